using System.Globalization;
using Google.OrTools.Sat;

namespace PartsOpt.Planning;

/// <summary>What one solve of the line-selection model gave.</summary>
/// <param name="Status">CP-SAT's status.</param>
/// <param name="Chosen">Per requirement, the chosen column (null for a requirement without columns, or one that took
/// its stand-in).</param>
/// <param name="Lines">Line indices the plan holds, ascending.</param>
/// <param name="Scale">Integer objective units per unit of currency.</param>
/// <param name="Rounded">True when some yearly cost had more decimals than the scale keeps (rounded in the model).</param>
internal sealed record LineSelection(CpSolverStatus Status, IReadOnlyList<DesignColumn?> Chosen, IReadOnlyList<int> Lines, long Scale, bool Rounded)
{
    /// <summary>True when a plan was found (optimal or not).</summary>
    public bool Found => Status is CpSolverStatus.Optimal or CpSolverStatus.Feasible;

    /// <summary>Per requirement, true when the solution took its stand-in rather than a column (empty without stand-ins).</summary>
    public IReadOnlyList<bool> TookStandIn { get; init; } = [];

    /// <summary>Every line the solution holds, needed or not (a superset of <see cref="Lines"/>).</summary>
    public IReadOnlyList<int> Held { get; init; } = [];

    /// <summary>The objective of the solution, in currency (exact unless <see cref="Rounded"/>).</summary>
    public decimal Objective { get; init; }

    /// <summary>
    /// No solution of the model costs less than this (exact unless <see cref="Rounded"/>): CP-SAT's bound;
    /// null when there is none.
    /// </summary>
    public decimal? Bound { get; init; }
}

/// <summary>
/// Every design of one requirement that is not a column of the model, as one column of the model
/// (docs/stocking-plans.md, "proof"): it costs at least <paramref name="PerBoard"/> and needs no line of its
/// own, except as its cuts say.
/// </summary>
/// <param name="PerBoard">No design left out costs less per board (the pool's floor).</param>
/// <param name="Cuts">What searches on smaller stocks proved about the designs left out.</param>
internal sealed record StandIn(decimal PerBoard, IReadOnlyList<StandInCut> Cuts)
{
    /// <summary>
    /// What the stand-in costs per board on the <paramref name="held"/> lines: its floor, raised by every cut
    /// whose lines hold them all (<see cref="decimal.MaxValue"/> where such a cut found no design), as the model
    /// prices it.
    /// </summary>
    public decimal PriceOn(IReadOnlyList<int> held) => Cuts
        .Where(c => held.All(c.Within.Contains))
        .Aggregate(PerBoard, (price, c) => c.PerBoard is { } p ? Math.Max(price, p) : decimal.MaxValue);

    /// <summary>
    /// True when one of <paramref name="columns"/> is as cheap on the <paramref name="held"/> lines and needs no
    /// line more: a solution taking the stand-in there is matched by a plan of columns, so the stand-in lowered
    /// nothing (its pool need not grow).
    /// </summary>
    public bool TiedOn(IReadOnlyList<DesignColumn> columns, IReadOnlyList<int> held)
    {
        var price = PriceOn(held);
        return columns.Any(c => c.PerBoard <= price && c.Lines.All(held.Contains));
    }
}

/// <summary>
/// A search of the requirement on the lines <paramref name="Within"/> listed its designs, and each became a
/// column: a design left out that needs no line outside <paramref name="Within"/> costs at least
/// <paramref name="PerBoard"/> per board, or there is none (null).
/// </summary>
internal sealed record StandInCut(IReadOnlyList<int> Within, decimal? PerBoard);

/// <summary>
/// The master model of the stocking plan (docs/stocking-plans.md): a bool per line (held), a bool per
/// column (this design meets that requirement), exactly one column (or the requirement's stand-in, when
/// given) per requirement that has any, a column needs its lines, today's lines held when they must be kept;
/// minimise Σ unitsPerYear × cost per board of the chosen columns (and stand-ins) + holding cost × lines
/// held.
/// </summary>
internal static class LineSelectionModel
{
    /// <summary>
    /// CP-SAT workers of a proposal (a solve from a hinted plan, looking for cheaper plans): the whole
    /// portfolio, its neighbourhood searches included.
    /// </summary>
    public const int Workers = 8;

    /// <summary>
    /// The workers of every other solve, the bound's above all: two tree searches on the linear relaxation,
    /// one branching on it, one on its reduced costs, each a full worker (without num_full_subsolvers CP-SAT
    /// gives two workers one tree search and one worker of interleaved neighbourhood searches, which stop
    /// helping once the optimum is found and only the proof is left). On the stocking-plan benchmark's last
    /// models (1,500-1,900 columns) the two proved the optimum in 3-7 s, where one tree search took 4-15 s and
    /// the eight-worker portfolio 20-35 s on two cores (docs/benchmarks.md).
    /// </summary>
    public const string BoundWorkers = "num_workers:2, num_full_subsolvers:2, subsolvers:\"max_lp\", subsolvers:\"reduced_costs\"";

    /// <summary>Largest scale tried for an exact integer objective; past it costs are rounded to 1e-6.</summary>
    public const long MaxScale = 1_000_000;

    public static LineSelection Solve(
        IReadOnlyList<IReadOnlyList<DesignColumn>> columns,
        IReadOnlyList<int> unitsPerYear,
        PlanLines lines,
        decimal holdingCostPerLine,
        bool keepExisting,
        TimeSpan timeLimit,
        int seed,
        CancellationToken cancellation,
        IReadOnlyList<StandIn?>? standIns = null,
        IReadOnlyCollection<int>? hint = null)
    {
        var forced = keepExisting ? lines.ExistingLines.ToHashSet() : [];
        columns = columns.Select((list, r) => Undominated(list, forced, unitsPerYear[r], holdingCostPerLine)).ToList();
        (columns, standIns) = WithinReach(columns, standIns, unitsPerYear, holdingCostPerLine, forced);
        var yearly = columns.Select((list, r) => list.Select(c => unitsPerYear[r] * c.PerBoard).ToList()).ToList();
        var standInAmounts = (standIns ?? []).SelectMany((s, r) => s is null ? []
            : s.Cuts.Where(c => c.PerBoard is not null).Select(c => unitsPerYear[r] * c.PerBoard!.Value).Append(unitsPerYear[r] * s.PerBoard));
        var (scale, rounded) = ScaleFor(yearly.SelectMany(y => y).Concat(standInAmounts).Append(holdingCostPerLine));

        var model = new CpModel();
        var held = Enumerable.Range(0, lines.Count).Select(l => model.NewBoolVar($"held_{l}")).ToArray();
        var objective = LinearExpr.NewBuilder();
        var holding = Scaled(holdingCostPerLine, scale);
        for (var l = 0; l < lines.Count; l++)
        {
            if (keepExisting && lines.Existing[l])
                model.Add(held[l] == 1);
            objective.AddTerm(held[l], holding);
            if (hint is not null)
                model.AddHint(held[l], hint.Contains(l) ? 1 : 0);
        }
        var pick = new BoolVar[columns.Count][];
        var standIn = new BoolVar?[columns.Count];
        for (var r = 0; r < columns.Count; r++)
        {
            pick[r] = columns[r].Select((_, j) => model.NewBoolVar($"design_{r}_{j}")).ToArray();
            if (pick[r].Length == 0)
                continue;
            if (standIns is { } s && s[r] is { } stand)
                standIn[r] = AddStandIn(model, objective, held, stand, unitsPerYear[r], scale, r);
            model.AddExactlyOne(standIn[r] is { } si ? [.. pick[r], si] : pick[r]);
            // A design needs its lines, written per line: the designs of r that use line l, together, need it
            // (Σ_j∋l use[r,j] ≤ held[l]; at most one is taken, and the sum binds the model's linear relaxation
            // harder than one implication per design).
            var users = new Dictionary<int, List<BoolVar>>();
            for (var j = 0; j < pick[r].Length; j++)
            {
                foreach (var line in columns[r][j].Lines)
                    (users.TryGetValue(line, out var list) ? list : users[line] = []).Add(pick[r][j]);
                objective.AddTerm(pick[r][j], Scaled(yearly[r][j], scale));
            }
            foreach (var (line, designs) in users)
                model.Add(LinearExpr.Sum(designs) <= held[line]);
        }
        // No constraint "cheaper than the best plan so far": written into the model it made CP-SAT's proof on
        // the benchmark's last model slower, not faster (docs/benchmarks.md); the objective bounds itself.
        model.Minimize(objective);
        var solver = new CpSolver
        {
            StringParameters = string.Create(CultureInfo.InvariantCulture,
                $"max_time_in_seconds:{Math.Max(timeLimit.TotalSeconds, 0.001):0.###}, random_seed:{seed}, {(hint is null ? BoundWorkers : $"num_workers:{Workers}")}"),
        };
        CpSolverStatus status;
        using (cancellation.Register(solver.StopSearch))
            status = solver.Solve(model);
        if (status is not (CpSolverStatus.Optimal or CpSolverStatus.Feasible))
            return new LineSelection(status, columns.Select(_ => (DesignColumn?)null).ToList(), [], scale, rounded);

        var took = standIn.Select(v => v is not null && solver.BooleanValue(v)).ToList();
        var chosen = columns.Select((list, r) => list.Count == 0 || took[r] ? null
            : list[Array.FindIndex(pick[r], v => solver.BooleanValue(v))]).ToList();
        // A line no chosen design needs is held only when it must be kept: with no holding cost the solver
        // may leave one on at no charge, and the plan does not list it.
        var needed = chosen.Where(c => c is not null).SelectMany(c => c!.Lines)
            .Concat(keepExisting ? lines.ExistingLines : []).ToHashSet();
        var planLines = Enumerable.Range(0, lines.Count).Where(l => solver.BooleanValue(held[l]) && needed.Contains(l)).ToList();
        return new LineSelection(status, chosen, planLines, scale, rounded)
        {
            TookStandIn = standIns is null ? [] : took,
            Held = Enumerable.Range(0, lines.Count).Where(l => solver.BooleanValue(held[l])).ToList(),
            Objective = (decimal)(long)Math.Round(solver.ObjectiveValue) / scale,
            Bound = (decimal)(long)Math.Ceiling(solver.BestObjectiveBound - 1e-6) / scale,
        };
    }

    /// <summary>
    /// The stand-in's bool: it costs units × its floor, and each cut whose lines hold every held line raises
    /// it to the cut's cost (or rules it out when the cut found no design).
    /// </summary>
    private static BoolVar AddStandIn(CpModel model, LinearExprBuilder objective, BoolVar[] held, StandIn stand, int units, long scale, int r)
    {
        var taken = model.NewBoolVar($"stand_in_{r}");
        var floor = Scaled(units * stand.PerBoard, scale);
        objective.AddTerm(taken, floor);
        var raises = stand.Cuts.Where(c => c.PerBoard is { } p && p > stand.PerBoard).ToList();
        var extra = raises.Count == 0 ? null
            : model.NewIntVar(0, raises.Max(c => Scaled(units * c.PerBoard!.Value, scale)) - floor, $"stand_in_raise_{r}");
        if (extra is not null)
            objective.AddTerm(extra, 1);
        foreach (var cut in stand.Cuts)
        {
            var within = cut.Within.ToHashSet();
            var outside = Enumerable.Range(0, held.Length).Where(l => !within.Contains(l)).Select(l => (ILiteral)held[l]).ToList();
            if (cut.PerBoard is not { } perBoard)
                model.AddBoolOr([.. outside, taken.Not()]);
            else if (perBoard > stand.PerBoard)
                model.Add(extra! >= Scaled(units * perBoard, scale) - floor)
                    .OnlyEnforceIf([taken, .. outside.Select(l => l.Not())]);
        }
        return taken;
    }

    /// <summary>
    /// The columns no other column of the same requirement dominates. Column k dominates column j when
    /// units × (cost of j − cost of k) is at least the holding of k's lines that j does not use (lines every
    /// plan holds aside): in any plan with j, k instead costs no more, whatever else is held. With no lines
    /// of its own outside j this is "a subset of j's lines at no higher cost"; of equal columns the first stays.
    /// </summary>
    internal static IReadOnlyList<DesignColumn> Undominated(IReadOnlyList<DesignColumn> list, IReadOnlySet<int> forced, int units, decimal holdingCostPerLine)
    {
        var own = list.Select(c => c.Lines.Where(l => !forced.Contains(l)).ToList()).ToList();
        var masks = own.Select(Mask).ToList();
        // Cheapest first, then fewest lines: a column can only be dominated by one before it, and dominance
        // chains (k over j and m over k make m over j), so only the columns kept need be asked.
        var order = Enumerable.Range(0, list.Count).OrderBy(j => list[j].PerBoard).ThenBy(j => own[j].Count).ThenBy(j => j).ToList();
        var kept = new List<int>();
        foreach (var j in order)
            if (!kept.Any(k => units * (list[j].PerBoard - list[k].PerBoard) >= holdingCostPerLine * Outside(masks[k], masks[j])))
                kept.Add(j);
        kept.Sort();
        return kept.Count == list.Count ? list : kept.Select(j => list[j]).ToList();

        static ulong[] Mask(List<int> used)
        {
            var mask = new ulong[used.Count == 0 ? 1 : used.Max() / 64 + 1];
            foreach (var l in used)
                mask[l / 64] |= 1UL << (l % 64);
            return mask;
        }

        // Lines of the first not among the second's.
        static int Outside(ulong[] inner, ulong[] outer)
        {
            var count = 0;
            for (var w = 0; w < inner.Length; w++)
                count += System.Numerics.BitOperations.PopCount(inner[w] & ~(w < outer.Length ? outer[w] : 0));
            return count;
        }
    }

    /// <summary>
    /// The columns and stand-ins worth a place in the model. A column dearer a year than another column of the
    /// same requirement plus the holding of every line of that one not held anyway is never in an optimal plan
    /// (swapping it for the other saves money), nor is a stand-in dearer than that (docs/stocking-plans.md).
    /// </summary>
    internal static (IReadOnlyList<IReadOnlyList<DesignColumn>> Columns, IReadOnlyList<StandIn?>? StandIns) WithinReach(
        IReadOnlyList<IReadOnlyList<DesignColumn>> columns, IReadOnlyList<StandIn?>? standIns, IReadOnlyList<int> unitsPerYear,
        decimal holdingCostPerLine, IReadOnlySet<int> forced)
    {
        var caps = columns.Select((list, r) => list.Count == 0 ? decimal.MaxValue
            : list.Min(c => unitsPerYear[r] * c.PerBoard + holdingCostPerLine * c.Lines.Count(l => !forced.Contains(l)))).ToList();
        var kept = columns.Select((list, r) => (IReadOnlyList<DesignColumn>)list.Where(c => unitsPerYear[r] * c.PerBoard <= caps[r]).ToList()).ToList();
        var stands = standIns?.Select((s, r) => s is not null && unitsPerYear[r] * s.PerBoard <= caps[r] ? s : null).ToList();
        return (kept, stands);
    }

    /// <summary>The smallest power of ten (up to <see cref="MaxScale"/>) that makes every amount whole.</summary>
    internal static (long Scale, bool Rounded) ScaleFor(IEnumerable<decimal> amounts)
    {
        var scale = 1L;
        foreach (var amount in amounts)
            while (amount * scale != decimal.Truncate(amount * scale))
            {
                if (scale == MaxScale)
                    return (MaxScale, true);
                scale *= 10;
            }
        return (scale, false);
    }

    internal static long Scaled(decimal amount, long scale) => checked((long)decimal.Round(amount * scale, MidpointRounding.AwayFromZero));
}
