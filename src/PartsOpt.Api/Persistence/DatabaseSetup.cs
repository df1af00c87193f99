using Microsoft.Data.Sqlite;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Diagnostics;

namespace PartsOpt.Api.Persistence;

/// <summary>
/// Where the database lives and how it comes up. Setting <c>Storage:DatabasePath</c> (default
/// <c>data/partsopt.db</c>, relative to the working directory; its folder is created). At start-up the
/// migrations are applied (never EnsureCreated), so an upgrade keeps the data, then the demo stock is loaded
/// into an empty database when <c>Seed:Enabled</c> is true. Features add EF interceptors by registering
/// them as <see cref="IInterceptor"/> services (webhooks: a commit wakes the delivery worker).
/// </summary>
public static class DatabaseSetup
{
    public const string DatabasePathKey = "Storage:DatabasePath";
    public const string DefaultDatabasePath = "data/partsopt.db";

    public static IServiceCollection AddPartsOptDatabase(this IServiceCollection services)
    {
        services.AddSingleton<IInterceptor, Parts.PartVersionInterceptor>(); // a part's ETag moves with every saved change
        // Read at resolution time, so settings a test host adds late still count.
        services.AddDbContext<PartsOptDbContext>((provider, options) => options
            .UseSqlite(ConnectionString(provider.GetRequiredService<IConfiguration>()))
            .AddInterceptors(provider.GetServices<IInterceptor>()));
        return services;
    }

    /// <summary>The full path of the database file.</summary>
    public static string DatabaseFile(IConfiguration configuration) =>
        Path.GetFullPath(configuration[DatabasePathKey] is { Length: > 0 } p ? p : DefaultDatabasePath);

    public static string ConnectionString(IConfiguration configuration)
    {
        var path = DatabaseFile(configuration);
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        return new SqliteConnectionStringBuilder { DataSource = path, ForeignKeys = true }.ToString();
    }

    /// <summary>Applies pending migrations, then seeds an empty database if seeding is on.</summary>
    public static async Task InitialiseDatabaseAsync(this WebApplication app)
    {
        await using var scope = app.Services.CreateAsyncScope();
        var db = scope.ServiceProvider.GetRequiredService<PartsOptDbContext>();
        await db.Database.MigrateAsync();
        await DemoStock.SeedIfEmptyAsync(scope.ServiceProvider, app.Configuration, app.Logger);
    }
}
