using System.Net;
using System.Net.Http.Json;
using System.Text.Json;
using Microsoft.EntityFrameworkCore;

namespace PartsOpt.Api.Tests;

/// <summary>Migrations on a fresh file, the health check, the OpenAPI document.</summary>
public sealed class StartupTests : IClassFixture<StockFactory>
{
    private readonly StockFactory _factory;
    private readonly HttpClient _client;

    public StartupTests(StockFactory factory)
    {
        _factory = factory;
        _client = factory.CreateClient();
    }

    [Fact]
    public async Task Migrations_apply_to_a_fresh_file_and_are_recorded()
    {
        Assert.True(File.Exists(_factory.DatabasePath));
        var tables = await _factory.WithDbAsync(db => db.Database
            .SqlQuery<string>($"SELECT name AS \"Value\" FROM sqlite_master WHERE type = 'table'").ToListAsync());
        Assert.Contains("__EFMigrationsHistory", tables);
        Assert.Contains("Parts", tables);
        Assert.Contains("Movements", tables);

        var applied = await _factory.WithDbAsync(db => db.Database.GetAppliedMigrationsAsync());
        Assert.Contains(applied, m => m.EndsWith("_InitialStock", StringComparison.Ordinal));
        Assert.Empty(await _factory.WithDbAsync(db => db.Database.GetPendingMigrationsAsync()));
    }

    [Fact]
    public async Task Health_is_200_healthy_while_the_database_answers()
    {
        var response = await _client.GetAsync("/health");
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        var body = await response.Content.ReadFromJsonAsync<JsonElement>();
        Assert.Equal("healthy", body.GetProperty("status").GetString());
    }

    [Fact]
    public async Task Health_is_503_problem_when_the_database_cannot_answer()
    {
        using var broken = new StockFactory();
        var client = broken.CreateClient();
        Assert.Equal(HttpStatusCode.OK, (await client.GetAsync("/health")).StatusCode);
        // A damaged database: the table the check queries is gone.
        await broken.WithDbAsync(db => db.Database.ExecuteSqlRawAsync("PRAGMA foreign_keys = OFF; DROP TABLE Parts;"));

        var response = await client.GetAsync("/health");
        await response.AssertProblem(HttpStatusCode.ServiceUnavailable);
    }

    [Fact]
    public async Task Swagger_document_lists_the_endpoints_and_the_ui_is_served()
    {
        var document = await _client.GetFromJsonAsync<JsonElement>("/swagger/v1/swagger.json");
        var paths = document.GetProperty("paths");
        foreach (var path in new[] { "/health", "/api/v1/parts", "/api/v1/parts/{partNumber}",
                     "/api/v1/parts/{partNumber}/movements", "/api/v1/parts/import", "/api/v1/parts/export" })
            Assert.True(paths.TryGetProperty(path, out _), $"missing {path}");
        var create = paths.GetProperty("/api/v1/parts").GetProperty("post");
        Assert.Equal("CreatePart", create.GetProperty("operationId").GetString());
        Assert.True(create.GetProperty("responses").TryGetProperty("409", out _));

        var ui = await _client.GetAsync("/swagger/index.html");
        Assert.Equal(HttpStatusCode.OK, ui.StatusCode);
    }

    [Fact]
    public async Task Unknown_route_is_a_problem_too()
    {
        var response = await _client.GetAsync("/api/v1/nothing-here");
        await response.AssertProblem(HttpStatusCode.NotFound);
    }
}
