using PartsOpt.Planning;

namespace PartsOpt.Tests.Planning;

/// <summary>The planner claims a proof only when it has one, and says how far its search went when not.</summary>
public class StockingPlannerHonestyTests
{
    [Fact]
    public void APlanCutShortIsTheBestFoundAndSaysHowFarTheBoundGot()
    {
        var question = PlanningPortfolios.Question(16, keepExisting: false) with { HoldingCostPerLine = 10m };
        var proved = StockingPlanner.Plan(question);
        // One design per requirement, no room to grow and one round: the bound's model then takes stand-ins that
        // need no line, while any real plan pays for its lines (holding above 0), so the bound stays below.
        var small = StockingPlanner.Plan(question, new StockingOptions(PoolSize: 1, MaxPoolSize: 1, MaxRefinementRounds: 1));

        Assert.Equal(PlanOptimality.Proved, proved.Optimality);
        Assert.NotEmpty(proved.Designs);
        Assert.Equal(proved.YearlyCost, proved.LowerBound);
        Assert.Equal(PlanOptimality.BestFound, small.Optimality);
        Assert.Equal("best over 1 candidate designs per requirement", small.OptimalityText);
        Assert.Contains(small.Notes, n => n.Contains("not proved", StringComparison.Ordinal));
        Assert.Contains(small.Notes, n => n.Contains("rounds ran out", StringComparison.Ordinal));
        // The bound is one: no higher than the proved optimum, which is no higher than the plan cut short.
        Assert.NotNull(small.LowerBound);
        Assert.True(small.LowerBound < small.YearlyCost, $"bound {small.LowerBound}, plan {small.YearlyCost}");
        Assert.True(small.LowerBound <= proved.YearlyCost, $"bound {small.LowerBound} above the proved {proved.YearlyCost}");
        Assert.True(small.YearlyCost >= proved.YearlyCost, $"{small.YearlyCost} below the proved {proved.YearlyCost}");
        StockingPlannerExactnessTests.CheckConsistent(question, small);
    }

    /// <summary>
    /// With every pool complete the first round's model is the whole problem: its solution, searched again on
    /// the lines it holds, is a plan no dearer than the model's optimum, so the round ends proved there. (It has
    /// nothing left to learn: had it gone on, it would have stopped as stalled, unproved.)
    /// </summary>
    [Fact]
    public void WithCompletePoolsTheFirstRoundProvesThePlan()
    {
        var question = PlanningPortfolios.Question(14, keepExisting: false);
        var plan = StockingPlanner.Plan(question);

        Assert.All(plan.CandidateDesigns.Values, count => Assert.True(count < new StockingOptions().PoolSize, $"{count} designs: a pool not complete"));
        Assert.Equal(PlanOptimality.Proved, plan.Optimality);
        Assert.Equal(1, plan.Rounds);
        Assert.Equal(plan.YearlyCost, plan.LowerBound);
    }

    [Fact]
    public void RequirementsAndHoldingCostAreChecked()
    {
        var question = PlanningPortfolios.Question(16, keepExisting: false);
        var twice = question with { Requirements = [question.Requirements[0], question.Requirements[0]] };
        Assert.Equal("requirements[1].name", Assert.Throws<ArgumentException>(() => StockingPlanner.Plan(twice)).ParamName);
        var none = question with { Requirements = [question.Requirements[0] with { UnitsPerYear = 0 }] };
        Assert.Equal("requirements[0].unitsPerYear", Assert.Throws<ArgumentException>(() => StockingPlanner.Plan(none)).ParamName);
        var negative = question with { HoldingCostPerLine = -1m };
        Assert.Equal("packageCostPerLine", Assert.Throws<ArgumentException>(() => StockingPlanner.Plan(negative)).ParamName);
        Assert.Equal("requirements", Assert.Throws<ArgumentException>(() => StockingPlanner.Plan(question with { Requirements = [] })).ParamName);
    }
}
