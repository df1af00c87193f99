using PartsOpt.Topologies;

namespace PartsOpt.Search;

/// <summary>
/// The frequency band (and for the loop the ramp amplitude's upper edge) as linear bounds on the logs of
/// the part values, from the engine's closed forms (REFERENCE.md), widened by <see cref="Margin"/> so the
/// model stays a relaxation: the exact engine has the last word on every design.
/// </summary>
/// <remarks>
/// Relaxation oscillator: R·C·k(β, L+, L−) + a·2·te ≤ T ≤ R·C·k + b·2·te, te = (L+ − L−)/SR one slewing
/// edge, k from the unequal-saturation times, a and b the edge multipliers of the exact slewing solution; k depends on the divider pair (and with a single supply on the reference
/// pair too), so it enters through a tuple group. Loop: T = (r1/r2)·Ri·Ci·g + c with g = (L+ − L−)(1/L+ −
/// 1/L−) and c the slewing edges and their shift of the ramp: separable in the logs, except that L± move
/// with a single supply's reference, which then enters through a group over the reference pair.
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

    /// <summary>Largest tuple group built; past it the bound is left out (sound, only slower).</summary>
    public const int MaxTuples = 40_000;

    public sealed record Result(IReadOnlyList<TupleGroup> Groups, IReadOnlyList<LogBound> Bounds);

    public static Result For(SearchVariant variant, IReadOnlyList<SelectionSlot> slots)
    {
        var supply = variant.Prototype.Supply;
        var amp = variant.Prototype.Amplifier;
        var band = variant.Context.Requirement.Frequency;
        double periodMin = Math.Max(1 / band.Max, EdgeLimitedPeriod(variant.Prototype)), periodMax = 1 / band.Min;
        var edge = (supply.SpanV - amp.OutputHeadroomHighV - amp.OutputHeadroomLowV) / amp.SlewRateVPerS;
        var levels = new Levels(supply, amp);
        var groups = new List<TupleGroup>();
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

        if (variant.Topology is TopologyKind.ThreeStage or TopologyKind.RcRamp)
        {
            int r1 = Slot(Roles.OscR1), r2 = Slot(Roles.OscR2);
            var dividerTuples = Pairs(slots[r1].Options.Count, slots[r2].Options.Count);
            if ((long)dividerTuples.Count * referenceTuples.Count <= MaxTuples)
            {
                var tuples = new List<int[]>();
                var logs = new List<double>();
                // The slewing edges add between a·2·te and b·2·te to R·C·k (RelaxationTiming.EdgeMultipliers).
                // The largest b of any tuple bounds R·C·k from below; from above, a = 1/2, the proved lower
                // multiplier, keeps the bound a relaxation whatever the tuple.
                var upperMultiplier = 1.0;
                foreach (var d in dividerTuples)
                    foreach (var r in referenceTuples)
                    {
                        var beta = Value(r2, d[1]) / (Value(r1, d[0]) + Value(r2, d[1]));
                        var reference = ReferenceOf(r);
                        tuples.Add([.. d, .. r]);
                        logs.Add(Math.Log(levels.PeriodFactor(beta, reference, amp.InputOffsetV)));
                        var (_, upper) = RelaxationTiming.EdgeMultipliers(beta, levels.HighRel(reference), levels.LowRel(reference));
                        if (double.IsFinite(upper))
                            upperMultiplier = Math.Max(upperMultiplier, upper);
                    }
                groups.Add(new TupleGroup([r1, r2, .. referenceSlots], tuples, logs));
                bounds.Add(new LogBound(FigureNames.Frequency,
                    [new LogTerm(Slot(Roles.OscR), 1), new LogTerm(Slot(Roles.OscC), 1), new LogTerm(0, 1, IsGroup: true)],
                    LogOrMinusInfinity(periodMin - upperMultiplier * 2 * edge) - Margin,
                    LogOrMinusInfinity(periodMax - ProvedLowerEdgeMultiplier * 2 * edge) + Margin));
            }
        }
        else if (referenceTuples.Count <= MaxTuples)
        {
            // Loop: T = k·τ·g(ref) + c(ref); with a single supply g and c move with the reference pair.
            var gains = new List<double>();
            double cMin = double.PositiveInfinity, cMax = double.NegativeInfinity;
            foreach (var r in referenceTuples)
            {
                var (g, c) = levels.LoopFactors(ReferenceOf(r), edge);
                gains.Add(double.IsFinite(g) && g > 0 ? Math.Log(g) : double.NaN);
                if (double.IsFinite(g) && g > 0)
                    (cMin, cMax) = (Math.Min(cMin, c), Math.Max(cMax, c));
            }
            var terms = new List<LogTerm>
            {
                new(Slot(Roles.SchR1), 1), new(Slot(Roles.SchR2), -1), new(Slot(Roles.IntR), 1), new(Slot(Roles.IntC), 1),
            };
            if (supply.IsSingle)
            {
                groups.Add(new TupleGroup(referenceSlots, referenceTuples, gains));
                terms.Add(new LogTerm(0, 1, IsGroup: true));
            }
            var gainShift = supply.IsSingle ? 0 : gains[0];
            if (double.IsNaN(gainShift) || double.IsPositiveInfinity(cMin))
                bounds.Add(Impossible(FigureNames.Frequency));
            else
                bounds.Add(new LogBound(FigureNames.Frequency, terms,
                    LogOrMinusInfinity(periodMin - cMax) - gainShift - Margin,
                    LogOrMinusInfinity(periodMax - cMin) - gainShift + Margin));

            if (variant.Context.Requirement.TrianglePeakToPeak is { } amplitude && !supply.IsSingle)
            {
                // Vpp = k·(L+ − L−) + (L+² + L−²)/(2·SR·τ) ≥ k·(L+ − L−): an upper edge on k alone.
                var swing = levels.HighRel(0) - levels.LowRel(0);
                bounds.Add(new LogBound(FigureNames.TrianglePeakToPeak,
                    [new LogTerm(Slot(Roles.SchR1), 1), new LogTerm(Slot(Roles.SchR2), -1)],
                    double.NegativeInfinity, Math.Log(amplitude.Max / swing) + Margin));
            }
        }

        return new Result(groups, bounds);
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
