namespace PartsOpt.Topologies;

/// <summary>
/// The steady-state waveforms of a design in closed form: the square-wave generator's levels and times,
/// the ramp the comparator sees, the comparator's output and the thresholds. Voltages named "Rel" are
/// relative to the reference (0 V split supply, the mid-rail divider single supply); the others are absolute.
/// A value type filled in place, so the figure model evaluates without allocating.
/// </summary>
/// <remarks>
/// Modelling choices: the square-wave generator's outputs saturate at the rails minus the headroom and
/// slew at the part's slew rate. The relaxation oscillator's times are exact for that model
/// (<see cref="RelaxationTiming"/>: the capacitor keeps charging towards the slewing output), and the
/// capacitor and the lossy integrator are driven by the real trapezoid, each piece solved exactly
/// (<see cref="RampPieces.Driven"/>). In the loop, the Schmitt's slewing edges make
/// the triangle overshoot each threshold by L²/(2·SR·Ri·Ci) and shift its restart by the integral of
/// the slewing input, and through each edge the triangle is a parabola (<see cref="RampPieces.Integrated"/>).
/// The integrators are taken as ideal (their own slew and swing limits are checks, not part of the closed
/// form), and the reference as stiff.
/// </remarks>
internal struct Waveform
{
    public bool Oscillates;
    public double ReferenceV;
    public double LevelHighRel, LevelLowRel;
    public double Ratio;
    public double AmpEdgeS;
    public double HighTimeS, LowTimeS, PeriodS;
    public RampPieces Ramp;
    public double RampMaxRel, RampMinRel;
    public double IntegratorSlopeMax;
    public double LinearityErrorPercent;
    public double OutputHighV, OutputLowV, EdgeTimeS;
    public double ThresholdMinV, ThresholdMaxV;
    public double DutyMin, DutyMax;
    public double SupplyCurrentA;
    public double SchmittNodeMaxRel, SchmittNodeMinRel;
    public double CapacitorSwingV;

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
        return Ramp.TimeAbove(rel) / PeriodS;
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
    /// High and low times of the slewing relaxation oscillator, mid-edge to mid-edge
    /// (<see cref="RelaxationTiming.HalfPeriods(double, double, double, double, double)"/>); false when an edge cannot complete.
    /// </summary>
    private static bool RelaxationTimes(in CircuitValues v, ref Waveform w, out double edgeX, out double edgeExcess)
    {
        var (high, low) = RelaxationTiming.HalfPeriods(v.OscR * v.OscC, w.Ratio, w.LevelHighRel, w.LevelLowRel,
            v.AmpSlewRate, out edgeX, out edgeExcess);
        w.HighTimeS = high;
        w.LowTimeS = low;
        w.PeriodS = high + low;
        return double.IsFinite(w.PeriodS);
    }

    private static bool ThreeStage(in CircuitValues v, CircuitShape shape, ref Waveform w)
    {
        if (!RelaxationCanSwitch(in w, w.Ratio, shape.AmpOffsetV) || !RelaxationTimes(in v, ref w, out var edgeX, out var edgeExcess))
            return false;

        // Lossy integrator, v′ = (−(Rf/Ri)·w(t) − v)/(Rf·Ci), driven by the oscillator's trapezoid; its
        // periodic steady state, with the turning points inside the edges where the input crosses −v·Ri/Rf.
        var edge = w.AmpEdgeS;
        var (capacitorMax, capacitorMin) = RampPieces.RelaxationExtremes(v.OscR * v.OscC, w.LevelHighRel, w.LevelLowRel,
            edge, w.Ratio * w.LevelHighRel, w.Ratio * w.LevelLowRel, edgeX, edgeExcess);
        w.CapacitorSwingV = capacitorMax - capacitorMin;
        var tau = v.IntRf * v.IntC;
        w.Ramp.FillDriven(-v.IntRf / v.IntR, tau, w.LevelHighRel, w.LevelLowRel, edge, w.LowTimeS - edge, w.HighTimeS - edge);
        w.RampMaxRel = w.Ramp.MaxV;
        w.RampMinRel = w.Ramp.MinV;
        var slopeMax = 0.0;
        for (var i = 0; i < w.Ramp.Count; i++)
            slopeMax = Math.Max(slopeMax, Math.Abs(w.Ramp[i].StartSlope));
        w.IntegratorSlopeMax = slopeMax;
        w.LinearityErrorPercent = 100 * w.Ramp.LinearityError();
        return true;
    }

    private static bool RcRamp(in CircuitValues v, CircuitShape shape, ref Waveform w)
    {
        var beta = w.Ratio;
        if (!RelaxationCanSwitch(in w, beta, shape.AmpOffsetV) || !RelaxationTimes(in v, ref w, out var edgeX, out var edgeExcess))
            return false;
        // The capacitor, from the falling trip at βL+: it overshoots while the output slews down, and
        // undershoots βL− while it slews up.
        var edge = w.AmpEdgeS;
        w.Ramp.FillRelaxation(v.OscR * v.OscC, w.LevelHighRel, w.LevelLowRel, edge, w.LowTimeS - edge,
            w.HighTimeS - edge, beta * w.LevelHighRel, beta * w.LevelLowRel, edgeX, edgeExcess);
        w.RampMaxRel = w.Ramp.MaxV;
        w.RampMinRel = w.Ramp.MinV;
        w.CapacitorSwingV = w.RampMaxRel - w.RampMinRel;
        w.LinearityErrorPercent = 100 * w.Ramp.LinearityError();
        return true;
    }

    /// <summary>Both thresholds β·L± must lie inside the swing by more than the input offset.</summary>
    private static bool RelaxationCanSwitch(in Waveform w, double beta, double offsetV) =>
        (1 - beta) * Math.Min(w.LevelHighRel, -w.LevelLowRel) > offsetV;

    /// <summary>
    /// High and low times of the Schmitt-and-integrator loop (thresholds −k·L± about the reference, integrator
    /// time constant τ, output edges t_e that shift the ramp); NaN for both when a ramp time is not positive.
    /// The search forecasts the loop's frequency with this same function.
    /// </summary>
    internal static (double High, double Low) LoopHalfPeriods(double tauI, double k, double lp, double lm, double te)
    {
        var shift = -te * (lp + lm) / (2 * tauI);
        var fall = (k * (lp - lm) + shift) * tauI / lp;
        var rise = (k * (lp - lm) - shift) * tauI / -lm;
        return fall > 0 && rise > 0 ? (fall + te, rise + te) : (double.NaN, double.NaN);
    }

    private static bool Loop(in CircuitValues v, ref Waveform w)
    {
        double lp = w.LevelHighRel, lm = w.LevelLowRel, te = w.AmpEdgeS;
        var k = w.Ratio;
        // Thresholds −k·L+ and −k·L− must lie inside the integrator's swing (r1 < r2 when symmetric).
        if (!(k * lp < -lm && -k * lm < lp))
            return false;
        var tauI = v.IntR * v.IntC;
        var (high, low) = LoopHalfPeriods(tauI, k, lp, lm, te);
        if (!double.IsFinite(high))
            return false;
        w.HighTimeS = high;
        w.LowTimeS = low;
        w.PeriodS = w.HighTimeS + w.LowTimeS;
        var slewTimesTau = 2 * v.AmpSlewRate * tauI;
        w.RampMaxRel = -k * lm + lm * lm / slewTimesTau;
        w.RampMinRel = -k * lp - lp * lp / slewTimesTau;
        // The triangle as the engine's pieces (parabolic through the edges) for the duty; it starts at the
        // lower threshold −k·L+ where the Schmitt trips low.
        w.Ramp = RampPieces.Integrated(tauI, lp, lm, te, w.LowTimeS - te, w.HighTimeS - te, -k * lp);
        w.IntegratorSlopeMax = Math.Max(lp, -lm) / tauI;
        var sum = v.SchR1 + v.SchR2;
        w.SchmittNodeMaxRel = (w.RampMaxRel * v.SchR2 + lp * v.SchR1) / sum;
        w.SchmittNodeMinRel = (w.RampMinRel * v.SchR2 + lm * v.SchR1) / sum;
        return true;
    }

    /// <summary>
    /// Mean current drawn from V+: quiescent current of every fitted section, the threshold and reference
    /// dividers, the pull-up while the output is low (at the middle setting), and the current each op-amp
    /// output sources into its networks while high (timing capacitor: its charge C·ΔV per period, exactly,
    /// ΔV its whole swing including the overshoot while the output slews;
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
                    + v.OscC * w.CapacitorSwingV / w.PeriodS
                    + -lm / v.IntR * lowShare;
                break;
            case TopologyKind.RcRamp:
                current += lp / (v.OscR1 + v.OscR2) * highShare + v.OscC * w.CapacitorSwingV / w.PeriodS;
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
