using System.Collections.ObjectModel;

namespace PartsOpt.Topologies;

/// <summary>
/// A PWM generator to analyse: its topology, supply, op-amp part(s), the part in every role and what sets
/// the duty cycle.
/// </summary>
/// <param name="Topology">Which of the three topologies.</param>
/// <param name="Supply">The supply rails; a 0 V negative rail means single supply with a mid-rail reference.</param>
/// <param name="Amplifier">The op-amp used for every analog section (oscillator, integrator, Schmitt, reference buffer).</param>
/// <param name="Roles">The part in each role, keyed by role name (see <see cref="Topologies.Roles"/>).</param>
/// <param name="DutyControl">Potentiometer divider or external control voltage.</param>
/// <param name="Comparator">A separate part for the comparator section; null to use a section of <paramref name="Amplifier"/>.</param>
/// <param name="BufferReference">Single supply only: buffer the mid-rail reference with a spare section.</param>
public sealed record CircuitDesign(
    TopologyKind Topology,
    Supply Supply,
    OpAmpSpec Amplifier,
    IReadOnlyDictionary<string, RolePart> Roles,
    DutyControl DutyControl,
    OpAmpSpec? Comparator = null,
    bool BufferReference = false)
{
    /// <summary>The part that does the comparing: <see cref="Comparator"/> if given, else <see cref="Amplifier"/>.</summary>
    public OpAmpSpec ComparatorPart => Comparator ?? Amplifier;

    /// <summary>The roles this design must fill, in role order.</summary>
    public IReadOnlyList<string> RequiredRoles() =>
        RequiredRoles(Topology, Supply, DutyControl, ComparatorPart.IsOpenDrain);

    /// <summary>
    /// The roles a design must fill, in role order: the topology's timing parts, the threshold divider when a
    /// potentiometer sets the duty, the pull-up of an open-drain comparator, and the mid-rail reference of a
    /// single supply.
    /// </summary>
    public static IReadOnlyList<string> RequiredRoles(TopologyKind topology, Supply supply, DutyControl dutyControl,
        bool comparatorOpenDrain)
    {
        ArgumentNullException.ThrowIfNull(supply);
        ArgumentNullException.ThrowIfNull(dutyControl);
        // Four facts decide the list: each combination is built once and shared (the search asks per design).
        var slot = ((((int)topology * 2) + (supply.IsSingle ? 1 : 0)) * 2 + (dutyControl is PotentiometerDuty ? 1 : 0)) * 2 + (comparatorOpenDrain ? 1 : 0);
        if ((uint)slot < (uint)RoleLists.Length)
            return RoleLists[slot] ??= Build(topology, supply.IsSingle, dutyControl is PotentiometerDuty, comparatorOpenDrain);
        return Build(topology, supply.IsSingle, dutyControl is PotentiometerDuty, comparatorOpenDrain);
    }

    private static readonly IReadOnlyList<string>?[] RoleLists = new IReadOnlyList<string>?[Enum.GetValues<TopologyKind>().Length * 8];

    private static ReadOnlyCollection<string> Build(TopologyKind topology, bool singleSupply, bool potentiometerDuty, bool comparatorOpenDrain)
    {
        var roles = new List<string>(16);
        if (topology is TopologyKind.ThreeStage or TopologyKind.RcRamp)
            roles.AddRange([Topologies.Roles.OscR, Topologies.Roles.OscC, Topologies.Roles.OscR1, Topologies.Roles.OscR2]);
        if (topology is TopologyKind.ThreeStage)
            roles.AddRange([Topologies.Roles.IntR, Topologies.Roles.IntC, Topologies.Roles.IntRf]);
        if (topology is TopologyKind.Loop)
            roles.AddRange([Topologies.Roles.IntR, Topologies.Roles.IntC, Topologies.Roles.SchR1, Topologies.Roles.SchR2]);
        if (potentiometerDuty)
            roles.AddRange([Topologies.Roles.CmpRa, Topologies.Roles.CmpPot, Topologies.Roles.CmpRb]);
        if (comparatorOpenDrain)
            roles.Add(Topologies.Roles.CmpPullup);
        if (singleSupply)
            roles.AddRange([Topologies.Roles.RefRtop, Topologies.Roles.RefRbottom, Topologies.Roles.RefC]);
        return roles.AsReadOnly();
    }

    /// <summary>
    /// Throws a <see cref="DesignValidationException"/> naming the field for input that cannot be analysed:
    /// a missing or unknown role, a value or tolerance that is not a sensible finite number, a supply outside
    /// a part's rated range, an open-drain part in an analog section. Designs that merely do not work pass
    /// here and fail a <see cref="CircuitCheck"/> instead.
    /// </summary>
    public void Validate()
    {
        if (!Enum.IsDefined(Topology))
            throw new DesignValidationException("topology", $"Unknown topology {Topology}.");
        ArgumentNullException.ThrowIfNull(Supply);
        ArgumentNullException.ThrowIfNull(Amplifier);
        ArgumentNullException.ThrowIfNull(Roles);
        ArgumentNullException.ThrowIfNull(DutyControl);
        Supply.Validate();
        Amplifier.Validate("amplifier");
        Comparator?.Validate("comparator");
        if (Amplifier.IsOpenDrain)
            throw new DesignValidationException("amplifier.isOpenDrain",
                "An open-drain part cannot drive the oscillator and integrator; give it as the comparator instead.");
        if (Amplifier.IsComparator && Topology != TopologyKind.RcRamp)
            throw new DesignValidationException("amplifier.isComparator",
                "A comparator part cannot work as an integrator; the amplifier must be an op-amp for this topology.");
        CheckSupplyRange(Amplifier, "amplifier");
        if (Comparator is not null)
            CheckSupplyRange(Comparator, "comparator");
        if (BufferReference && !Supply.IsSingle)
            throw new DesignValidationException("bufferReference", "A reference buffer only exists with a single supply.");
        if (DutyControl is ControlVoltageDuty control)
        {
            if (!double.IsFinite(control.MinV) || !double.IsFinite(control.MaxV) || control.MaxV < control.MinV)
                throw new DesignValidationException("dutyControl",
                    $"The control voltage range must be finite with min ≤ max (got {control.MinV} … {control.MaxV} V).");
            if (control.MinV < Supply.NegativeV || control.MaxV > Supply.PositiveV)
                throw new DesignValidationException("dutyControl",
                    $"The control voltage range {control.MinV} … {control.MaxV} V lies outside the rails.");
        }

        var required = RequiredRoles();
        foreach (var role in required)
        {
            if (!Roles.TryGetValue(role, out var part) || part is null)
                throw new DesignValidationException($"roles.{role}", $"The {Topology.ToWireName()} design needs a part in role {role}.");
            CheckPart(role, part);
        }

        foreach (var role in Roles.Keys)
        {
            if (!required.Contains(role))
                throw new DesignValidationException($"roles.{role}",
                    Topologies.Roles.All.Contains(role)
                        ? $"Role {role} is not part of this {Topology.ToWireName()} design."
                        : $"Unknown role {role}.");
        }
    }

    private void CheckSupplyRange(OpAmpSpec part, string field)
    {
        var span = Supply.SpanV;
        if (span < part.SupplyMinV || span > part.SupplyMaxV)
            throw new DesignValidationException("supply.positive",
                $"The {field} part ({part.PartNumber ?? "unnamed"}) is rated for {part.SupplyMinV}…{part.SupplyMaxV} V " +
                $"across its rails, but the supply gives {span} V.");
    }

    private static void CheckPart(string role, RolePart part)
    {
        if (!double.IsFinite(part.Value) || part.Value <= 0)
            throw new DesignValidationException($"roles.{role}.value", $"The value of {role} must be a finite number above 0 (got {part.Value}).");
        if (!double.IsFinite(part.ToleranceMinus) || part.ToleranceMinus is < 0 or >= 1)
            throw new DesignValidationException($"roles.{role}.toleranceMinus", $"The lower tolerance of {role} must lie in [0, 1) (got {part.ToleranceMinus}).");
        if (!double.IsFinite(part.TolerancePlus) || part.TolerancePlus < 0)
            throw new DesignValidationException($"roles.{role}.tolerancePlus", $"The upper tolerance of {role} must be a finite number at or above 0 (got {part.TolerancePlus}).");
        if (part.PowerRatingW is { } power && (!double.IsFinite(power) || power <= 0))
            throw new DesignValidationException($"roles.{role}.powerRatingW", $"The power rating of {role} must be above 0 W (got {power}).");
        if (part.VoltageRatingV is { } volts && (!double.IsFinite(volts) || volts <= 0))
            throw new DesignValidationException($"roles.{role}.voltageRatingV", $"The voltage rating of {role} must be above 0 V (got {volts}).");
    }
}
