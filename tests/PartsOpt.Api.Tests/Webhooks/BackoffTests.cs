using PartsOpt.Api.Webhooks;

namespace PartsOpt.Api.Tests.Webhooks;

/// <summary>
/// Retry delays: exponential back-off, doubled per failure and capped, with "equal jitter" (half fixed, half
/// random). Common practice for retrying network calls; the figures follow from the documented defaults.
/// </summary>
public sealed class BackoffTests
{
    private static readonly WebhookOptions Defaults = new(); // base 2 s, cap 10 min

    [Theory]
    [InlineData(1, 0.0, 1.0)]     // first failure: half the base at the least
    [InlineData(1, 1.0, 2.0)]     // ... the whole base at the most
    [InlineData(2, 1.0, 4.0)]     // doubled
    [InlineData(4, 1.0, 16.0)]    // 2 s · 2^3
    [InlineData(9, 1.0, 512.0)]   // 2 s · 2^8, still under the cap
    [InlineData(10, 1.0, 600.0)]  // 1024 s would pass the 10 min cap
    [InlineData(60, 0.0, 300.0)]  // far past the cap, no overflow: half the cap at the least
    public void Doubles_per_failure_up_to_the_cap_with_jitter_in_the_upper_half(int failures, double random, double seconds) =>
        Assert.Equal(seconds, Defaults.Backoff(failures, random).TotalSeconds, 9);
}
