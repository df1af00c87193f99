using System.Net.Http;

namespace PartsOpt.Api.Tests.DesignSearches;

/// <summary>
/// The search-test stock in a real SQLite file, searched once (1 kHz, all topologies): several tests read
/// the same stored search. Tests that change the stock use their own factory.
/// </summary>
public sealed class SearchedStockFactory : StockFactory, IAsyncLifetime
{
    public HttpClient Client { get; private set; } = null!;
    public HttpResponseMessage Response { get; private set; } = null!;
    public string Body { get; private set; } = "";

    public async Task InitializeAsync()
    {
        Client = CreateClient();
        await SearchStock.SeedAsync(Client);
        (Response, Body) = await SearchStock.SearchAsync(Client, SearchStock.Requirement());
    }

    Task IAsyncLifetime.DisposeAsync() => Task.CompletedTask;
}

/// <summary>The test classes that read the one search of <see cref="SearchedStockFactory"/>.</summary>
[CollectionDefinition(Name)]
public sealed class SharedSearch : ICollectionFixture<SearchedStockFactory>
{
    public const string Name = "searched stock";
}
