using System.Diagnostics;
using System.Globalization;
using Google.OrTools.Sat;
using PartsOpt.Search;
using PartsOpt.Topologies;
using PartsOpt.Values;

namespace PartsOpt.Planning;

/// <summary>
/// Chooses which lines to stock so every requirement of the year has a feasible design and the yearly cost
/// (Σ units a year × cost per board + holding cost × lines held) is lowest: candidate designs per
/// requirement from the design search, one CP-SAT model over lines and designs, and a refinement loop that
/// searches again on the chosen lines (docs/stocking-plans.md).
/// </summary>
public static class StockingPlanner
{
    /// <summary>Plans the stock for <paramref name="question"/>.</summary>
    /// <param name="question">Requirements, today's lines, candidate lines, holding cost, keep today's lines or not.</param>
    /// <param name="options">Pool size, time limits, rounds; defaults when null.</param>
    /// <param name="cancellation">Stops the planner; the plan then holds what was found so far and is not proved.</param>
    /// <exception cref="ArgumentException">Names not unique, units a year not above 0, a negative holding cost, a part
    /// number twice, or a requirement the search refuses (the message names it).</exception>
    public static StockingPlan Plan(StockingQuestion question, StockingOptions? options = null, CancellationToken cancellation = default)
    {
        ArgumentNullException.ThrowIfNull(question);
        options ??= new StockingOptions();
        Validate(question, options);
        var clock = Stopwatch.StartNew();
        var lines = new PlanLines(question);
        var requirements = question.Requirements;
        var searchOptions = new SearchOptions(options.EffectiveSearchTimeLimit, options.Seed);
        var notes = new List<string>();

        // Pools: every requirement's cheapest designs over every line that could be held.
        var all = lines.All;
        var columns = requirements.Select(_ => new List<DesignColumn>()).ToList();
        var keys = new HashSet<string>(StringComparer.Ordinal);
        var pools = new DesignPool?[requirements.Count];
        var unmet = new List<UnmetRequirement>();
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
            pools[r] = pool;
            AddColumns(r, pool.Outcome);
        }

        var units = requirements.Select(r => r.UnitsPerYear).ToList();
        // Proof (docs/stocking-plans.md): the line-selection model over the columns, with a stand-in for the
        // designs each incomplete pool left out, is a relaxation: no plan costs less than its optimum. Each
        // round solves it, searches every requirement on the lines its solution holds (the designs found
        // become columns, the best of them a plan, and a stand-in it took learns a cut), proposes a plan from
        // the columns alone when the solve ran out of time, and grows the pools whose stand-in it took. The
        // plan is proved when no relaxed plan costs less.
        var provable = decided && pools.All(p => p is null || p.Complete || p.Floor is not null);
        var cuts = requirements.Select(_ => new List<StandInCut>()).ToList();
        LineSelection? selection = null;
        Candidate? best = null;
        decimal? bound = null;
        var rounds = 0;
        var proved = false;
        var stalled = false;
        while (columns.Any(c => c.Count > 0) && !cancellation.IsCancellationRequested && rounds < options.MaxRefinementRounds)
        {
            rounds++;
            var standIns = pools.Select((p, r) => p is { Complete: false, Floor: { } floor } ? new StandIn(floor, cuts[r].ToList()) : null).ToList();
            selection = LineSelectionModel.Solve(columns, units, lines, question.HoldingCostPerLine, question.KeepExisting,
                options.EffectiveSolverTimeLimit, options.Seed, cancellation, standIns);
            if (provable && !selection.Rounded && selection.Bound is { } least)
                bound = Math.Max(bound ?? least, least);
            if (proved = Settled())
                break;
            if (!selection.Found)
            {
                stalled = true;
                break;
            }
            var progress = Refine(selection, standIns);
            if (proved = Settled())
                break;
            // When the solve ran out of time its plan may be far from the best there is: a proposal from the
            // columns alone, starting at the best plan, may find a cheaper one for an answer cut short. (Solved to
            // the end, its plan is refined already, and the next round's model holds more.)
            if (selection.Status != CpSolverStatus.Optimal)
            {
                var proposal = LineSelectionModel.Solve(columns, units, lines, question.HoldingCostPerLine, question.KeepExisting,
                    Min(options.EffectiveSolverTimeLimit, ProposalSolveLimit), options.Seed, cancellation, hint: best!.Lines);
                if (proposal.Found)
                    progress |= Refine(proposal, null);
                if (proved = Settled())
                    break;
            }
            // Pools whose stand-in the model took grow: their floor rises and fewer designs are left out. Not
            // when the stand-in is tied with a column on the lines the solution holds: it lowered nothing.
            for (var r = 0; r < requirements.Count; r++)
                if (selection.TookStandIn[r] && !standIns[r]!.TiedOn(columns[r], selection.Held) && pools[r] is { } pool && pool.Size < options.MaxPoolSize && pool.Outcome.Status == SearchStatus.Optimal)
                {
                    pools[r] = DesignPool.Search(requirements[r].Requirement, all, Math.Min(PoolGrowth * pool.Size, options.MaxPoolSize), searchOptions, cancellation);
                    progress |= AddColumns(r, pools[r]!.Outcome);
                    provable &= pools[r]!.Outcome.Status == SearchStatus.Optimal;
                }
            if (!progress)
            {
                stalled = true;
                break;
            }
        }

        // The best plan costs no more than the bound: no plan costs less.
        bool Settled() => bound is { } least && best is not null && best.YearlyCost <= least;

        // Searches every requirement on the lines a solution holds: the designs found become columns and the
        // best of them (or the chosen column, when the search found nothing as cheap) make a plan. A stand-in
        // the solution took is replaced by the design found there, or by the column that adds the least holding;
        // and when the search listed every design there up to more than the stand-in's price, that is a cut.
        bool Refine(LineSelection solution, IReadOnlyList<StandIn?>? standIns)
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
            if (best is null || plan.YearlyCost < best.YearlyCost)
                best = plan;
            return progress;
        }

        // A stand-in's place in a plan on the held lines: the design found there, or the column that costs the
        // year least with the holding of the lines it adds (when none was found, or that costs less).
        Entry Cheapest(int r, Entry? found, IReadOnlyList<int> held)
        {
            decimal Year(decimal perBoard, IEnumerable<int> used) => units[r] * perBoard + question.HoldingCostPerLine * used.Count(l => !held.Contains(l));
            var column = columns[r].MinBy(c => Year(c.PerBoard, c.Lines))!;
            return found is not null && Year(found.PerBoard, found.Lines) <= Year(column.PerBoard, column.Lines) ? found : Entry.Of(column);
        }

        var today = Today(question, lines, searchOptions, cancellation);
        var counts = requirements.Select((req, r) => (req.Name, Designs: pools[r]?.Outcome.Designs.Count ?? 0)).ToDictionary(x => x.Name, x => x.Designs, StringComparer.Ordinal);
        if (best is null)
        {
            var reason = selection is null ? "no requirement can be met from the candidate lines" : $"the line-selection model gave no plan ({selection.Status})";
            return new StockingPlan(PlanOptimality.None, reason, [], [], [], unmet, 0, 0, today,
                selection?.Status.ToString() ?? "NotRun", rounds, counts, clock.Elapsed, notes);
        }
        foreach (var (pool, r) in pools.Select((p, r) => (p, r)))
            if (pool is { Outcome.Status: not SearchStatus.Optimal })
                notes.Add($"{requirements[r].Name}: the search of its candidate designs ran out of time; a longer search time limit may find cheaper designs.");
        if (!proved && bound is { } lower)
            notes.Add(Say($"No plan costs less than {lower} a year (the bound of the model with stand-ins after {rounds} round(s)); this one costs {best.YearlyCost}: it is the best found, not proved."));
        else if (!proved)
            notes.Add("No bound was found (a pool search or a solve ran out of time, or a requirement was not decided): the plan is the best found, not proved.");
        if (!proved && stalled)
            notes.Add("The rounds stopped with nothing new to learn (a solve or a search ran out of time).");
        else if (!proved && rounds >= options.MaxRefinementRounds)
            notes.Add(Say($"The rounds ran out ({rounds}) before the bound reached the plan."));
        if (selection?.Rounded == true)
            notes.Add("Some yearly costs have more than six decimals: the model compared them rounded to 1e-6; the costs reported are exact.");

        var designs = new List<PlannedDesign>();
        for (var r = 0; r < requirements.Count; r++)
        {
            if (best.Entries[r] is not { } entry)
                continue;
            var used = entry.Lines.Select(l => lines.PartNumbers[l]).ToList();
            designs.Add(new PlannedDesign(requirements[r].Name, requirements[r].UnitsPerYear, entry.Design, entry.PerBoard,
                requirements[r].UnitsPerYear * entry.PerBoard, used));
            if (entry.Decoupler is { } d && !entry.Design.Bom.Any(b => string.Equals(b.PartNumber, lines.PartNumbers[d], StringComparison.OrdinalIgnoreCase)))
                notes.Add($"{requirements[r].Name}: decouple with {lines.PartNumbers[d]} instead of the capacitor the design lists.");
        }

        var usedBy = designs.SelectMany(d => d.Lines.Select(l => (Line: lines.Index[l], d.Requirement)))
            .GroupBy(x => x.Line).ToDictionary(g => g.Key, g => g.Select(x => x.Requirement).Distinct().ToList());
        var planned = best.Lines.Select(l => Describe(lines, l, usedBy.GetValueOrDefault(l) ?? [])).ToList();
        var dropped = lines.ExistingLines.Where(l => !best.Lines.Contains(l)).Select(l => lines.PartNumbers[l]).ToList();
        var holding = question.HoldingCostPerLine * best.Lines.Count;

        var text = proved ? "proved"
            : Say($"best over {(counts.Count == 0 ? 0 : counts.Values.Max())} candidate designs per requirement");
        if (unmet.Count > 0)
            notes.Add($"Not covered by the plan: {string.Join(", ", unmet.Select(u => u.Requirement))} (see their reasons: proved infeasible from every candidate line, or not decided in time).");
        return new StockingPlan(proved ? PlanOptimality.Proved : PlanOptimality.BestFound, text, planned, dropped, designs, unmet,
            best.YearlyCost, holding, today, proved ? nameof(CpSolverStatus.Optimal) : selection!.Status.ToString(), rounds, counts, clock.Elapsed, notes)
        {
            LowerBound = proved ? best.YearlyCost : bound,
        };

        bool AddColumns(int r, SearchOutcome outcome)
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
    }

    /// <summary>
    /// How one requirement is met in a plan: the design, its cost per board, the lines it uses, and the
    /// decoupler of a column whose design lists another.
    /// </summary>
    private sealed record Entry(FoundDesign Design, decimal PerBoard, IReadOnlyList<int> Lines, int? Decoupler)
    {
        /// <summary>A design the search found on the plan's lines: its BOM is what it uses.</summary>
        public static Entry Of(FoundDesign design, PlanLines lines) =>
            new(design, design.Cost.PerBoard, design.Bom.Select(b => lines.Index[b.PartNumber]).Distinct().Order().ToList(), null);

        /// <summary>A column: its design with the column's decoupler, at the column's cost.</summary>
        public static Entry Of(DesignColumn column) => new(column.Source, column.PerBoard, column.Lines, column.Decoupler);
    }

    /// <summary>A plan: an entry per requirement met, the lines held (today's too when kept) and its yearly cost.</summary>
    private sealed record Candidate(IReadOnlyList<Entry?> Entries, IReadOnlyList<int> Lines, decimal YearlyCost)
    {
        public static Candidate Of(Entry?[] entries, List<int> units, PlanLines lines, StockingQuestion question)
        {
            var held = entries.Where(e => e is not null).SelectMany(e => e!.Lines)
                .Concat(question.KeepExisting ? lines.ExistingLines : []).Distinct().Order().ToList();
            var yearly = question.HoldingCostPerLine * held.Count + entries.Select((e, r) => e is null ? 0 : units[r] * e.PerBoard).Sum();
            return new Candidate(entries, held, yearly);
        }
    }

    /// <summary>
    /// Wall time of the model over the columns alone, which only proposes plans (the proof rests on the model
    /// with stand-ins); it starts from the best plan so far.
    /// </summary>
    private static readonly TimeSpan ProposalSolveLimit = TimeSpan.FromSeconds(1);

    /// <summary>A pool whose stand-in the model takes is searched again this many times as large.</summary>
    private const int PoolGrowth = 8;

    private static TimeSpan Min(TimeSpan a, TimeSpan b) => a < b ? a : b;

    /// <summary>Today's lines unchanged: every requirement searched on them (replenished, none added or dropped).</summary>
    private static TodayStock Today(StockingQuestion question, PlanLines lines, SearchOptions options, CancellationToken cancellation)
    {
        var stock = lines.StockOf(lines.ExistingLines);
        var designs = new List<TodayDesign>();
        var unmet = new List<UnmetRequirement>();
        var yearly = question.HoldingCostPerLine * lines.ExistingLines.Count();
        foreach (var requirement in question.Requirements)
        {
            var outcome = DesignSearch.Run(requirement.Requirement with { MaxResults = 1 }, stock, options, cancellation);
            var best = outcome.Designs.Count > 0 ? outcome.Designs[0].Cost.PerBoard : (decimal?)null;
            designs.Add(new TodayDesign(requirement.Name, outcome.Status, best));
            if (best is { } perBoard)
                yearly += requirement.UnitsPerYear * perBoard;
            else
                unmet.Add(Unmet.Of(requirement.Name, outcome));
        }
        return new TodayStock(yearly, designs, unmet);
    }

    private static PlannedLine Describe(PlanLines lines, int l, IReadOnlyList<string> usedBy)
    {
        if (lines.OpAmp[l] is { } opAmp)
            return new PlannedLine(opAmp.PartNumber, LineKind.OpAmp, null, null, null, opAmp.UnitCost, lines.Existing[l], usedBy);
        var part = lines.Passive[l]!;
        var kind = part.Kind switch
        {
            RoleKind.Capacitor => LineKind.Capacitor,
            RoleKind.Potentiometer => LineKind.Potentiometer,
            _ => LineKind.Resistor,
        };
        return new PlannedLine(part.PartNumber, kind, part.Value, PreferredValues.SmallestSeriesContaining(part.Value)?.ToString(),
            part.Tolerance, part.UnitCost, lines.Existing[l], usedBy);
    }

    private static void Validate(StockingQuestion question, StockingOptions options)
    {
        ArgumentNullException.ThrowIfNull(question.Requirements);
        ArgumentNullException.ThrowIfNull(question.Existing);
        ArgumentNullException.ThrowIfNull(question.Candidates);
        if (question.Requirements.Count == 0)
            Refuse("requirements", "Plan for at least one requirement.");
        var names = new HashSet<string>(StringComparer.Ordinal);
        for (var i = 0; i < question.Requirements.Count; i++)
        {
            var requirement = question.Requirements[i];
            if (!names.Add(requirement.Name))
                Refuse($"requirements[{i}].name", $"'{requirement.Name}' names two requirements.");
            if (requirement.UnitsPerYear < 1)
                Refuse($"requirements[{i}].unitsPerYear", "Build at least one a year.");
        }
        if (question.HoldingCostPerLine < 0)
            Refuse("packageCostPerLine", "The holding cost may not be negative.");
        if (options.PoolSize < 1 || options.RefinementResults < 1 || options.MaxRefinementRounds < 1)
            throw new ArgumentException("Pool size, refinement results and rounds must be at least 1.", nameof(options));
    }

    private static void Refuse(string field, string message) => throw new ArgumentException($"{field}: {message}", field);

    private static string Say(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
