using PartsOpt.Simulation;
using Build = PartsOpt.Tests.Topologies.TestCircuits;
using PartsOpt.Topologies;

namespace PartsOpt.Tests.Simulation;

/// <summary>
/// The closed forms of the topology engine against the time-domain simulator, on the same designs, with
/// real op-amp limits (unequal saturation headroom, finite slew). The two are independent code paths:
/// the engine solves each waveform segment in closed form, the simulator integrates the circuit between
/// switching events. Where the closed form holds they must agree within 1 % (the acceptance bound the
/// engine is held to).
/// </summary>
public class ClosedFormAgreementTests
{
    // Unequal output headroom (1.2 V to V+, 0.8 V to V−) and 13 V/µs: values of the kind data sheets give,
    // chosen for the test, not a real part.
    private static readonly OpAmpSpec Amp = new(4, 7, 36, 3e6, 13e6, 1.2, 0.8, 1.5, 1.5, 0, 0.02, 1e-3);

    public static TheoryData<string, double> Designs => new()
    {
        { "three-stage", 0.25 }, { "three-stage", 0.5 }, { "three-stage", 0.8 },
        { "loop", 0.25 }, { "loop", 0.5 }, { "loop", 0.8 },
        { "rc-ramp", 0.25 }, { "rc-ramp", 0.5 }, { "rc-ramp", 0.8 },
        { "loop-single-supply", 0.5 },
    };

    [Theory]
    [MemberData(nameof(Designs))]
    public void SimulationAgreesWithTheClosedForms(string name, double setting)
    {
        var design = Design(name);
        var evaluation = CircuitAnalysis.Analyse(design);
        Assert.True(evaluation.Works, string.Join("; ", evaluation.Checks.Where(c => !c.Passed).Select(c => c.Reason)));

        var circuit = DesignSimulation.FromDesign(design, DesignSimulation.ThresholdAt(evaluation, setting));
        var run = TransientSimulator.Run(circuit, new SimulationOptions
        {
            SettlePeriods = DesignSimulation.SettlePeriods(design, evaluation),
            MeasurePeriods = 4,
            StepsPerPeriod = 400,
        });
        Assert.Equal(SimulationOutcome.Measured, run.Outcome);
        var measured = run.Figures!;

        // Acceptance bound: 1 % of the closed-form value for frequency and amplitude.
        Precision.AlmostEqualRelative(evaluation.Figure(FigureNames.Frequency)!.Value, measured.Frequency, 0.01, "frequency");
        Precision.AlmostEqualRelative(evaluation.Figure(FigureNames.TrianglePeakToPeak)!.Value, measured.TrianglePeakToPeak, 0.01, "peak-to-peak");
        // The centre may sit at 0 V: 1 % of the peak-to-peak instead.
        Precision.AlmostEqualAbsolute(evaluation.Figure(FigureNames.TriangleCentre)!.Value, measured.TriangleCentre,
            0.01 * evaluation.Figure(FigureNames.TrianglePeakToPeak)!.Value, "centre");
        // Duty is a fraction: one percentage point.
        Precision.AlmostEqualAbsolute(DesignSimulation.ClosedFormDutyAt(evaluation, setting)!.Value, measured.DutyCycle, 0.01, "duty");

        var agreement = DesignSimulation.Compare(evaluation, setting, measured);
        Assert.All(agreement.Where(a => a.Figure == FigureNames.Frequency), a => Assert.InRange(Math.Abs(a.Difference!.Value), 0, 1));
    }

    [Fact]
    public void AnOscillatorThatCannotSwitchIsReportedByBoth()
    {
        // Loop with r1 > r2: the triangle would have to exceed the Schmitt's own swing to trip it
        // (peak = L·r1/r2 > L; Sedra & Smith, general scheme for triangular and square waveforms).
        var design = Build.Loop(r1: 30e3, r2: 20e3, amp: Amp);
        var evaluation = CircuitAnalysis.Analyse(design);
        Assert.False(evaluation.Works);
        var run = TransientSimulator.Run(DesignSimulation.FromDesign(design, 0), new SimulationOptions());
        Assert.Equal(SimulationOutcome.DoesNotOscillate, run.Outcome);
    }

    private static CircuitDesign Design(string name) => name switch
    {
        // 455 Hz oscillator (Sedra & Smith's 10 kΩ / 100 nF with equal dividers), integrator 100 kΩ / 100 nF
        // so the triangle (about 1.2 V peak to peak) stays well inside the swing, 1 MΩ shunt.
        "three-stage" => Build.ThreeStage(ri: 100e3, ci: 100e-9, rf: 1e6, amp: Amp),
        "loop" => Build.Loop(amp: Amp),
        "rc-ramp" => Build.RcRamp(r1: 20e3, r2: 10e3, amp: Amp),
        "loop-single-supply" => SingleSupplyLoop(),
        _ => throw new ArgumentOutOfRangeException(nameof(name)),
    };

    private static CircuitDesign SingleSupplyLoop()
    {
        var loop = Build.Loop(amp: Amp);
        var roles = new Dictionary<string, RolePart>(loop.Roles)
        {
            [Roles.RefRtop] = Build.R(10e3),
            [Roles.RefRbottom] = Build.R(10e3),
            [Roles.RefC] = Build.C(10e-6, 0.1, PartsOpt.Values.Dielectric.X7R),
        };
        return loop with { Supply = Supply.SingleRail(24), Roles = roles, BufferReference = true };
    }
}
