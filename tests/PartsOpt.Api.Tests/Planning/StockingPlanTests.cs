using System.Net;
using System.Net.Http.Json;
using System.Text.Json.Nodes;
using PartsOpt.Api.Planning;

namespace PartsOpt.Api.Tests.Planning;

/// <summary>POST /api/v1/stocking-plans on a thin stockroom: bad input named and nothing written; a plan that
/// buys the missing capacitor, its figures adding up from their definitions.</summary>
public sealed class StockingPlanTests(StockFactory factory) : IClassFixture<StockFactory>
{
    private readonly HttpClient _client = factory.CreateClient();

    [Theory]
    [InlineData("requirements", "requirements", "[]")]
    [InlineData("requirements[0].unitsPerYear", "requirements", """[{"name": "a", "unitsPerYear": 0, "requirement": {}}]""")]
    [InlineData("requirements[0].unitsPerYear", "requirements", """[{"name": "a", "unitsPerYear": -20, "requirement": {}}]""")]
    [InlineData("requirements[0].name", "requirements", """[{"unitsPerYear": 5, "requirement": {}}]""")]
    [InlineData("requirements[0].requirement.duty", "requirements", """[{"name": "a", "unitsPerYear": 5, "requirement": {"supply": {"positive": 12}, "frequency": {"target": 1000, "tolerance": 0.1}, "buildQuantity": 10}}]""")]
    [InlineData("requirements[1].name", "requirements", """[{"name": "a", "unitsPerYear": 5}, {"name": "a", "unitsPerYear": 5}]""")]
    [InlineData("candidates.resistorSeries", "candidates", """{"resistorSeries": "E25", "resistorRange": {"min": 1000, "max": 10000}, "resistorUnitCost": 0.01, "packageCostPerLine": 1}""")]
    [InlineData("candidates.resistorRange.min", "candidates", """{"resistorSeries": "E24", "resistorRange": {"min": 10000, "max": 1000}, "resistorUnitCost": 0.01, "packageCostPerLine": 1}""")]
    [InlineData("candidates.capacitorRange.min", "candidates", """{"capacitorSeries": "E12", "capacitorRange": {"min": 1e-6, "max": 1e-9}, "capacitorUnitCost": 0.01, "packageCostPerLine": 1}""")]
    [InlineData("candidates.capacitorDielectric", "candidates", """{"capacitorSeries": "E12", "capacitorRange": {"min": 1e-9, "max": 1e-8}, "capacitorUnitCost": 0.01, "capacitorDielectric": "paper", "packageCostPerLine": 1}""")]
    [InlineData("candidates.resistorUnitCost", "candidates", """{"resistorSeries": "E24", "resistorRange": {"min": 1000, "max": 10000}, "packageCostPerLine": 1}""")]
    [InlineData("candidates.packageCostPerLine", "candidates", """{"packageCostPerLine": -1}""")]
    [InlineData("candidates.packageCostPerLine", "candidates", """{}""")]
    [InlineData("candidates", "candidates", """{"resistorSeries": "E192", "resistorRange": {"min": 1, "max": 1e7}, "resistorUnitCost": 0.01, "packageCostPerLine": 1}""")]
    [InlineData("candidates.opAmps[0].opAmp.sections", "candidates", """{"packageCostPerLine": 1, "opAmps": [{"partNumber": "X1", "unitCost": 0.2, "opAmp": {"sections": 3}}]}""")]
    [InlineData("candidates.opAmps[0].unitCost", "candidates", """{"packageCostPerLine": 1, "opAmps": [{"partNumber": "X1"}]}""")]
    [InlineData("poolSize", "poolSize", "0")]
    [InlineData("timeLimitSeconds", "timeLimitSeconds", "9999")]
    public async Task A_nonsense_field_is_400_naming_it_and_nothing_is_written(string field, string property, string json)
    {
        var before = await PlanningStock.RowsAsync(factory.Services);
        var body = PlanningStock.Plan();
        body[property] = JsonNode.Parse(json);
        var response = await _client.PostJson("/api/v1/stocking-plans", body.ToJsonString());
        (await response.AssertProblem(HttpStatusCode.BadRequest)).ErrorsFor(field);
        Assert.Equal(before, await PlanningStock.RowsAsync(factory.Services));
    }

    [Fact]
    public async Task A_candidate_op_amp_already_in_stock_is_400_naming_it()
    {
        await PlanningStock.SeedAsync(_client);
        var body = PlanningStock.Plan();
        body["candidates"]!["opAmps"] = new JsonArray(JsonNode.Parse(System.Text.Json.JsonSerializer.Serialize(
            new { partNumber = "P-U-QUAD", unitCost = 0.3, opAmp = PlanningStock.OpAmpLimits() })));
        var response = await _client.PostJson("/api/v1/stocking-plans", body.ToJsonString());
        (await response.AssertProblem(HttpStatusCode.BadRequest)).ErrorsFor("candidates.opAmps[0].partNumber");
    }
}
