using System.Net;
using System.Net.Http.Json;
using System.Text.Json.Nodes;
using Microsoft.EntityFrameworkCore;
using PartsOpt.Api.Builds;

namespace PartsOpt.Api.Tests.Builds;

/// <summary>What the build tests do through the API, and what they read back from the database.</summary>
internal static class BuildApi
{
    public static Task<HttpResponseMessage> PostBuild(this HttpClient client, int designId, int quantity, string reference = "WO-1") =>
        client.PostAsJsonAsync("/api/v1/builds", new { designId, quantity, reference, note = "test run" });

    public static async Task<BuildDto> Reserve(this HttpClient client, int designId, int quantity, string reference = "WO-1")
    {
        var response = await client.PostBuild(designId, quantity, reference);
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.Created, $"expected 201, got {(int)response.StatusCode}: {text}");
        return (await response.Content.ReadFromJsonAsync<BuildDto>(Api.Json))!;
    }

    public static async Task<(HttpStatusCode Status, string Body)> Close(this HttpClient client, int buildId, string action)
    {
        var response = await client.PostAsync($"/api/v1/builds/{buildId}/{action}", null);
        return (response.StatusCode, await response.Content.ReadAsStringAsync());
    }

    /// <summary>Books an adjustment so that the part's available quantity becomes <paramref name="available"/>.</summary>
    public static async Task SetAvailable(this HttpClient client, string partNumber, int available)
    {
        var change = available - (await client.GetPart(partNumber)).Available;
        if (change == 0)
            return;
        var response = await client.PostAsJsonAsync($"/api/v1/parts/{partNumber}/movements",
            new { kind = "adjustment", quantity = change, reason = "test stock level" });
        Assert.Equal(HttpStatusCode.Created, response.StatusCode);
    }

    /// <summary>Replaces a part's reorder level with a PUT of the part as GET gave it.</summary>
    public static async Task SetReorderLevel(this HttpClient client, string partNumber, int level)
    {
        var part = (await client.GetFromJsonAsync<JsonObject>($"/api/v1/parts/{partNumber}"))!;
        part["reorderLevel"] = level;
        var response = await client.PutAsJsonAsync($"/api/v1/parts/{partNumber}", part);
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
    }

    public static Task<int> LedgerRows(this StockFactory factory) => factory.WithDbAsync(db => db.Movements.CountAsync());

    public static Task<int> Events(this StockFactory factory, string type) =>
        factory.WithDbAsync(db => db.OutboxEvents.CountAsync(e => e.Type == type));

    /// <summary>Σ ReservedChange of a part, by SQL of the test's own.</summary>
    public static Task<int> ReservedSum(this StockFactory factory, string partNumber) => factory.WithDbAsync(db => db.Database
        .SqlQuery<int>($"""
            SELECT COALESCE(SUM(m.ReservedChange), 0) AS "Value" FROM Movements m
            JOIN Parts p ON p.Id = m.PartId WHERE p.PartNumber = {partNumber}
            """)
        .SingleAsync());
}
