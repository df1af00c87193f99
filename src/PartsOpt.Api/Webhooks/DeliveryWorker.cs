using System.Diagnostics;
using System.Text;
using System.Text.Json.Nodes;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.Options;
using PartsOpt.Api.Persistence;

namespace PartsOpt.Api.Webhooks;

/// <summary>
/// Takes events from the outbox to the subscribers. Each pass: (1) fans new events out into one delivery
/// per matching subscription, in one SaveChanges; (2) for every enabled subscription, sends its OLDEST
/// pending delivery if it is due, so a subscription's events go out strictly in order and the next waits for
/// the previous one's 2xx. All state is in the database, so a restart resumes where it stopped: at least once.
/// </summary>
internal sealed partial class DeliveryWorker(
    IServiceScopeFactory scopes, IHttpClientFactory http, IOptionsMonitor<WebhookOptions> options,
    OutboxSignal signal, TimeProvider clock, ILogger<DeliveryWorker> logger) : BackgroundService
{
    public const string ClientName = "webhooks";

    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        while (!stoppingToken.IsCancellationRequested)
        {
            try
            {
                await FanOutAsync(stoppingToken);
                await DeliverDueAsync(stoppingToken);
            }
            catch (OperationCanceledException) when (stoppingToken.IsCancellationRequested)
            {
                return;
            }
            catch (Exception e) when (e is DbUpdateException or InvalidOperationException or Microsoft.Data.Sqlite.SqliteException)
            {
                // The database was busy or a row vanished under us (a subscription deleted): next pass.
                LogPassFailed(e);
            }
            try
            {
                await signal.WaitAsync(options.CurrentValue.PollInterval, stoppingToken);
            }
            catch (OperationCanceledException)
            {
                return;
            }
        }
    }

    private async Task FanOutAsync(CancellationToken ct)
    {
        await using var scope = scopes.CreateAsyncScope();
        var db = scope.ServiceProvider.GetRequiredService<PartsOptDbContext>();
        var events = await db.OutboxEvents.Where(e => !e.FannedOut).OrderBy(e => e.Id).Take(500).ToListAsync(ct);
        if (events.Count == 0)
            return;
        var subscriptions = await db.Subscriptions.AsNoTracking().ToListAsync(ct);
        var now = clock.GetUtcNow().UtcDateTime;
        foreach (var outboxEvent in events)
        {
            // A subscription receives what happened after it was made; disabled ones queue until re-enabled.
            foreach (var subscription in subscriptions.Where(s =>
                         s.Wants(outboxEvent.Type) && s.CreatedAtUtc <= outboxEvent.OccurredAtUtc))
                db.Deliveries.Add(new Delivery
                {
                    SubscriptionId = subscription.Id, OutboxEventId = outboxEvent.Id, NextAttemptAtUtc = now,
                });
            outboxEvent.FannedOut = true;
        }
        await db.SaveChangesAsync(ct);
    }

    private async Task DeliverDueAsync(CancellationToken ct)
    {
        List<long> due;
        await using (var scope = scopes.CreateAsyncScope())
        {
            var db = scope.ServiceProvider.GetRequiredService<PartsOptDbContext>();
            var pending = await db.Deliveries.AsNoTracking()
                .Where(d => d.DeliveredAtUtc == null && d.Subscription!.Enabled)
                .OrderBy(d => d.SubscriptionId).ThenBy(d => d.OutboxEventId)
                .Select(d => new { d.Id, d.SubscriptionId, d.NextAttemptAtUtc })
                .ToListAsync(ct);
            var now = clock.GetUtcNow().UtcDateTime;
            due = pending.GroupBy(d => d.SubscriptionId).Select(g => g.First())
                .Where(d => d.NextAttemptAtUtc <= now).Select(d => d.Id).ToList();
        }
        // Subscriptions are independent: a slow receiver does not hold up the others.
        await Task.WhenAll(due.Select(id => DeliverAsync(id, ct)));
    }

    private async Task DeliverAsync(long deliveryId, CancellationToken ct)
    {
        await using var scope = scopes.CreateAsyncScope();
        var db = scope.ServiceProvider.GetRequiredService<PartsOptDbContext>();
        var delivery = await db.Deliveries.Include(d => d.Event).Include(d => d.Subscription)
            .SingleOrDefaultAsync(d => d.Id == deliveryId, ct);
        if (delivery is not { DeliveredAtUtc: null, Event: { } outboxEvent, Subscription: { Enabled: true } subscription })
            return;

        var settings = options.CurrentValue;
        var startedAt = clock.GetUtcNow();
        var (statusCode, error, elapsed) = await SendAsync(subscription, outboxEvent, settings.Timeout, ct);
        var succeeded = error is null && statusCode is >= 200 and < 300;

        delivery.Attempts++;
        var attempt = new DeliveryAttempt
        {
            Number = delivery.Attempts,
            AtUtc = startedAt.UtcDateTime,
            StatusCode = statusCode,
            Error = error is { Length: > 500 } ? error[..500] : error,
            DurationMs = Math.Round(elapsed.TotalMilliseconds, 1),
            Succeeded = succeeded,
        };
        delivery.AttemptLog.Add(attempt);
        var now = clock.GetUtcNow().UtcDateTime;
        if (succeeded)
        {
            delivery.DeliveredAtUtc = now;
            subscription.ConsecutiveFailures = 0;
        }
        else
        {
            subscription.ConsecutiveFailures++;
            if (subscription.ConsecutiveFailures >= settings.MaxConsecutiveFailures)
            {
                subscription.Enabled = false;
                subscription.DisabledAtUtc = now;
                LogDisabled(subscription.Id, subscription.ConsecutiveFailures);
            }
            else
            {
                delivery.NextAttemptAtUtc = now + settings.Backoff(delivery.Attempts, Random.Shared.NextDouble());
                attempt.NextRetryAtUtc = delivery.NextAttemptAtUtc;
            }
        }
        await db.SaveChangesAsync(CancellationToken.None); // what was sent is recorded even while stopping
    }

    private async Task<(int? StatusCode, string? Error, TimeSpan Elapsed)> SendAsync(
        Subscription subscription, OutboxEvent outboxEvent, TimeSpan timeout, CancellationToken stopping)
    {
        var body = Encoding.UTF8.GetBytes(Envelope(outboxEvent));
        var timestamp = clock.GetUtcNow().ToUnixTimeSeconds();
        using var request = new HttpRequestMessage(HttpMethod.Post, subscription.Url)
        {
            Content = new ByteArrayContent(body) { Headers = { ContentType = new("application/json") { CharSet = "utf-8" } } },
        };
        request.Headers.Add(WebhookSignature.EventIdHeader, outboxEvent.EventId.ToString());
        request.Headers.Add(WebhookSignature.EventTypeHeader, outboxEvent.Type);
        request.Headers.Add(WebhookSignature.TimestampHeader, timestamp.ToString(System.Globalization.CultureInfo.InvariantCulture));
        request.Headers.Add(WebhookSignature.SignatureHeader, WebhookSignature.Sign(subscription.Secret, timestamp, body));

        using var limit = CancellationTokenSource.CreateLinkedTokenSource(stopping);
        limit.CancelAfter(timeout);
        var watch = Stopwatch.StartNew();
        try
        {
            using var response = await http.CreateClient(ClientName).SendAsync(request, limit.Token);
            return ((int)response.StatusCode, null, watch.Elapsed);
        }
        catch (OperationCanceledException) when (!stopping.IsCancellationRequested)
        {
            return (null, $"No answer within {timeout.TotalSeconds:0.###} s.", watch.Elapsed);
        }
        catch (HttpRequestException e)
        {
            return (null, e.Message, watch.Elapsed);
        }
    }

    /// <summary>The body: {"id", "type", "occurredAt", "data"}; the same bytes on every attempt.</summary>
    internal static string Envelope(OutboxEvent outboxEvent) => new JsonObject
    {
        ["id"] = outboxEvent.EventId.ToString(),
        ["type"] = outboxEvent.Type,
        ["occurredAt"] = outboxEvent.OccurredAtUtc,
        ["data"] = JsonNode.Parse(outboxEvent.Payload),
    }.ToJsonString();

    [LoggerMessage(Level = LogLevel.Warning, Message = "Webhook subscription {SubscriptionId} disabled after {Failures} consecutive failures.")]
    private partial void LogDisabled(long subscriptionId, int failures);

    [LoggerMessage(Level = LogLevel.Warning, Message = "A webhook delivery pass failed; retrying on the next pass.")]
    private partial void LogPassFailed(Exception exception);
}
