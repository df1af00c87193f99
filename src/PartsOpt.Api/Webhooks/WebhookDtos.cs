namespace PartsOpt.Api.Webhooks;

/// <summary>A subscription request: an absolute http(s) URL, event types (or ["*"]), a note for people.</summary>
public sealed record SubscriptionInput(string? Url, IReadOnlyList<string>? Events, string? Description);

/// <summary>A subscription as listed: never its secret.</summary>
public sealed record SubscriptionDto(
    long Id, string Url, IReadOnlyList<string> Events, string Description, bool Enabled, int ConsecutiveFailures,
    int PendingDeliveries, DateTime CreatedAtUtc, string CreatedBy, DateTime? DisabledAtUtc);

/// <summary>The answer to a subscription request: the only time the signing secret is shown.</summary>
public sealed record CreatedSubscriptionDto(
    long Id, string Url, IReadOnlyList<string> Events, string Description, bool Enabled, DateTime CreatedAtUtc,
    string CreatedBy, string Secret);

/// <summary>One delivery attempt, newest first in the list. <c>statusCode</c> or <c>error</c> says how it ended.</summary>
public sealed record DeliveryAttemptDto(
    Guid EventId, string EventType, long DeliveryId, int Attempt, DateTime AtUtc, bool Succeeded, int? StatusCode,
    string? Error, double DurationMs, DateTime? NextRetryAtUtc);
