using System.Net;
using System.Net.Http.Json;

namespace PartsOpt.Api.Tests;

/// <summary>No input produces a 500: every bad request is a 400 problem (RFC 9457) naming the field.</summary>
public sealed class BadInputTests : IClassFixture<StockFactory>
{
    private readonly HttpClient _client;

    public BadInputTests(StockFactory factory) => _client = factory.CreateClient();

    [Fact]
    public async Task Malformed_json_is_400()
    {
        var response = await _client.PostJson("/api/v1/parts", "{\"partNumber\": \"R-1\", \"kind\": ");
        (await response.AssertProblem(HttpStatusCode.BadRequest)).ErrorsFor("$");
    }

    [Fact]
    public async Task Empty_body_is_400()
    {
        var response = await _client.PostJson("/api/v1/parts", "");
        var problem = await response.AssertProblem(HttpStatusCode.BadRequest);
        Assert.Contains("body", problem.GetProperty("detail").GetString(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task Wrong_type_is_400_naming_the_field()
    {
        var response = await _client.PostJson("/api/v1/parts",
            """{"partNumber": "R-T1", "kind": "resistor", "resistor": {"resistanceOhms": true}}""");
        (await response.AssertProblem(HttpStatusCode.BadRequest)).ErrorsFor("resistor.resistanceOhms");
    }

    [Theory]
    [InlineData("\"NaN\"")]
    [InlineData("\"Infinity\"")]
    [InlineData("1e400")] // beyond double's range (IEEE 754 binary64 max ≈ 1.8e308)
    public async Task Non_finite_values_are_400_naming_the_field(string value)
    {
        var response = await _client.PostJson("/api/v1/parts",
            $$$"""{"partNumber": "R-NF", "kind": "resistor", "resistor": {"resistanceOhms": {{{value}}}, "toleranceMinus": 0.01, "tolerancePlus": 0.01}}""");
        (await response.AssertProblem(HttpStatusCode.BadRequest)).ErrorsFor("resistor.resistanceOhms");
    }

    [Fact]
    public async Task Negative_values_are_400_naming_each_field()
    {
        var response = await _client.PostJson("/api/v1/parts", """
            {"partNumber": "C-NEG", "kind": "capacitor", "unitCost": -1,
             "capacitor": {"capacitanceF": -1e-9, "toleranceMinus": 0.05, "tolerancePlus": 0.05,
                           "dielectric": "X7R", "voltageRatingV": -50, "polarised": false}}
            """);
        var problem = await response.AssertProblem(HttpStatusCode.BadRequest);
        problem.ErrorsFor("capacitor.capacitanceF");
        problem.ErrorsFor("capacitor.voltageRatingV");
        problem.ErrorsFor("unitCost");
    }

    [Fact]
    public async Task Unknown_kind_and_missing_kind_object_are_400()
    {
        var unknown = await _client.PostJson("/api/v1/parts", """{"partNumber": "T-1", "kind": "transistor"}""");
        var messages = (await unknown.AssertProblem(HttpStatusCode.BadRequest)).ErrorsFor("kind");
        Assert.Contains(messages, m => m.Contains("transistor", StringComparison.Ordinal));

        var bare = await _client.PostJson("/api/v1/parts", """{"partNumber": "R-BARE", "kind": "resistor"}""");
        (await bare.AssertProblem(HttpStatusCode.BadRequest)).ErrorsFor("resistor");

        var foreign = await _client.PostJson("/api/v1/parts", """
            {"partNumber": "R-FOREIGN", "kind": "resistor",
             "resistor": {"resistanceOhms": 1, "toleranceMinus": 0.01, "tolerancePlus": 0.01},
             "opAmp": {"sections": 2}}
            """);
        (await foreign.AssertProblem(HttpStatusCode.BadRequest)).ErrorsFor("opAmp");
    }

    [Theory]
    [InlineData("", "partNumber")]
    [InlineData("has space", "partNumber")]
    [InlineData("export", "partNumber")] // a literal route segment under /api/v1/parts
    public async Task Bad_part_numbers_are_400(string partNumber, string field)
    {
        var response = await _client.PostAsJsonAsync("/api/v1/parts", Api.Resistor(partNumber, 100));
        (await response.AssertProblem(HttpStatusCode.BadRequest)).ErrorsFor(field);
    }

    [Fact]
    public async Task Op_amp_rules_name_their_fields()
    {
        var response = await _client.PostJson("/api/v1/parts", """
            {"partNumber": "U-BAD", "kind": "op-amp",
             "opAmp": {"sections": 3, "supplyMinV": 30, "supplyMaxV": 5, "slewRateVPerS": 0,
                       "outputHeadroomLowV": -1, "outputHeadroomHighV": 1, "inputHeadroomLowV": -0.3,
                       "inputHeadroomHighV": 1, "comparator": false, "openDrain": false}}
            """);
        var problem = await response.AssertProblem(HttpStatusCode.BadRequest);
        problem.ErrorsFor("opAmp.sections");
        problem.ErrorsFor("opAmp.supplyMaxV");
        problem.ErrorsFor("opAmp.slewRateVPerS");
        problem.ErrorsFor("opAmp.outputHeadroomLowV");
        problem.ErrorsFor("opAmp.gainBandwidthHz"); // required for an amplifier, not for a comparator
    }

    [Fact]
    public async Task Bad_list_parameters_are_400()
    {
        (await (await _client.GetAsync("/api/v1/parts?pageSize=100000")).AssertProblem(HttpStatusCode.BadRequest)).ErrorsFor("pageSize");
        (await (await _client.GetAsync("/api/v1/parts?kind=resistor&min=lots")).AssertProblem(HttpStatusCode.BadRequest)).ErrorsFor("min");
        (await (await _client.GetAsync("/api/v1/parts?min=1k")).AssertProblem(HttpStatusCode.BadRequest)).ErrorsFor("min");
        (await (await _client.GetAsync("/api/v1/parts?kind=diode")).AssertProblem(HttpStatusCode.BadRequest)).ErrorsFor("kind");
        await (await _client.GetAsync("/api/v1/parts?page=abc")).AssertProblem(HttpStatusCode.BadRequest);
    }
}
