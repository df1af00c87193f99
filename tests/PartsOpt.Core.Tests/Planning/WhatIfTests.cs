using PartsOpt.Planning;
using PartsOpt.Search;
using PartsOpt.Topologies;
using PartsOpt.Values;
using static PartsOpt.Tests.Search.TestStock;

namespace PartsOpt.Tests.Planning;

/// <summary>
/// What-if: the ranking is checked by adding the candidate to the stock here and running the search again;
/// pruned candidates are checked not to lower the cost; a budget that runs out says so.
/// </summary>
public class WhatIfTests
{
    private static readonly SearchOptions Generous = new(TimeSpan.FromSeconds(600));
    private static readonly WhatIfOptions Patient = new(TimeSpan.FromSeconds(600), TimeSpan.FromSeconds(600));

    /// <summary>rc-ramp, 1 kHz ±10 %, duty 20–80 % by potentiometer, ±12 V, 10 boards.</summary>
    private static SearchRequirement Requirement() =>
        new(Supply.Symmetric(12), new Band(1e3, 0.10), new DutyRequirement(0.2, 0.8), 10)
        {
            Topologies = [TopologyKind.RcRamp],
            Costs = new CostModel(0.02m, 5.00m),
            MaxResults = 1,
        };

    /// <summary>Dear resistors and a dear timing capacitor: room for a cheaper value to help.</summary>
    private static Stock DearStock(bool timingCapacitor = true) => new(
    [
        Resistor("R-10K", 10e3, 0.05m),
        Resistor("R-22K", 22e3, 0.09m),
        Resistor("R-47K", 47e3, 0.09m),
        .. timingCapacitor ? [Capacitor("C-22N", 22e-9, 0.30m)] : Array.Empty<StockPart>(),
        Capacitor("C-100N", 100e-9, 0.02m, Dielectric.X7R),
        Pot("RV-10K", 10e3, 0.40m),
    ],
    [OpAmp("TL074", QuadJfet, 0.35m)]);

    private static IReadOnlyList<StockPart> E6Capacitors(decimal unitCost) => CandidateCatalogue.FromSeries(
        new SeriesCandidates(RoleKind.Capacitor, ESeries.E6, 4.7e-9, 47e-9, 0.05, unitCost), new Stock([], []));

    private static decimal? BestWith(Stock stock, StockPart part)
    {
        var outcome = DesignSearch.Run(Requirement(), stock with { Parts = [.. stock.Parts, part] }, Generous);
        Assert.True(outcome.Status is SearchStatus.Optimal or SearchStatus.Infeasible);
        return outcome.Designs.Count > 0 ? outcome.Designs[0].Cost.PerBoard : null;
    }

    [Fact]
    public void TheTopCandidateLowersTheCostByWhatTheSearchSaysWhenAddedByHand()
    {
        var stock = DearStock();
        var candidates = E6Capacitors(0.03m)
            .Concat(CandidateCatalogue.FromSeries(new SeriesCandidates(RoleKind.Resistor, ESeries.E6, 10e3, 47e3, 0.01, 0.005m), new Stock([], [])))
            .ToList();
        var outcome = WhatIf.Rank(Requirement(), stock, candidates, Patient);

        Assert.Equal(SearchStatus.Optimal, outcome.BaseStatus);
        Assert.False(outcome.CutShort);
        Assert.NotEmpty(outcome.Ranked);
        var top = outcome.Ranked[0];
        // The check: the search itself, run here on the stock with the top candidate added.
        Assert.Equal(BestWith(stock, top.Part), top.BestPerBoard);
        Assert.True(top.BestPerBoard < outcome.BasePerBoard);
        Assert.Equal(outcome.BasePerBoard - top.BestPerBoard, top.Improvement);
        Assert.True(DesignJudge.Judge(Requirement(), top.Design!.Design).Accepted);
        Assert.Contains(top.Design.Bom, b => b.PartNumber == top.Part.PartNumber);
        // Ranked by improvement, largest first.
        var improvements = outcome.Ranked.Select(r => r.Improvement!.Value).ToList();
        Assert.Equal(improvements.OrderDescending(), improvements);
        Assert.Equal(candidates.Count, outcome.Examined + outcome.Pruned);
    }

    [Fact]
    public void AnInfeasibleSearchIsMadeFeasibleByTheCapacitorItLacks()
    {
        var stock = DearStock(timingCapacitor: false);
        var outcome = WhatIf.Rank(Requirement(), stock, E6Capacitors(0.03m), Patient);

        Assert.Equal(SearchStatus.Infeasible, outcome.BaseStatus);
        Assert.Null(outcome.BasePerBoard);
        Assert.NotEmpty(outcome.Ranked);
        Assert.All(outcome.Ranked, r => Assert.True(r.MakesFeasible));
        var costs = outcome.Ranked.Select(r => r.BestPerBoard!.Value).ToList();
        Assert.Equal(costs.Order(), costs);
        Assert.Equal(BestWith(stock, outcome.Ranked[0].Part), outcome.Ranked[0].BestPerBoard);
        Assert.Contains(outcome.Ranked[0].Design!.Bom, b => b.PartNumber == outcome.Ranked[0].Part.PartNumber && b.Uses.Contains("osc.c"));
    }

    [Fact]
    public void CandidatesThatCannotLowerTheCostAreSetAsideAndIndeedDoNot()
    {
        var stock = DearStock();
        var baseline = DesignSearch.Run(Requirement(), stock, Generous).Designs[0].Cost.PerBoard;
        // Dearer on its own than today's whole board; and a twin of a stocked line at the same price.
        var dear = new StockPart("NEW-C-10N-DEAR", RoleKind.Capacitor, 10e-9, 0.05, baseline, 0) { Dielectric = Dielectric.C0G, VoltageRatingV = 50 };
        var twin = stock.Parts.Single(p => p.PartNumber == "R-22K") with { PartNumber = "R-22K-TWIN" };
        var outcome = WhatIf.Rank(Requirement(), stock, [dear, twin], Patient);

        Assert.Equal(2, outcome.Pruned);
        Assert.Equal(0, outcome.Examined);
        Assert.Empty(outcome.Ranked);
        Assert.True(BestWith(stock, dear with { Available = 10_000 }) >= baseline);
        Assert.True(BestWith(stock, twin) >= baseline);
    }

    [Fact]
    public void ABudgetThatRunsOutSaysSo()
    {
        // The budget's timer and the caller's cancellation stop the same linked token; one already stopped is
        // the case that does not depend on timing (a 1 ms budget no longer runs out: these searches take
        // about a millisecond).
        using var stopped = new CancellationTokenSource();
        stopped.Cancel();
        var outcome = WhatIf.Rank(Requirement(), DearStock(timingCapacitor: false), E6Capacitors(0.03m), Patient, stopped.Token);
        Assert.True(outcome.CutShort);
        Assert.True(outcome.NotExamined + outcome.Unproved > 0);
    }

    [Fact]
    public void ACandidateAlreadyInStockIsRefused() =>
        Assert.Throws<ArgumentException>(() => WhatIf.Rank(Requirement(), DearStock(), [Resistor("R-10K", 10e3, 0.01m)], Patient));
}
