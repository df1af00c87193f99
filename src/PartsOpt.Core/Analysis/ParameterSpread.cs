namespace PartsOpt.Analysis;

/// <summary>
/// A parameter's tolerance as a relative deviation δ, the part's value being nominal·(1 + δ) with δ in
/// [−ToleranceMinus, +TolerancePlus]. Working in δ keeps negative nominals (a negative saturation
/// voltage) and asymmetric tolerances (+80/−20 %) in one arithmetic.
/// </summary>
internal static class ParameterSpread
{
    /// <summary>√3: a uniform distribution of half-width a has σ = a/√3.</summary>
    private static readonly double Sqrt3 = Math.Sqrt(3);

    /// <summary>Half the width of the tolerance band, relative: (minus + plus)/2.</summary>
    public static double RelativeHalfWidth(ParameterSpec p) => (p.ToleranceMinus + p.TolerancePlus) / 2;

    /// <summary>
    /// Where the band's centre sits relative to nominal: (plus − minus)/2. Both distributions are
    /// centred on the band, so this is also the mean of δ (+0.30 for a +80/−20 % part).
    /// </summary>
    public static double RelativeMeanOffset(ParameterSpec p) => (p.TolerancePlus - p.ToleranceMinus) / 2;

    /// <summary>
    /// Standard deviation of δ: half-width/√3 for a uniform spread (variance of the uniform distribution),
    /// half-width/3 for a normal one whose band is ±3σ (common practice). The normal figure ignores the
    /// truncation at ±3σ that Monte Carlo applies, which lowers the true σ by 1.3 %: root-sum-square stays
    /// on the safe side.
    /// </summary>
    public static double RelativeSigma(ParameterSpec p) => p.Distribution switch
    {
        SpreadDistribution.Normal => RelativeHalfWidth(p) / 3,
        _ => RelativeHalfWidth(p) / Sqrt3,
    };
}
