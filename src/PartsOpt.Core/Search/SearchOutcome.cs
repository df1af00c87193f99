using PartsOpt.Topologies;

namespace PartsOpt.Search;

/// <summary>How a search ended.</summary>
public enum SearchStatus
{
    /// <summary>Designs found, and the solver proved none cheaper exists (nor any cheaper tie left out).</summary>
    Optimal,

    /// <summary>Designs found, but time ran out (or the search was cancelled) before optimality was proved.</summary>
    Feasible,

    /// <summary>Proved: no design from this stock meets the requirement.</summary>
    Infeasible,

    /// <summary>No design found, and time ran out (or the search was cancelled) before infeasibility was proved.</summary>
    Unknown,
}

/// <summary>How the search walks the choices.</summary>
public enum SearchMethod
{
    /// <summary>
    /// Exact branch and bound over the roles (the default): cost bounds with line items, log-space bounds,
    /// the engine on partial designs and on every leaf.
    /// </summary>
    BranchAndBound,

    /// <summary>
    /// CP-SAT selection models with a lazy loop: the engine judges each solution and cuts off the failures.
    /// Slower on real stockrooms; kept as an independent second search for cross-checks.
    /// </summary>
    SelectionModel,
}

/// <summary>How to tune the search itself.</summary>
/// <param name="TimeLimit">Wall time for the whole search (default 30 s).</param>
/// <param name="Seed">CP-SAT random seed (default 1). Results do not depend on it when the search completes.</param>
/// <param name="YieldCheck">The yield post-check when the requirement asks for a yield; null for
/// <see cref="ToleranceYieldCheck"/> (extreme-value corners or Monte Carlo from the tolerance analyses).</param>
/// <param name="Method">How the search walks the choices (default: branch and bound).</param>
public sealed record SearchOptions(TimeSpan? TimeLimit = null, int Seed = 1, IYieldCheck? YieldCheck = null,
    SearchMethod Method = SearchMethod.BranchAndBound)
{
    /// <summary>The time limit in force.</summary>
    public TimeSpan EffectiveTimeLimit => TimeLimit ?? TimeSpan.FromSeconds(30);
}

/// <summary>One line of a design's bill of materials.</summary>
/// <param name="PartNumber">Stock part number.</param>
/// <param name="Uses">Where it goes: role names, "decoupling" or the op-amp function.</param>
/// <param name="PerBoard">Pieces per board.</param>
/// <param name="UnitCost">Cost of one piece.</param>
/// <param name="ForBuild">Pieces for the whole build.</param>
/// <param name="Available">Pieces on hand less reserved.</param>
public sealed record BomLine(string PartNumber, IReadOnlyList<string> Uses, int PerBoard, decimal UnitCost, int ForBuild, int Available);

/// <summary>A design the search found, with the engine's analysis of it and its bill of materials.</summary>
/// <param name="Rank">1 for the cheapest.</param>
/// <param name="Design">The circuit, ready for <see cref="CircuitAnalysis.Analyse(CircuitDesign, int)"/>.</param>
/// <param name="Evaluation">The engine's analysis (figures, checks, designators, sections).</param>
/// <param name="RoleParts">Stock part number(s) in each role; two for a series or parallel combination.</param>
/// <param name="Bom">Bill of materials, decoupling and op-amp packages included.</param>
/// <param name="Cost">Cost per board and its parts.</param>
/// <param name="FrequencyError">|f − target| / target of the nominal design.</param>
/// <param name="Margin">Smallest slack of a banded figure, relative (the second tie-break).</param>
/// <param name="Notes">Decoupling, unused sections and how they are tied off, combinations.</param>
/// <param name="BestOfTopology">True when no cheaper design of this topology exists in the list.</param>
public sealed record FoundDesign(
    int Rank,
    CircuitDesign Design,
    CircuitEvaluation Evaluation,
    IReadOnlyDictionary<string, IReadOnlyList<string>> RoleParts,
    IReadOnlyList<BomLine> Bom,
    DesignCost Cost,
    double FrequencyError,
    double Margin,
    IReadOnlyList<string> Notes,
    bool BestOfTopology)
{
    /// <summary>The topology of the design.</summary>
    public TopologyKind Topology => Design.Topology;
}

/// <summary>The closest a topology came when it has no feasible design.</summary>
/// <param name="RoleParts">The parts of the nearest design found.</param>
/// <param name="Figures">Its figures by name.</param>
/// <param name="Misses">What it missed and by how much, in a designer's words.</param>
public sealed record NearMiss(
    IReadOnlyDictionary<string, string> RoleParts,
    IReadOnlyDictionary<string, double?> Figures,
    IReadOnlyList<string> Misses);

/// <summary>One value to buy that would bring a topology's nearest design into its frequency band.</summary>
/// <param name="Role">The role the new part fills.</param>
/// <param name="Kind">Resistor or capacitor.</param>
/// <param name="Value">Nominal value, Ω or F, from <paramref name="Series"/>.</param>
/// <param name="Series">The preferred-number series the value comes from ("E24" resistors, "E12" capacitors).</param>
/// <param name="Explanation">What it achieves and what would still be missing, in a designer's words.</param>
public sealed record PurchaseSuggestion(string Role, RoleKind Kind, double Value, string Series, string Explanation);

/// <summary>What the search found for one topology.</summary>
/// <param name="Topology">The topology.</param>
/// <param name="Feasible">True when at least one design of this topology was found.</param>
/// <param name="Proved">True when the answer for this topology is proved (optimal or infeasible).</param>
/// <param name="Blocking">Why nothing fits, in a designer's words; null when feasible.</param>
/// <param name="Nearest">The nearest miss; null when feasible or when no candidate got as far as the engine.</param>
/// <param name="Purchase">One value to buy that brings the nearest design's frequency into its band, if one
/// was found cheaply; null otherwise (see <paramref name="PurchaseNote"/>).</param>
/// <param name="PurchaseNote">Why no purchase is suggested, when none is.</param>
public sealed record TopologyReport(
    TopologyKind Topology,
    bool Feasible,
    bool Proved,
    string? Blocking,
    NearMiss? Nearest,
    PurchaseSuggestion? Purchase,
    string? PurchaseNote = null);

/// <summary>The answer to "what can we build from the stockroom, and what is cheapest?".</summary>
/// <param name="Status">Optimal, feasible (not proved), infeasible or unknown.</param>
/// <param name="Designs">Up to the requested number of designs in rank order, plus the best of every feasible topology.</param>
/// <param name="Topologies">Per topology: feasible or why not.</param>
/// <param name="Solves">The search's units of work: designs the engine judged, whole or partial (branch and
/// bound), or CP-SAT solves (selection model).</param>
/// <param name="Elapsed">Wall time taken.</param>
/// <param name="Notes">Anything that qualifies the answer (yield not checked, time limit reached…).</param>
public sealed record SearchOutcome(
    SearchStatus Status,
    IReadOnlyList<FoundDesign> Designs,
    IReadOnlyList<TopologyReport> Topologies,
    int Solves,
    TimeSpan Elapsed,
    IReadOnlyList<string> Notes);
