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

        // Every requirement's pool of designs, then the rounds of the line-selection model and its proof.
        var rounds = new PlanRounds(question, options, lines, searchOptions, cancellation);
        rounds.Run();
        var (pools, unmet, best, selection, proved) = (rounds.Pools, rounds.UnmetRequirements, rounds.Best, rounds.Selection, rounds.Proved);

        var today = Today(question, lines, searchOptions, cancellation);
        var counts = requirements.Select((req, r) => (req.Name, Designs: pools[r]?.Outcome.Designs.Count ?? 0)).ToDictionary(x => x.Name, x => x.Designs, StringComparer.Ordinal);
        if (best is null)
        {
            var reason = selection is null ? "no requirement can be met from the candidate lines" : $"the line-selection model gave no plan ({selection.Status})";
            return new StockingPlan(PlanOptimality.None, reason, [], [], [], unmet, 0, 0, today,
                selection?.Status.ToString() ?? "NotRun", rounds.Count, counts, clock.Elapsed, notes);
        }
        foreach (var (pool, r) in pools.Select((p, r) => (p, r)))
            if (pool is { Outcome.Status: not SearchStatus.Optimal })
                notes.Add($"{requirements[r].Name}: the search of its candidate designs ran out of time; a longer search time limit may find cheaper designs.");
        if (!proved && rounds.Bound is { } lower)
            notes.Add(Say($"No plan costs less than {lower} a year (the bound of the model with stand-ins after {rounds.Count} round(s)); this one costs {best.YearlyCost}: it is the best found, not proved."));
        else if (!proved)
            notes.Add("No bound was found (a pool search or a solve ran out of time, or a requirement was not decided): the plan is the best found, not proved.");
        if (!proved && rounds.Stalled)
            notes.Add("The rounds stopped with nothing new to learn (a solve or a search ran out of time).");
        else if (!proved && rounds.Count >= options.MaxRefinementRounds)
            notes.Add(Say($"The rounds ran out ({rounds.Count}) before the bound reached the plan."));
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
            best.YearlyCost, holding, today, proved ? nameof(CpSolverStatus.Optimal) : selection!.Status.ToString(), rounds.Count, counts, clock.Elapsed, notes)
        {
            LowerBound = proved ? best.YearlyCost : rounds.Bound,
        };
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
