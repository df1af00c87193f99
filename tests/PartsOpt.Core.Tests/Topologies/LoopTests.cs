using PartsOpt.Topologies;

namespace PartsOpt.Tests.Topologies;

public class LoopTests
{
    [Fact]
    public void Textbook_loop_runs_at_five_kilohertz_with_six_volt_peaks()
    {
        var e = CircuitAnalysis.Analyse(TestCircuits.Loop(r1: 10e3, r2: 20e3, ri: 10e3, ci: 10e-9));

        // Sedra & Smith, general scheme for triangular and square waveforms: f = R2/(4·R1·Ri·Ci),
        // peak = ±L·R1/R2; ±12 V, 10 kΩ, 20 kΩ, 10 kΩ, 10 nF → 5.000 kHz, ±6 V (REFERENCE.md).
        Precision.AlmostEqualRelative(5000, e.Value(FigureNames.Frequency), 1e-9, "frequency");
        Precision.AlmostEqualRelative(12, e.Value(FigureNames.TrianglePeakToPeak), 1e-9, "peak-to-peak");
        Precision.AlmostEqualAbsolute(0, e.Value(FigureNames.TriangleCentre), 1e-9, "centre");
        Assert.Equal(0, e.Value(FigureNames.LinearityError));
    }

    [Fact]
    public void Unequal_levels_ramp_between_thresholds_set_by_each_level()
    {
        const double r1 = 10e3, r2 = 22e3, ri = 15e3, ci = 4.7e-9;
        var amp = TestCircuits.Ideal(headroomHigh: 1, headroomLow: 3.5);
        var e = CircuitAnalysis.Analyse(TestCircuits.Loop(r1, r2, ri, ci, amp));

        // Derived from first principles: the Schmitt's non-inverting node (vtri·R2 + vout·R1)/(R1+R2) crosses
        // the reference at vtri = −vout·R1/R2; the integrator ramps at −vout/(Ri·Ci) between −kL+ and −kL−.
        double lp = 11, lm = -8.5, k = r1 / r2, tau = ri * ci;
        var tFall = k * (lp - lm) * tau / lp;
        var tRise = k * (lp - lm) * tau / -lm;
        Precision.AlmostEqualRelative(tFall, e.Value(FigureNames.HighTime), 1e-9, "Schmitt high: triangle falls");
        Precision.AlmostEqualRelative(tRise, e.Value(FigureNames.LowTime), 1e-9, "Schmitt low: triangle rises");
        Precision.AlmostEqualRelative(k * (lp - lm), e.Value(FigureNames.TrianglePeakToPeak), 1e-9);
        Precision.AlmostEqualRelative(-k * (lp + lm) / 2, e.Value(FigureNames.TriangleCentre), 1e-9);
    }

    [Fact]
    public void Slewing_Schmitt_adds_one_edge_time_per_edge_and_overshoots_the_thresholds()
    {
        const double slew = 1e6;
        var ideal = CircuitAnalysis.Analyse(TestCircuits.Loop());
        var slow = CircuitAnalysis.Analyse(TestCircuits.Loop(amp: TestCircuits.Ideal(slewRate: slew)));

        // REFERENCE.md (common practice): each edge adds (L+ − L−)/SR; with symmetric levels the integral of the
        // slewing input is zero, so the addition is exact. While the input slews from L to 0 the triangle runs on
        // by L²/(2·SR·Ri·Ci) (integral of a linear ramp, first principles).
        var added = 1 / slow.Value(FigureNames.Frequency) - 1 / ideal.Value(FigureNames.Frequency);
        Precision.AlmostEqualRelative(2 * 24 / slew, added, 1e-9, "period lengthening");
        var overshoot = 12.0 * 12 / (2 * slew * 10e3 * 10e-9);
        Precision.AlmostEqualRelative(12 + 2 * overshoot, slow.Value(FigureNames.TrianglePeakToPeak), 1e-9);
    }

    [Fact]
    public void R1_not_below_R2_cannot_switch_and_is_a_failed_check_not_an_exception()
    {
        var e = CircuitAnalysis.Analyse(TestCircuits.Loop(r1: 22e3, r2: 20e3));

        var check = e.Check("oscillator can switch");
        Assert.False(check.Passed);
        Assert.True(check.Margin < 0);
        Assert.False(e.Works);
        Assert.Null(e.Figure(FigureNames.Frequency));
        Assert.All(e.DutyCurve, p => Assert.Null(p.Duty));
    }

    [Fact]
    public void Edges_that_outlast_the_ramps_leave_no_period()
    {
        // Levels +11.5/−2 V, thresholds −1.15/+0.2 V (r1/r2 = 0.1) and a 20 V/ms slew: each edge (0.675 ms)
        // shifts the restart by −t_e·(L+ + L−)/(2·Ri·Ci) ≈ −3.2 V, past the 1.35 V between the thresholds.
        var amp = TestCircuits.Ideal(slewRate: 2e4, headroomHigh: 0.5, headroomLow: 10);
        var e = CircuitAnalysis.Analyse(TestCircuits.Loop(r1: 2e3, r2: 20e3, ri: 10e3, ci: 100e-9, amp: amp));

        Assert.False(e.Check("oscillator can switch").Passed);
        Assert.Null(e.Figure(FigureNames.Frequency));
    }

    [Fact]
    public void Triangle_duty_is_linear_in_the_threshold_and_clamped()
    {
        var e = CircuitAnalysis.Analyse(TestCircuits.Loop(duty: DutyControl.ControlVoltage(-8, 8)), dutyCurvePoints: 17);

        // REFERENCE.md, comparator and duty: D = (Vp − Vth)/(2·Vp), clamped to [0, 1]; here Vp = 6 V.
        foreach (var point in e.DutyCurve)
        {
            var expected = Math.Clamp((6 - point.ThresholdV) / 12, 0, 1);
            Precision.AlmostEqualAbsolute(expected, point.Duty!.Value, 1e-12, $"duty at {point.ThresholdV} V");
        }

        Assert.Equal(1, e.Value(FigureNames.DutyAtSettingMin));
        Assert.Equal(0, e.Value(FigureNames.DutyAtSettingMax));
    }
}
