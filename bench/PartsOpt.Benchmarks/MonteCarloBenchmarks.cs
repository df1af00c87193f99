using BenchmarkDotNet.Attributes;
using PartsOpt.Analysis;
using PartsOpt.Topologies;

namespace PartsOpt.Benchmarks;

/// <summary>
/// Target: a 10,000-sample Monte Carlo run of one design in under 10 ms on two cores. Measured on the
/// three-stage design (13 parameters: ten parts and three op-amp limits) and, for comparison, on a
/// synthetic 12-parameter model whose Evaluate costs about 100 ns.
/// </summary>
[MemoryDiagnoser]
public class MonteCarloBenchmarks
{
    private readonly TwelvePartModel _model = new();
    private readonly IFigureModel _design = CircuitFigureModel.For(BenchmarkDesigns.ThreeStage());

    /// <summary>One run of 10,000 boards of the three-stage design against a frequency band.</summary>
    [Benchmark]
    public MonteCarloResult TenThousandBoardsOfOneDesign() =>
        MonteCarlo.Analyse(_design, 10_000, seed: 1, [new FigureBand("frequency", 18e3, 22e3)]);

    /// <summary>One run of 10,000 boards against one band.</summary>
    [Benchmark]
    public MonteCarloResult TenThousandBoards() =>
        MonteCarlo.Analyse(_model, 10_000, seed: 1, [new FigureBand("y", 0, 100)]);

    /// <summary>Twelve parts, two figures, a handful of divisions and a logarithm: about 100 ns.</summary>
    private sealed class TwelvePartModel : IFigureModel
    {
        public IReadOnlyList<ParameterSpec> Parameters { get; } =
            Enumerable.Range(0, 12).Select(i => ParameterSpec.Symmetric($"x{i}", 1 + i, 0.05)).ToArray();

        public IReadOnlyList<FigureSpec> Figures { get; } = [new("y", "1"), new("z", "1")];

        public void Evaluate(ReadOnlySpan<double> parameters, Span<double> figures)
        {
            double product = 1, sum = 0;
            foreach (var x in parameters)
            {
                product *= x;
                sum += x / (1 + x);
            }
            figures[0] = Math.Log(product) + sum;
            figures[1] = Math.Sqrt(product) / sum;
        }
    }
}
