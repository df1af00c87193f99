using PartsOpt.Topologies;

namespace PartsOpt.Search;

/// <summary>A target value and the fraction either side of it a design may land on.</summary>
/// <param name="Target">Target value, SI units.</param>
/// <param name="Tolerance">Allowed relative deviation, fraction (0.05 for ±5 %).</param>
public sealed record Band(double Target, double Tolerance)
{
    /// <summary>Lowest value inside the band.</summary>
    public double Min => Target * (1 - Tolerance);

    /// <summary>Highest value inside the band.</summary>
    public double Max => Target * (1 + Tolerance);

    /// <summary>True when <paramref name="value"/> lies inside the band (edges included).</summary>
    public bool Contains(double value) => value >= Min && value <= Max;
}

/// <summary>How the duty cycle is adjusted on the finished board.</summary>
public enum DutyAdjust
{
    /// <summary>A potentiometer in the threshold divider (roles cmp.ra, cmp.pot, cmp.rb).</summary>
    Potentiometer,

    /// <summary>An external control voltage on the comparator.</summary>
    ControlVoltage,
}

/// <summary>
/// The duty range the adjustment must cover: duty at setting 0 and at setting 1 must reach past
/// <paramref name="Min"/> and <paramref name="Max"/>.
/// </summary>
/// <param name="Min">Lowest duty the user must be able to set, fraction.</param>
/// <param name="Max">Highest duty the user must be able to set, fraction.</param>
/// <param name="Adjust">Potentiometer or control voltage.</param>
/// <param name="ControlMinV">Control voltage at setting 0 (absolute, V); control voltage only.</param>
/// <param name="ControlMaxV">Control voltage at setting 1 (absolute, V); control voltage only.</param>
public sealed record DutyRequirement(double Min, double Max, DutyAdjust Adjust = DutyAdjust.Potentiometer,
    double ControlMinV = 0, double ControlMaxV = 0)
{
    /// <summary>The engine's duty control for this requirement.</summary>
    public DutyControl ToDutyControl() => Adjust == DutyAdjust.Potentiometer
        ? DutyControl.Potentiometer
        : DutyControl.ControlVoltage(ControlMinV, ControlMaxV);
}

/// <summary>Output levels the PWM output must reach (absolute, V).</summary>
/// <param name="MinHighV">The high level must be at least this.</param>
/// <param name="MaxLowV">The low level must be at most this.</param>
public sealed record OutputRequirement(double MinHighV, double MaxLowV);

/// <summary>How a yield target is judged.</summary>
public enum YieldMethod
{
    /// <summary>Every part at its tolerance limits together.</summary>
    WorstCase,

    /// <summary>Random samples inside the tolerances.</summary>
    MonteCarlo,
}

/// <summary>The fraction of boards that must meet the bands when part values spread.</summary>
/// <param name="Target">Required fraction, e.g. 0.99.</param>
/// <param name="Method">Worst case or Monte Carlo.</param>
/// <param name="Samples">Monte Carlo samples (default 2000).</param>
public sealed record YieldRequirement(double Target, YieldMethod Method = YieldMethod.WorstCase, int Samples = 2000);

/// <summary>
/// What the team wants built: "a 20 kHz PWM generator, duty adjustable 5–95 %, 100 units".
/// </summary>
/// <param name="Supply">The rails; a 0 V negative rail is a single supply (mid-rail reference roles needed).</param>
/// <param name="Frequency">Target frequency, Hz, and its tolerance.</param>
/// <param name="Duty">Duty range the adjustment must cover.</param>
/// <param name="BuildQuantity">Boards to build; stock must cover all of them.</param>
public sealed record SearchRequirement(Supply Supply, Band Frequency, DutyRequirement Duty, int BuildQuantity)
{
    /// <summary>Triangle (ramp) peak-to-peak target, V; null when any amplitude will do.</summary>
    public Band? TrianglePeakToPeak { get; init; }

    /// <summary>Output levels; null when any will do.</summary>
    public OutputRequirement? Output { get; init; }

    /// <summary>Topologies to consider; null or empty for all three.</summary>
    public IReadOnlyList<TopologyKind>? Topologies { get; init; }

    /// <summary>Yield target; null for nominal designs only. Judged by <see cref="ToleranceYieldCheck"/> unless
    /// <see cref="SearchOptions.YieldCheck"/> supplies another <see cref="IYieldCheck"/>.</summary>
    public YieldRequirement? Yield { get; init; }

    /// <summary>Ambient range the board must work over, folded into the yield check; null for 25 °C alone.</summary>
    public Analysis.TemperatureRange? Temperature { get; init; }

    /// <summary>Let a resistor or capacitor role take two stocked parts in series or parallel.</summary>
    public bool AllowCombinations { get; init; }

    /// <summary>Placement and line-item charges (defaults: <see cref="CostModel.Default"/>).</summary>
    public CostModel Costs { get; init; } = CostModel.Default;

    /// <summary>Designs to return at most (default 10); the best of each feasible topology is always included.</summary>
    public int MaxResults { get; init; } = 10;

    /// <summary>The topologies to search, in enum order.</summary>
    public IReadOnlyList<TopologyKind> TopologiesToSearch() =>
        Topologies is { Count: > 0 } chosen ? chosen.Distinct().Order().ToList() : Enum.GetValues<TopologyKind>();
}
