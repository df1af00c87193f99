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

public class WithToleranceTests
{
    [Fact]
    public void A_spread_given_to_a_limit_reaches_the_worst_case()
    {
        // y = x·k with k the spread limit: extremes (1 ± 0.03)(1 ± 0.2) at the corners (calculus).
        var model = new Product().WithTolerance(name => name == "k", 0.2);
        var worst = WorstCase.Analyse(model);
        Precision.AlmostEqualRelative(0.97 * 0.8, worst.Figures[0].Min!.Value, 1e-12, "min");
        Precision.AlmostEqualRelative(1.03 * 1.2, worst.Figures[0].Max!.Value, 1e-12, "max");
        Assert.Throws<ArgumentOutOfRangeException>(() => new Product().WithTolerance(_ => true, double.NaN));
    }

    private sealed class Product : IFigureModel
    {
        public IReadOnlyList<ParameterSpec> Parameters { get; } =
            [ParameterSpec.Symmetric("x", 1, 0.03), ParameterSpec.Symmetric("k", 1, 0)];
        public IReadOnlyList<FigureSpec> Figures { get; } = [new("y", "1")];
        public void Evaluate(ReadOnlySpan<double> parameters, Span<double> figures) => figures[0] = parameters[0] * parameters[1];
    }
}

public class LinearCoefficientTests
{
    [Fact]
    public void A_negative_coefficient_drifts_both_ways_by_its_magnitude()
    {
        // Polypropylene film is about −200 ppm/K (common practice, from memory): over 25…85 °C the value may
        // move by 200e-6 × 60 = 1.2 % either way in the analysis.
        var film = ParameterSpec.Symmetric("c", 10e-9, 0.02, TemperatureBehaviour.Linear(-200));
        var drift = ParameterDrift.Of(film, new TemperatureRange(25, 85));
        Precision.AlmostEqualRelative(0.012, drift.DriftMinus, 1e-12, "drift down");
        Precision.AlmostEqualRelative(0.012, drift.DriftPlus, 1e-12, "drift up");
    }
}
