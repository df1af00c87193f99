using MathNet.Numerics.Distributions;
using PartsOpt.Analysis;

namespace PartsOpt.Tests.Analysis;

public class MonteCarloTests
{
    [Fact]
    public void Small_tolerances_agree_with_root_sum_square()
    {
        var model = FormulaModel.Product(3, 0.001);
        var sampled = MonteCarlo.Analyse(model, 100_000, seed: 1).Figures[0];
        var rss = RootSumSquare.Analyse(model).Figures[0];

        // At 0.1 % the product is linear to 1e-6, so RSS (σ_rel = √3·0.001/√3 = 0.001) is exact to first
        // order; the sampled σ has a standard error of about 0.2 % at 100,000 samples.
        Precision.AlmostEqualRelative(rss.Sigma!.Value, sampled.StandardDeviation!.Value, 0.02, "σ");
        Precision.AlmostEqualRelative(1, sampled.Mean!.Value, 1e-5, "mean");
        Assert.Equal(100_000, sampled.DefinedSamples);
        Assert.InRange(sampled.Min!.Value, Math.Pow(0.999, 3), 1);
        Assert.InRange(sampled.Max!.Value, 1, Math.Pow(1.001, 3));
    }

    [Fact]
    public void Moderate_tolerances_agree_with_the_exact_variance_of_a_product_of_uniforms()
    {
        // x_i = 1 + u_i, u_i uniform ±t, independent: E[y] = 1 and E[y²] = Π E[x_i²] = (1 + t²/3)^n, so
        // var y = (1 + t²/3)^n − 1 (standard probability). At t = 30 %, n = 3 that is 0.092727, while the
        // first-order RSS gives n·t²/3 = 0.09: 3 % apart.
        const double t = 0.30;
        var exact = Math.Pow(1 + t * t / 3, 3) - 1;
        var model = FormulaModel.Product(3, t);
        var sampled = MonteCarlo.Analyse(model, 200_000, seed: 2024).Figures[0];
        var rss = RootSumSquare.Analyse(model).Figures[0];

        var variance = sampled.StandardDeviation!.Value * sampled.StandardDeviation.Value;
        // Standard error of the sampled variance ≈ √((κ − 1)/n)·var ≈ 0.3 % here.
        Precision.AlmostEqualRelative(exact, variance, 0.015, "variance vs exact");
        Precision.AlmostEqualRelative(1, sampled.Mean!.Value, 0.003, "mean vs exact");
        Assert.True(Math.Abs(variance - exact) < Math.Abs(variance - rss.Sigma!.Value * rss.Sigma.Value),
            "sampling sees the second-order term that RSS drops");
    }

    [Fact]
    public void The_same_seed_gives_identical_results_and_another_seed_does_not()
    {
        var model = FormulaModel.Oscillator(10e3, 100e-9, 10e3, 10e3);
        var bands = new[] { new FigureBand("frequency", 440, 470) };
        var a = MonteCarlo.Analyse(model, 20_000, seed: 42, bands);
        var b = MonteCarlo.Analyse(model, 20_000, seed: 42, bands);
        var c = MonteCarlo.Analyse(model, 20_000, seed: 43, bands);

        Assert.Equal(a.Figures, b.Figures); // record equality: every double bit for bit
        Assert.Equal(a.Yield!.Passing, b.Yield!.Passing);
        Assert.NotEqual(a.Figures[0].Mean, c.Figures[0].Mean);
        Assert.NotEqual(a.Figures[0].StandardDeviation, c.Figures[0].StandardDeviation);
    }

    [Fact]
    public void One_thread_and_many_give_identical_results()
    {
        var model = FormulaModel.Oscillator(10e3, 100e-9, 10e3, 10e3);
        var bands = new[] { new FigureBand("frequency", 450, null) };
        var one = MonteCarlo.Analyse(model, 50_001, seed: 5, bands, parallelOptions: new ParallelOptions { MaxDegreeOfParallelism = 1 });
        var many = MonteCarlo.Analyse(model, 50_001, seed: 5, bands, parallelOptions: new ParallelOptions { MaxDegreeOfParallelism = 8 });

        Assert.Equal(one.Figures, many.Figures);
        Assert.Equal(one.Yield!.Passing, many.Yield!.Passing);
        Assert.Equal(one.Yield.Bands, many.Yield.Bands);
    }

    [Fact]
    public void Normal_parts_are_truncated_to_their_band()
    {
        // Band ±3 % as ±3σ (σ = 1 %), redrawn outside the band: the truncated normal has
        // σ_t = σ·√(1 − 2·3·φ(3)/(2Φ(3) − 1)) (standard result), φ and Φ from MathNet.
        var model = FormulaModel.Scalar(x => x[0], new ParameterSpec("a", 1, 0.03, 0.03, SpreadDistribution.Normal));
        var figure = MonteCarlo.Analyse(model, 200_000, seed: 9).Figures[0];

        var truncated = 0.01 * Math.Sqrt(1 - 6 * Normal.PDF(0, 1, 3) / (2 * Normal.CDF(0, 1, 3) - 1));
        Precision.AlmostEqualRelative(0.98658, truncated / 0.01, 1e-4, "truncation factor");
        Precision.AlmostEqualRelative(truncated, figure.StandardDeviation!.Value, 0.01, "σ");
        Assert.InRange(figure.Min!.Value, 0.97, 1);
        Assert.InRange(figure.Max!.Value, 1, 1.03);
    }

    [Fact]
    public void A_normal_part_with_an_asymmetric_band_is_centred_on_the_band()
    {
        // −0/+6 %: band [1, 1.06], centre 1.03, σ = 1 % before truncation at ±3σ (factor 0.98658, as above).
        var model = FormulaModel.Scalar(x => x[0], new ParameterSpec("a", 1, 0, 0.06, SpreadDistribution.Normal));
        var figure = MonteCarlo.Analyse(model, 100_000, seed: 12).Figures[0];

        Precision.AlmostEqualRelative(1.03, figure.Mean!.Value, 1e-4, "mean");
        Precision.AlmostEqualRelative(0.0098658, figure.StandardDeviation!.Value, 0.01, "σ");
        Assert.InRange(figure.Min!.Value, 1, 1.06);
        Assert.InRange(figure.Max!.Value, 1, 1.06);
    }

    [Fact]
    public void An_asymmetric_band_is_sampled_as_it_stands()
    {
        // Z: +80/−20 % (IEC 60062), uniform over [0.8, 1.8]: mean 1.3, σ = 0.5/√3.
        var model = FormulaModel.Scalar(x => x[0], new ParameterSpec("c", 1, 0.20, 0.80));
        var figure = MonteCarlo.Analyse(model, 100_000, seed: 3).Figures[0];

        Precision.AlmostEqualRelative(1.3, figure.Mean!.Value, 0.003, "mean");
        Precision.AlmostEqualRelative(0.5 / Math.Sqrt(3), figure.StandardDeviation!.Value, 0.01, "σ");
        Assert.InRange(figure.Min!.Value, 0.8, 0.81);
        Assert.InRange(figure.Max!.Value, 1.79, 1.8);
    }

    [Fact]
    public void Yield_is_one_for_a_band_around_everything_and_a_half_at_the_median()
    {
        // y = a, uniform ±5 %: symmetric about 1, so half the samples lie below the median 1.
        var model = FormulaModel.Scalar(x => x[0], ParameterSpec.Symmetric("a", 1, 0.05));
        const int samples = 40_000;
        var result = MonteCarlo.Analyse(model, samples, seed: 11,
            [new FigureBand("y", 0.95, 1.05), new FigureBand("y", null, 1.0)]);

        Assert.Equal(1.0, result.Yield!.Bands[0].Fraction);
        // Binomial standard error at p = ½: 0.5/√n = 0.0025; allow 4 of them.
        Assert.InRange(result.Yield.Bands[1].Fraction, 0.5 - 0.01, 0.5 + 0.01);
        Assert.Equal(result.Yield.Bands[1].Passing, result.Yield.Passing); // every band together
        Precision.AlmostEqualRelative(Math.Sqrt(result.Yield.Fraction * (1 - result.Yield.Fraction) / samples),
            result.Yield.StandardError, 1e-12, "binomial standard error");
    }

    [Fact]
    public void An_undefined_figure_fails_every_band()
    {
        // Exists only for a ≤ 1.02 of a uniform 1 ± 5 %: probability 0.7.
        var model = FormulaModel.Scalar(x => x[0] > 1.02 ? double.NaN : x[0], ParameterSpec.Symmetric("a", 1, 0.05));
        var result = MonteCarlo.Analyse(model, 40_000, seed: 4, [new FigureBand("y", double.NegativeInfinity, double.PositiveInfinity)]);

        Assert.InRange(result.Yield!.Fraction, 0.69, 0.71);
        Assert.Equal(result.Yield.Passing, result.Figures[0].DefinedSamples);
        Assert.Equal(40_000, result.Figures[0].DefinedSamples + result.Figures[0].UndefinedSamples);
    }

    [Fact]
    public void Temperature_applies_a_linear_coefficient_of_either_sign()
    {
        // 100 ppm/K over 25…125 °C, no initial tolerance: δ = u·1e-4·ΔT, u uniform [−1, 1], ΔT uniform
        // [0, 100] K, independent: E[δ] = 0, var δ = E[u²]·E[ΔT²]·1e-8 = (1/3)·(10⁴/3)·1e-8, σ = 1/300.
        var model = FormulaModel.Scalar(x => x[0], new ParameterSpec("r", 1, 0, 0, Temperature: TemperatureBehaviour.Linear(100)));
        var result = MonteCarlo.Analyse(model, 100_000, seed: 8, temperature: new TemperatureRange(25, 125));
        var figure = result.Figures[0];

        Precision.AlmostEqualRelative(1.0 / 300, figure.StandardDeviation!.Value, 0.01, "σ");
        Precision.AlmostEqualAbsolute(1, figure.Mean!.Value, 1e-4, "mean");
        Assert.InRange(figure.Min!.Value, 0.99, 1);
        Assert.InRange(figure.Max!.Value, 1, 1.01);
        Assert.Contains("Temperature", result.Method, StringComparison.Ordinal);
    }

    [Fact]
    public void Arguments_are_validated_by_name()
    {
        var model = FormulaModel.Product(2, 0.01);
        Assert.Equal("samples", Assert.Throws<ArgumentOutOfRangeException>(() => MonteCarlo.Analyse(model, 0, 1)).ParamName);
        Assert.Equal("samples", Assert.Throws<ArgumentOutOfRangeException>(() => MonteCarlo.Analyse(model, 1_000_001, 1)).ParamName);
        Assert.Equal("bands", Assert.Throws<ArgumentException>(() => MonteCarlo.Analyse(model, 10, 1, [new FigureBand("nope", 0, 1)])).ParamName);
        Assert.Equal("bands", Assert.Throws<ArgumentException>(() => MonteCarlo.Analyse(model, 10, 1, [new FigureBand("y", 2, 1)])).ParamName);
        Assert.Equal("temperature", Assert.Throws<ArgumentOutOfRangeException>(
            () => MonteCarlo.Analyse(model, 10, 1, temperature: new TemperatureRange(30, 20))).ParamName);
        Assert.Single(MonteCarlo.Analyse(model, 1, 1).Figures); // the smallest run is allowed
    }
}
