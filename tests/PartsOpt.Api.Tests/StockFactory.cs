using System.Net.Http.Headers;
using System.Net.Http.Json;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.Data.Sqlite;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.DependencyInjection;
using PartsOpt.Api.Keys;
using PartsOpt.Api.Persistence;
using PartsOpt.Api.Security;

namespace PartsOpt.Api.Tests;

/// <summary>
/// The service over a REAL SQLite file in a fresh temporary folder (no in-memory provider, no mocks).
/// Seeding is off unless asked for; <see cref="Settings"/> adds or overrides configuration.
/// Every client it creates carries the admin key the service wrote on first start (Folder/admin.key), so
/// tests written before keys existed run unchanged; <see cref="ClientWithKey"/> and <see cref="Anonymous"/>
/// give other clients. The per-key rate limit is set far above what any test sends, unless a test sets it.
/// </summary>
public class StockFactory : WebApplicationFactory<Program>
{
    /// <summary>The folder of the database; set it to an earlier factory's to restart on the same file.</summary>
    public string Folder { get; init; } = Path.Combine(Path.GetTempPath(), "partsopt-tests", Guid.NewGuid().ToString("N"));

    public string DatabasePath => Path.Combine(Folder, "stock.db");
    public string AdminKeyPath => Path.Combine(Folder, AdminKeyBootstrap.FileName);
    public bool Seed { get; init; }
    public bool OwnsFolder { get; init; } = true;
    public Dictionary<string, string> Settings { get; } = [];

    protected override void ConfigureWebHost(IWebHostBuilder builder)
    {
        Directory.CreateDirectory(Folder);
        builder.UseEnvironment("Development");
        builder.UseSetting(DatabaseSetup.DatabasePathKey, DatabasePath);
        builder.UseSetting(DemoStock.EnabledKey, Seed ? "true" : "false");
        builder.UseSetting(RateLimits.PerKeyRequestsKey, "1000000");
        foreach (var (key, value) in Settings)
            builder.UseSetting(key, value);
    }

    /// <summary>The admin key of the first start, read from the file the service wrote.</summary>
    public string AdminKey
    {
        get
        {
            _ = Server; // started, so the file exists
            return File.ReadAllText(AdminKeyPath).Trim();
        }
    }

    protected override void ConfigureClient(HttpClient client)
    {
        base.ConfigureClient(client);
        _ = Server;
        if (File.Exists(AdminKeyPath))
            client.DefaultRequestHeaders.Authorization = new AuthenticationHeaderValue("Bearer", AdminKey);
    }

    /// <summary>A client sending <paramref name="key"/>.</summary>
    public HttpClient ClientWithKey(string key)
    {
        var client = CreateClient();
        client.DefaultRequestHeaders.Authorization = new AuthenticationHeaderValue("Bearer", key);
        return client;
    }

    /// <summary>A client sending no key at all.</summary>
    public HttpClient Anonymous()
    {
        var client = CreateClient();
        client.DefaultRequestHeaders.Authorization = null;
        return client;
    }

    /// <summary>Creates a key through the API with the admin key; returns the key text.</summary>
    public async Task<string> CreateKeyAsync(string name, params string[] roles)
    {
        var response = await CreateClient().PostAsJsonAsync("/api/v1/keys", new { name, roles });
        Assert.True(response.IsSuccessStatusCode, await response.Content.ReadAsStringAsync());
        var created = await response.Content.ReadFromJsonAsync<CreatedKeyDto>(Api.Json);
        return created!.Key;
    }

    /// <summary>A context of the service's own, for setting up what the API does not offer (reservations).</summary>
    public async Task<T> WithDbAsync<T>(Func<PartsOptDbContext, Task<T>> work)
    {
        await using var scope = Services.CreateAsyncScope();
        return await work(scope.ServiceProvider.GetRequiredService<PartsOptDbContext>());
    }

    public Task WithDbAsync(Func<PartsOptDbContext, Task> work) =>
        WithDbAsync(async db => { await work(db); return true; });

    /// <summary>Σ OnHandChange straight from the Movements table, by SQL of the test's own.</summary>
    public Task<int> LedgerSumAsync(string partNumber) => WithDbAsync(db => db.Database
        .SqlQuery<int>($"""
            SELECT COALESCE(SUM(m.OnHandChange), 0) AS "Value" FROM Movements m
            JOIN Parts p ON p.Id = m.PartId WHERE p.PartNumber = {partNumber}
            """)
        .SingleAsync());

    protected override void Dispose(bool disposing)
    {
        base.Dispose(disposing);
        if (disposing && OwnsFolder)
        {
            SqliteConnection.ClearAllPools();
            try
            {
                Directory.Delete(Folder, recursive: true);
            }
            catch (IOException)
            {
                // A temp folder left behind is harmless; a failing dispose would hide the test's result.
            }
        }
    }
}
