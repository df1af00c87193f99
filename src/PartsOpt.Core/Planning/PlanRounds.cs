using Google.OrTools.Sat;
using PartsOpt.Search;

namespace PartsOpt.Planning;

/// <summary>
/// The stocking planner's search for the proof (docs/stocking-plans.md, "the method"): every requirement's
/// pool and columns, the cuts its stand-in has learnt, the best plan found and the bound.
/// </summary>
/// <remarks>
/// The line-selection model over the columns, with a stand-in for the designs each incomplete pool left out,
/// is a relaxation: no plan costs less than its optimum. Each round solves it, searches every requirement on
/// the lines its solution holds (the designs found become columns, the best of them a plan, and a stand-in it
/// took learns a cut), proposes a plan from the columns alone when the solve ran out of time, and grows the
/// pools whose stand-in it took. The plan is proved when no relaxed plan costs less.
/// </remarks>
internal sealed class PlanRounds
{
    /// <summary>
    /// Wall time of the model over the columns alone, which only proposes plans (the proof rests on the model
    /// with stand-ins); it starts from the best plan so far.
    /// </summary>
    private static readonly TimeSpan ProposalSolveLimit = TimeSpan.FromSeconds(1);

    /// <summary>A pool whose stand-in the model takes is searched again this many times as large.</summary>
    private const int PoolGrowth = 8;

    private readonly StockingQuestion question;
    private readonly StockingOptions options;
    private readonly PlanLines lines;
    private readonly SearchOptions searchOptions;
    private readonly CancellationToken cancellation;
    private readonly IReadOnlyList<YearlyRequirement> requirements;
    private readonly List<int> units;
    private readonly List<DesignColumn>[] columns;
    private readonly HashSet<string> keys = new(StringComparer.Ordinal);
    private readonly List<StandInCut>[] cuts;
    private readonly List<UnmetRequirement> unmet = [];
    private readonly Stock all;
    private bool provable;

    public PlanRounds(StockingQuestion question, StockingOptions options, PlanLines lines, SearchOptions searchOptions, CancellationToken cancellation)
    {
        (this.question, this.options, this.lines, this.searchOptions, this.cancellation) = (question, options, lines, searchOptions, cancellation);
        requirements = question.Requirements;
        units = requirements.Select(r => r.UnitsPerYear).ToList();
        columns = requirements.Select(_ => new List<DesignColumn>()).ToArray();
        cuts = requirements.Select(_ => new List<StandInCut>()).ToArray();
        Pools = new DesignPool?[requirements.Count];
        all = lines.All;
    }

    /// <summary>Per requirement, its pool (null when the search found no design).</summary>
    public DesignPool?[] Pools { get; }

    /// <summary>Requirements the pools' searches found no design for.</summary>
    public IReadOnlyList<UnmetRequirement> UnmetRequirements => unmet;

    /// <summary>The cheapest plan found so far.</summary>
    public Candidate? Best { get; private set; }

    /// <summary>No plan costs less (CP-SAT's bound of the model with stand-ins); null until one is proved.</summary>
    public decimal? Bound { get; private set; }

    /// <summary>The last solve of the model with stand-ins.</summary>
    public LineSelection? Selection { get; private set; }

    /// <summary>Rounds run.</summary>
    public int Count { get; private set; }

    /// <summary>The best plan costs no more than the bound.</summary>
    public bool Proved { get; private set; }

    /// <summary>The rounds stopped with nothing new to learn.</summary>
    public bool Stalled { get; private set; }

    /// <summary>
    /// Searches every requirement's pool, then runs rounds until the plan is proved, a round learns nothing, the
    /// rounds run out or the planner is cancelled.
    /// </summary>
    public void Run()
    {
        SearchPools();
        while (columns.Any(c => c.Count > 0) && !cancellation.IsCancellationRequested && Count < options.MaxRefinementRounds)
        {
            Count++;
            var standIns = Pools.Select((p, r) => p is { Complete: false, Floor: { } floor } ? new StandIn(floor, cuts[r].ToList()) : null).ToList();
            var selection = Selection = LineSelectionModel.Solve(columns, units, lines, question.HoldingCostPerLine, question.KeepExisting,
                options.EffectiveSolverTimeLimit, options.Seed, cancellation, standIns);
            if (provable && !selection.Rounded && selection.Bound is { } least)
                Bound = Math.Max(Bound ?? least, least);
            if (Proved = Settled())
                return;
            if (!selection.Found)
            {
                Stalled = true;
                return;
            }
            var progress = Refine(selection, standIns);
            if (Proved = Settled())
                return;
            // When the solve ran out of time its plan may be far from the best there is: a proposal from the
            // columns alone, starting at the best plan, may find a cheaper one for an answer cut short. (Solved to
            // the end, its plan is refined already, and the next round's model holds more.)
            if (selection.Status != CpSolverStatus.Optimal)
            {
                var limit = options.EffectiveSolverTimeLimit < ProposalSolveLimit ? options.EffectiveSolverTimeLimit : ProposalSolveLimit;
                var proposal = LineSelectionModel.Solve(columns, units, lines, question.HoldingCostPerLine, question.KeepExisting,
                    limit, options.Seed, cancellation, hint: Best!.Lines);
                if (proposal.Found)
                    progress |= Refine(proposal, null);
                if (Proved = Settled())
                    return;
            }
            progress |= Grow(selection, standIns);
            if (!progress)
            {
                Stalled = true;
                return;
            }
        }
    }

    /// <summary>Every requirement's pool: its cheapest designs over every line that could be held.</summary>
    private void SearchPools()
    {
        var decided = true;
        for (var r = 0; r < requirements.Count; r++)
        {
            var pool = DesignPool.Search(requirements[r].Requirement, all, options.PoolSize, searchOptions, cancellation);
            if (pool.Outcome.Designs.Count == 0)
            {
                unmet.Add(Unmet.Of(requirements[r].Name, pool.Outcome));
                decided &= pool.Outcome.Status == SearchStatus.Infeasible;
                continue;
            }
            Pools[r] = pool;
            AddColumns(r, pool.Outcome);
        }
        provable = decided && Pools.All(p => p is null || p.Complete || p.Floor is not null);
    }

    // The best plan costs no more than the bound: no plan costs less.
    private bool Settled() => Bound is { } least && Best is not null && Best.YearlyCost <= least;

    /// <summary>
    /// Pools whose stand-in the model took grow: their floor rises and fewer designs are left out. Not when the
    /// stand-in is tied with a column on the lines the solution holds: it lowered nothing.
    /// </summary>
    private bool Grow(LineSelection selection, List<StandIn?> standIns)
    {
        var progress = false;
        for (var r = 0; r < requirements.Count; r++)
            if (selection.TookStandIn[r] && !standIns[r]!.TiedOn(columns[r], selection.Held) && Pools[r] is { } pool && pool.Size < options.MaxPoolSize && pool.Outcome.Status == SearchStatus.Optimal)
            {
                Pools[r] = DesignPool.Search(requirements[r].Requirement, all, Math.Min(PoolGrowth * pool.Size, options.MaxPoolSize), searchOptions, cancellation);
                progress |= AddColumns(r, Pools[r]!.Outcome);
                provable &= Pools[r]!.Outcome.Status == SearchStatus.Optimal;
            }
        return progress;
    }

    /// <summary>
    /// Searches every requirement on the lines a solution holds: the designs found become columns and the best
    /// of them (or the chosen column, when the search found nothing as cheap) make a plan. A stand-in the
    /// solution took is replaced by the design found there, or by the column that adds the least holding; and
    /// when the search listed every design there up to more than the stand-in's price, that is a cut.
    /// </summary>
    private bool Refine(LineSelection solution, List<StandIn?>? standIns)
    {
        var held = solution.Held;
        var stock = lines.StockOf(held);
        var entries = new Entry?[requirements.Count];
        var progress = false;
        for (var r = 0; r < requirements.Count; r++)
        {
            var tookStandIn = solution.TookStandIn.Count > 0 && solution.TookStandIn[r];
            if (solution.Chosen[r] is null && !tookStandIn)
                continue;
            var searched = requirements[r].Requirement with { MaxResults = options.RefinementResults };
            var outcome = DesignSearch.Run(searched, stock, searchOptions, cancellation);
            progress |= AddColumns(r, outcome);
            var top = outcome.Designs.Count > 0 ? Entry.Of(outcome.Designs[0], lines) : null;
            if (solution.Chosen[r] is { } chosen)
            {
                entries[r] = top is not null && top.PerBoard <= chosen.PerBoard ? top : Entry.Of(chosen);
                continue;
            }
            entries[r] = Cheapest(r, top, held);
            if (outcome.Status is not (SearchStatus.Optimal or SearchStatus.Infeasible))
                continue;
            decimal? listed = outcome.Designs.Count < searched.MaxResults ? null : outcome.Designs[searched.MaxResults - 1].Cost.PerBoard;
            if (listed is null || listed > standIns![r]!.PriceOn(held))
            {
                cuts[r].Add(new StandInCut(held, listed));
                progress = true;
            }
        }
        var plan = Candidate.Of(entries, units, lines, question);
        if (Best is null || plan.YearlyCost < Best.YearlyCost)
            Best = plan;
        return progress;
    }

    /// <summary>
    /// A stand-in's place in a plan on the held lines: the design found there, or the column that costs the year
    /// least with the holding of the lines it adds (when none was found, or that costs less).
    /// </summary>
    private Entry Cheapest(int r, Entry? found, IReadOnlyList<int> held)
    {
        decimal Year(decimal perBoard, IEnumerable<int> used) => units[r] * perBoard + question.HoldingCostPerLine * used.Count(l => !held.Contains(l));
        var column = columns[r].MinBy(c => Year(c.PerBoard, c.Lines))!;
        return found is not null && Year(found.PerBoard, found.Lines) <= Year(column.PerBoard, column.Lines) ? found : Entry.Of(column);
    }

    private bool AddColumns(int r, SearchOutcome outcome)
    {
        var added = false;
        foreach (var design in outcome.Designs)
            foreach (var column in DesignColumn.Of(r, design, requirements[r].Requirement, lines))
                if (keys.Add(column.Key))
                {
                    columns[r].Add(column);
                    added = true;
                }
        return added;
    }

    /// <summary>
    /// How one requirement is met in a plan: the design, its cost per board, the lines it uses, and the
    /// decoupler of a column whose design lists another.
    /// </summary>
    public sealed record Entry(FoundDesign Design, decimal PerBoard, IReadOnlyList<int> Lines, int? Decoupler)
    {
        /// <summary>A design the search found on the plan's lines: its BOM is what it uses.</summary>
        public static Entry Of(FoundDesign design, PlanLines lines) =>
            new(design, design.Cost.PerBoard, design.Bom.Select(b => lines.Index[b.PartNumber]).Distinct().Order().ToList(), null);

        /// <summary>A column: its design with the column's decoupler, at the column's cost.</summary>
        public static Entry Of(DesignColumn column) => new(column.Source, column.PerBoard, column.Lines, column.Decoupler);
    }

    /// <summary>A plan: an entry per requirement met, the lines held (today's too when kept) and its yearly cost.</summary>
    public sealed record Candidate(IReadOnlyList<Entry?> Entries, IReadOnlyList<int> Lines, decimal YearlyCost)
    {
        public static Candidate Of(Entry?[] entries, List<int> units, PlanLines lines, StockingQuestion question)
        {
            var held = entries.Where(e => e is not null).SelectMany(e => e!.Lines)
                .Concat(question.KeepExisting ? lines.ExistingLines : []).Distinct().Order().ToList();
            var yearly = question.HoldingCostPerLine * held.Count + entries.Select((e, r) => e is null ? 0 : units[r] * e.PerBoard).Sum();
            return new Candidate(entries, held, yearly);
        }
    }
}
