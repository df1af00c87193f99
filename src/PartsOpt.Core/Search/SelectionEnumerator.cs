using PartsOpt.Topologies;

namespace PartsOpt.Search;

/// <summary>
/// Exact branch and bound over the selection problem of one variant: roles are filled one at a time in
/// an order that completes the square-wave generator first, then the ramp, then the threshold divider;
/// each partial assignment is bounded below on cost (parts, placements and line items) and checked
/// against the log-space bounds and stock, and the exact engine judges the partial designs whose
/// failures are decided by the roles already filled (the scopes of <see cref="SearchVariant.ScopeOf"/>).
/// Every leaf the bounds leave is judged by the engine; nothing is discarded that the engine would accept
/// at a cost within the cutoff, so an exhausted tree proves the list (see docs/search-model.md).
/// </summary>
internal sealed class SelectionEnumerator
{
    /// <summary>Floating-point slack on the log-space bounds (they are already widened by 1 %).</summary>
    private const double Slack = 1e-9;

    private readonly SearchVariant variant;
    private readonly SelectionProblem problem;
    private readonly int roleCount;
    private readonly int[] order;
    private readonly int[] position;
    private readonly bool[] checkAfter;
    private readonly long[][] objective;
    private readonly int[][][] linesOf;
    private readonly PartDraw[][][] drawsOf;
    private readonly int[][] byCost;
    private readonly long[] minObjective;
    private readonly int[] slotKind;
    private readonly int[][] singleOption;
    private readonly Dictionary<(int, int), int>[] pairOptions;
    private readonly long setup;
    private readonly long fixedObjective;
    private readonly long[] capacity;
    private readonly int[][] boundsOf;
    private readonly double[][] logs;
    private readonly (double Min, double Max)[] slotRange;
    private readonly (double Min, double Max)[] bucketRange;
    private readonly (double Min, double Max)[] groupRange;
    private readonly Dictionary<long, int>[] groupIndex;
    private readonly int dividerRa, dividerPot, dividerRb, dividerDepth;

    // Search state.
    private readonly int[] choice;
    private readonly bool[] assigned;
    private readonly long[] use;
    private readonly int[] lineRefs;
    private readonly List<int> usedLines = [];
    private readonly double[] needTopAbove, needBottomBelow;
    private long partialObjective;
    private double errorAtFrequencyDepth = double.NaN;
    private readonly int frequencyDepth;
    private long nodes;
    private DateTime deadline;
    private CancellationToken cancellation;
    private Func<int[], SelectionVerdict> verify = null!;
    private Func<int[], DesignJudgement?> judgePartial = null!;
    private Func<SearchCutoff?> cutoff = null!;
    private Action<AcceptedChoice> onAccepted = null!;
    private bool stopped;

    public SelectionEnumerator(SearchVariant variant)
    {
        this.variant = variant;
        problem = variant.Problem;
        roleCount = variant.RoleNames.Count;
        var slots = problem.Slots;
        var scale = SelectionSolver.ScaleFor(problem);
        long Scaled(decimal amount) => checked((long)(amount * scale));
        long DrawObjective(PartDraw d) =>
            problem.BuildQuantity * d.PerBoard * (Scaled(problem.Lines[d.Line].UnitCost) + Scaled(problem.Costs.PlacementCost));

        setup = Scaled(problem.Costs.LineItemSetupCost);
        fixedObjective = problem.FixedDraws.Sum(DrawObjective);
        objective = slots.Select(s => s.Options.Select(o => o.Draws.Sum(DrawObjective)).ToArray()).ToArray();
        linesOf = slots.Select(s => s.Options.Select(o => o.Draws.Select(d => d.Line).Distinct().ToArray()).ToArray()).ToArray();
        drawsOf = slots.Select(s => s.Options.Select(o => o.Draws.ToArray()).ToArray()).ToArray();
        byCost = objective.Select(costs => Enumerable.Range(0, costs.Length).OrderBy(o => costs[o]).ThenBy(o => o).ToArray()).ToArray();
        minObjective = objective.Select(costs => costs.Length == 0 ? 0 : costs.Min()).ToArray();
        capacity = problem.Lines.Select(l => (long)l.Available).ToArray();
        logs = slots.Select(s => s.Options.Select(o => o.LogValue).ToArray()).ToArray();

        var lineKind = new int[problem.Lines.Count];
        Array.Fill(lineKind, -1);
        slotKind = new int[slots.Count];
        for (var s = 0; s < slots.Count; s++)
        {
            slotKind[s] = s < roleCount ? (int)Roles.KindOf(variant.RoleNames[s]) : (int)RoleKind.Capacitor;
            foreach (var lines in linesOf[s])
                foreach (var line in lines)
                    lineKind[line] = slotKind[s];
        }
        singleOption = new int[slots.Count][];
        pairOptions = new Dictionary<(int, int), int>[slots.Count];
        for (var s = 0; s < slots.Count; s++)
        {
            singleOption[s] = Enumerable.Repeat(-1, problem.Lines.Count).ToArray();
            pairOptions[s] = [];
            foreach (var o in byCost[s])
            {
                var lines = linesOf[s][o];
                if (lines.Length == 1 && singleOption[s][lines[0]] < 0)
                    singleOption[s][lines[0]] = o;
                else if (lines.Length == 2)
                    pairOptions[s].TryAdd((Math.Min(lines[0], lines[1]), Math.Max(lines[0], lines[1])), o);
            }
        }

        slotRange = logs.Select(values => Range(values.Where(double.IsFinite))).ToArray();
        bucketRange = problem.Buckets.Select(b => (b.Low.Where(double.IsFinite).DefaultIfEmpty(0).Min(), b.High.Where(double.IsFinite).DefaultIfEmpty(0).Max())).ToArray();
        groupRange = problem.Groups.Select(g => Range(g.LogValues.Where(v => !double.IsNaN(v)))).ToArray();
        groupIndex = problem.Groups.Select(g =>
        {
            var index = new Dictionary<long, int>(g.Tuples.Count);
            for (var k = 0; k < g.Tuples.Count; k++)
                index[Key(g.Tuples[k])] = k;
            return index;
        }).ToArray();

        var touching = slots.Select(_ => new List<int>()).ToArray();
        for (var b = 0; b < problem.Bounds.Count; b++)
            foreach (var slot in SlotsOf(problem.Bounds[b]).Distinct())
                touching[slot].Add(b);
        boundsOf = touching.Select(t => t.ToArray()).ToArray();

        (order, checkAfter) = BranchingOrder();
        position = Enumerable.Repeat(int.MaxValue, slots.Count).ToArray();
        for (var d = 0; d < order.Length; d++)
            position[order[d]] = d;

        // The frequency is decided once its roles are filled: a partial check runs there.
        var frequencyRoles = variant.ScopeOf(MissedTarget.Frequency);
        frequencyDepth = frequencyRoles.Count < roleCount ? frequencyRoles.Max(s => position[s]) : -1;
        if (frequencyDepth >= 0 && !checkAfter[frequencyDepth])
            frequencyDepth = -1;

        (dividerRa, dividerPot, dividerRb) = (variant.SlotOf(Roles.CmpRa), variant.SlotOf(Roles.CmpPot), variant.SlotOf(Roles.CmpRb));
        dividerDepth = dividerRa >= 0 && dividerPot >= 0 && dividerRb >= 0 && variant.Prototype.DutyControl is not ControlVoltageDuty
            ? new[] { dividerRa, dividerPot, dividerRb }.Max(s => position[s])
            : -1;

        choice = new int[slots.Count];
        assigned = new bool[slots.Count];
        use = new long[problem.Lines.Count];
        lineRefs = new int[problem.Lines.Count];
        needTopAbove = new double[order.Length];
        needBottomBelow = new double[order.Length];
    }

    /// <summary>Partial designs judged, and leaves judged, in the last run.</summary>
    public long Judged { get; private set; }

    /// <summary>Partial designs judged in the last run (included in <see cref="Judged"/>).</summary>
    public long PartialJudged { get; private set; }

    /// <summary>Nodes of the tree visited in the last run.</summary>
    public long Nodes => nodes;

    /// <summary>
    /// Enumerates every design of the variant whose cost is within <paramref name="cutoffOf"/> (read again
    /// at every node, so a list filling up elsewhere tightens it), reporting each accepted one to
    /// <paramref name="accepted"/>. Complete when the tree was exhausted before the deadline.
    /// </summary>
    /// <param name="judge">The verdict on a whole design (engine, then yield).</param>
    /// <param name="judgePartial">The engine's judgement of a design whose unfilled roles hold placeholders
    /// (null when the engine cannot analyse it); only failures confined to filled roles are used.</param>
    /// <param name="cutoffOf">The last cost and frequency error that can still enter the list, or null while any can.</param>
    /// <param name="accepted">Called for every accepted design within the cutoff.</param>
    /// <param name="deadlineUtc">When to stop (the run is then not complete).</param>
    /// <param name="token">Stops the run.</param>
    public SelectionRun Run(Func<int[], SelectionVerdict> judge, Func<int[], DesignJudgement?> judgePartial,
        Func<SearchCutoff?> cutoffOf, Action<AcceptedChoice> accepted, DateTime deadlineUtc, CancellationToken token)
    {
        (verify, this.judgePartial, cutoff, deadline, cancellation) = (judge, judgePartial, cutoffOf, deadlineUtc, token);
        stopped = false;
        nodes = 0;
        Judged = 0;
        var found = new List<AcceptedChoice>();
        onAccepted = a =>
        {
            found.Add(a);
            accepted(a);
        };
        var buildable = problem.Bounds.All(b => b.Lower <= b.Upper && !double.IsNegativeInfinity(b.Upper))
            && Enumerable.Range(0, roleCount).All(s => problem.Slots[s].Options.Count > 0);
        if (buildable && TakeFixed())
            Descend(0);
        var ranked = found
            .OrderBy(a => a.Objective)
            .ThenBy(a => a.Verdict.FrequencyError)
            .ThenByDescending(a => a.Verdict.Margin)
            .ThenBy(a => string.Join(',', a.Choice))
            .ToList();
        return new SelectionRun(ranked, !stopped, (int)Math.Min(Judged, int.MaxValue), []);
    }

    /// <summary>The fixed draws (op-amp packages) take their stock and line items before any role.</summary>
    private bool TakeFixed()
    {
        Array.Clear(use);
        Array.Clear(lineRefs);
        usedLines.Clear();
        partialObjective = fixedObjective;
        foreach (var draw in problem.FixedDraws)
        {
            if (lineRefs[draw.Line]++ == 0)
            {
                usedLines.Add(draw.Line);
                partialObjective += setup;
            }
            use[draw.Line] += draw.PerBoard;
            if (use[draw.Line] * problem.BuildQuantity > capacity[draw.Line])
                return false;
        }
        return true;
    }

    /// <summary>
    /// Fills the slot at <paramref name="depth"/> with each option in turn. Returns the depth whose next
    /// option is to be tried: <paramref name="depth"/> − 1 when every option here is done, shallower to jump
    /// back past slots a failure does not depend on.
    /// </summary>
    private int Descend(int depth)
    {
        if (depth == order.Length)
            return Leaf();
        if ((++nodes & 1023) == 0 && (cancellation.IsCancellationRequested || DateTime.UtcNow >= deadline))
            stopped = true;
        if (stopped)
            return -1;

        var slot = order[depth];
        var (low, high) = AllowedLog(slot);
        if (low > high)
            return depth - 1;

        // First the options that add no line item, cheapest first; then the rest, cheapest first, until one
        // would pass the cutoff even with the cheapest completion.
        var reusing = ReusingOptions(slot);
        foreach (var o in reusing)
        {
            var next = Try(depth, slot, o, low, high);
            if (next < depth)
                return next;
        }
        foreach (var o in byCost[slot])
        {
            if (reusing.Contains(o))
                continue;
            if (cutoff() is { } limit)
            {
                // A new line item costs its setup, less one the rest would need anyway of the same kind.
                var (rest, kinds) = LowerBoundOfRest(depth + 1);
                var shared = (kinds & (1 << slotKind[slot])) != 0 ? setup : 0;
                if (partialObjective + objective[slot][o] + setup + rest - shared > limit.Cost)
                    break;
            }
            var next = Try(depth, slot, o, low, high);
            if (next < depth)
                return next;
        }
        return depth - 1;
    }

    /// <summary>Fills one slot with one option and goes deeper if the bounds allow; returns as <see cref="Descend"/> does for the level.</summary>
    private int Try(int depth, int slot, int o, double low, double high)
    {
        var value = logs[slot][o];
        if (value < low || value > high)
            return depth;
        var next = depth;
        if (depth == frequencyDepth)
            errorAtFrequencyDepth = double.NaN; // known again only after this option's partial check
        if (Assign(slot, o) && WithinCutoff(depth) && BoundsHold(slot))
        {
            var check = PartialCheck(depth);
            if (check > depth)
            {
                needTopAbove[depth] = double.NegativeInfinity;
                needBottomBelow[depth] = double.PositiveInfinity;
                next = Descend(depth + 1);
            }
            else
                next = check;
        }
        Unassign(slot, o);
        return Math.Min(next, depth);
    }

    /// <summary>
    /// False when no completion can enter the list: it would cost more than the cutoff, or as much with a
    /// larger frequency error (known once the square-wave generator is filled).
    /// </summary>
    private bool WithinCutoff(int depth)
    {
        if (cutoff() is not { } limit)
            return true;
        var least = partialObjective + LowerBoundOfRest(depth + 1).Bound;
        return least < limit.Cost || (least == limit.Cost && !(KnownError(depth) > limit.FrequencyError));
    }

    /// <summary>The nominal frequency error of every completion, once the frequency's roles are filled (else NaN).</summary>
    private double KnownError(int depth) => frequencyDepth >= 0 && depth >= frequencyDepth ? errorAtFrequencyDepth : double.NaN;

    /// <summary>
    /// Judges a partial design when the roles just filled complete a scope: the unfilled roles take
    /// placeholder options, and a failure the engine confines to filled roles prunes every completion.
    /// Returns the depth to resume at: deeper than <paramref name="depth"/> to go on, <paramref name="depth"/>
    /// to try the next option here, shallower to jump back.
    /// </summary>
    private int PartialCheck(int depth)
    {
        if (!checkAfter[depth])
            return depth + 1;
        var trial = (int[])choice.Clone();
        for (var s = 0; s < roleCount; s++)
            if (!assigned[s])
                trial[s] = byCost[s].Length > 0 ? byCost[s][0] : 0;
        Judged++;
        PartialJudged++;
        var judgement = judgePartial(trial);
        if (depth == frequencyDepth)
        {
            errorAtFrequencyDepth = judgement?.FrequencyError ?? double.NaN;
            if (!WithinCutoff(depth))
                return depth;
        }
        if (judgement is null || judgement.Accepted)
            return depth + 1;
        var deepest = -1;
        foreach (var s in variant.PlainScope(judgement))
        {
            if (!assigned[s])
                return depth + 1;
            deepest = Math.Max(deepest, position[s]);
        }
        return deepest;
    }

    /// <summary>Every role is filled: the threshold requirements learnt so far, the cost, then the engine.</summary>
    private int Leaf()
    {
        var depth = order.Length;
        if (dividerDepth >= 0 && !ThresholdsReachFurther())
            return depth - 1;

        // The extra slots (decoupling) do not make a different circuit: the cheapest that fits is taken.
        var extra = new List<(int Slot, int Option)>();
        for (var s = roleCount; s < problem.Slots.Count; s++)
        {
            var best = -1;
            var bestCost = long.MaxValue;
            foreach (var o in byCost[s])
            {
                if (!Assign(s, o))
                {
                    Unassign(s, o);
                    continue;
                }
                var cost = partialObjective;
                Unassign(s, o);
                if (cost < bestCost)
                    (best, bestCost) = (o, cost);
            }
            if (best < 0)
            {
                foreach (var (es, eo) in extra)
                    Unassign(es, eo);
                return depth - 1; // no decoupling capacitor left in stock for this design
            }
            Assign(s, best);
            extra.Add((s, best));
        }
        var total = partialObjective;
        var snapshot = (int[])choice.Clone();
        foreach (var (es, eo) in extra)
            Unassign(es, eo);
        if (cutoff() is { } c && (total > c.Cost || (total == c.Cost && KnownError(depth) > c.FrequencyError)))
            return depth - 1;

        Judged++;
        var verdict = verify(snapshot);
        if (verdict.Accepted)
        {
            onAccepted(new AcceptedChoice(snapshot, total, verdict));
            return depth - 1;
        }
        if (verdict.CutGroup is not null || verdict.CutEscapeOptions is not null)
        {
            // A missed duty range: every divider reaching no further fails with the same ramp.
            if (dividerDepth >= 0 && verdict.CutSlots is { } rampSlots && rampSlots.All(s => position[s] < dividerDepth - 2))
            {
                var frame = rampSlots.Max(s => position[s]);
                var (top, bottom) = Thresholds();
                var judgement = (DesignJudgement)verdict.Payload!;
                if (judgement.MissesLowDuty)
                    needTopAbove[frame] = Math.Max(needTopAbove[frame], top);
                if (judgement.MissesHighDuty)
                    needBottomBelow[frame] = Math.Min(needBottomBelow[frame], bottom);
            }
            return depth - 1;
        }
        var target = verdict.CutSlots is { } slots ? slots.Max(s => position[s]) : depth - 1;
        if (verdict.Payload is DesignJudgement rejected)
            target = Math.Min(target, variant.PlainScope(rejected).Max(s => position[s]));
        return target;
    }

    /// <summary>The threshold divider's top and bottom thresholds, as fractions of the supply span.</summary>
    private (double Top, double Bottom) Thresholds()
    {
        double Value(int slot) => ((StockChoice)problem.Slots[slot].Options[choice[slot]].Tag!).Value;
        double ra = Value(dividerRa), pot = Value(dividerPot), rb = Value(dividerRb), sum = ra + pot + rb;
        return ((rb + pot) / sum, rb / sum);
    }

    /// <summary>True when the divider reaches further than every divider that failed with the same ramp.</summary>
    private bool ThresholdsReachFurther()
    {
        var (top, bottom) = Thresholds();
        for (var d = 0; d < dividerDepth; d++)
            if (!(top > needTopAbove[d]) || !(bottom < needBottomBelow[d]))
                return false;
        return true;
    }

    private bool Assign(int slot, int o)
    {
        choice[slot] = o;
        assigned[slot] = true;
        partialObjective += objective[slot][o];
        var fits = true;
        foreach (var draw in drawsOf[slot][o])
        {
            use[draw.Line] += draw.PerBoard;
            if (use[draw.Line] * problem.BuildQuantity > capacity[draw.Line])
                fits = false;
        }
        foreach (var line in linesOf[slot][o])
            if (lineRefs[line]++ == 0)
            {
                usedLines.Add(line);
                partialObjective += setup;
            }
        return fits;
    }

    private void Unassign(int slot, int o)
    {
        assigned[slot] = false;
        partialObjective -= objective[slot][o];
        foreach (var draw in drawsOf[slot][o])
            use[draw.Line] -= draw.PerBoard;
        foreach (var line in linesOf[slot][o])
            if (--lineRefs[line] == 0)
            {
                usedLines.Remove(line);
                partialObjective -= setup;
            }
    }

    /// <summary>The options of a slot that draw only lines already on the BOM.</summary>
    private List<int> ReusingOptions(int slot)
    {
        var result = new List<int>();
        foreach (var line in usedLines)
            if (singleOption[slot][line] is >= 0 and var o)
                result.Add(o);
        if (pairOptions[slot].Count > 0)
            foreach (var a in usedLines)
                foreach (var b in usedLines)
                    if (a <= b && pairOptions[slot].TryGetValue((a, b), out var o))
                        result.Add(o);
        // A line may carry more than one option of the slot only through duplicates; keep the cheapest order.
        result.Sort((x, y) => objective[slot][x] != objective[slot][y] ? objective[slot][x].CompareTo(objective[slot][y]) : x.CompareTo(y));
        return result;
    }

    /// <summary>
    /// A lower bound on what the slots from <paramref name="depth"/> on add: each one's cheapest option,
    /// and one line item for every kind of part some of them cannot take from a line already on the BOM.
    /// </summary>
    private (long Bound, int Kinds) LowerBoundOfRest(int depth)
    {
        var bound = 0L;
        var kinds = 0;
        for (var d = depth; d < order.Length; d++)
        {
            var slot = order[d];
            bound += minObjective[slot];
            if ((kinds & (1 << slotKind[slot])) == 0 && !CanReuse(slot))
                kinds |= 1 << slotKind[slot];
        }
        for (var s = roleCount; s < problem.Slots.Count; s++)
        {
            bound += minObjective[s];
            if ((kinds & (1 << slotKind[s])) == 0 && !CanReuse(s))
                kinds |= 1 << slotKind[s];
        }
        return (bound + System.Numerics.BitOperations.PopCount((uint)kinds) * setup, kinds);
    }

    private bool CanReuse(int slot)
    {
        foreach (var line in usedLines)
            if (singleOption[slot][line] >= 0)
                return true;
        if (pairOptions[slot].Count > 0)
            foreach (var a in usedLines)
                foreach (var b in usedLines)
                    if (a <= b && pairOptions[slot].ContainsKey((a, b)))
                        return true;
        return false;
    }

    /// <summary>
    /// The interval of ln(value) a slot may take given the slots already filled: for every bound where it
    /// is a plain term, what the bound leaves once every other term takes its widest range.
    /// </summary>
    private (double Low, double High) AllowedLog(int slot)
    {
        double low = double.NegativeInfinity, high = double.PositiveInfinity;
        foreach (var b in boundsOf[slot])
        {
            var bound = problem.Bounds[b];
            var coefficient = 0;
            double restMin = 0, restMax = 0;
            foreach (var term in bound.Terms)
            {
                if (term.Kind == TermKind.Slot && term.Index == slot)
                {
                    coefficient += term.Coefficient;
                    continue;
                }
                var (min, max) = TermRange(term);
                restMin += min;
                restMax += max;
            }
            if (coefficient == 0 || double.IsNaN(restMin) || double.IsNaN(restMax))
                continue;
            double from = (bound.Lower - restMax) / coefficient, to = (bound.Upper - restMin) / coefficient;
            if (coefficient < 0)
                (from, to) = (to, from);
            low = Math.Max(low, from - Slack);
            high = Math.Min(high, to + Slack);
        }
        return (low, high);
    }

    /// <summary>
    /// True when every bound touching <paramref name="slot"/> can still hold, each on its own and, where
    /// several read the same unfilled plain terms (R and C of the oscillator), together: each leaves an
    /// interval for the sum of those terms, and the intervals must meet.
    /// </summary>
    private bool BoundsHold(int slot)
    {
        Span<(long Key, double Low, double High)> free = stackalloc (long, double, double)[boundsOf[slot].Length];
        var count = 0;
        foreach (var b in boundsOf[slot])
        {
            var bound = problem.Bounds[b];
            double min = 0, max = 0, fixedMin = 0, fixedMax = 0;
            var key = 0L;
            foreach (var term in bound.Terms)
            {
                var (lo, hi) = TermRange(term);
                if (double.IsNaN(lo))
                    return false;
                min += lo;
                max += hi;
                if (term.Kind == TermKind.Slot && !assigned[term.Index])
                    key = key * 1_000_003 + term.Index * 64 + term.Coefficient + 32;
                else
                    (fixedMin, fixedMax) = (fixedMin + lo, fixedMax + hi);
            }
            if (min > bound.Upper + Slack || max < bound.Lower - Slack)
                return false;
            if (key == 0)
                continue;
            var (low, high) = (bound.Lower - fixedMax, bound.Upper - fixedMin);
            var merged = false;
            for (var i = 0; i < count; i++)
                if (free[i].Key == key)
                {
                    free[i] = (key, Math.Max(free[i].Low, low), Math.Min(free[i].High, high));
                    if (free[i].Low > free[i].High + Slack)
                        return false;
                    merged = true;
                }
            if (!merged)
                free[count++] = (key, low, high);
        }
        return true;
    }

    /// <summary>The range of coefficient × ln(value) a term can still take; NaN when no value is possible.</summary>
    private (double Min, double Max) TermRange(LogTerm term)
    {
        double min, max;
        switch (term.Kind)
        {
            case TermKind.Slot:
                (min, max) = assigned[term.Index]
                    ? (logs[term.Index][choice[term.Index]], logs[term.Index][choice[term.Index]])
                    : slotRange[term.Index];
                break;
            case TermKind.Buckets:
                (min, max) = BucketRange(term.Index);
                break;
            default:
                (min, max) = GroupRange(term.Index);
                break;
        }
        if (double.IsNaN(min))
            return (double.NaN, double.NaN);
        return term.Coefficient >= 0 ? (term.Coefficient * min, term.Coefficient * max) : (term.Coefficient * max, term.Coefficient * min);
    }

    private (double Min, double Max) BucketRange(int index)
    {
        var buckets = problem.Buckets[index];
        var ratio = 0.0;
        foreach (var term in buckets.Ratio)
        {
            if (!assigned[term.Index])
                return bucketRange[index];
            ratio += term.Coefficient * logs[term.Index][choice[term.Index]];
        }
        // Edges are sorted; a ratio no stocked pair of the buckets has cannot work (that pair was left out).
        double min = double.PositiveInfinity, max = double.NegativeInfinity;
        var edges = buckets.Edges;
        int lo = 0, hi = edges.Count;
        while (lo < hi)
        {
            var mid = (lo + hi) / 2;
            if (edges[mid].High < ratio - 1e-9)
                lo = mid + 1;
            else
                hi = mid;
        }
        for (var j = lo; j < edges.Count && edges[j].Low <= ratio + 1e-9; j++)
        {
            min = Math.Min(min, buckets.Low[j]);
            max = Math.Max(max, buckets.High[j]);
        }
        return min <= max ? (min, max) : (double.NaN, double.NaN);
    }

    private (double Min, double Max) GroupRange(int index)
    {
        var group = problem.Groups[index];
        foreach (var slot in group.Slots)
            if (!assigned[slot])
                return groupRange[index];
        var key = 0L;
        foreach (var slot in group.Slots)
            key = key * 100_003 + choice[slot];
        var value = groupIndex[index].TryGetValue(key, out var k) ? group.LogValues[k] : double.NaN;
        return (value, value);
    }

    private static long Key(int[] tuple)
    {
        var key = 0L;
        foreach (var o in tuple)
            key = key * 100_003 + o;
        return key;
    }

    private static (double Min, double Max) Range(IEnumerable<double> values)
    {
        double min = double.PositiveInfinity, max = double.NegativeInfinity;
        foreach (var v in values)
            (min, max) = (Math.Min(min, v), Math.Max(max, v));
        return min <= max ? (min, max) : default;
    }

    private IEnumerable<int> SlotsOf(LogBound bound)
    {
        foreach (var term in bound.Terms)
            switch (term.Kind)
            {
                case TermKind.Slot:
                    yield return term.Index;
                    break;
                case TermKind.Buckets:
                    foreach (var ratio in problem.Buckets[term.Index].Ratio)
                        yield return ratio.Index;
                    break;
                default:
                    foreach (var slot in problem.Groups[term.Index].Slots)
                        yield return slot;
                    break;
            }
    }

    /// <summary>
    /// Role slots in branching order: the smallest scopes first (output stage, square-wave generator, ramp),
    /// then the threshold divider, then the rest. Inside a scope, slots that only enter a bound through a
    /// ratio come first and plain bound terms last, fewest options first, so the last one of a bound is cut
    /// to the interval the others leave. A partial design is judged where a scope completes.
    /// </summary>
    private (int[] Order, bool[] CheckAfter) BranchingOrder()
    {
        var all = variant.RoleSlots;
        var scopes = new[]
            {
                variant.ScopeOf(MissedTarget.OutputLevels),
                variant.ScopeOf(MissedTarget.Frequency),
                variant.ScopeOf(MissedTarget.TriangleAmplitude),
            }
            .Where(s => s.Count > 0 && s.Count < all.Count)
            .OrderBy(s => s.Count)
            .ToList();
        var divider = new[] { Roles.CmpRa, Roles.CmpPot, Roles.CmpRb }.Select(variant.SlotOf).Where(s => s >= 0).ToList();
        var plainTerm = new bool[problem.Slots.Count];
        foreach (var bound in problem.Bounds)
            foreach (var term in bound.Terms)
                if (term.Kind == TermKind.Slot)
                    plainTerm[term.Index] = true;

        var order = new List<int>();
        var checks = new List<int>();
        void Take(IEnumerable<int> slots)
        {
            var fresh = slots.Where(s => !order.Contains(s))
                .OrderBy(s => plainTerm[s])
                .ThenBy(s => problem.Slots[s].Options.Count)
                .ThenBy(s => s)
                .ToList();
            order.AddRange(fresh);
        }
        foreach (var scope in scopes)
        {
            Take(scope);
            checks.Add(order.Count - 1);
        }
        Take(divider);
        Take(all);
        var checkAfter = new bool[order.Count];
        foreach (var c in checks)
            if (c >= 0 && c < order.Count - 1)
                checkAfter[c] = true;
        return (order.ToArray(), checkAfter);
    }
}
