using PartsOpt.Search;

namespace PartsOpt.Planning;

/// <summary>
/// Every line a plan may hold — today's lines first, then the candidates — and the stock a search sees
/// for a chosen set of them. A line in a plan is one the team keeps buying, so the stock a search sees
/// holds <see cref="Plenty"/> pieces of each chosen line: enough for a year of every requirement.
/// </summary>
internal sealed class PlanLines
{
    /// <summary>Pieces of one part number a board may take at most (roles plus decoupling; 64 is far above any topology).</summary>
    public const int PiecesPerBoardBound = 64;

    private readonly List<StockPart> parts = [];
    private readonly List<StockOpAmp> opAmps = [];

    public PlanLines(StockingQuestion question)
    {
        long year = 0;
        foreach (var r in question.Requirements)
            year += Math.Max(r.UnitsPerYear, r.Requirement.BuildQuantity);
        Plenty = (int)Math.Min(year * PiecesPerBoardBound, 1_000_000_000);

        var names = new HashSet<string>(StringComparer.OrdinalIgnoreCase);
        void Add(string partNumber, bool existing, StockPart? part, StockOpAmp? opAmp)
        {
            if (!names.Add(partNumber))
                throw new ArgumentException($"Part number {partNumber} appears twice among today's lines and the candidates.", nameof(question));
            Index[partNumber] = PartNumbers.Count;
            PartNumbers.Add(partNumber);
            Existing.Add(existing);
            Passive.Add(part);
            OpAmp.Add(opAmp);
        }
        foreach (var (stock, existing) in new[] { (question.Existing, true), (question.Candidates, false) })
        {
            foreach (var p in stock.Parts)
                Add(p.PartNumber, existing, p with { Available = Plenty }, null);
            foreach (var o in stock.OpAmps)
                Add(o.PartNumber, existing, null, o with { Available = Plenty });
        }
    }

    /// <summary>Pieces of each line a plan's stock holds.</summary>
    public int Plenty { get; }

    public List<string> PartNumbers { get; } = [];
    public List<bool> Existing { get; } = [];
    public List<StockPart?> Passive { get; } = [];
    public List<StockOpAmp?> OpAmp { get; } = [];
    public Dictionary<string, int> Index { get; } = new(StringComparer.OrdinalIgnoreCase);

    public int Count => PartNumbers.Count;

    public IEnumerable<int> ExistingLines => Enumerable.Range(0, Count).Where(l => Existing[l]);

    /// <summary>The stock a search sees when the plan holds <paramref name="chosen"/> (line indices).</summary>
    public Stock StockOf(IEnumerable<int> chosen)
    {
        var set = chosen.Order().Distinct().ToList();
        return new Stock(
            set.Where(l => Passive[l] is not null).Select(l => Passive[l]!).ToList(),
            set.Where(l => OpAmp[l] is not null).Select(l => OpAmp[l]!).ToList());
    }

    /// <summary>The stock of every line.</summary>
    public Stock All => StockOf(Enumerable.Range(0, Count));

    /// <summary>Lines that may decouple the op-amps of a board on <paramref name="supply"/>, as the search judges it.</summary>
    public IReadOnlyList<int> Decouplers(Topologies.Supply supply) =>
        Enumerable.Range(0, Count).Where(l => Passive[l] is { } p && SearchContext.FitsDecoupling(p, supply)).ToList();
}
