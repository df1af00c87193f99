using PartsOpt.Search;
using PartsOpt.Topologies;

namespace PartsOpt.Tests.Search;

/// <summary>
/// The branch and bound's own guarantees, beyond agreeing with the exhaustive reference
/// (RandomStockExactnessTests): its frequency forecast never disagrees with the engine it stands in for, and
/// the outcome does not depend on how the variants searched side by side happen to interleave.
/// </summary>
public class SelectionEnumeratorTests
{
    [Fact]
    public void The_forecast_agrees_with_every_judgement_it_meets()
    {
        var requirement = TestStock.PwmAt20Kilohertz() with { MaxResults = 3 };
        var context = new SearchContext(requirement, TestStock.Stockroom());
        var tracker = new MissTracker();
        var compared = 0L;
        foreach (var variant in Enum.GetValues<TopologyKind>().SelectMany(t => VariantPlanner.Plan(context, t).Variants))
        {
            var enumerator = new SelectionEnumerator(variant) { QuickStart = false };
            enumerator.Run(
                choice => DesignSearch.Verify(variant, choice, null, tracker, forModel: false),
                choice => DesignJudge.Judge(requirement, variant.DesignOf(choice)),
                () => null,
                _ => { },
                DateTime.UtcNow.AddSeconds(20),
                CancellationToken.None);
            Assert.True(enumerator.ForecastTrusted, $"{variant.Describe()}: a forecast disagreed with the engine");
            compared += enumerator.PartialJudged;
        }
        Assert.True(compared > 0, "no partial design was judged, so the forecast was never checked");
    }

    [Theory]
    [InlineData(20e3)]
    [InlineData(2e6)] // beyond every stocked part: nothing fits, and the reports must repeat too
    public void Two_runs_of_one_search_give_the_same_answer(double hertz)
    {
        var requirement = TestStock.PwmAt20Kilohertz() with
        {
            Frequency = new Band(hertz, 0.1),
            MaxResults = 5,
        };
        var stock = TestStock.Stockroom();
        string Answer()
        {
            var outcome = DesignSearch.Run(requirement, stock, new SearchOptions(TimeSpan.FromSeconds(120)));
            Assert.True(outcome.Status is SearchStatus.Optimal or SearchStatus.Infeasible, outcome.Status.ToString());
            var designs = outcome.Designs.Select(d =>
                $"{d.Rank} {d.Topology} {d.Cost.TotalBuildCost} {string.Join(",", d.RoleParts.OrderBy(kv => kv.Key).Select(kv => kv.Key + "=" + string.Join("+", kv.Value)))}");
            var reports = outcome.Topologies.Select(t =>
                $"{t.Topology} {t.Feasible} {t.Blocking} {(t.Nearest is { } n ? string.Join(",", n.RoleParts.OrderBy(kv => kv.Key).Select(kv => kv.Key + "=" + kv.Value)) : "")}");
            return string.Join("\n", designs.Concat(reports));
        }
        var first = Answer();
        for (var run = 0; run < 3; run++)
            Assert.Equal(first, Answer());
    }
}
