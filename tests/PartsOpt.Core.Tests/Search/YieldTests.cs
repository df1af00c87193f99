using PartsOpt.Search;
using PartsOpt.Topologies;
using static PartsOpt.Tests.Search.TestStock;

namespace PartsOpt.Tests.Search;

/// <summary>The yield post-check: designs that meet the bands nominally but not across their tolerances are cut.</summary>
public class YieldTests
{
    private static readonly SearchOptions Generous = new(TimeSpan.FromSeconds(600));

    private static SearchRequirement RcRampWithYield(YieldRequirement? yield) =>
        PwmAt20Kilohertz(TopologyKind.RcRamp) with { Duty = new DutyRequirement(0.20, 0.80), Yield = yield, MaxResults = 3 };

    [Fact]
    public void EveryDesignReturnedHoldsItsBandsAtTheWorstCase()
    {
        var requirement = RcRampWithYield(new YieldRequirement(1, YieldMethod.WorstCase));
        var outcome = DesignSearch.Run(requirement, Stockroom(), Generous);
        var nominalOnly = DesignSearch.Run(RcRampWithYield(null), Stockroom(), Generous);

        Assert.Equal(SearchStatus.Optimal, outcome.Status);
        Assert.All(outcome.Designs, d => Assert.Equal(1, new ToleranceYieldCheck().Estimate(requirement, d.Design).Yield));
        Assert.True(outcome.Designs[0].Cost.PerBoard >= nominalOnly.Designs[0].Cost.PerBoard);
    }

    [Fact]
    public void LooseCapacitorsFailTheWorstCaseThoughTheyPassNominally()
    {
        // ±20 % timing capacitors move the frequency by ±20 % at the corners (sensitivity −1, REFERENCE.md):
        // no design keeps inside ±10 %.
        var loose = Stockroom() with
        {
            Parts = [.. Stockroom().Parts.Select(p => p.Kind == RoleKind.Capacitor ? p with { Tolerance = 0.20 } : p)],
        };
        Assert.Equal(SearchStatus.Optimal, DesignSearch.Run(RcRampWithYield(null), loose, Generous).Status);
        var outcome = DesignSearch.Run(RcRampWithYield(new YieldRequirement(1)), loose, Generous);

        Assert.Equal(SearchStatus.Infeasible, outcome.Status);
        Assert.Contains("yield short", Assert.Single(outcome.Topologies).Blocking, StringComparison.Ordinal);
    }

    [Fact]
    public void ASuppliedYieldCheckIsAskedAndObeyed()
    {
        var check = new RefusesPart("R-4K7");
        var requirement = RcRampWithYield(new YieldRequirement(0.99));
        var outcome = DesignSearch.Run(requirement, Stockroom(), Generous with { YieldCheck = check });

        Assert.True(check.Asked > 0);
        Assert.Equal(SearchStatus.Optimal, outcome.Status);
        Assert.All(outcome.Designs, d => Assert.DoesNotContain(d.RoleParts.Values, parts => parts.Contains("R-4K7")));
    }

    private sealed class RefusesPart(string partNumber) : IYieldCheck
    {
        public int Asked { get; private set; }

        public YieldResult Estimate(SearchRequirement requirement, CircuitDesign design)
        {
            Asked++;
            return design.Roles.Values.Any(p => p.PartNumber == partNumber)
                ? new YieldResult(0.5, $"{partNumber} refused")
                : new YieldResult(1, "fine");
        }
    }
}
