using System.Net;
using System.Text.Json.Nodes;

namespace PartsOpt.Api.Tests.DesignSearches;

/// <summary>A requirement that means nothing is a 400 ValidationProblem naming the field; no search runs.</summary>
public sealed class DesignSearchInputTests(StockFactory factory) : IClassFixture<StockFactory>
{
    private readonly HttpClient _client = factory.CreateClient();

    [Theory]
    [InlineData("duty.min", "duty", """{"min": 0.9, "max": 0.1}""")]
    [InlineData("duty.max", "duty", """{"min": 0.1, "max": 1.5}""")]
    [InlineData("duty.adjust", "duty", """{"min": 0.1, "max": 0.9, "adjust": "knob"}""")]
    [InlineData("duty.controlRange", "duty", """{"min": 0.1, "max": 0.9, "adjust": "controlVoltage"}""")]
    [InlineData("duty.controlRange.min", "duty", """{"min": 0.1, "max": 0.9, "adjust": "controlVoltage", "controlRange": {"min": 5, "max": 1}}""")]
    [InlineData("duty.controlRange.max", "duty", """{"min": 0.1, "max": 0.9, "adjust": "controlVoltage", "controlRange": {"min": 0, "max": 30}}""")]
    [InlineData("frequency.tolerance", "frequency", """{"target": 1000, "tolerance": 0}""")]
    [InlineData("frequency.tolerance", "frequency", """{"target": 1000, "tolerance": 1}""")]
    [InlineData("frequency.tolerance", "frequency", """{"target": 1000, "tolerance": -0.1}""")]
    [InlineData("frequency.target", "frequency", """{"target": 0, "tolerance": 0.05}""")]
    [InlineData("frequency.target", "frequency", """{"target": -50, "tolerance": 0.05}""")]
    [InlineData("frequency.target", "frequency", """{"target": 2e6, "tolerance": 0.05}""")]
    [InlineData("frequency.target", "frequency", """{"tolerance": 0.05}""")]
    [InlineData("buildQuantity", "buildQuantity", "0")]
    [InlineData("buildQuantity", "buildQuantity", "-3")]
    [InlineData("topologies[1]", "topologies", """["loop", "bridge"]""")]
    [InlineData("supply.positive", "supply", """{"positive": 0, "negative": -12}""")]
    [InlineData("supply.negative", "supply", """{"positive": 12, "negative": 5}""")]
    [InlineData("trianglePeakToPeak.target", "trianglePeakToPeak", """{"target": 40, "tolerance": 0.1}""")]
    [InlineData("output.maxLow", "output", """{"minHigh": 5, "maxLow": 8}""")]
    [InlineData("yield.target", "yield", """{"target": 1.2}""")]
    [InlineData("yield.method", "yield", """{"target": 0.99, "method": "guess"}""")]
    [InlineData("temperature.min", "temperature", """{"min": 85, "max": -40}""")]
    [InlineData("costModel.placement", "costModel", """{"placement": -0.01}""")]
    [InlineData("maxResults", "maxResults", "0")]
    [InlineData("maxResults", "maxResults", "500")]
    [InlineData("timeLimitSeconds", "timeLimitSeconds", "0")]
    [InlineData("timeLimitSeconds", "timeLimitSeconds", "3600")]
    public async Task A_nonsense_field_is_400_naming_it(string field, string property, string json)
    {
        var body = SearchStock.Requirement();
        body[property] = JsonNode.Parse(json);
        var response = await _client.PostJson("/api/v1/design-searches", body.ToJsonString());
        (await response.AssertProblem(HttpStatusCode.BadRequest)).ErrorsFor(field);
    }

    [Theory]
    [InlineData("frequency.target", "\"NaN\"")]
    [InlineData("frequency.tolerance", "\"Infinity\"")]
    public async Task Non_finite_numbers_are_400_naming_the_field(string field, string value)
    {
        // System.Text.Json reads "NaN" only when asked to; the body fails binding at that field.
        var json = SearchStock.Requirement().ToJsonString().Replace(
            field == "frequency.target" ? "\"target\":1000" : "\"tolerance\":0.05", $"\"{field.Split('.')[1]}\":{value}",
            StringComparison.Ordinal);
        var response = await _client.PostJson("/api/v1/design-searches", json);
        (await response.AssertProblem(HttpStatusCode.BadRequest)).ErrorsFor(field);
    }

    [Theory]
    [InlineData("supply")]
    [InlineData("frequency")]
    [InlineData("duty")]
    [InlineData("buildQuantity")]
    public async Task A_missing_required_field_is_400_naming_it(string property)
    {
        var body = SearchStock.Requirement();
        body.Remove(property);
        var response = await _client.PostJson("/api/v1/design-searches", body.ToJsonString());
        (await response.AssertProblem(HttpStatusCode.BadRequest)).ErrorsFor(property);
    }

    [Fact]
    public async Task Nothing_is_stored_for_a_rejected_request()
    {
        var body = SearchStock.Requirement();
        body["buildQuantity"] = 0;
        await (await _client.PostJson("/api/v1/design-searches", body.ToJsonString())).AssertProblem(HttpStatusCode.BadRequest);
        Assert.Equal(0, await factory.WithDbAsync(db => Task.FromResult(db.DesignSearches.Count())));
    }
}
