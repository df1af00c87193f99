using Google.OrTools.Sat;

namespace PartsOpt.Search;

/// <summary>
/// Builds the CP-SAT model of a <see cref="SelectionProblem"/> and runs the lazy verification loop:
/// solve, let the exact engine judge the assignment, cut it off (rejected: by the slots its reason depends
/// on; accepted: as a design already listed), solve again, until enough designs are listed and the next
/// candidate costs more than the last one wanted, or the model has no solution left.
/// </summary>
internal sealed class SelectionSolver
{
    /// <summary>Integer steps per unit of natural log in the log-space bounds (1e-6 relative).</summary>
    public const double LogScale = 1e6;

    private readonly SelectionProblem problem;
    private readonly CpModel model = new();
    private readonly BoolVar[][] chosen;
    private readonly long[][] optionObjective;
    private readonly long[] lineObjective;
    private readonly long constantObjective;

    public SelectionSolver(SelectionProblem problem)
    {
        this.problem = problem;
        CostScale = ScaleFor(problem);
        chosen = problem.Slots
            .Select((slot, s) => slot.Options.Select((_, o) => model.NewBoolVar($"x_{s}_{o}")).ToArray())
            .ToArray();
        foreach (var vars in chosen)
            model.AddExactlyOne(vars);

        optionObjective = problem.Slots.Select(slot => slot.Options.Select(OptionObjective).ToArray()).ToArray();
        lineObjective = new long[problem.Lines.Count];
        constantObjective = problem.FixedDraws.Sum(d => problem.BuildQuantity * DrawObjective(d));

        AddGroups();
        AddBuckets();
        AddStock();
        var lineUsed = AddLineItems();
        AddBounds();

        var objective = LinearExpr.NewBuilder();
        for (var s = 0; s < chosen.Length; s++)
            for (var o = 0; o < chosen[s].Length; o++)
                objective.AddTerm(chosen[s][o], optionObjective[s][o]);
        for (var l = 0; l < lineUsed.Length; l++)
            if (lineUsed[l] is { } y)
                objective.AddTerm(y, lineObjective[l] = Scaled(problem.Costs.LineItemSetupCost));
        ObjectiveExpression = objective;
        model.Minimize(objective);
    }

    /// <summary>Further CP-SAT parameters, appended to the time limit, workers and seed.</summary>
    internal static string ExtraParameters { get; set; } = "";

    /// <summary>Integer objective units per unit of currency (a power of ten that makes every cost whole).</summary>
    public long CostScale { get; }

    private LinearExprBuilder ObjectiveExpression { get; }

    /// <summary>The exact integer objective of an assignment: the total build cost × <see cref="CostScale"/>.</summary>
    public long ObjectiveOf(IReadOnlyList<int> choice) =>
        checked((long)(problem.CostOf(choice).TotalBuildCost * CostScale));

    /// <summary>
    /// Runs the lazy loop until <paramref name="wanted"/> accepted designs and all their ties are listed,
    /// no candidate is left, the objective passes <paramref name="cutoff"/>, time runs out or
    /// <paramref name="cancellation"/> fires.
    /// </summary>
    public SelectionRun Run(
        Func<int[], SelectionVerdict> verify,
        int wanted,
        long? cutoff,
        IReadOnlyList<int> distinctSlots,
        DateTime deadlineUtc,
        int seed,
        CancellationToken cancellation)
    {
        if (cutoff is { } bound)
            model.Add(ObjectiveExpression <= bound - constantObjective);

        var accepted = new List<AcceptedChoice>();
        var rejections = new List<(int[], SelectionVerdict)>();
        var solves = 0;
        var complete = false;
        while (!cancellation.IsCancellationRequested)
        {
            var remaining = (deadlineUtc - DateTime.UtcNow).TotalSeconds;
            if (remaining <= 0)
                break;
            var solver = new CpSolver
            {
                StringParameters = string.Create(System.Globalization.CultureInfo.InvariantCulture,
                    $"max_time_in_seconds:{remaining:0.###}, num_workers:1, random_seed:{seed}{ExtraParameters}"),
            };
            CpSolverStatus status;
            using (cancellation.Register(solver.StopSearch))
                status = solver.Solve(model);
            solves++;
            if (status == CpSolverStatus.Infeasible)
            {
                complete = true;
                break;
            }
            if (status is not (CpSolverStatus.Optimal or CpSolverStatus.Feasible))
            {
                if (status == CpSolverStatus.ModelInvalid)
                    throw new InvalidOperationException("The selection model is invalid: " + model.Validate());
                break;
            }

            var choice = chosen.Select(vars => Array.FindIndex(vars, v => solver.BooleanValue(v))).ToArray();
            var objective = ObjectiveOf(choice);
            if (accepted.Count >= wanted && objective > accepted[wanted - 1].Objective)
            {
                complete = status == CpSolverStatus.Optimal;
                break;
            }

            var verdict = verify(choice);
            if (verdict.Accepted)
            {
                accepted.Add(new AcceptedChoice(choice, objective, verdict));
                Forbid(choice, distinctSlots);
            }
            else
            {
                rejections.Add((choice, verdict));
                var slots = verdict.CutSlots ?? Enumerable.Range(0, chosen.Length).ToArray();
                if (verdict is { CutGroup: { } group, CutEscape: { } escape })
                    model.AddBoolOr(slots.Select(s => chosen[s][choice[s]].Not()).Concat(escape.Select(k => (ILiteral)groupVars[group][k])));
                else if (verdict is { CutEscapeOptions: { } options })
                    model.AddBoolOr(slots.Select(s => chosen[s][choice[s]].Not())
                        .Concat(options.Select(o => (ILiteral)chosen[o.Slot][o.Option])));
                else if (verdict is { CutEscapeSlot: { } slot, CutEscape: { } better })
                    model.AddBoolOr(slots.Where(s => s != slot).Select(s => chosen[s][choice[s]].Not())
                        .Concat(better.Select(o => (ILiteral)chosen[slot][o])));
                else
                    Forbid(choice, slots);
                foreach (var (other, otherSlots) in verdict.MoreCuts)
                    Forbid(other, otherSlots);
            }
            if (status != CpSolverStatus.Optimal)
                break; // time ran out inside the solve: what we have is not proved
        }

        var ranked = AcceptedChoice.InRankOrder(accepted);
        return new SelectionRun(ranked, complete, solves, rejections);
    }

    /// <summary>Forbids a design accepted outside the loop (a starting design), so the model looks past it.</summary>
    public void Exclude(int[] choice, IReadOnlyList<int> slots) => Forbid(choice, slots);

    private void Forbid(int[] choice, IReadOnlyList<int> slots) =>
        model.AddBoolOr(slots.Select(s => chosen[s][choice[s]].Not()));

    private void AddGroups()
    {
        foreach (var group in problem.Groups)
        {
            var tuples = group.Tuples.Select((_, k) => model.NewBoolVar($"t_{k}")).ToArray();
            model.AddExactlyOne(tuples);
            for (var k = 0; k < tuples.Length; k++)
                if (double.IsNaN(group.LogValues[k]))
                    model.Add(tuples[k] == 0);
            for (var position = 0; position < group.Slots.Count; position++)
            {
                var slot = group.Slots[position];
                for (var o = 0; o < chosen[slot].Length; o++)
                {
                    var matching = Enumerable.Range(0, tuples.Length)
                        .Where(k => group.Tuples[k][position] == o)
                        .Select(k => tuples[k]);
                    model.Add(LinearExpr.Sum(matching) == chosen[slot][o]);
                }
            }
            groupVars.Add(tuples);
        }
    }

    private readonly List<BoolVar[]> groupVars = [];

    private void AddStock()
    {
        var use = problem.Lines.Select(_ => LinearExpr.NewBuilder()).ToArray();
        var fixedUse = new long[problem.Lines.Count];
        foreach (var draw in problem.FixedDraws)
            fixedUse[draw.Line] += draw.PerBoard;
        for (var s = 0; s < chosen.Length; s++)
            for (var o = 0; o < chosen[s].Length; o++)
                foreach (var draw in problem.Slots[s].Options[o].Draws)
                    use[draw.Line].AddTerm(chosen[s][o], (long)draw.PerBoard * problem.BuildQuantity);
        for (var l = 0; l < use.Length; l++)
            model.Add(use[l] <= problem.Lines[l].Available - fixedUse[l] * problem.BuildQuantity);
    }

    private BoolVar?[] AddLineItems()
    {
        var isFixed = new bool[problem.Lines.Count];
        foreach (var draw in problem.FixedDraws)
            isFixed[draw.Line] = true;
        var drawers = problem.Lines.Select(_ => new List<BoolVar>()).ToArray();
        for (var s = 0; s < chosen.Length; s++)
            for (var o = 0; o < chosen[s].Length; o++)
                foreach (var draw in problem.Slots[s].Options[o].Draws)
                    drawers[draw.Line].Add(chosen[s][o]);

        var used = new BoolVar?[problem.Lines.Count];
        for (var l = 0; l < used.Length; l++)
        {
            if (isFixed[l] || drawers[l].Count == 0)
                continue;
            var y = model.NewBoolVar($"line_{l}");
            foreach (var x in drawers[l].Distinct())
                model.AddImplication(x, y);
            model.Add(y <= LinearExpr.Sum(drawers[l].Distinct()));
            used[l] = y;
        }
        return used;
    }

    /// <summary>
    /// One literal per bucket, exactly one true; a true bucket holds the ratio's scaled log inside its edges,
    /// widened outward by one step per rounded term.
    /// </summary>
    private void AddBuckets()
    {
        foreach (var buckets in problem.Buckets)
        {
            var ratio = LinearExpr.NewBuilder();
            foreach (var term in buckets.Ratio)
                AddScaledLogs(ratio, term, term.Coefficient);
            var slack = buckets.Ratio.Count;
            var literals = buckets.Edges.Select((_, j) => model.NewBoolVar($"b_{j}")).ToArray();
            model.AddExactlyOne(literals);
            for (var j = 0; j < literals.Length; j++)
            {
                model.Add(ratio >= (long)Math.Floor(buckets.Edges[j].Low * LogScale) - slack).OnlyEnforceIf(literals[j]);
                model.Add(ratio <= (long)Math.Ceiling(buckets.Edges[j].High * LogScale) + slack).OnlyEnforceIf(literals[j]);
            }
            bucketVars.Add(literals);
        }
    }

    private readonly List<BoolVar[]> bucketVars = [];

    private void AddScaledLogs(LinearExprBuilder sum, LogTerm term, int coefficient)
    {
        var vars = chosen[term.Index];
        var options = problem.Slots[term.Index].Options;
        for (var i = 0; i < vars.Length; i++)
            if (!double.IsNaN(options[i].LogValue))
                sum.AddTerm(vars[i], coefficient * (long)Math.Round(options[i].LogValue * LogScale));
    }

    /// <summary>
    /// Each bound as one linear constraint, or, when it reads a bucketed factor, as two: the upper edge with
    /// each bucket's least factor, the lower edge with its greatest (so every stocked pair still satisfies it).
    /// </summary>
    private void AddBounds()
    {
        foreach (var bound in problem.Bounds)
        {
            if (double.IsNegativeInfinity(bound.Upper) || bound.Lower > bound.Upper)
            {
                model.AddBoolOr([]); // no value can meet this bound: the variant has no design
                continue;
            }
            // Each rounded term is within half a step: widen by one step per term, outward.
            var slack = bound.Terms.Count;
            var lower = double.IsNegativeInfinity(bound.Lower) ? long.MinValue / 4 : (long)Math.Floor(bound.Lower * LogScale) - slack;
            var upper = double.IsPositiveInfinity(bound.Upper) ? long.MaxValue / 4 : (long)Math.Ceiling(bound.Upper * LogScale) + slack;
            if (bound.Terms.All(t => t.Kind != TermKind.Buckets))
            {
                model.AddLinearConstraint(Sum(bound, useHigh: false), lower, upper);
                continue;
            }
            model.AddLinearConstraint(Sum(bound, useHigh: false), long.MinValue / 4, upper);
            model.AddLinearConstraint(Sum(bound, useHigh: true), lower, long.MaxValue / 4);
        }
    }

    private LinearExprBuilder Sum(LogBound bound, bool useHigh)
    {
        var sum = LinearExpr.NewBuilder();
        foreach (var term in bound.Terms)
        {
            switch (term.Kind)
            {
                case TermKind.Slot:
                    AddScaledLogs(sum, term, term.Coefficient);
                    break;
                case TermKind.Group:
                    var logs = problem.Groups[term.Index].LogValues;
                    for (var i = 0; i < logs.Count; i++)
                        if (!double.IsNaN(logs[i]))
                            sum.AddTerm(groupVars[term.Index][i], term.Coefficient * (long)Math.Round(logs[i] * LogScale));
                    break;
                case TermKind.Buckets:
                    var buckets = problem.Buckets[term.Index];
                    // A positive coefficient takes the low factor into the upper edge; a negative one the high.
                    var edge = useHigh == term.Coefficient > 0 ? buckets.High : buckets.Low;
                    for (var j = 0; j < edge.Count; j++)
                        sum.AddTerm(bucketVars[term.Index][j], term.Coefficient * (long)Math.Round(edge[j] * LogScale));
                    break;
            }
        }
        return sum;
    }

    private long OptionObjective(SlotOption option) =>
        option.Draws.Sum(d => problem.BuildQuantity * DrawObjective(d));

    private long DrawObjective(PartDraw draw) =>
        draw.PerBoard * (Scaled(problem.Lines[draw.Line].UnitCost) + Scaled(problem.Costs.PlacementCost));

    private long Scaled(decimal amount) => checked((long)(amount * CostScale));

    /// <summary>The smallest power of ten (up to 10^8) that makes every cost in the problem a whole number.</summary>
    internal static long ScaleFor(SelectionProblem problem) => ScaleFor(problem.Lines, problem.Costs);

    /// <summary>The smallest power of ten (up to 10^8) that makes every line's cost and the cost model whole.</summary>
    internal static long ScaleFor(IReadOnlyList<StockLine> lines, CostModel costs)
    {
        var amounts = lines.Select(l => l.UnitCost)
            .Append(costs.PlacementCost).Append(costs.LineItemSetupCost);
        var scale = 1L;
        foreach (var amount in amounts)
        {
            while (amount * scale != decimal.Truncate(amount * scale))
            {
                scale *= 10;
                if (scale > 100_000_000)
                    throw new ArgumentException($"Cost {amount} has more than eight decimal places.", nameof(lines));
            }
        }
        return scale;
    }
}
