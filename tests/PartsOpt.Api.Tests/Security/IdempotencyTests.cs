using System.Net;
using System.Net.Http.Json;
using System.Text;
using PartsOpt.Api.Movements;
using PartsOpt.Api.Parts;

namespace PartsOpt.Api.Tests.Security;

/// <summary>Idempotency-Key: a repeat returns the first answer without doing the work again; a different body is 422.</summary>
public sealed class IdempotencyTests(StockFactory factory) : IClassFixture<StockFactory>
{
    private readonly HttpClient _client = factory.CreateClient();

    private static HttpRequestMessage Post(string path, string json, string? key)
    {
        var request = new HttpRequestMessage(HttpMethod.Post, path) { Content = new StringContent(json, Encoding.UTF8, "application/json") };
        if (key is not null)
            request.Headers.Add("Idempotency-Key", key);
        return request;
    }

    private async Task<int> Rows(string partNumber) =>
        (await _client.GetFromJsonAsync<PagedList<MovementDto>>($"/api/v1/parts/{partNumber}/movements", Api.Json))!.Total;

    [Fact]
    public async Task A_repeated_create_returns_the_first_answer_and_books_once()
    {
        var body = System.Text.Json.JsonSerializer.Serialize(Api.Resistor("R-IDEM-1", 1000, initialQuantity: 10), Api.Json);
        var first = await _client.SendAsync(Post("/api/v1/parts", body, "create-r-idem-1"));
        Assert.Equal(HttpStatusCode.Created, first.StatusCode);
        var again = await _client.SendAsync(Post("/api/v1/parts", body, "create-r-idem-1"));

        Assert.Equal(HttpStatusCode.Created, again.StatusCode); // not 409 "taken": the work was not done again
        Assert.Equal("true", again.Headers.GetValues("PartsOpt-Replayed").Single());
        Assert.False(first.Headers.Contains("PartsOpt-Replayed"));
        Assert.Equal(first.Headers.Location, again.Headers.Location);
        Assert.Equal(first.Content.Headers.ContentType, again.Content.Headers.ContentType);
        Assert.Equal(await first.Content.ReadAsByteArrayAsync(), await again.Content.ReadAsByteArrayAsync());
        Assert.Equal(10, (await _client.GetPart("R-IDEM-1")).QuantityOnHand);
        Assert.Equal(1, await Rows("R-IDEM-1"));
    }

    [Fact]
    public async Task The_same_key_with_another_body_is_422_and_changes_nothing()
    {
        await _client.CreatePart(Api.Resistor("R-IDEM-2", 1000));
        const string Receipt = """{"kind":"receipt","quantity":5,"reason":"goods in"}""";
        Assert.Equal(HttpStatusCode.Created, (await _client.SendAsync(Post("/api/v1/parts/R-IDEM-2/movements", Receipt, "k-2"))).StatusCode);

        var other = await _client.SendAsync(Post("/api/v1/parts/R-IDEM-2/movements", Receipt.Replace("5", "6", StringComparison.Ordinal), "k-2"));
        await other.AssertProblem(HttpStatusCode.UnprocessableEntity);
        // The same body on another path is another request too.
        await _client.CreatePart(Api.Resistor("R-IDEM-3", 1000));
        await (await _client.SendAsync(Post("/api/v1/parts/R-IDEM-3/movements", Receipt, "k-2"))).AssertProblem(HttpStatusCode.UnprocessableEntity);
        Assert.Equal(5, (await _client.GetPart("R-IDEM-2")).QuantityOnHand);
        Assert.Equal(0, (await _client.GetPart("R-IDEM-3")).QuantityOnHand);
    }

    [Fact]
    public async Task Keys_are_scoped_per_api_key_and_absent_means_no_deduplication()
    {
        await _client.CreatePart(Api.Resistor("R-IDEM-4", 1000));
        var stores = factory.ClientWithKey(await factory.CreateKeyAsync("idem-stores", "stockkeeper"));
        const string Receipt = """{"kind":"receipt","quantity":2,"reason":"goods in"}""";
        Assert.Equal(HttpStatusCode.Created, (await _client.SendAsync(Post("/api/v1/parts/R-IDEM-4/movements", Receipt, "shared"))).StatusCode);
        var theirs = await stores.SendAsync(Post("/api/v1/parts/R-IDEM-4/movements", Receipt, "shared"));
        Assert.Equal(HttpStatusCode.Created, theirs.StatusCode);
        Assert.False(theirs.Headers.Contains("PartsOpt-Replayed"));

        Assert.Equal(HttpStatusCode.Created, (await _client.SendAsync(Post("/api/v1/parts/R-IDEM-4/movements", Receipt, null))).StatusCode);
        Assert.Equal(HttpStatusCode.Created, (await _client.SendAsync(Post("/api/v1/parts/R-IDEM-4/movements", Receipt, null))).StatusCode);
        Assert.Equal(8, (await _client.GetPart("R-IDEM-4")).QuantityOnHand);
    }

    [Fact]
    public async Task Concurrent_duplicates_do_the_work_once_and_all_get_its_answer()
    {
        await _client.CreatePart(Api.Resistor("R-IDEM-5", 1000));
        const string Receipt = """{"kind":"receipt","quantity":7,"reason":"delivery 12"}""";
        var responses = await Task.WhenAll(Enumerable.Range(0, 12).Select(_ =>
            factory.CreateClient().SendAsync(Post("/api/v1/parts/R-IDEM-5/movements", Receipt, "delivery-12"))));

        Assert.All(responses, r => Assert.Equal(HttpStatusCode.Created, r.StatusCode));
        var bodies = await Task.WhenAll(responses.Select(r => r.Content.ReadAsStringAsync()));
        Assert.Single(bodies.Distinct());
        Assert.Equal(11, responses.Count(r => r.Headers.Contains("PartsOpt-Replayed")));
        Assert.Equal(1, await Rows("R-IDEM-5"));
        Assert.Equal(7, await factory.LedgerSumAsync("R-IDEM-5"));
    }

    [Fact]
    public async Task An_import_is_replayed_not_repeated()
    {
        const string Csv = "partNumber,kind,value\n";
        var first = await _client.SendAsync(new HttpRequestMessage(HttpMethod.Post, "/api/v1/parts/import?dryRun=true")
        { Content = new StringContent(Csv, Encoding.UTF8, "text/csv"), Headers = { { "Idempotency-Key", "imp-1" } } });
        var again = await _client.SendAsync(new HttpRequestMessage(HttpMethod.Post, "/api/v1/parts/import?dryRun=true")
        { Content = new StringContent(Csv, Encoding.UTF8, "text/csv"), Headers = { { "Idempotency-Key", "imp-1" } } });
        Assert.Equal(first.StatusCode, again.StatusCode);
        Assert.True(again.Headers.Contains("PartsOpt-Replayed"));
        var other = await _client.SendAsync(new HttpRequestMessage(HttpMethod.Post, "/api/v1/parts/import?dryRun=false")
        { Content = new StringContent(Csv, Encoding.UTF8, "text/csv"), Headers = { { "Idempotency-Key", "imp-1" } } });
        await other.AssertProblem(HttpStatusCode.UnprocessableEntity); // the query is part of the request
    }
}
