namespace PartsOpt.Topologies;

/// <summary>
/// One monotonic piece of a ramp: from <see cref="StartV"/> to <see cref="EndV"/> in <see cref="DurationS"/>,
/// exponential towards <see cref="TargetV"/> with time constant <see cref="TauS"/>, or a straight line when
/// <see cref="TauS"/> is infinite. Voltages in any common frame.
/// </summary>
internal readonly record struct RampSegment(double StartV, double EndV, double DurationS, double TargetV, double TauS)
{
    public static RampSegment Linear(double startV, double endV, double durationS) =>
        new(startV, endV, durationS, double.NaN, double.PositiveInfinity);

    private bool IsLinear => double.IsPositiveInfinity(TauS);

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
        // Time from the start until the ramp crosses the threshold; log1p keeps long time constants exact.
        var crossing = IsLinear
            ? DurationS * (thresholdV - StartV) / (EndV - StartV)
            : TauS * Accurate.Log1P((StartV - thresholdV) / (thresholdV - TargetV));
        crossing = Math.Clamp(crossing, 0, DurationS);
        return rising ? DurationS - crossing : crossing;
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
