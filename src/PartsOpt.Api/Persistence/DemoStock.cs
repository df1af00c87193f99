using PartsOpt.Api.Parts.Csv;
using Microsoft.EntityFrameworkCore;

namespace PartsOpt.Api.Persistence;

/// <summary>
/// Loads the demo stockroom (seed-inventory-demo/*.csv, invented parts) into an EMPTY database, through the
/// ordinary import, so the demo files are checked by the same rules as any other file. Settings:
/// <c>Seed:Enabled</c> (default true; tests turn it off) and <c>Seed:Path</c> (default
/// <c>seed-inventory-demo</c>; a relative path is looked for beside the program, where the build copies the
/// files, then under the working directory). A database that holds any part or ledger row is never seeded.
/// </summary>
public static class DemoStock
{
    public const string EnabledKey = "Seed:Enabled";
    public const string PathKey = "Seed:Path";
    public const string DefaultPath = "seed-inventory-demo";
    public const string SeedActor = "demo-seed";

    public static async Task SeedIfEmptyAsync(IServiceProvider services, IConfiguration configuration, ILogger logger)
    {
        if (!configuration.GetValue(EnabledKey, true))
            return;
        var db = services.GetRequiredService<PartsOptDbContext>();
        if (await db.Parts.AnyAsync() || await db.Movements.AnyAsync())
            return;
        var folder = FindFolder(configuration[PathKey] is { Length: > 0 } p ? p : DefaultPath);
        if (folder is null)
        {
            logger.LogWarning("Demo stock folder not found; starting with an empty stock.");
            return;
        }

        var clock = services.GetRequiredService<TimeProvider>();
        foreach (var file in Directory.GetFiles(folder, "*.csv").Order(StringComparer.Ordinal))
        {
            using var text = new StreamReader(file);
            var outcome = await PartImporter.ImportAsync(db, text, dryRun: false, SeedActor, clock.GetUtcNow().UtcDateTime, default);
            if (outcome.Errors.Count > 0)
                throw new InvalidOperationException($"The demo file {file} does not import: " +
                    string.Join("; ", outcome.Errors.Take(5).Select(e => $"line {e.Line} {e.Column}: {e.Message}")));
            if (logger.IsEnabled(LogLevel.Information))
                logger.LogInformation("Demo stock: {Count} parts from {File}.", outcome.Report!.Created.Count, Path.GetFileName(file));
        }
    }

    private static string? FindFolder(string path)
    {
        if (Path.IsPathRooted(path))
            return Directory.Exists(path) ? path : null;
        return new[] { AppContext.BaseDirectory, Directory.GetCurrentDirectory() }
            .Select(root => Path.Combine(root, path))
            .FirstOrDefault(Directory.Exists);
    }
}
