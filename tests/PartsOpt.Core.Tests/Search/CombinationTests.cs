using PartsOpt.Search;
using PartsOpt.Topologies;
using PartsOpt.Values;
using static PartsOpt.Tests.Search.TestStock;

namespace PartsOpt.Tests.Search;

/// <summary>Roles filled by two stocked parts in series or parallel when combinations are allowed.</summary>
public class CombinationTests
{
    private static readonly SearchOptions Generous = new(TimeSpan.FromSeconds(600));

    /// <summary>
    /// rc-ramp at 20 kHz ±10 %: 10 kΩ and 1 nF give about 40 kHz (β = ½: 2·R·C·ln 3, Sedra &amp; Smith,
    /// plus two slewing edges); two 10 kΩ in series make 20 kΩ, about 21 kHz, and two 1 nF in parallel
    /// 2 nF, about 22 kHz. Nothing single fits.
    /// </summary>
    private static (SearchRequirement, Stock) NeedsTwenty(bool allow) =>
        (new SearchRequirement(Supply.Symmetric(12), new Band(20e3, 0.10), new DutyRequirement(0.20, 0.80), 10)
        {
            Topologies = [TopologyKind.RcRamp],
            AllowCombinations = allow,
            MaxResults = 3,
        },
        new Stock(
        [
            Resistor("R-10K", 10e3, 0.010m),
            Capacitor("C-1N0", 1e-9, 0.05m),
            Capacitor("C-100N", 100e-9, 0.02m, Dielectric.X7R),
            Pot("RV-10K", 10e3, 0.40m),
        ],
        [OpAmp("TL074", QuadJfet, 0.35m), OpAmp("CMP-FAST", FastComparator, 0.60m)]));

    [Fact]
    public void WithoutCombinationsNothingFits()
    {
        var (requirement, stock) = NeedsTwenty(allow: false);
        Assert.Equal(SearchStatus.Infeasible, DesignSearch.Run(requirement, stock, Generous).Status);
    }

    [Fact]
    public void TwoResistorsInSeriesFillTheTimingRole()
    {
        var (requirement, stock) = NeedsTwenty(allow: true);
        var outcome = DesignSearch.Run(requirement, stock, Generous);

        Assert.Equal(SearchStatus.Optimal, outcome.Status);
        var best = outcome.Designs[0];
        // Two 10 kΩ in series (0.02 + two placements) are cheaper than two 1 nF in parallel (0.10 + two placements).
        Assert.Equal(["R-10K", "R-10K"], best.RoleParts[Roles.OscR]);
        Precision.AlmostEqualRelative(20e3, best.Design.Roles[Roles.OscR].Value, 1e-12, "series 10 kΩ + 10 kΩ");
        Assert.True(requirement.Frequency.Contains(best.Evaluation.Figure(FigureNames.Frequency)!.Value));
        Assert.Contains(best.Notes, n => n.Contains("osc.r is R-10K + R-10K (series", StringComparison.Ordinal));
        // Five single 10 kΩ roles and the series pair: six 10 kΩ per board on the BOM.
        Assert.Equal(6, best.Bom.Single(l => l.PartNumber == "R-10K").PerBoard);
        Assert.Contains(outcome.Designs, d => d.RoleParts[Roles.OscC].Count == 2 && d.Design.Roles[Roles.OscC].Value == 2e-9);
    }
}
