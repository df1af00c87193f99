using BenchmarkDotNet.Attributes;
using PartsOpt.Search;
using PartsOpt.Tests.Search;
using PartsOpt.Topologies;
using PartsOpt.Values;

namespace PartsOpt.Benchmarks;

/// <summary>
/// Target: on a medium stock, the search at least 100× faster than the exhaustive reference in the same
/// run. The reference is the tests' brute force (every topology asked for, every op-amp assignment, every
/// stocked part in every role, judged cheapest first until one is accepted), compiled in as written; it
/// holds every candidate in memory, which bounds the stock: E6 resistors 1 kΩ … 10 kΩ (7), E6 capacitors
/// 1 nF … 10 nF (7), two pots, one quad op-amp, and the topologies with five resistor roles
/// (rc-ramp and loop: about 250,000 candidates per op-amp assignment; the three-stage's eight would be
/// 40 million). The question: 5 kHz ±10 %, duty 10–90 %, ±12 V, ten boards, the cheapest design. Both
/// must agree on its cost, checked once before measuring.
/// </summary>
[MemoryDiagnoser]
public class ExhaustiveComparisonBenchmarks
{
    private Stock _stock = null!;
    private SearchRequirement _requirement = null!;

    [GlobalSetup]
    public void Setup()
    {
        (_stock, _requirement) = (Stock(), Requirement());
        var reference = ExhaustiveReference.Cheapest(_requirement, _stock);
        var outcome = DesignSearch.Run(_requirement, _stock, new SearchOptions(TimeSpan.FromSeconds(60)));
        if (outcome.Status != SearchStatus.Optimal || reference is null || outcome.Designs[0].Cost.TotalBuildCost != reference.TotalBuildCost)
            throw new InvalidOperationException(
                $"search and reference disagree: {outcome.Status} {(outcome.Designs.Count > 0 ? outcome.Designs[0].Cost.TotalBuildCost : null)} against {reference?.TotalBuildCost}");
    }

    /// <summary>The tests' brute force.</summary>
    [Benchmark(Baseline = true)]
    public decimal? Exhaustive() => ExhaustiveReference.Cheapest(_requirement, _stock)?.TotalBuildCost;

    /// <summary>The search, the same question.</summary>
    [Benchmark]
    public decimal? Search() =>
        DesignSearch.Run(_requirement, _stock, new SearchOptions(TimeSpan.FromSeconds(60))).Designs is { Count: > 0 } designs
            ? designs[0].Cost.TotalBuildCost
            : null;

    internal static SearchRequirement Requirement() =>
        new(Supply.Symmetric(12), new Band(5_000, 0.1), new DutyRequirement(0.1, 0.9), 10)
        {
            Topologies = [TopologyKind.RcRamp, TopologyKind.Loop],
            MaxResults = 1,
        };

    internal static Stock Stock()
    {
        var parts = new List<StockPart>();
        foreach (var ohms in PreferredValues.InRange(ESeries.E6, 1e3, 10e3))
            parts.Add(new StockPart($"R-{EngineeringValue.FormatRkm(ohms, Quantity.Resistance)}", RoleKind.Resistor, ohms, 0.05, 0.003m, 5000)
            { TempcoPpmPerK = 200, PowerRatingW = 0.1 });
        foreach (var farads in PreferredValues.InRange(ESeries.E6, 1e-9, 10e-9))
            parts.Add(new StockPart($"C-{EngineeringValue.FormatRkm(farads, Quantity.Capacitance)}", RoleKind.Capacitor, farads, 0.05, 0.01m, 5000)
            { Dielectric = Dielectric.C0G, VoltageRatingV = 50 });
        foreach (var ohms in new[] { 10e3, 50e3 })
            parts.Add(new StockPart($"RV-{EngineeringValue.FormatRkm(ohms, Quantity.Resistance)}", RoleKind.Potentiometer, ohms, 0.2, 0.15m, 1000)
            { TempcoPpmPerK = 100, PowerRatingW = 0.1 });
        // One quad op-amp (its own sections oscillate, integrate and compare): two op-amp assignments in all.
        return new Stock(parts, SearchStocks.Medium().OpAmps.Where(o => o.PartNumber == "AMP-FAST4").ToList());
    }
}
