using PartsOpt.Planning;
using PartsOpt.Search;
using PartsOpt.Topologies;
using PartsOpt.Values;
using static PartsOpt.Tests.Search.TestStock;

namespace PartsOpt.Tests.Planning;

/// <summary>Candidate lines from preferred-value ranges: the series' members, names a stock part number may take.</summary>
public class CandidateCatalogueTests
{
    [Fact]
    public void ARangeGivesTheSeriesMembersInsideIt()
    {
        var parts = CandidateCatalogue.FromSeries(new SeriesCandidates(RoleKind.Resistor, ESeries.E12, 1e3, 10e3, 0.01, 0.004m), new Stock([], []));
        // IEC 60063 E12: 1.0 1.2 1.5 1.8 2.2 2.7 3.3 3.9 4.7 5.6 6.8 8.2, then 10 of the next decade.
        Assert.Equal([1e3, 1.2e3, 1.5e3, 1.8e3, 2.2e3, 2.7e3, 3.3e3, 3.9e3, 4.7e3, 5.6e3, 6.8e3, 8.2e3, 10e3], parts.Select(p => p.Value));
        Assert.All(parts, p => Assert.Equal(0.004m, p.UnitCost));
        Assert.Contains(parts, p => p.PartNumber == "NEW-R-4K7-F"); // IEC 60062: RKM 4K7, letter F = ±1 %
    }

    [Fact]
    public void AValueHeldTodayAtTheSameOrBetterToleranceIsNotACandidate()
    {
        var today = new Stock([Resistor("R-4K7", 4.7e3, 0.01m)], []);
        var parts = CandidateCatalogue.FromSeries(new SeriesCandidates(RoleKind.Resistor, ESeries.E6, 1e3, 10e3, 0.05, 0.004m), today);
        // IEC 60063 E6 from 1 k to 10 k: 1.0 1.5 2.2 3.3 4.7 6.8 10 (k), less the 4.7 k held at ±1 %.
        Assert.Equal([1e3, 1.5e3, 2.2e3, 3.3e3, 6.8e3, 10e3], parts.Select(p => p.Value));
    }

    [Theory]
    [InlineData(RoleKind.Capacitor, 2.2e-9, 0.05, "NEW-C-2n2-C0G-J")] // IEC 60062: 2n2, J = ±5 %
    [InlineData(RoleKind.Capacitor, 1e-6, 0.10, "NEW-C-1u0-C0G-K")]   // µ written u; K = ±10 %
    [InlineData(RoleKind.Resistor, 470, 0.03, "NEW-R-470R-T3")]       // no IEC 60062 letter for ±3 %
    public void MadeUpPartNumbersUseTheStocksCharacters(RoleKind kind, double value, double tolerance, string expected) =>
        Assert.Equal(expected, CandidateCatalogue.PartNumberFor(kind, value, tolerance, kind == RoleKind.Capacitor ? Dielectric.C0G : null));
}
