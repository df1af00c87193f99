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
internal sealed partial class SelectionEnumerator
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
    private readonly int[][][] singleOption;
    private readonly Dictionary<(int, int), int[]>[] pairOptions;
    private readonly long setup;
    private readonly long fixedObjective;
    private readonly long[] capacity;
    private readonly int[][] boundsOf;
    private readonly double[][] logs;
    private readonly (double Min, double Max)[] slotRange;
    private readonly (double Min, double Max)[] bucketRange;
    private readonly (double Min, double Max)[] groupRange;
    private readonly Dictionary<long, int>[] groupIndex;

    // The problem's bounds, buckets and groups as plain arrays: read at every node, where the lists'
    // interface enumerators cost an allocation and a virtual call each.
    private readonly LogTerm[][] boundTerms;
    private readonly double[] boundLower, boundUpper;
    private readonly LogTerm[][] bucketRatio;
    private readonly (double Low, double High)[][] bucketEdges;
    private readonly double[][] bucketLow, bucketHigh;
    private readonly int[][] groupSlots;
    private readonly double[][] groupLogValues;
    private readonly int dividerRa, dividerPot, dividerRb, dividerDepth;

    /// <summary>
    /// Threshold dividers the engine rejected on their own (the thresholds outside the comparator's input
    /// range, a divider part's rating): they fail whatever the rest of the design, so are not judged again.
    /// </summary>
    private readonly HashSet<long> failedDividers = [];

    /// <summary>The three-stage integrator's input resistor when it is filled below the square-wave generator (else −1), and its learnt floor (ln Ω).</summary>
    private readonly int integratorInput;
    private double integratorInputFloor = double.NegativeInfinity;

    // Search state.
    private readonly int[] choice;
    private readonly bool[] assigned;
    private readonly long[] use;
    private readonly int[] lineRefs;
    private readonly List<int> usedLines = [];
    private readonly double[] needTopAbove, needBottomBelow;
    private long partialObjective;
    private double errorAtFrequencyDepth = double.NaN;
    private SearchCutoff? limit;
    private int exhausted;
    private readonly List<(int Slot, int Option)> extraTaken = [];
    private int[] trialBuffer = [];
    private bool untilCutoff, collecting;
    private long collectAbove;
    private readonly List<Generator> generators = [];
    private readonly List<int> generatorOptions = [];
    private readonly int[][] slotsOnLine;
    private readonly int[] reusable;
    private readonly long[] cheapestFrom;
    private readonly (long Key, (double Min, double Max) Range)[] bucketMemo;
    private readonly double[][] values;
    private readonly double frequencyTarget, frequencyTolerance, dutyMin, dutyMax;
    private readonly bool learnsDuty;
    private readonly int dutyFrame;
    private readonly List<(double Threshold, double Duty)> tops = [], bottoms = [];
    private double topOutsideFrom = double.PositiveInfinity, bottomOutsideTo = double.NegativeInfinity;
    private readonly IReadOnlyList<int> rampSlots;
    private readonly FrequencyForecast? forecast;
    private bool forecastTrusted = true;

    /// <summary>False once a forecast disagreed with the engine in the last run.</summary>
    public bool ForecastTrusted => forecastTrusted;
    private readonly int[][] buffers;
    private readonly int[][] byLog;
    private readonly double[][] sortedLogs;
    private readonly int[][] marks;
    private int stamp;
    private readonly int frequencyBound;
    private readonly int frequencyDepth;
    private long nodes;
    private DateTime deadline;
    private DateTime stopAt; // the deadline, or the end of phase 1's first look
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
        // Slots of one kind share their option list (SearchContext.SlotOptionsFor), and so their tables:
        // made once per search, shared by every slot and variant that has the list.
        var tables = slots.Select(slot => variant.Context.EnumeratorTables.GetOrAdd(slot.Options,
            options => new SlotTable(options, DrawObjective, problem.Lines.Count))).ToArray();
        objective = tables.Select(t => t.Objective).ToArray();
        linesOf = tables.Select(t => t.LinesOf).ToArray();
        drawsOf = tables.Select(t => t.DrawsOf).ToArray();
        byCost = tables.Select(t => t.ByCost).ToArray();
        minObjective = tables.Select(t => t.MinObjective).ToArray();
        capacity = problem.Lines.Select(l => (long)l.Available).ToArray();
        logs = tables.Select(t => t.Logs).ToArray();
        singleOption = tables.Select(t => t.SingleOption).ToArray();
        pairOptions = tables.Select(t => t.PairOptions).ToArray();
        slotKind = new int[slots.Count];
        for (var s = 0; s < slots.Count; s++)
            slotKind[s] = s < roleCount ? (int)Roles.KindOf(variant.RoleNames[s]) : (int)RoleKind.Capacitor;

        slotRange = tables.Select(t => t.Range).ToArray();
        bucketRange = problem.Buckets.Select(b => (b.Low.Where(double.IsFinite).DefaultIfEmpty(0).Min(), b.High.Where(double.IsFinite).DefaultIfEmpty(0).Max())).ToArray();
        groupRange = problem.Groups.Select(g => Range(g.LogValues.Where(v => !double.IsNaN(v)))).ToArray();
        groupIndex = problem.Groups.Select(g =>
        {
            var index = new Dictionary<long, int>(g.Tuples.Count);
            for (var k = 0; k < g.Tuples.Count; k++)
                index[Key(g.Tuples[k])] = k;
            return index;
        }).ToArray();

        boundTerms = problem.Bounds.Select(b => b.Terms.ToArray()).ToArray();
        boundLower = problem.Bounds.Select(b => b.Lower).ToArray();
        boundUpper = problem.Bounds.Select(b => b.Upper).ToArray();
        bucketRatio = problem.Buckets.Select(b => b.Ratio.ToArray()).ToArray();
        bucketEdges = problem.Buckets.Select(b => b.Edges.ToArray()).ToArray();
        bucketLow = problem.Buckets.Select(b => b.Low.ToArray()).ToArray();
        bucketHigh = problem.Buckets.Select(b => b.High.ToArray()).ToArray();
        groupSlots = problem.Groups.Select(g => g.Slots.ToArray()).ToArray();
        groupLogValues = problem.Groups.Select(g => g.LogValues.ToArray()).ToArray();

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

        buffers = order.Select(s => new int[slots[s].Options.Count]).ToArray();
        byLog = tables.Select(t => t.ByLog).ToArray();
        sortedLogs = tables.Select(t => t.SortedLogs).ToArray();
        marks = slots.Select(s => new int[s.Options.Count]).ToArray();
        frequencyBound = problem.Bounds.Select((b, i) => (b, i)).FirstOrDefault(x => x.b.Figure == FigureNames.Frequency, (null!, -1)).Item2;
        values = tables.Select(t => t.Values).ToArray();
        frequencyTarget = variant.Context.Requirement.Frequency.Target;
        frequencyTolerance = variant.Context.Requirement.Frequency.Tolerance;
        (dutyMin, dutyMax) = (variant.Context.Requirement.Duty.Min, variant.Context.Requirement.Duty.Max);
        // Duty samples are shared by leaves that differ only in the divider: the divider must be the last
        // three roles, and the frame is the role just above them.
        learnsDuty = dividerDepth == order.Length - 1 && new[] { dividerRa, dividerPot, dividerRb }.All(s => position[s] >= order.Length - 3);
        dutyFrame = learnsDuty ? order.Length - 4 : -1;
        rampSlots = variant.ScopeOf(MissedTarget.TriangleAmplitude);
        integratorInput = variant.Topology == TopologyKind.ThreeStage && variant.SlotOf(Roles.IntR) is >= 0 and var intR
            && frequencyDepth >= 0 && position[intR] > frequencyDepth
            ? intR
            : -1;
        forecast = frequencyDepth >= 0 && FrequencyForecast.For(variant) is { } f && f.Slots.All(s => position[s] <= frequencyDepth) ? f : null;
        // The slots with a one-line option on each line (their reuse count rises when the line comes onto
        // the BOM), and the cheapest options of the slots from each depth on (the extra slots included).
        slotsOnLine = Enumerable.Range(0, problem.Lines.Count)
            .Select(line => Enumerable.Range(0, slots.Count).Where(s => singleOption[s][line].Length > 0).ToArray()).ToArray();
        reusable = new int[slots.Count];
        bucketMemo = new (long, (double, double))[problem.Buckets.Count];
        var extraCheapest = Enumerable.Range(roleCount, slots.Count - roleCount).Sum(s => minObjective[s]);
        cheapestFrom = new long[order.Length + 1];
        cheapestFrom[order.Length] = extraCheapest;
        for (var d = order.Length - 1; d >= 0; d--)
            cheapestFrom[d] = cheapestFrom[d + 1] + minObjective[order[d]];
        choice = new int[slots.Count];
        trialBuffer = new int[slots.Count];
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
        stopAt = deadline;
        stopped = false;
        nodes = 0;
        Judged = 0;
        var found = new List<AcceptedChoice>();
        var seen = new HashSet<string>();
        limit = cutoff();
        onAccepted = a =>
        {
            // The two phases below may meet a design twice.
            if (!seen.Add(string.Join(',', a.Choice.Take(roleCount))))
                return;
            found.Add(a);
            accepted(a);
            limit = cutoff();
        };
        var buildable = problem.Bounds.All(b => b.Lower <= b.Upper && !double.IsNegativeInfinity(b.Upper))
            && Enumerable.Range(0, roleCount).All(s => problem.Slots[s].Options.Count > 0);
        if (buildable && TakeFixed())
        {
            exhausted = Exhausted(0);
            if (forecast is null)
                Descend(0);
            else
            {
                // Phase 1: depth first until the list has a cutoff. Phase 2: every square-wave generator
                // within it, collected with its cheapest completion and forecast frequency error, then
                // completed in rank order until the next one ranks after the cutoff.
                untilCutoff = limit is null;
                var walked = false; // the whole tree, with no design in it
                if (untilCutoff && QuickStart)
                {
                    // Usually the walk finds a first design at once. Where it does not within a short look,
                    // a quick design by one-role repairs (judged like any other) mostly does; then the walk
                    // again, from the start, without a budget.
                    stopAt = Min(deadline, DateTime.UtcNow + FirstLookBudget);
                    Descend(0);
                    stopAt = deadline;
                    walked = !stopped && limit is null;
                    if (stopped && !cancellation.IsCancellationRequested && DateTime.UtcNow < deadline)
                        stopped = false;
                    if (!walked && !stopped && limit is null && StartingDesign.Find(variant, Min(deadline, DateTime.UtcNow + QuickStartBudget)) is { } start)
                        Whole(start);
                }
                untilCutoff = limit is null;
                if (untilCutoff && !stopped && !walked)
                    Descend(0);
                untilCutoff = false;
                if (!stopped && limit is not null)
                    ByGenerator();
            }
        }
        var ranked = AcceptedChoice.InRankOrder(found);
        return new SelectionRun(ranked, !stopped, (int)Math.Min(Judged, int.MaxValue), []);
    }

    /// <summary>The fixed draws (op-amp packages) take their stock and line items before any role.</summary>
    private bool TakeFixed()
    {
        Array.Clear(use);
        Array.Clear(lineRefs);
        Array.Clear(reusable);
        usedLines.Clear();
        partialObjective = fixedObjective;
        foreach (var draw in problem.FixedDraws)
        {
            if (lineRefs[draw.Line]++ == 0)
            {
                usedLines.Add(draw.Line);
                partialObjective += setup;
                foreach (var s in slotsOnLine[draw.Line])
                    reusable[s]++;
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
        if ((++nodes & 1023) == 0)
        {
            if (cancellation.IsCancellationRequested || DateTime.UtcNow >= stopAt)
                stopped = true;
            // Variants running beside this one tighten the shared cutoff too. A band is collected under its
            // own ceiling, which the shared cutoff may only lower: a generator dearer than the cutoff can
            // never enter the list, whatever its frequency error.
            if (cutoff() is { } latest)
            {
                if (collecting)
                {
                    if (latest.Cost < limit!.Value.Cost)
                        limit = new SearchCutoff(latest.Cost, double.PositiveInfinity);
                }
                else if (limit is not { } own || latest.CompareTo(own) < 0)
                    limit = latest;
            }
        }
        if (stopped || (untilCutoff && limit is not null))
            return -1;

        var slot = order[depth];
        var (low, high) = AllowedLog(slot);
        if (slot == integratorInput)
            low = Math.Max(low, Math.BitIncrement(integratorInputFloor));
        if (!(low <= high))
            return depth - 1;

        // First the options that add no line item, then the rest, each cheapest first (at the slot that
        // closes the frequency, equal costs nearest the target first, so the list's frequency errors, and
        // with them the cutoff, tighten early); the rest only until one would pass the cutoff even with the
        // cheapest completion. The cheapest completion is worked out once: the state is restored after
        // every try.
        var (count, reusing) = Candidates(depth, slot, low, high);
        var candidates = buffers[depth];
        var (rest, kinds) = LowerBoundOfRest(depth + 1);
        var shared = (kinds & (1 << slotKind[slot])) != 0 ? setup : 0;
        for (var i = 0; i < count; i++)
        {
            var o = candidates[i];
            if (i >= reusing && limit is { } bound && partialObjective + objective[slot][o] + setup + rest - shared > bound.Cost)
                break;
            var next = Try(depth, slot, o);
            if (next < depth)
                return next;
        }
        return depth - 1;
    }

    /// <summary>
    /// The options to try at <paramref name="depth"/>, inside the slot's log interval, into that depth's
    /// buffer: first those drawing only lines already on the BOM, then the rest, each in cost order.
    /// Returns how many, and how many of them reuse lines.
    /// </summary>
    private (int Count, int Reusing) Candidates(int depth, int slot, double low, double high)
    {
        var buffer = buffers[depth];
        var mark = ++stamp;
        var count = 0;
        var values = logs[slot];
        void Reuse(int[] options)
        {
            foreach (var o in options)
                if (values[o] >= low && values[o] <= high && marks[slot][o] != mark)
                {
                    marks[slot][o] = mark;
                    buffer[count++] = o;
                }
        }
        foreach (var line in usedLines)
            Reuse(singleOption[slot][line]);
        if (pairOptions[slot].Count > 0)
            foreach (var a in usedLines)
                foreach (var b in usedLines)
                    if (a < b && pairOptions[slot].TryGetValue((a, b), out var both))
                        Reuse(both);
        var reusing = count;
        var costs = objective[slot];
        if ((exhausted & (1 << slotKind[slot])) == 0)
        {
            // The rest inside [low, high], found by bisection in the slot's options sorted by value.
            var sorted = byLog[slot];
            var sortedValues = sortedLogs[slot];
            var from = LowerIndex(sortedValues, low);
            var to = LowerIndex(sortedValues, high);
            while (to < sorted.Length && sortedValues[to] <= high)
                to++;
            if (to - from > 32)
            {
                // A wide interval: the options already in cost order, filtered, beat sorting them.
                foreach (var o in byCost[slot])
                    if (marks[slot][o] != mark && values[o] >= low && values[o] <= high)
                        buffer[count++] = o;
            }
            else
            {
                for (var i = from; i < to; i++)
                    if (marks[slot][sorted[i]] != mark)
                        buffer[count++] = sorted[i];
                SortSmall(buffer.AsSpan(reusing, count - reusing), new CheapestFirst(costs, values, double.NaN));
            }
        }

        var cheapest = new CheapestFirst(costs, values, depth == frequencyDepth ? CentreOfBand(slot) ?? double.NaN : double.NaN);
        SortSmall(buffer.AsSpan(0, reusing), cheapest);
        if (!double.IsNaN(cheapest.Centre))
            SortSmall(buffer.AsSpan(reusing, count - reusing), cheapest);
        return (count, reusing);
    }

    /// <summary>Insertion sort for the few candidates of a deep slot (no delegate, no allocation); the library sort past 32.</summary>
    private static void SortSmall(Span<int> items, CheapestFirst order)
    {
        if (items.Length > 32)
        {
            items.Sort(order);
            return;
        }
        for (var i = 1; i < items.Length; i++)
        {
            var item = items[i];
            var j = i - 1;
            while (j >= 0 && order.Compare(items[j], item) > 0)
            {
                items[j + 1] = items[j];
                j--;
            }
            items[j + 1] = item;
        }
    }

    /// <summary>The first index whose value is at least <paramref name="value"/> (values sorted ascending).</summary>
    private static int LowerIndex(double[] values, double value)
    {
        int lo = 0, hi = values.Length;
        while (lo < hi)
        {
            var mid = (lo + hi) >>> 1;
            if (values[mid] < value)
                lo = mid + 1;
            else
                hi = mid;
        }
        return lo;
    }

    /// <summary>
    /// Where the frequency bound puts the slot's log value for the band's centre (the middle of the interval
    /// it leaves once the other terms are filled); null when the slot is not a plain term of it.
    /// </summary>
    private double? CentreOfBand(int slot)
    {
        if (frequencyBound < 0)
            return null;
        var (coefficient, restMin, restMax) = Split(frequencyBound, slot);
        double lower = boundLower[frequencyBound], upper = boundUpper[frequencyBound];
        if (coefficient == 0 || !double.IsFinite(lower) || !double.IsFinite(upper) || double.IsNaN(restMin))
            return null;
        return ((lower + upper) / 2 - (restMin + restMax) / 2) / coefficient;
    }

    /// <summary>Fills one slot with one option and goes deeper if the bounds allow; returns as <see cref="Descend"/> does for the level.</summary>
    private int Try(int depth, int slot, int o)
    {
        var next = depth;
        if (depth == frequencyDepth)
        {
            errorAtFrequencyDepth = double.NaN; // known again only after this option's partial check
            integratorInputFloor = double.NegativeInfinity; // learnt anew for each generator
        }
        var before = exhausted;
        if (Assign(slot, o))
        {
            // The cheapest completion, once: it decides the cutoff, the kinds that can take no new line
            // below (also for the next level), and whether a forecast may skip the judge.
            var (rest, kinds) = LowerBoundOfRest(depth + 1);
            var least = partialObjective + rest;
            if (Admits(least, depth))
            {
                exhausted = limit is { } bound && least + setup > bound.Cost ? ~kinds & 0b111 : 0;
                if (BoundsHold(slot) && !(depth == frequencyDepth && RanksOutOnFrequency(least)))
                {
                    if (collecting && depth == frequencyDepth)
                    {
                        Collect(least);
                        Unassign(slot, o);
                        exhausted = before;
                        return depth;
                    }
                    var check = PartialCheck(depth);
                    if (check > depth)
                    {
                        needTopAbove[depth] = double.NegativeInfinity;
                        needBottomBelow[depth] = double.PositiveInfinity;
                        if (depth == dutyFrame)
                        {
                            tops.Clear();
                            bottoms.Clear();
                        }
                        next = Descend(depth + 1);
                    }
                    else
                        next = check;
                }
            }
        }
        Unassign(slot, o);
        exhausted = before;
        return Math.Min(next, depth);
    }

    /// <summary>
    /// False when no completion can enter the list: it would cost more than the cutoff, or as much with a
    /// larger frequency error (known once the square-wave generator is filled).
    /// </summary>
    private bool Admits(long least, int depth) =>
        limit is not { } bound || least < bound.Cost || (least == bound.Cost && !(KnownError(depth) > bound.FrequencyError));

    /// <summary>
    /// True when every completion would tie the cutoff on cost at best and the forecast frequency error
    /// (<see cref="FrequencyForecast"/>) ranks it after the cutoff: skipped without judging.
    /// </summary>
    private bool RanksOutOnFrequency(long least)
    {
        if (forecast is null || !forecastTrusted || limit is not { } bound || least < bound.Cost)
            return false;
        var error = ForecastError();
        return error > bound.FrequencyError * (1 + 1e-9) + 1e-15;
    }

    private double ForecastError()
    {
        var frequency = forecast!.Frequency(values, choice);
        return Math.Abs(frequency - frequencyTarget) / frequencyTarget;
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
        var trial = trialBuffer;
        Array.Copy(choice, trial, choice.Length);
        for (var s = 0; s < roleCount; s++)
            if (!assigned[s])
                trial[s] = byCost[s].Length > 0 ? byCost[s][0] : 0;
        Judged++;
        PartialJudged++;
        var judgement = judgePartial(trial);
        if (depth == frequencyDepth)
        {
            errorAtFrequencyDepth = judgement?.FrequencyError ?? double.NaN;
            // The forecast checks itself against every judgement: any disagreement and it is not used again.
            if (forecast is not null && judgement is not null && double.IsFinite(judgement.FrequencyError)
                && ForecastError() is var forecastError && double.IsFinite(forecastError)
                && Math.Abs(forecastError - judgement.FrequencyError) > 1e-9 * Math.Max(judgement.FrequencyError, 1e-9))
                forecastTrusted = false;
            if (!Admits(partialObjective + LowerBoundOfRest(depth + 1).Bound, depth))
                return depth;
        }
        if (judgement is not null)
            LearnIntegratorInputFloor(judgement);
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
        if (dividerDepth >= 0 && (!ThresholdsReachFurther() || ThresholdsOutside()))
            return depth - 1;

        // The extra slots (decoupling) do not make a different circuit: the cheapest that fits is taken.
        var extra = extraTaken;
        extra.Clear();
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
        if (limit is { } c && RanksAfter(c, total, depth, snapshot))
            return depth - 1;

        if (limit is { } tie && DutyMarginRanksAfter(tie, total, depth, snapshot))
            return depth - 1;

        if (dividerDepth >= 0 && failedDividers.Contains(DividerKey()))
            return depth - 1;
        if ((Judged & 15) == 0 && (cancellation.IsCancellationRequested || DateTime.UtcNow >= stopAt))
        {
            stopped = true; // judging is what takes the time: checked here too, not only every 1,024 nodes
            return -1;
        }
        Judged++;
        var verdict = verify(snapshot);
        if (verdict.Payload is DesignJudgement judged)
            LearnDuty(judged);
        if (verdict.Accepted)
        {
            onAccepted(new AcceptedChoice(snapshot, total, verdict));
            return depth - 1;
        }
        if (verdict.Payload is DesignJudgement rejected)
            LearnIntegratorInputFloor(rejected);
        if (verdict.Payload is not DesignJudgement judgement || judgement.Accepted)
            return verdict.CutSlots is { } cut ? cut.Max(s => position[s]) : depth - 1; // invalid, or a yield short
        var plain = variant.PlainScope(judgement);
        if (dividerDepth >= 0 && plain.All(s => s == dividerRa || s == dividerPot || s == dividerRb))
            failedDividers.Add(DividerKey()); // fails with any generator and ramp: never judged again
        if (dividerDepth >= 0 && variant.ThresholdsLeaveComparatorRange(judgement))
            LearnThresholdsOutside();
        if (plain.Count < roleCount || !judgement.Missed.Contains(MissedTarget.DutyRange))
            return plain.Max(s => position[s]);
        if (variant.Prototype.DutyControl is ControlVoltageDuty)
            return rampSlots.Max(s => position[s]); // the duty then depends on the ramp alone
        // A missed duty range: duty falls as the threshold rises, so with the same ramp every divider reaching
        // no further at the failing end fails too. Learnt for the subtree of the ramp's last role.
        if (dividerDepth >= 0 && rampSlots.All(s => position[s] < dividerDepth - 2))
        {
            var frame = rampSlots.Max(s => position[s]);
            var (top, bottom) = Thresholds();
            if (judgement.MissesLowDuty)
                needTopAbove[frame] = Math.Max(needTopAbove[frame], top);
            if (judgement.MissesHighDuty)
                needBottomBelow[frame] = Math.Min(needBottomBelow[frame], bottom);
        }
        return depth - 1;
    }

    /// <summary>
    /// Three-stage: the oscillator's output drives the timing resistor, the hysteresis divider and the
    /// integrator's input resistor, which draws level/int.r (CircuitChecks.OutputCurrents): with the square-wave
    /// generator fixed, the output-current check only improves as int.r grows. A design rejected on it puts
    /// a floor under int.r for every completion of the same generator: no value at or below it is tried.
    /// </summary>
    private void LearnIntegratorInputFloor(DesignJudgement judgement)
    {
        if (integratorInput >= 0 && assigned[integratorInput] && judgement.FailedChecks.Contains("output current (oscillator)"))
            integratorInputFloor = Math.Max(integratorInputFloor, logs[integratorInput][choice[integratorInput]]);
    }

    /// <summary>The threshold divider's options as one key (<see cref="failedDividers"/>).</summary>
    private long DividerKey() =>
        ((long)choice[dividerRa] * problem.Slots[dividerPot].Options.Count + choice[dividerPot]) * problem.Slots[dividerRb].Options.Count + choice[dividerRb];

    /// <summary>
    /// True when a whole design, not yet judged, cannot rank before the cutoff: dearer; as dear with a larger
    /// frequency error; or as dear with the same error, where its margin can be no larger than the frequency's
    /// own (the tolerance less the error) and so must beat or tie the cutoff's, a tie going to the key.
    /// </summary>
    private bool RanksAfter(SearchCutoff cut, long total, int depth, int[] design)
    {
        if (total != cut.Cost)
            return total > cut.Cost;
        var error = KnownError(depth);
        if (!(error <= cut.FrequencyError))
            return error > cut.FrequencyError;
        if (error < cut.FrequencyError || cut.Key is null)
            return false;
        var marginAtMost = frequencyTolerance - error;
        return marginAtMost < cut.Margin
            || (marginAtMost == cut.Margin && string.CompareOrdinal(DesignAssembler.Key(variant, design), cut.Key.Value) > 0);
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
                foreach (var s in slotsOnLine[line])
                    reusable[s]++;
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
                foreach (var s in slotsOnLine[line])
                    reusable[s]--;
            }
    }

    /// <summary>
    /// A lower bound on what the slots from <paramref name="depth"/> on add: each one's cheapest option,
    /// and one line item for every kind of part some of them cannot take from a line already on the BOM.
    /// </summary>
    private (long Bound, int Kinds) LowerBoundOfRest(int depth)
    {
        var bound = cheapestFrom[depth];
        var kinds = 0;
        for (var d = depth; d < order.Length; d++)
        {
            var slot = order[d];
            if ((kinds & (1 << slotKind[slot])) == 0 && !CanReuse(slot))
                kinds |= 1 << slotKind[slot];
        }
        for (var s = roleCount; s < problem.Slots.Count; s++)
            if ((kinds & (1 << slotKind[s])) == 0 && !CanReuse(s))
                kinds |= 1 << slotKind[s];
        return (bound + System.Numerics.BitOperations.PopCount((uint)kinds) * setup, kinds);
    }

    private bool CanReuse(int slot)
    {
        if (reusable[slot] > 0)
            return true;
        if (pairOptions[slot].Count > 0)
            foreach (var a in usedLines)
                foreach (var b in usedLines)
                    if (a < b && pairOptions[slot].ContainsKey((a, b)))
                        return true;
        return false;
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

    /// <summary>Options cheapest first; at equal cost nearest a log value (when one is given), then by index.</summary>
    private readonly struct CheapestFirst(long[] costs, double[] logs, double centre) : IComparer<int>
    {
        public double Centre => centre;

        public int Compare(int x, int y)
        {
            if (costs[x] != costs[y])
                return costs[x].CompareTo(costs[y]);
            if (!double.IsNaN(centre))
            {
                double dx = Math.Abs(logs[x] - centre), dy = Math.Abs(logs[y] - centre);
                if (dx != dy)
                    return dx.CompareTo(dy);
            }
            return x.CompareTo(y);
        }
    }
}
