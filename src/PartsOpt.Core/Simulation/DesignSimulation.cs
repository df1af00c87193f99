using PartsOpt.Topologies;

namespace PartsOpt.Simulation;

/// <summary>
/// Turns a circuit design into the simulator's plain numbers, so the time-domain run and the closed forms
/// describe the same circuit, and compares what each of them finds.
/// </summary>
public static class DesignSimulation
{
    /// <summary>
    /// The circuit the simulator runs for <paramref name="design"/> with the comparator threshold at
    /// <paramref name="thresholdV"/>. The single-supply reference is the unloaded divider voltage (the closed
    /// forms take it as stiff too); an open-drain comparator's output rises to V+ through its pull-up.
    /// </summary>
    public static SimulatedCircuit FromDesign(CircuitDesign design, double thresholdV)
    {
        ArgumentNullException.ThrowIfNull(design);
        design.Validate();
        var roles = design.Roles;
        double Value(string role) => roles.TryGetValue(role, out var part) ? part.Value : 0;

        var amplifier = Section(design.Amplifier, openDrain: false);
        var reference = design.Supply.IsSingle
            ? design.Supply.PositiveV * Value(Roles.RefRbottom) / (Value(Roles.RefRtop) + Value(Roles.RefRbottom))
            : 0;
        return new SimulatedCircuit
        {
            Topology = design.Topology switch
            {
                TopologyKind.ThreeStage => SimulatedTopology.ThreeStage,
                TopologyKind.Loop => SimulatedTopology.Loop,
                _ => SimulatedTopology.RcRamp,
            },
            SupplyPositive = design.Supply.PositiveV,
            SupplyNegative = design.Supply.NegativeV,
            Reference = reference,
            Oscillator = amplifier,
            Integrator = amplifier,
            Comparator = Section(design.ComparatorPart, design.ComparatorPart.IsOpenDrain),
            OscR = Value(Roles.OscR),
            OscC = Value(Roles.OscC),
            OscR1 = Value(Roles.OscR1),
            OscR2 = Value(Roles.OscR2),
            IntR = Value(Roles.IntR),
            IntC = Value(Roles.IntC),
            IntRf = roles.ContainsKey(Roles.IntRf) ? Value(Roles.IntRf) : double.PositiveInfinity,
            SchR1 = Value(Roles.SchR1),
            SchR2 = Value(Roles.SchR2),
            Threshold = thresholdV,
        };
    }

    /// <summary>
    /// How many periods a run must settle before it measures: the slowest time constant the design has
    /// (the integrator's shunt, Rf·Ci, which sets how fast its DC level finds its place) taken ten times, so
    /// the start-up offset has decayed to e^-10 (5·10^-5) of itself, and never fewer than
    /// <paramref name="minimum"/> periods. Five time constants leave up to 0.7 %, which shows in the centre
    /// and the duty.
    /// </summary>
    public static int SettlePeriods(CircuitDesign design, CircuitEvaluation evaluation, int minimum = 5, int maximum = 4000)
    {
        ArgumentNullException.ThrowIfNull(design);
        ArgumentNullException.ThrowIfNull(evaluation);
        if (evaluation.Figure(FigureNames.Frequency) is not { } frequency || frequency <= 0)
            return minimum;
        var tau = design.Roles.TryGetValue(Roles.IntRf, out var rf) && design.Roles.TryGetValue(Roles.IntC, out var ci)
            ? rf.Value * ci.Value
            : 0;
        return (int)Math.Clamp(Math.Ceiling(10 * tau * frequency), minimum, maximum);
    }

    /// <summary>The comparator threshold the closed forms use at a setting 0…1 (linear in the setting).</summary>
    public static double ThresholdAt(CircuitEvaluation evaluation, double setting)
    {
        ArgumentNullException.ThrowIfNull(evaluation);
        ArgumentOutOfRangeException.ThrowIfLessThan(setting, 0);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(setting, 1);
        var low = evaluation.DutyCurve[0].ThresholdV;
        var high = evaluation.DutyCurve[^1].ThresholdV;
        return low + setting * (high - low);
    }

    /// <summary>
    /// Side-by-side figures of the closed forms and the simulation, with their difference in percent of the
    /// closed-form value (absolute difference × 100 for the duty cycle, a fraction).
    /// </summary>
    public static IReadOnlyList<FigureAgreement> Compare(CircuitEvaluation evaluation, double setting, SteadyStateFigures measured)
    {
        ArgumentNullException.ThrowIfNull(evaluation);
        ArgumentNullException.ThrowIfNull(measured);
        var dutyClosed = ClosedFormDutyAt(evaluation, setting);
        return
        [
            Relative(FigureNames.Frequency, evaluation.Figure(FigureNames.Frequency), measured.Frequency, "Hz"),
            Relative(FigureNames.HighTime, evaluation.Figure(FigureNames.HighTime), measured.HighTime, "s"),
            Relative(FigureNames.LowTime, evaluation.Figure(FigureNames.LowTime), measured.LowTime, "s"),
            Relative(FigureNames.TrianglePeakToPeak, evaluation.Figure(FigureNames.TrianglePeakToPeak), measured.TrianglePeakToPeak, "V"),
            Absolute(FigureNames.TriangleCentre, evaluation.Figure(FigureNames.TriangleCentre), measured.TriangleCentre, "V"),
            Absolute("duty", dutyClosed, measured.DutyCycle, "1"),
        ];
    }

    /// <summary>The closed-form duty at a setting, interpolated on the evaluation's duty curve.</summary>
    public static double? ClosedFormDutyAt(CircuitEvaluation evaluation, double setting)
    {
        ArgumentNullException.ThrowIfNull(evaluation);
        var curve = evaluation.DutyCurve;
        for (var i = 1; i < curve.Count; i++)
        {
            if (setting > curve[i].Setting && i < curve.Count - 1)
                continue;
            var (a, b) = (curve[i - 1], curve[i]);
            if (a.Duty is not { } da || b.Duty is not { } db)
                return null;
            var t = b.Setting == a.Setting ? 0 : (setting - a.Setting) / (b.Setting - a.Setting);
            return da + t * (db - da);
        }

        return curve.Count == 1 ? curve[0].Duty : null;
    }

    private static OpAmpSection Section(OpAmpSpec part, bool openDrain) =>
        new(openDrain ? 0 : part.OutputHeadroomHighV, part.OutputHeadroomLowV, part.SlewRateVPerS);

    private static FigureAgreement Relative(string name, double? closedForm, double simulated, string unit) =>
        new(name, unit, closedForm, simulated,
            closedForm is { } c && c != 0 ? 100 * (simulated - c) / Math.Abs(c) : null, "percent of the closed-form value");

    private static FigureAgreement Absolute(string name, double? closedForm, double simulated, string unit) =>
        new(name, unit, closedForm, simulated,
            closedForm is { } c ? 100 * (simulated - c) / (unit == "V" ? Math.Max(Math.Abs(c), 1) : 1) : null,
            unit == "V" ? "percent of the closed-form value (of 1 V near 0 V)" : "percentage points");
}

/// <summary>One figure as the closed forms and the simulation give it.</summary>
/// <param name="Figure">Figure name.</param>
/// <param name="Unit">SI unit.</param>
/// <param name="ClosedForm">The closed-form value; null where the figure does not exist.</param>
/// <param name="Simulated">The value measured on the simulated waveforms.</param>
/// <param name="Difference">Simulated minus closed form, in the unit <paramref name="DifferenceBasis"/> names.</param>
/// <param name="DifferenceBasis">How <paramref name="Difference"/> is expressed.</param>
public sealed record FigureAgreement(string Figure, string Unit, double? ClosedForm, double Simulated, double? Difference,
    string DifferenceBasis);
