namespace PartsOpt.Topologies;

/// <summary>
/// The steady-state waveforms of a design in closed form: the square-wave generator's levels and times,
/// the ramp the comparator sees, the comparator's output and the thresholds. Voltages named "Rel" are
/// relative to the reference (0 V split supply, the mid-rail divider single supply); the others are absolute.
/// A value type filled in place, so the figure model evaluates without allocating.
/// </summary>
/// <remarks>
/// Modelling choices: the square-wave generator's outputs saturate at the rails minus the headroom and
/// slew at the part's slew rate; each edge adds (L+ − L−)/SR to its period (common practice), and the
/// integrator sees a square whose high and low parts each last their saturated time plus one edge time
/// (the slewing ramp split evenly between the levels). In the loop, the Schmitt's slewing edges make
/// the triangle overshoot each threshold by L²/(2·SR·Ri·Ci) and shift its restart by the integral of
/// the slewing input. The reference is taken as stiff.
/// </remarks>
internal struct Waveform
{
    public bool Oscillates;
    public double ReferenceV;
    public double LevelHighRel, LevelLowRel;
    public double Ratio;
    public double AmpEdgeS;
    public double HighTimeS, LowTimeS, PeriodS;
    public RampSegment Fall, Rise;
    public double DwellTopS;
    public double RampMaxRel, RampMinRel;
    public double IntegratorSlopeMax;
    public double LinearityErrorPercent;
    public double OutputHighV, OutputLowV, EdgeTimeS;
    public double ThresholdMinV, ThresholdMaxV;
    public double DutyMin, DutyMax;
    public double SupplyCurrentA;
    public double SchmittNodeMaxRel, SchmittNodeMinRel;

    public readonly double RampMaxV => RampMaxRel + ReferenceV;
    public readonly double RampMinV => RampMinRel + ReferenceV;

    /// <summary>The comparator threshold at a setting 0…1 (linear in the setting for both pot and control voltage).</summary>
    public readonly double ThresholdAt(double setting) => ThresholdMinV + setting * (ThresholdMaxV - ThresholdMinV);

    /// <summary>
    /// Fraction of the period the ramp (on the comparator's non-inverting input) spends above
    /// <paramref name="thresholdV"/>: the exact time above on each exponential or straight segment.
    /// </summary>
    public readonly double DutyAt(double thresholdV)
    {
        if (!Oscillates)
            return double.NaN;
        var rel = thresholdV - ReferenceV;
        if (rel >= RampMaxRel)
            return 0;
        if (rel <= RampMinRel)
            return 1;
        var above = Fall.TimeAbove(rel) + Rise.TimeAbove(rel) + DwellTopS;
        return above / PeriodS;
    }

    public static void Compute(in CircuitValues v, CircuitShape shape, out Waveform w)
    {
        w = default;
        var span = shape.PositiveV - shape.NegativeV;
        w.ReferenceV = shape.SingleSupply ? shape.PositiveV * v.RefRbottom / (v.RefRtop + v.RefRbottom) : 0;
        w.LevelHighRel = shape.PositiveV - v.AmpHeadroomHigh - w.ReferenceV;
        w.LevelLowRel = shape.NegativeV + v.AmpHeadroomLow - w.ReferenceV;
        w.AmpEdgeS = (w.LevelHighRel - w.LevelLowRel) / v.AmpSlewRate;

        w.OutputHighV = shape.OpenDrain ? shape.PositiveV : shape.PositiveV - v.CmpHeadroomHigh;
        w.OutputLowV = shape.NegativeV + v.CmpHeadroomLow;
        w.EdgeTimeS = (w.OutputHighV - w.OutputLowV) / v.CmpSlewRate;

        if (shape.Potentiometer)
        {
            var sum = v.CmpRa + v.CmpPot + v.CmpRb;
            w.ThresholdMinV = shape.NegativeV + span * v.CmpRb / sum;
            w.ThresholdMaxV = shape.NegativeV + span * (v.CmpRb + v.CmpPot) / sum;
        }
        else
        {
            w.ThresholdMinV = shape.ControlMinV;
            w.ThresholdMaxV = shape.ControlMaxV;
        }

        w.Ratio = shape.Topology == TopologyKind.Loop ? v.SchR1 / v.SchR2 : v.OscR2 / (v.OscR1 + v.OscR2);

        // The outputs must straddle the reference, or no threshold can ever be crossed.
        var switches = w.LevelHighRel > 0 && w.LevelLowRel < 0 && shape.Topology switch
        {
            TopologyKind.Loop => Loop(in v, ref w),
            TopologyKind.RcRamp => RcRamp(in v, shape, ref w),
            _ => ThreeStage(in v, shape, ref w),
        };
        w.Oscillates = switches && double.IsFinite(w.PeriodS) && w.PeriodS > 0;
        if (!w.Oscillates)
            return;

        w.DutyMin = w.DutyAt(w.ThresholdMinV);
        w.DutyMax = w.DutyAt(w.ThresholdMaxV);
        w.SupplyCurrentA = SupplyCurrent(in v, shape, in w);
    }

    /// <summary>
    /// Saturated high and low times of the relaxation oscillator (REFERENCE.md, unequal saturation), as
    /// RC·ln(1 + g): g_high = β(L+ − L−)/((1−β)L+), g_low = β(L+ − L−)/((1−β)|L−|) are the ratios less one,
    /// written so that a small β loses no digits. Also returns x = 1 − e^(−t/RC) = g/(1+g) of each.
    /// </summary>
    private static (double High, double Low, double XHigh, double XLow) RelaxationTimes(in CircuitValues v, in Waveform w, double beta)
    {
        double lp = w.LevelHighRel, lm = w.LevelLowRel, rc = v.OscR * v.OscC;
        var common = beta * (lp - lm) / (1 - beta);
        double gHigh = common / lp, gLow = common / -lm;
        return (rc * Accurate.Log1P(gHigh), rc * Accurate.Log1P(gLow), gHigh / (1 + gHigh), gLow / (1 + gLow));
    }

    private static bool ThreeStage(in CircuitValues v, CircuitShape shape, ref Waveform w)
    {
        var beta = w.Ratio;
        if (!RelaxationCanSwitch(in w, beta, shape.AmpOffsetV))
            return false;
        var (high, low, _, _) = RelaxationTimes(in v, in w, beta);
        w.HighTimeS = high + w.AmpEdgeS;
        w.LowTimeS = low + w.AmpEdgeS;
        w.PeriodS = w.HighTimeS + w.LowTimeS;

        // Lossy integrator: each part of the square is an exponential towards −(Rf/Ri)·level with τ = Rf·Ci.
        // Periodic steady state: Vpp = (B − A)·x·y/(x + y − x·y), x = 1 − e^(−a/τ), y = 1 − e^(−b/τ).
        var tau = v.IntRf * v.IntC;
        var gain = v.IntRf / v.IntR;
        var towardsLow = -gain * w.LevelHighRel;
        var towardsHigh = -gain * w.LevelLowRel;
        var x = -Accurate.ExpM1(-w.HighTimeS / tau);
        var y = -Accurate.ExpM1(-w.LowTimeS / tau);
        var den = x + y - x * y;
        var peakToPeak = (towardsHigh - towardsLow) * x * y / den;
        w.RampMaxRel = towardsLow + (towardsHigh - towardsLow) * y / den;
        w.RampMinRel = w.RampMaxRel - peakToPeak;
        w.Fall = new RampSegment(w.RampMaxRel, w.RampMinRel, w.HighTimeS, towardsLow, tau);
        w.Rise = new RampSegment(w.RampMinRel, w.RampMaxRel, w.LowTimeS, towardsHigh, tau);
        w.IntegratorSlopeMax = Math.Max(w.RampMaxRel - towardsLow, towardsHigh - w.RampMinRel) / tau;
        w.LinearityErrorPercent = 100 * Math.Max(RampSegment.Bow(w.HighTimeS / tau, x), RampSegment.Bow(w.LowTimeS / tau, y));
        return true;
    }

    private static bool RcRamp(in CircuitValues v, CircuitShape shape, ref Waveform w)
    {
        var beta = w.Ratio;
        if (!RelaxationCanSwitch(in w, beta, shape.AmpOffsetV))
            return false;
        var (high, low, xHigh, xLow) = RelaxationTimes(in v, in w, beta);
        w.HighTimeS = high + w.AmpEdgeS;
        w.LowTimeS = low + w.AmpEdgeS;
        w.PeriodS = w.HighTimeS + w.LowTimeS;
        var rc = v.OscR * v.OscC;
        w.RampMaxRel = beta * w.LevelHighRel;
        w.RampMinRel = beta * w.LevelLowRel;
        // The capacitor charges while the output is high and rests near its peak while the output slews down.
        w.Rise = new RampSegment(w.RampMinRel, w.RampMaxRel, high, w.LevelHighRel, rc);
        w.Fall = new RampSegment(w.RampMaxRel, w.RampMinRel, low, w.LevelLowRel, rc);
        w.DwellTopS = w.AmpEdgeS;
        w.LinearityErrorPercent = 100 * Math.Max(RampSegment.Bow(high / rc, xHigh), RampSegment.Bow(low / rc, xLow));
        return true;
    }

    /// <summary>Both thresholds β·L± must lie inside the swing by more than the input offset.</summary>
    private static bool RelaxationCanSwitch(in Waveform w, double beta, double offsetV) =>
        (1 - beta) * Math.Min(w.LevelHighRel, -w.LevelLowRel) > offsetV;

    private static bool Loop(in CircuitValues v, ref Waveform w)
    {
        double lp = w.LevelHighRel, lm = w.LevelLowRel, te = w.AmpEdgeS;
        var k = w.Ratio;
        // Thresholds −k·L+ and −k·L− must lie inside the integrator's swing (r1 < r2 when symmetric).
        if (!(k * lp < -lm && -k * lm < lp))
            return false;
        var tauI = v.IntR * v.IntC;
        var shift = -te * (lp + lm) / (2 * tauI);
        var fall = (k * (lp - lm) + shift) * tauI / lp;
        var rise = (k * (lp - lm) - shift) * tauI / -lm;
        if (!(fall > 0 && rise > 0))
            return false;
        w.HighTimeS = fall + te;
        w.LowTimeS = rise + te;
        w.PeriodS = w.HighTimeS + w.LowTimeS;
        var slewTimesTau = 2 * v.AmpSlewRate * tauI;
        w.RampMaxRel = -k * lm + lm * lm / slewTimesTau;
        w.RampMinRel = -k * lp - lp * lp / slewTimesTau;
        w.Fall = RampSegment.Linear(w.RampMaxRel, w.RampMinRel, w.HighTimeS);
        w.Rise = RampSegment.Linear(w.RampMinRel, w.RampMaxRel, w.LowTimeS);
        w.IntegratorSlopeMax = Math.Max(lp, -lm) / tauI;
        var sum = v.SchR1 + v.SchR2;
        w.SchmittNodeMaxRel = (w.RampMaxRel * v.SchR2 + lp * v.SchR1) / sum;
        w.SchmittNodeMinRel = (w.RampMinRel * v.SchR2 + lm * v.SchR1) / sum;
        return true;
    }

    /// <summary>
    /// Mean current drawn from V+: quiescent current of every fitted section, the threshold and reference
    /// dividers, the pull-up while the output is low (at the middle setting), and the current each op-amp
    /// output sources into its networks while high (timing capacitor: its charge C·ΔV per period, exactly;
    /// resistors: at the output level over the time spent there, far end at the node's mean voltage).
    /// </summary>
    private static double SupplyCurrent(in CircuitValues v, CircuitShape shape, in Waveform w)
    {
        double lp = w.LevelHighRel, lm = w.LevelLowRel;
        double highShare = w.HighTimeS / w.PeriodS, lowShare = w.LowTimeS / w.PeriodS;
        var current = shape.QuiescentA;
        if (shape.Potentiometer)
            current += (shape.PositiveV - shape.NegativeV) / (v.CmpRa + v.CmpPot + v.CmpRb);
        if (shape.SingleSupply)
            current += shape.PositiveV / (v.RefRtop + v.RefRbottom);
        if (shape.OpenDrain)
        {
            var midDuty = w.DutyAt(0.5 * (w.ThresholdMinV + w.ThresholdMaxV));
            current += (shape.PositiveV - w.OutputLowV) / v.CmpPullup * (1 - midDuty);
        }

        switch (shape.Topology)
        {
            case TopologyKind.ThreeStage:
                current += (lp / (v.OscR1 + v.OscR2) + lp / v.IntR) * highShare
                    + v.OscC * w.Ratio * (lp - lm) / w.PeriodS
                    + -lm / v.IntR * lowShare;
                break;
            case TopologyKind.RcRamp:
                current += lp / (v.OscR1 + v.OscR2) * highShare + v.OscC * w.Ratio * (lp - lm) / w.PeriodS;
                break;
            default:
                var centre = 0.5 * (w.RampMaxRel + w.RampMinRel);
                var sum = v.SchR1 + v.SchR2;
                current += (lp / v.IntR + (lp - centre) / sum) * highShare
                    + (-lm / v.IntR + (centre - lm) / sum) * lowShare;
                break;
        }

        return current;
    }
}
