using PartsOpt.Api.Common;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.EntityFrameworkCore;
using PartsOpt.Api.Movements;
using PartsOpt.Api.Parts;
using PartsOpt.Api.Persistence;
using PartsOpt.Api.Keys;
using PartsOpt.Api.Problems;

namespace PartsOpt.Api.Webhooks;

/// <summary>/api/v1/webhooks: subscriptions to stock and build events, and their delivery log (docs/webhooks.md).</summary>
public static class WebhooksEndpoints
{
    public static IEndpointRouteBuilder MapWebhooks(this IEndpointRouteBuilder app)
    {
        // Admin only. No Idempotency-Key replay: the subscribe answer carries the signing secret, which must
        // not be stored a second time (the same reason key creation has none).
        var webhooks = app.MapGroup("/api/v1/webhooks").WithTags("Webhooks").RequireAuthorization(Policies.Admin);

        webhooks.MapPost("/", Subscribe).WithName("Subscribe")
            .WithSummary("Subscribes a URL to event types; the answer shows the signing secret, once.")
            .Validate<SubscriptionInput>(WebhookRules.Validate);
        webhooks.MapGet("/", List).WithName("ListSubscriptions")
            .WithSummary("Every subscription, oldest first (never the secret).");
        webhooks.MapGet("/{id:long}", Get).WithName("GetSubscription")
            .WithSummary("One subscription (never the secret).")
            .ProducesProblem(StatusCodes.Status404NotFound);
        webhooks.MapDelete("/{id:long}", Delete).WithName("DeleteSubscription")
            .WithSummary("Removes a subscription and its pending deliveries.")
            .ProducesProblem(StatusCodes.Status404NotFound);
        webhooks.MapPost("/{id:long}/enable", Enable).WithName("EnableSubscription")
            .WithSummary("Re-enables a subscription and resets its failure count; pending deliveries resume at once.")
            .ProducesProblem(StatusCodes.Status404NotFound);
        webhooks.MapGet("/{id:long}/deliveries", Deliveries).WithName("ListDeliveryAttempts")
            .WithSummary("A subscription's delivery attempts, newest first; paged.")
            .ProducesProblem(StatusCodes.Status404NotFound);
        return app;
    }

    private static async Task<Created<CreatedSubscriptionDto>> Subscribe(
        SubscriptionInput input, PartsOptDbContext db, HttpContext http, TimeProvider clock, CancellationToken ct)
    {
        var subscription = new Subscription
        {
            Url = input.Url!.Trim(),
            Events = WebhookRules.EventsColumn(input.Events!),
            Description = input.Description?.Trim() ?? "",
            Secret = WebhookSignature.NewSecret(),
            CreatedAtUtc = clock.GetUtcNow().UtcDateTime,
            CreatedBy = Actor.Of(http),
        };
        db.Subscriptions.Add(subscription);
        await db.SaveChangesAsync(ct);
        var s = subscription;
        return TypedResults.Created($"/api/v1/webhooks/{s.Id}", new CreatedSubscriptionDto(
            s.Id, s.Url, s.EventList, s.Description, s.Enabled, s.CreatedAtUtc, s.CreatedBy, s.Secret));
    }

    private static async Task<Ok<List<SubscriptionDto>>> List(PartsOptDbContext db, CancellationToken ct) =>
        TypedResults.Ok(await ListingAsync(db.Subscriptions.OrderBy(s => s.Id), ct));

    private static async Task<Results<Ok<SubscriptionDto>, ProblemHttpResult>> Get(
        long id, PartsOptDbContext db, CancellationToken ct) =>
        await ListingAsync(db.Subscriptions.Where(s => s.Id == id), ct) is [var found]
            ? TypedResults.Ok(found)
            : NoSuchSubscription(id);

    private static async Task<Results<NoContent, ProblemHttpResult>> Delete(
        long id, PartsOptDbContext db, CancellationToken ct) =>
        await db.Subscriptions.Where(s => s.Id == id).ExecuteDeleteAsync(ct) == 0
            ? NoSuchSubscription(id)
            : TypedResults.NoContent();

    private static async Task<Results<Ok<SubscriptionDto>, ProblemHttpResult>> Enable(
        long id, PartsOptDbContext db, TimeProvider clock, CancellationToken ct)
    {
        var now = clock.GetUtcNow().UtcDateTime;
        await using var transaction = await db.Database.BeginTransactionAsync(ct);
        var changed = await db.Subscriptions.Where(s => s.Id == id).ExecuteUpdateAsync(set => set
            .SetProperty(s => s.Enabled, true)
            .SetProperty(s => s.ConsecutiveFailures, 0)
            .SetProperty(s => s.DisabledAtUtc, (DateTime?)null), ct);
        if (changed == 0)
            return NoSuchSubscription(id);
        // Whatever back-off was running is over: the next pending delivery goes out on the next pass.
        await db.Deliveries.Where(d => d.SubscriptionId == id && d.DeliveredAtUtc == null)
            .ExecuteUpdateAsync(set => set.SetProperty(d => d.NextAttemptAtUtc, now), ct);
        await transaction.CommitAsync(ct);
        return TypedResults.Ok((await ListingAsync(db.Subscriptions.Where(s => s.Id == id), ct)).Single());
    }

    private static async Task<Results<Ok<PagedList<DeliveryAttemptDto>>, ValidationProblem, ProblemHttpResult>> Deliveries(
        long id, int? page, int? pageSize, PartsOptDbContext db, CancellationToken ct)
    {
        if (Paging.Problems(page, pageSize) is { } paging)
            return TypedResults.ValidationProblem(paging);
        if (!await db.Subscriptions.AnyAsync(s => s.Id == id, ct))
            return NoSuchSubscription(id);

        var size = pageSize ?? Paging.DefaultSize;
        var number = page ?? 1;
        var attempts = db.DeliveryAttempts.AsNoTracking().Where(a => a.Delivery!.SubscriptionId == id);
        var total = await attempts.CountAsync(ct);
        var items = await attempts.OrderByDescending(a => a.Id).Skip((number - 1) * size).Take(size)
            .Select(a => new DeliveryAttemptDto(a.Delivery!.Event!.EventId, a.Delivery.Event.Type, a.DeliveryId,
                a.Number, a.AtUtc, a.Succeeded, a.StatusCode, a.Error, a.DurationMs, a.NextRetryAtUtc))
            .ToListAsync(ct);
        return TypedResults.Ok(new PagedList<DeliveryAttemptDto>(items, number, size, total));
    }

    private static async Task<List<SubscriptionDto>> ListingAsync(IQueryable<Subscription> subscriptions,
        CancellationToken ct)
    {
        var rows = await subscriptions.AsNoTracking()
            .Select(s => new { Subscription = s, Pending = s.Deliveries.Count(d => d.DeliveredAtUtc == null) })
            .ToListAsync(ct);
        return rows.ConvertAll(r => new SubscriptionDto(r.Subscription.Id, r.Subscription.Url,
            r.Subscription.EventList, r.Subscription.Description, r.Subscription.Enabled,
            r.Subscription.ConsecutiveFailures, r.Pending, r.Subscription.CreatedAtUtc, r.Subscription.CreatedBy,
            r.Subscription.DisabledAtUtc));
    }

    private static ProblemHttpResult NoSuchSubscription(long id) =>
        TypedResults.Problem(statusCode: StatusCodes.Status404NotFound, title: "No such subscription.",
            detail: $"There is no webhook subscription {id}.");
}
