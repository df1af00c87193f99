using System.Net;
using System.Text.Json;
using System.Text.Json.Nodes;
using PartsOpt.Topologies;

namespace PartsOpt.Api.Tests.DesignSearches;

/// <summary>A yield target: every design offered holds its band with all parts at their tolerance limits.</summary>
public sealed class DesignYieldTests
{
    [Fact]
    public async Task With_a_worst_case_yield_every_design_stays_in_band_at_its_tolerance_corners()
    {
        using var factory = new StockFactory();
        var client = factory.CreateClient();
        await SearchStock.SeedAsync(client);
        var requirement = SearchStock.Requirement(maxResults: 2, topologies: TopologyNames.RcRamp);
        requirement["frequency"]!["tolerance"] = 0.15;
        requirement["yield"] = new JsonObject { ["target"] = 1, ["method"] = "worstCase" };
        var (_, body) = await SearchStock.SearchAsync(client, requirement);
        var search = SearchStock.Read(body);
        Assert.Equal("worstCase", search.Requirement.Yield!.Method);
        Assert.NotEmpty(search.Designs);

        foreach (var design in search.Designs)
        {
            var roles = new JsonObject();
            foreach (var role in design.Result.Roles)
                roles[role.Role] = new JsonObject { ["partNumber"] = role.PartNumbers[0] };
            var request = new JsonObject
            {
                ["topology"] = design.Topology,
                ["supply"] = new JsonObject { ["positive"] = 12, ["negative"] = -12 },
                ["opAmp"] = new JsonObject { ["partNumber"] = design.Result.Amplifier },
                ["roles"] = roles,
                ["analysis"] = new JsonObject { ["methods"] = new JsonArray("worstCase"), ["waveformPoints"] = 0 },
            };
            var response = await client.PostJson("/api/v1/circuits/evaluate", request.ToJsonString());
            var text = await response.Content.ReadAsStringAsync();
            Assert.True(response.StatusCode == HttpStatusCode.OK, text);
            var frequency = JsonDocument.Parse(text).RootElement.GetProperty("worstCase").GetProperty("figures")
                .EnumerateArray().Single(f => f.GetProperty("figure").GetString() == FigureNames.Frequency);
            Assert.InRange(frequency.GetProperty("min").GetDouble(), 1000 * 0.85, 1000 * 1.15);
            Assert.InRange(frequency.GetProperty("max").GetDouble(), 1000 * 0.85, 1000 * 1.15);
        }
    }
}
