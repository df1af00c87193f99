using PartsOpt.Planning;
using PartsOpt.Search;
using Xunit.Abstractions;

namespace PartsOpt.Tests.Planning;

/// <summary>
/// Exactness: on small seeded random portfolios the planner's yearly cost equals the minimum over every
/// subset of lines (<see cref="SubsetReference"/>), to the exact decimal, with optimality proved; and both
/// name the same requirements as impossible.
/// </summary>
public class StockingPlannerExactnessTests(ITestOutputHelper output)
{
    public static TheoryData<int, bool> Portfolios() => new()
    {
        { 1, true }, { 4, true }, { 6, true }, { 7, false }, { 10, false }, { 12, false }, { 13, true }, { 14, false }, { 16, false },
    };

    [Theory]
    [MemberData(nameof(Portfolios))]
    public void PlannerAgreesWithEveryLineSubset(int seed, bool keepExisting)
    {
        var question = PlanningPortfolios.Question(seed, keepExisting);
        var plan = StockingPlanner.Plan(question, new StockingOptions(SearchTimeLimit: TimeSpan.FromSeconds(600)));
        var reference = SubsetReference.Cheapest(question);
        output.WriteLine($"seed {seed}: plan {plan.YearlyCost} ({plan.Optimality}, {plan.Rounds} rounds, {plan.Elapsed.TotalSeconds:F1} s), " +
            $"reference {reference.YearlyCost} over {reference.Subsets} subsets, {reference.Searches} searches; unmet {string.Join(",", reference.Infeasible)}");

        output.WriteLine($"  reference best: {reference.Best}");
        output.WriteLine($"  plan lines: {string.Join(" ", plan.Lines.Select(l => l.PartNumber))}; holding {question.HoldingCostPerLine}");
        foreach (var d in plan.Designs)
            output.WriteLine($"  {d.Requirement}: {d.PerBoard} × {d.UnitsPerYear} using {string.Join(" ", d.Lines)}");
        foreach (var u in plan.Unmet)
            output.WriteLine($"  {u.Requirement}: {u.Reason}");
        Assert.Equal(reference.Infeasible, plan.Unmet.Select(u => u.Requirement));
        Assert.All(plan.Unmet, u => Assert.Equal(SearchStatus.Infeasible, u.Status));
        if (reference.YearlyCost is null)
        {
            Assert.Equal(PlanOptimality.None, plan.Optimality);
            return;
        }
        Assert.Equal(PlanOptimality.Proved, plan.Optimality);
        Assert.Equal("proved", plan.OptimalityText);
        Assert.Equal(reference.YearlyCost, plan.YearlyCost);
        Assert.Equal(reference.YearlyCost, plan.LowerBound);
        CheckConsistent(question, plan);
    }

    /// <summary>
    /// The bound is a bound: cut short after one round with pools of one design, the planner's lower bound is
    /// no higher than the minimum over every subset of lines, and its plan no lower.
    /// </summary>
    [Theory]
    [MemberData(nameof(Portfolios))]
    public void ABoundAfterOneRoundIsNoHigherThanEverySubsetsMinimum(int seed, bool keepExisting)
    {
        var question = PlanningPortfolios.Question(seed, keepExisting);
        var plan = StockingPlanner.Plan(question, new StockingOptions(PoolSize: 1, MaxPoolSize: 1, MaxRefinementRounds: 1,
            SearchTimeLimit: TimeSpan.FromSeconds(600)));
        var reference = SubsetReference.Cheapest(question);
        output.WriteLine($"seed {seed}: bound {plan.LowerBound}, plan {plan.YearlyCost} ({plan.Optimality}), reference {reference.YearlyCost}");
        if (reference.YearlyCost is not { } least)
            return;
        Assert.NotNull(plan.LowerBound);
        Assert.True(plan.LowerBound <= least, $"bound {plan.LowerBound} above the minimum {least}");
        Assert.True(plan.YearlyCost >= least, $"plan {plan.YearlyCost} below the minimum {least}");
        if (plan.Optimality == PlanOptimality.Proved)
            Assert.Equal(least, plan.YearlyCost);
    }

    /// <summary>
    /// Pools that may not grow: the plan can then only be proved by the model with a stand-in for the designs
    /// each pool left out (the pool's floor, sharing the plan's lines) and the cuts the searches on its lines
    /// teach it, and must still equal the minimum over every subset of lines.
    /// </summary>
    [Theory]
    [InlineData(4, true)]
    [InlineData(6, true)]
    [InlineData(7, false)]
    [InlineData(10, false)]
    [InlineData(12, false)]
    [InlineData(14, false)]
    [InlineData(16, false)]
    public void Pools_that_cannot_grow_are_proved_by_the_stand_in_bound(int seed, bool keepExisting)
    {
        var question = PlanningPortfolios.Question(seed, keepExisting);
        var plan = StockingPlanner.Plan(question, new StockingOptions(PoolSize: 8, MaxPoolSize: 8, SearchTimeLimit: TimeSpan.FromSeconds(600)));
        var reference = SubsetReference.Cheapest(question);

        Assert.Equal(PlanOptimality.Proved, plan.Optimality);
        Assert.Equal(reference.YearlyCost, plan.YearlyCost);
        Assert.Contains(plan.CandidateDesigns.Values, count => count >= 8); // some pool did leave designs out
    }

    /// <summary>
    /// Seed 8 once caught a flaw in the design search: a run asked for one design accepted a second one tied at
    /// the same cost, forbade it in the model, and then dropped it from its list, so the continued model never
    /// listed it (1.766 per board, osc.r1, cmp.ra, cmp.rb on N-R6). The planner, trusting the list, held one
    /// line more than needed (726.400 a year against 724.400).
    /// </summary>
    [Fact]
    public void PlannerAgreesWithEveryLineSubsetOnSeedEight() => PlannerAgreesWithEveryLineSubset(8, true);

    /// <summary>
    /// What the planner relies on from the search: a design found on any smaller stock and no dearer than
    /// the K-th design of the whole stock is in the whole stock's list of K (same cost, same lines).
    /// </summary>
    [Fact]
    public void TheWholeStocksListHoldsEveryDesignNoDearerThanItsLast()
    {
        var question = PlanningPortfolios.Question(8, true);
        var requirement = question.Requirements[0].Requirement with { MaxResults = 3 };
        var options = new SearchOptions(TimeSpan.FromSeconds(600));
        var whole = new Stock([.. question.Existing.Parts, .. question.Candidates.Parts], [.. question.Existing.OpAmps, .. question.Candidates.OpAmps]);
        var listed = DesignSearch.Run(requirement, whole, options);
        var smaller = whole with { Parts = whole.Parts.Where(p => p.PartNumber != "N-C220N").ToList() };
        var found = DesignSearch.Run(requirement, smaller, options);
        static string Lines(FoundDesign d) => string.Join(" ", d.Bom.Select(b => $"{b.PartNumber}x{b.PerBoard}"));
        var last = listed.Designs[requirement.MaxResults - 1].Cost.PerBoard;
        foreach (var design in found.Designs.Where(d => d.Cost.PerBoard <= last))
            Assert.Contains(Lines(design), listed.Designs.Select(Lines));
    }

    /// <summary>The plan's own figures add up: lines, designs, costs and the reasons each line is held.</summary>
    internal static void CheckConsistent(StockingQuestion question, StockingPlan plan)
    {
        var held = plan.Lines.Select(l => l.PartNumber).ToHashSet(StringComparer.OrdinalIgnoreCase);
        foreach (var design in plan.Designs)
        {
            Assert.All(design.Design.Bom, b => Assert.Contains(b.PartNumber, held));
            Assert.Equal(design.Design.Cost.PerBoard, design.PerBoard);
            Assert.Equal(design.UnitsPerYear * design.PerBoard, design.YearlyCost);
            var requirement = question.Requirements.Single(r => r.Name == design.Requirement).Requirement;
            Assert.True(DesignJudge.Judge(requirement, design.Design.Design).Accepted);
        }
        Assert.Equal(plan.Designs.Sum(d => d.YearlyCost) + question.HoldingCostPerLine * plan.Lines.Count, plan.YearlyCost);
        Assert.Equal(question.HoldingCostPerLine * plan.Lines.Count, plan.YearlyHoldingCost);
        foreach (var line in plan.Lines)
        {
            Assert.Equal(line.UsedBy.OrderBy(x => x), plan.Designs.Where(d => d.Lines.Contains(line.PartNumber)).Select(d => d.Requirement).OrderBy(x => x));
            if (!question.KeepExisting)
                Assert.NotEmpty(line.UsedBy);
            Assert.Equal(question.Existing.Parts.Any(p => p.PartNumber == line.PartNumber) || question.Existing.OpAmps.Any(o => o.PartNumber == line.PartNumber), line.Existing);
        }
        if (question.KeepExisting)
            Assert.Empty(plan.Dropped);
    }
}
