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
        LineSelection? selection = null;
        var confirmed = new FoundDesign?[requirements.Count];
        var rounds = 0;
        var refined = false;
        var bounded = false;
        while (columns.Any(c => c.Count > 0) && !cancellation.IsCancellationRequested)
        {
            rounds++;
            selection = LineSelectionModel.Solve(columns, units, lines, question.HoldingCostPerLine, question.KeepExisting,
                options.EffectiveSolverTimeLimit, options.Seed, cancellation);
            if (!selection.Found)
                break;
            // Refinement: search again on the chosen lines alone; a design cheaper than the chosen one is a
            // column the pool missed. Its best design is also the one reported.
            var stock = lines.StockOf(selection.Lines);
            var improved = false;
            for (var r = 0; r < requirements.Count; r++)
            {
                if (selection.Chosen[r] is not { } chosen)
                    continue;
                var searched = requirements[r].Requirement with { MaxResults = options.RefinementResults };
                var outcome = DesignSearch.Run(searched, stock, searchOptions, cancellation);
                confirmed[r] = outcome.Designs.Count > 0 ? outcome.Designs[0] : null;
                if (confirmed[r] is { } best && best.Cost.PerBoard < chosen.PerBoard)
                    improved |= AddColumns(r, outcome);
            }
            refined = !improved;
            if (rounds >= options.MaxRefinementRounds)
                break;
            if (improved)
                continue;
            if (selection.Status != CpSolverStatus.Optimal || selection.Rounded)
                break;
            // Proof: a plan that used a design left out of a pool would pay at least that pool's floor for its
            // requirement and the cheapest design for every other. Pools whose bound does not clear the plan
            // found are doubled; the plan is proved when every pool is complete or clears it.
            var found = question.HoldingCostPerLine * selection.Lines.Count
                + selection.Chosen.Select((c, r) => c is null ? 0 : units[r] * c.PerBoard).Sum();
            var weak = Enumerable.Range(0, requirements.Count).Where(r => pools[r] is { } pool
                && !pool.Complete && !(LowerBound(r) >= found)).ToList();
            // Sharper: the line-selection model itself, where each weak requirement may also take a stand-in
            // for every design left out of its pool: the pool's floor per board and no line of its own (it
            // may share any line the plan holds). Its optimum bounds every plan that uses a design left out;
            // pools whose stand-in that optimum takes are the ones to grow.
            if (weak.Count > 0 && weak.All(r => pools[r]!.Floor is not null)
                && LineSelectionModel.Solve(WithStandIns(weak), units, lines, question.HoldingCostPerLine, question.KeepExisting,
                    options.EffectiveSolverTimeLimit, options.Seed, cancellation) is { Status: CpSolverStatus.Optimal, Rounded: false } bound)
            {
                var least = question.HoldingCostPerLine * bound.Lines.Count
                    + bound.Chosen.Select((c, r) => c is null ? 0 : units[r] * c.PerBoard).Sum();
                weak = least >= found ? [] : weak.Where(r => bound.Chosen[r] is { Lines.Count: 0 } c && c.PerBoard == pools[r]!.Floor).ToList();
            }
            if (weak.Count == 0)
            {
                bounded = true;
                break;
            }
            var grow = weak.Where(r => pools[r]!.Size < options.MaxPoolSize && pools[r]!.Outcome.Status == SearchStatus.Optimal).ToList();
            if (grow.Count == 0)
                break;
            foreach (var r in grow)
            {
                pools[r] = DesignPool.Search(requirements[r].Requirement, all, Math.Min(2 * pools[r]!.Size, options.MaxPoolSize),
                    searchOptions, cancellation);
                AddColumns(r, pools[r]!.Outcome);
            }
        }

        // The columns with a stand-in for the designs each weak requirement's pool left out (see above); the
        // stand-in carries the pool's last design only as a placeholder, it is never reported.
        List<IReadOnlyList<DesignColumn>> WithStandIns(IReadOnlyList<int> weak) => columns
            .Select((list, r) => weak.Contains(r)
                ? (IReadOnlyList<DesignColumn>)[.. list, new DesignColumn(r, pools[r]!.Outcome.Designs[^1], [], pools[r]!.Floor!.Value, null)]
                : list)
            .ToList();

        decimal? LowerBound(int r)
        {
            if (pools[r]!.Floor is not { } floor)
                return null;
            var forced = question.KeepExisting ? lines.ExistingLines.Count() : 0;
            var bound = question.HoldingCostPerLine * forced + units[r] * floor;
            for (var other = 0; other < requirements.Count; other++)
                if (other != r && pools[other] is { } pool)
                {
                    if (pool.Best is not { } best)
                        return null;
                    bound += units[other] * best;
                }
            return bound;
        }

        var today = Today(question, lines, searchOptions, cancellation);
        var counts = requirements.Select((req, r) => (req.Name, Designs: pools[r]?.Outcome.Designs.Count ?? 0)).ToDictionary(x => x.Name, x => x.Designs, StringComparer.Ordinal);
        if (selection is not { Found: true })
        {
            var reason = selection is null ? "no requirement can be met from the candidate lines" : $"the line-selection model gave no plan ({selection.Status})";
            return new StockingPlan(PlanOptimality.None, reason, [], [], [], unmet, 0, 0, today,
                selection?.Status.ToString() ?? "NotRun", rounds, counts, clock.Elapsed, notes);
        }
        if (!refined)
            notes.Add(Say($"The refinement loop stopped after {rounds} round(s) while still finding cheaper designs: the plan is not proved."));
        foreach (var (pool, r) in pools.Select((p, r) => (p, r)))
            if (pool is { Outcome.Status: not SearchStatus.Optimal })
                notes.Add($"{requirements[r].Name}: the search of its candidate designs ran out of time; a longer search time limit may find cheaper designs.");
        if (refined && !bounded)
            notes.Add("Some requirement has more feasible designs than its pool holds, and a design left out could not be ruled out: the plan is the best found, not proved.");
        if (selection.Rounded)
            notes.Add("Some yearly costs have more than six decimals: the model compared them rounded to 1e-6; the costs reported are exact.");

        var designs = new List<PlannedDesign>();
        for (var r = 0; r < requirements.Count; r++)
        {
            if (selection.Chosen[r] is not { } column)
                continue;
            // The design the search gives on the plan's lines, when it is as cheap as the chosen column (it is
            // unless that search ran out of time); otherwise the chosen column's design.
            var (design, perBoard) = confirmed[r] is { } best && best.Cost.PerBoard <= column.PerBoard
                ? (best, best.Cost.PerBoard)
                : (column.Source, column.PerBoard);
            var used = design == column.Source && confirmed[r] != design
                ? column.Lines.Select(l => lines.PartNumbers[l]).ToList()
                : design.Bom.Select(b => lines.PartNumbers[lines.Index[b.PartNumber]]).ToList();
            designs.Add(new PlannedDesign(requirements[r].Name, requirements[r].UnitsPerYear, design, perBoard,
                requirements[r].UnitsPerYear * perBoard, used));
            if (design == column.Source && confirmed[r] != design && column.Decoupler is { } d
                && !design.Bom.Any(b => string.Equals(b.PartNumber, lines.PartNumbers[d], StringComparison.OrdinalIgnoreCase)))
                notes.Add($"{requirements[r].Name}: decouple with {lines.PartNumbers[d]} instead of the capacitor the design lists.");
        }

        var usedBy = designs.SelectMany(d => d.Lines.Select(l => (Line: lines.Index[l], d.Requirement)))
            .GroupBy(x => x.Line).ToDictionary(g => g.Key, g => g.Select(x => x.Requirement).Distinct().ToList());
        var held = usedBy.Keys.Concat(question.KeepExisting ? lines.ExistingLines : []).Distinct().Order().ToList();
        var planned = held.Select(l => Describe(lines, l, usedBy.GetValueOrDefault(l) ?? [])).ToList();
        var dropped = lines.ExistingLines.Where(l => !held.Contains(l)).Select(l => lines.PartNumbers[l]).ToList();
        var holding = question.HoldingCostPerLine * held.Count;
        var yearly = designs.Sum(d => d.YearlyCost) + holding;

        var proved = decided && refined && bounded;
        var text = proved ? "proved"
            : Say($"best over {(counts.Count == 0 ? 0 : counts.Values.Max())} candidate designs per requirement");
        if (unmet.Count > 0)
            notes.Add($"Not covered by the plan: {string.Join(", ", unmet.Select(u => u.Requirement))} (see their reasons: proved infeasible from every candidate line, or not decided in time).");
        return new StockingPlan(proved ? PlanOptimality.Proved : PlanOptimality.BestFound, text, planned, dropped, designs, unmet,
            yearly, holding, today, selection.Status.ToString(), rounds, counts, clock.Elapsed, notes);

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
