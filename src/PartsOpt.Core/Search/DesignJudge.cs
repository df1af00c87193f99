using System.Globalization;
using PartsOpt.Topologies;

namespace PartsOpt.Search;

/// <summary>
/// Judges a design against a requirement with the exact closed-form engine: nominal figures (nominal part
/// values, the op-amp's real swing) inside the bands, duty reachable at both ends of the adjustment, every
/// failure-severity check passed. The search and its exhaustive reference use this one judge.
/// </summary>
public static class DesignJudge
{
    /// <summary>Analyses <paramref name="design"/> and judges it against <paramref name="requirement"/>.</summary>
    /// <exception cref="DesignValidationException">The engine cannot analyse the design at all.</exception>
    public static DesignJudgement Judge(SearchRequirement requirement, CircuitDesign design)
    {
        ArgumentNullException.ThrowIfNull(requirement);
        var evaluation = CircuitAnalysis.Analyse(design, dutyCurvePoints: 2, explain: false);
        var missed = new List<MissedTarget>();
        var reasons = new List<string>();
        var margins = new List<double>();
        var shortfall = 0.0;
        void Short(double excess) => shortfall += double.IsFinite(excess) ? Math.Max(0, excess) : 1;

        var frequency = evaluation.Figure(FigureNames.Frequency);
        var target = requirement.Frequency;
        var frequencyError = frequency is { } f && double.IsFinite(f)
            ? Math.Abs(f - target.Target) / target.Target
            : double.PositiveInfinity;
        margins.Add(target.Tolerance - frequencyError);
        Short(frequencyError - target.Tolerance);
        if (!(frequencyError <= target.Tolerance))
        {
            missed.Add(MissedTarget.Frequency);
            reasons.Add(frequency is { } hz && double.IsFinite(hz)
                ? Say($"frequency {hz:G5} Hz is {frequencyError:P2} from {target.Target:G5} Hz (band ±{target.Tolerance:P1})")
                : "the oscillator does not oscillate");
        }

        if (requirement.TrianglePeakToPeak is { } band)
        {
            var vpp = evaluation.Figure(FigureNames.TrianglePeakToPeak);
            var error = vpp is { } v && double.IsFinite(v) ? Math.Abs(v - band.Target) / band.Target : double.PositiveInfinity;
            margins.Add(band.Tolerance - error);
            Short(error - band.Tolerance);
            if (!(error <= band.Tolerance))
            {
                missed.Add(MissedTarget.TriangleAmplitude);
                reasons.Add(Say($"ramp peak-to-peak {vpp:G4} V is {error:P1} from {band.Target:G4} V (band ±{band.Tolerance:P1})"));
            }
        }

        if (requirement.Output is { } output)
        {
            var high = evaluation.Figure(FigureNames.OutputHigh) ?? double.NaN;
            var low = evaluation.Figure(FigureNames.OutputLow) ?? double.NaN;
            var scale = Math.Max(requirement.Supply.SpanV, 1e-9);
            margins.Add(Math.Min(high - output.MinHighV, output.MaxLowV - low) / scale);
            Short((output.MinHighV - high) / scale);
            Short((low - output.MaxLowV) / scale);
            if (!(high >= output.MinHighV && low <= output.MaxLowV))
            {
                missed.Add(MissedTarget.OutputLevels);
                reasons.Add(Say($"output swings {low:G4} … {high:G4} V, needs ≤ {output.MaxLowV:G4} V low and ≥ {output.MinHighV:G4} V high"));
            }
        }

        var duty0 = evaluation.Figure(FigureNames.DutyAtSettingMin) ?? double.NaN;
        var duty1 = evaluation.Figure(FigureNames.DutyAtSettingMax) ?? double.NaN;
        var lowest = Math.Min(duty0, duty1);
        var highest = Math.Max(duty0, duty1);
        var duty = requirement.Duty;
        margins.Add(Math.Min(duty.Min - lowest, highest - duty.Max));
        Short(lowest - duty.Min);
        Short(duty.Max - highest);
        if (!(lowest <= duty.Min && highest >= duty.Max))
        {
            missed.Add(MissedTarget.DutyRange);
            reasons.Add(double.IsNaN(lowest)
                ? "the comparator sees no ramp, so the duty cannot be set"
                : Say($"the adjustment reaches duty {lowest:P1} … {highest:P1}, needs {duty.Min:P1} … {duty.Max:P1}"));
        }

        var failedChecks = new List<string>();
        foreach (var check in evaluation.Checks.Where(c => !c.Passed && c.Severity == CheckSeverity.Failure))
        {
            failedChecks.Add(check.Name);
            missed.Add(MissedTarget.Check);
            reasons.Add($"{check.Name}: {check.Reason}");
            shortfall += 1;
        }

        return new DesignJudgement(evaluation, missed, reasons, frequencyError, margins.Min(), failedChecks, shortfall)
        {
            MissesLowDuty = !(lowest <= duty.Min),
            MissesHighDuty = !(highest >= duty.Max),
        };
    }

    private static string Say(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
