using PartsOpt.Topologies;

namespace PartsOpt.Search;

// The log-space bounds and the line-item budget at a node: what a slot may still take.
internal sealed partial class SelectionEnumerator
{
    /// <summary>
    /// The interval of ln(value) a slot may take given the slots already filled: for every bound where it
    /// is a plain term, what the bound leaves once every other term takes its widest range.
    /// </summary>
    private (double Low, double High) AllowedLog(int slot)
    {
        double low = double.NegativeInfinity, high = double.PositiveInfinity;
        foreach (var b in boundsOf[slot])
        {
            var (coefficient, restMin, restMax) = Split(b, slot);
            if (coefficient == 0 || double.IsNaN(restMin) || double.IsNaN(restMax))
                continue;
            double from = (boundLower[b] - restMax) / coefficient, to = (boundUpper[b] - restMin) / coefficient;
            if (coefficient < 0)
                (from, to) = (to, from);
            low = Math.Max(low, from - Slack);
            high = Math.Min(high, to + Slack);
        }
        return (low, high);
    }

    /// <summary>
    /// A bound split around one slot: the slot's total coefficient in it, and the least and greatest sum the
    /// other terms can still reach.
    /// </summary>
    private (int Coefficient, double RestMin, double RestMax) Split(int bound, int slot)
    {
        var coefficient = 0;
        double restMin = 0, restMax = 0;
        foreach (var term in boundTerms[bound])
        {
            if (term.Kind == TermKind.Slot && term.Index == slot)
            {
                coefficient += term.Coefficient;
                continue;
            }
            var (min, max) = TermRange(term);
            (restMin, restMax) = (restMin + min, restMax + max);
        }
        return (coefficient, restMin, restMax);
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
            double min = 0, max = 0, fixedMin = 0, fixedMax = 0;
            var key = 0L;
            foreach (var term in boundTerms[b])
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
            if (min > boundUpper[b] + Slack || max < boundLower[b] - Slack)
                return false;
            if (key == 0)
                continue;
            var (low, high) = (boundLower[b] - fixedMax, boundUpper[b] - fixedMin);
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
                    : (exhausted & (1 << slotKind[term.Index])) != 0 ? ReusableRange(term.Index) : slotRange[term.Index];
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

    /// <summary>
    /// The log range of the options of an unfilled slot that draw only lines already on the BOM (what it may
    /// take once its kind can afford no new line); NaN when there is none.
    /// </summary>
    private (double Min, double Max) ReusableRange(int slot)
    {
        double min = double.PositiveInfinity, max = double.NegativeInfinity;
        var values = logs[slot];
        foreach (var line in usedLines)
            foreach (var o in singleOption[slot][line])
                (min, max) = (Math.Min(min, values[o]), Math.Max(max, values[o]));
        if (pairOptions[slot].Count > 0)
            foreach (var a in usedLines)
                foreach (var b in usedLines)
                    if (a < b && pairOptions[slot].TryGetValue((a, b), out var both))
                        foreach (var o in both)
                            (min, max) = (Math.Min(min, values[o]), Math.Max(max, values[o]));
        return min <= max ? (min, max) : (double.NaN, double.NaN);
    }

    /// <summary>
    /// The kinds of part (bit per <see cref="RoleKind"/>) that can afford no new line item below
    /// <paramref name="depth"/>: the cheapest completion does not already pay for one of that kind, and one
    /// more would pass the cutoff. Their unfilled slots can only take lines already on the BOM.
    /// </summary>
    private int Exhausted(int depth)
    {
        if (limit is not { } bound)
            return 0;
        var (rest, kinds) = LowerBoundOfRest(depth);
        return partialObjective + rest + setup > bound.Cost ? ~kinds & 0b111 : 0;
    }

    private (double Min, double Max) BucketRange(int index)
    {
        var ratio = 0.0;
        var key = 0L;
        foreach (var term in bucketRatio[index])
        {
            if (!assigned[term.Index])
                return bucketRange[index];
            ratio += term.Coefficient * logs[term.Index][choice[term.Index]];
            key = key * 1_000_003 + choice[term.Index] + 1;
        }
        if (bucketMemo[index].Key == key)
            return bucketMemo[index].Range;
        var range = FindBucket(index, ratio);
        bucketMemo[index] = (key, range);
        return range;
    }

    /// <summary>The factor range of the bucket(s) holding a ratio; NaN when no stocked pair has it.</summary>
    private (double Min, double Max) FindBucket(int index, double ratio)
    {
        // Edges are sorted; a ratio no stocked pair of the buckets has cannot work (that pair was left out).
        double min = double.PositiveInfinity, max = double.NegativeInfinity;
        var edges = bucketEdges[index];
        int lo = 0, hi = edges.Length;
        while (lo < hi)
        {
            var mid = (lo + hi) / 2;
            if (edges[mid].High < ratio - 1e-9)
                lo = mid + 1;
            else
                hi = mid;
        }
        for (var j = lo; j < edges.Length && edges[j].Low <= ratio + 1e-9; j++)
        {
            min = Math.Min(min, bucketLow[index][j]);
            max = Math.Max(max, bucketHigh[index][j]);
        }
        return min <= max ? (min, max) : (double.NaN, double.NaN);
    }

    private (double Min, double Max) GroupRange(int index)
    {
        var slots = groupSlots[index];
        foreach (var slot in slots)
            if (!assigned[slot])
                return groupRange[index];
        var key = 0L;
        foreach (var slot in slots)
            key = key * 100_003 + choice[slot];
        var value = groupIndex[index].TryGetValue(key, out var k) ? groupLogValues[index][k] : double.NaN;
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
}
