using System.Collections.Concurrent;
using System.Diagnostics;
using PartsOpt.Search;
using PartsOpt.Topologies;

namespace PartsOpt.Planning;

/// <summary>How much work a what-if may do.</summary>
/// <param name="Budget">Wall time for all candidates together (default 60 s); candidates not reached are counted, not guessed.</param>
/// <param name="SearchTimeLimit">Wall time of one candidate's search (default 10 s).</param>
/// <param name="MaxParallelism">Candidates searched at once (default 2; each search runs CP-SAT on two workers).</param>
/// <param name="Seed">CP-SAT random seed (default 1).</param>
public sealed record WhatIfOptions(TimeSpan? Budget = null, TimeSpan? SearchTimeLimit = null, int MaxParallelism = 2, int Seed = 1)
{
    /// <summary>The budget in force.</summary>
    public TimeSpan EffectiveBudget => Budget ?? TimeSpan.FromSeconds(60);

    /// <summary>The search time limit in force.</summary>
    public TimeSpan EffectiveSearchTimeLimit => SearchTimeLimit ?? TimeSpan.FromSeconds(10);
}

/// <summary>What adding one candidate line does to the search.</summary>
/// <param name="Part">The candidate, with the availability it was searched with.</param>
/// <param name="Status">The search's status with the candidate added.</param>
/// <param name="BestPerBoard">The best cost per board with it; null when nothing was found.</param>
/// <param name="Improvement">Today's best cost per board less <paramref name="BestPerBoard"/> (null when either is missing).</param>
/// <param name="MakesFeasible">True when the search finds nothing today and finds a design with the candidate.</param>
/// <param name="Design">The new best design; null when nothing was found.</param>
public sealed record WhatIfResult(StockPart Part, SearchStatus Status, decimal? BestPerBoard, decimal? Improvement, bool MakesFeasible, FoundDesign? Design);

/// <summary>The ranked answer to "which one value should we add?".</summary>
/// <param name="BaseStatus">The search's status on today's stock.</param>
/// <param name="BasePerBoard">Today's best cost per board; null when nothing can be built.</param>
/// <param name="Ranked">The candidates that help: those that make the search feasible first (cheapest first), then the
/// largest improvement of the best cost per board first; ties by part number.</param>
/// <param name="Examined">Candidates searched.</param>
/// <param name="Pruned">Candidates set aside without a search because they cannot lower the cost (see docs/what-if.md).</param>
/// <param name="NotExamined">Candidates the budget left unsearched.</param>
/// <param name="Unproved">Candidates whose search stopped at its time limit (their result may not be their best).</param>
/// <param name="Elapsed">Wall time.</param>
public sealed record WhatIfOutcome(SearchStatus BaseStatus, decimal? BasePerBoard, IReadOnlyList<WhatIfResult> Ranked,
    int Examined, int Pruned, int NotExamined, int Unproved, TimeSpan Elapsed)
{
    /// <summary>True when the budget left candidates unsearched or searches unfinished: the ranking may be incomplete.</summary>
    public bool CutShort => NotExamined > 0 || Unproved > 0;
}

/// <summary>
/// For a requirement and today's stock: which single additional line lowers the best cost per board the
/// most, or turns an infeasible search feasible. Each candidate is searched on today's stock plus that one
/// line (with enough pieces for the build), in parallel within a time budget.
/// </summary>
public static class WhatIf
{
    /// <summary>Ranks <paramref name="candidates"/> by what each does to the search of <paramref name="requirement"/>.</summary>
    /// <exception cref="ArgumentException">A candidate's part number is already in the stock, or the requirement is refused by the search.</exception>
    public static WhatIfOutcome Rank(SearchRequirement requirement, Stock stock, IReadOnlyList<StockPart> candidates,
        WhatIfOptions? options = null, CancellationToken cancellation = default)
    {
        ArgumentNullException.ThrowIfNull(requirement);
        ArgumentNullException.ThrowIfNull(stock);
        ArgumentNullException.ThrowIfNull(candidates);
        options ??= new WhatIfOptions();
        var clock = Stopwatch.StartNew();
        var names = stock.Parts.Select(p => p.PartNumber).Concat(stock.OpAmps.Select(o => o.PartNumber)).ToHashSet(StringComparer.OrdinalIgnoreCase);
        foreach (var candidate in candidates)
            if (names.Contains(candidate.PartNumber))
                throw new ArgumentException($"{candidate.PartNumber} is in the stock already.", nameof(candidates));

        using var budget = CancellationTokenSource.CreateLinkedTokenSource(cancellation);
        budget.CancelAfter(options.EffectiveBudget);
        var searched = requirement with { MaxResults = 1 };
        SearchOptions Limit() => new(Min(options.EffectiveSearchTimeLimit, options.EffectiveBudget - clock.Elapsed), options.Seed);
        var baseline = DesignSearch.Run(searched, stock, Limit(), budget.Token);
        var basePerBoard = baseline.Designs.Count > 0 ? baseline.Designs[0].Cost.PerBoard : (decimal?)null;

        var enough = (int)Math.Min((long)requirement.BuildQuantity * PlanLines.PiecesPerBoardBound, int.MaxValue);
        var pruned = 0;
        var worth = new List<StockPart>();
        foreach (var candidate in candidates)
        {
            if (CannotHelp(candidate, requirement, stock, basePerBoard, enough))
                pruned++;
            else
                worth.Add(candidate with { Available = enough });
        }
        var order = ExamineFirst(worth, baseline);

        var results = new ConcurrentBag<WhatIfResult>();
        var examined = 0;
        var unproved = 0;
        try
        {
            Parallel.ForEach(order, new ParallelOptions { MaxDegreeOfParallelism = Math.Max(1, options.MaxParallelism), CancellationToken = budget.Token },
                candidate =>
                {
                    var outcome = DesignSearch.Run(searched, stock with { Parts = [.. stock.Parts, candidate] }, Limit(), budget.Token);
                    Interlocked.Increment(ref examined);
                    if (outcome.Status is not (SearchStatus.Optimal or SearchStatus.Infeasible))
                        Interlocked.Increment(ref unproved);
                    var best = outcome.Designs.Count > 0 ? outcome.Designs[0] : null;
                    results.Add(new WhatIfResult(candidate, outcome.Status, best?.Cost.PerBoard,
                        best is not null && basePerBoard is { } b ? b - best.Cost.PerBoard : null,
                        basePerBoard is null && best is not null, best));
                });
        }
        catch (OperationCanceledException) when (budget.IsCancellationRequested)
        {
            // The budget ran out: what was searched stands, the rest is counted as not examined.
        }

        var ranked = results.Where(r => r.MakesFeasible || r.Improvement > 0)
            .OrderByDescending(r => r.MakesFeasible)
            .ThenBy(r => r.MakesFeasible ? r.BestPerBoard : 0)
            .ThenByDescending(r => r.Improvement ?? 0)
            .ThenBy(r => r.Part.PartNumber, StringComparer.Ordinal)
            .ToList();
        return new WhatIfOutcome(baseline.Status, basePerBoard, ranked, examined, pruned, worth.Count - examined, unproved, clock.Elapsed);
    }

    /// <summary>
    /// A candidate that provably cannot lower the best cost: (1) today's best costs no more than the candidate
    /// alone would add to a board (its unit cost, one placement and its line-item setup over the build), or
    /// (2) today's stock holds a line identical in every attribute the engine reads, no dearer, with enough
    /// pieces for every role of the build, so any design with the candidate is matched by one without it.
    /// </summary>
    internal static bool CannotHelp(StockPart candidate, SearchRequirement requirement, Stock stock, decimal? basePerBoard, int enough)
    {
        var costs = requirement.Costs;
        if (basePerBoard is { } best
            && candidate.UnitCost + costs.PlacementCost + costs.LineItemSetupCost / requirement.BuildQuantity >= best)
            return true;
        return stock.Parts.Any(p => p.Kind == candidate.Kind && p.Value == candidate.Value && p.Tolerance == candidate.Tolerance
            && p.Dielectric == candidate.Dielectric && p.TempcoPpmPerK == candidate.TempcoPpmPerK && p.PowerRatingW == candidate.PowerRatingW
            && p.VoltageRatingV == candidate.VoltageRatingV && p.UnitCost <= candidate.UnitCost && p.Available >= enough);
    }

    /// <summary>
    /// Candidates nearest (in log ratio) to a value that matters first, so a budget that runs out cuts the
    /// least promising: the values of today's best design, or the purchases the search suggested.
    /// </summary>
    private static List<StockPart> ExamineFirst(List<StockPart> candidates, SearchOutcome baseline)
    {
        var anchors = baseline.Designs.Count > 0
            ? baseline.Designs[0].Design.Roles.Select(r => (Kind: Roles.KindOf(r.Key), r.Value.Value)).ToList()
            : baseline.Topologies.Where(t => t.Purchase is not null).Select(t => (t.Purchase!.Kind, t.Purchase.Value)).ToList();
        double Distance(StockPart p) => anchors.Where(a => a.Kind == p.Kind && a.Value > 0 && p.Value > 0)
            .Select(a => Math.Abs(Math.Log(p.Value / a.Value))).DefaultIfEmpty(double.MaxValue).Min();
        return candidates.OrderBy(Distance).ThenBy(p => p.PartNumber, StringComparer.Ordinal).ToList();
    }

    /// <summary>The smaller of two limits, never below a millisecond (a spent budget still makes a valid, instant search).</summary>
    private static TimeSpan Min(TimeSpan a, TimeSpan b)
    {
        var least = a < b ? a : b;
        return least > TimeSpan.Zero ? least : TimeSpan.FromMilliseconds(1);
    }
}
