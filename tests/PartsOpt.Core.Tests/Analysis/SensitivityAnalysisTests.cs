using PartsOpt.Analysis;

namespace PartsOpt.Tests.Analysis;

public class SensitivityAnalysisTests
{
    [Fact]
    public void Product_and_ratio_have_unit_sensitivities()
    {
        var result = SensitivityAnalysis.Analyse(FormulaModel.ProductRatio(0.01, 0.01, 0.01));

        // Calculus: for y = a·b/c, (a/y)·∂y/∂a = 1, likewise b, and (c/y)·∂y/∂c = −1. The central
        // difference is exact for a and b and off by h² = 1e-10 for c.
        Precision.AlmostEqualRelative(1, result.Sensitivity("y", "a")!.Value, 1e-9, "S(a)");
        Precision.AlmostEqualRelative(1, result.Sensitivity("y", "b")!.Value, 1e-9, "S(b)");
        Precision.AlmostEqualRelative(-1, result.Sensitivity("y", "c")!.Value, 1e-9, "S(c)");
        Assert.Equal(["a", "b", "c"], result.ParameterNames);
        Assert.Equal(["y"], result.FigureNames);
    }

    [Fact]
    public void Oscillator_frequency_sensitivities_match_the_derived_values()
    {
        // R = 10 kΩ, C = 100 nF, β = 1/2: f = 1/(2RC·ln 3) = 455.12 Hz (REFERENCE.md, Sedra & Smith).
        var model = FormulaModel.Oscillator(10e3, 100e-9, 10e3, 10e3);
        var result = SensitivityAnalysis.Analyse(model);

        Precision.AlmostEqualRelative(455.12, result.Figures[0].Nominal!.Value, 1e-5, "f");
        // Calculus on f ∝ 1/(R·C): −1 to each.
        Precision.AlmostEqualRelative(-1, result.Sensitivity("frequency", "osc.r")!.Value, 1e-9, "S(R)");
        Precision.AlmostEqualRelative(-1, result.Sensitivity("frequency", "osc.c")!.Value, 1e-9, "S(C)");
        // REFERENCE.md (derived): S(r2) = −S(r1) = −2β/((1+β)·ln((1+β)/(1−β))) = −0.6068 at β = 1/2.
        var beta = 0.5;
        var expected = -2 * beta / ((1 + beta) * Math.Log((1 + beta) / (1 - beta)));
        Precision.AlmostEqualRelative(-0.6068, expected, 1e-4, "formula at β = 1/2");
        Precision.AlmostEqualRelative(expected, result.Sensitivity("frequency", "osc.r2")!.Value, 1e-8, "S(r2)");
        Precision.AlmostEqualRelative(-expected, result.Sensitivity("frequency", "osc.r1")!.Value, 1e-8, "S(r1)");
        // REFERENCE.md: the sensitivities to all resistors sum to −1 (f scales as 1/resistance).
        var sum = result.Sensitivity("frequency", "osc.r")!.Value + result.Sensitivity("frequency", "osc.r1")!.Value
            + result.Sensitivity("frequency", "osc.r2")!.Value;
        Precision.AlmostEqualRelative(-1, sum, 1e-8, "sum over resistors");
    }

    [Fact]
    public void Variance_shares_follow_sensitivity_times_sigma_squared_and_rank_largest_first()
    {
        // |S| = 1 each; uniform σ ∝ tolerance, so shares ∝ t²: 1 : 4 : 9 of 14 (first-order variance sum).
        var result = SensitivityAnalysis.Analyse(FormulaModel.ProductRatio(0.01, 0.02, 0.03));
        var ranked = result.Figures[0].Ranked;

        Assert.Equal(["c", "b", "a"], ranked.Select(c => c.Parameter));
        Precision.AlmostEqualRelative(9.0 / 14, ranked[0].Share!.Value, 1e-8, "share c");
        Precision.AlmostEqualRelative(4.0 / 14, ranked[1].Share!.Value, 1e-8, "share b");
        Precision.AlmostEqualRelative(1.0 / 14, ranked[2].Share!.Value, 1e-8, "share a");
        // Uniform ±3 %: σ = 0.03/√3 (variance of the uniform distribution).
        Precision.AlmostEqualRelative(0.03 / Math.Sqrt(3), ranked[0].RelativeSigma, 1e-12, "σ of c");
        // Relative σ of y = √(1 + 4 + 9)·0.01/√3.
        Precision.AlmostEqualRelative(Math.Sqrt(14) * 0.01 / Math.Sqrt(3), result.Figures[0].RelativeSigma!.Value, 1e-8, "σ of y");
    }

    [Fact]
    public void A_zero_figure_has_no_normalised_sensitivity_but_keeps_its_variance_budget()
    {
        // y = a − b with a = b: y = 0, so S = (x/y)·∂y/∂x is undefined; the shares are ½ each by symmetry.
        var model = FormulaModel.Scalar(x => x[0] - x[1], ParameterSpec.Symmetric("a", 5, 0.01), ParameterSpec.Symmetric("b", 5, 0.01));
        var result = SensitivityAnalysis.Analyse(model);

        Assert.Null(result.Sensitivity("y", "a"));
        Assert.Null(result.Figures[0].RelativeSigma);
        Assert.All(result.Figures[0].Ranked, c => Precision.AlmostEqualRelative(0.5, c.Share!.Value, 1e-9, c.Parameter));
        // σ_y = √2·5·0.01/√3 V (first order, exact here: y is linear).
        Precision.AlmostEqualRelative(Math.Sqrt(2) * 5 * 0.01 / Math.Sqrt(3), result.Figures[0].Sigma!.Value, 1e-9, "σ");
    }

    [Fact]
    public void An_undefined_figure_reports_absent_values_and_does_not_throw()
    {
        var model = FormulaModel.Scalar(_ => double.NaN, ParameterSpec.Symmetric("a", 1, 0.01));
        var result = SensitivityAnalysis.Analyse(model);

        Assert.Null(result.Sensitivity("y", "a"));
        Assert.Null(result.Figures[0].Nominal);
        Assert.Null(result.Figures[0].Ranked[0].Share);
    }

    [Fact]
    public void A_figure_that_stops_existing_next_to_nominal_has_no_shares()
    {
        // Defined at nominal, NaN one step above: the derivative does not exist there.
        var model = FormulaModel.Scalar(x => x[0] > 1 ? double.NaN : x[0] * x[1],
            ParameterSpec.Symmetric("a", 1, 0.01), ParameterSpec.Symmetric("b", 1, 0.01));
        var result = SensitivityAnalysis.Analyse(model);

        Assert.Null(result.Sensitivity("y", "a"));
        Precision.AlmostEqualRelative(1, result.Sensitivity("y", "b")!.Value, 1e-9, "S(b)");
        Assert.All(result.Figures[0].Ranked, c => Assert.Null(c.Share));
    }

    [Fact]
    public void Arguments_are_validated_by_name()
    {
        var model = FormulaModel.ProductRatio(0.01, 0.01, 0.01);
        Assert.Equal("relativeStep", Assert.Throws<ArgumentOutOfRangeException>(() => SensitivityAnalysis.Analyse(model, 0)).ParamName);
        Assert.Equal("relativeStep", Assert.Throws<ArgumentOutOfRangeException>(() => SensitivityAnalysis.Analyse(model, double.NaN)).ParamName);
        Assert.Equal("model", Assert.Throws<ArgumentNullException>(() => SensitivityAnalysis.Analyse(null!)).ParamName);
        var negative = FormulaModel.Scalar(x => x[0], new ParameterSpec("a", 1, -0.01, 0.01));
        var error = Assert.Throws<ArgumentException>(() => SensitivityAnalysis.Analyse(negative));
        Assert.Equal("model", error.ParamName);
        Assert.Contains("'a'", error.Message, StringComparison.Ordinal);
        var result = SensitivityAnalysis.Analyse(model);
        Assert.Equal("parameter", Assert.Throws<ArgumentException>(() => result.Sensitivity("y", "zz")).ParamName);
        Assert.Equal("figure", Assert.Throws<ArgumentException>(() => result.Sensitivity("zz", "a")).ParamName);
    }
}
