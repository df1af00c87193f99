using System.Net;
using System.Net.Http.Json;
using PartsOpt.Api.DesignSearches;
using PartsOpt.Topologies;

namespace PartsOpt.Api.Tests.DesignSearches;

/// <summary>Designs against the stock as it changes, and a requirement the stock cannot meet.</summary>
public sealed class DesignStockTests
{
    [Fact]
    public async Task A_design_turns_stale_when_an_adjustment_takes_its_part_below_need()
    {
        using var factory = new StockFactory();
        var client = factory.CreateClient();
        await SearchStock.SeedAsync(client, quantity: 100);
        var (_, body) = await SearchStock.SearchAsync(client,
            SearchStock.Requirement(buildQuantity: 20, maxResults: 1, topologies: TopologyNames.RcRamp));
        var design = SearchStock.Read(body).Designs[0];
        Assert.False(design.Stale);
        Assert.Empty(design.Shortages);

        // Take the timing capacitor down to one short of what 20 boards need.
        var line = design.Result.Bom.Single(b => b.Uses.Contains(Roles.OscC));
        Assert.Equal(20 * line.PerUnit, line.ForBuild);
        var available = (await client.GetPart(line.PartNumber)).Available;
        var change = line.ForBuild - 1 - available;
        var movement = await client.PostAsJsonAsync($"/api/v1/parts/{line.PartNumber}/movements",
            new { kind = "adjustment", quantity = change, reason = "stocktake" });
        Assert.Equal(HttpStatusCode.Created, movement.StatusCode);

        var now = await client.GetFromJsonAsync<DesignDto>($"/api/v1/designs/{design.Id}", Api.Json);
        Assert.True(now!.Stale);
        var shortage = Assert.Single(now.Shortages);
        Assert.Equal(new ShortageDto(line.PartNumber, line.ForBuild, line.ForBuild - 1), shortage);
        var search = await client.GetFromJsonAsync<DesignSearchDto>($"/api/v1/design-searches/{now.SearchId}", Api.Json);
        Assert.True(search!.Designs.Single().Stale);
        // The stored result is what the search saw: the stock snapshot does not move with the ledger.
        Assert.Equal(design.Result.Bom.Select(b => b.Available), now.Result.Bom.Select(b => b.Available));

        // A receipt covers the need again.
        await client.PostAsJsonAsync($"/api/v1/parts/{line.PartNumber}/movements", new { kind = "receipt", quantity = 1, reason = "goods in" });
        Assert.False((await client.GetFromJsonAsync<DesignDto>($"/api/v1/designs/{design.Id}", Api.Json))!.Stale);
    }

    [Fact]
    public async Task A_design_whose_part_was_deleted_is_stale()
    {
        using var factory = new StockFactory();
        var client = factory.CreateClient();
        await SearchStock.SeedAsync(client, quantity: 100);
        var (_, body) = await SearchStock.SearchAsync(client,
            SearchStock.Requirement(buildQuantity: 5, maxResults: 1, topologies: TopologyNames.RcRamp));
        var design = SearchStock.Read(body).Designs[0];
        var pot = design.Result.Bom.Single(b => b.Uses.Contains(Roles.CmpPot));
        Assert.Equal(HttpStatusCode.NoContent, (await client.DeleteAsync($"/api/v1/parts/{pot.PartNumber}")).StatusCode);

        var now = await client.GetFromJsonAsync<DesignDto>($"/api/v1/designs/{design.Id}", Api.Json);
        Assert.Equal([new ShortageDto(pot.PartNumber, 5, 0)], now!.Shortages);
    }

    [Fact]
    public async Task A_frequency_no_stocked_rc_reaches_is_infeasible_with_a_reason_per_topology()
    {
        using var factory = new StockFactory();
        var client = factory.CreateClient();
        await SearchStock.SeedAsync(client);
        // 0.1 Hz: the slowest stocked relaxation oscillator, 100 kΩ · 100 nF with β = 100k/101k, runs near
        // 1/(2RC·ln 199) ≈ 9.4 Hz (Sedra & Smith, astable multivibrator); the slowest loop, r1/r2 = 100,
        // near r2/(4RC·r1) = 0.25 Hz (Sedra & Smith, triangle generator).
        var (response, body) = await SearchStock.SearchAsync(client, SearchStock.Requirement(frequencyHz: 0.1));
        var search = SearchStock.Read(body);
        Assert.Equal("infeasible", search.Status);
        Assert.False(search.OptimalityProved);
        Assert.Empty(search.Designs);
        Assert.Equal(TopologyNames.All, search.Topologies.Select(t => t.Topology));
        Assert.All(search.Topologies, t =>
        {
            Assert.False(t.Feasible);
            Assert.True(t.Proved);
            Assert.False(string.IsNullOrWhiteSpace(t.Blocking));
        });
        var read = await client.GetFromJsonAsync<DesignSearchDto>(response.Headers.Location, Api.Json);
        Assert.Equal("infeasible", read!.Status);
        Assert.Equal(search.Topologies.Select(t => t.Blocking), read.Topologies.Select(t => t.Blocking));
    }
}
