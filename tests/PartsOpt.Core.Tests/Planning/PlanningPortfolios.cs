using PartsOpt.Planning;
using PartsOpt.Search;
using PartsOpt.Tests.Search;
using PartsOpt.Topologies;
using PartsOpt.Values;

namespace PartsOpt.Tests.Planning;

/// <summary>
/// Seeded random portfolios for the planner tests: a small stock today, a few candidate lines, and two or
/// three rc-ramp requirements aimed at designs the candidate stock can build (so most are feasible, some
/// only with new lines). Prices and quantities are test inputs, never check values.
/// </summary>
internal static class PlanningPortfolios
{
    private static readonly double[] E12 = [1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2]; // IEC 60063 E12
    private static readonly int[] Quantities = [10, 20, 25, 50, 100]; // setup 5.00 / quantity stays an exact decimal
    private static readonly int[] Units = [50, 100, 400, 1000, 2500];
    private static readonly decimal[] Holding = [0m, 2m, 10m, 40m];

    public static StockingQuestion Question(int seed, bool keepExisting)
    {
        var random = new Random(seed);
        decimal Cost(int mils) => random.Next(1, mils) / 1000m;
        double Resistance() => E12[random.Next(12)] * Math.Pow(10, random.Next(3, 5));
        double Capacitance() => E12[random.Next(12)] * Math.Pow(10, random.Next(-9, -7));

        var values = new HashSet<double>();
        StockPart Resistor(string prefix)
        {
            double value;
            do value = Resistance(); while (!values.Add(value));
            return TestStock.Resistor($"{prefix}R{values.Count}", value, Cost(30));
        }
        StockPart Capacitor(string prefix)
        {
            double value;
            do value = Capacitance(); while (!values.Add(value));
            return TestStock.Capacitor($"{prefix}C{values.Count}", value, Cost(90));
        }

        // Today: in drop mode few enough lines that every subset of all lines can be enumerated (≤ 8 in all).
        var existing = new List<StockPart> { Resistor("E-"), Resistor("E-"), TestStock.Pot("E-RV10K", 10e3, Cost(500)) };
        if (keepExisting)
            existing.Add(Resistor("E-"));
        if (keepExisting || random.Next(2) == 0)
            existing.Add(Capacitor("E-"));
        var decouplerToday = random.Next(3) > 0;
        if (decouplerToday)
            existing.Add(TestStock.Capacitor("E-C100N", 100e-9, Cost(40), Dielectric.X7R));
        var opAmpsToday = new List<StockOpAmp> { TestStock.OpAmp("E-QJ", TestStock.QuadJfet, random.Next(20, 60) / 100m) };

        var candidates = new List<StockPart>();
        var budget = keepExisting ? 8 : 8 - existing.Count - opAmpsToday.Count;
        if (!decouplerToday || random.Next(2) == 0)
        {
            candidates.Add(TestStock.Capacitor("N-C220N", 220e-9, Cost(40), Dielectric.X7R));
            budget--;
        }
        var candidateOpAmps = new List<StockOpAmp>();
        if (budget > 2 && random.Next(3) == 0)
        {
            candidateOpAmps.Add(TestStock.OpAmp("N-DJ", TestStock.DualJfet, random.Next(10, 50) / 100m));
            budget--;
        }
        candidates.Add(Capacitor("N-"));
        budget--;
        while (budget-- > 0)
            candidates.Add(Resistor("N-"));

        var full = new Stock([.. existing, .. candidates], [.. opAmpsToday, .. candidateOpAmps]);
        var requirements = new List<YearlyRequirement>();
        var count = 2 + random.Next(2);
        for (var i = 0; i < count; i++)
        {
            var target = AimAt(random, full) ?? 5e3;
            var quantity = Quantities[random.Next(Quantities.Length)];
            var requirement = new SearchRequirement(Supply.Symmetric(12),
                new Band(target * (0.97 + 0.06 * random.NextDouble()), 0.05 + 0.1 * random.NextDouble()),
                new DutyRequirement(0.3 + 0.1 * random.NextDouble(), 0.6 + 0.1 * random.NextDouble()), quantity)
            {
                Topologies = [TopologyKind.RcRamp],
                Costs = new CostModel(0.02m, 5.00m),
            };
            requirements.Add(new YearlyRequirement($"product-{i + 1}", requirement, Units[random.Next(Units.Length)]));
        }
        return new StockingQuestion(requirements, new Stock(existing, opAmpsToday), new Stock(candidates, candidateOpAmps),
            Holding[random.Next(Holding.Length)], keepExisting);
    }

    /// <summary>The frequency of a random rc-ramp design from the stock (null when none oscillates).</summary>
    private static double? AimAt(Random random, Stock stock)
    {
        var supply = Supply.Symmetric(12);
        var roles = CircuitDesign.RequiredRoles(TopologyKind.RcRamp, supply, DutyControl.Potentiometer, false);
        for (var attempt = 0; attempt < 20; attempt++)
        {
            var parts = roles.ToDictionary(r => r, r =>
            {
                var kind = stock.Parts.Where(p => p.Kind == Roles.KindOf(r) && p.Dielectric != Dielectric.X7R).ToList();
                return kind[random.Next(kind.Count)].ToRolePart();
            });
            var design = new CircuitDesign(TopologyKind.RcRamp, supply, stock.OpAmps[0].Spec, parts, DutyControl.Potentiometer);
            if (CircuitAnalysis.Analyse(design, 2).Figure(FigureNames.Frequency) is { } f)
                return f;
        }
        return null;
    }
}
