namespace PartsOpt.Api.Webhooks;

/// <summary>
/// Settings under "Webhooks" (TimeSpans as "hh:mm:ss.fff"). Read when the worker starts each pass, so a
/// test host's settings count.
/// </summary>
public sealed class WebhookOptions
{
    public const string Section = "Webhooks";

    /// <summary>How often the worker looks at the outbox.</summary>
    public TimeSpan PollInterval { get; set; } = TimeSpan.FromSeconds(1);

    /// <summary>The wait after the first failure; doubled after each further one, up to <see cref="RetryCap"/>.</summary>
    public TimeSpan RetryBase { get; set; } = TimeSpan.FromSeconds(2);

    public TimeSpan RetryCap { get; set; } = TimeSpan.FromMinutes(10);

    /// <summary>How long one request may take before it counts as a failure.</summary>
    public TimeSpan Timeout { get; set; } = TimeSpan.FromSeconds(10);

    /// <summary>Consecutive failures after which a subscription is disabled.</summary>
    public int MaxConsecutiveFailures { get; set; } = 10;

    /// <summary>
    /// The back-off before attempt <paramref name="failures"/> + 1: base·2^(failures−1) capped, then "equal
    /// jitter" (a random point in its upper half) so that receivers coming back are not hit all at once.
    /// </summary>
    public TimeSpan Backoff(int failures, double random)
    {
        var exponent = Math.Min(Math.Max(failures - 1, 0), 30);
        var ms = Math.Min(RetryCap.TotalMilliseconds, RetryBase.TotalMilliseconds * Math.Pow(2, exponent));
        return TimeSpan.FromMilliseconds(ms * (0.5 + 0.5 * random));
    }
}
