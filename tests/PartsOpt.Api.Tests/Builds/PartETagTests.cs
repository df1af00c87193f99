using System.Net;
using System.Net.Http.Json;
using System.Text.Json.Nodes;

namespace PartsOpt.Api.Tests.Builds;

/// <summary>
/// Optimistic concurrency on PUT /api/v1/parts/{partNumber}: If-Match against the ETag (RFC 9110 §13.1.1:
/// strong comparison, "*" matches any current representation; §15.5.13: 412 Precondition Failed).
/// </summary>
public sealed class PartETagTests : IDisposable
{
    private const string PartNumber = "ETAG-R-4K7";
    private readonly StockFactory _factory = new();
    private readonly HttpClient _client;

    public PartETagTests() => _client = _factory.CreateClient();

    public void Dispose() => _factory.Dispose();

    private async Task<(JsonObject Part, string ETag)> Read()
    {
        var response = await _client.GetAsync($"/api/v1/parts/{PartNumber}");
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        var etag = response.Headers.ETag;
        Assert.NotNull(etag);
        Assert.False(etag.IsWeak);
        return ((await response.Content.ReadFromJsonAsync<JsonObject>())!, etag.ToString());
    }

    private Task<HttpResponseMessage> Put(JsonObject part, string? ifMatch)
    {
        var request = new HttpRequestMessage(HttpMethod.Put, $"/api/v1/parts/{PartNumber}") { Content = JsonContent.Create(part) };
        if (ifMatch is not null)
            request.Headers.TryAddWithoutValidation("If-Match", ifMatch);
        return _client.SendAsync(request);
    }

    [Fact]
    public async Task A_PUT_with_the_current_ETag_succeeds_and_a_stale_one_is_412()
    {
        await _client.CreatePart(Api.Resistor(PartNumber, 4.7e3, initialQuantity: 10));
        var (part, etag) = await Read();

        part["location"] = "drawer 7";
        var first = await Put(part, etag);
        Assert.Equal(HttpStatusCode.OK, first.StatusCode);
        var fresh = first.Headers.ETag?.ToString();
        Assert.NotNull(fresh);
        Assert.NotEqual(etag, fresh);
        Assert.Equal(fresh, (await Read()).ETag);

        // A second editor still holding the first ETag is refused, and the part keeps the first edit.
        part["location"] = "drawer 9";
        var stale = await Put(part, etag);
        var problem = await stale.AssertProblem(HttpStatusCode.PreconditionFailed);
        Assert.Contains(PartNumber, problem.GetProperty("detail").GetString(), StringComparison.Ordinal);
        Assert.Equal("drawer 7", (await _client.GetPart(PartNumber)).Location);

        // With the fresh ETag the same change goes through.
        Assert.Equal(HttpStatusCode.OK, (await Put(part, fresh)).StatusCode);
        Assert.Equal("drawer 9", (await _client.GetPart(PartNumber)).Location);
    }

    [Fact]
    public async Task Without_IfMatch_a_PUT_replaces_the_fields_as_before()
    {
        await _client.CreatePart(Api.Resistor(PartNumber, 4.7e3));
        var (part, _) = await Read();
        part["location"] = "shelf A";
        Assert.Equal(HttpStatusCode.OK, (await Put(part, null)).StatusCode);
        part["location"] = "shelf B";
        Assert.Equal(HttpStatusCode.OK, (await Put(part, null)).StatusCode);
        Assert.Equal("shelf B", (await _client.GetPart(PartNumber)).Location);
    }

    [Fact]
    public async Task Star_matches_weak_tags_never_and_a_garbled_header_is_400()
    {
        await _client.CreatePart(Api.Resistor(PartNumber, 4.7e3));
        var (part, etag) = await Read();

        Assert.Equal(HttpStatusCode.OK, (await Put(part, "*")).StatusCode);
        (part, etag) = await Read();
        await (await Put(part, "W/" + etag)).AssertProblem(HttpStatusCode.PreconditionFailed);
        Assert.Equal(HttpStatusCode.OK, (await Put(part, $"\"nope\", {etag}")).StatusCode); // any of a list
        var garbled = await (await Put(part, "not-quoted")).AssertProblem(HttpStatusCode.BadRequest);
        Assert.NotEmpty(garbled.ErrorsFor("If-Match"));
    }

    [Fact]
    public async Task Stock_movements_do_not_change_the_ETag_but_a_part_made_again_does()
    {
        await _client.CreatePart(Api.Resistor(PartNumber, 4.7e3, initialQuantity: 5));
        var (_, etag) = await Read();
        await _client.PostAsJsonAsync($"/api/v1/parts/{PartNumber}/movements", new { kind = "receipt", quantity = 3, reason = "goods in" });
        Assert.Equal(etag, (await Read()).ETag);

        Assert.Equal(HttpStatusCode.NoContent, (await _client.DeleteAsync($"/api/v1/parts/{PartNumber}")).StatusCode);
        await _client.CreatePart(Api.Resistor(PartNumber, 4.7e3));
        var (part, again) = await Read();
        Assert.NotEqual(etag, again);
        await (await Put(part, etag)).AssertProblem(HttpStatusCode.PreconditionFailed);
    }

    [Fact]
    public async Task A_CSV_import_that_changes_a_part_moves_its_ETag()
    {
        await _client.CreatePart(Api.Resistor(PartNumber, 4.7e3));
        var (part, etag) = await Read();
        var export = System.Text.Encoding.UTF8.GetString(await _client.Export());
        var changed = export.Replace("test resistor", "imported resistor", StringComparison.Ordinal);
        Assert.NotEqual(export, changed);
        var import = await _client.PostCsv("/api/v1/parts/import", changed.TrimStart('\uFEFF'));
        Assert.True(import.IsSuccessStatusCode, await import.Content.ReadAsStringAsync());

        Assert.NotEqual(etag, (await Read()).ETag);
        await (await Put(part, etag)).AssertProblem(HttpStatusCode.PreconditionFailed);
    }
}
