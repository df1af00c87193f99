using PartsOpt.Search;
using Xunit.Abstractions;

namespace PartsOpt.Tests.Search;

public class ScratchTests(ITestOutputHelper output)
{
    [Fact]
    public void Headline()
    {
        var outcome = DesignSearch.Run(TestStock.PwmAt20Kilohertz(), TestStock.Stockroom(), new SearchOptions(TimeSpan.FromSeconds(120)));
        output.WriteLine($"{outcome.Status} solves={outcome.Solves} elapsed={outcome.Elapsed}");
        foreach (var d in outcome.Designs)
            output.WriteLine($"{d.Rank} {d.Topology} {d.Cost.PerBoard} f={d.Evaluation.Figure("frequency")} {d.Design.Amplifier.PartNumber}/{d.Design.Comparator?.PartNumber} {string.Join(",", d.RoleParts.Select(kv => kv.Key + "=" + string.Join("+", kv.Value)))} | {string.Join(" / ", d.Bom.Select(b => b.PartNumber + "x" + b.PerBoard))}");
        foreach (var t in outcome.Topologies)
            output.WriteLine($"{t.Topology} feasible={t.Feasible} proved={t.Proved} {t.Blocking} {t.PurchaseHint}");
        foreach (var n in outcome.Notes) output.WriteLine(n);
    }
}
