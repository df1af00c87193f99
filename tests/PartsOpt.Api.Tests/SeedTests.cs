using System.Net.Http.Json;
using PartsOpt.Api.Parts;

namespace PartsOpt.Api.Tests;

/// <summary>The demo stockroom loads into an empty database once, and not again on restart.</summary>
public sealed class SeedTests
{
    [Fact]
    public async Task Demo_stock_loads_on_an_empty_database_and_not_again_on_restart()
    {
        int total, movements;
        string folder;
        using (var first = new StockFactory { Seed = true, OwnsFolder = false })
        {
            folder = first.Folder;
            var page = await first.CreateClient().GetFromJsonAsync<PagedList<PartDto>>("/api/v1/parts?pageSize=1", Api.Json);
            total = page!.Total;
            movements = await first.WithDbAsync(db => Task.FromResult(db.Movements.Count()));
            // Every kind is there, with stock booked through the ledger.
            foreach (var kind in new[] { "resistor", "capacitor", "potentiometer", "op-amp" })
            {
                var ofKind = await first.CreateClient().GetFromJsonAsync<PagedList<PartDto>>($"/api/v1/parts?kind={kind}", Api.Json);
                Assert.True(ofKind!.Total > 0, kind);
            }
        }
        Assert.InRange(total, 150, 250); // "about 200 lines" of demo stock
        Assert.Equal(total, movements); // one receipt per part

        using var restarted = new StockFactory { Folder = folder, Seed = true };
        var again = await restarted.CreateClient().GetFromJsonAsync<PagedList<PartDto>>("/api/v1/parts?pageSize=1", Api.Json);
        Assert.Equal(total, again!.Total);
        Assert.Equal(movements, await restarted.WithDbAsync(db => Task.FromResult(db.Movements.Count())));
    }

    [Fact]
    public async Task Seeding_off_leaves_the_database_empty()
    {
        using var factory = new StockFactory { Seed = false };
        var page = await factory.CreateClient().GetFromJsonAsync<PagedList<PartDto>>("/api/v1/parts", Api.Json);
        Assert.Equal(0, page!.Total);
    }

    [Fact]
    public async Task The_whole_demo_stock_round_trips_through_export_and_import()
    {
        using var seeded = new StockFactory { Seed = true };
        var exported = await seeded.CreateClient().Export();

        using var empty = new StockFactory();
        var client = empty.CreateClient();
        var import = await client.PostAsync("/api/v1/parts/import",
            new ByteArrayContent(exported) { Headers = { ContentType = new("text/csv") } });
        Assert.Equal(System.Net.HttpStatusCode.OK, import.StatusCode);
        Assert.Equal(exported, await client.Export());
    }
}
