using PartsOpt.Analysis;

namespace PartsOpt.Tests.Analysis;

public class RootSumSquareTests
{
    [Theory]
    [InlineData(1, 0.01)]
    [InlineData(3, 0.01)]
    [InlineData(6, 0.05)]
    public void Product_of_uniform_parts_has_relative_sigma_root_n_times_t_over_root_3(int n, double t)
    {
        var result = RootSumSquare.Analyse(FormulaModel.Product(n, t));
        var figure = Assert.Single(result.Figures);

        // Standard probability: a uniform ±t has σ = t/√3; n independent terms with |S| = 1 add in
        // quadrature, σ_rel = √n·t/√3.
        var expected = Math.Sqrt(n) * t / Math.Sqrt(3);
        Precision.AlmostEqualRelative(expected, figure.RelativeSigma!.Value, 1e-8, "σ_rel");
        Precision.AlmostEqualRelative(1 - 3 * expected, figure.Min!.Value, 1e-8, "min = 1 − 3σ");
        Precision.AlmostEqualRelative(1 + 3 * expected, figure.Max!.Value, 1e-8, "max = 1 + 3σ");
        Assert.Equal(3, result.CoverageFactor);
    }

    [Fact]
    public void Normal_parts_take_their_band_as_three_sigma()
    {
        // Common practice: the tolerance band of a normally spread part is ±3σ, so σ = t/3.
        var result = RootSumSquare.Analyse(FormulaModel.Product(2, 0.03, SpreadDistribution.Normal), coverageFactor: 2);
        var figure = result.Figures[0];

        Precision.AlmostEqualRelative(Math.Sqrt(2) * 0.01, figure.RelativeSigma!.Value, 1e-8, "σ_rel");
        Precision.AlmostEqualRelative(1 + 2 * Math.Sqrt(2) * 0.01, figure.Max!.Value, 1e-8, "k = 2");
        Assert.Contains("2", result.Method, StringComparison.Ordinal);
    }

    [Fact]
    public void An_asymmetric_tolerance_moves_the_centre_by_its_mean_offset()
    {
        // Tolerance letter Z: +80/−20 % (IEC 60062). Uniform over [0.8, 1.8]·C: mean 1.3·C, σ = 0.5/√3·C.
        var model = FormulaModel.Scalar(x => x[0], new ParameterSpec("c", 100e-9, 0.20, 0.80));
        var figure = RootSumSquare.Analyse(model).Figures[0];

        Precision.AlmostEqualRelative(100e-9, figure.Nominal!.Value, 1e-12, "nominal");
        Precision.AlmostEqualRelative(130e-9, figure.Centre!.Value, 1e-8, "centre");
        Precision.AlmostEqualRelative(0.5 / Math.Sqrt(3) * 100e-9, figure.Sigma!.Value, 1e-8, "σ");
        Precision.AlmostEqualRelative(130e-9 - 3 * 0.5 / Math.Sqrt(3) * 100e-9, figure.Min!.Value, 1e-8, "min");
    }

    [Fact]
    public void The_mean_offset_follows_the_sign_of_the_sensitivity()
    {
        // y = 1/c, S = −1 (calculus): the +30 % offset of a +80/−20 % part moves the centre by −30 % to
        // first order.
        var model = FormulaModel.Scalar(x => 1 / x[0], new ParameterSpec("c", 2, 0.20, 0.80));
        var figure = RootSumSquare.Analyse(model).Figures[0];

        Precision.AlmostEqualRelative(0.5 * (1 - 0.30), figure.Centre!.Value, 1e-8, "centre");
    }

    [Fact]
    public void A_figure_centred_on_zero_still_gets_a_band()
    {
        // Divider midpoint between ±10 V with equal 1 % resistors: Vth = −10 + 20·Rb/(Ra+Rb) = 0 V
        // (REFERENCE.md, comparator); ∂Vth/∂Rb·Rb = 20·¼ = 5 V per unit relative change, likewise −5 V for Ra.
        var model = FormulaModel.Scalar(x => -10 + 20 * x[1] / (x[0] + x[1]),
            ParameterSpec.Symmetric("cmp.ra", 10e3, 0.01), ParameterSpec.Symmetric("cmp.rb", 10e3, 0.01));
        var figure = RootSumSquare.Analyse(model).Figures[0];

        Assert.Null(figure.RelativeSigma);
        Precision.AlmostEqualRelative(Math.Sqrt(2) * 5 * 0.01 / Math.Sqrt(3), figure.Sigma!.Value, 1e-6, "σ in V");
    }

    [Fact]
    public void Arguments_are_validated_by_name()
    {
        var model = FormulaModel.Product(2, 0.01);
        Assert.Equal("coverageFactor", Assert.Throws<ArgumentOutOfRangeException>(() => RootSumSquare.Analyse(model, 0)).ParamName);
        Assert.Equal("relativeStep", Assert.Throws<ArgumentOutOfRangeException>(() => RootSumSquare.Analyse(model, 3, 1)).ParamName);
    }
}
