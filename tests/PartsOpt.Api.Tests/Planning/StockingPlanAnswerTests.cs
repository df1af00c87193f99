using System.Net;
using System.Net.Http.Json;
using PartsOpt.Api.Planning;

namespace PartsOpt.Api.Tests.Planning;

/// <summary>
/// A plan on a stockroom with no timing capacitor: today's stock cannot build the 1 kHz rc-ramp (named,
/// with the search's reason), the plan adds one capacitor line and says why; the yearly cost is the
/// definition's Σ units × cost per board + holding × lines.
/// </summary>
public sealed class StockingPlanAnswerTests(StockFactory factory) : IClassFixture<StockFactory>
{
    private readonly HttpClient _client = factory.CreateClient();

    [Fact]
    public async Task The_plan_buys_the_missing_capacitor_and_its_costs_add_up()
    {
        await PlanningStock.SeedAsync(_client);
        var before = await PlanningStock.RowsAsync(factory.Services);
        var response = await _client.PostJson("/api/v1/stocking-plans", PlanningStock.Plan().ToJsonString());
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.OK, text);
        var plan = (await response.Content.ReadFromJsonAsync<StockingPlanDto>(Api.Json))!;

        // Today: no timing capacitor, so nothing to build; the search's reason is passed on.
        var today = Assert.Single(plan.Today.Infeasible);
        Assert.Equal("fan-1k", today.Requirement);
        Assert.Equal("infeasible", today.Status);
        Assert.False(string.IsNullOrWhiteSpace(today.Reason));

        Assert.Empty(plan.Infeasible);
        var design = Assert.Single(plan.Designs);
        Assert.Equal("rc-ramp", design.Topology);
        var added = Assert.Single(plan.Added);
        Assert.StartsWith("NEW-C-", added, StringComparison.Ordinal);
        var line = plan.Lines.Single(l => l.PartNumber == added);
        Assert.Equal("new", line.Status);
        // IEC 60063: E6 is 1.0, 1.5, 2.2, 3.3, 4.7, 6.8; the answer names the smallest series holding the value
        // (E3 for 1.0, 2.2, 4.7).
        Assert.True(PartsOpt.Values.PreferredValues.Contains(PartsOpt.Values.ESeries.E6, line.Value!.Value));
        Assert.True(line.Series is "E3" or "E6", line.Series);
        Assert.InRange(line.Value!.Value, 10e-9 * (1 - 1e-9), 47e-9 * (1 + 1e-9));
        Assert.Equal(["fan-1k"], line.UsedBy);
        Assert.Contains(design.Roles, r => r.Role == "osc.c" && r.PartNumbers.SequenceEqual([added]));
        // Every existing line is kept; nothing dropped.
        Assert.Empty(plan.Dropped);
        Assert.Equal(8, plan.Lines.Count);
        Assert.All(plan.Lines.Where(l => l.PartNumber != added), l => Assert.Equal("existing", l.Status));

        // The year's cost from its definition.
        Assert.Equal(200 * design.PerBoard, design.YearlyCost);
        Assert.Equal(5.00m * plan.Lines.Count, plan.YearlyHoldingCost);
        Assert.Equal(design.YearlyCost + plan.YearlyHoldingCost, plan.YearlyCost);
        Assert.Equal(5.00m * 7, plan.Today.YearlyCost); // holding of today's seven lines, nothing buildable
        Assert.Equal(plan.YearlyCost - plan.Today.YearlyCost, plan.ChangeAgainstToday);
        Assert.True(plan.Optimality == "proved", $"{plan.OptimalityText}: {string.Join(" | ", plan.Notes)} {string.Join(",", plan.CandidateDesigns)}");
        Assert.Equal(plan.YearlyCost, plan.LowerBound); // proved: no plan costs less (docs/stocking-plans.md)
        Assert.Equal(Common.Cautions.PowerStage, plan.Cautions);
        // A plan is an answer, not a record: nothing written.
        Assert.Equal(before, await PlanningStock.RowsAsync(factory.Services));
    }
}
