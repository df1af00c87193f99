using PartsOpt.Topologies;

namespace PartsOpt.Search;

// Duty: the threshold requirements learnt from misses, and duty margins bounded from judged siblings.
internal sealed partial class SelectionEnumerator
{
    /// <summary>
    /// With the rest of the design fixed, duty falls as the threshold rises (the fact the duty cut rests on).
    /// So a divider whose top threshold is at most a judged sibling's reaches a lowest duty at least that
    /// sibling's, and one whose bottom is at least a sibling's a highest duty at most its: each bounds the
    /// duty margin, min(duty min − lowest, highest − duty max), from above without judging. A design tied
    /// on cost and frequency error whose margin can then not beat the cutoff's ranks after it (a tie on the
    /// margin going to the key).
    /// </summary>
    private bool DutyMarginRanksAfter(SearchCutoff cut, long total, int depth, int[] design)
    {
        if (!learnsDuty || total != cut.Cost || cut.Key is null)
            return false;
        var error = KnownError(depth);
        if (!(error == cut.FrequencyError))
            return false;
        var (top, bottom) = Thresholds();
        var bound = frequencyTolerance - error;
        // Sibling with the least top threshold at or above this one; the greatest bottom at or below.
        var above = Bisect(tops, top);
        if (above < tops.Count)
            bound = Math.Min(bound, dutyMin - tops[above].Duty);
        var below = Bisect(bottoms, bottom);
        if (below < bottoms.Count && bottoms[below].Threshold == bottom)
            below++;
        if (below > 0)
            bound = Math.Min(bound, bottoms[below - 1].Duty - dutyMax);
        return bound < cut.Margin
            || (bound == cut.Margin && string.CompareOrdinal(DesignAssembler.Key(variant, design), cut.Key.Value) > 0);
    }

    /// <summary>Records a judged leaf's duty at its two thresholds, for its siblings under the same ramp.</summary>
    private void LearnDuty(DesignJudgement judgement)
    {
        if (!learnsDuty)
            return;
        var atMin = judgement.Evaluation.Figure(FigureNames.DutyAtSettingMin) ?? double.NaN;
        var atMax = judgement.Evaluation.Figure(FigureNames.DutyAtSettingMax) ?? double.NaN;
        double lowest = Math.Min(atMin, atMax), highest = Math.Max(atMin, atMax);
        if (!double.IsFinite(lowest) || !double.IsFinite(highest))
            return;
        var (top, bottom) = Thresholds();
        tops.Insert(Bisect(tops, top), (top, lowest));
        bottoms.Insert(Bisect(bottoms, bottom), (bottom, highest));
    }

    /// <summary>The first index whose threshold is at least <paramref name="threshold"/> (sorted ascending).</summary>
    private static int Bisect(List<(double Threshold, double Duty)> samples, double threshold)
    {
        int lo = 0, hi = samples.Count;
        while (lo < hi)
        {
            var mid = (lo + hi) >>> 1;
            if (samples[mid].Threshold < threshold)
                lo = mid + 1;
            else
                hi = mid;
        }
        return lo;
    }

    /// <summary>The threshold divider's top and bottom thresholds, as fractions of the supply span.</summary>
    private (double Top, double Bottom) Thresholds()
    {
        double Value(int slot) => ((StockChoice)problem.Slots[slot].Options[choice[slot]].Tag!).Value;
        double ra = Value(dividerRa), pot = Value(dividerPot), rb = Value(dividerRb), sum = ra + pot + rb;
        return ((rb + pot) / sum, rb / sum);
    }

    /// <summary>
    /// Learns from a divider whose thresholds left the comparator's input range
    /// (<see cref="SearchVariant.ThresholdsLeaveComparatorRange"/>): the range check falls as the top threshold
    /// rises and as the bottom one falls, so every divider whose top is at least a top found above the range,
    /// or whose bottom is at most a bottom found below it, fails too, whatever the ramp.
    /// </summary>
    private void LearnThresholdsOutside()
    {
        var (top, bottom) = Thresholds();
        var (above, below) = variant.ThresholdsOutsideComparatorRange(top, bottom);
        if (above)
            topOutsideFrom = Math.Min(topOutsideFrom, top);
        if (below)
            bottomOutsideTo = Math.Max(bottomOutsideTo, bottom);
    }

    /// <summary>True when the filled divider's thresholds reach as far as thresholds learnt to leave the comparator's range.</summary>
    private bool ThresholdsOutside()
    {
        var (top, bottom) = Thresholds();
        return top >= topOutsideFrom || bottom <= bottomOutsideTo;
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
}
