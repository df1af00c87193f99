using PartsOpt.Planning;
using PartsOpt.Search;
using PartsOpt.Topologies;
using PartsOpt.Values;
using static PartsOpt.Tests.Search.TestStock;

namespace PartsOpt.Tests.Planning;

/// <summary>
/// A found design becomes one column per capacitor that could decouple it; with the decoupler the search
/// chose, the column's cost per board is the search's own, recomputed from the definition (parts +
/// placements × placement charge + line items × setup / build quantity).
/// </summary>
public class DesignColumnTests
{
    [Fact]
    public void EachDecouplerGivesAColumnAndTheSearchsOwnCostComesBack()
    {
        var requirement = new SearchRequirement(Supply.Symmetric(12), new Band(1e3, 0.10), new DutyRequirement(0.2, 0.8), 20)
        {
            Topologies = [TopologyKind.RcRamp],
            Costs = new CostModel(0.02m, 5.00m),
            MaxResults = 4,
        };
        var today = new Stock(
        [
            Resistor("R-10K", 10e3, 0.01m), Resistor("R-22K", 22e3, 0.012m), Resistor("R-47K", 47e3, 0.012m),
            Capacitor("C-22N", 22e-9, 0.06m), Capacitor("C-100N", 100e-9, 0.02m, Dielectric.X7R),
            Capacitor("C-220N", 220e-9, 0.03m, Dielectric.X7R), Pot("RV-10K", 10e3, 0.40m),
        ],
        [OpAmp("TL074", QuadJfet, 0.35m)]);
        var question = new StockingQuestion([new YearlyRequirement("A", requirement, 100)], today, new Stock([], []), 0m, true);
        var lines = new PlanLines(question);
        var outcome = DesignSearch.Run(requirement, lines.All, new SearchOptions(TimeSpan.FromSeconds(600)));
        Assert.Equal(SearchStatus.Optimal, outcome.Status);
        Assert.NotEmpty(outcome.Designs);

        foreach (var design in outcome.Designs)
        {
            var columns = DesignColumn.Of(0, design, requirement, lines).ToList();
            Assert.Equal(["C-100N", "C-220N"], columns.Select(c => lines.PartNumbers[c.Decoupler!.Value]).Order());
            var chosen = design.Bom.Single(b => b.Uses.Contains("decoupling")).PartNumber;
            var same = columns.Single(c => lines.PartNumbers[c.Decoupler!.Value] == chosen);
            Assert.Equal(design.Cost.PerBoard, same.PerBoard);
            Assert.Equal(design.Bom.Select(b => b.PartNumber).Order(), same.Lines.Select(l => lines.PartNumbers[l]).Order());
            // The search picked the cheaper decoupler for this circuit: the other column costs no less.
            Assert.All(columns, c => Assert.True(c.PerBoard >= same.PerBoard));
        }
    }
}
