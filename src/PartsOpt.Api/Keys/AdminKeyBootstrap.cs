using Microsoft.EntityFrameworkCore;
using PartsOpt.Api.Persistence;

namespace PartsOpt.Api.Keys;

/// <summary>
/// First start with no keys at all: one admin key named "admin" is created and its text written to a file
/// only the service's user can read (mode 600), at <c>Keys:AdminKeyFile</c> (default <c>admin.key</c> beside
/// the database, i.e. <c>data/admin.key</c>). The log names the file, never the key. A database that holds
/// any key, even a revoked one, is left alone.
/// </summary>
public static class AdminKeyBootstrap
{
    public const string FileKey = "Keys:AdminKeyFile";
    public const string FileName = "admin.key";
    public const string AdminName = "admin";
    public const string Creator = "first-start";

    public static string FilePath(IConfiguration configuration) =>
        Path.GetFullPath(configuration[FileKey] is { Length: > 0 } path
            ? path
            : Path.Combine(Path.GetDirectoryName(DatabaseSetup.DatabaseFile(configuration))!, FileName));

    public static async Task EnsureAdminKeyAsync(this WebApplication app)
    {
        await using var scope = app.Services.CreateAsyncScope();
        var db = scope.ServiceProvider.GetRequiredService<PartsOptDbContext>();
        if (await db.ApiKeys.AnyAsync())
            return;

        var now = scope.ServiceProvider.GetRequiredService<TimeProvider>().GetUtcNow().UtcDateTime;
        var (key, text) = KeysEndpoints.NewKey(AdminName, [KeyRoles.Admin], expiresAtUtc: null, Creator, now);
        var path = FilePath(app.Configuration);
        // The file first: a key in the database that nobody holds would lock everyone out.
        await WriteOwnerOnlyAsync(path, text + "\n");
        db.ApiKeys.Add(key);
        await db.SaveChangesAsync();
        app.Logger.LogWarning("No API keys existed: created the admin key '{Name}' and wrote it to {Path} (readable by this user only). " +
            "Move it somewhere safe and delete the file.", AdminName, path);
    }

    private static async Task WriteOwnerOnlyAsync(string path, string text)
    {
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        var options = new FileStreamOptions { Mode = FileMode.Create, Access = FileAccess.Write };
        if (!OperatingSystem.IsWindows())
            options.UnixCreateMode = UnixFileMode.UserRead | UnixFileMode.UserWrite; // never readable by others, not even briefly
        await using (var stream = new FileStream(path, options))
        await using (var writer = new StreamWriter(stream))
            await writer.WriteAsync(text);
        if (!OperatingSystem.IsWindows())
            File.SetUnixFileMode(path, UnixFileMode.UserRead | UnixFileMode.UserWrite); // an older file keeps its mode otherwise
    }
}
