using System.Net;
using System.Net.Http.Headers;
using System.Net.Http.Json;
using Microsoft.AspNetCore.Hosting;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Logging;
using PartsOpt.Api.Keys;

namespace PartsOpt.Api.Tests.Security;

/// <summary>First start with no keys: one admin key, in a file only its owner reads, named in the log, never shown there.</summary>
public sealed class AdminKeyFileTests
{
    private sealed class LoggedStock(CapturedLog log) : StockFactory
    {
        protected override void ConfigureWebHost(IWebHostBuilder builder)
        {
            base.ConfigureWebHost(builder);
            builder.ConfigureServices(services => services.AddLogging(logging => logging.AddProvider(log)));
        }
    }

    [Fact]
    public async Task The_first_start_writes_a_working_admin_key_readable_by_its_owner_only()
    {
        var log = new CapturedLog();
        using var factory = new LoggedStock(log);
        _ = factory.Server;

        Assert.True(File.Exists(factory.AdminKeyPath));
        if (!OperatingSystem.IsWindows())
            Assert.Equal(UnixFileMode.UserRead | UnixFileMode.UserWrite, File.GetUnixFileMode(factory.AdminKeyPath)); // 0600
        var key = File.ReadAllText(factory.AdminKeyPath).Trim();
        Assert.StartsWith("po_", key, StringComparison.Ordinal);

        var client = factory.CreateClient();
        client.DefaultRequestHeaders.Authorization = new AuthenticationHeaderValue("Bearer", key);
        var keys = await client.GetFromJsonAsync<List<KeyDto>>("/api/v1/keys", Api.Json);
        var admin = Assert.Single(keys!);
        Assert.Equal(("admin", "first-start"), (admin.Name, admin.CreatedBy));
        Assert.Equal(["admin"], admin.Roles);

        Assert.Contains(log.Lines, line => line.Contains(factory.AdminKeyPath, StringComparison.Ordinal));
        Assert.DoesNotContain(log.Lines, line => line.Contains(key, StringComparison.Ordinal)
            || line.Contains(key[3..20], StringComparison.Ordinal));
    }

    [Fact]
    public async Task A_second_start_creates_no_other_key_and_leaves_the_file_alone()
    {
        string folder, firstKey;
        using (var first = new StockFactory { OwnsFolder = false })
        {
            folder = first.Folder;
            firstKey = first.AdminKey;
        }
        using var second = new StockFactory { Folder = folder };
        var keys = await second.CreateClient().GetFromJsonAsync<List<KeyDto>>("/api/v1/keys", Api.Json);
        Assert.Single(keys!);
        Assert.Equal(firstKey, second.AdminKey); // the same file, and the key still works (the client used it)
    }

    [Fact]
    public async Task The_file_path_is_a_setting()
    {
        var elsewhere = Path.Combine(Path.GetTempPath(), "partsopt-tests", Guid.NewGuid().ToString("N"), "keys", "first.key");
        using var factory = new StockFactory { Settings = { [AdminKeyBootstrap.FileKey] = elsewhere } };
        _ = factory.Server;
        Assert.True(File.Exists(elsewhere));
        Assert.False(File.Exists(factory.AdminKeyPath));
        var client = factory.Anonymous();
        client.DefaultRequestHeaders.Authorization = new AuthenticationHeaderValue("Bearer", File.ReadAllText(elsewhere).Trim());
        Assert.Equal(HttpStatusCode.OK, (await client.GetAsync("/api/v1/keys")).StatusCode);
        Directory.Delete(Path.GetDirectoryName(Path.GetDirectoryName(elsewhere))!, recursive: true);
    }
}
