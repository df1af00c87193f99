using System.Net;
using System.Text.Json;
using System.Text.Json.Nodes;
using PartsOpt.Tests;

namespace PartsOpt.Api.Tests.DesignSearches;

/// <summary>
/// A design the search proposes, posted by its parts to POST /api/v1/circuits/evaluate, gets the same
/// nominal figures and the same verdict: the search and the hand evaluation are one engine.
/// </summary>
[Collection(SharedSearch.Name)]
public sealed class DesignConsistencyTests(SearchedStockFactory factory)
{
    [Fact]
    public async Task Every_found_design_evaluates_to_the_same_figures()
    {
        var search = SearchStock.Read(factory.Body);
        Assert.NotEmpty(search.Designs);
        foreach (var design in search.Designs)
        {
            var result = design.Result;
            var roles = new JsonObject();
            foreach (var role in result.Roles)
                roles[role.Role] = new JsonObject { ["partNumber"] = Assert.Single(role.PartNumbers) };
            var request = new JsonObject
            {
                ["topology"] = design.Topology,
                ["supply"] = new JsonObject { ["positive"] = result.Supply.Positive, ["negative"] = result.Supply.Negative },
                ["opAmp"] = new JsonObject { ["partNumber"] = result.Amplifier },
                ["duty"] = new JsonObject { ["adjust"] = result.DutyAdjust },
                ["bufferReference"] = result.BufferReference,
                ["roles"] = roles,
                ["analysis"] = new JsonObject { ["methods"] = new JsonArray(), ["waveformPoints"] = 0 },
            };
            if (result.Comparator is { } comparator)
                request["comparator"] = new JsonObject { ["partNumber"] = comparator };

            var response = await factory.Client.PostJson("/api/v1/circuits/evaluate", request.ToJsonString());
            var text = await response.Content.ReadAsStringAsync();
            Assert.True(response.StatusCode == HttpStatusCode.OK, $"design {design.Rank}: {(int)response.StatusCode} {text}");
            var evaluated = JsonDocument.Parse(text).RootElement;
            Assert.True(evaluated.GetProperty("works").GetBoolean(), $"design {design.Rank} does not work when evaluated");

            var figures = evaluated.GetProperty("figures").EnumerateArray()
                .ToDictionary(f => f.GetProperty("name").GetString()!, f => f.TryGetProperty("value", out var v) && v.ValueKind == JsonValueKind.Number ? v.GetDouble() : (double?)null);
            Assert.Equal(result.Figures.Select(f => f.Name).Order(), figures.Keys.Order());
            foreach (var figure in result.Figures)
            {
                Assert.Equal(figure.Value is null, figures[figure.Name] is null);
                if (figure.Value is { } value)
                    // Same engine, same parts: equal to rounding.
                    Precision.AlmostEqualRelative(value, figures[figure.Name]!.Value, 1e-9, $"design {design.Rank} {figure.Name}");
            }
            var designators = evaluated.GetProperty("roles").EnumerateArray()
                .ToDictionary(r => r.GetProperty("role").GetString()!, r => r.GetProperty("designator").GetString());
            Assert.All(result.Roles, r => Assert.Equal(r.Designator, designators[r.Role]));
        }
    }
}
