using PartsOpt.Topologies;
using PartsOpt.Values;

namespace PartsOpt.Tests.Topologies;

/// <summary>
/// Builders for the designs the tests analyse. The "ideal" op-amp saturates exactly at the rails (zero
/// headroom, so L± = the rails) and slews so fast that edges vanish: the textbook assumptions.
/// </summary>
internal static class TestCircuits
{
    public static OpAmpSpec Ideal(double slewRate = 1e30, double headroomHigh = 0, double headroomLow = 0,
        int sections = 4, double offset = 0) =>
        new(sections, 1, 100, 1e12, slewRate, headroomHigh, headroomLow, -1, -1, offset, 1, 0);

    /// <summary>An op-amp with limits of the kind data sheets give (values chosen for the tests, not a real part).</summary>
    public static OpAmpSpec Real(double slewRate = 13e6) =>
        new(4, 7, 36, 3e6, slewRate, 1.5, 1.5, 1.5, 1.5, 3e-3, 0.02, 1.4e-3, PartNumber: "TEST-OPAMP");

    public static RolePart R(double ohms, double tolerance = 0.01) => RolePart.Resistor(ohms, tolerance);

    public static RolePart C(double farads, double tolerance = 0.05, Dielectric dielectric = Dielectric.C0G) =>
        RolePart.Capacitor(farads, tolerance, dielectric);

    public static Dictionary<string, RolePart> Pot(double ra = 10e3, double pot = 10e3, double rb = 10e3) => new()
    {
        [Roles.CmpRa] = R(ra),
        [Roles.CmpPot] = R(pot, 0.2),
        [Roles.CmpRb] = R(rb),
    };

    public static CircuitDesign ThreeStage(double r = 10e3, double c = 100e-9, double r1 = 10e3, double r2 = 10e3,
        double ri = 10e3, double ci = 100e-9, double rf = 1e6, OpAmpSpec? amp = null, double supply = 12,
        Dictionary<string, RolePart>? extra = null)
    {
        var roles = new Dictionary<string, RolePart>
        {
            [Roles.OscR] = R(r), [Roles.OscC] = C(c), [Roles.OscR1] = R(r1), [Roles.OscR2] = R(r2),
            [Roles.IntR] = R(ri), [Roles.IntC] = C(ci), [Roles.IntRf] = R(rf),
        };
        foreach (var (role, part) in extra ?? Pot())
            roles[role] = part;
        return new CircuitDesign(TopologyKind.ThreeStage, Supply.Symmetric(supply), amp ?? Ideal(), roles, DutyControl.Potentiometer);
    }

    public static CircuitDesign RcRamp(double r = 10e3, double c = 100e-9, double r1 = 10e3, double r2 = 10e3,
        OpAmpSpec? amp = null, double supply = 12, DutyControl? duty = null)
    {
        var roles = new Dictionary<string, RolePart>
        {
            [Roles.OscR] = R(r), [Roles.OscC] = C(c), [Roles.OscR1] = R(r1), [Roles.OscR2] = R(r2),
        };
        duty ??= DutyControl.Potentiometer;
        if (duty is PotentiometerDuty)
        {
            foreach (var (role, part) in Pot())
                roles[role] = part;
        }

        return new CircuitDesign(TopologyKind.RcRamp, Supply.Symmetric(supply), amp ?? Ideal(), roles, duty);
    }

    public static CircuitDesign Loop(double r1 = 10e3, double r2 = 20e3, double ri = 10e3, double ci = 10e-9,
        OpAmpSpec? amp = null, double supply = 12, DutyControl? duty = null)
    {
        var roles = new Dictionary<string, RolePart>
        {
            [Roles.IntR] = R(ri), [Roles.IntC] = C(ci), [Roles.SchR1] = R(r1), [Roles.SchR2] = R(r2),
        };
        duty ??= DutyControl.Potentiometer;
        if (duty is PotentiometerDuty)
        {
            foreach (var (role, part) in Pot())
                roles[role] = part;
        }

        return new CircuitDesign(TopologyKind.Loop, Supply.Symmetric(supply), amp ?? Ideal(), roles, duty);
    }

    public static double Value(this CircuitEvaluation evaluation, string name) =>
        evaluation.Figure(name) ?? throw new InvalidOperationException($"{name} does not exist for this design.");

    public static CircuitCheck Check(this CircuitEvaluation evaluation, string name) =>
        evaluation.Checks.Single(c => c.Name == name);
}
