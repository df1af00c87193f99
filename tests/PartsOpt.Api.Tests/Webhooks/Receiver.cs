using System.Collections.Concurrent;
using System.Net;
using System.Net.Sockets;
using System.Security.Cryptography;
using System.Text;
using System.Text.Json;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Hosting.Server;
using Microsoft.AspNetCore.Hosting.Server.Features;
using Microsoft.AspNetCore.Http;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Logging;

namespace PartsOpt.Api.Tests.Webhooks;

/// <summary>
/// A real HTTP receiver on 127.0.0.1 (Kestrel), verifying every request exactly as docs/webhooks.md tells
/// receivers to: recompute the v1 signature over "{timestamp}.{body}", compare in constant time, refuse
/// timestamps more than 5 minutes away, de-duplicate by event id. <see cref="Answer"/> picks the status
/// of each request by its number (1, 2, …), so tests can make it fail on purpose.
/// </summary>
internal sealed class Receiver : IAsyncDisposable
{
    private static readonly TimeSpan Tolerance = TimeSpan.FromMinutes(5);
    private readonly WebApplication _app;
    private readonly HashSet<string> _seen = [];
    private readonly object _gate = new();
    private int _requests;

    private Receiver(WebApplication app) => _app = app;

    public string Url { get; private set; } = "";
    public string Secret { get; set; } = "";
    public Func<int, HttpStatusCode> Answer { get; set; } = _ => HttpStatusCode.OK;

    /// <summary>Events accepted (2xx answered), each once, in the order they were first accepted.</summary>
    public ConcurrentQueue<JsonElement> Accepted { get; } = new();

    /// <summary>Every request: event id and whether its signature verified.</summary>
    public ConcurrentQueue<(string EventId, bool Verified)> Requests { get; } = new();

    /// <summary>Every request as it came: the timestamp and signature headers and the raw body.</summary>
    public ConcurrentQueue<(string Timestamp, string Signature, byte[] Body)> Raw { get; } = new();

    public int RequestCount => Volatile.Read(ref _requests);

    public static int FreePort()
    {
        using var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        return ((IPEndPoint)listener.LocalEndpoint).Port;
    }

    public static async Task<Receiver> StartAsync(int port = 0)
    {
        var builder = WebApplication.CreateSlimBuilder();
        builder.WebHost.UseUrls($"http://127.0.0.1:{port}");
        builder.Logging.ClearProviders();
        var app = builder.Build();
        var receiver = new Receiver(app);
        app.MapPost("/hook", receiver.HandleAsync);
        await app.StartAsync();
        var address = app.Services.GetRequiredService<IServer>().Features.Get<IServerAddressesFeature>()!.Addresses.First();
        receiver.Url = address + "/hook";
        return receiver;
    }

    private async Task<IResult> HandleAsync(HttpRequest request)
    {
        var number = Interlocked.Increment(ref _requests);
        using var buffer = new MemoryStream();
        await request.Body.CopyToAsync(buffer);
        var body = buffer.ToArray();
        var eventId = request.Headers["PartsOpt-Event-Id"].ToString();
        var verified = Verify(Secret, request.Headers["PartsOpt-Timestamp"].ToString(),
            request.Headers["PartsOpt-Signature"].ToString(), body, DateTimeOffset.UtcNow);
        Requests.Enqueue((eventId, verified));
        Raw.Enqueue((request.Headers["PartsOpt-Timestamp"].ToString(), request.Headers["PartsOpt-Signature"].ToString(), body));
        if (!verified)
            return Results.StatusCode(StatusCodes.Status401Unauthorized);

        var status = Answer(number);
        if ((int)status is < 200 or >= 300)
            return Results.StatusCode((int)status);
        lock (_gate)
        {
            // De-duplicate by event id: a redelivery is answered 2xx and otherwise ignored.
            if (_seen.Add(eventId))
                Accepted.Enqueue(JsonDocument.Parse(body).RootElement.Clone());
        }
        return Results.StatusCode((int)status);
    }

    /// <summary>The recipe of docs/webhooks.md, step by step.</summary>
    public static bool Verify(string secret, string timestampHeader, string signatureHeader, byte[] body,
        DateTimeOffset now)
    {
        if (!long.TryParse(timestampHeader, out var timestamp)
            || (now - DateTimeOffset.FromUnixTimeSeconds(timestamp)).Duration() > Tolerance)
            return false;
        var signed = Encoding.UTF8.GetBytes(timestampHeader + ".").Concat(body).ToArray();
        var expected = "hmac-sha256=" + Convert.ToHexStringLower(HMACSHA256.HashData(Encoding.UTF8.GetBytes(secret), signed));
        return CryptographicOperations.FixedTimeEquals(Encoding.ASCII.GetBytes(expected),
            Encoding.ASCII.GetBytes(signatureHeader));
    }

    public ValueTask DisposeAsync() => _app.DisposeAsync();
}
