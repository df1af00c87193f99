using PartsOpt.Search;
using PartsOpt.Topologies;
using PartsOpt.Values;

namespace PartsOpt.Tests.Search;

/// <summary>
/// Exactness: on many small seeded random stockrooms and requirements, the search and the exhaustive
/// reference agree on whether anything can be built and on the cheapest cost, to the exact decimal.
/// The requirements are aimed at a random design built from the same stock, so most cases are feasible
/// and some are not (stock short, a target the stock cannot reach, a check that fails).
/// </summary>
public class RandomStockExactnessTests
{
    private static readonly double[] E12 = [1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2]; // IEC 60063 E12
    private static readonly double[] PotValues = [10e3, 20e3, 50e3, 100e3];
    private static readonly decimal[] PlacementCosts = [0m, 0.01m, 0.02m];
    private static readonly decimal[] SetupCosts = [0m, 1m, 5m];
    private static readonly int[] Quantities = [1, 2, 4, 5, 10, 20, 25, 50, 100]; // setup cost / quantity stays an exact decimal

    public static TheoryData<int> Seeds()
    {
        var seeds = new TheoryData<int>();
        for (var seed = 1; seed <= 40; seed++)
            seeds.Add(seed);
        return seeds;
    }

    [Theory]
    [MemberData(nameof(Seeds))]
    public void SearchAgreesWithExhaustiveEnumeration(int seed)
    {
        var (requirement, stock) = Case(seed);
        var reference = ExhaustiveReference.Cheapest(requirement, stock);
        var outcome = DesignSearch.Run(requirement, stock, new SearchOptions(TimeSpan.FromSeconds(600), Seed: seed));

        if (reference is null)
        {
            Assert.Equal(SearchStatus.Infeasible, outcome.Status);
            Assert.Empty(outcome.Designs);
            return;
        }

        Assert.Equal(SearchStatus.Optimal, outcome.Status);
        var best = outcome.Designs[0];
        Assert.True(reference.TotalBuildCost == best.Cost.TotalBuildCost,
            $"seed {seed}: reference {reference.TotalBuildCost} ({reference.Description}), search {best.Cost.TotalBuildCost}");
        Assert.Equal(reference.PerBoard, best.Cost.PerBoard);
        Assert.True(DesignJudge.Judge(requirement, best.Design).Accepted);
    }

    /// <summary>
    /// The two searches — branch and bound, and the CP-SAT selection model with its lazy loop — are written
    /// independently over the same engine; on a top-five list they must agree design for design, in rank
    /// order (cost, then the exact tie-breaks), including every tie at the fifth cost.
    /// </summary>
    [Theory]
    [MemberData(nameof(Seeds))]
    public void Both_search_methods_list_the_same_designs(int seed)
    {
        var (requirement, stock) = Case(seed);
        requirement = requirement with { MaxResults = 5 };
        var enumerated = DesignSearch.Run(requirement, stock, new SearchOptions(TimeSpan.FromSeconds(600), Seed: seed));
        var modelled = DesignSearch.Run(requirement, stock,
            new SearchOptions(TimeSpan.FromSeconds(600), Seed: seed, Method: SearchMethod.SelectionModel));

        Assert.Equal(modelled.Status, enumerated.Status);
        static string Key(FoundDesign d) =>
            $"{d.Topology} {d.Cost.TotalBuildCost} {string.Join(",", d.RoleParts.OrderBy(kv => kv.Key).Select(kv => kv.Key + "=" + string.Join("+", kv.Value)))}";
        Assert.Equal(modelled.Designs.Select(Key), enumerated.Designs.Select(Key));
    }

    /// <summary>A seeded random stockroom (4–6 resistors, 2–3 capacitors, 1–2 pots, 1–2 op-amps) and requirement.</summary>
    internal static (SearchRequirement Requirement, Stock Stock) Case(int seed)
    {
        var random = new Random(seed);
        var topology = (TopologyKind)(seed % 3);
        var single = seed % 7 == 0;
        var resistorCount = topology == TopologyKind.ThreeStage || single ? 4 : random.Next(4, 7);
        var capacitorCount = topology == TopologyKind.ThreeStage || single ? 2 : random.Next(2, 4);
        var potCount = topology == TopologyKind.ThreeStage ? 1 : random.Next(1, 3);
        var quantity = Quantities[random.Next(Quantities.Length)];

        int Available() => random.Next(10) switch
        {
            0 => quantity,         // enough for one role per board
            1 => 2 * quantity - 1, // one role, not two
            _ => 100_000,
        };
        decimal Cost(int cents) => random.Next(1, cents) / 1000m;

        var parts = new List<StockPart>();
        foreach (var value in Distinct(resistorCount, () => E12[random.Next(12)] * Math.Pow(10, random.Next(3, 5))))
            parts.Add(TestStock.Resistor($"R{parts.Count}", value, Cost(30), Available()));
        foreach (var value in Distinct(capacitorCount, () => E12[random.Next(12)] * Math.Pow(10, random.Next(-10, -7))))
            parts.Add(TestStock.Capacitor($"C{parts.Count}", value, Cost(90), Dielectric.C0G, Available()));
        if (random.Next(3) > 0)
            parts.Add(TestStock.Capacitor($"C{parts.Count}", 100e-9, Cost(40), Dielectric.X7R, Available()));
        foreach (var value in Distinct(potCount, () => PotValues[random.Next(4)]))
            parts.Add(TestStock.Pot($"P{parts.Count}", value, Cost(500), Available()));

        (string Name, OpAmpSpec Spec)[] catalogue =
            [("QJ", TestStock.QuadJfet), ("DJ", TestStock.DualJfet), ("DB", TestStock.DualBipolar), ("FC", TestStock.FastComparator)];
        var opAmps = new List<StockOpAmp> { OpAmpFrom(catalogue[random.Next(3)]) };
        if (random.Next(2) == 0)
        {
            var second = catalogue[random.Next(4)];
            if (second.Name != opAmps[0].PartNumber)
                opAmps.Add(OpAmpFrom(second));
        }
        StockOpAmp OpAmpFrom((string Name, OpAmpSpec Spec) entry) =>
            new(entry.Name, entry.Spec, random.Next(10, 80) / 100m, random.Next(8) == 0 ? quantity - 1 : 100_000);
        var stock = new Stock(parts, opAmps);

        var supply = single ? Supply.SingleRail(12) : Supply.Symmetric(random.Next(2) == 0 ? 12 : 15);
        var target = AimAt(random, topology, supply, stock) ?? 10e3;
        var requirement = new SearchRequirement(supply, new Band(target * (0.9 + 0.2 * random.NextDouble()), 0.05 + 0.2 * random.NextDouble()),
            new DutyRequirement(0.05 + 0.3 * random.NextDouble(), 0.65 + 0.3 * random.NextDouble()), quantity)
        {
            Topologies = [topology],
            Costs = new CostModel(PlacementCosts[random.Next(3)], SetupCosts[random.Next(3)]),
            MaxResults = 1,
        };
        return (requirement, stock);

        IEnumerable<double> Distinct(int count, Func<double> draw)
        {
            var values = new SortedSet<double>();
            while (values.Count < count)
                values.Add(draw());
            return values;
        }
    }

    /// <summary>The frequency of a random design from the stock (null when it does not oscillate).</summary>
    private static double? AimAt(Random random, TopologyKind topology, Supply supply, Stock stock)
    {
        var amp = stock.OpAmps[0];
        var duty = DutyControl.Potentiometer;
        var roles = CircuitDesign.RequiredRoles(topology, supply, duty, false);
        for (var attempt = 0; attempt < 20; attempt++)
        {
            var parts = roles.ToDictionary(r => r, r =>
            {
                var kind = stock.Parts.Where(p => p.Kind == Roles.KindOf(r)).ToList();
                return kind[random.Next(kind.Count)].ToRolePart();
            });
            var design = new CircuitDesign(topology, supply, amp.Spec, parts, duty);
            if (CircuitAnalysis.Analyse(design, 2).Figure(FigureNames.Frequency) is { } f)
                return f;
        }
        return null;
    }
}
