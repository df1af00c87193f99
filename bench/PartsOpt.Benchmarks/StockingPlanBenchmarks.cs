using System.Globalization;
using BenchmarkDotNet.Attributes;
using BenchmarkDotNet.Engines;
using PartsOpt.Planning;
using PartsOpt.Search;
using PartsOpt.Topologies;
using PartsOpt.Values;

namespace PartsOpt.Benchmarks;

/// <summary>
/// Target: a stocking plan for a portfolio of 20 requirements (1–50 kHz, varied duty ranges and supplies)
/// against E24 ±1 % resistors (1 kΩ … 100 kΩ), E12 C0G capacitors (1 nF … 100 nF) and six op-amps, in under
/// 30 s with optimality proved. One cold run per iteration (the plan is seconds, not nanoseconds); the plan's
/// optimality and yearly cost are written to the log after each run so the figure can be recorded with them.
/// Op-amp limits are typical data-sheet figures recalled for common parts (from memory); prices are invented.
/// </summary>
[SimpleJob(RunStrategy.ColdStart, launchCount: 1, warmupCount: 0, iterationCount: 3)]
public class StockingPlanBenchmarks
{
    private static readonly int[] LotSizes = [25, 50, 100, 250];
    private static readonly int[] YearlyUnits = [100, 500, 2000, 10_000];
    private StockingQuestion _question = null!;
    private StockingPlan? _last;

    [GlobalSetup]
    public void Setup() => _question = Portfolio();

    /// <summary>The whole plan: pools, the rounds of line selection, searches and proof, and today's stock for comparison.</summary>
    [Benchmark]
    public StockingPlan TwentyRequirements() => _last = StockingPlanner.Plan(_question);

    [IterationCleanup]
    public void Report()
    {
        if (_last is { } plan)
            Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"// plan: {plan.OptimalityText}, yearly {plan.YearlyCost}, bound {plan.LowerBound}, {plan.Lines.Count} lines ({plan.Lines.Count(l => !l.Existing)} new), " +
                $"{plan.Unmet.Count} unmet, {plan.Rounds} rounds, {plan.Elapsed.TotalSeconds:F1} s"));
    }

    internal static StockingQuestion Portfolio()
    {
        var today = new Stock(
        [
            Pot("RV-10K", 10e3, 0.40m), Pot("RV-50K", 50e3, 0.45m), Pot("RV-100K", 100e3, 0.45m),
            new("C-100N-X7R", RoleKind.Capacitor, 100e-9, 0.10, 0.02m, 50_000) { Dielectric = Dielectric.X7R, VoltageRatingV = 50 },
        ], []);
        var resistors = CandidateCatalogue.FromSeries(new SeriesCandidates(RoleKind.Resistor, ESeries.E24, 1e3, 100e3, 0.01, 0.004m), today);
        var capacitors = CandidateCatalogue.FromSeries(
            new SeriesCandidates(RoleKind.Capacitor, ESeries.E12, 1e-9, 100e-9, 0.05, 0.03m) { Dielectric = Dielectric.C0G, VoltageRatingV = 50 }, today);
        StockOpAmp OpAmp(string partNumber, OpAmpSpec spec, decimal cost) => new(partNumber, spec with { PartNumber = partNumber }, cost, 0);
        var opAmps = new[]
        {
            OpAmp("QUAD-JFET", new OpAmpSpec(4, 10, 36, 3e6, 13e6, 1.5, 1.5, 0.5, 3, 3e-3, 10e-3, 1.4e-3), 0.35m),   // TL074 kind
            OpAmp("DUAL-JFET", new OpAmpSpec(2, 10, 36, 3e6, 13e6, 1.5, 1.5, 0.5, 3, 3e-3, 10e-3, 1.4e-3), 0.25m),   // TL072 kind
            OpAmp("DUAL-BIP", new OpAmpSpec(2, 3, 32, 1e6, 0.3e6, 1.5, 0.05, 1.5, 0, 2e-3, 20e-3, 0.35e-3), 0.12m),  // LM358 kind
            OpAmp("QUAD-BIP", new OpAmpSpec(4, 3, 32, 1e6, 0.5e6, 1.5, 0.05, 1.5, 0, 2e-3, 20e-3, 0.2e-3), 0.15m),   // LM324 kind
            OpAmp("DUAL-CMP-OD", new OpAmpSpec(2, 2, 36, 1e6, 10e6, 0, 0.2, 1.5, 0, 2e-3, 16e-3, 0.2e-3, IsComparator: true, IsOpenDrain: true), 0.10m), // LM393 kind
            OpAmp("DUAL-CMP-PP", new OpAmpSpec(2, 4, 36, 10e6, 50e6, 0.5, 0.2, 1.5, 0, 1e-3, 20e-3, 1e-3, IsComparator: true), 0.60m),
        };
        var candidates = new Stock([.. resistors, .. capacitors], opAmps);

        var random = new Random(20);
        var requirements = new List<YearlyRequirement>();
        for (var i = 0; i < 20; i++)
        {
            var frequency = 10 * Math.Round(100 * Math.Pow(50, random.NextDouble())); // 1 … 50 kHz, log-uniform, to 10 Hz
            var supply = (i % 4) switch
            {
                0 => Supply.Symmetric(12),
                1 => Supply.Symmetric(15),
                2 => Supply.SingleRail(12),
                _ => Supply.SingleRail(24),
            };
            var dutyMin = 0.05 + 0.05 * random.Next(5);
            var requirement = new SearchRequirement(supply, new Band(frequency, 0.05 + 0.05 * random.Next(3)),
                new DutyRequirement(dutyMin, 1 - dutyMin - 0.05 * random.Next(3)), LotSizes[random.Next(4)]);
            requirements.Add(new YearlyRequirement($"pwm-{i + 1:00}-{frequency / 1e3:0.#}k", requirement, YearlyUnits[random.Next(4)]));
        }
        return new StockingQuestion(requirements, today, candidates, 25m, KeepExisting: true);
    }

    private static StockPart Pot(string partNumber, double ohms, decimal cost) =>
        new(partNumber, RoleKind.Potentiometer, ohms, 0.2, cost, 50_000) { PowerRatingW = 0.25 };
}
