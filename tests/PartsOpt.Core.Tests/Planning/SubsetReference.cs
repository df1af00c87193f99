using PartsOpt.Planning;
using PartsOpt.Search;
using PartsOpt.Topologies;
using PartsOpt.Values;

namespace PartsOpt.Tests.Planning;

/// <summary>
/// The brute-force reference the planner is checked against: every subset S of the lines that may come or
/// go (the candidates; with today's lines not kept, today's lines too), the design search run on the stock
/// S (plus today's lines when kept) for each requirement, and the yearly cost from its definition:
/// Σ units a year × cost per board + holding cost × lines held. A subset without a decoupling capacitor,
/// where some line could decouple, does not count (a plan must decouple). Written from the documented
/// rules (docs/stocking-plans.md) with none of the planner's code.
/// Searches are saved by monotonicity, which holds for stocks that hold a decoupler: a stock S inside a
/// stock S' whose best design uses only lines of S has the same best cost (S' offers every design S does,
/// and S offers that one); a stock inside one with no design has none either. Subsets are visited largest
/// first so that such S' are known.
/// </summary>
internal static class SubsetReference
{
    public sealed record Answer(decimal? YearlyCost, IReadOnlyList<string> Infeasible, int Subsets, int Searches, string Best = "");

    public static Answer Cheapest(StockingQuestion question)
    {
        long year = question.Requirements.Sum(r => (long)Math.Max(r.UnitsPerYear, r.Requirement.BuildQuantity));
        var plenty = (int)Math.Min(year * 64, 1_000_000_000);
        var fixedParts = question.KeepExisting ? question.Existing.Parts : [];
        var fixedOpAmps = question.KeepExisting ? question.Existing.OpAmps : [];
        var freeParts = (question.KeepExisting ? [] : question.Existing.Parts).Concat(question.Candidates.Parts).ToList();
        var freeOpAmps = (question.KeepExisting ? [] : question.Existing.OpAmps).Concat(question.Candidates.OpAmps).ToList();
        var free = freeParts.Count + freeOpAmps.Count;
        Assert.True(free <= 10, "the reference enumerates 2^lines subsets");

        bool Decouples(StockPart p, Supply supply) => p.Kind == RoleKind.Capacitor && p.Value >= 100e-9 * (1 - 1e-9)
            && p.Value <= 1e-6 * (1 + 1e-9) && p.Dielectric is null or Dielectric.C0G or Dielectric.X7R or Dielectric.X5R
            && (p.VoltageRatingV is null || p.VoltageRatingV >= supply.SpanV);
        Stock StockOf(int mask) => new(
            fixedParts.Concat(freeParts.Where((_, i) => (mask & (1 << i)) != 0)).Select(p => p with { Available = plenty }).ToList(),
            fixedOpAmps.Concat(freeOpAmps.Where((_, i) => (mask & (1 << (freeParts.Count + i))) != 0)).Select(o => o with { Available = plenty }).ToList());

        var options = new SearchOptions(TimeSpan.FromSeconds(600));
        var searches = 0;
        decimal? PerBoard(YearlyRequirement r, Stock stock)
        {
            searches++;
            var outcome = DesignSearch.Run(r.Requirement with { MaxResults = 1 }, stock, options);
            Assert.True(outcome.Status is SearchStatus.Optimal or SearchStatus.Infeasible, $"reference search {outcome.Status}");
            return outcome.Designs.Count > 0 ? outcome.Designs[0].Cost.PerBoard : null;
        }

        var everything = (1 << free) - 1;
        var all = StockOf(everything);
        var infeasible = question.Requirements.Where(r => PerBoard(r, all) is null).Select(r => r.Name).ToList();
        var met = question.Requirements.Where(r => !infeasible.Contains(r.Name)).ToList();
        var known = met.ToDictionary(r => r.Name, _ => new List<(int Searched, int Used, decimal? PerBoard)>());
        int MaskOf(FoundDesign design)
        {
            var mask = 0;
            foreach (var line in design.Bom)
            {
                var part = freeParts.FindIndex(p => p.PartNumber == line.PartNumber);
                var opAmp = freeOpAmps.FindIndex(o => o.PartNumber == line.PartNumber);
                mask |= part >= 0 ? 1 << part : opAmp >= 0 ? 1 << (freeParts.Count + opAmp) : 0;
            }
            return mask;
        }
        decimal? Cost(YearlyRequirement r, int mask)
        {
            var cache = known[r.Name];
            foreach (var (searched, used, perBoard) in cache)
                if ((mask & ~searched) == 0 && (perBoard is null || (used & ~mask) == 0))
                    return perBoard;
            searches++;
            var outcome = DesignSearch.Run(r.Requirement with { MaxResults = 1 }, StockOf(mask), options);
            Assert.True(outcome.Status is SearchStatus.Optimal or SearchStatus.Infeasible, $"reference search {outcome.Status}");
            var design = outcome.Designs.Count > 0 ? outcome.Designs[0] : null;
            cache.Add((mask, design is null ? 0 : MaskOf(design), design?.Cost.PerBoard));
            return design?.Cost.PerBoard;
        }

        decimal? best = null;
        var bestText = "";
        foreach (var mask in Enumerable.Range(0, 1 << free).OrderByDescending(m => System.Numerics.BitOperations.PopCount((uint)m)))
        {
            var stock = StockOf(mask);
            var yearly = question.HoldingCostPerLine * (stock.Parts.Count + stock.OpAmps.Count);
            var valid = met.Count > 0;
            foreach (var r in met)
            {
                if (all.Parts.Any(p => Decouples(p, r.Requirement.Supply)) && !stock.Parts.Any(p => Decouples(p, r.Requirement.Supply)))
                {
                    valid = false;
                    break;
                }
                if (Cost(r, mask) is not { } perBoard)
                {
                    valid = false;
                    break;
                }
                yearly += r.UnitsPerYear * perBoard;
            }
            if (valid && (best is null || yearly < best))
            {
                best = yearly;
                bestText = string.Join(" ", stock.Parts.Select(p => p.PartNumber).Concat(stock.OpAmps.Select(o => o.PartNumber)))
                    + " | " + string.Join(" ", met.Select(r => $"{r.Name}={Cost(r, mask)}"));
            }
        }
        return new Answer(best, infeasible, 1 << free, searches, bestText);
    }
}
