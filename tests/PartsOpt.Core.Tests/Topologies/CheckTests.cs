using PartsOpt.Topologies;
using PartsOpt.Values;

namespace PartsOpt.Tests.Topologies;

public class CheckTests
{
    [Fact]
    public void A_sound_design_passes_every_failure_check()
    {
        var e = CircuitAnalysis.Analyse(TestCircuits.ThreeStage(amp: TestCircuits.Real()));

        Assert.True(e.Works, string.Join("; ", e.Checks.Where(c => !c.Passed).Select(c => c.Reason)));
        Assert.Contains(e.Checks, c => c.Name == "input common-mode range (oscillator)");
        Assert.Contains(e.Checks, c => c.Name == "output current (integrator)");
    }

    [Theory]
    [InlineData(0.5e6)]  // the integrator outruns half the slew rate: a failing check
    [InlineData(100e6)]
    public void Judging_without_explanations_gives_the_same_checks_and_the_reasons_of_those_that_miss(double slewRate)
    {
        // The design search's analysis writes no reason for a check that passes; everything else is the same.
        var design = SingleSupply(TestCircuits.ThreeStage(ri: 1e3, ci: 1e-9, amp: TestCircuits.Real(slewRate: slewRate)), 12, 10e3, 10e3);
        var full = CircuitAnalysis.Analyse(design, 2);
        var quiet = CircuitAnalysis.Analyse(design, 2, explain: false);

        Assert.Equal(full.Figures, quiet.Figures);
        Assert.Equal(full.Checks.Select(c => (c.Name, c.Passed, c.Margin, c.Severity)), quiet.Checks.Select(c => (c.Name, c.Passed, c.Margin, c.Severity)));
        Assert.All(full.Checks.Zip(quiet.Checks), pair => Assert.Equal(pair.First.Passed ? "" : pair.First.Reason, pair.Second.Reason));
        Assert.All(full.Checks, c => Assert.NotEqual("", c.Reason));
        Assert.Contains(full.Checks, c => !c.Passed);
        Assert.Empty(quiet.Notes);
    }

    [Fact]
    public void Integrator_faster_than_half_the_slew_rate_fails()
    {
        // Slope Vs/(Ri·Ci) = 10.5 V / (1 kΩ·1 nF) ≈ 10.5 V/µs against 0.5 V/µs (REFERENCE.md, common practice).
        var slow = TestCircuits.ThreeStage(ri: 1e3, ci: 1e-9, amp: TestCircuits.Real(slewRate: 0.5e6));
        var fast = TestCircuits.ThreeStage(ri: 1e3, ci: 1e-9, amp: TestCircuits.Real(slewRate: 100e6));

        Assert.False(CircuitAnalysis.Analyse(slow).Check("integrator slope below slew rate").Passed);
        Assert.True(CircuitAnalysis.Analyse(fast).Check("integrator slope below slew rate").Passed);
    }

    [Fact]
    public void Levels_that_do_not_straddle_the_reference_cannot_switch()
    {
        // Single 12 V supply, reference divider 100 kΩ over 1 kΩ: 0.12 V, below the output's 1.5 V floor.
        var design = SingleSupply(TestCircuits.RcRamp(amp: TestCircuits.Real()), 12, 100e3, 1e3);
        var e = CircuitAnalysis.Analyse(design);

        Assert.False(e.Check("oscillator can switch").Passed);
        Assert.Null(e.Figure(FigureNames.Frequency));
        Assert.NotNull(e.Figure(FigureNames.OutputHigh));
    }

    [Fact]
    public void Single_supply_stages_return_to_the_mid_rail_reference()
    {
        var design = SingleSupply(TestCircuits.ThreeStage(), 24, 10e3, 10e3);
        var e = CircuitAnalysis.Analyse(design);

        // Levels 0 V and 24 V about a 12 V reference are ±12 V: Sedra & Smith's 1/(2RC·ln 3) still holds.
        Precision.AlmostEqualRelative(455.12, e.Value(FigureNames.Frequency), 1e-5);
        Precision.AlmostEqualRelative(12, e.ReferenceV, 1e-12);
        Precision.AlmostEqualRelative(12, e.Value(FigureNames.TriangleCentre), 1e-9);
    }

    [Fact]
    public void Input_common_mode_range_is_checked_at_the_oscillator()
    {
        // β = 0.9 puts the capacitor at ±9.45 V; an input range ending 3 V below the 12 V rail stops at 9 V.
        var amp = TestCircuits.Real() with { InputHeadroomHighV = 3 };
        var e = CircuitAnalysis.Analyse(TestCircuits.RcRamp(r1: 1e3, r2: 9e3, amp: amp));
        var check = e.Check("input common-mode range (oscillator)");

        Assert.False(check.Passed);
        Precision.AlmostEqualRelative(9 - 0.9 * 10.5, check.Margin, 1e-12, "margin in volts");
    }

    [Fact]
    public void Heavy_feedback_load_exceeds_the_output_current()
    {
        // 100 Ω timing resistor: (L+ + βL+)/R ≈ 15.75 V / 100 Ω ≈ 158 mA against 20 mA.
        var e = CircuitAnalysis.Analyse(TestCircuits.ThreeStage(r: 100, c: 10e-6, amp: TestCircuits.Real()));
        Assert.False(e.Check("output current (oscillator)").Passed);
    }

    [Fact]
    public void Triangle_beyond_the_integrators_swing_fails()
    {
        // Nearly ideal integrator with a small capacitor: Vs/(2fRiCi) ≈ 10.5 × 2.2 ms / (2 × 10 µs) ≫ 21 V.
        var e = CircuitAnalysis.Analyse(TestCircuits.ThreeStage(ci: 1e-9, rf: 10e6, amp: TestCircuits.Real(slewRate: 1e9)));
        Assert.False(e.Check("triangle inside integrator swing").Passed);
    }

    [Fact]
    public void Polarised_timing_capacitor_fails_and_class_2_ceramic_only_warns()
    {
        var design = TestCircuits.RcRamp(amp: TestCircuits.Real());
        var electrolytic = Replace(design, Roles.OscC, RolePart.Capacitor(100e-9, 0.2, Dielectric.Electrolytic));
        var x7r = Replace(design, Roles.OscC, RolePart.Capacitor(100e-9, 0.1, Dielectric.X7R));

        var polarised = CircuitAnalysis.Analyse(electrolytic);
        Assert.False(polarised.Check("non-polarised (osc.c)").Passed);
        Assert.False(polarised.Works);

        var ceramic = CircuitAnalysis.Analyse(x7r);
        var warning = ceramic.Check("timing dielectric (osc.c)");
        Assert.False(warning.Passed);
        Assert.Equal(CheckSeverity.Warning, warning.Severity);
        Assert.True(ceramic.Works);
        Assert.DoesNotContain(CircuitAnalysis.Analyse(design).Checks, c => c.Name.StartsWith("timing dielectric", StringComparison.Ordinal));
    }

    [Fact]
    public void Ratings_are_derated_by_common_practice()
    {
        var design = TestCircuits.RcRamp(amp: TestCircuits.Real());
        // The capacitor sees β·L = 0.5 × 10.5 V = 5.25 V: a 10 V ceramic allows 5 V at 50 % (common practice).
        var tight = CircuitAnalysis.Analyse(Replace(design, Roles.OscC, RolePart.Capacitor(100e-9, 0.05, Dielectric.C0G, 10)));
        var ample = CircuitAnalysis.Analyse(Replace(design, Roles.OscC, RolePart.Capacitor(100e-9, 0.05, Dielectric.C0G, 16)));
        Assert.False(tight.Check("voltage (osc.c)").Passed);
        Assert.True(ample.Check("voltage (osc.c)").Passed);

        // cmp.ra of 100 Ω in a 300 Ω divider across 24 V: 80 mA, 0.64 W against 50 % of 1/8 W.
        var hot = design with
        {
            Roles = new Dictionary<string, RolePart>(design.Roles)
            {
                [Roles.CmpRa] = RolePart.Resistor(100, 0.01, powerRatingW: 0.125),
                [Roles.CmpPot] = TestCircuits.R(100),
                [Roles.CmpRb] = TestCircuits.R(100),
            },
        };
        var power = CircuitAnalysis.Analyse(hot).Check("power (cmp.ra)");
        Assert.False(power.Passed);
        Precision.AlmostEqualRelative(1 - 0.64 / 0.0625, power.Margin, 1e-9);
    }

    [Fact]
    public void Slow_comparator_edges_fail_against_the_period()
    {
        // 24 V swing at 0.05 V/µs: 480 µs per edge against a 2.2 ms period.
        var slowComparator = TestCircuits.Ideal(slewRate: 0.05e6) with { IsComparator = true, SectionsPerPackage = 1 };
        var e = CircuitAnalysis.Analyse(TestCircuits.ThreeStage() with { Comparator = slowComparator });
        Assert.False(e.Check("output edges short against the period").Passed);
        Precision.AlmostEqualRelative(24 / 0.05e6, e.Value(FigureNames.EdgeTime), 1e-12);
        Assert.True(CircuitAnalysis.Analyse(TestCircuits.ThreeStage()).Check("output edges short against the period").Passed);
    }

    [Fact]
    public void Hysteresis_drowned_by_the_offset_fails()
    {
        // β = 10 Ω/100 kΩ ≈ 1e-4: hysteresis ≈ 2.4 mV against 4 × 3 mV offset (common practice).
        var amp = TestCircuits.Ideal(offset: 3e-3);
        var small = CircuitAnalysis.Analyse(TestCircuits.RcRamp(r1: 100e3, r2: 10, amp: amp));
        var ample = CircuitAnalysis.Analyse(TestCircuits.RcRamp(r1: 100e3, r2: 10e3, amp: amp));

        Assert.False(small.Check("hysteresis above offset").Passed);
        Assert.False(small.Works);
        Assert.True(ample.Check("hysteresis above offset").Passed);
    }

    [Fact]
    public void Unbuffered_reference_is_checked_for_stiffness_and_bypass()
    {
        // Reference source 50 kΩ against a 20 kΩ hysteresis divider: far from 1 % (common practice).
        var soft = SingleSupply(TestCircuits.RcRamp(), 24, 100e3, 100e3);
        var e = CircuitAnalysis.Analyse(soft);
        Assert.False(e.Check("reference stiff against its load").Passed);
        Assert.Equal(CheckSeverity.Warning, e.Check("reference stiff against its load").Severity);
        // 50 kΩ × 10 µF = 0.5 s against ten 2.2 ms periods: well bypassed.
        Assert.True(e.Check("reference bypass").Passed);

        var stiff = CircuitAnalysis.Analyse(SingleSupply(TestCircuits.RcRamp(), 24, 100, 100));
        Assert.True(stiff.Check("reference stiff against its load").Passed);
        Assert.False(stiff.Check("reference bypass").Passed); // 50 Ω × 10 µF = 0.5 ms < 22 ms

        var buffered = CircuitAnalysis.Analyse(soft with { BufferReference = true });
        Assert.DoesNotContain(buffered.Checks, c => c.Name.StartsWith("reference", StringComparison.Ordinal));
        Assert.Contains(buffered.Checks, c => c.Name == "input common-mode range (reference buffer)");
    }

    [Theory]
    [InlineData(5.9, 100e6, true, true)]    // 0.1 V overdrive, 0.24 µs edges: both fine
    [InlineData(5.9, 5e6, false, true)]     // 2 × 4.8 µs edges against 1.67 µs pulses
    [InlineData(5.995, 1e9, true, false)]   // 5 mV overdrive against 10 mV (common practice)
    public void Duty_extremes_are_checked_for_pulse_width_and_overdrive(double edge, double slew, bool pulseOk, bool overdriveOk)
    {
        // ±6 V loop triangle at 5 kHz (Sedra & Smith's example); thresholds close to its peaks.
        var comparator = TestCircuits.Ideal(slewRate: slew, sections: 1) with { IsComparator = true };
        var design = TestCircuits.Loop(duty: DutyControl.ControlVoltage(-edge, edge)) with { Comparator = comparator };
        var e = CircuitAnalysis.Analyse(design);

        Assert.Equal(pulseOk, e.Check("shortest pulse reaches full swing").Passed);
        Assert.Equal(overdriveOk, e.Check("comparator overdrive").Passed);
        Assert.True(e.Works, "both are warnings");
    }

    [Fact]
    public void Margins_stay_finite_for_absurd_but_valid_values()
    {
        // A 1e-310 Ω pull-up asks for an infinite sink current: the check fails with a finite margin.
        var openDrain = TestCircuits.Ideal(sections: 1) with { IsComparator = true, IsOpenDrain = true };
        var design = Replace(TestCircuits.Loop() with { Comparator = openDrain }, Roles.CmpPullup, TestCircuits.R(1e-310));
        var e = CircuitAnalysis.Analyse(design);

        Assert.False(e.Check("output current (comparator)").Passed);
        Assert.All(e.Checks, c => Assert.True(double.IsFinite(c.Margin), c.Name));
        Assert.All(e.Figures, f => Assert.True(f.Value is null || double.IsFinite(f.Value.Value), f.Name));
    }

    [Fact]
    public void Integrator_offset_times_its_noise_gain_is_weighed_against_the_triangle()
    {
        // DC noise gain 1 + Rf/Ri (Sedra & Smith, from memory): 1 + 10 MΩ/10 kΩ ≈ 1001 × 3 mV ≈ 3 V on a ~1.2 V triangle.
        var amp = TestCircuits.Real();
        var lossy = CircuitAnalysis.Analyse(TestCircuits.ThreeStage(ci: 1e-6, rf: 100e3, amp: amp));
        var highGain = CircuitAnalysis.Analyse(TestCircuits.ThreeStage(ci: 1e-6, rf: 10e6, amp: amp));

        Assert.True(lossy.Check("integrator offset shift").Passed);
        var check = highGain.Check("integrator offset shift");
        Assert.False(check.Passed);
        Assert.Equal(CheckSeverity.Warning, check.Severity);
    }

    private static CircuitDesign Replace(CircuitDesign design, string role, RolePart part) =>
        design with { Roles = new Dictionary<string, RolePart>(design.Roles) { [role] = part } };

    internal static CircuitDesign SingleSupply(CircuitDesign design, double volts, double top, double bottom) =>
        design with
        {
            Supply = Supply.SingleRail(volts),
            Roles = new Dictionary<string, RolePart>(design.Roles)
            {
                [Roles.RefRtop] = TestCircuits.R(top),
                [Roles.RefRbottom] = TestCircuits.R(bottom),
                [Roles.RefC] = TestCircuits.C(10e-6, 0.2, Dielectric.X7R),
            },
        };
}
