using PartsOpt.Topologies;

namespace PartsOpt.Tests.Topologies;

public class ValidationTests
{
    [Theory]
    [InlineData("three-stage", TopologyKind.ThreeStage)]
    [InlineData("loop", TopologyKind.Loop)]
    [InlineData("rc-ramp", TopologyKind.RcRamp)]
    public void Wire_names_round_trip(string name, TopologyKind kind)
    {
        Assert.Equal(kind, TopologyNames.Parse(name));
        Assert.Equal(name, kind.ToWireName());
    }

    [Fact]
    public void Unknown_topology_names_the_field()
    {
        var error = Assert.Throws<DesignValidationException>(() => TopologyNames.Parse("Three-Stage"));
        Assert.Equal("topology", error.Field);
    }

    [Fact]
    public void Missing_role_names_the_role()
    {
        var design = TestCircuits.ThreeStage();
        var roles = new Dictionary<string, RolePart>(design.Roles);
        roles.Remove(Roles.IntRf);
        var error = Assert.Throws<DesignValidationException>(() => CircuitAnalysis.Analyse(design with { Roles = roles }));
        Assert.Equal("roles.int.rf", error.Field);
    }

    [Theory]
    [InlineData("osc.rx")]
    [InlineData("sch.r1")]
    [InlineData("ref.rtop")]
    public void Unknown_or_foreign_role_names_the_role(string role)
    {
        var design = TestCircuits.ThreeStage();
        var roles = new Dictionary<string, RolePart>(design.Roles) { [role] = TestCircuits.R(1e3) };
        var error = Assert.Throws<DesignValidationException>(() => CircuitAnalysis.Analyse(design with { Roles = roles }));
        Assert.Equal($"roles.{role}", error.Field);
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(-1e-9)]
    [InlineData(double.NaN)]
    [InlineData(double.PositiveInfinity)]
    public void Non_positive_or_non_finite_values_name_the_field(double value)
    {
        var design = TestCircuits.ThreeStage();
        var roles = new Dictionary<string, RolePart>(design.Roles) { [Roles.OscC] = TestCircuits.C(1e-9) with { Value = value } };
        var error = Assert.Throws<DesignValidationException>(() => CircuitAnalysis.Analyse(design with { Roles = roles }));
        Assert.Equal("roles.osc.c.value", error.Field);
    }

    [Fact]
    public void Supply_outside_the_op_amps_range_is_an_input_error()
    {
        // The test op-amp is rated for 7…36 V across its rails; ±20 V gives 40 V.
        var design = TestCircuits.ThreeStage(amp: TestCircuits.Real(), supply: 20);
        var error = Assert.Throws<DesignValidationException>(() => CircuitAnalysis.Analyse(design));
        Assert.Equal("supply.positive", error.Field);
        Assert.Throws<DesignValidationException>(() => CircuitFigureModel.For(design));
    }

    [Fact]
    public void Open_drain_comparator_needs_its_pull_up()
    {
        var openDrain = TestCircuits.Ideal() with { IsOpenDrain = true, IsComparator = true, SectionsPerPackage = 2 };
        var design = TestCircuits.Loop() with { Comparator = openDrain };
        var error = Assert.Throws<DesignValidationException>(() => CircuitAnalysis.Analyse(design));
        Assert.Equal("roles.cmp.pullup", error.Field);

        var roles = new Dictionary<string, RolePart>(design.Roles) { [Roles.CmpPullup] = TestCircuits.R(4.7e3) };
        var e = CircuitAnalysis.Analyse(design with { Roles = roles });
        Assert.Equal(12, e.Value(FigureNames.OutputHigh)); // open drain: high is V+ through the pull-up
    }

    [Fact]
    public void A_comparator_part_cannot_integrate()
    {
        var comparator = TestCircuits.Ideal() with { IsComparator = true };
        var error = Assert.Throws<DesignValidationException>(() => CircuitAnalysis.Analyse(TestCircuits.Loop(amp: comparator)));
        Assert.Equal("amplifier.isComparator", error.Field);
        // A comparator makes a fine relaxation oscillator: the rc-ramp needs no integrator.
        Assert.NotNull(CircuitAnalysis.Analyse(TestCircuits.RcRamp(amp: comparator)).Figure(FigureNames.Frequency));
    }

    [Fact]
    public void Curve_points_are_bounded()
    {
        var error = Assert.Throws<DesignValidationException>(() => CircuitAnalysis.Analyse(TestCircuits.Loop(), 1));
        Assert.Equal("dutyCurvePoints", error.Field);
    }

    [Fact]
    public void Required_roles_follow_topology_supply_and_duty_control()
    {
        var roles = CircuitDesign.RequiredRoles(TopologyKind.Loop, Supply.SingleRail(12), DutyControl.ControlVoltage(1, 2), true);
        Assert.Equal(["int.r", "int.c", "sch.r1", "sch.r2", "cmp.pullup", "ref.rtop", "ref.rbottom", "ref.c"], roles);
        var three = CircuitDesign.RequiredRoles(TopologyKind.ThreeStage, Supply.Symmetric(12), DutyControl.Potentiometer, false);
        Assert.Equal(["osc.r", "osc.c", "osc.r1", "osc.r2", "int.r", "int.c", "int.rf", "cmp.ra", "cmp.pot", "cmp.rb"], three);
    }
}
