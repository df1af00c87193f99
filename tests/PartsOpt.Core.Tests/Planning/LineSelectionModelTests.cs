using PartsOpt.Planning;
using PartsOpt.Search;
using PartsOpt.Topologies;
using static PartsOpt.Tests.Search.TestStock;

namespace PartsOpt.Tests.Planning;

/// <summary>
/// The line-selection model on a hand-worked case (two requirements, two designs each), status, objective
/// and solution asserted as a CP-SAT test should. The columns' source designs are not read by the model.
/// Lines: 0 today's, 1–3 candidates, 4 today's and used by nothing.
/// A (100 a year): a1 on {0, 1} at 1.00, a2 on {0, 2} at 1.10. B (50 a year): b1 on {3} at 0.50, b2 on {2} at 0.80.
/// </summary>
public class LineSelectionModelTests
{
    private static (PlanLines Lines, List<IReadOnlyList<DesignColumn>> Columns) Case(bool keepExisting)
    {
        var requirement = new SearchRequirement(Supply.Symmetric(12), new Band(1e3, 0.1), new DutyRequirement(0.2, 0.8), 10);
        var question = new StockingQuestion([new YearlyRequirement("A", requirement, 100), new YearlyRequirement("B", requirement, 50)],
            new Stock([Resistor("L0", 1e3, 0.01m), Resistor("L4", 4.7e3, 0.01m)], []),
            new Stock([Resistor("L1", 2.2e3, 0.01m), Resistor("L2", 3.3e3, 0.01m), Resistor("L3", 6.8e3, 0.01m)], []),
            0m, keepExisting);
        var lines = new PlanLines(question);
        int L(string name) => lines.Index[name];
        DesignColumn Column(int r, decimal perBoard, params string[] used) =>
            new(r, null!, used.Select(L).Order().ToList(), perBoard, null);
        return (lines, [
            [Column(0, 1.00m, "L0", "L1"), Column(0, 1.10m, "L0", "L2")],
            [Column(1, 0.50m, "L3"), Column(1, 0.80m, "L2")],
        ]);
    }

    private static LineSelection Solve(decimal holding, bool keepExisting)
    {
        var (lines, columns) = Case(keepExisting);
        return LineSelectionModel.Solve(columns, [100, 50], lines, holding, keepExisting, TimeSpan.FromSeconds(30), 1, default);
    }

    private static string[] Names(LineSelection selection, bool keepExisting) =>
        selection.Lines.Select(l => Case(keepExisting).Lines.PartNumbers[l]).ToArray();

    [Fact]
    public void CheapDesignsWinWhenHoldingIsCheap()
    {
        // a1 + b1: 100 × 1.00 + 50 × 0.50 + 10 × 3 lines = 155 (a1+b2 170, a2+b1 165, a2+b2 170).
        var selection = Solve(10m, keepExisting: false);
        Assert.Equal(Google.OrTools.Sat.CpSolverStatus.Optimal, selection.Status);
        Assert.Equal([1.00m, 0.50m], selection.Chosen.Select(c => c!.PerBoard));
        Assert.Equal(["L0", "L1", "L3"], Names(selection, false));
        Assert.Equal(1, selection.Scale); // the yearly amounts 100, 110, 25, 40 and the holding 10 are whole
        Assert.False(selection.Rounded);
    }

    [Fact]
    public void SharedLinesWinWhenHoldingIsDear()
    {
        // a2 + b2 share L2: 110 + 40 + 30 × 2 = 210 against a1 + b1: 125 + 30 × 3 = 215.
        var selection = Solve(30m, keepExisting: false);
        Assert.Equal(Google.OrTools.Sat.CpSolverStatus.Optimal, selection.Status);
        Assert.Equal([1.10m, 0.80m], selection.Chosen.Select(c => c!.PerBoard));
        Assert.Equal(["L0", "L2"], Names(selection, false));
    }

    [Fact]
    public void KeptLinesStayEvenUnused()
    {
        var selection = Solve(30m, keepExisting: true);
        Assert.Equal(Google.OrTools.Sat.CpSolverStatus.Optimal, selection.Status);
        Assert.Equal(["L0", "L4", "L2"], Names(selection, true));
    }

    [Theory]
    [InlineData("1.25", 100)]
    [InlineData("0.005", 1000)]
    [InlineData("3", 1)]
    public void TheScaleIsTheSmallestPowerOfTenThatMakesEveryAmountWhole(string amount, long scale) =>
        Assert.Equal((scale, false), LineSelectionModel.ScaleFor([decimal.Parse(amount, System.Globalization.CultureInfo.InvariantCulture), 2m]));

    [Fact]
    public void AmountsFinerThanAMillionthAreRounded() =>
        Assert.Equal((LineSelectionModel.MaxScale, true), LineSelectionModel.ScaleFor([1m / 3m]));

    /// <summary>
    /// A's stand-in (every design of A not a column, at least 0.95 per board, no line of its own), holding 10:
    /// alone it undercuts every column (95 + b1's 25 + 10 = 130 against a1 + b1 = 155).
    /// </summary>
    private static LineSelection WithStandIn(params StandInCut[] cuts)
    {
        var (lines, columns) = Case(keepExisting: false);
        return LineSelectionModel.Solve(columns, [100, 50], lines, 10m, false, TimeSpan.FromSeconds(30), 1, default,
            [new StandIn(0.95m, cuts), null]);
    }

    [Fact]
    public void AStandInNeedsNoLineOfItsOwn()
    {
        var selection = WithStandIn();
        Assert.Equal(Google.OrTools.Sat.CpSolverStatus.Optimal, selection.Status);
        Assert.Equal([true, false], selection.TookStandIn);
        Assert.Equal(130m, selection.Objective);
        Assert.Equal(130m, selection.Bound);
        Assert.Equal(["L3"], Names(selection, false));
    }

    [Fact]
    public void ACutWithNoDesignMakesTheStandInHoldALineOutsideIt()
    {
        // No design of A outside the columns within {L3}: the stand-in needs some other line held (+10).
        var selection = WithStandIn(new StandInCut([Index("L3")], null));
        Assert.Equal([true, false], selection.TookStandIn);
        Assert.Equal(140m, selection.Objective);
        Assert.Equal(2, selection.Held.Count);
        Assert.Equal(["L3"], Names(selection, false)); // the extra line is held for the bound, needed by no design
    }

    [Fact]
    public void ACutWithACostRaisesTheStandInWithinItsLines()
    {
        // Within {L3} A's left-out designs cost at least 1.02: 102 + 35 = 137, below 95 + 35 + 10 for a line outside.
        var selection = WithStandIn(new StandInCut([Index("L3")], 1.02m));
        Assert.Equal([true, false], selection.TookStandIn);
        Assert.Equal(137m, selection.Objective);
        Assert.Single(selection.Held);
    }

    [Fact]
    public void ColumnsDominatedByCheaperOnesOnFewerLinesAreLeftOut()
    {
        var (lines, _) = Case(keepExisting: true);
        DesignColumn Column(decimal perBoard, params string[] used) => new(0, null!, used.Select(n => lines.Index[n]).Order().ToList(), perBoard, null);
        var a = Column(1.00m, "L1", "L2");
        var b = Column(1.00m, "L1", "L2", "L3"); // a needs fewer lines at the same cost
        var c = Column(0.90m, "L3");
        var d = Column(1.05m, "L0", "L1"); // dearer than a, but on other lines
        var e = Column(1.00m, "L0", "L1"); // L0 is held by every plan: e needs only L1, which dominates a
        // A holding of 1,000 a line for 100 a year: no saving per board pays for a line, only subsets dominate.
        Assert.Equal([a, c, d], LineSelectionModel.Undominated([a, b, c, d], new HashSet<int>(), 100, 1000m));
        Assert.Equal([c, e], LineSelectionModel.Undominated([a, b, c, d, e], new HashSet<int> { lines.Index["L0"] }, 100, 1000m));
    }

    [Fact]
    public void ColumnsDearerThanAnotherByMoreThanTheHoldingOfItsOtherLinesAreLeftOut()
    {
        // 100 a year, holding 10 a line. p (1.00 on L1 L2) instead of another column adds at most the holding
        // of its lines the other does not use: 10 for L2 beside L1, 20 beside L3 alone.
        var (lines, _) = Case(keepExisting: false);
        DesignColumn Column(decimal perBoard, params string[] used) => new(0, null!, used.Select(n => lines.Index[n]).Order().ToList(), perBoard, null);
        var p = Column(1.00m, "L1", "L2");
        var q = Column(1.08m, "L1", "L3"); // 8 a year dearer than p, which would add L2 (10): stays
        var r = Column(1.10m, "L1", "L3"); // 10 a year dearer: p costs no more in any plan with r
        var s = Column(1.25m, "L3");       // 25 dearer, p would add two lines (20): goes
        var t = Column(1.15m, "L3");       // 15 dearer: stays (and then s is also 10 dearer than t on the same line)
        Assert.Equal([p, q, t], LineSelectionModel.Undominated([p, q, r, s, t], new HashSet<int>(), 100, 10m));
        // With no holding cost only the cheapest column matters.
        Assert.Equal([p], LineSelectionModel.Undominated([p, q, r, s, t], new HashSet<int>(), 100, 0m));
    }

    [Fact]
    public void ColumnsAndStandInsDearerThanAnotherColumnWithItsLinesAreLeftOut()
    {
        // Holding 10, nothing kept. A: a1 100 + 2 lines = 120 caps it; a2 (110) stays. B: b1 25 + 1 line = 35
        // caps it; b2 (40) goes, and so does a stand-in at 0.75 (37.5), while one at 0.70 (35) stays.
        var (_, columns) = Case(keepExisting: false);
        var (kept, standIns) = LineSelectionModel.WithinReach(columns, [null, new StandIn(0.75m, [])], [100, 50], 10m, new HashSet<int>());
        Assert.Equal([1.00m, 1.10m], kept[0].Select(c => c.PerBoard));
        Assert.Equal([0.50m], kept[1].Select(c => c.PerBoard));
        Assert.Equal([null, null], standIns!);
        var (_, cheaper) = LineSelectionModel.WithinReach(columns, [null, new StandIn(0.70m, [])], [100, 50], 10m, new HashSet<int>());
        Assert.NotNull(cheaper![1]);
    }

    [Fact]
    public void AStandInIsTiedWhenAColumnAsCheapNeedsNoLineMoreThanTheSolutionHolds()
    {
        // Requirement A's columns, worked by hand: a1 1.00 on {L0, L1}, a2 1.10 on {L0, L2}.
        var (_, columns) = Case(keepExisting: false);
        int[] held = [Index("L0"), Index("L1"), Index("L3")];
        Assert.True(new StandIn(1.00m, []).TiedOn(columns[0], held));             // a1: as cheap, lines held
        Assert.False(new StandIn(0.99m, []).TiedOn(columns[0], held));            // cheaper than every column
        Assert.False(new StandIn(1.20m, []).TiedOn(columns[0], [Index("L0"), Index("L3")])); // neither column's lines held
        // A cut over lines holding all those held raises the price to its own, or rules the stand-in out.
        var raised = new StandIn(0.90m, [new StandInCut([Index("L0"), Index("L1"), Index("L2"), Index("L3")], 1.05m)]);
        Assert.Equal(1.05m, raised.PriceOn(held));
        Assert.True(raised.TiedOn(columns[0], held));
        Assert.Equal(0.90m, raised.PriceOn([Index("L0"), Index("L4")]));           // L4 is outside the cut
        Assert.Equal(decimal.MaxValue, new StandIn(0.90m, [new StandInCut(held, null)]).PriceOn(held));
    }

    private static int Index(string name) => Case(keepExisting: false).Lines.Index[name];
}
