using PartsOpt.Search;

namespace PartsOpt.Tests.Search;

/// <summary>
/// The CP-SAT selection model on hand-built candidate sets, where the optimum is worked out by hand in
/// each test: status, exact objective and the chosen options, as the OR-Tools suite checks its models.
/// </summary>
public class SelectionSolverTests
{
    private static readonly DateTime Later = DateTime.UtcNow.AddMinutes(5);

    private static SlotOption Use(int line, int perBoard = 1, double value = 1) =>
        new([new PartDraw(line, perBoard)], Math.Log(value));

    private static SelectionVerdict AcceptAll(int[] _) => new(true);

    [Fact]
    public void PicksTheCheapestOptionOfEachSlotWhenEverythingPasses()
    {
        // Two resistors at 0.10 and 0.05, one capacitor at 0.20; no placement or setup charge, 10 boards.
        var problem = new SelectionProblem
        {
            Lines = [new("R-A", 0.10m, 100), new("R-B", 0.05m, 100), new("C-A", 0.20m, 100)],
            Slots = [new("osc.r", [Use(0), Use(1)]), new("osc.c", [Use(2)])],
            BuildQuantity = 10,
            Costs = new CostModel(0, 0),
        };
        var solver = new SelectionSolver(problem);
        var run = solver.Run(AcceptAll, 1, null, [0, 1], Later, 1, CancellationToken.None);

        Assert.True(run.Complete);
        var best = Assert.Single(run.Accepted);
        Assert.Equal([1, 0], best.Choice);
        // 10 boards × (0.05 + 0.20) = 2.50, in units of 0.01.
        Assert.Equal(100, solver.CostScale);
        Assert.Equal(250, best.Objective);
        Assert.Equal(0.25m, problem.CostOf(best.Choice).PerBoard);
    }

    [Fact]
    public void SharedStockCannotFillTwoRolesBeyondWhatIsOnHand()
    {
        // R-A (cheap) has 10 pieces: enough for one role on 10 boards, not for two. R-B is dear but plentiful.
        var problem = new SelectionProblem
        {
            Lines = [new("R-A", 0.01m, 10), new("R-B", 0.50m, 1000)],
            Slots = [new("osc.r1", [Use(0), Use(1)]), new("osc.r2", [Use(0), Use(1)])],
            BuildQuantity = 10,
            Costs = new CostModel(0, 0),
        };
        var solver = new SelectionSolver(problem);
        var run = solver.Run(AcceptAll, 1, null, [0, 1], Later, 1, CancellationToken.None);

        // The two mirror assignments tie; the run lists both (each is forbidden in the model once accepted).
        Assert.Equal(2, run.Accepted.Count);
        Assert.All(run.Accepted, a => Assert.Equal(run.Accepted[0].Objective, a.Objective));
        var best = run.Accepted[0];
        Assert.Equal(1, best.Choice.Count(c => c == 0));
        Assert.Equal(10 * (0.01m + 0.50m) * 100, best.Objective);
        Assert.True(problem.StockSuffices(best.Choice));
        Assert.False(problem.StockSuffices([0, 0]));
    }

    [Fact]
    public void LineItemSetupCostMakesOnePartNumberForTwoRolesWin()
    {
        // Without setup cost the two cheapest different part numbers win (0.01 + 0.02);
        // with 1.00 per line item over 10 boards, reusing R-C (0.03 twice) saves a line item: 0.06 + 0.10
        // per board beats 0.03 + 0.20.
        var lines = new StockLine[] { new("R-A", 0.01m, 100), new("R-B", 0.02m, 100), new("R-C", 0.03m, 100) };
        SelectionSlot Slot(string name, int cheap) => new(name, [Use(cheap), Use(2)]);
        SelectionProblem Problem(decimal setup) => new()
        {
            Lines = lines,
            Slots = [Slot("int.r", 0), Slot("int.rf", 1)],
            BuildQuantity = 10,
            Costs = new CostModel(0, setup),
        };

        var free = new SelectionSolver(Problem(0)).Run(AcceptAll, 1, null, [0, 1], Later, 1, CancellationToken.None);
        Assert.Equal([0, 0], free.Accepted[0].Choice);

        var withSetup = Problem(1.00m);
        var solver = new SelectionSolver(withSetup);
        var charged = solver.Run(AcceptAll, 1, null, [0, 1], Later, 1, CancellationToken.None);
        Assert.Equal([1, 1], charged.Accepted[0].Choice);
        Assert.Equal(0.16m, withSetup.CostOf(charged.Accepted[0].Choice).PerBoard);
        Assert.Equal(160, charged.Accepted[0].Objective);
    }

    [Fact]
    public void RejectedAssignmentsAreCutAndTheNextCheapestIsVerified()
    {
        // The engine rejects anything using R-A in slot 0 (cut on slot 0 alone); the best is then R-B.
        var problem = new SelectionProblem
        {
            Lines = [new("R-A", 0.01m, 100), new("R-B", 0.02m, 100), new("C-A", 0.10m, 100), new("C-B", 0.20m, 100)],
            Slots = [new("osc.r", [Use(0), Use(1)]), new("osc.c", [Use(2), Use(3)])],
            BuildQuantity = 1,
            Costs = new CostModel(0, 0),
        };
        var seen = new List<int[]>();
        SelectionVerdict Verify(int[] choice)
        {
            seen.Add(choice);
            return choice[0] == 0 ? new SelectionVerdict(false, [0], Reason: "R-A fails") : new SelectionVerdict(true);
        }
        var run = new SelectionSolver(problem).Run(Verify, 1, null, [0, 1], Later, 1, CancellationToken.None);

        Assert.Equal([1, 0], run.Accepted[0].Choice);
        Assert.Single(run.Rejections);
        Assert.Equal(2, seen.Count); // the cut on slot 0 removed (R-A, C-B) without asking the engine
    }

    [Fact]
    public void LogBoundKeepsOnlyProductsInsideTheBand()
    {
        // R·C must lie in [0.9 ms, 1.1 ms]: 10 kΩ × 100 nF = 1 ms passes, 1 kΩ × 100 nF and 10 kΩ × 10 nF do not.
        var problem = new SelectionProblem
        {
            Lines = [new("1k", 0.01m, 100), new("10k", 0.02m, 100), new("10n", 0.01m, 100), new("100n", 0.02m, 100)],
            Slots = [new("osc.r", [Use(0, value: 1e3), Use(1, value: 1e4)]), new("osc.c", [Use(2, value: 10e-9), Use(3, value: 100e-9)])],
            Bounds = [new("frequency", [new LogTerm(0, 1), new LogTerm(1, 1)], Math.Log(0.9e-3), Math.Log(1.1e-3))],
            BuildQuantity = 1,
            Costs = new CostModel(0, 0),
        };
        var run = new SelectionSolver(problem).Run(AcceptAll, 5, null, [0, 1], Later, 1, CancellationToken.None);

        Assert.True(run.Complete);
        var only = Assert.Single(run.Accepted);
        Assert.Equal([1, 1], only.Choice);
    }

    [Fact]
    public void TupleGroupCarriesANonSeparableFactor()
    {
        // A pair group over (r1, r2) whose tuples give ln 2 for (A, B) and ln 5 otherwise; the bound asks
        // the factor to be within 1.5…3, so only (A, B) is allowed although (B, A) would be as cheap.
        var problem = new SelectionProblem
        {
            Lines = [new("A", 0.01m, 100), new("B", 0.01m, 100)],
            Slots = [new("osc.r1", [Use(0), Use(1)]), new("osc.r2", [Use(0), Use(1)])],
            Groups = [new TupleGroup([0, 1], [[0, 0], [0, 1], [1, 0], [1, 1]], [Math.Log(5), Math.Log(2), Math.Log(5), double.NaN])],
            Bounds = [new("frequency", [new LogTerm(0, 1, TermKind.Group)], Math.Log(1.5), Math.Log(3))],
            BuildQuantity = 1,
            Costs = new CostModel(0, 0),
        };
        var run = new SelectionSolver(problem).Run(AcceptAll, 5, null, [0, 1], Later, 1, CancellationToken.None);

        Assert.True(run.Complete);
        Assert.Equal([0, 1], Assert.Single(run.Accepted).Choice);
    }

    [Fact]
    public void TopListIsInCostOrderWithTiesBrokenByFrequencyErrorThenMargin()
    {
        // Four options at 0.01, 0.01, 0.01, 0.02: the three ties rank by frequency error, then margin.
        var problem = new SelectionProblem
        {
            Lines = [new("A", 0.01m, 100), new("B", 0.01m, 100), new("C", 0.01m, 100), new("D", 0.02m, 100)],
            Slots = [new("osc.r", [Use(0), Use(1), Use(2), Use(3)])],
            BuildQuantity = 1,
            Costs = new CostModel(0, 0),
        };
        double[] error = [0.02, 0.01, 0.01, 0.0];
        double[] margin = [0.5, 0.1, 0.3, 0.9];
        var run = new SelectionSolver(problem).Run(
            c => new SelectionVerdict(true, FrequencyError: error[c[0]], Margin: margin[c[0]]),
            3, null, [0], Later, 1, CancellationToken.None);

        Assert.True(run.Complete);
        Assert.Equal([2, 1, 0], run.Accepted.Select(a => a.Choice[0]));
    }

    [Fact]
    public void CutoffExcludesDesignsDearerThanTheBound()
    {
        var problem = new SelectionProblem
        {
            Lines = [new("A", 0.05m, 100), new("B", 0.01m, 100)],
            Slots = [new("osc.r", [Use(0), Use(1)])],
            FixedDraws = [new PartDraw(0, 1)],
            BuildQuantity = 1,
            Costs = new CostModel(0, 0),
        };
        // The fixed draw costs 5 cents, so the cheapest design costs 6: a cutoff of 5 leaves nothing.
        var none = new SelectionSolver(problem).Run(AcceptAll, 1, 5, [0], Later, 1, CancellationToken.None);
        Assert.Empty(none.Accepted);
        Assert.True(none.Complete);
        var six = new SelectionSolver(problem).Run(AcceptAll, 1, 6, [0], Later, 1, CancellationToken.None);
        Assert.Equal(6, Assert.Single(six.Accepted).Objective);
    }

    [Fact]
    public void CancelledRunStopsWithoutClaimingCompleteness()
    {
        var problem = new SelectionProblem
        {
            Lines = [new("A", 0.01m, 100)],
            Slots = [new("osc.r", [Use(0)])],
            BuildQuantity = 1,
            Costs = new CostModel(0, 0),
        };
        using var cancelled = new CancellationTokenSource();
        cancelled.Cancel();
        var run = new SelectionSolver(problem).Run(AcceptAll, 1, null, [0], Later, 1, cancelled.Token);
        Assert.Empty(run.Accepted);
        Assert.False(run.Complete);
        Assert.Equal(0, run.Solves);
    }
}
