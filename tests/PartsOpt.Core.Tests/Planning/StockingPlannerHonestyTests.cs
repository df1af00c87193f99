using PartsOpt.Planning;

namespace PartsOpt.Tests.Planning;

/// <summary>The planner claims a proof only when it has one, and says how far its search went when not.</summary>
public class StockingPlannerHonestyTests
{
    [Fact]
    public void APoolTooSmallToRuleOutTheRestIsTheBestFoundNotProved()
    {
        var question = PlanningPortfolios.Question(16, keepExisting: false) with { HoldingCostPerLine = 10m };
        var proved = StockingPlanner.Plan(question);
        // One design per requirement and no room to grow: with holding above 0, a plan pays for its lines, so
        // the floor bound (the one listed design's cost, and no holding) cannot reach the plan found.
        var small = StockingPlanner.Plan(question, new StockingOptions(PoolSize: 1, MaxPoolSize: 1));

        Assert.Equal(PlanOptimality.Proved, proved.Optimality);
        Assert.NotEmpty(proved.Designs);
        Assert.Equal(PlanOptimality.BestFound, small.Optimality);
        Assert.Equal("best over 1 candidate designs per requirement", small.OptimalityText);
        Assert.Contains(small.Notes, n => n.Contains("could not be ruled out", StringComparison.Ordinal));
        Assert.True(small.YearlyCost >= proved.YearlyCost, $"{small.YearlyCost} below the proved {proved.YearlyCost}");
        StockingPlannerExactnessTests.CheckConsistent(question, small);
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
