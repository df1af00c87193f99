namespace PartsOpt.Topologies;

/// <summary>
/// Exact half periods of the relaxation (Schmitt) oscillator whose output saturates at L+ and L− (relative
/// to the reference) and slews at SR between them, and a bracket of its period that is linear in the edge
/// time, for search relaxations.
/// </summary>
/// <remarks>
/// Derived. After the Schmitt trips at v_c = βL+ the output slews v_o(t) = L+ − SR·t for
/// t_e = (L+ − L−)/SR while the capacitor keeps charging towards it, v_c′ = (v_o − v_c)/τ, τ = RC; for a
/// ramp input the solution is v_c = v_o(t) + SR·τ + (βL+ − L+ − SR·τ)·e^(−t/τ). After the edge v_c runs
/// exponentially towards L− until it meets βL−. With u = t_e/τ, φ(u) = (1 − e^(−u))/u:
/// t_low = t_e + τ·ln(D/((1 − β)|L−|)), D = (L+ − L−)·φ(u) − (1 − β)·L+·e^(−u), and t_high likewise with
/// L+ and |L−| exchanged. Times are from the middle of one edge to the middle of the next (the output
/// crosses its mid-level halfway through a linear edge). Assumption, checked: the Schmitt cannot flip back
/// during an edge. v_c − β·v_o starts at 0 and is concave in t over the edge, so it stays positive up to
/// the edge's end whenever D &gt; (1 − β)|L−|, which is exactly the condition for t_low to exceed t_e;
/// otherwise the output turns back before it saturates, a regime this form does not cover (reported as
/// <see cref="double.NaN"/>). With SR = ∞ (u = 0) it is REFERENCE.md's unequal-saturation pair.
/// </remarks>
public static class RelaxationTiming
{
    /// <summary>
    /// High and low times (mid-level to mid-level) of the slewing relaxation oscillator; NaN for both when
    /// an edge cannot complete before the capacitor reaches the other threshold, or the levels do not
    /// straddle the reference.
    /// </summary>
    /// <param name="rc">Timing resistor times capacitor, s.</param>
    /// <param name="beta">Feedback ratio r2/(r1 + r2), 0 &lt; β &lt; 1.</param>
    /// <param name="levelHigh">L+ relative to the reference, V (&gt; 0).</param>
    /// <param name="levelLow">L− relative to the reference, V (&lt; 0).</param>
    /// <param name="slewRate">Output slew rate, V/s (may be +∞).</param>
    public static (double High, double Low) HalfPeriods(double rc, double beta, double levelHigh, double levelLow, double slewRate) =>
        HalfPeriods(rc, beta, levelHigh, levelLow, slewRate, out _, out _);

    /// <summary>
    /// <see cref="HalfPeriods(double, double, double, double, double)"/>, also giving the edge's
    /// exponential factors x = 1 − e^(−u) and u − x, u = t_e/(R·C), for the capacitor's ramp, which
    /// needs exactly these (so it does not compute them again).
    /// </summary>
    internal static (double High, double Low) HalfPeriods(double rc, double beta, double levelHigh, double levelLow,
        double slewRate, out double edgeX, out double edgeExcess)
    {
        edgeX = edgeExcess = double.NaN;
        if (!(levelHigh > 0 && levelLow < 0 && beta > 0 && beta < 1 && rc > 0 && slewRate > 0))
            return (double.NaN, double.NaN);
        var swing = levelHigh - levelLow;
        var edge = swing / slewRate;
        var u = edge / rc;
        // Both half periods share u: one e^(−u) for the pair (it dominated the cost of this call).
        var x = -Accurate.ExpM1(-u);
        var excess = ExcessOverChord(u, x);
        edgeX = x;
        edgeExcess = excess;
        var oneMinusPhi = u == 0 ? 0 : excess / u;
        var low = edge + rc * SaturatedLog(x, oneMinusPhi, beta, swing, levelHigh, -levelLow);
        var high = edge + rc * SaturatedLog(x, oneMinusPhi, beta, swing, -levelLow, levelHigh);
        return double.IsFinite(low) && double.IsFinite(high) ? (high, low) : (double.NaN, double.NaN);
    }

    /// <summary>
    /// Lower and upper multipliers a ≤ b of the two edges in the bracket
    /// R·C·k + a·2·t_e ≤ T ≤ R·C·k + b·2·t_e, valid for every R·C &gt; 0 and slew rate, where
    /// t_e = (L+ − L−)/SR and k = ln((L+ − βL−)/((1−β)L+)) + ln((L− − βL+)/((1−β)L−)) is the instant-edge
    /// factor. With p± = (1 − β)·|L±|/(L+ − L−): a = (3 − β)/4 and
    /// b = (max(1, 1/(2(1 − p+))) + max(1, 1/(2(1 − p−))))/2, so b = 1 whenever β ≥ 1/2. Derived per half
    /// period: its excess over the instant-edge time is u·τ + τ·ln((φ(u) − p·e^(−u))/(1 − p)), which lies
    /// between (1 + p)/2·t_e and max(1, 1/(2(1 − p)))·t_e. The upper edge for p ≤ 1/2 and a weaker lower edge
    /// t_e/2 are proved (1 − e^(−u) ≤ 2u/(2 + u); φ(u) ≥ e^(−u/2)); the rest is checked numerically over
    /// random levels, β, RC and slew rates in the tests. Symmetric levels, β = 1/2: a = 0.625, b = 1, and the
    /// exact multiplier tends to 2/3 for short edges.
    /// </summary>
    /// <param name="beta">Feedback ratio r2/(r1 + r2).</param>
    /// <param name="levelHigh">L+ relative to the reference, V (&gt; 0).</param>
    /// <param name="levelLow">L− relative to the reference, V (&lt; 0).</param>
    public static (double Lower, double Upper) EdgeMultipliers(double beta, double levelHigh, double levelLow)
    {
        var swing = levelHigh - levelLow;
        double pHigh = (1 - beta) * levelHigh / swing, pLow = (1 - beta) * -levelLow / swing;
        static double Upper(double p) => Math.Max(1, 0.5 / (1 - p));
        return ((3 - beta) / 4, 0.5 * (Upper(pHigh) + Upper(pLow)));
    }

    /// <summary>
    /// The bracket [R·C·k + a·2·t_e, R·C·k + b·2·t_e] of the slewing oscillator's period, with a and b from
    /// <see cref="EdgeMultipliers"/>; the exact period (<see cref="HalfPeriods(double, double, double, double, double)"/>) lies inside it.
    /// </summary>
    /// <param name="rc">Timing resistor times capacitor, s.</param>
    /// <param name="beta">Feedback ratio r2/(r1 + r2).</param>
    /// <param name="levelHigh">L+ relative to the reference, V (&gt; 0).</param>
    /// <param name="levelLow">L− relative to the reference, V (&lt; 0).</param>
    /// <param name="slewRate">Output slew rate, V/s (may be +∞).</param>
    public static (double Min, double Max) PeriodBracket(double rc, double beta, double levelHigh, double levelLow, double slewRate)
    {
        var twoEdges = 2 * (levelHigh - levelLow) / slewRate;
        var instant = rc * (Math.Log((levelHigh - beta * levelLow) / ((1 - beta) * levelHigh))
            + Math.Log((levelLow - beta * levelHigh) / ((1 - beta) * levelLow)));
        var (a, b) = EdgeMultipliers(beta, levelHigh, levelLow);
        return (instant + a * twoEdges, instant + b * twoEdges);
    }

    /// <summary>
    /// ln(D/((1−β)·far)) after an edge from the level <paramref name="near"/> (where the trip was, at β·near)
    /// towards the level −<paramref name="far"/>: D = swing·φ(u) − (1−β)·near·e^(−u). Written as
    /// log1p((β·swing − swing·(1 − φ) + (1−β)·near·(1 − e^(−u)))/((1−β)·far)) so short edges and small β keep
    /// their digits. NaN when the edge cannot complete (the argument is not above 1). Takes
    /// x = 1 − e^(−u) and 1 − φ(u), which the caller computes once for both half periods.
    /// </summary>
    internal static double SaturatedLog(double x, double oneMinusPhi, double beta, double swing, double near, double far)
    {
        var excess = beta * swing - swing * oneMinusPhi + (1 - beta) * near * x;
        return excess > 0 ? Accurate.Log1P(excess / ((1 - beta) * far)) : double.NaN;
    }

    /// <summary>
    /// D = swing·φ(u) − (1−β)·near·e^(−u) of one half period and its partial derivatives by u and by β
    /// (for the analytic sensitivities); φ′(u) = (e^(−u)·(1 + u) − 1)/u², by its series for small u.
    /// </summary>
    internal static (double D, double ByU, double ByBeta) EdgeTerm(double u, double beta, double swing, double near)
    {
        var e = Math.Exp(-u);
        var phi = u == 0 ? 1 : 1 - ExcessOverChord(u) / u;
        var phiSlope = u < 1e-3 ? -0.5 + u * (1.0 / 3 - u / 8) : (e * (1 + u) - 1) / (u * u);
        return (swing * phi - (1 - beta) * near * e, swing * phiSlope + (1 - beta) * near * e, near * e);
    }

    /// <summary>u − (1 − e^(−u)) = u + expm1(−u), by its series for small u.</summary>
    internal static double ExcessOverChord(double u) =>
        u < 1e-3 ? u * u * (0.5 - u * (1.0 / 6 - u / 24)) : u + Accurate.ExpM1(-u);

    /// <summary>
    /// u − (1 − e^(−u)) when the caller already has x = 1 − e^(−u) = −expm1(−u): the same value as
    /// <see cref="ExcessOverChord(double)"/>, bit for bit, without a second exponential.
    /// </summary>
    internal static double ExcessOverChord(double u, double x) =>
        u < 1e-3 ? u * u * (0.5 - u * (1.0 / 6 - u / 24)) : u - x;
}
