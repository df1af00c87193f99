using PartsOpt.Topologies;

namespace PartsOpt.Tests.Topologies;

public class LayoutTests
{
    [Fact]
    public void Designators_follow_role_order_per_kind()
    {
        var design = CheckTests.SingleSupply(TestCircuits.ThreeStage(), 24, 10e3, 10e3) with { BufferReference = true };
        var d = CircuitAnalysis.Analyse(design).Designators;

        // DEVELOPERS.md: R1…, C1…, RV1… in role order per kind.
        Assert.Equal("R1", d[Roles.OscR]);
        Assert.Equal("C1", d[Roles.OscC]);
        Assert.Equal("R2", d[Roles.OscR1]);
        Assert.Equal("R3", d[Roles.OscR2]);
        Assert.Equal("R4", d[Roles.IntR]);
        Assert.Equal("C2", d[Roles.IntC]);
        Assert.Equal("R5", d[Roles.IntRf]);
        Assert.Equal("R6", d[Roles.CmpRa]);
        Assert.Equal("RV1", d[Roles.CmpPot]);
        Assert.Equal("R7", d[Roles.CmpRb]);
        Assert.Equal("R8", d[Roles.RefRtop]);
        Assert.Equal("R9", d[Roles.RefRbottom]);
        Assert.Equal("C3", d[Roles.RefC]);
    }

    [Fact]
    public void Sections_pack_into_packages()
    {
        var quad = CheckTests.SingleSupply(TestCircuits.ThreeStage(), 24, 10e3, 10e3) with { BufferReference = true };
        Assert.Equal(["U1A oscillator", "U1B integrator", "U1C comparator", "U1D reference buffer"],
            CircuitAnalysis.Analyse(quad).Sections.Select(s => $"{s.Designator} {s.Function}"));

        var dual = quad with { Amplifier = TestCircuits.Ideal(sections: 2) };
        Assert.Equal(["U1A", "U1B", "U2A", "U2B"], CircuitAnalysis.Analyse(dual).Sections.Select(s => s.Designator));

        var separate = TestCircuits.Loop() with { Comparator = TestCircuits.Ideal(sections: 2) with { IsComparator = true, PartNumber = "CMP" } };
        Assert.Equal(["U1A schmitt", "U1B integrator", "U2A comparator"],
            CircuitAnalysis.Analyse(separate).Sections.Select(s => $"{s.Designator} {s.Function}"));
    }

    [Fact]
    public void Quiescent_current_counts_every_section_of_every_fitted_package()
    {
        // Three sections of a dual op-amp fill two packages: four sections draw quiescent current.
        var without = TestCircuits.ThreeStage(amp: TestCircuits.Ideal(sections: 2));
        var with = TestCircuits.ThreeStage(amp: TestCircuits.Ideal(sections: 2) with { QuiescentCurrentPerSectionA = 1e-3 });
        var added = CircuitAnalysis.Analyse(with).Value(FigureNames.SupplyCurrent)
            - CircuitAnalysis.Analyse(without).Value(FigureNames.SupplyCurrent);
        Precision.AlmostEqualRelative(4e-3, added, 1e-9);
    }

    [Fact]
    public void Supply_current_of_the_rc_ramp_counts_dividers_and_the_capacitor_charge()
    {
        const double r = 10e3, c = 100e-9, r1 = 10e3, r2 = 10e3;
        var e = CircuitAnalysis.Analyse(TestCircuits.RcRamp(r, c, r1, r2));
        var period = 1 / e.Value(FigureNames.Frequency);

        // First principles, ideal ±12 V outputs, quiescent 0: the threshold divider (3 × 10 kΩ across 24 V),
        // the hysteresis divider while high (12 V / 20 kΩ for half the period) and the timing capacitor's
        // charge C·ΔV per period (ΔV = 2βL = 12 V), all drawn from V+.
        var expected = 24 / 30e3 + 12 / 20e3 * 0.5 + c * 12 / period;
        Precision.AlmostEqualRelative(expected, e.Value(FigureNames.SupplyCurrent), 1e-12);
    }

    [Fact]
    public void Supply_current_of_a_slewing_rc_ramp_counts_the_capacitor_overshoot()
    {
        const double r = 10e3, c = 100e-9, r1 = 10e3, r2 = 10e3;
        var e = CircuitAnalysis.Analyse(TestCircuits.RcRamp(r, c, r1, r2, amp: TestCircuits.Ideal(slewRate: 0.5e6)));
        var period = 1 / e.Value(FigureNames.Frequency);
        var highShare = e.Value(FigureNames.HighTime) * e.Value(FigureNames.Frequency);
        var swing = e.Value(FigureNames.TrianglePeakToPeak);

        // First principles as above, with the capacitor's whole swing (derived: it keeps charging past βL
        // while the output slews; checked against the time-domain simulator in ClosedFormAgreementTests).
        Assert.True(swing > 12 * 1.003, "the capacitor overshoots the thresholds");
        var expected = 24 / 30e3 + 12 / 20e3 * highShare + c * swing / period;
        Precision.AlmostEqualRelative(expected, e.Value(FigureNames.SupplyCurrent), 1e-12);
    }
}
