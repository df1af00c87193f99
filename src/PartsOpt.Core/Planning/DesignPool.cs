using PartsOpt.Search;

namespace PartsOpt.Planning;

/// <summary>
/// A requirement's cheapest designs over every line a plan could hold, and what the search proved about
/// the designs it left out.
/// </summary>
/// <param name="Size">Designs asked for.</param>
/// <param name="Outcome">The search's answer.</param>
internal sealed record DesignPool(int Size, SearchOutcome Outcome)
{
    /// <summary>Proved to hold every feasible design: the search finished and listed fewer than asked.</summary>
    public bool Complete => Outcome.Status == SearchStatus.Optimal && Outcome.Designs.Count < Size;

    /// <summary>
    /// Every design left out of the pool costs at least this per board: the search lists the cheapest
    /// <see cref="Size"/> in cost order, so anything missing costs no less than the last of them (null unless
    /// proved, or when the pool is complete).
    /// </summary>
    public decimal? Floor => Outcome.Status == SearchStatus.Optimal && Outcome.Designs.Count >= Size
        ? Outcome.Designs[Size - 1].Cost.PerBoard
        : null;

    public static DesignPool Search(SearchRequirement requirement, Stock stock, int size, SearchOptions options, CancellationToken cancellation) =>
        new(size, DesignSearch.Run(requirement with { MaxResults = size }, stock, options, cancellation));
}
