namespace PartsOpt.Topologies;

/// <summary>
/// Analytic normalised sensitivities S = (x/f)·∂f/∂x of the oscillation frequency, where the closed form
/// gives them directly.
/// </summary>
public static class FrequencySensitivity
{
    /// <summary>
    /// The analytic sensitivities of the frequency to the timing parts and to "amp.slewRate".
    /// Relaxation oscillator (<see cref="RelaxationTiming"/>: T = 2·t_e + τ·Λ(u, β), τ = RC, u = t_e/τ,
    /// Λ = ln(D_f/((1−β)|L−|)) + ln(D_r/((1−β)L+)), β = r2/(r1+r2)): T is homogeneous of degree one in
    /// (τ, t_e), so S(osc.r) = S(osc.c) = −(τ·Λ − t_e·∂Λ/∂u)/T and S(amp.slewRate) = t_e·(2 + ∂Λ/∂u)/T;
    /// S(osc.r2) = −S(osc.r1) = −τ·(∂Λ/∂β)·β(1−β)/T with ∂Λ/∂β = L+·e^(−u)/D_f + |L−|·e^(−u)/D_r + 2/(1−β).
    /// For symmetric levels and no slew S(osc.r2) is −2β/((1+β)·ln((1+β)/(1−β))).
    /// Loop (ramp time T_k = (r1/r2)·(L+ − L−)·Ri·Ci·(1/L+ + 1/|L−|)):
    /// S(sch.r2) = T_k/T, S(sch.r1) = S(int.r) = S(int.c) = −T_k/T, and S(amp.slewRate) is the
    /// share of the period taken by the edges. Parts not listed (threshold divider, pull-up, reference
    /// bypass) do not move the frequency; the single-supply reference divider does, through the levels,
    /// and is left to numerical differences.
    /// </summary>
    /// <returns>Sensitivity by parameter name; empty when the design does not oscillate.</returns>
    /// <exception cref="DesignValidationException">The design cannot be analysed.</exception>
    public static IReadOnlyDictionary<string, double> Analytic(CircuitDesign design)
    {
        ArgumentNullException.ThrowIfNull(design);
        design.Validate();
        var values = CircuitValues.From(design);
        Waveform.Compute(in values, new CircuitShape(design), out var w);
        var result = new Dictionary<string, double>();
        if (!w.Oscillates)
            return result;
        double lp = w.LevelHighRel, lm = w.LevelLowRel, period = w.PeriodS;
        if (design.Topology == TopologyKind.Loop)
        {
            var k = values.SchR1 / values.SchR2;
            var ramps = k * (lp - lm) * values.IntR * values.IntC * (1 / lp + 1 / -lm);
            result[Roles.SchR1] = -ramps / period;
            result[Roles.SchR2] = ramps / period;
            result[Roles.IntR] = -ramps / period;
            result[Roles.IntC] = -ramps / period;
            result[CircuitFigureModel.AmpSlewRate] = (period - ramps) / period;
            return result;
        }

        // T = 2·t_e + τ·Λ(u, β), u = t_e/τ, Λ = Σ ln(D/((1−β)·far)) over both halves (RelaxationTiming).
        var beta = w.Ratio;
        var tau = values.OscR * values.OscC;
        var edge = w.AmpEdgeS;
        var u = edge / tau;
        var swing = lp - lm;
        var (dFall, dFallU, dFallBeta) = RelaxationTiming.EdgeTerm(u, beta, swing, lp);
        var (dRise, dRiseU, dRiseBeta) = RelaxationTiming.EdgeTerm(u, beta, swing, -lm);
        var logs = period - 2 * edge;
        var byU = dFallU / dFall + dRiseU / dRise;
        var byTau = logs - edge * byU; // τ·∂T/∂τ
        var sBeta = -tau * (dFallBeta / dFall + dRiseBeta / dRise + 2 / (1 - beta)) * beta * (1 - beta) / period;
        result[Roles.OscR] = -byTau / period;
        result[Roles.OscC] = -byTau / period;
        result[Roles.OscR1] = -sBeta;
        result[Roles.OscR2] = sBeta;
        result[CircuitFigureModel.AmpSlewRate] = edge * (2 + byU) / period;
        return result;
    }
}
