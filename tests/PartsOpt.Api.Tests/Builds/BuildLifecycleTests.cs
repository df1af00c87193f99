using System.Net;
using System.Net.Http.Json;
using System.Text.Json;
using PartsOpt.Api.Builds;
using PartsOpt.Api.Parts;
using PartsOpt.Api.Webhooks;

namespace PartsOpt.Api.Tests.Builds;

/// <summary>Completing consumes a reservation, cancelling releases it; both are safe to repeat and final.</summary>
[Collection(SharedDesign.Name)]
public sealed class BuildLifecycleTests(DesignedStock stock)
{
    [Fact]
    public async Task Completing_consumes_the_reservation_and_repeating_it_writes_nothing()
    {
        using var factory = stock.NewService();
        var client = factory.CreateClient();
        var build = await client.Reserve(stock.DesignId, 2);

        var (status, body) = await client.Close(build.Id, "complete");
        Assert.Equal(HttpStatusCode.OK, status);
        var completed = JsonSerializer.Deserialize<BuildDto>(body, Api.Json)!;
        Assert.Equal("completed", completed.Status);
        Assert.NotNull(completed.ClosedAt);
        Assert.False(string.IsNullOrEmpty(completed.ClosedBy));
        Assert.All(completed.Lines, l => Assert.Equal(l.Reserved, l.Consumed));
        foreach (var line in stock.Bom)
        {
            var part = await client.GetPart(line.PartNumber);
            Assert.Equal((DesignedStock.Stock - 2 * line.PerUnit, 0), (part.QuantityOnHand, part.Reserved));
            Assert.Equal(part.QuantityOnHand, await factory.LedgerSumAsync(line.PartNumber));
        }
        Assert.Equal(1, await factory.Events(EventTypes.BuildCompleted));

        var rows = await factory.LedgerRows();
        var (again, againBody) = await client.Close(build.Id, "complete");
        Assert.Equal(HttpStatusCode.OK, again);
        Assert.Equivalent(completed, JsonSerializer.Deserialize<BuildDto>(againBody, Api.Json));
        Assert.Equal(rows, await factory.LedgerRows());
        Assert.Equal(1, await factory.Events(EventTypes.BuildCompleted));
    }

    [Fact]
    public async Task Cancelling_releases_the_reservation_and_repeating_it_writes_nothing()
    {
        using var factory = stock.NewService();
        var client = factory.CreateClient();
        var build = await client.Reserve(stock.DesignId, 2);

        var (status, body) = await client.Close(build.Id, "cancel");
        Assert.Equal(HttpStatusCode.OK, status);
        var cancelled = JsonSerializer.Deserialize<BuildDto>(body, Api.Json)!;
        Assert.Equal("cancelled", cancelled.Status);
        Assert.All(cancelled.Lines, l => Assert.Equal(0, l.Consumed));
        foreach (var line in stock.Bom)
        {
            var part = await client.GetPart(line.PartNumber);
            Assert.Equal((DesignedStock.Stock, 0), (part.QuantityOnHand, part.Reserved));
        }
        Assert.Equal(1, await factory.Events(EventTypes.BuildCancelled));

        var rows = await factory.LedgerRows();
        var (again, againBody) = await client.Close(build.Id, "cancel");
        Assert.Equal(HttpStatusCode.OK, again);
        Assert.Equivalent(cancelled, JsonSerializer.Deserialize<BuildDto>(againBody, Api.Json));
        Assert.Equal(rows, await factory.LedgerRows());
        Assert.Equal(1, await factory.Events(EventTypes.BuildCancelled));
    }

    [Theory]
    [InlineData("cancel", "complete")]
    [InlineData("complete", "cancel")]
    public async Task The_other_ending_after_one_is_409_and_books_nothing(string first, string second)
    {
        using var factory = stock.NewService();
        var client = factory.CreateClient();
        var build = await client.Reserve(stock.DesignId, 1);
        Assert.Equal(HttpStatusCode.OK, (await client.Close(build.Id, first)).Status);
        var rows = await factory.LedgerRows();

        var response = await client.PostAsync($"/api/v1/builds/{build.Id}/{second}", null);

        var problem = await response.AssertProblem(HttpStatusCode.Conflict);
        Assert.Contains(first == "cancel" ? "cancelled" : "completed", problem.GetProperty("title").GetString(), StringComparison.Ordinal);
        Assert.Equal(rows, await factory.LedgerRows());
        var now = await client.GetFromJsonAsync<BuildDto>($"/api/v1/builds/{build.Id}", Api.Json);
        Assert.Equal(first == "cancel" ? "cancelled" : "completed", now!.Status);
    }

    [Fact]
    public async Task Unknown_builds_are_404()
    {
        using var factory = stock.NewService();
        var client = factory.CreateClient();
        await (await client.GetAsync("/api/v1/builds/4242")).AssertProblem(HttpStatusCode.NotFound);
        await (await client.PostAsync("/api/v1/builds/4242/complete", null)).AssertProblem(HttpStatusCode.NotFound);
        await (await client.PostAsync("/api/v1/builds/4242/cancel", null)).AssertProblem(HttpStatusCode.NotFound);
    }

    [Fact]
    public async Task The_list_filters_by_status_newest_first_and_pages()
    {
        using var factory = stock.NewService();
        var client = factory.CreateClient();
        var ids = new List<int>();
        for (var i = 0; i < 4; i++)
            ids.Add((await client.Reserve(stock.DesignId, 1, $"WO-{i}")).Id);
        await client.Close(ids[0], "complete");
        await client.Close(ids[1], "cancel");

        var reserved = await client.GetFromJsonAsync<PagedList<BuildDto>>("/api/v1/builds?status=reserved", Api.Json);
        Assert.Equal([ids[3], ids[2]], reserved!.Items.Select(b => b.Id));
        Assert.Equal(2, reserved.Total);
        var completed = await client.GetFromJsonAsync<PagedList<BuildDto>>("/api/v1/builds?status=Completed", Api.Json);
        Assert.Equal([ids[0]], completed!.Items.Select(b => b.Id));

        var page2 = await client.GetFromJsonAsync<PagedList<BuildDto>>("/api/v1/builds?page=2&pageSize=3", Api.Json);
        Assert.Equal((2, 3, 4), (page2!.Page, page2.PageSize, page2.Total));
        Assert.Equal([ids[0]], page2.Items.Select(b => b.Id));
        Assert.NotEmpty(page2.Items[0].Lines);

        Assert.NotEmpty((await (await client.GetAsync("/api/v1/builds?status=built")).AssertProblem(HttpStatusCode.BadRequest)).ErrorsFor("status"));
        Assert.NotEmpty((await (await client.GetAsync("/api/v1/builds?page=0")).AssertProblem(HttpStatusCode.BadRequest)).ErrorsFor("page"));
        Assert.NotEmpty((await (await client.GetAsync("/api/v1/builds?pageSize=201")).AssertProblem(HttpStatusCode.BadRequest)).ErrorsFor("pageSize"));
    }

    [Fact]
    public async Task A_viewer_reads_builds_but_cannot_reserve_complete_or_cancel()
    {
        using var factory = stock.NewService();
        var admin = factory.CreateClient();
        var build = await admin.Reserve(stock.DesignId, 1);
        var viewer = factory.ClientWithKey(await factory.CreateKeyAsync("floor-viewer", "viewer"));
        var designer = factory.ClientWithKey(await factory.CreateKeyAsync("bench-designer", "designer"));
        var rows = await factory.LedgerRows();

        Assert.Equal(HttpStatusCode.Forbidden, (await viewer.PostBuild(stock.DesignId, 1)).StatusCode);
        Assert.Equal(HttpStatusCode.Forbidden, (await designer.PostBuild(stock.DesignId, 1)).StatusCode);
        Assert.Equal(HttpStatusCode.Forbidden, (await viewer.Close(build.Id, "complete")).Status);
        Assert.Equal(HttpStatusCode.Forbidden, (await viewer.Close(build.Id, "cancel")).Status);
        Assert.Equal(HttpStatusCode.Unauthorized, (await factory.Anonymous().GetAsync("/api/v1/builds")).StatusCode);
        Assert.Equal(rows, await factory.LedgerRows());

        Assert.Equal(HttpStatusCode.OK, (await viewer.GetAsync($"/api/v1/builds/{build.Id}")).StatusCode);
        var keeper = factory.ClientWithKey(await factory.CreateKeyAsync("stores", "stockkeeper"));
        var kept = await keeper.Reserve(stock.DesignId, 1);
        Assert.Equal("stores", kept.Actor);
    }
}
