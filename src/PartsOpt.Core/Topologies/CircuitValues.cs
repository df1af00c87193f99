using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;

namespace PartsOpt.Topologies;

/// <summary>The numbers a design is evaluated from, by slot, so the figure model can overwrite any of them.</summary>
internal enum Slot
{
    OscR, OscC, OscR1, OscR2, IntR, IntC, IntRf, SchR1, SchR2,
    CmpRa, CmpPot, CmpRb, CmpPullup, RefRtop, RefRbottom, RefC,
    AmpHeadroomHigh, AmpHeadroomLow, AmpSlewRate,
    CmpHeadroomHigh, CmpHeadroomLow, CmpSlewRate,
}

/// <summary>
/// One design's values as plain numbers (SI units). A value type so that the figure model can copy a
/// template onto the stack and overwrite the parameters of one evaluation without allocating.
/// </summary>
[StructLayout(LayoutKind.Sequential)]
internal struct CircuitValues
{
    public double OscR, OscC, OscR1, OscR2, IntR, IntC, IntRf, SchR1, SchR2;
    public double CmpRa, CmpPot, CmpRb, CmpPullup, RefRtop, RefRbottom, RefC;
    public double AmpHeadroomHigh, AmpHeadroomLow, AmpSlewRate;
    public double CmpHeadroomHigh, CmpHeadroomLow, CmpSlewRate;

    /// <summary>
    /// Writes the field a slot names. The slots are the fields in declaration order and the struct is a
    /// sequential run of doubles, so the slot is an offset: the figure model sets every parameter this way
    /// on each evaluation, and a switch of twenty-two cases was a visible share of its cost.
    /// </summary>
    public void Set(Slot slot, double value)
    {
        if ((uint)slot > (uint)Slot.CmpSlewRate)
            throw new ArgumentOutOfRangeException(nameof(slot), slot, "Unknown slot.");
        Unsafe.Add(ref OscR, (int)slot) = value;
    }

    public static Slot SlotOf(string role) => role switch
    {
        Roles.OscR => Slot.OscR,
        Roles.OscC => Slot.OscC,
        Roles.OscR1 => Slot.OscR1,
        Roles.OscR2 => Slot.OscR2,
        Roles.IntR => Slot.IntR,
        Roles.IntC => Slot.IntC,
        Roles.IntRf => Slot.IntRf,
        Roles.SchR1 => Slot.SchR1,
        Roles.SchR2 => Slot.SchR2,
        Roles.CmpRa => Slot.CmpRa,
        Roles.CmpPot => Slot.CmpPot,
        Roles.CmpRb => Slot.CmpRb,
        Roles.CmpPullup => Slot.CmpPullup,
        Roles.RefRtop => Slot.RefRtop,
        Roles.RefRbottom => Slot.RefRbottom,
        Roles.RefC => Slot.RefC,
        _ => throw new ArgumentOutOfRangeException(nameof(role), role, "Unknown role."),
    };

    /// <summary>The values of a validated design.</summary>
    public static CircuitValues From(CircuitDesign design)
    {
        var values = new CircuitValues
        {
            AmpHeadroomHigh = design.Amplifier.OutputHeadroomHighV,
            AmpHeadroomLow = design.Amplifier.OutputHeadroomLowV,
            AmpSlewRate = design.Amplifier.SlewRateVPerS,
            CmpHeadroomHigh = design.ComparatorPart.OutputHeadroomHighV,
            CmpHeadroomLow = design.ComparatorPart.OutputHeadroomLowV,
            CmpSlewRate = design.ComparatorPart.SlewRateVPerS,
        };
        foreach (var (role, part) in design.Roles)
            values.Set(SlotOf(role), part.Value);
        return values;
    }
}

/// <summary>
/// What stays fixed while a design's values vary: topology, rails, how the duty is set, the parts' fixed
/// properties. Built once per design.
/// </summary>
internal sealed class CircuitShape
{
    public CircuitShape(CircuitDesign design)
    {
        Topology = design.Topology;
        PositiveV = design.Supply.PositiveV;
        NegativeV = design.Supply.NegativeV;
        SingleSupply = design.Supply.IsSingle;
        if (design.DutyControl is ControlVoltageDuty control)
        {
            ControlMinV = control.MinV;
            ControlMaxV = control.MaxV;
        }
        else
        {
            Potentiometer = true;
        }

        var comparator = design.ComparatorPart;
        OpenDrain = comparator.IsOpenDrain;
        AmpOffsetV = design.Amplifier.InputOffsetV;
        CmpOffsetV = comparator.InputOffsetV;
        Sections = SectionLayout.For(design);
        QuiescentA = Sections.AmplifierPackages * design.Amplifier.SectionsPerPackage * design.Amplifier.QuiescentCurrentPerSectionA
            + Sections.ComparatorPackages * comparator.SectionsPerPackage * comparator.QuiescentCurrentPerSectionA;
    }

    public TopologyKind Topology { get; }
    public double PositiveV { get; }
    public double NegativeV { get; }
    public bool SingleSupply { get; }
    public bool Potentiometer { get; }
    public double ControlMinV { get; }
    public double ControlMaxV { get; }
    public bool OpenDrain { get; }
    public double AmpOffsetV { get; }
    public double CmpOffsetV { get; }
    public SectionLayout Sections { get; }

    /// <summary>Quiescent current of every section of every package fitted (unused sections draw current too).</summary>
    public double QuiescentA { get; }
}
