using System.Net;
using System.Text.Json;
using Microsoft.EntityFrameworkCore;
using PartsOpt.Api.Movements;

namespace PartsOpt.Api.Tests.Builds;

/// <summary>Builds racing for the last parts, over HTTP through the test server against one SQLite file.</summary>
[Collection(SharedDesign.Name)]
public sealed class BuildConcurrencyTests(DesignedStock stock)
{
    private const int Racers = 20;

    [Fact]
    public async Task Twenty_builds_racing_for_stock_of_three_never_overbook()
    {
        using var factory = stock.NewService();
        var client = factory.CreateClient();
        var opAmp = stock.OpAmpLine;
        const int boardsInStock = 3;
        await client.SetAvailable(opAmp.PartNumber, boardsInStock * opAmp.PerUnit);
        var stockBefore = await factory.LedgerSumAsync(opAmp.PartNumber);

        using var start = new SemaphoreSlim(0);
        var racers = Enumerable.Range(0, Racers).Select(async i =>
        {
            var racer = factory.CreateClient();
            await start.WaitAsync();
            var response = await racer.PostBuild(stock.DesignId, 1, $"race-{i}");
            return (response.StatusCode, Body: await response.Content.ReadAsStringAsync());
        }).ToList();
        start.Release(Racers);
        var answers = await Task.WhenAll(racers);

        var successes = answers.Count(a => a.StatusCode == HttpStatusCode.Created);
        Assert.All(answers.Where(a => a.StatusCode != HttpStatusCode.Created), a =>
        {
            Assert.True(a.StatusCode == HttpStatusCode.Conflict, $"expected 409, got {(int)a.StatusCode}: {a.Body}");
            var shortage = JsonDocument.Parse(a.Body).RootElement.GetProperty("shortages").EnumerateArray().Single();
            Assert.Equal(opAmp.PartNumber, shortage.GetProperty("partNumber").GetString());
        });
        // Serialised writers: each sees what the ones before it left, so exactly the stock's worth succeed.
        Assert.True(successes * opAmp.PerUnit <= stockBefore);
        Assert.Equal(boardsInStock, successes);
        Assert.Equal(successes * opAmp.PerUnit, await factory.ReservedSum(opAmp.PartNumber));
        Assert.Equal(successes, await factory.WithDbAsync(db => db.Builds.CountAsync()));
        Assert.Equal(successes * stock.Bom.Count,
            await factory.WithDbAsync(db => db.Movements.CountAsync(m => m.Kind == MovementKind.Reservation)));
        var available = await factory.WithDbAsync(db => db.Parts
            .Select(p => p.Movements.Sum(m => m.OnHandChange - m.ReservedChange)).ToListAsync());
        Assert.All(available, a => Assert.True(a >= 0, $"available {a}"));
    }

    [Fact]
    public async Task Completes_and_cancels_racing_on_one_build_end_it_once()
    {
        using var factory = stock.NewService();
        var client = factory.CreateClient();
        var build = await client.Reserve(stock.DesignId, 1);
        var rowsBefore = await factory.LedgerRows();

        using var start = new SemaphoreSlim(0);
        var racers = Enumerable.Range(0, Racers).Select(async i =>
        {
            var racer = factory.CreateClient();
            await start.WaitAsync();
            var (status, body) = await racer.Close(build.Id, i % 2 == 0 ? "complete" : "cancel");
            return (Action: i % 2 == 0 ? "complete" : "cancel", status, body);
        }).ToList();
        start.Release(Racers);
        var answers = await Task.WhenAll(racers);

        var winners = answers.Where(a => a.status == HttpStatusCode.OK).Select(a => a.Action).Distinct().ToList();
        var winner = Assert.Single(winners);
        Assert.All(answers.Where(a => a.Action != winner), a => Assert.Equal(HttpStatusCode.Conflict, a.status));
        Assert.Equal(rowsBefore + stock.Bom.Count, await factory.LedgerRows()); // one ending's rows, once
        foreach (var line in stock.Bom)
            Assert.Equal(0, await factory.ReservedSum(line.PartNumber));
    }
}
