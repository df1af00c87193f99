namespace PartsOpt.Topologies;

/// <summary>
/// A whole period of a ramp as up to six monotonic pieces in time order, held inline so the figure model
/// stays allocation-free. Built either from two straight pieces (the loop) or as the periodic response of a
/// first-order stage to the square-wave generator's trapezoid (<see cref="Driven"/>).
/// </summary>
internal struct RampPieces
{
    private Six _pieces;
    public int Count;
    public double MaxV, MinV;

    /// <summary>
    /// Six pieces inline. An inline array rather than six fields behind a switch, so the pieces are read
    /// by reference: the loops over them below copied a 56-byte piece per access and dominated the
    /// evaluation's cost.
    /// </summary>
    [System.Runtime.CompilerServices.InlineArray(6)]
    private struct Six
    {
        private RampSegment _first;
    }

    [System.Diagnostics.CodeAnalysis.UnscopedRef]
    public readonly ref readonly RampSegment this[int i] => ref _pieces[Math.Min(i, 5)];

    public void Add(in RampSegment piece)
    {
        if (piece.DurationS <= 0)
            return;
        _pieces[Math.Min(Count++, 5)] = piece;
    }

    /// <summary>
    /// Time per period above <paramref name="thresholdV"/>. A crossing of a plain exponential piece is at
    /// τ·log1p(q), q = (v0 − V)/(V − A) &gt; 0 (<see cref="RampSegment.TimeAbove"/>); the crossings of pieces
    /// sharing one τ (every piece of a driven ramp) are summed inside a single log1p, by
    /// log1p(a) + log1p(b) = log1p(a + b + a·b) and log1p(a) − log1p(b) = log1p((a − b)/(1 + b)) (the time
    /// above a rising piece is its duration less its crossing), so a threshold crossed twice costs one
    /// logarithm. Both forms keep log1p's absolute precision: no 1 + q is formed before the logarithm.
    /// </summary>
    public readonly double TimeAbove(double thresholdV)
    {
        double sum = 0, combined = 0, combinedTauS = double.NaN;
        for (var i = 0; i < Count; i++)
        {
            ref readonly var piece = ref this[i];
            var rising = piece.EndV > piece.StartV;
            var inside = rising
                ? thresholdV > piece.StartV && thresholdV < piece.EndV
                : thresholdV < piece.StartV && thresholdV > piece.EndV;
            if (inside && piece.SlopeVPerS == 0 && double.IsFinite(piece.TauS)
                && (double.IsNaN(combinedTauS) || piece.TauS == combinedTauS))
            {
                combinedTauS = piece.TauS;
                var q = (piece.StartV - thresholdV) / (thresholdV - piece.TargetV);
                if (rising)
                {
                    sum += piece.DurationS;
                    combined = (combined - q) / (1 + q);
                }
                else
                {
                    combined += q + combined * q;
                }
            }
            else
            {
                sum += piece.TimeAbove(thresholdV);
            }
        }

        return double.IsNaN(combinedTauS) ? sum : sum + combinedTauS * Accurate.Log1P(combined);
    }

    /// <summary>
    /// Periodic steady state of v′ = (gain·w(t) − v)/τ for the trapezoid w: from L+ (at the start, the
    /// falling trip) down at −SR for <paramref name="edgeS"/>, held at L− for <paramref name="lowHeldS"/>,
    /// up at +SR for <paramref name="edgeS"/>, held at L+ for <paramref name="highHeldS"/>. Each phase has
    /// the exact solution of <see cref="RampSegment"/>; the start value is <paramref name="startV"/> when
    /// given, else the periodic one, v0 = c/(1 − e^(−T/τ)) with c the end value of a period started at 0.
    /// Turning points inside an edge (where v = gain·w(t) + slope·τ·… meets v′ = 0) are at
    /// e^(−t/τ) = B·τ/(v0 − A + B·τ), in closed form; the phases are split there.
    /// </summary>
    public static RampPieces Driven(double gain, double tauS, double levelHigh, double levelLow,
        double edgeS, double lowHeldS, double highHeldS, double startV = double.NaN)
    {
        var pieces = default(RampPieces);
        pieces.FillDriven(gain, tauS, levelHigh, levelLow, edgeS, lowHeldS, highHeldS, startV);
        return pieces;
    }

    /// <summary>
    /// <see cref="Driven"/> written in place (over whatever was here), so a caller that keeps the pieces
    /// in a larger struct does not copy them.
    /// </summary>
    public void FillDriven(double gain, double tauS, double levelHigh, double levelLow,
        double edgeS, double lowHeldS, double highHeldS, double startV = double.NaN)
    {
        var slew = edgeS > 0 ? (levelHigh - levelLow) / edgeS : 0;
        // Each phase's exponential depends only on its duration, and the two edges share one: three per
        // period, computed once here for both the periodic start and the pieces.
        var edge = new Decay(edgeS, tauS);
        var lowHeld = new Decay(lowHeldS, tauS);
        var highHeld = new Decay(highHeldS, tauS);
        var v0 = startV;
        if (double.IsNaN(v0))
        {
            var c = 0.0;
            c = edge.End(c, gain * levelHigh, -gain * slew, tauS);
            c = lowHeld.End(c, gain * levelLow, 0, tauS);
            c = edge.End(c, gain * levelLow, gain * slew, tauS);
            c = highHeld.End(c, gain * levelHigh, 0, tauS);
            // 1 − e^(−T/τ) from the phases' own: 1 − e^(−a−b) = x_a + x_b − x_a·x_b, all terms of one sign
            // (no cancellation), so no fourth exponential.
            var x = Decay.Join(Decay.Join(Decay.Join(edge.X, lowHeld.X), edge.X), highHeld.X);
            v0 = c / x;
        }

        Count = 0;
        MaxV = double.NegativeInfinity;
        MinV = double.PositiveInfinity;
        var v = v0;
        v = Phase(v, gain * levelHigh, -gain * slew, edge, tauS);
        v = Phase(v, gain * levelLow, 0, lowHeld, tauS);
        v = Phase(v, gain * levelLow, gain * slew, edge, tauS);
        Phase(v, gain * levelHigh, 0, highHeld, tauS);
    }

    /// <summary>
    /// The relaxation oscillator's capacitor, written in place: <see cref="Driven"/> with gain 1 from the
    /// falling trip at <paramref name="tripHighV"/> (β·L+), its held phases ending exactly at the trip
    /// points β·L− and β·L+, since the half periods are the times at which it reaches them
    /// (<see cref="RelaxationTiming.HalfPeriods(double, double, double, double, double)"/>). So the held
    /// phases need no exponential, and the edges' own factors come from the half periods' computation.
    /// </summary>
    public void FillRelaxation(double tauS, double levelHigh, double levelLow, double edgeS, double lowHeldS,
        double highHeldS, double tripHighV, double tripLowV, double edgeX, double edgeExcess)
    {
        var slew = edgeS > 0 ? (levelHigh - levelLow) / edgeS : 0;
        var edge = new Decay(edgeS, edgeX, edgeExcess);
        Count = 0;
        MaxV = double.NegativeInfinity;
        MinV = double.PositiveInfinity;
        var v = Phase(tripHighV, levelHigh, -slew, edge, tauS);
        Phase(v, tripLowV, levelLow, 0, lowHeldS, tauS);
        v = Phase(tripLowV, levelLow, slew, edge, tauS);
        Phase(v, tripHighV, levelHigh, 0, highHeldS, tauS);
    }

    /// <summary>
    /// The exponential factors of one phase of duration d: x = 1 − e^(−u) and the excess u − x, u = d/τ.
    /// A phase's end is linear in its start value given these, so they are computed once per duration.
    /// </summary>
    private readonly struct Decay
    {
        public readonly double DurationS, X, Excess;

        public Decay(double durationS, double tauS)
        {
            DurationS = durationS;
            var u = durationS / tauS;
            X = -Accurate.ExpM1(-u);
            Excess = RelaxationTiming.ExcessOverChord(u, X);
        }

        /// <summary>The factors of a phase whose x = 1 − e^(−u) and u − x the caller has already.</summary>
        public Decay(double durationS, double x, double excess)
        {
            DurationS = durationS;
            X = x;
            Excess = excess;
        }

        /// <summary>The value at the phase's end from <paramref name="v"/> (unchanged for an empty phase).</summary>
        public double End(double v, double target, double slope, double tauS) =>
            DurationS <= 0 ? v : v + (target - v) * X + slope * tauS * Excess;

        /// <summary>1 − e^(−a−b) from x_a = 1 − e^(−a) and x_b = 1 − e^(−b).</summary>
        public static double Join(double xa, double xb) => xa + xb - xa * xb;
    }

    /// <summary>
    /// Largest distance between the ramp and the chords through its turning points, as a fraction of the
    /// peak-to-peak, the larger of the falling and rising runs. On each piece the distance is largest where
    /// its slope equals the chord's, e^(−t/τ) = (s − B)/((A − v0)/τ − B), in closed form.
    /// </summary>
    public readonly double LinearityError()
    {
        var swing = MaxV - MinV;
        if (!(swing > 0))
            return 0;
        double fallS = 0, riseS = 0;
        for (var i = 0; i < Count; i++)
        {
            if (this[i].EndV < this[i].StartV) fallS += this[i].DurationS;
            else riseS += this[i].DurationS;
        }

        // The falling run starts at the first falling piece after a rising one (cyclically).
        var first = 0;
        for (var i = 0; i < Count; i++)
        {
            // Cyclic neighbours by a compare, not %: an integer division per step was a visible cost here.
            ref readonly var prev = ref this[i == 0 ? Count - 1 : i - 1];
            if (this[i].EndV < this[i].StartV && prev.EndV >= prev.StartV)
                first = i;
        }

        double worst = 0, elapsedFall = 0, elapsedRise = 0, fallSlope = -swing / fallS, riseSlope = swing / riseS;
        for (var k = 0; k < Count; k++)
        {
            var index = first + k < Count ? first + k : first + k - Count;
            ref readonly var piece = ref this[index];
            var falling = piece.EndV < piece.StartV;
            var chordStart = falling ? MaxV : MinV;
            var elapsed = falling ? elapsedFall : elapsedRise;
            var chordSlope = falling ? fallSlope : riseSlope;
            if (MayMeetChordSlope(piece, this[index + 1 < Count ? index + 1 : 0], chordSlope))
                worst = Math.Max(worst, Math.Abs(Deviation(piece, chordStart, chordSlope, elapsed)));
            if (falling) elapsedFall += piece.DurationS;
            else elapsedRise += piece.DurationS;
        }

        return worst / swing;
    }

    /// <summary>
    /// Whether an exponential piece's slope can equal the chord's somewhere inside it, the only place the
    /// distance can have its extremum. On such a piece the slope runs monotonically from its start slope
    /// to its end slope, and the end slope is the next piece's start slope: the ramp's slope is continuous
    /// because the stage's input is (and the last piece's end slope is the first's start slope, since every
    /// ramp analysed is a steady state, periodic). False only when both lie on the same side of the chord's slope by a
    /// margin far above their rounding, so a meeting at a piece boundary is still looked for on both sides;
    /// always true next to a straight or parabolic piece. Spares most pieces a logarithm.
    /// </summary>
    private static bool MayMeetChordSlope(in RampSegment piece, in RampSegment next, double chordSlope)
    {
        if (double.IsPositiveInfinity(piece.TauS) || double.IsPositiveInfinity(next.TauS))
            return true;
        var margin = 1e-9 * Math.Abs(chordSlope);
        double atStart = piece.StartSlope - chordSlope, atEnd = next.StartSlope - chordSlope;
        return !((atStart > margin && atEnd > margin) || (atStart < -margin && atEnd < -margin));
    }

    private static double Deviation(in RampSegment piece, double chordStart, double chordSlope, double elapsedS)
    {
        if (double.IsPositiveInfinity(piece.TauS))
        {
            // Parabola: slope s0 + c·t meets the chord's at t = (s − s0)/c; a straight piece lies on it.
            if (piece.CurvatureVPerS2 == 0)
                return 0;
            var at = (chordSlope - piece.SlopeVPerS) / piece.CurvatureVPerS2;
            if (!(at > 0 && at < piece.DurationS))
                return 0;
            var value = piece.StartV + at * (piece.SlopeVPerS + 0.5 * piece.CurvatureVPerS2 * at);
            return value - (chordStart + chordSlope * (elapsedS + at));
        }

        // x = 1 − e^(−t/τ) there, formed directly as a quotient so that it keeps its digits when small;
        // knowing it, the value needs only the logarithm for t, not another exponential.
        var startSlope = piece.StartSlope;
        var x = (startSlope - chordSlope) / (startSlope - piece.SlopeVPerS);
        if (!(x >= 0 && x < 1))
            return 0;
        var u = -Accurate.Log1P(-x);
        var t = piece.TauS * u;
        if (!(t < piece.DurationS))
            return 0;
        return piece.ValueAt(u, x) - (chordStart + chordSlope * (elapsedS + t));
    }

    /// <summary>
    /// The ideal integrator's triangle, v′ = −w(t)/τi, over the same trapezoid, from <paramref name="startV"/>
    /// at the falling trip: parabolas during the edges (split where w crosses the reference, the turning
    /// points), straight lines while the input is held.
    /// </summary>
    public static RampPieces Integrated(double tauIS, double levelHigh, double levelLow, double edgeS,
        double lowHeldS, double highHeldS, double startV)
    {
        var slew = edgeS > 0 ? (levelHigh - levelLow) / edgeS : 0;
        var pieces = new RampPieces { MaxV = double.NegativeInfinity, MinV = double.PositiveInfinity };
        var v = pieces.EdgeParabola(startV, -levelHigh / tauIS, slew / tauIS, levelHigh / slew, edgeS);
        v = pieces.Straight(v, -levelLow / tauIS, lowHeldS);
        v = pieces.EdgeParabola(v, -levelLow / tauIS, -slew / tauIS, -levelLow / slew, edgeS);
        pieces.Straight(v, -levelHigh / tauIS, highHeldS);
        return pieces;
    }

    private double EdgeParabola(double v, double startSlope, double curvature, double turnS, double durationS)
    {
        if (!(durationS > 0))
            return v;
        Extend(v);
        if (turnS > 0 && turnS < durationS)
        {
            var first = RampSegment.Parabola(v, turnS, startSlope, curvature);
            Add(first);
            Extend(first.EndV);
            v = first.EndV;
            durationS -= turnS;
            startSlope = 0;
        }

        var rest = RampSegment.Parabola(v, durationS, startSlope, curvature);
        Add(rest);
        Extend(rest.EndV);
        return rest.EndV;
    }

    private double Straight(double v, double slope, double durationS)
    {
        var end = v + slope * durationS;
        Add(RampSegment.Linear(v, end, durationS));
        Extend(v);
        Extend(end);
        return end;
    }

    private double Phase(double v, double target, double slope, in Decay decay, double tauS) =>
        Phase(v, decay.End(v, target, slope, tauS), target, slope, decay.DurationS, tauS);

    /// <summary>One phase from <paramref name="v"/> to <paramref name="end"/>, split at a turning point inside it.</summary>
    private double Phase(double v, double end, double target, double slope, double durationS, double tauS)
    {
        Extend(v);
        Extend(end);
        if (durationS <= 0)
            return v;
        if (TurningPoint(v, target, slope, durationS, tauS, out var turn, out var peak))
        {
            Extend(peak);
            Add(new RampSegment(v, peak, turn, target, tauS, slope));
            // Restart at the turning point: the target there is A + B·t.
            Add(new RampSegment(peak, end, durationS - turn, target + slope * turn, tauS, slope));
            return end;
        }

        Add(new RampSegment(v, end, durationS, target, tauS, slope));
        return end;
    }

    /// <summary>
    /// The turning point strictly inside a phase whose target moves at B ≠ 0: v′ = 0 where
    /// e^(−t/τ) = B·τ/(v0 − A + B·τ), i.e. t = τ·log1p((v0 − A)/(B·τ)). There 1 − e^(−t/τ) = r/(1 + r) in
    /// closed form, so the peak needs no exponential. (Not the equal A + B·t: with a long τ, A and B·t are
    /// huge and cancel.) False when the phase has none.
    /// </summary>
    private static bool TurningPoint(double v, double target, double slope, double durationS, double tauS,
        out double turnS, out double peakV)
    {
        turnS = peakV = double.NaN;
        if (slope == 0 || !(durationS > 0))
            return false;
        var r = (v - target) / (slope * tauS);
        var u = Accurate.Log1P(r);
        var turn = tauS * u;
        if (!(turn > 0 && turn < durationS))
            return false;
        turnS = turn;
        peakV = RampSegment.ValueAt(v, target, tauS, slope, u, r / (1 + r));
        return true;
    }

    /// <summary>
    /// The extremes <see cref="FillRelaxation"/> would give (the same values, bit for bit), without its
    /// pieces: the three-stage generator needs only its capacitor's swing, for the supply current.
    /// </summary>
    public static (double MaxV, double MinV) RelaxationExtremes(double tauS, double levelHigh, double levelLow,
        double edgeS, double tripHighV, double tripLowV, double edgeX, double edgeExcess)
    {
        var slew = edgeS > 0 ? (levelHigh - levelLow) / edgeS : 0;
        var edge = new Decay(edgeS, edgeX, edgeExcess);
        var extremes = new RampPieces { MaxV = double.NegativeInfinity, MinV = double.PositiveInfinity };
        // Every value FillRelaxation extends by: each phase's start and end, and the edges' turning points.
        var fallEnd = edge.End(tripHighV, levelHigh, -slew, tauS);
        var riseEnd = edge.End(tripLowV, levelLow, slew, tauS);
        extremes.Extend(tripHighV);
        extremes.Extend(fallEnd);
        if (TurningPoint(tripHighV, levelHigh, -slew, edgeS, tauS, out _, out var peak))
            extremes.Extend(peak);
        extremes.Extend(tripLowV);
        extremes.Extend(riseEnd);
        if (TurningPoint(tripLowV, levelLow, slew, edgeS, tauS, out _, out var trough))
            extremes.Extend(trough);
        return (extremes.MaxV, extremes.MinV);
    }

    private void Extend(double v)
    {
        // Plain comparisons (Math.Max/Min's signed-zero handling cost more here than the rest of the
        // bookkeeping); a NaN still sticks, as with Math.Max/Min, so a failed piece shows in the figures.
        if (v > MaxV || double.IsNaN(v)) MaxV = v;
        if (v < MinV || double.IsNaN(v)) MinV = v;
    }
}
