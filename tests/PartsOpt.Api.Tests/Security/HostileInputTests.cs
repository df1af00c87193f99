using System.Collections.Concurrent;
using System.Net;
using System.Net.Http.Headers;
using System.Net.Http.Json;
using System.Text;
using System.Text.Json;
using Microsoft.EntityFrameworkCore;
using Xunit.Abstractions;

namespace PartsOpt.Api.Tests.Security;

/// <summary>
/// Ten thousand generated hostile requests (seeded: a failure names the seed and request number and
/// reproduces) against every endpoint, with a key that may call them all: no 5xx, every 4xx an RFC 9457
/// problem, no write accepted, and the stock byte-for-byte the same afterwards. Figures in docs/hostile-input.md.
/// </summary>
public sealed class HostileInputTests(ITestOutputHelper output)
{
    private const int Seed = 20261202;
    private const int Count = 10_000;

    [Fact]
    public async Task Ten_thousand_hostile_requests_cause_no_5xx_and_change_nothing()
    {
        using var factory = new StockFactory();
        var client = factory.CreateClient();
        await client.CreatePart(Api.Resistor(HostileRequests.Existing, 4700, initialQuantity: 100));
        await client.CreatePart(Api.Resistor(HostileRequests.Empty, 1000));
        await client.CreatePart(Api.Capacitor("C-HOSTILE-1", 100e-9, initialQuantity: 50));
        var before = await Snapshot(factory, client);

        // Generated in order from the seed, sent four at a time (no request depends on another: every write is refused).
        var generator = new HostileRequests(Seed);
        var requests = Enumerable.Range(0, Count).Select(_ => generator.Next()).ToList();
        var byKind = new ConcurrentDictionary<string, int>(StringComparer.Ordinal);
        var byStatus = new ConcurrentDictionary<int, int>();
        var failures = new ConcurrentQueue<string>();
        var started = DateTime.UtcNow;
        await Parallel.ForEachAsync(Enumerable.Range(0, Count), new ParallelOptions { MaxDegreeOfParallelism = 4 }, async (n, ct) =>
        {
            var hostile = requests[n];
            using var request = new HttpRequestMessage(hostile.Method, hostile.Path);
            if (hostile.Body is not null)
            {
                request.Content = new ByteArrayContent(hostile.Body);
                if (hostile.ContentType is not null)
                    request.Content.Headers.ContentType = MediaTypeHeaderValue.Parse(hostile.ContentType);
            }
            using var response = await client.SendAsync(request, ct);
            var status = (int)response.StatusCode;
            byKind.AddOrUpdate(hostile.Kind, 1, (_, c) => c + 1);
            byStatus.AddOrUpdate(status, 1, (_, c) => c + 1);
            var problem = await Check(response, hostile);
            if (problem is not null && failures.Count < 20)
                failures.Enqueue($"seed {Seed} request {n} ({hostile.Kind} {hostile.Method} {hostile.Path}): {problem}; body {(hostile.Body is { Length: < 2000 } b ? Encoding.UTF8.GetString(b) : "(large)")}");
        });
        var elapsed = DateTime.UtcNow - started;

        output.WriteLine($"{Count} requests, seed {Seed}, {elapsed.TotalSeconds:F1} s");
        output.WriteLine("by kind: " + string.Join(", ", byKind.OrderBy(k => k.Key, StringComparer.Ordinal).Select(k => $"{k.Key} {k.Value}")));
        output.WriteLine("by status: " + string.Join(", ", byStatus.OrderBy(s => s.Key).Select(s => $"{s.Key} {s.Value}")));
        output.WriteLine($"5xx: {byStatus.Where(s => s.Key >= 500).Sum(s => s.Value)}");
        Assert.True(failures.IsEmpty, string.Join("\n", failures));
        Assert.Equal(before, await Snapshot(factory, client));
    }

    /// <summary>Null when the answer is acceptable, else what is wrong with it.</summary>
    private static async Task<string?> Check(HttpResponseMessage response, HostileRequest hostile)
    {
        var status = (int)response.StatusCode;
        if (status >= 500)
            return $"{status}: {await response.Content.ReadAsStringAsync()}";
        if (hostile.MustBeRefused && status < 400)
            return $"a write that must be refused answered {status}";
        if (status < 400)
            return null;
        if (response.Content.Headers.ContentType?.MediaType != "application/problem+json")
            return $"{status} without a problem ({response.Content.Headers.ContentType})";
        try
        {
            var problem = JsonDocument.Parse(await response.Content.ReadAsStringAsync()).RootElement;
            if (problem.GetProperty("status").GetInt32() != status
                || string.IsNullOrEmpty(problem.GetProperty("title").GetString())
                || string.IsNullOrEmpty(problem.GetProperty("type").GetString()))
                return $"{status}: problem without a matching status, a title or a type";
        }
        catch (Exception e) when (e is JsonException or KeyNotFoundException or InvalidOperationException)
        {
            return $"{status}: problem body unreadable ({e.Message})";
        }
        return null;
    }

    /// <summary>The export (every part and its quantity) and the row counts of every table a write could touch.</summary>
    private static async Task<string> Snapshot(StockFactory factory, HttpClient client)
    {
        var export = Convert.ToBase64String(await client.Export());
        var counts = await factory.WithDbAsync(async db =>
            $"{await db.Parts.CountAsync()} parts, {await db.Movements.CountAsync()} movements, {await db.ApiKeys.CountAsync()} keys");
        return counts + "\n" + export;
    }

    [Fact]
    public async Task Formula_cells_come_out_of_the_export_neutralised()
    {
        using var factory = new StockFactory();
        var client = factory.CreateClient();
        string[] formulas = ["=cmd|' /C calc'!A0", "+1", "-1", "@SUM(1)"];
        for (var i = 0; i < formulas.Length; i++)
        {
            var part = JsonSerializer.SerializeToNode(Api.Resistor($"R-FORMULA-{i}", 1000), Api.Json)!;
            part["description"] = formulas[i];
            Assert.Equal(HttpStatusCode.Created, (await client.PostAsJsonAsync("/api/v1/parts", part)).StatusCode);
        }
        var text = Encoding.UTF8.GetString(await client.Export());
        // OWASP "CSV injection" advice (common practice): a leading ' keeps = + - @ from running.
        Assert.Contains(",'=cmd|' /C calc'!A0,", text, StringComparison.Ordinal);
        Assert.Contains(",'+1,", text, StringComparison.Ordinal);
        Assert.Contains(",'-1,", text, StringComparison.Ordinal);
        Assert.Contains(",'@SUM(1),", text, StringComparison.Ordinal);
        foreach (var cell in text.Split(['\n', ','], StringSplitOptions.None))
            Assert.False(cell.Length > 0 && "=+@".Contains(cell[0], StringComparison.Ordinal) , $"unneutralised cell {cell}");
    }
}
