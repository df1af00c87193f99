using System.Text.Json.Nodes;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.DependencyInjection;
using PartsOpt.Api.Persistence;

namespace PartsOpt.Api.Tests.Planning;

/// <summary>
/// A deliberately thin stockroom for the planning tests, entered through the parts API: a few resistors, a
/// pot, a decoupling capacitor and a quad JFET op-amp (limits of the TL074 kind, from memory), but no
/// timing capacitor, so an rc-ramp at 1 kHz cannot be built today and needs a capacitor bought. Part
/// numbers and prices are invented fixtures, never check values.
/// </summary>
internal static class PlanningStock
{
    public static async Task SeedAsync(HttpClient client)
    {
        foreach (var (partNumber, ohms) in new[] { ("P-R-4K7", 4.7e3), ("P-R-10K", 10e3), ("P-R-22K", 22e3), ("P-R-47K", 47e3) })
            await client.CreatePart(Api.Resistor(partNumber, ohms, 0.01, 10_000));
        await client.CreatePart(new
        {
            partNumber = "P-C-100N", kind = "capacitor", unitCost = 0.02m, currency = "EUR", initialQuantity = 10_000,
            capacitor = new { capacitanceF = 100e-9, toleranceMinus = 0.1, tolerancePlus = 0.1, dielectric = "X7R", voltageRatingV = 50.0, polarised = false },
        });
        await client.CreatePart(new
        {
            partNumber = "P-RV-10K", kind = "potentiometer", unitCost = 0.40m, currency = "EUR", initialQuantity = 10_000,
            potentiometer = new { resistanceOhms = 10e3, toleranceMinus = 0.2, tolerancePlus = 0.2, taper = "linear", powerRatingW = 0.25, trimmer = true },
        });
        await client.CreatePart(new
        {
            partNumber = "P-U-QUAD", kind = "op-amp", unitCost = 0.35m, currency = "EUR", initialQuantity = 10_000,
            opAmp = OpAmpLimits(),
        });
    }

    public static object OpAmpLimits() => new
    {
        sections = 4, supplyMinV = 10.0, supplyMaxV = 36.0, gainBandwidthHz = 3e6, slewRateVPerS = 13e6,
        outputHeadroomLowV = 1.5, outputHeadroomHighV = 1.5, inputHeadroomLowV = 3.0, inputHeadroomHighV = 0.5,
        inputOffsetV = 3e-3, outputCurrentMaxA = 10e-3, quiescentCurrentPerSectionA = 1.4e-3,
        comparator = false, openDrain = false,
    };

    /// <summary>An rc-ramp at 1 kHz ±10 %, duty 20–80 % by potentiometer, ±12 V, lots of 10.</summary>
    public static JsonObject Requirement(double frequencyHz = 1000) => new()
    {
        ["supply"] = new JsonObject { ["positive"] = 12, ["negative"] = -12 },
        ["frequency"] = new JsonObject { ["target"] = frequencyHz, ["tolerance"] = 0.10 },
        ["duty"] = new JsonObject { ["min"] = 0.2, ["max"] = 0.8 },
        ["buildQuantity"] = 10,
        ["topologies"] = new JsonArray("rc-ramp"),
    };

    /// <summary>One product, E6 C0G capacitors 10 nF … 47 nF to choose from, holding 5.00 a line a year.</summary>
    public static JsonObject Plan() => new()
    {
        ["requirements"] = new JsonArray(new JsonObject
        {
            ["name"] = "fan-1k",
            ["requirement"] = Requirement(),
            ["unitsPerYear"] = 200,
        }),
        ["candidates"] = new JsonObject
        {
            ["capacitorSeries"] = "E6",
            ["capacitorRange"] = new JsonObject { ["min"] = 10e-9, ["max"] = 47e-9 },
            ["capacitorDielectric"] = "C0G",
            ["capacitorUnitCost"] = 0.03,
            ["packageCostPerLine"] = 5.00,
        },
        ["keepExisting"] = true,
        ["searchTimeLimitSeconds"] = 60,
    };

    /// <summary>Rows in every table a request could write to.</summary>
    public static async Task<int> RowsAsync(IServiceProvider services)
    {
        using var scope = services.CreateScope();
        var db = scope.ServiceProvider.GetRequiredService<PartsOptDbContext>();
        return await db.Parts.CountAsync() + await db.Movements.CountAsync() + await db.DesignSearches.CountAsync()
            + await db.Designs.CountAsync() + await db.OutboxEvents.CountAsync() + await db.IdempotencyRecords.CountAsync();
    }
}
