using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.Data.Sqlite;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.DependencyInjection;
using PartsOpt.Api.Persistence;

namespace PartsOpt.Api.Tests;

/// <summary>
/// The service over a REAL SQLite file in a fresh temporary folder (no in-memory provider, no mocks).
/// Seeding is off unless asked for; <see cref="Settings"/> adds or overrides configuration.
/// </summary>
public class StockFactory : WebApplicationFactory<Program>
{
    /// <summary>The folder of the database; set it to an earlier factory's to restart on the same file.</summary>
    public string Folder { get; init; } = Path.Combine(Path.GetTempPath(), "partsopt-tests", Guid.NewGuid().ToString("N"));

    public string DatabasePath => Path.Combine(Folder, "stock.db");
    public bool Seed { get; init; }
    public bool OwnsFolder { get; init; } = true;
    public Dictionary<string, string> Settings { get; } = [];

    protected override void ConfigureWebHost(IWebHostBuilder builder)
    {
        Directory.CreateDirectory(Folder);
        builder.UseEnvironment("Development");
        builder.UseSetting(DatabaseSetup.DatabasePathKey, DatabasePath);
        builder.UseSetting(DemoStock.EnabledKey, Seed ? "true" : "false");
        foreach (var (key, value) in Settings)
            builder.UseSetting(key, value);
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
