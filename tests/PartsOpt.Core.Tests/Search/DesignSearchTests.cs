using PartsOpt.Search;
using PartsOpt.Topologies;
using PartsOpt.Values;
using static PartsOpt.Tests.Search.TestStock;

namespace PartsOpt.Tests.Search;

/// <summary>
/// The whole search on hand-built stockrooms: the team's 20 kHz question, shared stock, line-item setup
/// cost, op-amp section packing, determinism. Optimal costs are checked against the exhaustive
/// reference; costs per board against the definition (parts + placements × placement cost + line items ×
/// setup cost / build quantity).
/// </summary>
public class DesignSearchTests
{
    private static readonly SearchOptions Generous = new(TimeSpan.FromSeconds(600));

    [Fact]
    public void TheTwentyKilohertzQuestionIsAnsweredCheapestFirstWithEveryTopologysBest()
    {
        var requirement = PwmAt20Kilohertz();
        var stock = Stockroom();
        var outcome = DesignSearch.Run(requirement, stock, Generous);

        Assert.Equal(SearchStatus.Optimal, outcome.Status);
        Assert.InRange(outcome.Designs.Count, 1, requirement.MaxResults + 3);
        Assert.Equal(Enumerable.Range(1, outcome.Designs.Count), outcome.Designs.Select(d => d.Rank));
        var firstTen = outcome.Designs.Take(requirement.MaxResults).Select(d => d.Cost.PerBoard).ToList();
        Assert.Equal(firstTen.Order(), firstTen);
        foreach (var report in outcome.Topologies.Where(t => t.Feasible))
            Assert.Single(outcome.Designs, d => d.Topology == report.Topology && d.BestOfTopology);

        foreach (var design in outcome.Designs)
        {
            Assert.True(DesignJudge.Judge(requirement, design.Design).Accepted);
            Assert.All(design.Bom, line => Assert.True(line.ForBuild <= line.Available, line.PartNumber));
            // Cost per board from its definition, recomputed from the BOM.
            var parts = design.Bom.Sum(l => l.PerBoard * l.UnitCost);
            var placements = design.Bom.Sum(l => l.PerBoard);
            var expected = parts + placements * 0.02m + design.Bom.Count * 5.00m / 100;
            Assert.Equal(expected, design.Cost.PerBoard);
            Assert.Contains(design.Notes, n => n.StartsWith("Decoupling: one C-100N", StringComparison.Ordinal));
        }
    }

    [Fact]
    public void SameStockAndRequirementGiveTheSameAnswer()
    {
        var requirement = PwmAt20Kilohertz(TopologyKind.RcRamp) with { MaxResults = 5 };
        var first = DesignSearch.Run(requirement, Stockroom(), Generous with { Seed = 3 });
        var second = DesignSearch.Run(requirement, Stockroom(), Generous with { Seed = 11 });

        Assert.Equal(SearchStatus.Optimal, first.Status);
        Assert.Equal(Describe(first), Describe(second));
    }

    /// <summary>rc-ramp stock where two part numbers carry the same 10 kΩ: B is cheaper, A plentiful.</summary>
    private static Stock TwinResistors(int availableB) => new(
    [
        Resistor("R-10K-A", 10e3, 0.010m),
        Resistor("R-10K-B", 10e3, 0.009m, availableB),
        Capacitor("C-2N2", 2.2e-9, 0.05m),
        Capacitor("C-100N", 100e-9, 0.02m, Dielectric.X7R),
        Pot("RV-10K", 10e3, 0.40m),
    ],
    [OpAmp("TL074", QuadJfet, 0.35m), OpAmp("CMP-FAST", FastComparator, 0.60m)]);

    private static SearchRequirement TwinRequirement(int quantity, decimal setup) =>
        new(Supply.Symmetric(12), new Band(20e3, 0.10), new DutyRequirement(0.20, 0.80), quantity)
        {
            Topologies = [TopologyKind.RcRamp],
            Costs = new CostModel(0, setup),
            MaxResults = 1,
        };

    [Theory]
    [InlineData(20, 2)] // stock for exactly two roles on 10 boards
    [InlineData(19, 1)] // one piece short of two roles: only one role may take it
    public void SharedStockLimitsHowManyRolesOnePartNumberFills(int availableB, int rolesWithB)
    {
        var requirement = TwinRequirement(10, 0);
        var stock = TwinResistors(availableB);
        var outcome = DesignSearch.Run(requirement, stock, Generous);

        Assert.Equal(SearchStatus.Optimal, outcome.Status);
        var best = outcome.Designs[0];
        Assert.Equal(rolesWithB, best.RoleParts.Values.Count(p => p.Contains("R-10K-B")));
        Assert.Equal(rolesWithB, best.Bom.Single(l => l.PartNumber == "R-10K-B").PerBoard);
        Assert.Equal(ExhaustiveReference.Cheapest(requirement, stock)!.TotalBuildCost, best.Cost.TotalBuildCost);
    }

    [Fact]
    public void LineItemSetupCostMakesOnePartNumberWin()
    {
        // One board: without setup cost the cheaper twin B takes the roles its stock allows and A the rest;
        // at 5.00 per line item, dropping B saves a whole line item (5.00) against 0.001 per role.
        var stock = TwinResistors(2);
        var free = DesignSearch.Run(TwinRequirement(1, 0), stock, Generous);
        var charged = DesignSearch.Run(TwinRequirement(1, 5.00m), stock, Generous);

        Assert.Contains(free.Designs[0].Bom, l => l.PartNumber == "R-10K-B");
        Assert.DoesNotContain(charged.Designs[0].Bom, l => l.PartNumber == "R-10K-B");
        Assert.Equal(ExhaustiveReference.Cheapest(TwinRequirement(1, 0), stock)!.PerBoard, free.Designs[0].Cost.PerBoard);
        Assert.Equal(ExhaustiveReference.Cheapest(TwinRequirement(1, 5.00m), stock)!.PerBoard, charged.Designs[0].Cost.PerBoard);
    }

    /// <summary>A 2 kHz three-stage stockroom with one op-amp part for every section.</summary>
    private static (SearchRequirement, Stock) ThreeStageAt2Kilohertz(StockOpAmp amplifier) =>
        (new SearchRequirement(Supply.Symmetric(12), new Band(2e3, 0.10), new DutyRequirement(0.20, 0.80), 10)
        {
            Topologies = [TopologyKind.ThreeStage],
            MaxResults = 1,
        },
        new Stock(
        [
            Resistor("R-10K", 10e3, 0.010m),
            Resistor("R-22K", 22e3, 0.010m),
            Resistor("R-47K", 47e3, 0.010m),
            Capacitor("C-22N", 22e-9, 0.06m),
            Capacitor("C-100N", 100e-9, 0.02m, Dielectric.X7R),
            Pot("RV-10K", 10e3, 0.40m),
        ],
        [amplifier]));

    [Fact]
    public void ThreeSectionsFillOneQuadPackageWithTheFourthTiedOff()
    {
        var (requirement, stock) = ThreeStageAt2Kilohertz(OpAmp("TL074", QuadJfet, 0.35m));
        var outcome = DesignSearch.Run(requirement, stock, Generous);

        Assert.Equal(SearchStatus.Optimal, outcome.Status);
        var best = outcome.Designs[0];
        Assert.Equal(1, best.Bom.Single(l => l.PartNumber == "TL074").PerBoard);
        Assert.Equal(1, best.Bom.Single(l => l.PartNumber == "C-100N" && l.Uses.Contains("decoupling")).Uses.Count(u => u == "decoupling"));
        Assert.Contains(best.Notes, n => n.Contains("U1D", StringComparison.Ordinal) && n.Contains("voltage follower", StringComparison.Ordinal));
        Assert.Equal(ExhaustiveReference.Cheapest(requirement, stock)!.TotalBuildCost, best.Cost.TotalBuildCost);
    }

    [Fact]
    public void ThreeSectionsOnDualsTakeTwoPackagesAndTwoDecouplingCapacitors()
    {
        var (requirement, stock) = ThreeStageAt2Kilohertz(OpAmp("TL072", DualJfet, 0.25m));
        var outcome = DesignSearch.Run(requirement, stock, Generous);

        Assert.Equal(SearchStatus.Optimal, outcome.Status);
        var best = outcome.Designs[0];
        Assert.Equal(2, best.Bom.Single(l => l.PartNumber == "TL072").PerBoard);
        Assert.Contains(best.Notes, n => n.Contains("U2B", StringComparison.Ordinal));
        Assert.Contains(best.Notes, n => n.Contains("beside each of the 2 op-amp package(s)", StringComparison.Ordinal));
        Assert.Equal(ExhaustiveReference.Cheapest(requirement, stock)!.TotalBuildCost, best.Cost.TotalBuildCost);
    }

    [Theory]
    [InlineData(4, 1)] // oscillator, integrator, comparator, reference buffer: one quad
    [InlineData(2, 2)] // the same four sections on duals: two packages, none spare
    [InlineData(1, 4)]
    public void FourSectionsPackIntoPackagesOfTheirPart(int sectionsPerPackage, int packages)
    {
        var spec = QuadJfet with { SectionsPerPackage = sectionsPerPackage };
        var requirement = new SearchRequirement(Supply.SingleRail(15), new Band(2e3, 0.1), new DutyRequirement(0.2, 0.8), 1);
        var context = new SearchContext(requirement, new Stock([], [OpAmp("AMP", spec, 1m)]));
        var variant = new SearchVariant(context, TopologyKind.ThreeStage, 0, null, bufferReference: true);

        Assert.Equal(4, variant.Functions);
        Assert.Equal(packages, variant.AmplifierPackages);
        Assert.Equal(packages, Assert.Single(variant.Problem.FixedDraws).PerBoard);
    }

    private static string Describe(SearchOutcome outcome) =>
        string.Join("\n", outcome.Designs.Select(d => $"{d.Rank} {d.Topology} {d.Cost.PerBoard} " +
            string.Join(",", d.RoleParts.Select(kv => kv.Key + "=" + string.Join("+", kv.Value)))));
}
