using PartsOpt.Topologies;

namespace PartsOpt.Search;

/// <summary>
/// Remembers, per topology, what the engine rejected and why: how often each target was missed and the
/// nearest miss (smallest shortfall), for the report when a topology has no design.
/// </summary>
internal sealed class MissTracker
{
    private readonly Dictionary<TopologyKind, Dictionary<MissedTarget, int>> counts = [];
    private readonly Dictionary<TopologyKind, (SearchVariant Variant, int[] Choice, DesignJudgement Judgement)> nearest = [];
    private readonly Dictionary<TopologyKind, List<string>> other = [];

    private readonly Lock gate = new();

    /// <summary>
    /// Records a rejection; the nearest miss is the smallest shortfall, ties going to the smaller key, so the
    /// report does not depend on the order variants searched side by side happen to find them.
    /// </summary>
    public void Rejected(SearchVariant variant, int[] choice, DesignJudgement judgement)
    {
        lock (gate)
        {
            var tally = counts.TryGetValue(variant.Topology, out var t) ? t : counts[variant.Topology] = [];
            foreach (var missed in judgement.Missed.Distinct())
                tally[missed] = tally.GetValueOrDefault(missed) + 1;
            if (!nearest.TryGetValue(variant.Topology, out var best) || judgement.Shortfall < best.Judgement.Shortfall
                || (judgement.Shortfall == best.Judgement.Shortfall
                    && string.CompareOrdinal(DesignAssembler.Key(variant, choice), DesignAssembler.Key(best.Variant, best.Choice)) < 0))
                nearest[variant.Topology] = (variant, (int[])choice.Clone(), judgement);
        }
    }

    public void Invalid(SearchVariant variant, string message) => Other(variant.Topology, message);

    public void YieldShort(SearchVariant variant, string detail) => Other(variant.Topology, "yield short: " + detail);

    /// <summary>Times each target was missed by the candidates of a topology, most frequent first.</summary>
    public IReadOnlyList<(MissedTarget Target, int Count)> Misses(TopologyKind topology) =>
        counts.TryGetValue(topology, out var t)
            ? t.OrderByDescending(kv => kv.Value).ThenBy(kv => kv.Key).Select(kv => (kv.Key, kv.Value)).ToList()
            : [];

    /// <summary>The nearest miss of a topology, if the engine saw any candidate of it.</summary>
    public (SearchVariant Variant, int[] Choice, DesignJudgement Judgement)? Nearest(TopologyKind topology) =>
        nearest.TryGetValue(topology, out var n) ? n : null;

    /// <summary>Other reasons candidates were turned down (invalid designs, short yield).</summary>
    public IReadOnlyList<string> OtherReasons(TopologyKind topology) =>
        other.TryGetValue(topology, out var list) ? list.Distinct().Take(5).ToList() : [];

    private void Other(TopologyKind topology, string message)
    {
        lock (gate)
        {
            var list = other.TryGetValue(topology, out var l) ? l : other[topology] = [];
            if (list.Count < 1000)
                list.Add(message);
        }
    }
}
