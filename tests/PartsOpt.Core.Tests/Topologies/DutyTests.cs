using PartsOpt.Topologies;

namespace PartsOpt.Tests.Topologies;

public class DutyTests
{
    [Fact]
    public void Equal_divider_resistors_between_plus_and_minus_ten_volts_sit_at_zero()
    {
        var design = TestCircuits.Loop(supply: 10) with { Roles = WithPot(TestCircuits.Loop(supply: 10), 4.7e3, 10e3, 4.7e3) };
        var e = CircuitAnalysis.Analyse(design, dutyCurvePoints: 3);

        // REFERENCE.md, comparator and duty: two equal resistors sit at the midpoint (0 V between ±10 V).
        Precision.AlmostEqualAbsolute(0, e.DutyCurve[1].ThresholdV, 1e-12, "wiper at the middle");
    }

    [Fact]
    public void Potentiometer_spans_the_divider_formula()
    {
        const double ra = 10e3, pot = 5e3, rb = 2.2e3, sum = ra + pot + rb;
        var design = TestCircuits.Loop(supply: 10) with { Roles = WithPot(TestCircuits.Loop(supply: 10), ra, pot, rb) };
        var e = CircuitAnalysis.Analyse(design, dutyCurvePoints: 5);

        // REFERENCE.md: Vth spans V− + ΔV·Rb/Σ … V− + ΔV·(Rb+P)/Σ, Σ = Ra+P+Rb; setting 0 at the cmp.rb end.
        Precision.AlmostEqualRelative(-10 + 20 * rb / sum, e.DutyCurve[0].ThresholdV, 1e-12, "setting 0");
        Precision.AlmostEqualRelative(-10 + 20 * (rb + pot) / sum, e.DutyCurve[^1].ThresholdV, 1e-12, "setting 1");
        // Duty on the ±5 V triangle (peak L·r1/r2 = 10·10k/20k): D = (Vp − Vth)/(2Vp) clamped, REFERENCE.md.
        // Setting 0 (−7.44 V) lies below the triangle: 100 %.
        Assert.Equal(1, e.Value(FigureNames.DutyAtSettingMin));
        Precision.AlmostEqualRelative((5 - e.DutyCurve[^1].ThresholdV) / 10, e.Value(FigureNames.DutyAtSettingMax), 1e-12);
        Assert.False(e.Check("threshold range inside the ramp").Passed);
        Assert.Equal(CheckSeverity.Warning, e.Check("threshold range inside the ramp").Severity);
        Assert.True(e.Check("duty adjustable").Passed);
    }

    [Theory]
    [InlineData(0.0, 0.0)]
    [InlineData(1.0, 4.0)]
    [InlineData(3.0, 0.5)]
    public void Rc_ramp_duty_matches_a_time_step_simulation_of_the_capacitor(double headroomHigh, double headroomLow)
    {
        const double r = 10e3, c = 100e-9, r1 = 10e3, r2 = 10e3;
        var amp = TestCircuits.Ideal(headroomHigh: headroomHigh, headroomLow: headroomLow);
        var e = CircuitAnalysis.Analyse(TestCircuits.RcRamp(r, c, r1, r2, amp, duty: DutyControl.ControlVoltage(-5, 5)), 11);
        double lp = 12 - headroomHigh, lm = -12 + headroomLow, beta = r2 / (r1 + r2);

        foreach (var point in e.DutyCurve)
        {
            // Independent path: step the capacitor (RC·dv/dt = vout − v) and switch the output at β·L±
            // (Sedra & Smith's relaxation oscillator); count the time v spends above the threshold.
            var simulated = SimulatedDuty(lp, lm, beta, r * c, point.ThresholdV);
            Precision.AlmostEqualAbsolute(simulated, point.Duty!.Value, 2e-5, $"duty at {point.ThresholdV} V");
        }

        Assert.Contains(e.Notes, n => n.Contains("not linear", StringComparison.Ordinal));
    }

    [Fact]
    public void Rc_ramp_duty_is_not_linear_in_the_threshold()
    {
        var e = CircuitAnalysis.Analyse(TestCircuits.RcRamp(duty: DutyControl.ControlVoltage(-6, 6)), 5);
        var duties = e.DutyCurve.Select(p => p.Duty!.Value).ToArray();

        // Equal threshold steps give unequal duty steps on an exponential ramp (first principles).
        var firstStep = duties[0] - duties[1];
        var middleStep = duties[1] - duties[2];
        Assert.True(Math.Abs(firstStep - middleStep) > 0.01, $"steps {firstStep} and {middleStep} should differ");
        Assert.True(duties.Zip(duties.Skip(1)).All(d => d.First > d.Second), "duty falls as the threshold rises");
    }

    private static double SimulatedDuty(double lp, double lm, double beta, double tau, double threshold)
    {
        var dt = tau / 200_000;
        double v = beta * lm, output = lp, above = 0, total = 0;
        var switches = 0;
        while (switches < 6)
        {
            // Exact step of the linear ODE over dt keeps the simulation's error to the switching instants.
            var next = output + (v - output) * Math.Exp(-dt / tau);
            if (switches >= 2)
            {
                total += dt;
                if ((v + next) / 2 > threshold)
                    above += dt;
            }

            v = next;
            if (output > 0 && v >= beta * lp) { output = lm; switches++; }
            else if (output < 0 && v <= beta * lm) { output = lp; switches++; }
        }

        return above / total;
    }

    private static Dictionary<string, RolePart> WithPot(CircuitDesign design, double ra, double pot, double rb)
    {
        var roles = new Dictionary<string, RolePart>(design.Roles)
        {
            [Roles.CmpRa] = TestCircuits.R(ra),
            [Roles.CmpPot] = TestCircuits.R(pot),
            [Roles.CmpRb] = TestCircuits.R(rb),
        };
        return roles;
    }
}
