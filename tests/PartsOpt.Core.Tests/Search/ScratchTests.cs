using PartsOpt.Search;
using Xunit.Abstractions;

namespace PartsOpt.Tests.Search;

public class ScratchTests(ITestOutputHelper output)
{
    [Theory]
    [InlineData(12)]
    [InlineData(3)]
    [InlineData(6)]
    public void Seed(int seed)
    {
        var (requirement, stock) = RandomStockExactnessTests.Case(seed);
        var outcome = DesignSearch.Run(requirement, stock, new SearchOptions(TimeSpan.FromSeconds(100), Seed: seed));
        output.WriteLine($"{seed}: {outcome.Status} solves={outcome.Solves} elapsed={outcome.Elapsed}");
    }
}
