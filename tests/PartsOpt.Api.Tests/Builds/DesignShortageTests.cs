using System.Net;
using System.Net.Http.Json;
using PartsOpt.Api.Builds;

namespace PartsOpt.Api.Tests.Builds;

/// <summary>GET /api/v1/designs/{id}/shortages?quantity=N: needed, available, missing and the cost to buy it.</summary>
[Collection(SharedDesign.Name)]
public sealed class DesignShortageTests(DesignedStock stock)
{
    [Fact]
    public async Task Missing_quantities_and_costs_follow_from_the_BOM()
    {
        using var factory = stock.NewService();
        var client = factory.CreateClient();
        var opAmp = stock.OpAmpLine;
        var decoupling = stock.Bom.First(b => b.Uses.Contains("decoupling"));
        await client.SetAvailable(opAmp.PartNumber, 2);
        await client.SetAvailable(decoupling.PartNumber, 5);
        const int boards = 10;

        var answer = await client.GetFromJsonAsync<DesignShortagesDto>($"/api/v1/designs/{stock.DesignId}/shortages?quantity={boards}", Api.Json);

        // By hand, line by line: needed = per unit × boards, missing = needed − available when positive.
        Assert.Equal((stock.DesignId, boards, false), (answer!.DesignId, answer.Quantity, answer.Buildable));
        Assert.Equal(stock.Bom.Count, answer.Lines.Count);
        var total = 0m;
        foreach (var line in stock.Bom)
        {
            var available = line.PartNumber == opAmp.PartNumber ? 2 : line.PartNumber == decoupling.PartNumber ? 5 : DesignedStock.Stock;
            var needed = line.PerUnit * boards;
            var missing = Math.Max(needed - available, 0);
            var got = answer.Lines.Single(l => l.PartNumber == line.PartNumber);
            Assert.Equal(new ShortageLineDto(line.PartNumber, line.PerUnit, needed, available, missing, line.UnitCost,
                missing * line.UnitCost, "EUR"), got);
            total += missing * line.UnitCost;
        }
        // The op-amp at 0.35 EUR (the fixture's price): (10·p − 2) missing.
        var opAmpMissing = 10 * opAmp.PerUnit - 2;
        Assert.Equal(opAmpMissing * 0.35m, answer.Lines.Single(l => l.PartNumber == opAmp.PartNumber).CostToBuy);
        Assert.Equal(total, answer.CostToBuy);
        Assert.True(answer.CostToBuy > 0);
        Assert.Equal("EUR", answer.Currency);
    }

    [Fact]
    public async Task Reserved_stock_is_not_available_and_enough_stock_costs_nothing()
    {
        using var factory = stock.NewService();
        var client = factory.CreateClient();
        var opAmp = stock.OpAmpLine;
        await client.SetAvailable(opAmp.PartNumber, 3 * opAmp.PerUnit);
        var before = await client.GetFromJsonAsync<DesignShortagesDto>($"/api/v1/designs/{stock.DesignId}/shortages?quantity=3", Api.Json);
        Assert.True(before!.Buildable);
        Assert.Equal(0m, before.CostToBuy);

        await client.Reserve(stock.DesignId, 1);
        var after = await client.GetFromJsonAsync<DesignShortagesDto>($"/api/v1/designs/{stock.DesignId}/shortages?quantity=3", Api.Json);
        var line = after!.Lines.Single(l => l.PartNumber == opAmp.PartNumber);
        Assert.Equal((2 * opAmp.PerUnit, opAmp.PerUnit), (line.Available, line.Missing));
        Assert.False(after.Buildable);

        // Without a quantity: the design's own build quantity (one board here).
        var own = await client.GetFromJsonAsync<DesignShortagesDto>($"/api/v1/designs/{stock.DesignId}/shortages", Api.Json);
        Assert.Equal(stock.Design.Result.BuildQuantity, own!.Quantity);
    }

    [Theory]
    [InlineData("0")]
    [InlineData("-4")]
    [InlineData("100001")]
    [InlineData("ten")]
    [InlineData("2.5")]
    public async Task A_bad_quantity_is_400_naming_it(string quantity)
    {
        using var factory = stock.NewService();
        var response = await factory.CreateClient().GetAsync($"/api/v1/designs/{stock.DesignId}/shortages?quantity={quantity}");
        var problem = await response.AssertProblem(HttpStatusCode.BadRequest);
        Assert.Contains("quantity", problem.GetRawText(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task An_unknown_design_is_404()
    {
        using var factory = stock.NewService();
        await (await factory.CreateClient().GetAsync("/api/v1/designs/9999/shortages?quantity=1")).AssertProblem(HttpStatusCode.NotFound);
    }
}
