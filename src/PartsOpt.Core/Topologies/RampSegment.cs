namespace PartsOpt.Topologies;

/// <summary>
/// One monotonic piece of a ramp, the response of a first-order stage v′ = (target(t) − v)/τ to a target
/// that moves linearly: v(t) = v0 + (A − v0)·(1 − e^(−t/τ)) + B·τ·(u − 1 + e^(−u)), u = t/τ, with
/// A = <see cref="TargetV"/> the target at the start and B = <see cref="SlopeVPerS"/> its slope (0 for a
/// plain exponential). When <see cref="TauS"/> is infinite (an ideal integrator) the piece is a straight
/// line, or with <see cref="CurvatureVPerS2"/> ≠ 0 a parabola v = v0 + s0·t + c·t²/2 whose start slope s0 is
/// <see cref="SlopeVPerS"/> (the integrator's response to a slewing edge). Voltages in any common frame.
/// </summary>
internal readonly record struct RampSegment(double StartV, double EndV, double DurationS, double TargetV, double TauS,
    double SlopeVPerS = 0, double CurvatureVPerS2 = 0)
{
    public static RampSegment Linear(double startV, double endV, double durationS) =>
        new(startV, endV, durationS, double.NaN, double.PositiveInfinity);

    /// <summary>A parabola from <paramref name="startV"/> with start slope and constant second derivative.</summary>
    public static RampSegment Parabola(double startV, double durationS, double startSlope, double curvature) =>
        new(startV, startV + durationS * (startSlope + 0.5 * curvature * durationS), durationS, double.NaN,
            double.PositiveInfinity, startSlope, curvature);

    private bool IsLinear => double.IsPositiveInfinity(TauS);

    private bool IsParabola => IsLinear && CurvatureVPerS2 != 0;

    /// <summary>The value <paramref name="t"/> seconds into the piece (not for straight pieces).</summary>
    public double ValueAt(double t)
    {
        var u = t / TauS;
        return ValueAt(u, -Accurate.ExpM1(-u));
    }

    /// <summary>
    /// The value at u = t/τ given x = 1 − e^(−u), for callers that know x already (it is the only
    /// transcendental in the value, so sharing it with <see cref="SlopeAt(double)"/> halves the cost).
    /// </summary>
    public double ValueAt(double u, double x) => ValueAt(StartV, TargetV, TauS, SlopeVPerS, u, x);

    /// <summary>The value of the piece with these parameters at u = t/τ, given x = 1 − e^(−u).</summary>
    public static double ValueAt(double startV, double targetV, double tauS, double slopeVPerS, double u, double x) =>
        startV + (targetV - startV) * x + slopeVPerS * tauS * RelaxationTiming.ExcessOverChord(u, x);

    /// <summary>dv/dt at <paramref name="t"/> seconds into the piece (not for straight pieces).</summary>
    public double SlopeAt(double t) => SlopeFrom(-Accurate.ExpM1(-t / TauS));

    /// <summary>dv/dt where 1 − e^(−t/τ) = <paramref name="x"/>.</summary>
    private double SlopeFrom(double x) => StartSlope * (1 - x) + SlopeVPerS * x;

    /// <summary>
    /// dv/dt at the start, (A − v0)/τ, exactly what <see cref="SlopeAt(double)"/> gives at 0 (there x = 0),
    /// without the call to the exponential. Stored, not recomputed: the linearity error reads it twice
    /// for every piece (the piece's own and, as the end slope of the one before, the next's).
    /// </summary>
    public double StartSlope { get; } = (TargetV - StartV) / TauS;

    /// <summary>Time of this segment during which the ramp is above <paramref name="thresholdV"/>.</summary>
    public double TimeAbove(double thresholdV)
    {
        var rising = EndV > StartV;
        var top = rising ? EndV : StartV;
        var bottom = rising ? StartV : EndV;
        if (thresholdV >= top)
            return 0;
        if (thresholdV <= bottom)
            return DurationS;
        var crossing = Math.Clamp(Crossing(thresholdV), 0, DurationS);
        return rising ? DurationS - crossing : crossing;
    }

    /// <summary>
    /// Time from the start at which the piece passes <paramref name="thresholdV"/> (between its ends): a
    /// proportion on a straight piece, a logarithm on a plain exponential (log1p keeps long time constants
    /// exact), and on a piece with a moving target (a slewing edge: exponential plus line, no closed-form
    /// inverse) Newton's method kept inside a shrinking bracket; the piece is monotonic and has no
    /// inflection, so a handful of steps reach full precision.
    /// </summary>
    private double Crossing(double thresholdV)
    {
        if (IsParabola)
        {
            // Root of c/2·t² + s0·t − Δ = 0 on the monotonic piece, in the form without cancellation.
            var delta = thresholdV - StartV;
            var root = Math.Sqrt(Math.Max(0, SlopeVPerS * SlopeVPerS + 2 * CurvatureVPerS2 * delta));
            return 2 * delta / (SlopeVPerS + Math.Sign(EndV - StartV) * root);
        }

        if (IsLinear)
            return DurationS * (thresholdV - StartV) / (EndV - StartV);
        if (SlopeVPerS == 0)
            return TauS * Accurate.Log1P((StartV - thresholdV) / (thresholdV - TargetV));
        double lo = 0, hi = DurationS;
        var sign = EndV > StartV ? 1.0 : -1.0;
        var t = DurationS * (thresholdV - StartV) / (EndV - StartV);
        for (var i = 0; i < 60; i++)
        {
            // One exponential per step, shared by the value and the slope.
            var u = t / TauS;
            var x = -Accurate.ExpM1(-u);
            var f = sign * (ValueAt(u, x) - thresholdV);
            if (f > 0) hi = t; else lo = t;
            var next = t - f / (sign * SlopeFrom(x));
            if (!(next > lo && next < hi))
                next = 0.5 * (lo + hi);
            if (Math.Abs(next - t) <= 1e-15 * DurationS || hi - lo <= 1e-15 * DurationS)
                return next;
            t = next;
        }

        return t;
    }

    /// <summary>
    /// Largest distance between an exponential segment and the straight line through its end points, as a
    /// fraction of the segment's swing. For v(t) = A + (v0 − A)·e^(−t/τ) over u = d/τ, with x = 1 − e^(−u)
    /// (passed in, as the caller has it already), the chord's slope is met at e^(−t/τ) = x/u and the
    /// distance there is |x/u − 1 + (x/u)·ln(u/x)|/x, which is u/8 − u³/576 for small u (series by computer
    /// algebra). A straight segment (u = 0) has none.
    /// </summary>
    public static double Bow(double u, double x)
    {
        if (u < 1e-2)
            return u / 8 - u * u * u / 576;
        var ratio = x / u;
        return Math.Abs(ratio - 1 - ratio * Math.Log(ratio)) / x;
    }
}
