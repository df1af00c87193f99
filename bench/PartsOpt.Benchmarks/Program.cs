using BenchmarkDotNet.Configs;
using BenchmarkDotNet.Jobs;
using BenchmarkDotNet.Running;
using BenchmarkDotNet.Toolchains.InProcess.Emit;

// In-process: BenchmarkDotNet's generated project cannot build under this repository's central package
// versions and warnings-as-errors, and in-process measurement is as sound for CPU-bound code like ours.
var config = DefaultConfig.Instance.AddJob(Job.Default.WithToolchain(InProcessEmitToolchain.Instance).AsDefault());
BenchmarkSwitcher.FromAssembly(typeof(Program).Assembly).Run(args, config);
