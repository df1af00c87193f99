namespace PartsOpt.Search;

/// <summary>A stocked part number as the selection model sees it: what one costs and how many are free.</summary>
/// <param name="PartNumber">The part number (one line item on the BOM).</param>
/// <param name="UnitCost">Cost of one piece (one package for op-amps).</param>
/// <param name="Available">Pieces on hand less reserved.</param>
internal sealed record StockLine(string PartNumber, decimal UnitCost, int Available);

/// <summary>An option draws <paramref name="PerBoard"/> pieces of stock line <paramref name="Line"/> per board.</summary>
internal readonly record struct PartDraw(int Line, int PerBoard);

/// <summary>
/// One way to fill a slot: the stock it draws (one part, or two in series or parallel, or several
/// decoupling capacitors), and its value as a natural logarithm for the log-space figure bounds.
/// </summary>
/// <param name="Draws">Stock drawn per board; each piece drawn is one placement.</param>
/// <param name="LogValue">ln of the option's value in SI units (0 where no bound reads it).</param>
/// <param name="Tag">What the caller needs to rebuild the design (the stock part or combination).</param>
internal sealed record SlotOption(IReadOnlyList<PartDraw> Draws, double LogValue, object? Tag = null)
{
    /// <summary>Parts placed per board by this option.</summary>
    public int Placements => Draws.Sum(d => d.PerBoard);
}

/// <summary>A role to fill (or the decoupling capacitors), exactly one option per board.</summary>
internal sealed record SelectionSlot(string Name, IReadOnlyList<SlotOption> Options);

/// <summary>
/// A set of slots whose options are chosen together from an explicit list of tuples, each with its own
/// log-space value: how a non-separable figure (the factor a divider pair gives the period) enters the
/// linear model.
/// </summary>
/// <param name="Slots">The slot indices the tuples range over.</param>
/// <param name="Tuples">Option indices, one per slot in <paramref name="Slots"/>.</param>
/// <param name="LogValues">ln of the figure factor each tuple gives; NaN for a tuple that cannot work.</param>
internal sealed record TupleGroup(IReadOnlyList<int> Slots, IReadOnlyList<int[]> Tuples, IReadOnlyList<double> LogValues);

/// <summary>What a <see cref="LogTerm"/> reads: a slot's value, a tuple group's factor or a bucketed ratio's factor.</summary>
internal enum TermKind
{
    /// <summary>ln of the value of the option chosen in a slot.</summary>
    Slot,

    /// <summary>ln of the factor of the tuple chosen in a <see cref="TupleGroup"/>.</summary>
    Group,

    /// <summary>ln of the factor of a <see cref="RatioBuckets"/>, between its bucket's low and high edges.</summary>
    Buckets,
}

/// <summary>A term of a log-space bound: coefficient times the log value of a slot's, group's or buckets' choice.</summary>
/// <param name="Index">The slot, group or buckets index.</param>
/// <param name="Coefficient">Integer coefficient (±1 for a product or quotient of values).</param>
/// <param name="Kind">What <paramref name="Index"/> names.</param>
internal readonly record struct LogTerm(int Index, int Coefficient, TermKind Kind = TermKind.Slot);

/// <summary>
/// A factor that depends on a ratio of part values (a divider's β), bounded bucket by bucket: the ratio's
/// log, Σ coefficient·ln(value) over <paramref name="Ratio"/>, falls in exactly one bucket, and inside bucket j
/// the factor's log lies in [<paramref name="Low"/>[j], <paramref name="High"/>[j]] — the least and greatest
/// factor of the stocked pairs whose ratio falls there, so the bounds hold for every stocked pair. A few
/// hundred bucket literals stand in for a tuple per pair (tens of thousands on a real stockroom).
/// </summary>
/// <param name="Ratio">Slot terms whose sum is the ratio's log.</param>
/// <param name="Edges">Bucket j spans [Edges[j].Low, Edges[j].High] of the ratio's log (natural log units).</param>
/// <param name="Low">Least ln factor in each bucket.</param>
/// <param name="High">Greatest ln factor in each bucket.</param>
internal sealed record RatioBuckets(
    IReadOnlyList<LogTerm> Ratio, IReadOnlyList<(double Low, double High)> Edges, IReadOnlyList<double> Low, IReadOnlyList<double> High);

/// <summary>
/// A linear bound in log space, Lower ≤ Σ coefficient·ln(value) ≤ Upper, already widened by the caller so
/// that every design the exact engine accepts satisfies it (the model stays a relaxation).
/// </summary>
internal sealed record LogBound(string Figure, IReadOnlyList<LogTerm> Terms, double Lower, double Upper);

/// <summary>
/// The selection problem of one topology and op-amp assignment: slots with options, shared stock,
/// fixed draws (op-amp packages), log-space bounds. Pure data; <see cref="SelectionSolver"/> builds
/// the CP-SAT model from it.
/// </summary>
internal sealed class SelectionProblem
{
    public required IReadOnlyList<StockLine> Lines { get; init; }
    public required IReadOnlyList<SelectionSlot> Slots { get; init; }
    public IReadOnlyList<PartDraw> FixedDraws { get; init; } = [];
    public IReadOnlyList<TupleGroup> Groups { get; init; } = [];
    public IReadOnlyList<RatioBuckets> Buckets { get; init; } = [];
    public IReadOnlyList<LogBound> Bounds { get; init; } = [];
    public required int BuildQuantity { get; init; }
    public required CostModel Costs { get; init; }

    /// <summary>Parts cost, placements and line items of one assignment (one option index per slot).</summary>
    public DesignCost CostOf(IReadOnlyList<int> choice)
    {
        var parts = 0m;
        var placements = 0;
        var lines = new SortedSet<int>();
        foreach (var draw in FixedDraws.Concat(Slots.SelectMany((s, i) => s.Options[choice[i]].Draws)))
        {
            parts += draw.PerBoard * Lines[draw.Line].UnitCost;
            placements += draw.PerBoard;
            lines.Add(draw.Line);
        }
        return new DesignCost(parts, placements, lines.Count, BuildQuantity, Costs);
    }

    /// <summary>True when the stock covers the assignment for the whole build, every role sharing each line.</summary>
    public bool StockSuffices(IReadOnlyList<int> choice)
    {
        var use = new long[Lines.Count];
        foreach (var draw in FixedDraws.Concat(Slots.SelectMany((s, i) => s.Options[choice[i]].Draws)))
            use[draw.Line] += draw.PerBoard;
        return use.Select((u, l) => u * BuildQuantity <= Lines[l].Available).All(ok => ok);
    }
}
