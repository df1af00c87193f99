using System.Net;
using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;
using PartsOpt.Api.Security;

namespace PartsOpt.Api.Tests.Security;

/// <summary>Rate and size limits, the solver's concurrency limit, security headers and CORS.</summary>
public sealed class LimitsTests
{
    [Fact]
    public async Task A_key_over_its_rate_gets_429_with_Retry_After_and_other_keys_do_not()
    {
        using var factory = new StockFactory
        {
            Settings = { [RateLimits.PerKeyRequestsKey] = "3", [RateLimits.PerKeyPeriodKey] = "3600" },
        };
        var other = factory.ClientWithKey(await factory.CreateKeyAsync("other", "viewer")); // the admin's first request
        var admin = factory.CreateClient();
        Assert.Equal(HttpStatusCode.OK, (await admin.GetAsync("/api/v1/parts")).StatusCode);
        Assert.Equal(HttpStatusCode.OK, (await admin.GetAsync("/api/v1/parts")).StatusCode);

        var limited = await admin.GetAsync("/api/v1/parts");
        await limited.AssertProblem(HttpStatusCode.TooManyRequests);
        var retry = limited.Headers.RetryAfter?.Delta;
        Assert.NotNull(retry);
        Assert.InRange(retry.Value.TotalSeconds, 1, 3600);
        Assert.Equal(HttpStatusCode.OK, (await other.GetAsync("/api/v1/parts")).StatusCode);
        Assert.Equal(HttpStatusCode.OK, (await factory.Anonymous().GetAsync("/health")).StatusCode);
    }

    [Fact]
    public async Task Solver_jobs_beyond_the_concurrency_limit_and_queue_get_429()
    {
        using var factory = new StockFactory
        {
            Seed = true,
            Settings = { [RateLimits.SolverConcurrentKey] = "1", [RateLimits.SolverQueueKey] = "0" },
        };
        var example = JsonNode.Parse(await File.ReadAllTextAsync(Path.Combine(Repository.Root, "docs", "examples", "evaluate-three-stage.json")))!;
        example["analysis"]!["samples"] = 100_000; // the largest run allowed: long enough for the jobs to overlap
        var body = example.ToJsonString();
        var client = factory.CreateClient();
        var responses = await Task.WhenAll(Enumerable.Range(0, 4).Select(_ => client.PostJson("/api/v1/circuits/evaluate", body)));

        Assert.Contains(responses, r => r.StatusCode == HttpStatusCode.OK);
        var refused = responses.Where(r => r.StatusCode == HttpStatusCode.TooManyRequests).ToList();
        Assert.NotEmpty(refused);
        foreach (var response in refused)
        {
            await response.AssertProblem(HttpStatusCode.TooManyRequests);
            Assert.NotNull(response.Headers.RetryAfter);
        }
    }

    [Fact]
    public async Task Bodies_over_the_limit_are_413_except_the_import_which_has_its_own()
    {
        using var factory = new StockFactory { Settings = { [RequestBodyLimit.MaxBytesKey] = "1000" } };
        var client = factory.CreateClient();
        var big = "{\"partNumber\":\"" + new string('x', 2000) + "\"}";
        await (await client.PostJson("/api/v1/parts", big)).AssertProblem(HttpStatusCode.RequestEntityTooLarge);

        var csv = "partNumber,kind\n" + string.Concat(Enumerable.Repeat("R-X,resistor\n", 200));
        var import = await client.PostCsv("/api/v1/parts/import?dryRun=true", csv);
        Assert.NotEqual(HttpStatusCode.RequestEntityTooLarge, import.StatusCode); // 2.6 kB: under Import:MaxBytes
    }

    [Fact]
    public async Task Json_nested_deeper_than_32_is_refused_as_bad_json()
    {
        using var factory = new StockFactory();
        var deep = "{\"partNumber\":\"R-DEEP\",\"x\":" + new string('[', 40) + new string(']', 40) + "}";
        var problem = await (await factory.CreateClient().PostJson("/api/v1/parts", deep)).AssertProblem(HttpStatusCode.BadRequest);
        Assert.NotEmpty(problem.ErrorsFor("$"));
    }

    [Fact]
    public async Task Every_response_carries_the_security_headers()
    {
        using var factory = new StockFactory();
        foreach (var response in new[]
                 {
                     await factory.CreateClient().GetAsync("/api/v1/parts"),
                     await factory.Anonymous().GetAsync("/api/v1/parts"), // 401
                     await factory.Anonymous().GetAsync("/health"),
                 })
        {
            Assert.Equal("nosniff", Header(response, "X-Content-Type-Options"));
            Assert.Equal("DENY", Header(response, "X-Frame-Options"));
            Assert.Equal("no-referrer", Header(response, "Referrer-Policy"));
            Assert.Equal(SecurityHeaders.ApiPolicy, Header(response, "Content-Security-Policy"));
            Assert.Equal("no-store", Header(response, "Cache-Control"));
        }
        var ui = await factory.Anonymous().GetAsync("/swagger/index.html");
        Assert.Equal(HttpStatusCode.OK, ui.StatusCode);
        Assert.Equal(SecurityHeaders.UiPolicy, Header(ui, "Content-Security-Policy"));
        Assert.Contains("frame-ancestors 'none'", Header(ui, "Content-Security-Policy"), StringComparison.Ordinal);
        // script-src 'self' only holds while the page loads every script from a file, none inline.
        var page = await ui.Content.ReadAsStringAsync();
        Assert.Contains("<script src=", page, StringComparison.Ordinal);
        Assert.DoesNotContain("<script>", page, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Cors_is_closed_by_default_and_open_for_configured_origins_only()
    {
        using var closed = new StockFactory();
        var refused = await closed.Anonymous().SendAsync(Preflight("https://plm.example.com"));
        Assert.False(refused.Headers.Contains("Access-Control-Allow-Origin"));

        using var open = new StockFactory { Settings = { ["Cors:AllowedOrigins:0"] = "https://plm.example.com" } };
        var allowed = await open.Anonymous().SendAsync(Preflight("https://plm.example.com"));
        Assert.Equal("https://plm.example.com", Header(allowed, "Access-Control-Allow-Origin"));
        Assert.Contains("authorization", Header(allowed, "Access-Control-Allow-Headers"), StringComparison.OrdinalIgnoreCase);
        var stranger = await open.Anonymous().SendAsync(Preflight("https://evil.example.net"));
        Assert.False(stranger.Headers.Contains("Access-Control-Allow-Origin"));

        var request = new HttpRequestMessage(HttpMethod.Get, "/api/v1/parts");
        request.Headers.Add("Origin", "https://plm.example.com");
        var actual = await open.CreateClient().SendAsync(request);
        Assert.Equal(HttpStatusCode.OK, actual.StatusCode);
        Assert.Equal("https://plm.example.com", Header(actual, "Access-Control-Allow-Origin"));
    }

    private static HttpRequestMessage Preflight(string origin)
    {
        var request = new HttpRequestMessage(HttpMethod.Options, "/api/v1/parts");
        request.Headers.Add("Origin", origin);
        request.Headers.Add("Access-Control-Request-Method", "POST");
        request.Headers.Add("Access-Control-Request-Headers", "authorization,content-type");
        return request;
    }

    private static string Header(HttpResponseMessage response, string name) =>
        response.Headers.TryGetValues(name, out var values) ? string.Join(",", values)
        : response.Content.Headers.TryGetValues(name, out var content) ? string.Join(",", content) : "";
}
