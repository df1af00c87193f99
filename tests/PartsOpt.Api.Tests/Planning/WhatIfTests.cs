using System.Net;
using System.Net.Http.Json;
using System.Text.Json.Nodes;
using PartsOpt.Api.DesignSearches;
using PartsOpt.Api.Planning;

namespace PartsOpt.Api.Tests.Planning;

/// <summary>
/// POST /api/v1/design-searches/{id}/what-if on a stockroom without a timing capacitor: the stored search is
/// infeasible, the top candidate makes it feasible, and adding that capacitor to the stock by hand and
/// searching again gives the cost the what-if promised.
/// </summary>
public sealed class WhatIfTests(StockFactory factory) : IClassFixture<StockFactory>
{
    private readonly HttpClient _client = factory.CreateClient();

    private static JsonObject Series() => new()
    {
        ["series"] = new JsonObject
        {
            ["capacitors"] = "E6",
            ["capacitorRange"] = new JsonObject { ["min"] = 10e-9, ["max"] = 47e-9 },
            ["capacitorUnitCost"] = 0.03,
        },
        ["timeLimitSeconds"] = 240,
    };

    [Fact]
    public async Task The_top_candidate_gives_the_promised_cost_when_bought()
    {
        await PlanningStock.SeedAsync(_client);
        var requirement = PlanningStock.Requirement();
        requirement["timeLimitSeconds"] = 60;
        var created = await _client.PostJson("/api/v1/design-searches", requirement.ToJsonString());
        Assert.True(created.StatusCode == HttpStatusCode.Created, await created.Content.ReadAsStringAsync());
        var search = (await created.Content.ReadFromJsonAsync<DesignSearchDto>(Api.Json))!;
        Assert.Equal("infeasible", search.Status);

        var response = await _client.PostJson($"/api/v1/design-searches/{search.Id}/what-if", Series().ToJsonString());
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.OK, text);
        var whatIf = (await response.Content.ReadFromJsonAsync<WhatIfDto>(Api.Json))!;
        Assert.Equal("infeasible", whatIf.BaseStatus);
        Assert.False(whatIf.CutShort);
        Assert.Equal(5, whatIf.Candidates); // IEC 60063 E6 from 10 nF to 47 nF: 10, 15, 22, 33, 47
        var top = whatIf.Ranked[0];
        Assert.Equal(1, top.Rank);
        Assert.True(top.MakesFeasible);
        Assert.Contains(top.Design!.Roles, r => r.Role == "osc.c" && r.PartNumbers.SequenceEqual([top.PartNumber]));
        Assert.Equal(Common.Cautions.PowerStage, whatIf.Cautions);

        // The check: buy it (same part number and figures), search again, compare.
        await _client.CreatePart(new
        {
            partNumber = top.PartNumber, kind = "capacitor", unitCost = top.UnitCost, currency = "EUR", initialQuantity = 10_000,
            capacitor = new { capacitanceF = top.Value, toleranceMinus = top.Tolerance, tolerancePlus = top.Tolerance, dielectric = "C0G", voltageRatingV = 50.0, polarised = false },
        });
        var again = await _client.PostJson("/api/v1/design-searches", requirement.ToJsonString());
        var after = (await again.Content.ReadFromJsonAsync<DesignSearchDto>(Api.Json))!;
        Assert.Equal("optimal", after.Status);
        Assert.Equal(top.PerBoard, after.Designs[0].Result.Cost.PerBoard);
    }

    [Fact]
    public async Task An_unknown_search_is_404()
    {
        var response = await _client.PostJson("/api/v1/design-searches/999999/what-if", Series().ToJsonString());
        await response.AssertProblem(HttpStatusCode.NotFound);
    }

    [Theory]
    [InlineData("series.resistors", """{"series": {"resistors": "E7", "resistorRange": {"min": 1000, "max": 2000}, "resistorUnitCost": 0.01}}""")]
    [InlineData("series.capacitorRange.min", """{"series": {"capacitors": "E12", "capacitorRange": {"min": 1e-6, "max": 1e-9}, "capacitorUnitCost": 0.01}}""")]
    [InlineData("series", """{}""")]
    [InlineData("candidates[0].kind", """{"candidates": [{"kind": "inductor", "value": 1e-3, "tolerance": 0.1, "unitCost": 0.1}]}""")]
    [InlineData("candidates[0].value", """{"candidates": [{"kind": "resistor", "value": "lots", "tolerance": 0.01, "unitCost": 0.1}]}""")]
    [InlineData("candidates[0].unitCost", """{"candidates": [{"kind": "resistor", "value": "4k7", "tolerance": 0.01}]}""")]
    [InlineData("maxResults", """{"candidates": [{"kind": "resistor", "value": "4k7", "tolerance": 0.01, "unitCost": 0.1}], "maxResults": 0}""")]
    public async Task A_nonsense_field_is_400_naming_it(string field, string json)
    {
        var before = await PlanningStock.RowsAsync(factory.Services);
        var response = await _client.PostJson("/api/v1/design-searches/1/what-if", json);
        (await response.AssertProblem(HttpStatusCode.BadRequest)).ErrorsFor(field);
        Assert.Equal(before, await PlanningStock.RowsAsync(factory.Services));
    }
}
