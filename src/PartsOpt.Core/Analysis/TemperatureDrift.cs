namespace PartsOpt.Analysis;

/// <summary>
/// Temperature drift analysis: every parameter at nominal, moved only by its temperature behaviour over
/// an operating range relative to 25 °C, and the figures' extremes over the corners of those drift bands.
/// </summary>
/// <remarks>
/// A linear coefficient c moves a value by ±c·1e-6·|T − 25 °C| (the sign is not known, so both ways, at
/// the end of the range furthest from 25 °C). A banded characteristic (class-2 ceramics, EIA-198) moves it
/// anywhere in its guaranteed band as soon as the range leaves 25 °C: the standard guarantees the band
/// over the rated range, not a curve. A range that leaves a part's rated range gives a warning naming the
/// standard. The corners follow the worst-case policy (<see cref="WorstCase"/>).
/// </remarks>
public static class TemperatureDrift
{
    /// <summary>Finds each figure's extremes over the drift bands of the range.</summary>
    /// <param name="model">The circuit reduced to numbers.</param>
    /// <param name="range">Operating temperature range, °C.</param>
    /// <param name="exhaustiveLimit">Up to this many drifting parameters, all 2^n corners (0…20).</param>
    /// <param name="relativeStep">Step of the sensitivities that direct the corners beyond the limit.</param>
    /// <exception cref="ArgumentOutOfRangeException">An argument out of range; the message names it.</exception>
    /// <exception cref="ArgumentException">The model has a malformed parameter.</exception>
    public static TemperatureDriftResult Analyse(IFigureModel model, TemperatureRange range,
        int exhaustiveLimit = WorstCase.DefaultExhaustiveLimit, double relativeStep = SensitivityAnalysis.DefaultRelativeStep)
    {
        ModelPoint.Validate(model, nameof(model));
        ArgumentNullException.ThrowIfNull(range);
        TemperatureRange.Validate(range, nameof(range));
        CornerSearch.ValidateLimit(exhaustiveLimit, nameof(exhaustiveLimit));
        SensitivityAnalysis.ValidateStep(relativeStep, nameof(relativeStep));

        var drifts = model.Parameters.Select(p => ParameterDrift.Of(p, range)).ToArray();
        var deltaMinus = drifts.Select(d => -d.DriftMinus).ToArray();
        var deltaPlus = drifts.Select(d => d.DriftPlus).ToArray();
        var outcome = CornerSearch.Run(model, deltaMinus, deltaPlus, exhaustiveLimit, relativeStep);
        var method = "Temperature drift from 25 °C: linear coefficients as ±c·|T − 25 °C| at the furthest end of " +
            "the range, banded characteristics (EIA-198) as their whole guaranteed band; parameters otherwise at " +
            "nominal. " + outcome.Describe(exhaustiveLimit);
        var warnings = drifts.Where(d => d.Warning is not null).Select(d => d.Warning!).ToArray();
        return new TemperatureDriftResult(range, method, outcome.Method, outcome.Evaluated, outcome.Figures, drifts, warnings);
    }
}

/// <summary>Extremes of every figure over a temperature range, and the drift applied to each parameter.</summary>
/// <param name="Range">The operating range, °C.</param>
/// <param name="Method">How the drift was applied and how the corners were chosen.</param>
/// <param name="CornerMethod">Which corners were evaluated.</param>
/// <param name="PointsEvaluated">Number of model evaluations (corners and the nominal point).</param>
/// <param name="Figures">One entry per figure; the deviation percentages are the drift from nominal.</param>
/// <param name="Parameters">The drift applied to each parameter and its source.</param>
/// <param name="Warnings">Parts whose rated range the operating range leaves.</param>
public sealed record TemperatureDriftResult(
    TemperatureRange Range,
    string Method,
    CornerMethod CornerMethod,
    int PointsEvaluated,
    IReadOnlyList<FigureExtremes> Figures,
    IReadOnlyList<ParameterDrift> Parameters,
    IReadOnlyList<string> Warnings);
