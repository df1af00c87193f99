using PartsOpt.Analysis;

namespace PartsOpt.Tests.Analysis;

public class RedistributedTests
{
    /// <summary>y = x: its spread is the part's own.</summary>
    private sealed class Identity : IFigureModel
    {
        public IReadOnlyList<ParameterSpec> Parameters { get; } = [ParameterSpec.Symmetric("x", 1, 0.03)];
        public IReadOnlyList<FigureSpec> Figures { get; } = [new("y", "1")];
        public void Evaluate(ReadOnlySpan<double> parameters, Span<double> figures) => figures[0] = parameters[0];
    }

    [Fact]
    public void TheChosenDistributionSetsTheSpread()
    {
        // Standard probability results: a uniform spread over ±t has σ = t/√3; a normal spread whose ±t band
        // is ±3σ has σ = t/3 (common practice for the band), a little less once truncated to the band.
        var uniform = MonteCarlo.Analyse(new Identity().WithDistribution(SpreadDistribution.Uniform), 100_000, seed: 7);
        var normal = MonteCarlo.Analyse(new Identity().WithDistribution(SpreadDistribution.Normal), 100_000, seed: 7);
        Precision.AlmostEqualRelative(0.03 / Math.Sqrt(3), uniform.Figures[0].StandardDeviation!.Value, 0.01, "uniform σ");
        Precision.AlmostEqualRelative(0.03 / 3, normal.Figures[0].StandardDeviation!.Value, 0.03, "normal σ");
        Assert.All(new Identity().WithDistribution(SpreadDistribution.Normal).Parameters,
            p => Assert.Equal(SpreadDistribution.Normal, p.Distribution));
    }
}
