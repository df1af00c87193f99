using System.Net;
using System.Net.Http.Json;
using Microsoft.EntityFrameworkCore;
using PartsOpt.Api.Movements;
using PartsOpt.Api.Webhooks;

namespace PartsOpt.Api.Tests.Webhooks;

/// <summary>Events reach a real receiver signed, in order, at least once; failures back off and disable.</summary>
public sealed class DeliveryTests
{
    [Fact]
    public async Task An_import_and_a_movement_that_crosses_the_reorder_level_arrive_signed()
    {
        await using var receiver = await Receiver.StartAsync();
        using var factory = Webhook.Factory();
        var client = factory.CreateClient();
        var subscription = await client.Subscribe(receiver.Url, "stock.imported", "stock.low");
        receiver.Secret = subscription.Secret;

        // The actor is the name of the API key that made the change.
        var storesJo = factory.ClientWithKey(await factory.CreateKeyAsync("stores-jo", "stockkeeper"));
        var imported1 = await storesJo.PostAsync("/api/v1/parts/import",
            new StringContent(Webhook.CsvHeader + "\r\nR-WH-1,resistor,1k,F,50,10\r\n", System.Text.Encoding.UTF8, "text/csv"));
        Assert.Equal(HttpStatusCode.OK, imported1.StatusCode);
        await client.Book("R-WH-1", "adjustment", -45); // 50 -> 5, below 10

        await Webhook.Eventually(() => receiver.Accepted.Count >= 2, "two events");
        Assert.All(receiver.Requests, r => Assert.True(r.Verified, "every request verifies per docs/webhooks.md"));
        var events = receiver.Accepted.ToList();
        Assert.Equal(["stock.imported", "stock.low"], events.Select(e => e.Type()));
        var imported = events[0].Data();
        Assert.Equal((1, 0, "stores-jo"), (imported.GetProperty("created").GetInt32(),
            imported.GetProperty("updated").GetInt32(), imported.GetProperty("actor").GetString()));
        Assert.Equal("R-WH-1", imported.GetProperty("createdParts")[0].GetString());
        var low = events[1].Data();
        Assert.Equal(("R-WH-1", 5, 10, "movement"), (low.GetProperty("partNumber").GetString(),
            low.GetProperty("available").GetInt32(), low.GetProperty("reorderLevel").GetInt32(), low.GetProperty("cause").GetString()));
        Assert.True(Guid.TryParse(events[1].GetProperty("id").GetString(), out _));

        // A tampered body or a stale timestamp fails the documented check.
        var body = "{\"id\":\"x\"}"u8.ToArray();
        var now = DateTimeOffset.UtcNow;
        var stamp = now.ToUnixTimeSeconds().ToString(System.Globalization.CultureInfo.InvariantCulture);
        var good = WebhookSignature.Sign(subscription.Secret, now.ToUnixTimeSeconds(), body);
        Assert.True(Receiver.Verify(subscription.Secret, stamp, good, body, now));
        Assert.False(Receiver.Verify(subscription.Secret, stamp, good, "{\"id\":\"y\"}"u8.ToArray(), now));
        Assert.False(Receiver.Verify(subscription.Secret, stamp, good, body, now.AddMinutes(6)));
        Assert.False(Receiver.Verify("another secret", stamp, good, body, now));
    }

    [Fact]
    public async Task Stock_low_fires_on_crossing_below_available_not_on_every_movement_below()
    {
        await using var receiver = await Receiver.StartAsync();
        using var factory = Webhook.Factory();
        var client = factory.CreateClient();
        receiver.Secret = (await client.Subscribe(receiver.Url, "stock.low")).Secret;
        await client.CreatePart(Api.Resistor("R-LOW-1", 100, initialQuantity: 20)); // reorder level 10
        await client.Book("R-LOW-1", "adjustment", -12); // 8: crosses
        await client.Book("R-LOW-1", "adjustment", -1);  // 7: still below, quiet
        await client.Book("R-LOW-1", "receipt", 10);     // 17: back above, quiet
        await client.Book("R-LOW-1", "adjustment", -10); // 7: crosses again

        // Available, not on hand: 20 on hand with 8 reserved is 12 available; taking 3 leaves 17 on hand, 9 available.
        var part = await client.CreatePart(Api.Resistor("R-LOW-2", 100, initialQuantity: 20));
        await factory.WithDbAsync(async db =>
        {
            var id = await db.Parts.Where(p => p.PartNumber == "R-LOW-2").Select(p => p.Id).SingleAsync();
            db.Movements.Add(new Movement { PartId = id, Kind = MovementKind.Reservation, ReservedChange = 8, Reason = "build", Actor = "test", AtUtc = DateTime.UtcNow });
            await db.SaveChangesAsync();
        });
        await client.Book("R-LOW-2", "adjustment", -3);
        // And an import that lowers the count crosses too.
        await client.Import("R-LOW-3,resistor,1k,F,40,10");
        await client.Import("R-LOW-3,resistor,1k,F,4,10");

        await Webhook.Eventually(() => receiver.Accepted.Count >= 4, "four stock.low events");
        await Task.Delay(200); // and no more than four
        var lows = receiver.Accepted.Select(e => e.Data()).ToList();
        Assert.Equal([("R-LOW-1", 8), ("R-LOW-1", 7), ("R-LOW-2", 9), ("R-LOW-3", 4)],
            lows.Select(d => (d.GetProperty("partNumber").GetString()!, d.GetProperty("available").GetInt32())));
        Assert.Equal((17, 8), (lows[2].GetProperty("quantityOnHand").GetInt32(), lows[2].GetProperty("reserved").GetInt32()));
        Assert.Equal("import", lows[3].GetProperty("cause").GetString());
        Assert.NotNull(part);
    }

    [Fact]
    public async Task Events_reach_each_subscription_in_order_even_when_every_first_attempt_fails()
    {
        await using var receiver = await Receiver.StartAsync();
        receiver.Answer = n => n % 2 == 1 ? HttpStatusCode.ServiceUnavailable : HttpStatusCode.NoContent;
        using var factory = Webhook.Factory();
        var client = factory.CreateClient();
        receiver.Secret = (await client.Subscribe(receiver.Url, "*")).Secret;

        await client.Import("R-ORD-1,resistor,1k,F,100,10");
        for (var i = 0; i < 4; i++)
        {
            await client.Book("R-ORD-1", "adjustment", -95); // crosses below: stock.low
            await client.Book("R-ORD-1", "receipt", 95);     // back above, quiet
            await client.Import($"R-ORD-{i + 2},resistor,1k,F,1,0");
        }
        var written = await factory.WrittenEventIds();
        Assert.Equal(9, written.Count);

        await Webhook.Eventually(() => receiver.Accepted.Count >= written.Count, "every event");
        Assert.Equal(written, receiver.Accepted.Select(e => e.GetProperty("id").GetString()));
        // Strictly in order: no request for an event before the one ahead of it was accepted.
        var requested = receiver.Requests.Select(r => r.EventId).Distinct().ToList();
        Assert.Equal(written, requested);
    }

    [Fact]
    public async Task A_receiver_failing_twice_gets_the_event_on_the_third_attempt_and_the_log_shows_all_three()
    {
        await using var receiver = await Receiver.StartAsync();
        receiver.Answer = n => n <= 2 ? HttpStatusCode.InternalServerError : HttpStatusCode.OK;
        using var factory = Webhook.Factory();
        var client = factory.CreateClient();
        var subscription = await client.Subscribe(receiver.Url, "stock.imported");
        receiver.Secret = subscription.Secret;
        await client.Import("R-RTY-1,resistor,1k,F,5,0");

        await Webhook.Eventually(() => !receiver.Accepted.IsEmpty, "the event on a retry");
        List<DeliveryAttemptDto> attempts = [];
        await Webhook.Eventually(async () => (attempts = await client.Attempts(subscription.Id)).Count == 3, "three attempts logged");
        Assert.Equal([3, 2, 1], attempts.Select(a => a.Attempt));
        Assert.Equal([200, 500, 500], attempts.Select(a => a.StatusCode ?? 0));
        Assert.Equal([true, false, false], attempts.Select(a => a.Succeeded));
        Assert.Null(attempts[0].NextRetryAtUtc);
        Assert.All(attempts.Skip(1), a => Assert.True(a.NextRetryAtUtc > a.AtUtc));
        Assert.All(attempts, a => Assert.Equal("stock.imported", a.EventType));
        Assert.Single(attempts.Select(a => a.EventId).Distinct());
        var after = await client.GetSubscription(subscription.Id);
        Assert.Equal((0, 0, true), (after.ConsecutiveFailures, after.PendingDeliveries, after.Enabled));
    }

    [Fact]
    public async Task A_commit_wakes_the_worker_without_waiting_for_the_poll()
    {
        await using var receiver = await Receiver.StartAsync();
        using var factory = Webhook.Factory();
        factory.Settings["Webhooks:PollInterval"] = "01:00:00"; // the poll alone would not come within the test
        var client = factory.CreateClient();
        receiver.Secret = (await client.Subscribe(receiver.Url, "stock.imported")).Secret;
        await client.Import("R-WAKE-1,resistor,1k,F,5,0");
        await Webhook.Eventually(() => !receiver.Accepted.IsEmpty, "the event, woken by the import's commit");
    }

    [Fact]
    public async Task An_unreachable_receiver_is_recorded_as_an_error_without_a_status()
    {
        using var factory = Webhook.Factory();
        var client = factory.CreateClient();
        var subscription = await client.Subscribe($"http://127.0.0.1:{Receiver.FreePort()}/hook", "stock.imported");
        await client.Import("R-DOWN-1,resistor,1k,F,5,0");
        List<DeliveryAttemptDto> attempts = [];
        await Webhook.Eventually(async () => (attempts = await client.Attempts(subscription.Id)).Count > 0, "an attempt");
        Assert.Null(attempts[^1].StatusCode);
        Assert.False(string.IsNullOrEmpty(attempts[^1].Error));
    }

    [Fact]
    public async Task Consecutive_failures_disable_the_subscription_and_enable_re_arms_it()
    {
        await using var receiver = await Receiver.StartAsync();
        var failing = true;
        receiver.Answer = _ => Volatile.Read(ref failing) ? HttpStatusCode.BadGateway : HttpStatusCode.OK;
        using var factory = Webhook.Factory(maxFailures: 3);
        var client = factory.CreateClient();
        var subscription = await client.Subscribe(receiver.Url, "stock.imported");
        receiver.Secret = subscription.Secret;
        await client.Import("R-DIS-1,resistor,1k,F,5,0");

        await Webhook.Eventually(async () => !(await client.GetSubscription(subscription.Id)).Enabled, "disabled");
        var disabled = await client.GetSubscription(subscription.Id);
        Assert.Equal((3, 1), (disabled.ConsecutiveFailures, disabled.PendingDeliveries));
        Assert.NotNull(disabled.DisabledAtUtc);
        Volatile.Write(ref failing, false);
        await Task.Delay(300); // many poll intervals: a disabled subscription gets nothing
        Assert.Equal(3, receiver.RequestCount);
        Assert.Empty(receiver.Accepted);

        var enable = await client.PostAsync($"/api/v1/webhooks/{subscription.Id}/enable", null);
        Assert.Equal(HttpStatusCode.OK, enable.StatusCode);
        var enabled = await enable.Content.ReadFromJsonAsync<SubscriptionDto>(Api.Json);
        Assert.Equal((true, 0), (enabled!.Enabled, enabled.ConsecutiveFailures));
        Assert.Null(enabled.DisabledAtUtc);

        await Webhook.Eventually(() => !receiver.Accepted.IsEmpty, "the pending event after enable");
        // The receiver answers before the worker records the attempt: wait for the record, not only the answer.
        await Webhook.Eventually(async () => (await client.Attempts(subscription.Id)).Count >= 4, "the fourth attempt recorded");
        Assert.Equal(4, (await client.Attempts(subscription.Id)).Count);
    }

    [Fact]
    public async Task Changes_that_roll_back_publish_nothing()
    {
        await using var receiver = await Receiver.StartAsync();
        using var factory = Webhook.Factory();
        var client = factory.CreateClient();
        receiver.Secret = (await client.Subscribe(receiver.Url, "*")).Secret;
        await client.CreatePart(Api.Resistor("R-RB-1", 100, initialQuantity: 20));

        var csv = Webhook.CsvHeader + "\r\nR-RB-2,resistor,1k,F,1,10\r\n";
        Assert.Equal(HttpStatusCode.OK, (await client.PostCsv("/api/v1/parts/import?dryRun=true", csv)).StatusCode);
        var invalid = Webhook.CsvHeader + "\r\nR-RB-2,resistor,1k,F,1,10\r\nR-RB-3,resistor,lots,F,1,10\r\n";
        Assert.Equal(HttpStatusCode.BadRequest, (await client.PostCsv("/api/v1/parts/import", invalid)).StatusCode);
        var tooMuch = await client.PostAsJsonAsync("/api/v1/parts/R-RB-1/movements", new { kind = "adjustment", quantity = -25, reason = "count" });
        Assert.Equal(HttpStatusCode.Conflict, tooMuch.StatusCode);
        Assert.Equal(0, await factory.WithDbAsync(db => db.OutboxEvents.CountAsync()));

        // A committed change after them is the only event the receiver ever sees.
        await client.Import("R-RB-4,resistor,1k,F,1,0");
        await Webhook.Eventually(() => !receiver.Accepted.IsEmpty, "the committed import");
        await Task.Delay(200);
        var only = Assert.Single(receiver.Accepted);
        Assert.Equal("R-RB-4", only.Data().GetProperty("createdParts")[0].GetString());
        Assert.Equal(1, await factory.WithDbAsync(db => db.OutboxEvents.CountAsync()));
    }

    [Fact]
    public async Task A_restart_while_events_are_pending_loses_nothing()
    {
        var port = Receiver.FreePort();
        var url = $"http://127.0.0.1:{port}/hook";
        string folder;
        string secret;
        using (var first = Webhook.Factory(ownsFolder: false, maxFailures: 1000))
        {
            folder = first.Folder;
            var client = first.CreateClient();
            secret = (await client.Subscribe(url, "*")).Secret;
            await client.Import("R-RST-1,resistor,1k,F,100,10", "R-RST-2,resistor,1k,F,3,10");
            await client.Book("R-RST-1", "adjustment", -95);
            await client.Import("R-RST-3,resistor,1k,F,5,0");
            // The receiver is down: the worker is retrying when the service stops.
            await Webhook.Eventually(async () => await first.WithDbAsync(db => db.DeliveryAttempts.AnyAsync()), "a failed attempt");
        }

        await using var receiver = await Receiver.StartAsync(port);
        receiver.Secret = secret;
        using var second = Webhook.Factory(folder, ownsFolder: true, maxFailures: 1000);
        var written = await second.WrittenEventIds();
        Assert.Equal(4, written.Count); // 2 imports, stock.low of R-RST-2 (import) and of R-RST-1 (movement)

        await Webhook.Eventually(() => receiver.Accepted.Count >= written.Count, "every event after the restart");
        Assert.Equal(written, receiver.Accepted.Select(e => e.GetProperty("id").GetString()));
        Assert.All(receiver.Requests, r => Assert.True(r.Verified));
    }
}
