namespace PartsOpt.Search;

/// <summary>
/// The ratios x = ln(r2) − ln(r1) that two option lists can form, distinct and ascending, with how many
/// pairs form each. Stocked series repeat their ratios from decade to decade (E96 × E96 over five decades:
/// 231,361 pairs, 144,447 distinct ratios), and the relaxation oscillator's buckets need only the ratios in
/// order with their pair counts: worked out once per search and shared by every amplifier.
/// </summary>
internal sealed class DividerRatios
{
    private DividerRatios(double[] ratios, int[] pairs) => (Ratios, Pairs) = (ratios, pairs);

    /// <summary>The distinct ratios, ascending.</summary>
    public double[] Ratios { get; }

    /// <summary>How many (r1, r2) pairs form each ratio.</summary>
    public int[] Pairs { get; }

    public static DividerRatios Of(IReadOnlyList<SlotOption> first, IReadOnlyList<SlotOption> second)
    {
        var all = new double[first.Count * second.Count];
        var n = 0;
        foreach (var a in first)
            foreach (var b in second)
                all[n++] = b.LogValue - a.LogValue;
        Array.Sort(all);
        var ratios = new List<double>();
        var pairs = new List<int>();
        for (var i = 0; i < all.Length;)
        {
            var j = i + 1;
            while (j < all.Length && all[j] == all[i])
                j++;
            ratios.Add(all[i]);
            pairs.Add(j - i);
            i = j;
        }
        return new DividerRatios([.. ratios], [.. pairs]);
    }
}
