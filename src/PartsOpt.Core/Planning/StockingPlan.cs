using PartsOpt.Search;
using PartsOpt.Topologies;

namespace PartsOpt.Planning;

/// <summary>What a stocked line is.</summary>
public enum LineKind
{
    /// <summary>A resistor.</summary>
    Resistor,

    /// <summary>A capacitor.</summary>
    Capacitor,

    /// <summary>A potentiometer.</summary>
    Potentiometer,

    /// <summary>An op-amp or comparator.</summary>
    OpAmp,
}

/// <summary>How far the plan's optimality goes.</summary>
public enum PlanOptimality
{
    /// <summary>Proved: no cheaper plan exists (the model was solved to optimality over every feasible design of
    /// every requirement).</summary>
    Proved,

    /// <summary>The best plan over the designs examined: a cheaper one may exist.</summary>
    BestFound,

    /// <summary>No plan: time ran out before the model gave one, or no requirement can be met.</summary>
    None,
}

/// <summary>One line the plan holds.</summary>
/// <param name="PartNumber">Stock part number.</param>
/// <param name="Kind">Resistor, capacitor, potentiometer or op-amp.</param>
/// <param name="Value">Nominal value, Ω or F; null for op-amps.</param>
/// <param name="Series">The smallest IEC 60063 series holding the value ("E24"); null for op-amps and values in none.</param>
/// <param name="Tolerance">Tolerance, fraction; null for op-amps.</param>
/// <param name="UnitCost">Cost of one piece.</param>
/// <param name="Existing">True for a line of today's stock, false for one to add.</param>
/// <param name="UsedBy">The requirements whose designs use it (why it is needed); empty for a kept line nothing uses.</param>
public sealed record PlannedLine(string PartNumber, LineKind Kind, double? Value, string? Series, double? Tolerance,
    decimal UnitCost, bool Existing, IReadOnlyList<string> UsedBy);

/// <summary>The design that meets one requirement from the plan's lines.</summary>
/// <param name="Requirement">The requirement's name.</param>
/// <param name="UnitsPerYear">Boards a year.</param>
/// <param name="Design">The design (roles, parts, BOM, analysis).</param>
/// <param name="PerBoard">Its cost per board.</param>
/// <param name="YearlyCost">Units a year × cost per board.</param>
/// <param name="Lines">The part numbers it uses.</param>
public sealed record PlannedDesign(string Requirement, int UnitsPerYear, FoundDesign Design, decimal PerBoard, decimal YearlyCost,
    IReadOnlyList<string> Lines);

/// <summary>A requirement that cannot be met, and why.</summary>
/// <param name="Requirement">The requirement's name.</param>
/// <param name="Status">Infeasible (proved) or unknown (time ran out).</param>
/// <param name="Reason">What blocked each topology, in the search's words.</param>
public sealed record UnmetRequirement(string Requirement, SearchStatus Status, string Reason);

/// <summary>One requirement against today's lines, unchanged.</summary>
/// <param name="Requirement">The requirement's name.</param>
/// <param name="Status">The search's status on today's lines.</param>
/// <param name="PerBoard">Cost per board of the best design; null when none was found.</param>
public sealed record TodayDesign(string Requirement, SearchStatus Status, decimal? PerBoard);

/// <summary>What keeping today's lines unchanged (replenished, none added or dropped) costs a year.</summary>
/// <param name="YearlyCost">Σ units a year × cost per board over the requirements today's lines meet + holding × today's lines.</param>
/// <param name="Designs">Per requirement, the best design's cost or why there is none.</param>
/// <param name="Unmet">The requirements today's lines cannot meet (their cost is not in <paramref name="YearlyCost"/>).</param>
public sealed record TodayStock(decimal YearlyCost, IReadOnlyList<TodayDesign> Designs, IReadOnlyList<UnmetRequirement> Unmet);

/// <summary>The answer to "which values should we stock?".</summary>
/// <param name="Optimality">Proved, best found, or none.</param>
/// <param name="OptimalityText">The same in words: "proved", or "best over N candidate designs per requirement".</param>
/// <param name="Lines">The lines the plan holds: today's kept and the ones to add.</param>
/// <param name="Dropped">Today's lines the plan lets go (only when today's lines need not be kept).</param>
/// <param name="Designs">The design that meets each requirement the plan covers.</param>
/// <param name="Unmet">Requirements no candidate line set can meet, named with the search's reason.</param>
/// <param name="YearlyCost">Σ units a year × cost per board + <paramref name="YearlyHoldingCost"/>.</param>
/// <param name="YearlyHoldingCost">Holding cost per line × every line in the plan (today's kept lines included).</param>
/// <param name="Today">Today's lines unchanged, for comparison.</param>
/// <param name="SolverStatus">CP-SAT's status on the last solve of the line-selection model.</param>
/// <param name="Rounds">Solves of the line-selection model (the refinement loop's rounds).</param>
/// <param name="CandidateDesigns">Candidate designs per requirement (columns of the model, decoupler variants counted).</param>
/// <param name="Elapsed">Wall time.</param>
/// <param name="Notes">Anything that qualifies the answer.</param>
public sealed record StockingPlan(
    PlanOptimality Optimality,
    string OptimalityText,
    IReadOnlyList<PlannedLine> Lines,
    IReadOnlyList<string> Dropped,
    IReadOnlyList<PlannedDesign> Designs,
    IReadOnlyList<UnmetRequirement> Unmet,
    decimal YearlyCost,
    decimal YearlyHoldingCost,
    TodayStock Today,
    string SolverStatus,
    int Rounds,
    IReadOnlyDictionary<string, int> CandidateDesigns,
    TimeSpan Elapsed,
    IReadOnlyList<string> Notes)
{
    /// <summary>No plan costs less a year than this (equal to <see cref="YearlyCost"/> when proved): the best bound the
    /// line-selection model with stand-ins gave; null when it gave none (see docs/stocking-plans.md, "proof").</summary>
    public decimal? LowerBound { get; init; }

    /// <summary>Cost a year of the plan less that of today's lines (negative: the plan saves); comparable only
    /// when both meet the same requirements.</summary>
    public decimal ChangeAgainstToday => YearlyCost - Today.YearlyCost;
}

/// <summary>Where a requirement's reason for failing comes from.</summary>
internal static class Unmet
{
    public static UnmetRequirement Of(string name, SearchOutcome outcome) => new(name, outcome.Status,
        outcome.Topologies.Any(t => !t.Feasible)
            ? string.Join(" ", outcome.Topologies.Where(t => !t.Feasible)
                .Select(t => $"{t.Topology.ToWireName()}: {t.Blocking ?? (t.Proved ? "no design." : "not decided in time.")}"))
            : string.Join(" ", outcome.Notes));
}
