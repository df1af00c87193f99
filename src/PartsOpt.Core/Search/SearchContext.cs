using PartsOpt.Topologies;
using PartsOpt.Values;

namespace PartsOpt.Search;

/// <summary>
/// What every variant of one search shares: the requirement, the stock as selection lines (passive parts
/// first, op-amps after, in stock order), the role choices and the capacitors fit for decoupling.
/// </summary>
internal sealed class SearchContext
{
    /// <summary>Smallest and largest decoupling capacitance accepted: 100 nF … 1 µF (common practice).</summary>
    public const double DecouplingMinF = 100e-9, DecouplingMaxF = 1e-6;

    public SearchContext(SearchRequirement requirement, Stock stock)
    {
        Requirement = requirement;
        Stock = stock;
        Lines = stock.Parts.Select(p => new StockLine(p.PartNumber, p.UnitCost, p.Available))
            .Concat(stock.OpAmps.Select(o => new StockLine(o.PartNumber, o.UnitCost, o.Available)))
            .ToList();
        Options = new RoleOptions(stock.Parts, requirement.AllowCombinations);
        DecouplingCapacitors = Enumerable.Range(0, stock.Parts.Count)
            .Where(i => FitsDecoupling(stock.Parts[i], requirement.Supply))
            .OrderBy(i => stock.Parts[i].UnitCost)
            .ThenBy(i => stock.Parts[i].PartNumber, StringComparer.Ordinal)
            .ToList();
    }

    /// <summary>The slot options of every role of a kind, made once and shared by every variant.</summary>
    public IReadOnlyList<SlotOption> SlotOptionsFor(RoleKind kind)
    {
        if (!slotOptions.TryGetValue(kind, out var options))
            slotOptions[kind] = options = Options.For(kind).Select(RoleOptions.ToOption).ToList();
        return options;
    }

    private readonly Dictionary<RoleKind, IReadOnlyList<SlotOption>> slotOptions = [];

    /// <summary>
    /// The relaxation oscillator's ratio buckets for an amplifier (they depend on its levels and offset and on
    /// the stocked resistors only), made once and shared by the variants that use it.
    /// </summary>
    internal System.Collections.Concurrent.ConcurrentDictionary<int, Lazy<(RatioBuckets Buckets, RatioBuckets EdgeBuckets, double UpperEdgeMultiplier)?>> DividerBuckets { get; } = [];

    /// <summary>The divider ratios two option lists form (<see cref="Search.DividerRatios"/>), shared by every amplifier's buckets.</summary>
    internal System.Collections.Concurrent.ConcurrentDictionary<(IReadOnlyList<SlotOption>, IReadOnlyList<SlotOption>), Lazy<DividerRatios>> DividerRatios { get; } =
        new(new PairOfReferences());

    private sealed class PairOfReferences : IEqualityComparer<(IReadOnlyList<SlotOption>, IReadOnlyList<SlotOption>)>
    {
        public bool Equals((IReadOnlyList<SlotOption>, IReadOnlyList<SlotOption>) x, (IReadOnlyList<SlotOption>, IReadOnlyList<SlotOption>) y) =>
            ReferenceEquals(x.Item1, y.Item1) && ReferenceEquals(x.Item2, y.Item2);

        public int GetHashCode((IReadOnlyList<SlotOption>, IReadOnlyList<SlotOption>) pair) =>
            HashCode.Combine(System.Runtime.CompilerServices.RuntimeHelpers.GetHashCode(pair.Item1),
                System.Runtime.CompilerServices.RuntimeHelpers.GetHashCode(pair.Item2));
    }

    /// <summary>The branch and bound's tables of each option list (costs, lines, logs, orders), shared by every variant.</summary>
    internal System.Collections.Concurrent.ConcurrentDictionary<IReadOnlyList<SlotOption>, SelectionEnumerator.SlotTable> EnumeratorTables { get; } =
        new(ReferenceEqualityComparer.Instance);

    public SearchRequirement Requirement { get; }
    public Stock Stock { get; }
    public IReadOnlyList<StockLine> Lines { get; }
    public RoleOptions Options { get; }
    public IReadOnlyList<int> DecouplingCapacitors { get; }

    /// <summary>The selection line of op-amp <paramref name="index"/>.</summary>
    public int OpAmpLine(int index) => Stock.Parts.Count + index;

    /// <summary>
    /// A capacitor fit to decouple an op-amp package: a ceramic (C0G, X7R, X5R) of 100 nF … 1 µF rated for
    /// the whole supply when its rating is known (common practice: one 100 nF X7R beside each package).
    /// </summary>
    public static bool FitsDecoupling(StockPart part, Supply supply) =>
        part.Kind == RoleKind.Capacitor
        && part.Value >= DecouplingMinF * (1 - 1e-9) && part.Value <= DecouplingMaxF * (1 + 1e-9)
        && part.Dielectric is null or Dielectric.C0G or Dielectric.X7R or Dielectric.X5R
        && (part.VoltageRatingV is not { } rating || rating >= supply.SpanV);
}
