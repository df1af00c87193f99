using Microsoft.Data.Sqlite;
using PartsOpt.Api.DesignSearches;
using PartsOpt.Api.Tests.DesignSearches;
using PartsOpt.Topologies;

namespace PartsOpt.Api.Tests.Builds;

/// <summary>
/// One stored design over the search-test stock (<see cref="SearchStock"/>, <see cref="Stock"/> of every
/// part), made ONCE through the API (rc-ramp, 1 kHz, one board) in a real SQLite file. Every test then starts
/// the service on its own copy of that file (<see cref="NewService"/>), so tests change stock freely without a
/// search each. The design is a fixture: its BOM is the input of the checks, never a check value itself.
/// </summary>
public sealed class DesignedStock : IAsyncLifetime
{
    public const int Stock = 1000;

    private readonly string _folder = Path.Combine(Path.GetTempPath(), "partsopt-tests", "designed-" + Guid.NewGuid().ToString("N"));

    public DesignDto Design { get; private set; } = null!;
    public int DesignId => Design.Id;
    public IReadOnlyList<BomLineDto> Bom => Design.Result.Bom;

    public async Task InitializeAsync()
    {
        using (var factory = new StockFactory { Folder = _folder, OwnsFolder = false })
        {
            var client = factory.CreateClient();
            await SearchStock.SeedAsync(client, Stock);
            var (_, body) = await SearchStock.SearchAsync(client,
                SearchStock.Requirement(buildQuantity: 1, maxResults: 1, topologies: TopologyNames.RcRamp));
            Design = SearchStock.Read(body).Designs.Single();
        }
        SqliteConnection.ClearAllPools(); // the file is closed and whole before it is copied
    }

    /// <summary>A service on a fresh copy of the designed stock; dispose it to delete the copy.</summary>
    public StockFactory NewService()
    {
        var folder = Path.Combine(Path.GetTempPath(), "partsopt-tests", Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(folder);
        foreach (var file in Directory.GetFiles(_folder))
            File.Copy(file, Path.Combine(folder, Path.GetFileName(file)));
        return new StockFactory { Folder = folder };
    }

    /// <summary>The BOM line of the op-amp package (the amplifier).</summary>
    public BomLineDto OpAmpLine => Bom.Single(b => b.PartNumber == Design.Result.Amplifier);

    public Task DisposeAsync()
    {
        try
        {
            Directory.Delete(_folder, recursive: true);
        }
        catch (IOException)
        {
            // A temp folder left behind is harmless.
        }
        return Task.CompletedTask;
    }
}

/// <summary>The build tests: they share the one search of <see cref="DesignedStock"/> and run one after another.</summary>
[CollectionDefinition(Name)]
public sealed class SharedDesign : ICollectionFixture<DesignedStock>
{
    public const string Name = "designed stock";
}
