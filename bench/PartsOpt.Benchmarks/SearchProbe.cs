using System.Diagnostics;
using System.Globalization;
using PartsOpt.Search;

namespace PartsOpt.Benchmarks;

/// <summary>Runs each benchmarked search once and prints what it found and how long it took.</summary>
public static class SearchProbe
{
    /// <param name="arguments">Cases to run (demo, large, demo-loop-1k, medium; default all), and optionally
    /// <c>--limit</c> seconds (default 30), and <c>--repeat</c> warm runs whose median is printed (default 1).</param>
    public static void Run(IReadOnlyList<string> arguments)
    {
        var limitAt = arguments.ToList().IndexOf("--limit");
        var limitSeconds = limitAt >= 0 ? double.Parse(arguments[limitAt + 1], CultureInfo.InvariantCulture) : 30;
        var repeatAt = arguments.ToList().IndexOf("--repeat");
        var repeats = repeatAt >= 0 ? int.Parse(arguments[repeatAt + 1], CultureInfo.InvariantCulture) : 1;
        bool IsOption(int i) => (limitAt >= 0 && (i == limitAt || i == limitAt + 1)) || (repeatAt >= 0 && (i == repeatAt || i == repeatAt + 1));
        var which = arguments.Where((_, i) => !IsOption(i)).ToList();
        var cases = new (string Name, Func<Stock> Stock, SearchRequirement Requirement)[]
        {
            ("demo", SearchStocks.Demo, SearchStocks.UsualQuestion()),
            ("large", SearchStocks.Large, SearchStocks.UsualQuestion()),
            ("demo-loop-1k", SearchStocks.Demo, SearchStocks.UsualQuestion(3) with // the README's example
            {
                Frequency = new Band(1000, 0.1), Duty = new DutyRequirement(0.1, 0.9), Topologies = [Topologies.TopologyKind.Loop],
            }),
            ("medium", SearchStocks.Medium, SearchStocks.UsualQuestion() with { Frequency = new Band(1000, 0.05) }),
        };
        foreach (var (name, stockOf, requirement) in cases)
        {
            if (which.Count > 0 && !which.Contains(name))
                continue;
            var stock = stockOf();
            var clock = Stopwatch.StartNew();
            var outcome = DesignSearch.Run(requirement, stock, new SearchOptions { TimeLimit = TimeSpan.FromSeconds(limitSeconds) });
            var first = clock.Elapsed;
            // Once more, warm (the first run includes compiling the engine): what a running service sees.
            var warm = new List<double>();
            SearchOutcome again = outcome;
            for (var run = 0; run < repeats; run++)
            {
                clock.Restart();
                again = DesignSearch.Run(requirement, stock, new SearchOptions { TimeLimit = TimeSpan.FromSeconds(limitSeconds) });
                warm.Add(clock.Elapsed.TotalMilliseconds);
            }
            warm.Sort();
            Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"{name}: {stock.Parts.Count} parts, {stock.OpAmps.Count} op-amps: {outcome.Status} in {first.TotalMilliseconds:F0} ms (warm: {again.Status} in {warm[warm.Count / 2]:F0} ms median of {repeats}, {warm[0]:F0} … {warm[^1]:F0}), {outcome.Solves} designs judged, {outcome.Designs.Count} designs listed (limit {limitSeconds} s)"));
            foreach (var design in outcome.Designs.Take(3))
                Console.WriteLine(string.Create(CultureInfo.InvariantCulture, $"  #{design.Rank} {design.Topology} {design.Cost.PerBoard:F4}"));
        }
    }
}
