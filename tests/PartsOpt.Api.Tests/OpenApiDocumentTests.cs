using System.Net;

namespace PartsOpt.Api.Tests;

/// <summary>
/// openapi/partsopt-v1.json is the document the service serves, committed so that callers (PLM and
/// ticketing integrations) can generate clients and review changes. This test fails when it is stale.
/// To refresh it after an API change: PARTSOPT_WRITE_OPENAPI=1 dotnet test --filter OpenApiDocumentTests
/// </summary>
public sealed class OpenApiDocumentTests(StockFactory factory) : IClassFixture<StockFactory>
{
    private const string FileName = "partsopt-v1.json";

    [Fact]
    public async Task The_committed_document_matches_the_served_one()
    {
        var response = await factory.CreateClient().GetAsync("/swagger/v1/swagger.json");
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        var served = Normalise(await response.Content.ReadAsStringAsync());

        var path = Path.Combine(Repository.Root, "openapi", FileName);
        if (Environment.GetEnvironmentVariable("PARTSOPT_WRITE_OPENAPI") == "1")
            await File.WriteAllTextAsync(path, served);

        Assert.True(File.Exists(path), $"{path} is missing; run the test with PARTSOPT_WRITE_OPENAPI=1 to write it.");
        var committed = Normalise(await File.ReadAllTextAsync(path));
        Assert.True(committed == served,
            $"openapi/{FileName} is stale: the service now serves a different document. " +
            "Refresh it with PARTSOPT_WRITE_OPENAPI=1 dotnet test --filter OpenApiDocumentTests and commit it.");
    }

    private static string Normalise(string text) => text.ReplaceLineEndings("\n").TrimEnd() + "\n";
}
