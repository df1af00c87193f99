using PartsOpt.Analysis;
using PartsOpt.Values;

namespace PartsOpt.Tests.Analysis;

public class TemperatureDriftTests
{
    private static FormulaModel Capacitor(TemperatureBehaviour behaviour) =>
        FormulaModel.Scalar(x => x[0], ParameterSpec.Symmetric("osc.c", 10e-9, 0.05, behaviour, "C1"));

    [Fact]
    public void C0G_drifts_thirty_ppm_per_kelvin_from_25_degrees()
    {
        var c0g = DielectricCharacteristics.For(Dielectric.C0G);

        // EIA-198 C0G: 0 ± 30 ppm/K. 25…85 °C: ±30e-6 × 60 K = ±0.18 %.
        var hot = TemperatureDrift.Analyse(Capacitor(c0g), new TemperatureRange(25, 85)).Figures[0];
        Precision.AlmostEqualRelative(0.18, hot.MaxDeviationPercent!.Value, 1e-9, "25…85 °C, +");
        Precision.AlmostEqualRelative(-0.18, hot.MinDeviationPercent!.Value, 1e-9, "25…85 °C, −");

        // −40…+85 °C: the cold end is 65 K from 25 °C, further than the hot end's 60 K, so the bound
        // is 30e-6 × 65 K = ±0.195 %, not the ±0.18 % of the hot end alone.
        var result = TemperatureDrift.Analyse(Capacitor(c0g), new TemperatureRange(-40, 85));
        Precision.AlmostEqualRelative(0.195, result.Figures[0].MaxDeviationPercent!.Value, 1e-9, "−40…85 °C");
        var drift = Assert.Single(result.Parameters);
        Precision.AlmostEqualRelative(0.00195, drift.DriftPlus, 1e-9, "drift applied");
        Assert.Equal("C1", drift.ReferenceDesignator);
        Assert.Contains("C0G", drift.Standard, StringComparison.Ordinal);
        Assert.Empty(result.Warnings);
    }

    [Fact]
    public void X7R_band_is_passed_through_whole()
    {
        var x7r = DielectricCharacteristics.For(Dielectric.X7R);
        var result = TemperatureDrift.Analyse(Capacitor(x7r), new TemperatureRange(-40, 85));
        var figure = result.Figures[0];

        // EIA-198 X7R: ±15 % over −55…+125 °C; the whole band, as the standard gives no curve.
        Precision.AlmostEqualRelative(15, figure.MaxDeviationPercent!.Value, 1e-9, "+15 %");
        Precision.AlmostEqualRelative(-15, figure.MinDeviationPercent!.Value, 1e-9, "−15 %");
        Precision.AlmostEqualRelative(0.15, result.Parameters[0].DriftMinus, 1e-12, "band minus");
        Assert.Contains("X7R", result.Parameters[0].Standard, StringComparison.Ordinal);
        Assert.Empty(result.Warnings);
    }

    [Fact]
    public void Y5V_asymmetric_band_is_kept_asymmetric()
    {
        // EIA-198 Y5V: +22/−82 % over −30…+85 °C.
        var figure = TemperatureDrift.Analyse(Capacitor(DielectricCharacteristics.For(Dielectric.Y5V)),
            new TemperatureRange(-30, 85)).Figures[0];
        Precision.AlmostEqualRelative(22, figure.MaxDeviationPercent!.Value, 1e-9, "+22 %");
        Precision.AlmostEqualRelative(-82, figure.MinDeviationPercent!.Value, 1e-9, "−82 %");
    }

    [Fact]
    public void A_range_beyond_the_rated_range_warns_and_names_the_standard()
    {
        var x5r = DielectricCharacteristics.For(Dielectric.X5R);

        // EIA-198 X5R is rated to +85 °C.
        Assert.Empty(TemperatureDrift.Analyse(Capacitor(x5r), new TemperatureRange(-40, 85)).Warnings);
        var result = TemperatureDrift.Analyse(Capacitor(x5r), new TemperatureRange(-40, 105));
        var warning = Assert.Single(result.Warnings);
        Assert.Contains("EIA-198 X5R", warning, StringComparison.Ordinal);
        Assert.Contains("osc.c", warning, StringComparison.Ordinal);
        Assert.Equal(warning, result.Parameters[0].Warning);
        // The same warning reaches the worst-case and Monte Carlo results.
        Assert.Equal([warning], WorstCase.Analyse(Capacitor(x5r), new TemperatureRange(-40, 105)).Warnings);
        Assert.Equal([warning], MonteCarlo.Analyse(Capacitor(x5r), 10, 1, temperature: new TemperatureRange(-40, 105)).Warnings);
    }

    [Fact]
    public void Oscillator_frequency_drifts_inversely_with_its_capacitor()
    {
        // f ∝ 1/C (Sedra & Smith): C at ±0.18 % (C0G, 25…85 °C) gives f at 1/1.0018 − 1 and 1/0.9982 − 1.
        var model = FormulaModel.Oscillator(10e3, 100e-9, 10e3, 10e3, DielectricCharacteristics.For(Dielectric.C0G));
        var result = TemperatureDrift.Analyse(model, new TemperatureRange(25, 85));
        var figure = result.Figures[0];

        Precision.AlmostEqualRelative((1 / 1.0018 - 1) * 100, figure.MinDeviationPercent!.Value, 1e-9, "f low");
        Precision.AlmostEqualRelative((1 / 0.9982 - 1) * 100, figure.MaxDeviationPercent!.Value, 1e-9, "f high");
        Assert.Equal(ToleranceEnd.Plus, figure.MinCorner!.Single(s => s.Parameter == "osc.c").End);
        // Resistors carry no temperature behaviour here: one drifting parameter, 2 corners and nominal.
        Assert.Equal(3, result.PointsEvaluated);
    }

    [Fact]
    public void The_reference_temperature_alone_gives_no_drift()
    {
        var figure = TemperatureDrift.Analyse(Capacitor(DielectricCharacteristics.For(Dielectric.X7R)),
            new TemperatureRange(25, 25)).Figures[0];
        Assert.Equal(0, figure.MaxDeviationPercent);
        Assert.Equal(0, figure.MinDeviationPercent);
    }

    [Fact]
    public void Arguments_are_validated_by_name()
    {
        var model = Capacitor(DielectricCharacteristics.For(Dielectric.C0G));
        Assert.Equal("range", Assert.Throws<ArgumentNullException>(() => TemperatureDrift.Analyse(model, null!)).ParamName);
        Assert.Equal("range", Assert.Throws<ArgumentOutOfRangeException>(
            () => TemperatureDrift.Analyse(model, new TemperatureRange(double.NaN, 85))).ParamName);
        Assert.Equal("range", Assert.Throws<ArgumentOutOfRangeException>(
            () => TemperatureDrift.Analyse(model, new TemperatureRange(-300, 85))).ParamName);
    }
}
