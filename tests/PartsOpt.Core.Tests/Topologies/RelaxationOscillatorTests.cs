using PartsOpt.Topologies;

namespace PartsOpt.Tests.Topologies;

public class RelaxationOscillatorTests
{
    [Fact]
    public void Equal_divider_resistors_give_one_over_2RC_ln3()
    {
        var evaluation = CircuitAnalysis.Analyse(TestCircuits.ThreeStage(r: 10e3, c: 100e-9));

        // Sedra & Smith, Microelectronic Circuits, signal generators and waveform-shaping circuits:
        // f = 1/(2RC·ln 3) for β = 1/2; R = 10 kΩ, C = 100 nF → 455.12 Hz (REFERENCE.md).
        Precision.AlmostEqualRelative(455.12, evaluation.Value(FigureNames.Frequency), 1e-5, "frequency");
        Precision.AlmostEqualRelative(1 / (2 * 10e3 * 100e-9 * Math.Log(3)), evaluation.Value(FigureNames.Frequency), 1e-12);
        Precision.AlmostEqualRelative(evaluation.Value(FigureNames.HighTime), evaluation.Value(FigureNames.LowTime), 1e-12,
            "symmetric levels give equal halves");
    }

    [Theory]
    [InlineData(1e3, 9e3)]     // β = 0.9
    [InlineData(10e3, 1e3)]    // β = 1/11
    [InlineData(22e3, 4.7e3)]
    [InlineData(4.7e3, 100e3)]
    public void Period_is_2RC_ln_of_one_plus_beta_over_one_minus_beta(double r1, double r2)
    {
        const double r = 47e3, c = 22e-9;
        var beta = r2 / (r1 + r2);
        var evaluation = CircuitAnalysis.Analyse(TestCircuits.RcRamp(r: r, c: c, r1: r1, r2: r2));

        // Sedra & Smith (as above): T = 2RC·ln((1+β)/(1−β)) for symmetric saturation.
        var expected = 2 * r * c * Math.Log((1 + beta) / (1 - beta));
        Precision.AlmostEqualRelative(expected, 1 / evaluation.Value(FigureNames.Frequency), 1e-12, "period");
        // The capacitor swings between ±β·L (same source): peak-to-peak 2βL, centred on the reference.
        Precision.AlmostEqualRelative(2 * beta * 12, evaluation.Value(FigureNames.TrianglePeakToPeak), 1e-12);
        Precision.AlmostEqualAbsolute(0, evaluation.Value(FigureNames.TriangleCentre), 1e-12);
    }

    [Theory]
    [InlineData(1.0, 3.0)]
    [InlineData(4.0, 0.5)]
    [InlineData(2.5, 2.5)]
    public void Unequal_saturation_follows_the_derived_segment_times(double headroomHigh, double headroomLow)
    {
        const double r = 10e3, c = 100e-9, r1 = 10e3, r2 = 15e3;
        var amp = TestCircuits.Ideal(headroomHigh: headroomHigh, headroomLow: headroomLow);
        var evaluation = CircuitAnalysis.Analyse(TestCircuits.RcRamp(r: r, c: c, r1: r1, r2: r2, amp: amp));

        // REFERENCE.md (derived): the capacitor runs between βL− and βL+;
        // t_high = RC·ln((L+ − βL−)/((1−β)L+)), t_low = RC·ln((L− − βL+)/((1−β)L−)).
        double lp = 12 - headroomHigh, lm = -12 + headroomLow, beta = r2 / (r1 + r2);
        var tHigh = r * c * Math.Log((lp - beta * lm) / ((1 - beta) * lp));
        var tLow = r * c * Math.Log((lm - beta * lp) / ((1 - beta) * lm));
        Precision.AlmostEqualRelative(tHigh, evaluation.Value(FigureNames.HighTime), 1e-12, "t_high");
        Precision.AlmostEqualRelative(tLow, evaluation.Value(FigureNames.LowTime), 1e-12, "t_low");
        // The lower level approaches its threshold more slowly: that half lasts longer.
        if (headroomHigh != headroomLow)
            Assert.Equal(headroomHigh > headroomLow, evaluation.Value(FigureNames.HighTime) > evaluation.Value(FigureNames.LowTime));
    }

    [Fact]
    public void Unequal_times_meet_the_symmetric_formula_when_the_levels_meet()
    {
        // As the headroom difference shrinks, the derived unequal-saturation period tends to
        // Sedra & Smith's 2RC·ln((1+β)/(1−β)) with L = the common level.
        const double r = 10e3, c = 100e-9;
        var beta = 0.4;
        var symmetric = 2 * r * c * Math.Log((1 + beta) / (1 - beta));
        var previousError = double.MaxValue;
        foreach (var skew in new[] { 1.0, 0.1, 0.01, 1e-4 })
        {
            var amp = TestCircuits.Ideal(headroomHigh: 2 + skew, headroomLow: 2 - skew);
            var e = CircuitAnalysis.Analyse(TestCircuits.RcRamp(r: r, c: c, r1: 6e3, r2: 4e3, amp: amp));
            var error = Math.Abs(1 / e.Value(FigureNames.Frequency) - symmetric);
            Assert.True(error < previousError, $"error {error} should shrink with skew {skew}");
            previousError = error;
        }

        Assert.True(previousError / symmetric < 1e-8);
    }

    [Fact]
    public void Short_slewing_edges_add_less_than_the_full_swing_over_the_slew_rate()
    {
        // Derived (RelaxationTiming; checked against the time-domain simulator and MathNet RK4 in
        // ClosedFormAgreementTests): the capacitor keeps charging towards the slewing output, so for short
        // edges each adds t_e·(1 + ((1−β)L − (L+ − L−)/2)/(L(1+β))) = t_e/(1 + β) with symmetric levels ±L,
        // not the t_e of the common-practice rule. β = 1/2: 2/3 of t_e, up to O(t_e/RC).
        const double slew = 24e6; // t_e = 1 µs against RC = 1 ms
        var ideal = CircuitAnalysis.Analyse(TestCircuits.ThreeStage());
        var slow = CircuitAnalysis.Analyse(TestCircuits.ThreeStage(amp: TestCircuits.Ideal(slewRate: slew)));
        var edge = 24 / slew;
        var added = 1 / slow.Value(FigureNames.Frequency) - 1 / ideal.Value(FigureNames.Frequency);
        Precision.AlmostEqualRelative(2 * edge * 2 / 3, added, 2 * edge / 1e-3, "period lengthening");
        Assert.True(Math.Abs(added - 2 * edge) > 0.3 * 2 * edge, "the common-practice rule would not pass");
    }
}
