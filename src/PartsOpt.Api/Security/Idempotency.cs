using System.Globalization;
using System.Security.Cryptography;
using System.Text;
using Microsoft.AspNetCore.Mvc;
using Microsoft.EntityFrameworkCore;
using PartsOpt.Api.Keys;
using PartsOpt.Api.Persistence;

namespace PartsOpt.Api.Security;

/// <summary>
/// <c>Idempotency-Key</c> on POSTs that create something. An endpoint or group opts in with
/// <see cref="WithIdempotency{TBuilder}"/>. Per API key, the first request with a given key does the work
/// and its answer (status, Content-Type, Location, body) is stored; the same key with the same request
/// (method, path, query and body, hashed) gets that answer again with <c>PartsOpt-Replayed: true</c>,
/// without the work; with a different request, 422. A duplicate that arrives while the first is still
/// working waits for it (up to <see cref="WaitLimit"/>, then 409 with Retry-After). A unique index on
/// (key, Idempotency-Key) makes "only one does the work" hold across requests and instances. Answers of
/// 5xx are not kept (the client may retry). Records expire after <c>Idempotency:Hours</c> (default 24).
/// The header is optional: without it a request is handled as usual.
/// </summary>
public static class Idempotency
{
    public const string Header = "Idempotency-Key";
    public const string ReplayedHeader = "PartsOpt-Replayed";
    public const string HoursKey = "Idempotency:Hours";
    public const int MaxKeyLength = 200;
    private static readonly TimeSpan WaitLimit = TimeSpan.FromSeconds(10);
    private static readonly TimeSpan PollInterval = TimeSpan.FromMilliseconds(25);

    private sealed class Marker;

    public static TBuilder WithIdempotency<TBuilder>(this TBuilder builder) where TBuilder : IEndpointConventionBuilder
    {
        builder.Add(endpoint => endpoint.Metadata.Add(new Marker()));
        return builder;
    }

    public static IApplicationBuilder UseIdempotency(this IApplicationBuilder app) =>
        app.Use(async (context, next) =>
        {
            var key = context.Request.Headers[Header].ToString();
            if (!HttpMethods.IsPost(context.Request.Method) || key.Length == 0
                || context.GetEndpoint()?.Metadata.GetMetadata<Marker>() is null
                || context.User.FindFirst(ApiKeyAuthenticationHandler.KeyIdClaim)?.Value is not { } keyIdText)
            {
                await next(context);
                return;
            }
            if (key.Length > MaxKeyLength || key.Any(char.IsControl))
            {
                await Problem(context, StatusCodes.Status400BadRequest, "The Idempotency-Key is not valid.",
                    $"At most {MaxKeyLength} printable characters; a random UUID is usual.");
                return;
            }
            await Handle(context, next, int.Parse(keyIdText, CultureInfo.InvariantCulture), key);
        });

    private static async Task Handle(HttpContext context, RequestDelegate next, int apiKeyId, string key)
    {
        var db = context.RequestServices.GetRequiredService<PartsOptDbContext>();
        var clock = context.RequestServices.GetRequiredService<TimeProvider>();
        var hours = context.RequestServices.GetRequiredService<IConfiguration>().GetValue(HoursKey, 24.0);
        var hash = await HashRequestAsync(context.Request);
        var ct = context.RequestAborted;

        var now = clock.GetUtcNow().UtcDateTime;
        await db.IdempotencyRecords.Where(r => r.ExpiresAtUtc <= now).ExecuteDeleteAsync(ct);
        var record = new IdempotencyRecord
        {
            ApiKeyId = apiKeyId, Key = key, RequestHash = hash, CreatedAtUtc = now, ExpiresAtUtc = now.AddHours(hours),
        };
        db.IdempotencyRecords.Add(record);
        try
        {
            await db.SaveChangesAsync(ct); // the unique index decides who does the work
        }
        catch (DbUpdateException)
        {
            db.ChangeTracker.Clear();
            await AnswerDuplicate(context, db, apiKeyId, key, hash);
            return;
        }
        db.ChangeTracker.Clear();
        await DoAndKeep(context, next, db, record.Id);
    }

    private static async Task DoAndKeep(HttpContext context, RequestDelegate next, PartsOptDbContext db, long recordId)
    {
        var original = context.Response.Body;
        using var buffer = new MemoryStream();
        context.Response.Body = buffer;
        try
        {
            await next(context);
        }
        catch
        {
            context.Response.Body = original;
            await db.IdempotencyRecords.Where(r => r.Id == recordId).ExecuteDeleteAsync(CancellationToken.None);
            throw;
        }
        context.Response.Body = original;
        var body = buffer.ToArray();
        if (context.Response.StatusCode >= 500)
            await db.IdempotencyRecords.Where(r => r.Id == recordId).ExecuteDeleteAsync(CancellationToken.None);
        else
            await db.IdempotencyRecords.Where(r => r.Id == recordId).ExecuteUpdateAsync(set => set
                .SetProperty(r => r.StatusCode, context.Response.StatusCode)
                .SetProperty(r => r.ContentType, context.Response.ContentType)
                .SetProperty(r => r.Location, context.Response.Headers.Location.ToString())
                .SetProperty(r => r.Body, body), CancellationToken.None);
        await original.WriteAsync(body, context.RequestAborted);
    }

    private static async Task AnswerDuplicate(HttpContext context, PartsOptDbContext db, int apiKeyId, string key, byte[] hash)
    {
        var waited = TimeSpan.Zero;
        while (true)
        {
            var first = await db.IdempotencyRecords.AsNoTracking()
                .SingleOrDefaultAsync(r => r.ApiKeyId == apiKeyId && r.Key == key, context.RequestAborted);
            if (first is not null && !CryptographicOperations.FixedTimeEquals(first.RequestHash, hash))
            {
                await Problem(context, StatusCodes.Status422UnprocessableEntity, "The Idempotency-Key was used for another request.",
                    "This key was first sent with a different method, path or body; use a new key for a new request.");
                return;
            }
            if (first is { StatusCode: { } status })
            {
                context.Response.StatusCode = status;
                if (first.ContentType is { Length: > 0 } type)
                    context.Response.ContentType = type;
                if (first.Location is { Length: > 0 } location)
                    context.Response.Headers.Location = location;
                context.Response.Headers[ReplayedHeader] = "true";
                await context.Response.Body.WriteAsync(first.Body ?? [], context.RequestAborted);
                return;
            }
            // In progress, or the first failed with a 5xx and its row is gone: wait, then look again.
            if (first is null || waited >= WaitLimit)
            {
                context.Response.Headers.RetryAfter = "1";
                await Problem(context, StatusCodes.Status409Conflict, "A request with this Idempotency-Key is in progress.",
                    "Retry after it has finished.");
                return;
            }
            await Task.Delay(PollInterval, context.RequestAborted);
            waited += PollInterval;
        }
    }

    private static async Task<byte[]> HashRequestAsync(HttpRequest request)
    {
        request.EnableBuffering();
        using var sha = IncrementalHash.CreateHash(HashAlgorithmName.SHA256);
        sha.AppendData(Encoding.UTF8.GetBytes($"{request.Method} {request.Path}{request.QueryString}\n"));
        var chunk = new byte[16384];
        int read;
        while ((read = await request.Body.ReadAsync(chunk, request.HttpContext.RequestAborted)) > 0)
            sha.AppendData(chunk, 0, read);
        request.Body.Position = 0;
        return sha.GetHashAndReset();
    }

    private static async Task Problem(HttpContext context, int status, string title, string detail)
    {
        context.Response.StatusCode = status;
        await context.RequestServices.GetRequiredService<IProblemDetailsService>().WriteAsync(new ProblemDetailsContext
        {
            HttpContext = context,
            ProblemDetails = new ProblemDetails { Status = status, Title = title, Detail = detail },
        });
    }
}
