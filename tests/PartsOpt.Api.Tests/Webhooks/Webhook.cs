using System.Net;
using System.Net.Http.Json;
using System.Text.Json;
using Microsoft.EntityFrameworkCore;
using PartsOpt.Api.Webhooks;

namespace PartsOpt.Api.Tests.Webhooks;

/// <summary>What the webhook tests share: a service with tiny delays, subscribing, waiting for the worker.</summary>
internal static class Webhook
{
    public const string CsvHeader = "part_number,kind,resistance,tolerance,quantity,reorder_level";

    /// <summary>A service whose worker polls every 20 ms and retries after 10-100 ms.</summary>
    public static StockFactory Factory(string? folder = null, bool ownsFolder = true, int maxFailures = 10)
    {
        var factory = folder is null
            ? new StockFactory { OwnsFolder = ownsFolder }
            : new StockFactory { Folder = folder, OwnsFolder = ownsFolder };
        factory.Settings["Webhooks:PollInterval"] = "00:00:00.020";
        factory.Settings["Webhooks:RetryBase"] = "00:00:00.010";
        factory.Settings["Webhooks:RetryCap"] = "00:00:00.100";
        factory.Settings["Webhooks:Timeout"] = "00:00:02";
        factory.Settings["Webhooks:MaxConsecutiveFailures"] = maxFailures.ToString(System.Globalization.CultureInfo.InvariantCulture);
        return factory;
    }

    public static async Task<CreatedSubscriptionDto> Subscribe(this HttpClient client, string url, params string[] events)
    {
        var response = await client.PostAsJsonAsync("/api/v1/webhooks", new { url, events, description = "test receiver" });
        Assert.Equal(HttpStatusCode.Created, response.StatusCode);
        return (await response.Content.ReadFromJsonAsync<CreatedSubscriptionDto>(Api.Json))!;
    }

    public static async Task<SubscriptionDto> GetSubscription(this HttpClient client, long id) =>
        (await client.GetFromJsonAsync<SubscriptionDto>($"/api/v1/webhooks/{id}", Api.Json))!;

    public static async Task<List<DeliveryAttemptDto>> Attempts(this HttpClient client, long id) =>
        (await client.GetFromJsonAsync<JsonElement>($"/api/v1/webhooks/{id}/deliveries?pageSize=200", Api.Json))
        .GetProperty("items").Deserialize<List<DeliveryAttemptDto>>(Api.Json)!;

    public static async Task Import(this HttpClient client, params string[] rows)
    {
        var response = await client.PostCsv("/api/v1/parts/import", string.Join("\r\n", [CsvHeader, .. rows]) + "\r\n");
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
    }

    public static async Task Book(this HttpClient client, string partNumber, string kind, int quantity)
    {
        var response = await client.PostAsJsonAsync($"/api/v1/parts/{partNumber}/movements", new { kind, quantity, reason = "count" });
        Assert.Equal(HttpStatusCode.Created, response.StatusCode);
    }

    /// <summary>Waits for the worker (polling, 20 s at most) and fails with <paramref name="what"/> if it never comes.</summary>
    /// <summary>The outbox's event ids in write order, as receivers see them.</summary>
    public static async Task<List<string>> WrittenEventIds(this StockFactory factory) =>
        (await factory.WithDbAsync(db => db.OutboxEvents.OrderBy(e => e.Id).Select(e => e.EventId).ToListAsync()))
        .ConvertAll(id => id.ToString());

    public static async Task Eventually(Func<Task<bool>> condition, string what)
    {
        var until = DateTime.UtcNow.AddSeconds(20);
        while (DateTime.UtcNow < until)
        {
            if (await condition())
                return;
            await Task.Delay(25);
        }
        Assert.Fail($"Timed out waiting for: {what}");
    }

    public static Task Eventually(Func<bool> condition, string what) => Eventually(() => Task.FromResult(condition()), what);

    public static string Type(this JsonElement envelope) => envelope.GetProperty("type").GetString()!;
    public static JsonElement Data(this JsonElement envelope) => envelope.GetProperty("data");
}
