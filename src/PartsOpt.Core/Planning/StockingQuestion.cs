using PartsOpt.Search;

namespace PartsOpt.Planning;

/// <summary>One product the team builds through the year: what it must meet, and how many a year.</summary>
/// <param name="Name">The requirement's name, unique in the question (it names the requirement in the answer).</param>
/// <param name="Requirement">What to build, as for <see cref="DesignSearch.Run"/>; its build quantity is the lot size
/// that spreads the line-item setup charge.</param>
/// <param name="UnitsPerYear">Boards built a year (above 0): the weight of this requirement's cost per board.</param>
public sealed record YearlyRequirement(string Name, SearchRequirement Requirement, int UnitsPerYear);

/// <summary>
/// "Which values should we stock?": the products of the year, the stock today, the lines that could be
/// added, and what holding one more line costs.
/// </summary>
/// <param name="Requirements">The products, at least one.</param>
/// <param name="Existing">Today's stock lines.</param>
/// <param name="Candidates">Lines that could be added (part numbers distinct from today's).</param>
/// <param name="HoldingCostPerLine">Cost of holding one stocked line item for a year (≥ 0).</param>
/// <param name="KeepExisting">True: every line of today's stock stays; false: the plan may drop lines nothing uses.</param>
public sealed record StockingQuestion(
    IReadOnlyList<YearlyRequirement> Requirements,
    Stock Existing,
    Stock Candidates,
    decimal HoldingCostPerLine,
    bool KeepExisting);

/// <summary>How hard the planner works.</summary>
/// <param name="PoolSize">Designs first asked of each requirement's search over the whole candidate stock (default 40):
/// its pool of candidate designs. A pool is complete when the search proves it holds every feasible design.</param>
/// <param name="MaxPoolSize">The pool of a requirement whose stand-in the bound's model takes (and is not tied with a
/// column) is searched again eight times as large, up to this size (default 1280; docs/stocking-plans.md, "the method").</param>
/// <param name="SearchTimeLimit">Wall time of one design search (default 30 s).</param>
/// <param name="SolverTimeLimit">Wall time of one solve of the line-selection model (default 30 s).</param>
/// <param name="MaxRefinementRounds">Most rounds of the model and its searches on the lines it holds (default 20).</param>
/// <param name="RefinementResults">Designs asked of each search on the lines a round holds (default 10).</param>
/// <param name="Seed">CP-SAT random seed (default 1).</param>
public sealed record StockingOptions(
    int PoolSize = 40,
    int MaxPoolSize = 1280,
    TimeSpan? SearchTimeLimit = null,
    TimeSpan? SolverTimeLimit = null,
    int MaxRefinementRounds = 20,
    int RefinementResults = 10,
    int Seed = 1)
{
    /// <summary>The search time limit in force.</summary>
    public TimeSpan EffectiveSearchTimeLimit => SearchTimeLimit ?? TimeSpan.FromSeconds(30);

    /// <summary>The solver time limit in force.</summary>
    public TimeSpan EffectiveSolverTimeLimit => SolverTimeLimit ?? TimeSpan.FromSeconds(30);
}
