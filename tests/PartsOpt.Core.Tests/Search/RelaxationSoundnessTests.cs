using PartsOpt.Search;
using PartsOpt.Topologies;
using PartsOpt.Values;

namespace PartsOpt.Tests.Search;

/// <summary>
/// The search's model may only ever be looser than the exact engine: every bound, bucket and cut is checked
/// here against the engine's own closed forms (the relaxation oscillator period, REFERENCE.md) and its
/// judgement, on stockrooms large enough to take the paths small test stocks never reach.
/// </summary>
public class RelaxationSoundnessTests
{
    // IEC 60063 E24 mantissas.
    private static readonly double[] E24 =
        [1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1];

    private static readonly string[] RedrawnWithTheGenerator = [Roles.IntC, Roles.IntRf, Roles.CmpRa, Roles.CmpPot, Roles.CmpRb];

    private static readonly double[] PotValues = [1e3, 2e3, 5e3, 10e3, 20e3, 50e3, 100e3, 200e3, 500e3];

    private static IEnumerable<double> E24Between(int fromDecade, int toDecade) =>
        Enumerable.Range(fromDecade, toDecade - fromDecade).SelectMany(d => E24.Select(m => m * Math.Pow(10, d)));

    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public void Every_stocked_divider_pair_lies_inside_its_bucket(bool singleSupply)
    {
        var values = E24Between(2, 7).ToArray(); // 100 Ω … 9.1 MΩ: 120 values, 14,400 pairs
        var slot = new SelectionSlot("r", values.Select(v => new SlotOption([], Math.Log(v))).ToList());
        var supply = singleSupply ? Supply.SingleRail(12) : Supply.Symmetric(12);
        var amp = TestStock.QuadJfet;
        var levels = new FrequencyRelaxation.Levels(supply, amp);
        // Single supply: the references a stocked pair gives, 12 V · bottom / (top + bottom).
        var references = singleSupply
            ? values.SelectMany(top => values.Select(bottom => 12 * bottom / (top + bottom))).Distinct().Order().ToArray()
            : [0.0];

        var (buckets, _, upperMultiplier) = FrequencyRelaxation.DividerBuckets([slot, slot], 0, 1, references, levels, amp.InputOffsetV)!.Value;

        Assert.True(buckets.Edges.Count <= FrequencyRelaxation.MaxBuckets);
        var checkedPairs = 0;
        var sampled = new Random(7);
        foreach (var r1 in values)
            foreach (var r2 in values)
            {
                var beta = r2 / (r1 + r2);
                var x = Math.Log(r2) - Math.Log(r1);
                var bucket = Enumerable.Range(0, buckets.Edges.Count)
                    .FirstOrDefault(j => buckets.Edges[j].Low <= x + 1e-12 && x - 1e-12 <= buckets.Edges[j].High, -1);
                // Every reference for a dual supply; a seeded sample of them for a single one.
                foreach (var reference in singleSupply ? references.Where(_ => sampled.Next(200) == 0) : references)
                {
                    var k = levels.PeriodFactor(beta, reference, amp.InputOffsetV);
                    if (!double.IsFinite(k) || beta * (levels.HighRel(reference) - levels.LowRel(reference)) < CircuitChecks.HysteresisOffsets * amp.InputOffsetV)
                        continue; // the engine rejects this pair about this reference: the model need not admit it
                    Assert.True(bucket >= 0, $"pair {r1}/{r2} (x = {x}) is in no bucket");
                    Assert.InRange(Math.Log(k), buckets.Low[bucket] - 1e-12, buckets.High[bucket] + 1e-12);
                    var (_, upper) = RelaxationTiming.EdgeMultipliers(beta, levels.HighRel(reference), levels.LowRel(reference));
                    Assert.True(upper <= upperMultiplier + 1e-12, $"edge multiplier {upper} above the bound {upperMultiplier}");
                    checkedPairs++;
                }
            }
        Assert.True(checkedPairs > 10_000, $"only {checkedPairs} pairs checked");
    }

    /// <summary>
    /// The divider buckets read each factor at a bucket's end ratios only (both are monotone in β on each
    /// side of β = 1/2). Here every stocked pair is worked out on its own, by the definitions: whether the
    /// oscillator can switch with it, its period factor about the most and least favourable references
    /// (RelaxationTiming's closed form, REFERENCE.md) and its edge-completion factor. Each bucket must hold
    /// exactly the least and greatest of its pairs, and the buckets the same number of pairs give or take
    /// one ratio's worth.
    /// </summary>
    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public void Divider_buckets_hold_the_least_and_greatest_factor_of_their_pairs(bool singleSupply)
    {
        var values = E24Between(1, 6).ToArray(); // 10 Ω … 910 kΩ: 120 values, 14,400 pairs
        var slot = new SelectionSlot("r", values.Select(v => new SlotOption([], Math.Log(v))).ToList());
        var supply = singleSupply ? Supply.SingleRail(12) : Supply.Symmetric(12);
        var amp = TestStock.QuadJfet;
        var levels = new FrequencyRelaxation.Levels(supply, amp);
        var references = singleSupply
            ? values.Take(40).SelectMany(top => values.Take(40).Select(bottom => 12 * bottom / (top + bottom))).Distinct().Order().ToArray()
            : [0.0];

        var (buckets, edgeBuckets, _) = FrequencyRelaxation.DividerBuckets([slot, slot], 0, 1, references, levels, amp.InputOffsetV)!.Value;

        var usable = references.Where(r => levels.HighRel(r) > 0 && levels.LowRel(r) < 0).ToArray();
        var centre = usable.MinBy(r => Math.Abs(Math.Log(-levels.LowRel(r) / levels.HighRel(r))));
        var members = Enumerable.Range(0, buckets.Edges.Count).Select(_ => new List<(double Low, double High, double Edge)>()).ToArray();
        foreach (var r1 in values)
            foreach (var r2 in values)
            {
                var x = Math.Log(r2) - Math.Log(r1);
                var beta = 1 / (1 + Math.Exp(-x));
                if (!double.IsFinite(levels.PeriodFactor(beta, centre, amp.InputOffsetV))
                    || beta * (levels.HighRel(centre) - levels.LowRel(centre)) < CircuitChecks.HysteresisOffsets * amp.InputOffsetV * (1 - 1e-9))
                    continue; // cannot switch: in no bucket
                var bucket = Enumerable.Range(0, buckets.Edges.Count).Single(j => buckets.Edges[j].Low <= x && x <= buckets.Edges[j].High);
                var edge = usable.Length == 1
                    ? FrequencyRelaxation.EdgeCompletesSharp(beta, levels.HighRel(centre), levels.LowRel(centre))
                    : FrequencyRelaxation.EdgeCompletes(beta, levels.HighRel(centre), levels.LowRel(centre));
                members[bucket].Add((Math.Log(levels.PeriodFactor(beta, centre, 0)),
                    Math.Max(Math.Log(levels.PeriodFactor(beta, usable[0], 0)), Math.Log(levels.PeriodFactor(beta, usable[^1], 0))),
                    Math.Log(edge)));
            }

        Assert.Equal(buckets.Edges, edgeBuckets.Edges);
        for (var j = 0; j < members.Length; j++)
        {
            Assert.NotEmpty(members[j]);
            Assert.Equal(members[j].Min(m => m.Low), buckets.Low[j], 1e-12);
            Assert.Equal(members[j].Max(m => m.High), buckets.High[j], 1e-12);
            // The sharp edge factor is found by bisection to 1e-12 of itself: its ends agree to that.
            Assert.Equal(members[j].Min(m => m.Edge), edgeBuckets.Low[j], 1e-9);
            Assert.Equal(members[j].Max(m => m.Edge), edgeBuckets.High[j], 1e-9);
        }
        var counts = members.Select(m => m.Count).ToArray();
        var per = (counts.Sum() + FrequencyRelaxation.MaxBuckets - 1) / FrequencyRelaxation.MaxBuckets;
        Assert.All(counts[..^1], c => Assert.InRange(c, per, per + values.Length));
    }

    /// <summary>
    /// A comparator whose rise plus fall (full swing over its slew rate, twice) needs a period longer than
    /// the band allows fails the engine's edge check (within 5 % of the period, common practice) whatever
    /// the parts. With a single supply the slewing edges' slack in the period bounds used to hide that (the
    /// bipolar variants then walked their whole tree for 30 s); the variant is now ruled out at once, and
    /// the engine agrees on every design of it that was sampled.
    /// </summary>
    [Theory]
    [InlineData(TopologyKind.RcRamp)]
    [InlineData(TopologyKind.Loop)]
    [InlineData(TopologyKind.ThreeStage)]
    public void A_comparator_too_slow_for_the_band_rules_its_variant_out(TopologyKind topology)
    {
        var stock = TestStock.Stockroom(TestStock.OpAmp("LM358", TestStock.DualBipolar, 0.12m));
        // 0.3 V/µs over about 10.45 V: 70 µs of edges want a period of 1.4 ms; the band asks for 0.2 ms.
        var requirement = TestStock.PwmAt20Kilohertz(topology) with { Supply = Supply.SingleRail(12), Frequency = new Band(4500, 0.1) };
        var variant = new SearchVariant(new SearchContext(requirement, stock), topology, 0, null, false);

        Assert.Contains(variant.Problem.Bounds, b => b.Figure == FigureNames.Frequency && b.Lower > b.Upper);
        var random = new Random(11);
        for (var sample = 0; sample < 300; sample++)
        {
            var choice = RandomChoice(variant, random);
            if (JudgeOrNull(requirement, variant, choice) is not { } judgement)
                continue;
            Assert.False(judgement.Accepted);
            if (judgement.Evaluation.Figure(FigureNames.Frequency) is { } f && requirement.Frequency.Contains(f))
                Assert.Contains("output edges short against the period", judgement.FailedChecks);
        }
        var outcome = DesignSearch.Run(requirement, stock);
        Assert.Equal(SearchStatus.Infeasible, outcome.Status);
    }

    /// <summary>
    /// The facts the learnt threshold cut rests on, against the engine: a design rejected on the comparator's
    /// input range with its ramp inside has the pot's thresholds outside, a failure of the divider's roles
    /// alone; and every other design, any generator and ramp, whose top threshold reaches at least a top
    /// found above the range (or whose bottom reaches at most a bottom found below it) is rejected, on that
    /// check whenever it oscillates.
    /// </summary>
    [Fact]
    public void Thresholds_learnt_outside_the_comparator_range_fail_with_any_ramp()
    {
        var stock = SampledStock(3, 6, PotValues.Length); // TL074 inputs reach only 3 V above V−
        var requirement = TestStock.PwmAt20Kilohertz(TopologyKind.RcRamp);
        var variant = new SearchVariant(new SearchContext(requirement, stock), TopologyKind.RcRamp, 0, null, false);
        int[] divider = [variant.SlotOf(Roles.CmpRa), variant.SlotOf(Roles.CmpPot), variant.SlotOf(Roles.CmpRb)];
        double Value(int[] choice, int slot) => ((StockChoice)variant.Problem.Slots[slot].Options[choice[slot]].Tag!).Value;
        (double Top, double Bottom) Thresholds(int[] choice)
        {
            double ra = Value(choice, divider[0]), pot = Value(choice, divider[1]), rb = Value(choice, divider[2]);
            return ((rb + pot) / (ra + pot + rb), rb / (ra + pot + rb));
        }

        var random = new Random(17);
        double topFrom = double.PositiveInfinity, bottomTo = double.NegativeInfinity;
        for (var sample = 0; sample < 3000; sample++)
        {
            var choice = RandomChoice(variant, random);
            if (JudgeOrNull(requirement, variant, choice) is not { } judgement || !variant.ThresholdsLeaveComparatorRange(judgement))
                continue;
            Assert.Equal(divider.Order(), variant.ScopeOfCheck("input common-mode range (comparator)", judgement).Order());
            var (top, bottom) = Thresholds(choice);
            var (above, below) = variant.ThresholdsOutsideComparatorRange(top, bottom);
            Assert.True(above || below);
            if (above)
                topFrom = Math.Min(topFrom, top);
            if (below)
                bottomTo = Math.Max(bottomTo, bottom);
        }
        Assert.True(double.IsFinite(topFrom) && double.IsFinite(bottomTo), "both sides learnt");

        var checkedDesigns = 0;
        for (var sample = 0; sample < 3000; sample++)
        {
            var choice = RandomChoice(variant, random);
            var (top, bottom) = Thresholds(choice);
            if (!(top >= topFrom || bottom <= bottomTo) || JudgeOrNull(requirement, variant, choice) is not { } judgement)
                continue;
            Assert.False(judgement.Accepted);
            if (judgement.Evaluation.Figure(FigureNames.Frequency) is null)
                continue; // no oscillation, so no ramp to compare: rejected all the same
            Assert.Contains("input common-mode range (comparator)", judgement.FailedChecks);
            checkedDesigns++;
        }
        Assert.True(checkedDesigns > 100, $"only {checkedDesigns} designs checked");
    }

    /// <summary>
    /// The fact the integrator-input floor rests on, against the engine: with the square-wave generator held,
    /// a three-stage design that fails the oscillator's output-current check fails it with every smaller
    /// int.r too, whatever the integrator capacitor, feedback resistor and divider.
    /// </summary>
    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public void An_oscillator_short_of_current_stays_short_with_a_smaller_integrator_input(bool singleSupply)
    {
        var stock = SampledStock(2, 5, 4);
        var requirement = TestStock.PwmAt20Kilohertz(TopologyKind.ThreeStage) with
        {
            Supply = singleSupply ? Supply.SingleRail(24) : Supply.Symmetric(12),
        };
        var variant = new SearchVariant(new SearchContext(requirement, stock), TopologyKind.ThreeStage, 0, null, false);
        var intR = variant.SlotOf(Roles.IntR);
        var options = variant.Problem.Slots[intR].Options;
        double Value(int o) => ((StockChoice)options[o].Tag!).Value;
        var random = new Random(5);
        var failing = 0;
        for (var sample = 0; sample < 400 && failing < 40; sample++)
        {
            var choice = RandomChoice(variant, random);
            if (JudgeOrNull(requirement, variant, choice) is not { } judgement || !judgement.FailedChecks.Contains("output current (oscillator)"))
                continue;
            failing++;
            var at = Value(choice[intR]);
            foreach (var smaller in Enumerable.Range(0, options.Count).Where(o => Value(o) < at))
            {
                var trial = (int[])choice.Clone();
                trial[intR] = smaller;
                // The integrator's parts and the divider drawn afresh: only the generator is held.
                foreach (var role in RedrawnWithTheGenerator)
                    trial[variant.SlotOf(role)] = random.Next(variant.Problem.Slots[variant.SlotOf(role)].Options.Count);
                if (JudgeOrNull(requirement, variant, trial) is { } other)
                    Assert.Contains("output current (oscillator)", other.FailedChecks);
            }
        }
        Assert.True(failing >= 10, $"only {failing} designs short of current sampled");
    }

    /// <summary>
    /// Three-stage on low-value resistors, the cheapest first, where the oscillator's output (timing
    /// resistor, hysteresis divider and integrator input together) runs out of current: the branch and bound
    /// learns a floor under int.r from each such rejection and tries no value at or below it under the same
    /// generator. Checked against the tests' exhaustive reference on the cheapest cost, and the stock is
    /// shown to hold designs that fail on exactly that check.
    /// </summary>
    [Theory]
    [InlineData(4.5e3)]
    [InlineData(9e3)]
    public void The_integrator_input_floor_keeps_the_cheapest_design(double frequency)
    {
        var parts = new List<StockPart>
        {
            TestStock.Resistor("R-1K2", 1.2e3, 0.001m), TestStock.Resistor("R-1K5", 1.5e3, 0.002m),
            TestStock.Resistor("R-10K", 10e3, 0.003m), TestStock.Resistor("R-47K", 47e3, 0.004m),
            TestStock.Capacitor("C-10N", 10e-9, 0.02m), TestStock.Capacitor("C-470N", 470e-9, 0.03m),
            TestStock.Capacitor("C-100N", 100e-9, 0.02m, Dielectric.X7R),
            TestStock.Pot("P-10K", 10e3, 0.4m),
        };
        var stock = new Stock(parts, [TestStock.OpAmp("TL074", TestStock.QuadJfet, 0.35m)]);
        var requirement = TestStock.PwmAt20Kilohertz(TopologyKind.ThreeStage) with
        {
            Frequency = new Band(frequency, 0.3),
            Duty = new DutyRequirement(0.2, 0.8),
            BuildQuantity = 10,
            Costs = new CostModel(0m, 0m), // parts alone: the cheap low values are tried first
        };

        var reference = ExhaustiveReference.Cheapest(requirement, stock);
        var outcome = DesignSearch.Run(requirement, stock, new SearchOptions(TimeSpan.FromSeconds(600)));

        Assert.NotNull(reference);
        Assert.Equal(SearchStatus.Optimal, outcome.Status);
        Assert.Equal(reference.TotalBuildCost, outcome.Designs[0].Cost.TotalBuildCost);
        // The cheapest design with its integrator input at the lowest value fails on the oscillator's current.
        var best = outcome.Designs[0].Design;
        var loaded = best with { Roles = new Dictionary<string, RolePart>(best.Roles) { [Roles.IntR] = best.Roles[Roles.IntR] with { Value = 1.2e3 } } };
        Assert.Contains("output current (oscillator)", DesignJudge.Judge(requirement, loaded).FailedChecks);
    }

    [Fact]
    public void Buckets_are_exact_when_there_are_fewer_ratios_than_buckets()
    {
        var members = new List<(double X, double Low, double High)> { (0.5, 1, 1), (-0.2, 3, 3), (0.5, 1, 1), (0.1, 2, 2.5) };

        var buckets = FrequencyRelaxation.Bucketise([new LogTerm(0, -1), new LogTerm(1, 1)], members);

        Assert.Equal([(-0.2, -0.2), (0.1, 0.1), (0.5, 0.5)], buckets.Edges);
        Assert.Equal([3.0, 2.0, 1.0], buckets.Low);
        Assert.Equal([3.0, 2.5, 1.0], buckets.High);
    }

    /// <summary>
    /// A stockroom whose threshold divider is too large for a tuple group (73 resistors × 9 pots × 73),
    /// so a missed duty range is cut value by value. Every divider the cut leaves out is judged by the
    /// engine with the same ramp: each must miss the same end of the range.
    /// </summary>
    [Fact]
    public void A_duty_cut_without_a_divider_group_only_removes_dividers_that_fail_too()
    {
        var parts = E24Between(3, 6).Append(1e6)
            .Select((v, i) => TestStock.Resistor($"R{i:000}", v, 0.01m)).ToList();
        parts.Add(TestStock.Capacitor("C-1N0", 1e-9, 0.05m));
        parts.Add(TestStock.Capacitor("C-4N7", 4.7e-9, 0.05m));
        parts.AddRange(PotValues.Select((v, i) => TestStock.Pot($"P{i}", v, 0.4m)));
        var stock = new Stock(parts, [TestStock.OpAmp("TL074", TestStock.QuadJfet, 0.35m)]);
        var requirement = TestStock.PwmAt20Kilohertz(TopologyKind.ThreeStage) with { Frequency = new Band(2000, 0.1) };
        var variant = new SearchVariant(new SearchContext(requirement, stock), TopologyKind.ThreeStage, 0, null, false);
        Assert.Null(variant.Thresholds);

        int Option(string role, double value) => Enumerable.Range(0, variant.Problem.Slots[variant.SlotOf(role)].Options.Count)
            .Single(o => ((StockChoice)variant.Problem.Slots[variant.SlotOf(role)].Options[o].Tag!).Value == value);
        var choice = new int[variant.Problem.Slots.Count];
        // Oscillator about 2 kHz (1/(2·R·C·ln 3) with equal divider resistors), a ramp of about a volt.
        choice[variant.SlotOf(Roles.OscR)] = Option(Roles.OscR, 47e3);
        choice[variant.SlotOf(Roles.OscC)] = Option(Roles.OscC, 4.7e-9);
        choice[variant.SlotOf(Roles.OscR1)] = Option(Roles.OscR1, 10e3);
        choice[variant.SlotOf(Roles.OscR2)] = Option(Roles.OscR2, 10e3);
        choice[variant.SlotOf(Roles.IntR)] = Option(Roles.IntR, 470e3);
        choice[variant.SlotOf(Roles.IntC)] = Option(Roles.IntC, 4.7e-9);
        choice[variant.SlotOf(Roles.IntRf)] = Option(Roles.IntRf, 1e6);
        // A divider whose thresholds (−1.57 … −0.52 V) sit below the ramp's top: one end of the range is missed.
        choice[variant.SlotOf(Roles.CmpRa)] = Option(Roles.CmpRa, 120e3);
        choice[variant.SlotOf(Roles.CmpPot)] = Option(Roles.CmpPot, 10e3);
        choice[variant.SlotOf(Roles.CmpRb)] = Option(Roles.CmpRb, 100e3);

        var judgement = DesignJudge.Judge(requirement, variant.DesignOf(choice));
        Assert.True(judgement.Missed.Contains(MissedTarget.DutyRange), string.Join("; ", judgement.Reasons));
        var verdict = variant.Rejection(choice, judgement);
        Assert.NotNull(verdict.CutEscapeOptions);
        Assert.DoesNotContain(variant.SlotOf(Roles.CmpRa), verdict.CutSlots!);

        var divider = new[] { Roles.CmpRa, Roles.CmpPot, Roles.CmpRb }.Select(variant.SlotOf).ToArray();
        var escape = verdict.CutEscapeOptions!.ToHashSet();
        var random = new Random(11);
        var judged = 0;
        for (var trial = 0; trial < 3000 && judged < 150; trial++)
        {
            var other = (int[])choice.Clone();
            foreach (var slot in divider)
                other[slot] = random.Next(variant.Problem.Slots[slot].Options.Count);
            if (divider.Any(slot => escape.Contains((slot, other[slot]))))
                continue; // the cut lets this divider through
            var cut = DesignJudge.Judge(requirement, variant.DesignOf(other));
            Assert.False(cut.Accepted, "the cut removed a divider the engine accepts");
            if (judgement.MissesLowDuty)
                Assert.True(cut.MissesLowDuty);
            if (judgement.MissesHighDuty)
                Assert.True(cut.MissesHighDuty);
            judged++;
        }
        Assert.True(judged >= 20, $"only {judged} cut dividers judged");
    }

    [Fact]
    public void No_assignment_costs_less_than_its_variants_lower_bound()
    {
        var requirement = TestStock.PwmAt20Kilohertz();
        var context = new SearchContext(requirement, TestStock.Stockroom());
        var random = new Random(3);
        var variants = Enum.GetValues<TopologyKind>().SelectMany(t => VariantPlanner.Plan(context, t).Variants).ToList();
        Assert.NotEmpty(variants);
        foreach (var variant in variants)
        {
            var slots = variant.Problem.Slots;
            for (var trial = 0; trial < 300; trial++)
            {
                var choice = slots.Select(s => random.Next(s.Options.Count)).ToArray();
                Assert.True(variant.Problem.CostOf(choice).TotalBuildCost >= variant.LowerBound,
                    $"{variant.Describe()}: {variant.Problem.CostOf(choice).TotalBuildCost} below {variant.LowerBound}");
            }
        }
    }

    /// <summary>
    /// Two bounds read off the engine's slewing relaxation oscillator (RelaxationTiming.HalfPeriods): each
    /// half period is a whole edge t_e plus R·C times a non-negative log, so T ≥ 2·t_e; and an edge can only
    /// complete when R·C ≥ t_e·EdgeCompletesSharp (proved loosely for every β, sharply by bisection for
    /// β ≥ 1/2). Checked on random levels, ratios, time constants and slew rates.
    /// </summary>
    [Fact]
    public void Slewing_oscillator_bounds_hold_wherever_the_engine_finds_a_period()
    {
        var random = new Random(11);
        int periods = 0, nearEdge = 0;
        for (var trial = 0; trial < 200_000; trial++)
        {
            var high = 0.5 + 19.5 * random.NextDouble();
            var low = -(0.5 + 19.5 * random.NextDouble());
            var beta = 0.01 + 0.98 * random.NextDouble();
            var slew = Math.Pow(10, 4 + 4 * random.NextDouble());
            var edge = (high - low) / slew;
            var rc = edge * Math.Pow(10, -3 + 5 * random.NextDouble());
            var (up, down) = RelaxationTiming.HalfPeriods(rc, beta, high, low, slew);
            if (!double.IsFinite(up) || !double.IsFinite(down))
                continue;
            periods++;
            Assert.True(up + down >= 2 * edge * (1 - 1e-12), $"period {up + down} below two edges {2 * edge}");
            var least = edge * FrequencyRelaxation.EdgeCompletesSharp(beta, high, low);
            Assert.True(rc >= least * (1 - 1e-9), $"β {beta}, levels {high}/{low}: a period at R·C = {rc}, below the bound {least}");
            Assert.True(FrequencyRelaxation.EdgeCompletesSharp(beta, high, low) >= FrequencyRelaxation.EdgeCompletes(beta, high, low));
            if (rc < 1.01 * least)
                nearEdge++;
        }
        Assert.True(periods > 50_000, $"only {periods} periods");
        // The sharp bound is tight: periods exist within 1 % of it (for β ≥ 1/2 it is where D turns).
        Assert.True(nearEdge > 0, "no period within 1 % of the bound: it is not sharp");
    }

    /// <summary>
    /// The output current floors (the amplifier drives at least level/R into the timing resistor and the
    /// integrator's input resistor): on random assignments of every variant, a design whose output current
    /// checks all pass satisfies every floor.
    /// </summary>
    [Fact]
    public void Output_current_floors_hold_for_every_design_whose_current_checks_pass()
    {
        var requirement = TestStock.PwmAt20Kilohertz();
        var context = new SearchContext(requirement, TestStock.Stockroom());
        var random = new Random(5);
        var variants = Enum.GetValues<TopologyKind>().SelectMany(t => VariantPlanner.Plan(context, t).Variants).ToList();
        int passing = 0, floors = 0;
        foreach (var variant in variants)
        {
            var bounds = variant.Problem.Bounds.Where(b => b.Figure == "output current").ToList();
            floors += bounds.Count;
            for (var trial = 0; trial < 400; trial++)
            {
                var choice = RandomChoice(variant, random);
                if (JudgeOrNull(requirement, variant, choice) is not { } judgement)
                    continue;
                var waveform = judgement.Evaluation.Figure(FigureNames.Frequency) is { } f && double.IsFinite(f);
                if (!waveform || judgement.FailedChecks.Any(c => c.StartsWith("output current", StringComparison.Ordinal)))
                    continue;
                passing++;
                foreach (var bound in bounds)
                {
                    var slot = bound.Terms.Single().Index;
                    Assert.True(variant.Problem.Slots[slot].Options[choice[slot]].LogValue >= bound.Lower,
                        $"{variant.Describe()}: {variant.RoleNames[slot]} passes the engine's current check below its floor");
                }
            }
        }
        Assert.True(floors > 0 && passing > 100, $"{floors} floors, {passing} designs passing the current checks");
    }

    /// <summary>
    /// The search skips designs tied on cost whose forecast frequency error ranks them out, so the forecast
    /// must be the engine's own figure: on random designs of every variant (both supplies), it agrees with
    /// the frequency the engine reports wherever the engine finds one.
    /// </summary>
    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public void The_frequency_forecast_is_the_engines_frequency(bool singleSupply)
    {
        var requirement = TestStock.PwmAt20Kilohertz() with { Supply = singleSupply ? Supply.SingleRail(12) : Supply.Symmetric(12) };
        var context = new SearchContext(requirement, TestStock.Stockroom());
        var random = new Random(17);
        var compared = 0;
        foreach (var variant in Enum.GetValues<TopologyKind>().SelectMany(t => VariantPlanner.Plan(context, t).Variants))
        {
            var forecast = FrequencyForecast.For(variant);
            Assert.NotNull(forecast);
            for (var trial = 0; trial < 300; trial++)
            {
                var choice = variant.Slots.Select(s => random.Next(s.Options.Count)).ToArray();
                var design = variant.DesignOf(choice);
                double engine;
                try
                {
                    engine = CircuitAnalysis.Analyse(design, 2).Figure(FigureNames.Frequency) ?? double.NaN;
                }
                catch (DesignValidationException)
                {
                    continue;
                }
                if (!double.IsFinite(engine))
                    continue;
                var values = variant.Slots.Select(s => s.Options.Select(o => o.Tag is StockChoice c ? c.Value : double.NaN).ToArray()).ToArray();
                var predicted = forecast.Frequency(values, choice);
                Assert.True(Math.Abs(predicted - engine) <= 1e-12 * engine, $"{variant.Describe()}: forecast {predicted} Hz, engine {engine} Hz");
                compared++;
            }
        }
        Assert.True(compared > 500, $"only {compared} designs compared");
    }

    /// <summary>
    /// A stockroom to sample designs from: E24 resistors over whole decades, 1 nF, 10 nF and 100 nF C0G, the
    /// first <paramref name="pots"/> potentiometer values and one quad JFET op-amp.
    /// </summary>
    private static Stock SampledStock(int fromDecade, int toDecade, int pots)
    {
        var parts = E24Between(fromDecade, toDecade).Select((v, i) => TestStock.Resistor($"R{i:000}", v, 0.01m)).ToList();
        parts.AddRange(Enumerable.Range(-9, 3).Select(e => TestStock.Capacitor($"C{e}", Math.Pow(10, e), 0.05m)));
        parts.AddRange(PotValues.Take(pots).Select((v, i) => TestStock.Pot($"P{i}", v, 0.4m)));
        return new Stock(parts, [TestStock.OpAmp("TL074", TestStock.QuadJfet, 0.35m)]);
    }

    /// <summary>Every slot of the variant filled with a random option.</summary>
    private static int[] RandomChoice(SearchVariant variant, Random random) =>
        variant.Problem.Slots.Select(slot => random.Next(slot.Options.Count)).ToArray();

    /// <summary>The engine's verdict on a design of the variant; null when the engine refuses it as a design.</summary>
    private static DesignJudgement? JudgeOrNull(SearchRequirement requirement, SearchVariant variant, int[] choice)
    {
        try
        {
            return DesignJudge.Judge(requirement, variant.DesignOf(choice));
        }
        catch (DesignValidationException)
        {
            return null;
        }
    }
}
