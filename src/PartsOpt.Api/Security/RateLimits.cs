using System.Globalization;
using System.Threading.RateLimiting;
using Microsoft.AspNetCore.Mvc;
using Microsoft.AspNetCore.RateLimiting;

namespace PartsOpt.Api.Security;

/// <summary>
/// Two limits, both answered with 429, Retry-After and a problem:
/// per key, a token bucket of <c>Limits:PerKey:Requests</c> (default 600) refilled every
/// <c>Limits:PerKey:PeriodSeconds</c> (default 60), over every authenticated request; and the named policy
/// <see cref="Solver"/>, at most <c>Limits:Solver:Concurrent</c> (default: the processor count) CPU-heavy
/// jobs at once per instance, with <c>Limits:Solver:Queue</c> (default 4) waiting. Put it on a group with
/// <c>.RequireRateLimiting(RateLimits.Solver)</c>.
/// </summary>
public static class RateLimits
{
    public const string Solver = "solver";
    public const string PerKeyRequestsKey = "Limits:PerKey:Requests";
    public const string PerKeyPeriodKey = "Limits:PerKey:PeriodSeconds";
    public const string SolverConcurrentKey = "Limits:Solver:Concurrent";
    public const string SolverQueueKey = "Limits:Solver:Queue";
    private static readonly TimeSpan SolverRetry = TimeSpan.FromSeconds(2);

    public static IServiceCollection AddPartsOptRateLimits(this IServiceCollection services)
    {
        services.AddRateLimiter(_ => { });
        services.AddOptions<RateLimiterOptions>().Configure<IConfiguration>((options, configuration) =>
        {
            var requests = Math.Max(1, configuration.GetValue(PerKeyRequestsKey, 600));
            var period = TimeSpan.FromSeconds(Math.Max(1, configuration.GetValue(PerKeyPeriodKey, 60)));
            options.GlobalLimiter = PartitionedRateLimiter.Create<HttpContext, string>(context =>
                context.User.Identity is { IsAuthenticated: true, Name: { } name }
                    ? RateLimitPartition.GetTokenBucketLimiter(name, _ => new TokenBucketRateLimiterOptions
                    {
                        TokenLimit = requests,
                        TokensPerPeriod = requests,
                        ReplenishmentPeriod = period,
                        QueueLimit = 0,
                        AutoReplenishment = true,
                    })
                    // Without a key nothing but /health and the API document answers; 256-bit keys are not guessed.
                    : RateLimitPartition.GetNoLimiter(""));

            var concurrent = Math.Max(1, configuration.GetValue(SolverConcurrentKey, Environment.ProcessorCount));
            var queue = Math.Max(0, configuration.GetValue(SolverQueueKey, 4));
            options.AddConcurrencyLimiter(Solver, limiter =>
            {
                limiter.PermitLimit = concurrent;
                limiter.QueueLimit = queue;
                limiter.QueueProcessingOrder = QueueProcessingOrder.OldestFirst;
            });
            options.OnRejected = Reject;
        });
        return services;
    }

    private static async ValueTask Reject(OnRejectedContext rejected, CancellationToken ct)
    {
        var context = rejected.HttpContext;
        var retry = rejected.Lease.TryGetMetadata(MetadataName.RetryAfter, out var after) ? after : SolverRetry;
        var seconds = Math.Max(1, (int)Math.Ceiling(retry.TotalSeconds));
        context.Response.StatusCode = StatusCodes.Status429TooManyRequests;
        context.Response.Headers.RetryAfter = seconds.ToString(CultureInfo.InvariantCulture);
        await context.RequestServices.GetRequiredService<IProblemDetailsService>().WriteAsync(new ProblemDetailsContext
        {
            HttpContext = context,
            ProblemDetails = new ProblemDetails
            {
                Status = StatusCodes.Status429TooManyRequests,
                Type = "https://www.rfc-editor.org/rfc/rfc6585#section-4",
                Title = "Too many requests.",
                Detail = $"Try again in {seconds} s.",
            },
        });
    }
}
