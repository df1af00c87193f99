using PartsOpt.Api.DesignSearches;
using PartsOpt.Api.Parts;
using PartsOpt.Api.Parts.Csv;
using PartsOpt.Search;
using PartsOpt.Topologies;
using PartsOpt.Values;

namespace PartsOpt.Benchmarks;

/// <summary>
/// The stockrooms the search is measured on: the demo stock (seed-inventory-demo, read by the service's own
/// CSV reader and stock mapping), a generated large stock (E96 resistors 10 Ω … 1 MΩ, E12 capacitors
/// 10 pF … 10 µF, eight op-amps, six potentiometers) and a medium one small enough for the exhaustive
/// reference enumerator.
/// </summary>
public static class SearchStocks
{
    /// <summary>The team's usual question: 20 kHz ±10 %, duty 5 … 95 % by potentiometer, ±12 V, ten boards.</summary>
    public static SearchRequirement UsualQuestion(int maxResults = 10) =>
        new(new Supply(12, -12), new Band(20_000, 0.1), new DutyRequirement(0.05, 0.95), 10) { MaxResults = maxResults };

    public static Stock Demo()
    {
        var folder = FindDemoFolder();
        var stocked = new List<StockedPart>();
        foreach (var file in Directory.GetFiles(folder, "*.csv").Order(StringComparer.Ordinal))
        {
            using var text = new StreamReader(file);
            var read = PartCsvReader.Read(text, _ => null);
            if (read.Errors.Count > 0)
                throw new InvalidOperationException($"{file}: {read.Errors[0].Message}");
            foreach (var row in read.Rows)
            {
                var part = new Part { PartNumber = row.Input.PartNumber! };
                row.Input.ApplyTo(part);
                stocked.Add(new StockedPart(part, row.Quantity ?? 0, row.Quantity ?? 0));
            }
        }
        return Stockroom.From(stocked).Stock;
    }

    /// <summary>E96 1 % resistors 10 Ω … 1 MΩ, E12 capacitors 10 pF … 10 µF, 6 potentiometers, 8 op-amps.</summary>
    public static Stock Large() => Generated(ESeries.E96, 10, 1e6, 10e-12, 10e-6, OpAmps());

    /// <summary>E6 resistors 1 kΩ … 100 kΩ, E3 capacitors 1 nF … 100 nF, three potentiometers, two op-amps.</summary>
    public static Stock Medium() => Generated(ESeries.E6, 1e3, 100e3, 1e-9, 100e-9, OpAmps().Take(2).ToList());

    private static readonly double[] PotValues = [1e3, 2e3, 5e3, 10e3, 20e3, 50e3, 100e3];

    private static Stock Generated(ESeries resistors, double rMin, double rMax, double cMin, double cMax, IReadOnlyList<StockOpAmp> opAmps)
    {
        var parts = new List<StockPart>();
        foreach (var ohms in PreferredValues.InRange(resistors, rMin, rMax))
            parts.Add(new StockPart($"R-{EngineeringValue.FormatRkm(ohms, Quantity.Resistance)}", RoleKind.Resistor, ohms, 0.01, 0.002m, 5000)
            { TempcoPpmPerK = 100, PowerRatingW = 0.1 });
        foreach (var farads in PreferredValues.InRange(ESeries.E12, cMin, cMax))
            parts.Add(new StockPart($"C-{EngineeringValue.FormatRkm(farads, Quantity.Capacitance)}", RoleKind.Capacitor, farads,
                farads < 1e-9 ? 0.05 : 0.1, farads < 1e-6 ? 0.01m : 0.05m, 5000)
            { Dielectric = farads < 1e-9 ? Values.Dielectric.C0G : Values.Dielectric.X7R, VoltageRatingV = 50 });
        foreach (var ohms in PotValues.Take(resistors == ESeries.E96 ? 6 : 3))
            parts.Add(new StockPart($"RV-{EngineeringValue.FormatRkm(ohms, Quantity.Resistance)}", RoleKind.Potentiometer, ohms, 0.2, 0.15m, 1000)
            { TempcoPpmPerK = 100, PowerRatingW = 0.1 });
        return new Stock(parts, opAmps);
    }

    private static List<StockOpAmp> OpAmps()
    {
        static OpAmpSpec Amp(int sections, double min, double max, double gbw, double slewVPerUs, double outHigh, double outLow,
            double inHigh, double inLow, double current, double quiescent, bool comparator = false, bool openDrain = false) =>
            new(sections, min, max, gbw, slewVPerUs * 1e6, outHigh, outLow, inHigh, inLow, 3e-3, current, quiescent, comparator, openDrain);
        return
        [
            new("AMP-GP2", Amp(2, 6, 36, 1e6, 0.5, 1.5, 1.5, 1.5, -0.3, 0.02, 350e-6), 0.12m, 2000),
            new("AMP-FAST4", Amp(4, 10, 36, 4e6, 13, 1.5, 1.5, 0.5, 3, 0.02, 1.4e-3), 0.30m, 2000),
            new("AMP-SS4", Amp(4, 3, 32, 1.2e6, 0.5, 1.5, 0.02, 2, -0.3, 0.02, 175e-6), 0.15m, 2000),
            new("AMP-JF2", Amp(2, 10, 36, 3e6, 13, 1.5, 1.5, 0.5, 3, 0.02, 1.4e-3), 0.28m, 2000),
            new("AMP-RR1", Amp(1, 1.8, 5.5, 10e6, 6, 0.02, 0.02, -0.1, -0.1, 0.05, 1e-3), 0.45m, 2000),
            new("AMP-HV2", Amp(2, 8, 44, 8e6, 20, 1, 1, 1, 1, 0.03, 2e-3), 0.60m, 2000),
            new("CMP-OD2", Amp(2, 2, 36, 1e12, 10, 0, 0.2, 1.5, -0.3, 0.016, 400e-6, comparator: true, openDrain: true), 0.10m, 2000),
            new("CMP-PP2", Amp(2, 3, 36, 1e12, 40, 0.5, 0.5, 1.5, -0.3, 0.02, 600e-6, comparator: true), 0.35m, 2000),
        ];
    }

    private static string FindDemoFolder()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            var candidate = Path.Combine(dir.FullName, "seed-inventory-demo");
            if (Directory.Exists(candidate))
                return candidate;
        }
        throw new DirectoryNotFoundException("seed-inventory-demo not found above " + AppContext.BaseDirectory);
    }
}
