using System.Text.Json;
using PartsOpt.Analysis;
using PartsOpt.Values;

namespace PartsOpt.Tests.Analysis;

public class ResultSerialisationTests
{
    /// <summary>
    /// System.Text.Json refuses NaN and infinities by default; a figure that does not exist must reach the
    /// web layer as null, not as an exception.
    /// </summary>
    [Fact]
    public void Every_result_serialises_with_default_options_even_with_an_undefined_figure()
    {
        var model = new FormulaModel(
            [ParameterSpec.Symmetric("osc.c", 10e-9, 0.05, DielectricCharacteristics.For(Dielectric.X7R)), ParameterSpec.Symmetric("b", 1, 0.01)],
            [new FigureSpec("frequency", "Hz"), new FigureSpec("missing", "V"), new FigureSpec("zero", "V")],
            (x, y) =>
            {
                y[0] = 1 / x[0];
                y[1] = double.NaN;
                y[2] = x[1] - 1;
            });
        var range = new TemperatureRange(-40, 85);

        var sensitivity = JsonSerializer.Serialize(SensitivityAnalysis.Analyse(model));
        JsonSerializer.Serialize(RootSumSquare.Analyse(model));
        JsonSerializer.Serialize(WorstCase.Analyse(model, range));
        JsonSerializer.Serialize(TemperatureDrift.Analyse(model, range));
        var sampled = JsonSerializer.Serialize(MonteCarlo.Analyse(model, 100, 1, [new FigureBand("missing", 0, 1)], range));

        Assert.Contains("\"Nominal\":null", sensitivity, StringComparison.Ordinal);
        Assert.Contains("\"Mean\":null", sampled, StringComparison.Ordinal);
        Assert.Contains("\"Fraction\":0", sampled, StringComparison.Ordinal);
    }
}
