using BenchmarkDotNet.Configs;
using BenchmarkDotNet.Jobs;
using BenchmarkDotNet.Running;
using BenchmarkDotNet.Toolchains.InProcess.Emit;
using PartsOpt.Benchmarks;

if (args is ["probe-search", .. var rest])
{
    // One timed run of each search benchmark with its outcome printed: for a quick look while working,
    // not a measurement (the recorded figures come from the benchmark runs).
    SearchProbe.Run(rest);
    return;
}

if (args is ["probe-plan"])
{
    // One timed stocking plan of the 20-requirement portfolio, its outcome printed (see probe-search).
    var clock = System.Diagnostics.Stopwatch.StartNew();
    var plan = PartsOpt.Planning.StockingPlanner.Plan(StockingPlanBenchmarks.Portfolio());
    Console.WriteLine(System.FormattableString.Invariant(
        $"plan: {plan.OptimalityText}; yearly {plan.YearlyCost}; {plan.Lines.Count} lines; {plan.Unmet.Count} unmet; {plan.Rounds} rounds; {clock.Elapsed.TotalSeconds:F1} s"));
    foreach (var note in plan.Notes.Take(5))
        Console.WriteLine("  " + note);
    return;
}

if (args is ["probe-pools", .. var sizes])
{
    // Each requirement of the stocking-plan portfolio searched once over every candidate line, as the planner's
    // first pools are: how long each takes and what it proves (see probe-search).
    var question = StockingPlanBenchmarks.Portfolio();
    var all = new PartsOpt.Planning.PlanLines(question).All;
    foreach (var size in sizes.Length > 0 ? sizes.Select(int.Parse) : [40])
        foreach (var item in question.Requirements.Where(r => Environment.GetEnvironmentVariable("PROBE_ONLY") is not { } only || r.Name.Contains(only, StringComparison.Ordinal)))
        {
            var clock = System.Diagnostics.Stopwatch.StartNew();
            var outcome = PartsOpt.Search.DesignSearch.Run(item.Requirement with { MaxResults = size }, all,
                new PartsOpt.Search.SearchOptions(TimeSpan.FromSeconds(double.Parse(Environment.GetEnvironmentVariable("PROBE_LIMIT") ?? "30", System.Globalization.CultureInfo.InvariantCulture))));
            Console.WriteLine(System.FormattableString.Invariant(
                $"{item.Name} (pool {size}): {outcome.Status} in {clock.Elapsed.TotalMilliseconds:F0} ms, {outcome.Designs.Count} designs, {outcome.Solves} judged"));
            if (outcome.Designs.Count == 0)
                foreach (var report in outcome.Topologies)
                    Console.WriteLine($"  {report.Topology}: {report.Blocking} nearest: {string.Join(", ", report.Nearest?.RoleParts.Select(kv => kv.Key + "=" + kv.Value) ?? [])} | {string.Join("; ", report.Nearest?.Misses ?? [])}");
        }
    return;
}

// In-process: BenchmarkDotNet's generated project cannot build under this repository's central package
// versions and warnings-as-errors, and in-process measurement is as sound for CPU-bound code like ours.
var config = DefaultConfig.Instance.AddJob(Job.Default.WithToolchain(InProcessEmitToolchain.Instance).AsDefault());
BenchmarkSwitcher.FromAssembly(typeof(SearchProbe).Assembly).Run(args, config);
