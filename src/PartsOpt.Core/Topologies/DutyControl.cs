namespace PartsOpt.Topologies;

/// <summary>
/// What sets the comparator's threshold, and so the duty cycle: a potentiometer in a divider across the
/// rails (roles <c>cmp.ra</c>, <c>cmp.pot</c>, <c>cmp.rb</c>) or an external control voltage.
/// </summary>
public abstract record DutyControl
{
    private protected DutyControl() { }

    /// <summary>A potentiometer between <c>cmp.ra</c> (to V+) and <c>cmp.rb</c> (to V−), wiper to the comparator.</summary>
    public static DutyControl Potentiometer { get; } = new PotentiometerDuty();

    /// <summary>An external control voltage on the comparator's inverting input, swept from min to max.</summary>
    public static DutyControl ControlVoltage(double minV, double maxV) => new ControlVoltageDuty(minV, maxV);
}

/// <summary>The threshold comes from the <c>cmp.ra</c> – <c>cmp.pot</c> – <c>cmp.rb</c> divider.</summary>
public sealed record PotentiometerDuty : DutyControl;

/// <summary>The threshold is an external voltage between <paramref name="MinV"/> and <paramref name="MaxV"/> (absolute, V).</summary>
/// <param name="MinV">The control voltage at setting 0, V.</param>
/// <param name="MaxV">The control voltage at setting 1, V.</param>
public sealed record ControlVoltageDuty(double MinV, double MaxV) : DutyControl;
