using PartsOpt.Topologies;

namespace PartsOpt.Search;

/// <summary>
/// The frequency band (and for the loop the ramp amplitude's upper edge) as linear bounds on the logs of
/// the part values, from the engine's closed forms (REFERENCE.md), widened by <see cref="Margin"/> so the
/// model stays a relaxation: the exact engine has the last word on every design.
/// </summary>
/// <remarks>
/// Relaxation oscillator: R·C·k(β, L+, L−) + a·2·te ≤ T ≤ R·C·k + b·2·te, te = (L+ − L−)/SR one slewing
/// edge, k from the unequal-saturation times, a and b the edge multipliers of the exact slewing solution;
/// k depends on the divider's ratio (and with a single supply on the reference too), so it enters through
/// <see cref="RatioBuckets"/> over ln(r2/r1). Loop: T = (r1/r2)·Ri·Ci·g + c with g = (L+ − L−)(1/L+ − 1/L−)
/// and c the slewing edges and their shift of the ramp: separable in the logs, except that L± move with a
/// single supply's reference, which then enters through buckets over ln(bottom/top) of the reference pair.
/// </remarks>
internal static class FrequencyRelaxation
{
    /// <summary>Widening of every bound, in natural-log units (1 %): covers rounding and small model drift.</summary>
    public const double Margin = 0.01;

    /// <summary>
    /// Each slewing edge lengthens the relaxation oscillator's half period by at least half an edge time
    /// (proved in <see cref="RelaxationTiming.EdgeMultipliers"/>); the tighter (3 − β)/4 is checked only
    /// numerically, so the relaxation does not rely on it.
    /// </summary>
    public const double ProvedLowerEdgeMultiplier = 0.5;

    /// <summary>
    /// How far inside a strict limit a bound is drawn, in natural-log units (10 ppm): past the solver's
    /// rounding slack, so a ratio exactly at the limit (equal values, symmetric levels) is excluded.
    /// </summary>
    public const double StrictStep = 1e-5;

    /// <summary>Most buckets over the divider ratio; with fewer distinct ratios each bucket holds one and is exact.</summary>
    public const int MaxBuckets = 256;

    public sealed record Result(IReadOnlyList<RatioBuckets> Buckets, IReadOnlyList<LogBound> Bounds);

    public static Result For(SearchVariant variant, IReadOnlyList<SelectionSlot> slots)
    {
        var supply = variant.Prototype.Supply;
        var amp = variant.Prototype.Amplifier;
        var band = variant.Context.Requirement.Frequency;
        double periodMin = Math.Max(1 / band.Max, EdgeLimitedPeriod(variant.Prototype)), periodMax = 1 / band.Min;
        // The engine's edge check wants that period whatever the parts; the bounds below could lose it in
        // the slewing edges' slack (a slow comparator's edges are long), so a band ending below it is read here.
        if (periodMin > periodMax * (1 + 1e-9))
            return new Result([], [Impossible(FigureNames.Frequency)]);
        var edge = (supply.SpanV - amp.OutputHeadroomHighV - amp.OutputHeadroomLowV) / amp.SlewRateVPerS;
        var levels = new Levels(supply, amp);
        var bounds = new List<LogBound>();
        int Slot(string role) => variant.SlotOf(role);
        double Value(int slot, int option) => ((StockChoice)slots[slot].Options[option].Tag!).Value;

        var referenceSlots = supply.IsSingle ? new[] { Slot(Roles.RefRtop), Slot(Roles.RefRbottom) } : [];
        var referenceTuples = supply.IsSingle
            ? Pairs(slots[referenceSlots[0]].Options.Count, slots[referenceSlots[1]].Options.Count)
            : [[]];
        double ReferenceOf(int[] tuple) => supply.IsSingle
            ? supply.PositiveV * Value(referenceSlots[1], tuple[1]) / (Value(referenceSlots[0], tuple[0]) + Value(referenceSlots[1], tuple[1]))
            : 0;

        var buckets = new List<RatioBuckets>();
        if (variant.Topology is TopologyKind.ThreeStage or TopologyKind.RcRamp)
        {
            int r1 = Slot(Roles.OscR1), r2 = Slot(Roles.OscR2);
            var references = referenceTuples.Select(ReferenceOf).Distinct().Order().ToArray();
            // Each half period is one whole slewing edge plus R·C times a non-negative log
            // (RelaxationTiming.HalfPeriods), so no relaxation oscillator of this amplifier is faster than 1/(2·t_e).
            if (2 * edge > periodMax * (1 + 1e-9))
                bounds.Add(Impossible(FigureNames.Frequency));
            else if (SharedDividerBuckets(variant, slots, r1, r2, references, levels) is { } divider)
            {
                buckets.Add(divider.Buckets);
                // Each slewing edge must end before the capacitor reaches the other threshold, or no period
                // exists: R·C > t_e·(1 − β)·max(L+, −L−)/(L+ − L−) (see EdgeCompletes), a second factor over
                // the same ratio buckets.
                buckets.Add(divider.EdgeBuckets);
                bounds.Add(new LogBound("oscillator can switch",
                    [new LogTerm(Slot(Roles.OscR), 1), new LogTerm(Slot(Roles.OscC), 1), new LogTerm(1, -1, TermKind.Buckets)],
                    LogOrMinusInfinity(edge) - Margin, double.PositiveInfinity));
                // The slewing edges add between a·2·te and b·2·te to R·C·k (RelaxationTiming.EdgeMultipliers).
                // The largest b of any stocked divider bounds R·C·k from below; from above, a = 1/2, the proved
                // lower multiplier, keeps the bound a relaxation whatever the divider.
                bounds.Add(new LogBound(FigureNames.Frequency,
                    [new LogTerm(Slot(Roles.OscR), 1), new LogTerm(Slot(Roles.OscC), 1), new LogTerm(0, 1, TermKind.Buckets)],
                    LogOrMinusInfinity(periodMin - divider.UpperEdgeMultiplier * 2 * edge) - Margin,
                    LogOrMinusInfinity(periodMax - ProvedLowerEdgeMultiplier * 2 * edge) + Margin));
            }
            else
                bounds.Add(Impossible(FigureNames.Frequency));
        }
        else
        {
            // Loop: T = k·τ·g(ref) + c(ref); with a single supply g and c move with the reference pair.
            var dualGain = double.NaN; // ln g of the one reference a dual supply has
            var members = new List<(double X, double Low, double High)>();
            double cMin = double.PositiveInfinity, cMax = double.NegativeInfinity;
            foreach (var r in referenceTuples)
            {
                var (g, c) = levels.LoopFactors(ReferenceOf(r), edge);
                if (!supply.IsSingle)
                    dualGain = double.IsFinite(g) && g > 0 ? Math.Log(g) : double.NaN;
                if (double.IsFinite(g) && g > 0)
                {
                    (cMin, cMax) = (Math.Min(cMin, c), Math.Max(cMax, c));
                    if (supply.IsSingle)
                        members.Add((slots[referenceSlots[1]].Options[r[1]].LogValue - slots[referenceSlots[0]].Options[r[0]].LogValue,
                            Math.Log(g), Math.Log(g)));
                }
            }
            var terms = new List<LogTerm>
            {
                new(Slot(Roles.SchR1), 1), new(Slot(Roles.SchR2), -1), new(Slot(Roles.IntR), 1), new(Slot(Roles.IntC), 1),
            };
            if (supply.IsSingle && members.Count > 0)
            {
                // g depends on the reference only, and the reference on ln(bottom) − ln(top): bucketed.
                buckets.Add(Bucketise([new LogTerm(referenceSlots[0], -1), new LogTerm(referenceSlots[1], 1)], members));
                terms.Add(new LogTerm(0, 1, TermKind.Buckets));
            }
            var gainShift = supply.IsSingle ? 0 : dualGain;
            if (double.IsNaN(gainShift) || double.IsPositiveInfinity(cMin))
                bounds.Add(Impossible(FigureNames.Frequency));
            else
                bounds.Add(new LogBound(FigureNames.Frequency, terms,
                    LogOrMinusInfinity(periodMin - cMax) - gainShift - Margin,
                    LogOrMinusInfinity(periodMax - cMin) - gainShift + Margin));

            // The engine's switching checks on k = sch.r1/sch.r2, both failures: the Schmitt thresholds −k·L±
            // inside the swing (k < min(−L−/L+, L+/−L−), never above 1 whatever the reference), and hysteresis
            // k·(L+ − L−) at least HysteresisOffsets input offsets (L+ − L− does not move with the reference).
            var levelSwing = levels.HighRel(0) - levels.LowRel(0);
            var inside = supply.IsSingle ? 1 : Math.Min(-levels.LowRel(0) / levels.HighRel(0), levels.HighRel(0) / -levels.LowRel(0));
            var hysteresis = CircuitChecks.HysteresisOffsets * amp.InputOffsetV / levelSwing;
            bounds.Add(new LogBound("oscillator can switch", [new LogTerm(Slot(Roles.SchR1), 1), new LogTerm(Slot(Roles.SchR2), -1)],
                hysteresis > 0 ? Math.Log(hysteresis) - Margin : double.NegativeInfinity,
                // Strict: at k = the limit the ramp must reach the integrator's own rail, and no period exists.
                inside > 0 ? Math.Log(inside) - StrictStep : double.NegativeInfinity));

            if (variant.Context.Requirement.TrianglePeakToPeak is { } amplitude && !supply.IsSingle)
            {
                // Vpp = k·(L+ − L−) + (L+² + L−²)/(2·SR·τ) ≥ k·(L+ − L−): an upper edge on k alone.
                var swing = levels.HighRel(0) - levels.LowRel(0);
                bounds.Add(new LogBound(FigureNames.TrianglePeakToPeak,
                    [new LogTerm(Slot(Roles.SchR1), 1), new LogTerm(Slot(Roles.SchR2), -1)],
                    double.NegativeInfinity, Math.Log(amplitude.Max / swing) + Margin));
            }
        }

        // The output current checks: the amplifier's output drives at least level/R into the timing resistor
        // (max(L+ − βL−, βL+ − L−) ≥ max(L+, −L−)) and into the integrator's input resistor, level the larger
        // saturation level about the reference: a floor on each resistor alone, weakest reference taken.
        var leastLevel = referenceTuples.Select(ReferenceOf).Distinct()
            .Where(r => levels.HighRel(r) > 0 && levels.LowRel(r) < 0)
            .Select(r => Math.Max(levels.HighRel(r), -levels.LowRel(r)))
            .DefaultIfEmpty(double.NaN).Min();
        if (leastLevel > 0 && amp.MaxOutputCurrentA > 0 && double.IsFinite(amp.MaxOutputCurrentA))
        {
            string[] driven = variant.Topology switch
            {
                TopologyKind.ThreeStage => [Roles.OscR, Roles.IntR],
                TopologyKind.RcRamp => [Roles.OscR],
                _ => [Roles.IntR],
            };
            foreach (var role in driven)
                bounds.Add(new LogBound("output current", [new LogTerm(Slot(role), 1)],
                    Math.Log(leastLevel / amp.MaxOutputCurrentA) - Margin, double.PositiveInfinity));
        }

        return new Result(buckets, bounds);
    }

    private static (RatioBuckets Buckets, RatioBuckets EdgeBuckets, double UpperEdgeMultiplier)? SharedDividerBuckets(
        SearchVariant variant, IReadOnlyList<SelectionSlot> slots, int r1, int r2, IReadOnlyList<double> references, Levels levels)
    {
        // Variants are made on first use, by whichever thread searches them; the ratios are shared by all.
        var context = variant.Context;
        return context.DividerBuckets.GetOrAdd(variant.AmplifierIndex,
            _ => new Lazy<(RatioBuckets, RatioBuckets, double)?>(() => DividerBuckets(
                context.DividerRatios.GetOrAdd((slots[r1].Options, slots[r2].Options),
                    lists => new Lazy<DividerRatios>(() => Search.DividerRatios.Of(lists.Item1, lists.Item2))).Value,
                r1, r2, references, levels, levels.Amp.InputOffsetV))).Value;
    }

    /// <summary><see cref="DividerBuckets(DividerRatios, int, int, IReadOnlyList{double}, Levels, double)"/> of two slots' options.</summary>
    internal static (RatioBuckets Buckets, RatioBuckets EdgeBuckets, double UpperEdgeMultiplier)? DividerBuckets(
        IReadOnlyList<SelectionSlot> slots, int r1, int r2, IReadOnlyList<double> references, Levels levels, double offsetV) =>
        DividerBuckets(Search.DividerRatios.Of(slots[r1].Options, slots[r2].Options), r1, r2, references, levels, offsetV);

    /// <summary>
    /// The relaxation oscillator's period factor k(β, reference) bucketed over the divider ratio
    /// x = ln(r2) − ln(r1) (β = 1/(1 + e^(−x))), in at most <see cref="MaxBuckets"/> buckets of equal pair
    /// count (one ratio never split). k rises with β for any reference; for a fixed β it is symmetric in
    /// t = ln((ref − L−)/(L+ − ref)) and grows with |t|, so over the stocked references a pair's least k is
    /// at the reference nearest t = 0 and its greatest at one of the two extremes (with a dual supply there
    /// is one reference and the two agree). Pairs that cannot switch even about that most favourable
    /// reference are left out. Null when no stocked pair lets the oscillator switch.
    /// </summary>
    /// <remarks>
    /// Both factors are monotone in β over the ratios a bucket holds, so each bucket's least and greatest
    /// are read at its end ratios, not computed for every pair: k rises with β (each of its two logarithms
    /// does); the edge factor (<see cref="EdgeCompletes"/>, <see cref="EdgeCompletesSharp"/>) falls with β on
    /// each side of β = 1/2, where the sharp form takes over (see there), so a bucket across 1/2 is read at
    /// the last ratio below and the first at or above it too.
    /// </remarks>
    internal static (RatioBuckets Buckets, RatioBuckets EdgeBuckets, double UpperEdgeMultiplier)? DividerBuckets(
        DividerRatios ratios, int r1, int r2, IReadOnlyList<double> references, Levels levels, double offsetV)
    {
        // References where both levels lie on either side: the only ones an oscillator can switch about.
        var usable = references.Where(r => levels.HighRel(r) > 0 && levels.LowRel(r) < 0).ToArray();
        if (usable.Length == 0)
            return null;
        var centre = usable.MinBy(r => Math.Abs(Math.Log(-levels.LowRel(r) / levels.HighRel(r))));
        double Factor(double beta, double reference) => Math.Log(levels.PeriodFactor(beta, reference, 0));
        double EdgeFactor(double beta) => Math.Log(usable.Length == 1
            // max(L+, −L−) is least about the centre reference, where the loose bound is weakest; with one
            // reference (a dual supply) the sharp bound holds for β ≥ 1/2.
            ? EdgeCompletesSharp(beta, levels.HighRel(centre), levels.LowRel(centre))
            : EdgeCompletes(beta, levels.HighRel(centre), levels.LowRel(centre)));
        static double Beta(double x) => 1 / (1 + Math.Exp(-x));

        // The ratios whose pairs can switch: the offset condition is most lenient about the centre
        // reference, where min(L+, −L−) is largest; hysteresis β·(L+ − L−) below HysteresisOffsets input
        // offsets fails the engine's check too.
        var kept = new List<int>();
        var pairs = 0L;
        for (var i = 0; i < ratios.Ratios.Length; i++)
        {
            var beta = Beta(ratios.Ratios[i]);
            if (!double.IsFinite(levels.PeriodFactor(beta, centre, offsetV))
                || beta * (levels.HighRel(centre) - levels.LowRel(centre)) < CircuitChecks.HysteresisOffsets * offsetV * (1 - 1e-9))
                continue;
            kept.Add(i);
            pairs += ratios.Pairs[i];
        }
        if (kept.Count == 0)
            return null;

        var edges = new List<(double Low, double High)>();
        var low = new List<double>();
        var high = new List<double>();
        var edgeLow = new List<double>();
        var edgeHigh = new List<double>();
        var per = (pairs + MaxBuckets - 1) / MaxBuckets;
        for (var first = 0; first < kept.Count;)
        {
            // As many pairs as `per` from here, then to the end of the ratio the last of them has.
            var last = first;
            for (var taken = (long)ratios.Pairs[kept[first]]; taken < per && last + 1 < kept.Count;)
                taken += ratios.Pairs[kept[++last]];
            double xLow = ratios.Ratios[kept[first]], xHigh = ratios.Ratios[kept[last]];
            double betaLow = Beta(xLow), betaHigh = Beta(xHigh);
            edges.Add((xLow, xHigh));
            low.Add(Factor(betaLow, centre));
            high.Add(Math.Max(Factor(betaHigh, usable[0]), Factor(betaHigh, usable[^1])));
            var ends = new List<double> { betaLow, betaHigh };
            if (betaLow < 0.5 && betaHigh >= 0.5)
            {
                var split = first;
                while (Beta(ratios.Ratios[kept[split + 1]]) < 0.5)
                    split++;
                ends.Add(Beta(ratios.Ratios[kept[split]]));
                ends.Add(Beta(ratios.Ratios[kept[split + 1]]));
            }
            var edgeFactors = ends.Select(EdgeFactor).ToList();
            edgeLow.Add(edgeFactors.Min());
            edgeHigh.Add(edgeFactors.Max());
            first = last + 1;
        }
        // The edge multiplier b falls as β rises and, for a fixed β, is greatest at an extreme reference.
        var betaMin = Beta(ratios.Ratios[kept[0]]);
        var upper = new[] { usable[0], usable[^1], centre }
            .Select(r => RelaxationTiming.EdgeMultipliers(betaMin, levels.HighRel(r), levels.LowRel(r)).Upper)
            .Where(double.IsFinite)
            .Append(1.0)
            .Max();
        IReadOnlyList<LogTerm> ratio = [new LogTerm(r1, -1), new LogTerm(r2, 1)];
        return (new RatioBuckets(ratio, edges, low, high), new RatioBuckets(ratio, edges, edgeLow, edgeHigh), upper);
    }

    /// <summary>
    /// The least R·C/t_e at which both slewing edges of the relaxation oscillator can complete: with
    /// u = t_e/(R·C) and x = 1 − e^(−u), the engine's half period exists only when
    /// D = β·S − S·(u − x)/u + (1 − β)·near·x &gt; 0 (S = L+ − L−, near + far = S), that is
    /// x·(S/u + (1 − β)·near) &gt; (1 − β)·S; with x ≤ 1 this needs S/u &gt; (1 − β)·far, so
    /// R·C &gt; t_e·(1 − β)·far/S for far = L+ and far = −L−. Proved, not sharp (loose where β nears 1).
    /// </summary>
    internal static double EdgeCompletes(double beta, double levelHigh, double levelLow) =>
        (1 - beta) * Math.Max(levelHigh, -levelLow) / (levelHigh - levelLow);

    /// <summary>
    /// A sharper <see cref="EdgeCompletes"/> for β ≥ 1/2: 1/u* with u* the edge length (in time constants)
    /// beyond which D ≤ 0 for one of the half periods. With c = (1 − β)·near, q(u) = x·(S/u + c) falls
    /// with u when c &lt; S/2 (q′ &lt; 0 ⟺ c·u² &lt; S·(e^u − 1 − u), and e^u − 1 − u ≥ u²/2), which holds for
    /// β ≥ 1/2 since near &lt; S; q(0+) = S &gt; (1 − β)·S and q(∞) = c &lt; (1 − β)·S, so D &gt; 0 exactly for
    /// u &lt; u*, found by bisection and rounded up (the bound stays a relaxation). Below β = 1/2 the
    /// proved loose bound.
    /// </summary>
    internal static double EdgeCompletesSharp(double beta, double levelHigh, double levelLow)
    {
        var loose = EdgeCompletes(beta, levelHigh, levelLow);
        if (beta < 0.5)
            return loose;
        var swing = levelHigh - levelLow;
        double Crossing(double near)
        {
            var c = (1 - beta) * near;
            var target = (1 - beta) * swing;
            bool Completes(double u) => -Accurate.ExpM1(-u) * (swing / u + c) > target;
            double low = 1e-12, high = 1;
            while (Completes(high) && high < 1e12)
                high *= 2;
            for (var i = 0; i < 200 && high - low > 1e-12 * high; i++)
            {
                var mid = 0.5 * (low + high);
                if (Completes(mid))
                    low = mid;
                else
                    high = mid;
            }
            return high * (1 + 1e-9);
        }
        var limit = Math.Min(Crossing(levelHigh), Crossing(-levelLow));
        return Math.Max(loose, 1 / limit);
    }

    /// <summary>
    /// Sorts members by their ratio and cuts them into at most <see cref="MaxBuckets"/> buckets of equal count
    /// (equal ratios never split), each bucket bounded by the least and greatest factor of its members. With
    /// no more distinct ratios than buckets, each bucket holds one ratio and the bounds are exact.
    /// </summary>
    internal static RatioBuckets Bucketise(IReadOnlyList<LogTerm> ratio, List<(double X, double Low, double High)> members)
    {
        members.Sort((p, q) => p.X.CompareTo(q.X));
        var edges = new List<(double Low, double High)>();
        var low = new List<double>();
        var high = new List<double>();
        var per = (members.Count + MaxBuckets - 1) / MaxBuckets;
        for (var i = 0; i < members.Count;)
        {
            var j = Math.Min(i + per, members.Count) - 1;
            while (j + 1 < members.Count && members[j + 1].X == members[j].X)
                j++;
            edges.Add((members[i].X, members[j].X));
            double least = double.PositiveInfinity, greatest = double.NegativeInfinity;
            for (var k = i; k <= j; k++)
                (least, greatest) = (Math.Min(least, members[k].Low), Math.Max(greatest, members[k].High));
            low.Add(least);
            high.Add(greatest);
            i = j + 1;
        }
        return new RatioBuckets(ratio, edges, low, high);
    }

    /// <summary>
    /// The shortest period the engine's edge check lets pass: rise plus fall of the comparator output
    /// (full swing over its slew rate) within <see cref="CircuitChecks.EdgeShareOfPeriod"/> of the period.
    /// </summary>
    private static double EdgeLimitedPeriod(CircuitDesign design)
    {
        var part = design.ComparatorPart;
        var high = part.IsOpenDrain ? design.Supply.PositiveV : design.Supply.PositiveV - part.OutputHeadroomHighV;
        var low = design.Supply.NegativeV + part.OutputHeadroomLowV;
        return 2 * (high - low) / part.SlewRateVPerS / CircuitChecks.EdgeShareOfPeriod * (1 - 1e-9);
    }

    private static LogBound Impossible(string figure) => new(figure, [], 1, 0);

    /// <summary>ln x, or −∞ when x ≤ 0 (a lower edge that binds nothing, an upper edge nothing meets).</summary>
    private static double LogOrMinusInfinity(double x) => x > 0 ? Math.Log(x) : double.NegativeInfinity;

    private static List<int[]> Pairs(int first, int second)
    {
        var pairs = new List<int[]>(first * second);
        for (var a = 0; a < first; a++)
            for (var b = 0; b < second; b++)
                pairs.Add([a, b]);
        return pairs;
    }

    /// <summary>Saturation levels of the amplifier relative to a reference voltage.</summary>
    internal readonly record struct Levels(Supply Supply, OpAmpSpec Amp)
    {
        public double HighRel(double referenceV) => Supply.PositiveV - Amp.OutputHeadroomHighV - referenceV;

        public double LowRel(double referenceV) => Supply.NegativeV + Amp.OutputHeadroomLowV - referenceV;

        /// <summary>
        /// k with T = R·C·k + edges: ln((L+ − βL−)/((1−β)L+)) + ln((L− − βL+)/((1−β)L−)); NaN when the
        /// oscillator cannot switch (thresholds not inside the swing by more than the offset).
        /// </summary>
        public double PeriodFactor(double beta, double referenceV, double offsetV)
        {
            double lp = HighRel(referenceV), lm = LowRel(referenceV);
            if (!(lp > 0 && lm < 0) || (1 - beta) * Math.Min(lp, -lm) < offsetV * (1 - 1e-9))
                return double.NaN;
            var k = Math.Log((lp - beta * lm) / ((1 - beta) * lp)) + Math.Log((lm - beta * lp) / ((1 - beta) * lm));
            return double.IsFinite(k) && k > 0 ? k : double.NaN;
        }

        /// <summary>g and c of the loop's T = k·τ·g + c (edges and their shift of the ramp included).</summary>
        public (double Gain, double Constant) LoopFactors(double referenceV, double edge)
        {
            double lp = HighRel(referenceV), lm = LowRel(referenceV);
            if (!(lp > 0 && lm < 0))
                return (double.NaN, double.NaN);
            var gain = (lp - lm) * (1 / lp - 1 / lm);
            var shiftTimesTau = -edge * (lp + lm) / 2;
            return (gain, shiftTimesTau * (1 / lp + 1 / lm) + 2 * edge);
        }
    }
}
