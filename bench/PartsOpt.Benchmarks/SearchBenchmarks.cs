using BenchmarkDotNet.Attributes;
using PartsOpt.Search;

namespace PartsOpt.Benchmarks;

/// <summary>
/// Targets: the demo stock's top 10 in ≤ 250 ms median; the large stock's top 10 in ≤ 2 s median with
/// optimality proved (the medium stock's comparison with exhaustive enumeration is
/// <see cref="ExhaustiveComparisonBenchmarks"/>). Each search runs the team's usual question
/// (SearchStocks.UsualQuestion; 1 kHz on the medium stock) with a time limit, so a search that cannot
/// finish shows as the limit: read the status from `probe-search` beside it (all three end `Optimal`).
/// </summary>
[MemoryDiagnoser]
public class SearchBenchmarks
{
    private Stock _stock = null!;
    private SearchRequirement _requirement = null!;

    /// <summary>Which stockroom.</summary>
    [Params("medium", "demo", "large")]
    public string StockName { get; set; } = "medium";

    /// <summary>Wall-time limit of one search, seconds.</summary>
    [Params(30)]
    public int TimeLimitSeconds { get; set; }

    [GlobalSetup]
    public void Setup()
    {
        (_stock, _requirement) = StockName switch
        {
            "demo" => (SearchStocks.Demo(), SearchStocks.UsualQuestion()),
            "large" => (SearchStocks.Large(), SearchStocks.UsualQuestion()),
            _ => (SearchStocks.Medium(), SearchStocks.UsualQuestion() with { Frequency = new Band(1000, 0.05) }),
        };
    }

    /// <summary>One top-10 search.</summary>
    [Benchmark]
    public SearchStatus TopTen() =>
        DesignSearch.Run(_requirement, _stock, new SearchOptions(TimeSpan.FromSeconds(TimeLimitSeconds))).Status;
}
