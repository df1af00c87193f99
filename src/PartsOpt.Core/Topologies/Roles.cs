namespace PartsOpt.Topologies;

/// <summary>What kind of part fills a role, which decides its reference-designator prefix.</summary>
public enum RoleKind
{
    /// <summary>A fixed resistor (R1, R2…).</summary>
    Resistor,

    /// <summary>A capacitor (C1, C2…).</summary>
    Capacitor,

    /// <summary>A potentiometer (RV1, RV2…).</summary>
    Potentiometer,
}

/// <summary>
/// The stable role names of DEVELOPERS.md. Role order is the order of its table (oscillator, integrator,
/// Schmitt trigger, comparator, reference): reference designators are assigned in this order.
/// </summary>
public static class Roles
{
    /// <summary>Oscillator timing resistor, output → inverting input.</summary>
    public const string OscR = "osc.r";
    /// <summary>Oscillator timing capacitor, inverting input → reference.</summary>
    public const string OscC = "osc.c";
    /// <summary>Oscillator hysteresis resistor, output → non-inverting input.</summary>
    public const string OscR1 = "osc.r1";
    /// <summary>Oscillator hysteresis resistor, non-inverting input → reference.</summary>
    public const string OscR2 = "osc.r2";
    /// <summary>Loop Schmitt resistor, triangle → non-inverting input.</summary>
    public const string SchR1 = "sch.r1";
    /// <summary>Loop Schmitt resistor, own output → non-inverting input.</summary>
    public const string SchR2 = "sch.r2";
    /// <summary>Integrator input resistor.</summary>
    public const string IntR = "int.r";
    /// <summary>Integrator feedback capacitor.</summary>
    public const string IntC = "int.c";
    /// <summary>Integrator shunt resistor across the capacitor (three-stage only).</summary>
    public const string IntRf = "int.rf";
    /// <summary>Threshold divider resistor to V+.</summary>
    public const string CmpRa = "cmp.ra";
    /// <summary>Threshold potentiometer, wiper to the comparator's inverting input.</summary>
    public const string CmpPot = "cmp.pot";
    /// <summary>Threshold divider resistor to V−.</summary>
    public const string CmpRb = "cmp.rb";
    /// <summary>Pull-up of an open-drain comparator output, to V+.</summary>
    public const string CmpPullup = "cmp.pullup";
    /// <summary>Mid-rail reference divider, upper resistor (single supply).</summary>
    public const string RefRtop = "ref.rtop";
    /// <summary>Mid-rail reference divider, lower resistor (single supply).</summary>
    public const string RefRbottom = "ref.rbottom";
    /// <summary>Mid-rail reference bypass capacitor (single supply).</summary>
    public const string RefC = "ref.c";

    /// <summary>Every role, in role order.</summary>
    public static IReadOnlyList<string> All { get; } =
    [
        OscR, OscC, OscR1, OscR2, IntR, IntC, IntRf, SchR1, SchR2,
        CmpRa, CmpPot, CmpRb, CmpPullup, RefRtop, RefRbottom, RefC,
    ];

    /// <summary>The kind of part a role takes.</summary>
    public static RoleKind KindOf(string role) => role switch
    {
        OscC or IntC or RefC => RoleKind.Capacitor,
        CmpPot => RoleKind.Potentiometer,
        _ when All.Contains(role) => RoleKind.Resistor,
        _ => throw new ArgumentOutOfRangeException(nameof(role), role, "Unknown role."),
    };
}
