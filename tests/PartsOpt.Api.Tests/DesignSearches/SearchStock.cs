using System.Net;
using System.Net.Http.Json;
using System.Text.Json;
using System.Text.Json.Nodes;
using PartsOpt.Api.DesignSearches;

namespace PartsOpt.Api.Tests.DesignSearches;

/// <summary>
/// A small stockroom for the search tests, entered through the parts API. The part numbers and prices are
/// invented fixtures; the op-amp limits are typical data-sheet figures of a quad JFET-input part of the
/// TL074 kind (from memory), inputs to the search, never check values.
/// </summary>
internal static class SearchStock
{
    public const int Plenty = 10_000;

    public static readonly (string PartNumber, double Ohms)[] Resistors =
    [
        ("T-R-1K0", 1e3), ("T-R-2K2", 2.2e3), ("T-R-4K7", 4.7e3), ("T-R-10K", 10e3),
        ("T-R-22K", 22e3), ("T-R-47K", 47e3), ("T-R-100K", 100e3),
    ];

    public static readonly (string PartNumber, double Farads, string Dielectric)[] Capacitors =
    [
        ("T-C-4N7", 4.7e-9, "C0G"), ("T-C-10N", 10e-9, "C0G"), ("T-C-22N", 22e-9, "C0G"), ("T-C-47N", 47e-9, "C0G"),
        ("T-C-100N", 100e-9, "X7R"),
    ];

    public static async Task SeedAsync(HttpClient client, int quantity = Plenty)
    {
        foreach (var (partNumber, ohms) in Resistors)
            await client.CreatePart(Api.Resistor(partNumber, ohms, 0.01, quantity));
        foreach (var (partNumber, farads, dielectric) in Capacitors)
            await client.CreatePart(new
            {
                partNumber, kind = "capacitor", unitCost = 0.02m, currency = "EUR", initialQuantity = quantity,
                capacitor = new { capacitanceF = farads, toleranceMinus = 0.05, tolerancePlus = 0.05, dielectric, voltageRatingV = 50.0, polarised = false },
            });
        foreach (var (partNumber, ohms) in new[] { ("T-RV-10K", 10e3), ("T-RV-50K", 50e3) })
            await client.CreatePart(new
            {
                partNumber, kind = "potentiometer", unitCost = 0.40m, currency = "EUR", initialQuantity = quantity,
                potentiometer = new { resistanceOhms = ohms, toleranceMinus = 0.2, tolerancePlus = 0.2, taper = "linear", powerRatingW = 0.25, trimmer = true },
            });
        await client.CreatePart(new
        {
            partNumber = "T-U-QUAD-JFET", kind = "op-amp", unitCost = 0.35m, currency = "EUR", initialQuantity = quantity,
            opAmp = new
            {
                sections = 4, supplyMinV = 10.0, supplyMaxV = 36.0, gainBandwidthHz = 3e6, slewRateVPerS = 13e6,
                outputHeadroomLowV = 1.5, outputHeadroomHighV = 1.5, inputHeadroomLowV = 3.0, inputHeadroomHighV = 0.5,
                inputOffsetV = 3e-3, outputCurrentMaxA = 10e-3, quiescentCurrentPerSectionA = 1.4e-3,
                comparator = false, openDrain = false,
            },
        });
    }

    /// <summary>1 kHz ±5 %, duty 10–90 % by potentiometer, ±12 V, 10 boards.</summary>
    public static JsonObject Requirement(double frequencyHz = 1000, int buildQuantity = 10, int maxResults = 5,
        params string[] topologies)
    {
        var body = new JsonObject
        {
            ["supply"] = new JsonObject { ["positive"] = 12, ["negative"] = -12 },
            ["frequency"] = new JsonObject { ["target"] = frequencyHz, ["tolerance"] = 0.05 },
            ["duty"] = new JsonObject { ["min"] = 0.1, ["max"] = 0.9, ["adjust"] = "potentiometer" },
            ["buildQuantity"] = buildQuantity,
            ["maxResults"] = maxResults,
            ["timeLimitSeconds"] = 40,
        };
        if (topologies.Length > 0)
            body["topologies"] = new JsonArray(topologies.Select(t => (JsonNode)t!).ToArray());
        return body;
    }

    public static async Task<(HttpResponseMessage Response, string Body)> SearchAsync(HttpClient client, JsonObject requirement)
    {
        var response = await client.PostJson("/api/v1/design-searches", requirement.ToJsonString());
        var body = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.Created, $"expected 201, got {(int)response.StatusCode}: {body}");
        return (response, body);
    }

    public static DesignSearchDto Read(string body) => JsonSerializer.Deserialize<DesignSearchDto>(body, Api.Json)!;

    public static double Figure(this DesignResult result, string name) =>
        result.Figures.Single(f => f.Name == name).Value ?? throw new InvalidOperationException($"no {name}");

    public static double RoleValue(this DesignResult result, string role) => result.Roles.Single(r => r.Role == role).Value;
}
