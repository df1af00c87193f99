using System.Net;
using System.Net.Http.Json;
using System.Text.Json;
using Microsoft.EntityFrameworkCore;
using PartsOpt.Api.Parts;
using PartsOpt.Api.Webhooks;

namespace PartsOpt.Api.Tests.Builds;

/// <summary>GET /api/v1/stock/alerts: parts whose available quantity is at or below the reorder level.</summary>
[Collection(SharedDesign.Name)]
public sealed class StockAlertTests(DesignedStock stock)
{
    private const int Level = 5;

    [Fact]
    public async Task A_reservation_brings_a_part_onto_the_list_and_a_cancellation_takes_it_off()
    {
        using var factory = stock.NewService();
        var client = factory.CreateClient();
        var opAmp = stock.OpAmpLine;
        var p = opAmp.PerUnit;
        await client.SetReorderLevel(opAmp.PartNumber, Level);
        await client.SetAvailable(opAmp.PartNumber, Level + 2 * p);
        Assert.Empty(await Alerts(client)); // every part of the stock is above its level

        var first = await client.Reserve(stock.DesignId, 1);
        Assert.Empty(await Alerts(client)); // Level + p: still above

        var second = await client.Reserve(stock.DesignId, 1);
        var at = Assert.Single(await Alerts(client)); // exactly at the level counts
        var onHand = (await client.GetPart(opAmp.PartNumber)).QuantityOnHand;
        Assert.Equal(new StockAlertDto(opAmp.PartNumber, "op-amp", "", onHand, 2 * p, Level, Level, 0, 0.35m, "EUR"), at);

        // Consuming keeps available where it was (on hand and reserved fall together): still listed.
        Assert.Equal(HttpStatusCode.OK, (await client.Close(first.Id, "complete")).Status);
        var consumed = Assert.Single(await Alerts(client));
        Assert.Equal((onHand - p, p, Level, 0), (consumed.QuantityOnHand, consumed.Reserved, consumed.Available, consumed.Shortfall));

        // One more board takes it below: shortfall p, and stock.low fires once for the crossing.
        var third = await client.Reserve(stock.DesignId, 1);
        var below = Assert.Single(await Alerts(client));
        Assert.Equal((Level - p, p), (below.Available, below.Shortfall));
        var low = await factory.WithDbAsync(db => db.OutboxEvents.Where(e => e.Type == EventTypes.StockLow).Select(e => e.Payload).ToListAsync());
        var data = JsonDocument.Parse(Assert.Single(low)).RootElement;
        Assert.Equal((opAmp.PartNumber, "build", Level - p),
            (data.GetProperty("partNumber").GetString(), data.GetProperty("cause").GetString(), data.GetProperty("available").GetInt32()));

        await client.Close(second.Id, "cancel");
        await client.Close(third.Id, "cancel");
        Assert.Empty(await Alerts(client));
    }

    [Fact]
    public async Task Alerts_are_ordered_by_shortfall_and_paged()
    {
        using var factory = stock.NewService();
        var client = factory.CreateClient();
        var (a, b) = (stock.Bom[0].PartNumber, stock.Bom[1].PartNumber);
        await client.SetReorderLevel(a, 20);
        await client.SetReorderLevel(b, 20);
        await client.SetAvailable(a, 15);
        await client.SetAvailable(b, 2);

        var all = await client.GetFromJsonAsync<PagedList<StockAlertDto>>("/api/v1/stock/alerts", Api.Json);
        Assert.Equal([(b, 18), (a, 5)], all!.Items.Select(x => (x.PartNumber, x.Shortfall)));
        var second = await client.GetFromJsonAsync<PagedList<StockAlertDto>>("/api/v1/stock/alerts?page=2&pageSize=1", Api.Json);
        Assert.Equal(2, second!.Total);
        Assert.Equal([a], second.Items.Select(x => x.PartNumber));
        Assert.NotEmpty((await (await client.GetAsync("/api/v1/stock/alerts?pageSize=0")).AssertProblem(HttpStatusCode.BadRequest)).ErrorsFor("pageSize"));
    }

    private static async Task<IReadOnlyList<StockAlertDto>> Alerts(HttpClient client) =>
        (await client.GetFromJsonAsync<PagedList<StockAlertDto>>("/api/v1/stock/alerts", Api.Json))!.Items;
}
