namespace PartsOpt.Topologies;

/// <summary>The PWM generator topologies PartsOpt analyses.</summary>
public enum TopologyKind
{
    /// <summary>Relaxation oscillator → inverting integrator with shunt → comparator (wire name "three-stage").</summary>
    ThreeStage,

    /// <summary>Non-inverting Schmitt trigger and integrator in one loop → comparator (wire name "loop").</summary>
    Loop,

    /// <summary>Comparator on the relaxation oscillator's own capacitor voltage (wire name "rc-ramp").</summary>
    RcRamp,
}

/// <summary>The stable wire names of <see cref="TopologyKind"/> used by the API and stored designs.</summary>
public static class TopologyNames
{
    /// <summary>Wire name of <see cref="TopologyKind.ThreeStage"/>.</summary>
    public const string ThreeStage = "three-stage";

    /// <summary>Wire name of <see cref="TopologyKind.Loop"/>.</summary>
    public const string Loop = "loop";

    /// <summary>Wire name of <see cref="TopologyKind.RcRamp"/>.</summary>
    public const string RcRamp = "rc-ramp";

    /// <summary>Every wire name, in the order of the enum.</summary>
    public static IReadOnlyList<string> All { get; } = [ThreeStage, Loop, RcRamp];

    /// <summary>The wire name of a topology.</summary>
    public static string ToWireName(this TopologyKind kind) => kind switch
    {
        TopologyKind.ThreeStage => ThreeStage,
        TopologyKind.Loop => Loop,
        TopologyKind.RcRamp => RcRamp,
        _ => throw new ArgumentOutOfRangeException(nameof(kind), kind, "Unknown topology."),
    };

    /// <summary>Reads a wire name (exact, lower case); false for anything else.</summary>
    public static bool TryParse(string? name, out TopologyKind kind)
    {
        switch (name)
        {
            case ThreeStage: kind = TopologyKind.ThreeStage; return true;
            case Loop: kind = TopologyKind.Loop; return true;
            case RcRamp: kind = TopologyKind.RcRamp; return true;
            default: kind = default; return false;
        }
    }

    /// <summary>Reads a wire name or throws a <see cref="DesignValidationException"/> naming "topology".</summary>
    public static TopologyKind Parse(string? name) =>
        TryParse(name, out var kind)
            ? kind
            : throw new DesignValidationException("topology",
                $"Unknown topology '{name}'; expected one of {string.Join(", ", All)}.");
}
