using PartsOpt.Analysis;

namespace PartsOpt.Tests.Analysis;

public class WorstCaseTests
{
    private static FormulaModel TenVoltDivider(TemperatureBehaviour? raTemperature = null) => FormulaModel.Divider(
        new ParameterSpec("v", 10, 0, 0),
        ParameterSpec.Symmetric("ra", 10e3, 0.01, raTemperature, "R1"),
        ParameterSpec.Symmetric("rb", 10e3, 0.01, null, "R2"));

    [Fact]
    public void Divider_extremes_equal_the_hand_computed_corners()
    {
        var result = WorstCase.Analyse(TenVoltDivider());
        var figure = Assert.Single(result.Figures);

        // Vout = V·Rb/(Ra+Rb) rises with Rb and falls with Ra: max = 10·10.1k/(9.9k+10.1k) = 5.05 V,
        // min = 10·9.9k/(10.1k+9.9k) = 4.95 V.
        Precision.AlmostEqualRelative(5.05, figure.Max!.Value, 1e-12, "max");
        Precision.AlmostEqualRelative(4.95, figure.Min!.Value, 1e-12, "min");
        Precision.AlmostEqualRelative(1.0, figure.MaxDeviationPercent!.Value, 1e-9, "+1 %");
        Precision.AlmostEqualRelative(-1.0, figure.MinDeviationPercent!.Value, 1e-9, "−1 %");
        Assert.Equal([ToleranceEnd.Nominal, ToleranceEnd.Minus, ToleranceEnd.Plus], figure.MaxCorner!.Select(s => s.End));
        Assert.Equal([ToleranceEnd.Nominal, ToleranceEnd.Plus, ToleranceEnd.Minus], figure.MinCorner!.Select(s => s.End));
        Precision.AlmostEqualRelative(9.9e3, figure.MaxCorner![1].Value, 1e-12, "Ra at its minus end");
        // Only Ra and Rb vary (V has no tolerance): 2² corners and the nominal point.
        Assert.Equal(CornerMethod.AllCorners, result.CornerMethod);
        Assert.Equal(5, result.PointsEvaluated);
        Assert.Contains("all 2^n corners", result.Method, StringComparison.OrdinalIgnoreCase);
        Assert.Contains("can miss the worst case", result.Method, StringComparison.Ordinal);
    }

    private static FormulaModel MonotonicFourteen()
    {
        // y = (x0 + x1)/(x2 + x3) · Π x_i^e_i, exponents of both signs: monotonic in every part.
        var exponents = new[] { 0.0, 0, 0, 0, 1, -1, 2, -0.5, 1, -2, 0.3, -1, 1, 0.7 };
        var parameters = Enumerable.Range(0, 14)
            .Select(i => new ParameterSpec($"x{i}", 1 + 0.1 * i, 0.01 * (1 + i % 3), 0.02 * (1 + i % 2))).ToArray();
        return FormulaModel.Scalar(x =>
        {
            var y = (x[0] + x[1]) / (x[2] + x[3]);
            for (var i = 4; i < 14; i++) y *= Math.Pow(x[i], exponents[i]);
            return y;
        }, parameters);
    }

    [Fact]
    public void Sensitivity_directed_corners_agree_with_all_corners_for_a_monotonic_figure()
    {
        var model = MonotonicFourteen();
        var all = WorstCase.Analyse(model, exhaustiveLimit: 14);
        var directed = WorstCase.Analyse(model);

        Assert.Equal(CornerMethod.AllCorners, all.CornerMethod);
        Assert.Equal((1 << 14) + 1, all.PointsEvaluated);
        Assert.Equal(CornerMethod.SensitivityDirected, directed.CornerMethod);
        Assert.Equal(3, directed.PointsEvaluated);
        Assert.Contains("sensitivity-directed corners", directed.Method, StringComparison.OrdinalIgnoreCase);
        Assert.Contains("can miss the worst case", directed.Method, StringComparison.Ordinal);
        // For a function monotonic in each variable the extremes lie at the corner each variable's
        // direction points to (calculus): both searches find the same corner.
        Precision.AlmostEqualRelative(all.Figures[0].Max!.Value, directed.Figures[0].Max!.Value, 1e-14, "max");
        Precision.AlmostEqualRelative(all.Figures[0].Min!.Value, directed.Figures[0].Min!.Value, 1e-14, "min");
        Assert.Equal(all.Figures[0].MaxCorner, directed.Figures[0].MaxCorner);
    }

    [Fact]
    public void A_non_monotonic_figure_shows_the_stated_limitation()
    {
        // y = (x − 1.05)² with x = 1 ± 10 %: calculus puts the minimum 0 at x = 1.05, inside the band.
        // The corners (0.9, 1.1) and the nominal point give 0.0225, 0.0025 and 0.0025.
        var model = FormulaModel.Scalar(x => (x[0] - 1.05) * (x[0] - 1.05), ParameterSpec.Symmetric("x", 1, 0.10));
        foreach (var limit in new[] { 0, 12 })
        {
            var result = WorstCase.Analyse(model, exhaustiveLimit: limit);
            Precision.AlmostEqualRelative(0.0025, result.Figures[0].Min!.Value, 1e-9, "min found");
            Precision.AlmostEqualRelative(0.0225, result.Figures[0].Max!.Value, 1e-9, "max found");
            // The result claims no more than it can: it states that corners can miss an inner extreme.
            Assert.Contains("not monotonic", result.Method, StringComparison.Ordinal);
        }
        // Sampling the inside finds values below the corners' minimum.
        var sampled = MonteCarlo.Analyse(model, 10_000, seed: 7);
        Assert.True(sampled.Figures[0].Min < 0.0025 / 10);
    }

    [Fact]
    public void Temperature_widens_each_band_by_its_drift()
    {
        // Ra 100 ppm/K over 25…125 °C: ±1 % drift (100e-6 × 100 K) on top of ±1 % tolerance.
        var result = WorstCase.Analyse(TenVoltDivider(TemperatureBehaviour.Linear(100)), new TemperatureRange(25, 125));
        var figure = result.Figures[0];

        // Divider formula at Ra = 10k·0.99·0.99, Rb = 10.1k (max) and Ra = 10k·1.01·1.01, Rb = 9.9k (min).
        Precision.AlmostEqualRelative(10 * 10.1e3 / (10e3 * 0.99 * 0.99 + 10.1e3), figure.Max!.Value, 1e-12, "max");
        Precision.AlmostEqualRelative(10 * 9.9e3 / (10e3 * 1.01 * 1.01 + 9.9e3), figure.Min!.Value, 1e-12, "min");
        Assert.Contains("temperature", result.Method, StringComparison.Ordinal);
        Assert.Empty(result.Warnings);
    }

    [Fact]
    public void Corners_where_the_figure_does_not_exist_are_counted()
    {
        // Exists only while x ≤ 1.05: of the corners 0.9 and 1.1 and the nominal point, one fails.
        var model = FormulaModel.Scalar(x => x[0] > 1.05 ? double.NaN : x[0], ParameterSpec.Symmetric("x", 1, 0.10));
        var figure = WorstCase.Analyse(model).Figures[0];

        Assert.Equal(1, figure.UndefinedCorners);
        Precision.AlmostEqualRelative(1.0, figure.Max!.Value, 1e-12, "max among defined points");
    }

    [Fact]
    public void Arguments_are_validated_by_name()
    {
        var model = TenVoltDivider();
        Assert.Equal("exhaustiveLimit", Assert.Throws<ArgumentOutOfRangeException>(() => WorstCase.Analyse(model, exhaustiveLimit: 21)).ParamName);
        Assert.Equal("exhaustiveLimit", Assert.Throws<ArgumentOutOfRangeException>(() => WorstCase.Analyse(model, exhaustiveLimit: -1)).ParamName);
        Assert.Equal("temperature", Assert.Throws<ArgumentOutOfRangeException>(() => WorstCase.Analyse(model, new TemperatureRange(85, -40))).ParamName);
        Assert.Equal("model", Assert.Throws<ArgumentNullException>(() => WorstCase.Analyse(null!)).ParamName);
    }
}
