namespace PartsOpt.Analysis;

/// <summary>
/// Extreme-value (worst-case) analysis: every parameter at its tolerance limits together, the most
/// conservative of the tolerance analyses.
/// </summary>
/// <remarks>
/// <para>Corner policy: with at most <c>exhaustiveLimit</c> varying parameters (12 by default, 4096
/// corners), all 2^n corners are evaluated; beyond that, for each figure the two sensitivity-directed
/// corners (every parameter to the end that pushes the figure up, or down, by the sign of its
/// sensitivity at nominal). The nominal point is always evaluated too. The result states which was used.
/// Corners can miss the worst case of a non-monotonic figure: the result says so.</para>
/// <para>With a temperature range, each band is widened by the parameter's drift over that range
/// (<see cref="ParameterDrift.Of"/>), multiplicatively: the lower end becomes
/// nominal·(1 − tolerance)·(1 − drift), the upper end nominal·(1 + tolerance)·(1 + drift).</para>
/// </remarks>
public static class WorstCase
{
    /// <summary>Default largest number of varying parameters whose corners are all evaluated.</summary>
    public const int DefaultExhaustiveLimit = CornerSearch.DefaultExhaustiveLimit;

    /// <summary>Finds each figure's extremes over the corners of the tolerance (and temperature) bands.</summary>
    /// <param name="model">The circuit reduced to numbers.</param>
    /// <param name="temperature">Operating range whose drift widens each band; null for tolerance alone.</param>
    /// <param name="exhaustiveLimit">Up to this many varying parameters, all 2^n corners (0…20).</param>
    /// <param name="relativeStep">Step of the sensitivities that direct the corners beyond the limit.</param>
    /// <exception cref="ArgumentOutOfRangeException">An argument out of range; the message names it.</exception>
    /// <exception cref="ArgumentException">The model has a malformed parameter.</exception>
    public static WorstCaseResult Analyse(IFigureModel model, TemperatureRange? temperature = null,
        int exhaustiveLimit = DefaultExhaustiveLimit, double relativeStep = SensitivityAnalysis.DefaultRelativeStep)
    {
        ModelPoint.Validate(model, nameof(model));
        TemperatureRange.Validate(temperature, nameof(temperature));
        CornerSearch.ValidateLimit(exhaustiveLimit, nameof(exhaustiveLimit));
        SensitivityAnalysis.ValidateStep(relativeStep, nameof(relativeStep));

        var parameters = model.Parameters;
        var deltaMinus = new double[parameters.Count];
        var deltaPlus = new double[parameters.Count];
        var warnings = new List<string>();
        for (var i = 0; i < parameters.Count; i++)
        {
            var p = parameters[i];
            var drift = temperature is null ? null : ParameterDrift.Of(p, temperature);
            if (drift?.Warning is { } warning) warnings.Add(warning);
            deltaMinus[i] = (1 - p.ToleranceMinus) * (1 - (drift?.DriftMinus ?? 0)) - 1;
            deltaPlus[i] = (1 + p.TolerancePlus) * (1 + (drift?.DriftPlus ?? 0)) - 1;
        }

        var outcome = CornerSearch.Run(model, deltaMinus, deltaPlus, exhaustiveLimit, relativeStep);
        var method = "Extreme-value analysis, every parameter at its tolerance limits together" +
            (temperature is null ? "" : ", each band widened by its temperature drift") + ". " +
            outcome.Describe(exhaustiveLimit);
        return new WorstCaseResult(method, outcome.Method, outcome.Evaluated, temperature, outcome.Figures, warnings);
    }
}

/// <summary>Extremes of every figure over the corners of the parameters' bands.</summary>
/// <param name="Method">How the corners were chosen and what that can miss.</param>
/// <param name="CornerMethod">Which corners were evaluated.</param>
/// <param name="PointsEvaluated">Number of model evaluations (corners and the nominal point).</param>
/// <param name="Temperature">The temperature range folded into the bands, if any.</param>
/// <param name="Figures">One entry per figure, in the model's order.</param>
/// <param name="Warnings">Temperature ranges that leave a part's rated range.</param>
public sealed record WorstCaseResult(
    string Method,
    CornerMethod CornerMethod,
    int PointsEvaluated,
    TemperatureRange? Temperature,
    IReadOnlyList<FigureExtremes> Figures,
    IReadOnlyList<string> Warnings);
