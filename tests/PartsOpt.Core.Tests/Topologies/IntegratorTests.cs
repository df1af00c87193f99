using MathNet.Numerics.OdeSolvers;
using PartsOpt.Topologies;

namespace PartsOpt.Tests.Topologies;

public class IntegratorTests
{
    [Theory]
    [InlineData(100e3)]
    [InlineData(10e3)]
    [InlineData(3.3e3)]
    public void Lossy_amplitude_is_2_Rf_over_Ri_Vs_tanh_T_over_4RfCi(double rf)
    {
        const double ri = 10e3, ci = 100e-9;
        var e = CircuitAnalysis.Analyse(TestCircuits.ThreeStage(ri: ri, ci: ci, rf: rf));
        var period = 1 / e.Value(FigureNames.Frequency);

        // REFERENCE.md (derived, checked by simulation): Vpp = 2·(Rf/Ri)·Vs·tanh(T/(4·Rf·Ci)) for a ±Vs square.
        var expected = 2 * (rf / ri) * 12 * Math.Tanh(period / (4 * rf * ci));
        Precision.AlmostEqualRelative(expected, e.Value(FigureNames.TrianglePeakToPeak), 1e-12, "peak-to-peak");
        Precision.AlmostEqualAbsolute(0, e.Value(FigureNames.TriangleCentre), 1e-9, "symmetric square: centred");
    }

    [Fact]
    public void Without_shunt_losses_the_amplitude_tends_to_Vs_over_2fRiCi()
    {
        const double ri = 10e3, ci = 1e-6;
        var e = CircuitAnalysis.Analyse(TestCircuits.ThreeStage(ri: ri, ci: ci, rf: 1e13));
        var f = e.Value(FigureNames.Frequency);

        // REFERENCE.md: ideal integrator Vpp = Vs/(2·f·Ri·Ci); the lossy form meets it as Rf → ∞.
        Precision.AlmostEqualRelative(12 / (2 * f * ri * ci), e.Value(FigureNames.TrianglePeakToPeak), 1e-9);
        Assert.True(e.Value(FigureNames.LinearityError) < 1e-5);
    }

    [Fact]
    public void Dc_gain_and_corner_of_the_shunted_integrator()
    {
        var e = CircuitAnalysis.Analyse(TestCircuits.ThreeStage(ri: 10e3, ci: 47e-9, rf: 220e3));

        // Sedra & Smith (from memory): −(Rf/Ri)/(1 + s·Rf·Ci): DC gain −Rf/Ri, corner 1/(2π·Rf·Ci).
        Precision.AlmostEqualRelative(-22, e.IntegratorDcGain!.Value, 1e-12);
        Precision.AlmostEqualRelative(1 / (2 * Math.PI * 220e3 * 47e-9), e.IntegratorCornerHz!.Value, 1e-12);
        Assert.Null(CircuitAnalysis.Analyse(TestCircuits.Loop()).IntegratorDcGain);
    }

    [Fact]
    public void Unequal_square_matches_a_time_step_simulation_and_shifts_by_minus_Rf_over_Ri_Vdc()
    {
        const double ri = 10e3, ci = 100e-9, rf = 10e3;
        var amp = TestCircuits.Ideal(headroomHigh: 1, headroomLow: 4);
        var e = CircuitAnalysis.Analyse(TestCircuits.ThreeStage(ri: ri, ci: ci, rf: rf, r2: 6.8e3, amp: amp));
        double high = e.Value(FigureNames.HighTime), low = e.Value(FigureNames.LowTime), lp = 11, lm = -8;

        // Independent path: MathNet's fourth-order Runge–Kutta on Ci·dv/dt = −vin/Ri − v/Rf, run to steady state.
        var (max, min, mean) = SimulateIntegrator(lp, lm, high, low, ri, ci, rf);
        Precision.AlmostEqualRelative(max - min, e.Value(FigureNames.TrianglePeakToPeak), 1e-6, "peak-to-peak");
        Precision.AlmostEqualRelative((max + min) / 2, e.Value(FigureNames.TriangleCentre), 1e-5, "centre");

        // REFERENCE.md: a DC component of the square shifts the output by −(Rf/Ri)·Vdc (the mean output).
        var vdc = (lp * high + lm * low) / (high + low);
        Precision.AlmostEqualRelative(-(rf / ri) * vdc, mean, 1e-4, "mean output");
    }

    [Fact]
    public void Linearity_error_is_the_largest_gap_to_the_chord_by_sampling()
    {
        const double ri = 10e3, ci = 100e-9, rf = 10e3;
        var e = CircuitAnalysis.Analyse(TestCircuits.ThreeStage(ri: ri, ci: ci, rf: rf));
        var half = 1 / (2 * e.Value(FigureNames.Frequency));
        var vpp = e.Value(FigureNames.TrianglePeakToPeak);

        // Independent path: sample the falling half v(t) = A + (v0 − A)·e^(−t/τ) (first principles) densely.
        double tau = rf * ci, target = -(rf / ri) * 12, v0 = vpp / 2;
        var v1 = target + (v0 - target) * Math.Exp(-half / tau);
        var worst = 0.0;
        const int steps = 200_000;
        for (var i = 0; i <= steps; i++)
        {
            var t = half * i / steps;
            var v = target + (v0 - target) * Math.Exp(-t / tau);
            var chord = v0 + (v1 - v0) * t / half;
            worst = Math.Max(worst, Math.Abs(v - chord));
        }

        Precision.AlmostEqualRelative(100 * worst / vpp, e.Value(FigureNames.LinearityError), 1e-6, "linearity error %");
    }

    [Fact]
    public void Rc_ramp_linearity_error_by_sampling_the_capacitor()
    {
        const double r = 10e3, c = 100e-9;
        var e = CircuitAnalysis.Analyse(TestCircuits.RcRamp(r: r, c: c, r1: 10e3, r2: 22e3));

        // Sedra & Smith's capacitor: from −βL towards +L, reaching +βL after RC·ln((1+β)/(1−β)); sampled densely.
        double beta = 22.0 / 32, l = 12, tau = r * c, half = tau * Math.Log((1 + beta) / (1 - beta));
        double v0 = -beta * l, v1 = beta * l, worst = 0;
        const int steps = 200_000;
        for (var i = 0; i <= steps; i++)
        {
            var t = half * i / steps;
            var v = l + (v0 - l) * Math.Exp(-t / tau);
            worst = Math.Max(worst, Math.Abs(v - (v0 + (v1 - v0) * t / half)));
        }

        Precision.AlmostEqualRelative(100 * worst / (v1 - v0), e.Value(FigureNames.LinearityError), 1e-6, "linearity error %");
    }

    [Fact]
    public void Three_stage_duty_on_the_lossy_ramp_matches_a_time_step_simulation()
    {
        const double ri = 10e3, ci = 100e-9, rf = 6.8e3;
        var amp = TestCircuits.Ideal(headroomHigh: 0.5, headroomLow: 3);
        var roles = new Dictionary<string, RolePart>();
        var design = TestCircuits.ThreeStage(ri: ri, ci: ci, rf: rf, amp: amp, extra: roles) with
        {
            DutyControl = DutyControl.ControlVoltage(-6, 4),
        };
        var e = CircuitAnalysis.Analyse(design, 9);
        double high = e.Value(FigureNames.HighTime), low = e.Value(FigureNames.LowTime);

        foreach (var point in e.DutyCurve)
        {
            // Independent path: MathNet's RK4 on the integrator (as above), time above the threshold counted step by step.
            var duty = SimulatedDuty(11.5, -9, high, low, ri, ci, rf, point.ThresholdV);
            Precision.AlmostEqualAbsolute(duty, point.Duty!.Value, 1e-4, $"duty at {point.ThresholdV} V");
        }
    }

    /// <summary>
    /// Independent path: the lossy integrator Ci·dv/dt = −vin/Ri − v/Rf driven by the square (lp for
    /// <paramref name="high"/> s, lm for <paramref name="low"/> s), stepped from 0 V by MathNet's fourth-order
    /// Runge–Kutta (a general-purpose reference library) for <paramref name="periods"/> periods, so that it
    /// settles; returns the samples of the last period's high and low parts.
    /// </summary>
    private static (double[] High, double[] Low) LastPeriod(double lp, double lm, double high, double low,
        double ri, double ci, double rf, int periods, int stepsPerPart)
    {
        double v = 0;
        double[] highPart = [], lowPart = [];
        for (var p = 0; p < periods; p++)
        {
            highPart = RungeKutta.FourthOrder(v, 0, high, stepsPerPart + 1, (_, x) => (-lp / ri - x / rf) / ci);
            lowPart = RungeKutta.FourthOrder(highPart[^1], 0, low, stepsPerPart + 1, (_, x) => (-lm / ri - x / rf) / ci);
            v = lowPart[^1];
        }

        return (highPart, lowPart);
    }

    private static double SimulatedDuty(double lp, double lm, double high, double low, double ri, double ci, double rf,
        double threshold)
    {
        const int steps = 20_000;
        var (highPart, lowPart) = LastPeriod(lp, lm, high, low, ri, ci, rf, periods: 30, steps);
        // Time above the threshold, step by step (the midpoint of each step decides).
        double Above(double[] part, double length) =>
            Enumerable.Range(0, steps).Count(i => (part[i] + part[i + 1]) / 2 > threshold) * (length / steps);
        return (Above(highPart, high) + Above(lowPart, low)) / (high + low);
    }

    private static (double Max, double Min, double Mean) SimulateIntegrator(double lp, double lm, double high, double low,
        double ri, double ci, double rf)
    {
        const int steps = 10_000;
        var (highPart, lowPart) = LastPeriod(lp, lm, high, low, ri, ci, rf, periods: 40, steps);
        // The mean by the trapezoid rule over the period.
        double Area(double[] part, double length) =>
            Enumerable.Range(0, steps).Sum(i => (part[i] + part[i + 1]) / 2) * (length / steps);
        var all = highPart.Concat(lowPart).ToArray();
        return (all.Max(), all.Min(), (Area(highPart, high) + Area(lowPart, low)) / (high + low));
    }
}
