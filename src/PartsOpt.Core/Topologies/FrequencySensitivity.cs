namespace PartsOpt.Topologies;

/// <summary>
/// Analytic normalised sensitivities S = (x/f)·∂f/∂x of the oscillation frequency, where the closed form
/// gives them directly.
/// </summary>
public static class FrequencySensitivity
{
    /// <summary>
    /// The analytic sensitivities of the frequency to the timing parts and to "amp.slewRate".
    /// Relaxation oscillator (period T = RC·G(β) + 2·t_edge, β = r2/(r1+r2)): S(osc.r) = S(osc.c) = −RC·G/T,
    /// S(osc.r2) = −S(osc.r1) = −RC·G′(β)·β(1−β)/T with
    /// G′ = −L−/(L+ − βL−) + L+/(βL+ − L−) + 2/(1−β); for symmetric levels and no slew this is
    /// −2β/((1+β)·ln((1+β)/(1−β))). Loop (ramp time T_k = (r1/r2)·(L+ − L−)·Ri·Ci·(1/L+ + 1/|L−|)):
    /// S(sch.r2) = T_k/T, S(sch.r1) = S(int.r) = S(int.c) = −T_k/T. In both, S(amp.slewRate) is the
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

        var beta = w.Ratio;
        var rc = values.OscR * values.OscC;
        var saturated = period - 2 * w.AmpEdgeS;
        var slope = -lm / (lp - beta * lm) + lp / (beta * lp - lm) + 2 / (1 - beta);
        var sBeta = -rc * slope * beta * (1 - beta) / period;
        result[Roles.OscR] = -saturated / period;
        result[Roles.OscC] = -saturated / period;
        result[Roles.OscR1] = -sBeta;
        result[Roles.OscR2] = sBeta;
        result[CircuitFigureModel.AmpSlewRate] = 2 * w.AmpEdgeS / period;
        return result;
    }
}
