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

if (args is ["probe-plan", .. var planArguments])
{
    // Timed stocking plans of the 20-requirement portfolio in one process (the first cold, the rest warm),
    // each outcome printed (see probe-search): `probe-plan [--repeat N]`.
    var repeat = 1;
    if (planArguments is not ([] or ["--repeat", _]) || (planArguments is [_, var count] && (!int.TryParse(count, out repeat) || repeat < 1)))
    {
        Console.Error.WriteLine("usage: probe-plan [--repeat N], N at least 1");
        return;
    }
    var question = StockingPlanBenchmarks.Portfolio();
    for (var run = 0; run < repeat; run++)
    {
        var clock = System.Diagnostics.Stopwatch.StartNew();
        var plan = PartsOpt.Planning.StockingPlanner.Plan(question);
        Console.WriteLine(System.FormattableString.Invariant(
            $"plan: {plan.OptimalityText}; yearly {plan.YearlyCost}; bound {plan.LowerBound}; {plan.Lines.Count} lines; {plan.Unmet.Count} unmet; {plan.Rounds} rounds; {clock.Elapsed.TotalSeconds:F1} s"));
        foreach (var note in plan.Notes.Take(5))
            Console.WriteLine("  " + note);
    }
    return;
}

if (args is ["probe-pools", .. var poolArguments])
{
    PoolProbe.Run(poolArguments);
    return;
}

// In-process: BenchmarkDotNet's generated project cannot build under this repository's central package
// versions and warnings-as-errors, and in-process measurement is as sound for CPU-bound code like ours.
var config = DefaultConfig.Instance.AddJob(Job.Default.WithToolchain(InProcessEmitToolchain.Instance).AsDefault());
BenchmarkSwitcher.FromAssembly(typeof(SearchProbe).Assembly).Run(args, config);
