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

// In-process: BenchmarkDotNet's generated project cannot build under this repository's central package
// versions and warnings-as-errors, and in-process measurement is as sound for CPU-bound code like ours.
var config = DefaultConfig.Instance.AddJob(Job.Default.WithToolchain(InProcessEmitToolchain.Instance).AsDefault());
BenchmarkSwitcher.FromAssembly(typeof(SearchProbe).Assembly).Run(args, config);
