using System.Globalization;
using PartsOpt.Analysis;
using PartsOpt.Topologies;

namespace PartsOpt.Search;

/// <summary>
/// The yield check the search uses by default: the design's figure model through the tolerance analyses
/// (extreme-value corners or Monte Carlo, with the requirement's temperature range), against the same
/// bands the nominal design must meet: frequency, ramp amplitude if asked, output levels if asked, and the
/// duty adjustment's reach (the end giving the higher duty must reach the maximum, the other the minimum).
/// The engine's failure checks are judged on nominal values only.
/// </summary>
public sealed class ToleranceYieldCheck : IYieldCheck
{
    /// <summary>Monte Carlo seed (fixed, so the search stays deterministic).</summary>
    public const int Seed = 20_26;

    /// <inheritdoc/>
    public YieldResult Estimate(SearchRequirement requirement, CircuitDesign design)
    {
        ArgumentNullException.ThrowIfNull(requirement);
        var yield = requirement.Yield ?? new YieldRequirement(1);
        var model = CircuitFigureModel.For(design);
        var bands = Bands(requirement, model);
        if (yield.Method == YieldMethod.MonteCarlo)
        {
            var result = MonteCarlo.Analyse(model, yield.Samples, Seed, bands, requirement.Temperature);
            var fraction = result.Yield?.Fraction ?? 1;
            return new YieldResult(fraction, Say($"Monte Carlo over {yield.Samples} boards: {fraction:P1} inside every band."));
        }

        var extremes = WorstCase.Analyse(model, requirement.Temperature).Figures.ToDictionary(f => f.Figure);
        var outside = bands.Where(b => !Inside(extremes[b.Name], b)).Select(b => b.Name).ToList();
        return outside.Count == 0
            ? new YieldResult(1, "Extreme-value analysis: every band holds with all parts at their limits.")
            : new YieldResult(0, "Extreme-value analysis: with parts at their limits these leave their bands: " + string.Join(", ", outside) + ".",
                outside);
    }

    private static bool Inside(FigureExtremes extremes, FigureBand band) =>
        extremes is { Min: { } min, Max: { } max, UndefinedCorners: 0 }
        && (band.Min is not { } low || min >= low)
        && (band.Max is not { } high || max <= high);

    /// <summary>The requirement's bands on the figure model's figures.</summary>
    public static IReadOnlyList<FigureBand> Bands(SearchRequirement requirement, IFigureModel model)
    {
        ArgumentNullException.ThrowIfNull(requirement);
        ArgumentNullException.ThrowIfNull(model);
        var bands = new List<FigureBand> { new(FigureNames.Frequency, requirement.Frequency.Min, requirement.Frequency.Max) };
        if (requirement.TrianglePeakToPeak is { } amplitude)
            bands.Add(new FigureBand(FigureNames.TrianglePeakToPeak, amplitude.Min, amplitude.Max));
        if (requirement.Output is { } output)
        {
            bands.Add(new FigureBand(FigureNames.OutputHigh, output.MinHighV, null));
            bands.Add(new FigureBand(FigureNames.OutputLow, null, output.MaxLowV));
        }

        // Which end of the adjustment gives the higher duty is a property of the topology, read at nominal.
        Span<double> nominal = stackalloc double[model.Figures.Count];
        model.Evaluate(model.Parameters.Select(p => p.Nominal).ToArray(), nominal);
        var names = model.Figures.Select(f => f.Name).ToList();
        var atZero = nominal[names.IndexOf(FigureNames.DutyAtSettingMin)];
        var atOne = nominal[names.IndexOf(FigureNames.DutyAtSettingMax)];
        var (high, low) = atZero >= atOne
            ? (FigureNames.DutyAtSettingMin, FigureNames.DutyAtSettingMax)
            : (FigureNames.DutyAtSettingMax, FigureNames.DutyAtSettingMin);
        bands.Add(new FigureBand(high, requirement.Duty.Max, null));
        bands.Add(new FigureBand(low, null, requirement.Duty.Min));
        return bands;
    }

    private static string Say(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
