using System.Diagnostics;
using System.Globalization;
using PartsOpt.Search;

namespace PartsOpt.Benchmarks;

/// <summary>Runs each benchmarked search once and prints what it found and how long it took.</summary>
public static class SearchProbe
{
    public static void Run(IReadOnlyList<string> which)
    {
        var cases = new (string Name, Func<Stock> Stock, SearchRequirement Requirement)[]
        {
            ("demo", SearchStocks.Demo, SearchStocks.UsualQuestion()),
            ("large", SearchStocks.Large, SearchStocks.UsualQuestion()),
            ("medium", SearchStocks.Medium, SearchStocks.UsualQuestion() with { Frequency = new Band(1000, 0.05) }),
        };
        SelectionSolver.ExtraParameters = Environment.GetEnvironmentVariable("PROBE_PARAMS") ?? "";
        foreach (var (name, stockOf, requirement) in cases)
        {
            if (which.Count > 0 && !which.Contains(name))
                continue;
            var stock = stockOf();
            var clock = Stopwatch.StartNew();
            var outcome = DesignSearch.Run(requirement, stock, new SearchOptions { TimeLimit = TimeSpan.FromSeconds(double.Parse(Environment.GetEnvironmentVariable("PROBE_LIMIT") ?? "120", CultureInfo.InvariantCulture)) });
            Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"{name}: {stock.Parts.Count} parts, {stock.OpAmps.Count} op-amps: {outcome.Status} in {clock.Elapsed.TotalMilliseconds:F0} ms, {outcome.Solves} solves, {outcome.Designs.Count} designs"));
            foreach (var design in outcome.Designs.Take(3))
                Console.WriteLine(string.Create(CultureInfo.InvariantCulture, $"  #{design.Rank} {design.Topology} {design.Cost.PerBoard:F4}"));
        }
    }
}
