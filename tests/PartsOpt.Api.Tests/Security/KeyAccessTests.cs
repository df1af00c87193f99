using System.Net;
using System.Net.Http.Headers;
using System.Net.Http.Json;
using System.Text;
using System.Text.Json;
using PartsOpt.Api.Keys;

namespace PartsOpt.Api.Tests.Security;

/// <summary>
/// Who may do what: every endpoint group against every role (401 without a valid key, 403 with the wrong
/// role, both RFC 9457 problems), and the life of a key: shown once, never listed, expiry, revocation.
/// </summary>
public sealed class KeyAccessTests(StockFactory factory) : IClassFixture<StockFactory>
{
    private readonly HttpClient _admin = factory.CreateClient();

    public static TheoryData<string, string, string, string> Endpoints => new()
    {
        // method, path, body, the least role that may call it
        { "GET", "/api/v1/parts", "", KeyRoles.Viewer },
        { "GET", "/api/v1/parts/R-NONE", "", KeyRoles.Viewer },
        { "GET", "/api/v1/parts/R-NONE/movements", "", KeyRoles.Viewer },
        { "GET", "/api/v1/parts/export", "", KeyRoles.Viewer },
        { "POST", "/api/v1/parts", "{}", KeyRoles.Stockkeeper },
        { "PUT", "/api/v1/parts/R-NONE", "{}", KeyRoles.Stockkeeper },
        { "DELETE", "/api/v1/parts/R-NONE", "", KeyRoles.Stockkeeper },
        { "POST", "/api/v1/parts/R-NONE/movements", "{}", KeyRoles.Stockkeeper },
        { "POST", "/api/v1/parts/import?dryRun=true", "", KeyRoles.Stockkeeper },
        { "POST", "/api/v1/circuits/evaluate", "{}", KeyRoles.Designer },
        { "GET", "/api/v1/builds", "", KeyRoles.Viewer },
        { "GET", "/api/v1/builds/9999", "", KeyRoles.Viewer },
        { "POST", "/api/v1/builds", "{}", KeyRoles.Stockkeeper },
        { "POST", "/api/v1/builds/9999/complete", "", KeyRoles.Stockkeeper },
        { "POST", "/api/v1/builds/9999/cancel", "", KeyRoles.Stockkeeper },
        { "GET", "/api/v1/stock/alerts", "", KeyRoles.Viewer },
        { "GET", "/api/v1/designs/9999/shortages?quantity=1", "", KeyRoles.Viewer },
        { "GET", "/api/v1/keys", "", KeyRoles.Admin },
        { "POST", "/api/v1/keys", "{}", KeyRoles.Admin },
        { "DELETE", "/api/v1/keys/9999", "", KeyRoles.Admin },
    };

    // Which roles pass a policy, by the implication rules: designer and stockkeeper imply viewer, admin all.
    private static bool Grants(string held, string needed) => held == needed || held == KeyRoles.Admin
        || (needed == KeyRoles.Viewer && held is KeyRoles.Designer or KeyRoles.Stockkeeper);

    [Theory]
    [MemberData(nameof(Endpoints))]
    public async Task Each_role_reaches_exactly_the_endpoints_it_is_granted(string method, string path, string body, string needed)
    {
        var anonymous = await factory.Anonymous().SendAsync(Request(method, path, body));
        await anonymous.AssertProblem(HttpStatusCode.Unauthorized);
        Assert.StartsWith("Bearer", anonymous.Headers.WwwAuthenticate.ToString(), StringComparison.Ordinal);

        foreach (var role in KeyRoles.All)
        {
            var client = factory.ClientWithKey(await KeyFor(role));
            var response = await client.SendAsync(Request(method, path, body));
            if (Grants(role, needed))
                Assert.True(response.StatusCode is not (HttpStatusCode.Unauthorized or HttpStatusCode.Forbidden),
                    $"{role} on {method} {path}: {(int)response.StatusCode}");
            else
                await response.AssertProblem(HttpStatusCode.Forbidden);
        }
    }

    [Fact]
    public async Task Health_and_the_api_document_need_no_key()
    {
        var anonymous = factory.Anonymous();
        Assert.Equal(HttpStatusCode.OK, (await anonymous.GetAsync("/health")).StatusCode);
        Assert.Equal(HttpStatusCode.OK, (await anonymous.GetAsync("/swagger/v1/swagger.json")).StatusCode);
        var document = await anonymous.GetFromJsonAsync<JsonElement>("/swagger/v1/swagger.json");
        var scheme = document.GetProperty("components").GetProperty("securitySchemes").GetProperty("bearer");
        Assert.Equal("bearer", scheme.GetProperty("scheme").GetString());
    }

    [Theory]
    [InlineData("Bearer po_not-a-key-at-all")]
    [InlineData("Basic YWRtaW46YWRtaW4=")]
    [InlineData("Bearer ")]
    public async Task A_wrong_key_or_scheme_is_401(string header)
    {
        var request = Request("GET", "/api/v1/parts", "");
        request.Headers.TryAddWithoutValidation("Authorization", header);
        var response = await factory.Anonymous().SendAsync(request);
        await response.AssertProblem(HttpStatusCode.Unauthorized);
    }

    [Fact]
    public async Task A_new_key_is_shown_once_and_never_listed()
    {
        var response = await _admin.PostAsJsonAsync("/api/v1/keys", new { name = "ci-pipeline", roles = new List<string> { "viewer" } });
        Assert.Equal(HttpStatusCode.Created, response.StatusCode);
        var created = (await response.Content.ReadFromJsonAsync<CreatedKeyDto>(Api.Json))!;
        Assert.StartsWith("po_", created.Key, StringComparison.Ordinal);
        // 32 random bytes are 43 base64url characters: 256 bits, above the 128 the issue asks for.
        Assert.Equal(3 + 43, created.Key.Length);
        Assert.StartsWith(created.Prefix, created.Key, StringComparison.Ordinal);

        var list = await _admin.GetStringAsync("/api/v1/keys");
        var one = await _admin.GetStringAsync($"/api/v1/keys/{created.Id}");
        foreach (var text in new[] { list, one })
        {
            Assert.DoesNotContain(created.Key, text, StringComparison.Ordinal);
            Assert.DoesNotContain(created.Key[10..30], text, StringComparison.Ordinal);
            Assert.DoesNotContain("hash", text, StringComparison.OrdinalIgnoreCase);
        }
        var listed = JsonSerializer.Deserialize<List<KeyDto>>(list, Api.Json)!.Single(k => k.Name == "ci-pipeline");
        Assert.Equal(["viewer"], listed.Roles);
        Assert.Equal("admin", listed.CreatedBy);
        Assert.True(listed.Active);

        // Only the hash is stored.
        var stored = await factory.WithDbAsync(db => Task.FromResult(db.ApiKeys.Single(k => k.Name == "ci-pipeline")));
        Assert.Equal(System.Security.Cryptography.SHA256.HashData(Encoding.UTF8.GetBytes(created.Key)), stored.Hash);

        Assert.Equal(HttpStatusCode.OK, (await factory.ClientWithKey(created.Key).GetAsync("/api/v1/parts")).StatusCode);
    }

    [Fact]
    public async Task Bad_new_keys_are_400_naming_the_field_and_a_taken_name_is_409()
    {
        var bad = await _admin.PostAsJsonAsync("/api/v1/keys",
            new { name = "has space", roles = new List<string> { "root" }, expiresAt = DateTimeOffset.UtcNow.AddDays(-1) });
        var problem = await bad.AssertProblem(HttpStatusCode.BadRequest);
        Assert.NotEmpty(problem.ErrorsFor("name"));
        Assert.NotEmpty(problem.ErrorsFor("roles"));
        Assert.NotEmpty(problem.ErrorsFor("expiresAt"));

        // Found by the hostile suite: a null role once slipped through and made a key with no role at all.
        var nullRole = await _admin.PostJson("/api/v1/keys", """{"name":"no-role","roles":[null]}""");
        Assert.NotEmpty((await nullRole.AssertProblem(HttpStatusCode.BadRequest)).ErrorsFor("roles"));

        await factory.CreateKeyAsync("twice", "viewer");
        var again = await _admin.PostAsJsonAsync("/api/v1/keys", new { name = "twice", roles = new List<string> { "viewer" } });
        await again.AssertProblem(HttpStatusCode.Conflict);
    }

    [Fact]
    public async Task A_revoked_key_is_refused_from_the_next_request_on()
    {
        var response = await _admin.PostAsJsonAsync("/api/v1/keys", new { name = "leaked", roles = new List<string> { "stockkeeper" } });
        var created = (await response.Content.ReadFromJsonAsync<CreatedKeyDto>(Api.Json))!;
        var leaked = factory.ClientWithKey(created.Key);
        Assert.Equal(HttpStatusCode.OK, (await leaked.GetAsync("/api/v1/parts")).StatusCode);

        Assert.Equal(HttpStatusCode.NoContent, (await _admin.DeleteAsync($"/api/v1/keys/{created.Id}")).StatusCode);
        var refused = await leaked.GetAsync("/api/v1/parts");
        var problem = await refused.AssertProblem(HttpStatusCode.Unauthorized);
        Assert.Contains("revoked", problem.GetProperty("detail").GetString(), StringComparison.Ordinal);

        var listed = await _admin.GetFromJsonAsync<KeyDto>($"/api/v1/keys/{created.Id}", Api.Json);
        Assert.False(listed!.Active);
        Assert.Equal("admin", listed.RevokedBy);
        // POST …/revoke is the same and may be repeated.
        Assert.Equal(HttpStatusCode.NoContent, (await _admin.PostAsync($"/api/v1/keys/{created.Id}/revoke", null)).StatusCode);
    }

    [Fact]
    public async Task An_expired_key_is_refused()
    {
        var response = await _admin.PostAsJsonAsync("/api/v1/keys",
            new { name = "short-lived", roles = new List<string> { "viewer" }, expiresAt = DateTimeOffset.UtcNow.AddSeconds(1.5) });
        var created = (await response.Content.ReadFromJsonAsync<CreatedKeyDto>(Api.Json))!;
        var client = factory.ClientWithKey(created.Key);
        Assert.Equal(HttpStatusCode.OK, (await client.GetAsync("/api/v1/parts")).StatusCode);

        await Task.Delay(TimeSpan.FromSeconds(2));
        var problem = await (await client.GetAsync("/api/v1/parts")).AssertProblem(HttpStatusCode.Unauthorized);
        Assert.Contains("expired", problem.GetProperty("detail").GetString(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task The_last_active_admin_key_cannot_be_revoked()
    {
        using var alone = new StockFactory();
        var admin = alone.CreateClient();
        var keys = await admin.GetFromJsonAsync<List<KeyDto>>("/api/v1/keys", Api.Json);
        var only = Assert.Single(keys!);
        await (await admin.DeleteAsync($"/api/v1/keys/{only.Id}")).AssertProblem(HttpStatusCode.Conflict);

        await alone.CreateKeyAsync("second-admin", "admin");
        Assert.Equal(HttpStatusCode.NoContent, (await admin.DeleteAsync($"/api/v1/keys/{only.Id}")).StatusCode);
    }

    private readonly Dictionary<string, string> _keys = [];

    private async Task<string> KeyFor(string role)
    {
        if (!_keys.TryGetValue(role, out var key))
            _keys[role] = key = await factory.CreateKeyAsync($"matrix-{role}-{Guid.NewGuid():N}", role);
        return key;
    }

    private static HttpRequestMessage Request(string method, string path, string body)
    {
        var request = new HttpRequestMessage(new HttpMethod(method), path);
        if (body.Length > 0 || method is "POST" or "PUT")
            request.Content = new StringContent(body, Encoding.UTF8,
                path.Contains("import", StringComparison.Ordinal) ? "text/csv" : "application/json");
        return request;
    }
}
