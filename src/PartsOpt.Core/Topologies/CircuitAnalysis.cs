using System.Globalization;

namespace PartsOpt.Topologies;

/// <summary>The closed-form analysis of a PWM generator design with real op-amp limits.</summary>
public static class CircuitAnalysis
{
    /// <summary>
    /// Validates <paramref name="design"/> and computes its figures, duty curve, designators, notes and checks.
    /// A design that cannot oscillate is not an error: its frequency-dependent figures are null and the
    /// "oscillator can switch" check fails.
    /// </summary>
    /// <param name="design">The design to analyse.</param>
    /// <param name="dutyCurvePoints">Points of the duty-versus-setting curve, 2…1001 (default 21).</param>
    /// <exception cref="DesignValidationException">The design cannot be analysed (missing role, bad value…).</exception>
    public static CircuitEvaluation Analyse(CircuitDesign design, int dutyCurvePoints = 21) => Analyse(design, dutyCurvePoints, explain: true);

    /// <summary>
    /// As <see cref="Analyse(CircuitDesign, int)"/>; without <paramref name="explain"/> the notes and reference
    /// designators are left empty and only the checks that fail or warn get reasons (the design search judges
    /// hundreds of thousands of designs and reads only their figures and the reasons they miss).
    /// </summary>
    internal static CircuitEvaluation Analyse(CircuitDesign design, int dutyCurvePoints, bool explain)
    {
        ArgumentNullException.ThrowIfNull(design);
        design.Validate();
        if (dutyCurvePoints is < 2 or > 1001)
            throw new DesignValidationException("dutyCurvePoints", $"The duty curve needs 2…1001 points (got {dutyCurvePoints}).");

        var shape = new CircuitShape(design);
        var values = CircuitValues.From(design);
        Waveform.Compute(in values, shape, out var wave);

        Span<double> raw = stackalloc double[FigureNames.All.Count];
        CircuitFigureModel.Write(in wave, raw);
        var figures = new FigureValue[raw.Length];
        for (var i = 0; i < raw.Length; i++)
            figures[i] = new FigureValue(FigureNames.All[i], double.IsFinite(raw[i]) ? raw[i] : null, FigureNames.Units[i]);

        var curve = new DutyPoint[dutyCurvePoints];
        for (var i = 0; i < dutyCurvePoints; i++)
        {
            var setting = (double)i / (dutyCurvePoints - 1);
            var threshold = wave.ThresholdAt(setting);
            var duty = wave.DutyAt(threshold);
            curve[i] = new DutyPoint(setting, threshold, double.IsFinite(duty) ? duty : null);
        }

        double? dcGain = null, cornerHz = null;
        if (design.Topology == TopologyKind.ThreeStage)
        {
            dcGain = -values.IntRf / values.IntR;
            cornerHz = 1 / (2 * Math.PI * values.IntRf * values.IntC);
        }

        return new CircuitEvaluation(
            design.Topology,
            figures,
            dcGain,
            cornerHz,
            wave.ReferenceV,
            curve,
            explain ? ReferenceDesignators.ForRoles(design.RequiredRoles()) : NoDesignators,
            shape.Sections.Sections,
            explain ? Notes(design, in values, in wave) : [],
            CircuitChecks.All(design, shape, in values, in wave, explain));
    }

    private static readonly IReadOnlyDictionary<string, string> NoDesignators = new Dictionary<string, string>();

    private static List<string> Notes(CircuitDesign design, in CircuitValues v, in Waveform w)
    {
        var notes = new List<string>();
        switch (design.Topology)
        {
            case TopologyKind.RcRamp:
                notes.Add("Duty is not linear in the threshold: the comparator watches the timing capacitor's exponential voltage, so the time above the threshold is computed exactly on each exponential segment.");
                break;
            case TopologyKind.ThreeStage:
                notes.Add(Format($"The integrator's shunt makes it lossy (DC gain {-v.IntRf / v.IntR:G4}, corner {1 / (2 * Math.PI * v.IntRf * v.IntC):G4} Hz): its ramps are exponential segments, and the duty is computed on those segments, not on straight lines."));
                break;
            default:
                notes.Add("The loop's integrator has no shunt: its ramps are straight and the duty is linear in the threshold.");
                break;
        }

        notes.Add("Outputs saturate at the rails minus the part's headroom; each slewing edge of the square-wave generator adds (L+ − L−)/SR to the period (common practice).");
        notes.Add("Supply current is the mean drawn from V+: quiescent current of every section of every package fitted, the threshold and reference dividers, the pull-up while the output is low (middle setting), and the current the op-amp outputs source into their networks. External loads are not included.");
        if (design.ComparatorPart.IsOpenDrain)
            notes.Add("Open-drain comparator: the output rises to V+ through the pull-up at a rate set by the pull-up and the load capacitance, not modelled here; the edge time uses the part's slew rate.");
        if (!design.ComparatorPart.IsComparator && w.Oscillates)
        {
            var differential = Math.Max(w.RampMaxV - w.ThresholdMinV, w.ThresholdMaxV - w.RampMinV);
            notes.Add(Format($"An op-amp works as the comparator: its differential input reaches {differential:G3} V. Check its data sheet for input clamp diodes (they conduct beyond about 0.7 V), phase reversal outside the common-mode range and slow recovery from saturation."));
        }

        if (design.Supply.IsSingle)
        {
            var source = v.RefRtop * v.RefRbottom / (v.RefRtop + v.RefRbottom);
            notes.Add(design.BufferReference
                ? "Single supply: every stage returns to the mid-rail reference, buffered by a spare section."
                : Format($"Single supply: every stage returns to the mid-rail reference, unbuffered; its source resistance is {source:G4} Ω, taken as stiff here. Keep it well below the resistors returned to it."));
        }

        notes.Add("A PWM generator often drives power stages and high-voltage supplies: isolate and fuse them, discharge stored energy before touching, and defer to local codes and licensed practice.");
        return notes;
    }

    private static string Format(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
