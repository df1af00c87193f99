using System.Diagnostics;
using System.Globalization;
using PartsOpt.Planning;
using PartsOpt.Search;

namespace PartsOpt.Benchmarks;

/// <summary>
/// Searches each requirement of the stocking-plan portfolio once over every candidate line, as the planner's
/// first pools are, and prints how long each took and what it proved; for a requirement with no design, what
/// blocked each topology. A quick look while working, not a measurement.
/// </summary>
public static class PoolProbe
{
    /// <param name="arguments">Pool sizes (default 40), optionally <c>--limit</c> seconds per search (default 30)
    /// and <c>--only</c> a part of the requirements' names.</param>
    public static void Run(IReadOnlyList<string> arguments)
    {
        var list = arguments.ToList();
        string? Option(string name) => list.IndexOf(name) is >= 0 and var at && at + 1 < list.Count ? list[at + 1] : null;
        var limit = TimeSpan.FromSeconds(double.Parse(Option("--limit") ?? "30", CultureInfo.InvariantCulture));
        var only = Option("--only");
        var sizes = list.Where((a, i) => !a.StartsWith("--", StringComparison.Ordinal) && (i == 0 || !list[i - 1].StartsWith("--", StringComparison.Ordinal)))
            .Select(a => int.Parse(a, CultureInfo.InvariantCulture)).DefaultIfEmpty(40).ToList();

        var question = StockingPlanBenchmarks.Portfolio();
        var all = new PlanLines(question).All;
        foreach (var size in sizes)
            foreach (var item in question.Requirements.Where(r => only is null || r.Name.Contains(only, StringComparison.Ordinal)))
            {
                var clock = Stopwatch.StartNew();
                var outcome = DesignSearch.Run(item.Requirement with { MaxResults = size }, all, new SearchOptions(limit));
                Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
                    $"{item.Name} ({item.UnitsPerYear} a year, pool {size}): {outcome.Status} in {clock.Elapsed.TotalMilliseconds:F0} ms, {outcome.Designs.Count} designs, {outcome.Solves} judged; " +
                    $"per board (designs, distinct line sets): {string.Join(", ", outcome.Designs.GroupBy(d => d.Cost.PerBoard).Take(4).Select(g => $"{g.Key} ({g.Count()}, {g.Select(d => string.Join(" ", d.Bom.Select(b => b.PartNumber).Order())).Distinct().Count()})"))}"));
                if (outcome.Designs.Count > 0)
                    continue;
                foreach (var report in outcome.Topologies)
                    Console.WriteLine($"  {report.Topology}: {report.Blocking} Nearest: " +
                        string.Join(", ", report.Nearest?.RoleParts.Select(kv => kv.Key + "=" + kv.Value) ?? []) +
                        " | " + string.Join("; ", report.Nearest?.Misses ?? []));
            }
    }
}
