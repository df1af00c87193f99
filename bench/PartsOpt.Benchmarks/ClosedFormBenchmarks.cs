using BenchmarkDotNet.Attributes;
using PartsOpt.Topologies;

namespace PartsOpt.Benchmarks;

/// <summary>
/// Closed-form evaluations of one design's figure model, the call the design search and Monte Carlo make
/// for every candidate and sample. Target: at least 5 million evaluations per second on two cores.
/// </summary>
[MemoryDiagnoser]
public class ClosedFormBenchmarks
{
    /// <summary>Evaluations per parallel batch: evaluations per second = Batch / (mean time of one batch).</summary>
    public const int Batch = 100_000;

    private CircuitFigureModel _model = null!;
    private double[] _nominal = null!;

    [GlobalSetup]
    public void Setup()
    {
        _model = CircuitFigureModel.For(BenchmarkDesigns.ThreeStage());
        _nominal = _model.NominalParameters();
    }

    /// <summary>One evaluation on one thread.</summary>
    [Benchmark]
    public double OneEvaluation()
    {
        Span<double> figures = stackalloc double[16];
        _model.Evaluate(_nominal, figures);
        return figures[0];
    }

    /// <summary>A batch of <see cref="Batch"/> evaluations with slightly different values, spread over every core.</summary>
    [Benchmark(OperationsPerInvoke = Batch)]
    public double BatchOnAllCores()
    {
        var total = 0.0;
        var gate = new object();
        Parallel.For(0, Environment.ProcessorCount, () => 0.0, (worker, _, sum) =>
        {
            Span<double> values = stackalloc double[_nominal.Length];
            Span<double> figures = stackalloc double[16];
            _nominal.CopyTo(values);
            var per = Batch / Environment.ProcessorCount;
            for (var i = 0; i < per; i++)
            {
                values[0] = _nominal[0] * (1 + 1e-6 * (i & 1023));
                _model.Evaluate(values, figures);
                sum += figures[0];
            }

            return sum;
        }, sum => { lock (gate) total += sum; });
        return total;
    }
}
