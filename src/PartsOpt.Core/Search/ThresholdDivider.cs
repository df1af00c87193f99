using PartsOpt.Topologies;

namespace PartsOpt.Search;

/// <summary>
/// The comparator's threshold divider as one tuple group over (cmp.ra, cmp.pot, cmp.rb), with the
/// threshold range each tuple gives (engine formula: V− + span·rb/Σ at setting 0, V− + span·(rb + pot)/Σ
/// at setting 1). Lets a duty miss cut every divider that reaches no further than the one that failed.
/// </summary>
internal sealed class ThresholdDivider
{
    private readonly int ra, pot, rb, potCount, rbCount;
    private readonly double[] low, high;

    private ThresholdDivider(TupleGroup group, int ra, int pot, int rb, int potCount, int rbCount, double[] low, double[] high)
    {
        Group = group;
        (this.ra, this.pot, this.rb, this.potCount, this.rbCount) = (ra, pot, rb, potCount, rbCount);
        (this.low, this.high) = (low, high);
    }

    /// <summary>Largest tuple group built; past it the group is left out (sound, only slower).</summary>
    public const int MaxTuples = 40_000;

    public TupleGroup Group { get; }

    /// <summary>The divider's group, or null when the duty is set by a control voltage or the group would be too large.</summary>
    public static ThresholdDivider? For(SearchVariant variant, IReadOnlyList<SelectionSlot> slots)
    {
        int ra = variant.SlotOf(Roles.CmpRa), pot = variant.SlotOf(Roles.CmpPot), rb = variant.SlotOf(Roles.CmpRb);
        if (ra < 0 || pot < 0 || rb < 0)
            return null;
        int na = slots[ra].Options.Count, np = slots[pot].Options.Count, nb = slots[rb].Options.Count;
        if ((long)na * np * nb > MaxTuples)
            return null;
        double Value(int slot, int option) => ((StockChoice)slots[slot].Options[option].Tag!).Value;
        var supply = variant.Prototype.Supply;
        // A threshold outside the comparator's input range fails the engine's common-mode check whatever the ramp.
        var comparator = variant.Prototype.ComparatorPart;
        var floor = supply.NegativeV + comparator.InputHeadroomLowV - 1e-9;
        var ceiling = supply.PositiveV - comparator.InputHeadroomHighV + 1e-9;
        var logs = new double[na * np * nb];
        var tuples = new List<int[]>(na * np * nb);
        var low = new double[na * np * nb];
        var high = new double[na * np * nb];
        for (var a = 0; a < na; a++)
            for (var p = 0; p < np; p++)
                for (var b = 0; b < nb; b++)
                {
                    double va = Value(ra, a), vp = Value(pot, p), vb = Value(rb, b), sum = va + vp + vb;
                    low[tuples.Count] = supply.NegativeV + supply.SpanV * vb / sum;
                    high[tuples.Count] = supply.NegativeV + supply.SpanV * (vb + vp) / sum;
                    if (low[tuples.Count] < floor || high[tuples.Count] > ceiling)
                        logs[tuples.Count] = double.NaN;
                    tuples.Add([a, p, b]);
                }
        return new ThresholdDivider(new TupleGroup([ra, pot, rb], tuples, logs),
            ra, pot, rb, np, nb, low, high);
    }

    /// <summary>
    /// The tuples that reach further than the chosen one at the failing end(s): a higher top threshold
    /// when the lowest duty is too high, a lower bottom threshold when the highest duty is too low. Every
    /// other divider fails the same way with the same ramp.
    /// </summary>
    public IReadOnlyList<int> Escape(int[] choice, bool missesLowDuty, bool missesHighDuty)
    {
        var current = (choice[ra] * potCount + choice[pot]) * rbCount + choice[rb];
        return Enumerable.Range(0, low.Length)
            .Where(k => !double.IsNaN(Group.LogValues[k]))
            .Where(k => (!missesLowDuty || high[k] > high[current]) && (!missesHighDuty || low[k] < low[current]))
            .ToList();
    }
}
