using System.Globalization;

namespace PartsOpt.Topologies;

/// <summary>
/// The checks of a design's operation: supply, oscillation, common-mode ranges, slew, output currents,
/// swing, duty range, overdrive and edges. Part ratings are in <see cref="PartRatingChecks"/>.
/// </summary>
internal static class CircuitChecks
{
    /// <summary>Integrator slope limit as a share of the slew rate (common practice: stay well below it).</summary>
    public const double SlewShare = 0.5;

    /// <summary>Output edges (rise plus fall) as a share of the period at most (common practice).</summary>
    public const double EdgeShareOfPeriod = 0.05;

    /// <summary>Comparator overdrive wanted beyond the input offset, V (common practice).</summary>
    public const double OverdriveV = 0.010;

    /// <summary>Hysteresis wanted, in input offsets (common practice).</summary>
    public const double HysteresisOffsets = 4;

    /// <summary>Triangle shift by the integrator's amplified offset, at most this share of its peak-to-peak (common practice).</summary>
    public const double OffsetShiftShare = 0.1;

    /// <summary>Frequency at most this share of the gain-bandwidth product (common practice).</summary>
    public const double BandwidthShare = 0.01;

    /// <summary>Every check of the design; without <paramref name="explain"/> only the checks that fail or warn get reasons.</summary>
    public static List<CircuitCheck> All(CircuitDesign design, CircuitShape shape, in CircuitValues v, in Waveform w, bool explain = true)
    {
        var checks = new CheckList(explain);
        SupplyRange(checks, design.Amplifier, "amplifier", design.Supply);
        if (design.Comparator is { } separate)
            SupplyRange(checks, separate, "comparator", design.Supply);
        CanSwitch(checks, design, shape, in v, in w);
        var canSwitch = checks.Items.FindIndex(c => c.Name == "oscillator can switch");
        if (!w.Oscillates && checks.Items[canSwitch].Passed)
        {
            // Thresholds are reachable, yet no period comes out: the slewing edges eat the ramps, or the
            // values lie so far out that the closed form overflows. (The check passed, so its reason is
            // written again for the failure.)
            var explained = new CheckList(explain: true);
            CanSwitch(explained, design, shape, in v, in w);
            checks.Items[canSwitch] = Check("oscillator can switch", -1, "1",
                explained.Items.First(c => c.Name == "oscillator can switch").Reason + " Even so, no steady period exists: the slewing edges leave no time for the ramps, or the values are out of range.");
        }

        if (w.Oscillates)
        {
            CommonMode(checks, design, in w);
            Operation(checks, design, in v, in w);
            OutputCurrents(checks, design, shape, in v, in w);
            if (shape.SingleSupply && !design.BufferReference)
                StiffReference(checks, design, in v, in w);
        }

        PartRatingChecks.Add(checks, design, shape, in v, in w);
        return checks.Items;
    }

    private static void SupplyRange(CheckList checks, OpAmpSpec part, string which, Supply supply)
    {
        var span = supply.SpanV;
        var margin = Math.Min(span - part.SupplyMinV, part.SupplyMaxV - span);
        checks.Add($"supply range ({which})", margin, "V",
            $"The supply gives {span:G4} V across the rails; the {which} part is rated for {part.SupplyMinV:G4}…{part.SupplyMaxV:G4} V.");
    }

    private static void CanSwitch(CheckList checks, CircuitDesign design, CircuitShape shape, in CircuitValues v, in Waveform w)
    {
        double lp = w.LevelHighRel, lm = w.LevelLowRel;
        if (!(lp > 0 && lm < 0))
        {
            checks.Add("oscillator can switch", Math.Min(lp, -lm), "V",
                $"The op-amp's output swings {lm + w.ReferenceV:G4}…{lp + w.ReferenceV:G4} V, which does not straddle the reference {w.ReferenceV:G4} V.");
            return;
        }

        if (design.Topology == TopologyKind.Loop)
        {
            var k = v.SchR1 / v.SchR2;
            var margin = Math.Min(-lm - k * lp, lp + k * lm);
            checks.Add("oscillator can switch", margin, "V",
                $"The Schmitt thresholds {-k * lp:G4} V and {-k * lm:G4} V (sch.r1/sch.r2 = {k:G4}, needs sch.r1 < sch.r2) must lie inside the integrator's swing {lm:G4}…{lp:G4} V about the reference.");
            var hysteresis = k * (lp - lm);
            checks.Add("hysteresis above offset", hysteresis - HysteresisOffsets * shape.AmpOffsetV, "V",
                $"Hysteresis {hysteresis:G4} V against {HysteresisOffsets} × the input offset {shape.AmpOffsetV:G3} V: below that the offset, not the parts, sets the timing (common practice).");
            return;
        }

        var beta = v.OscR2 / (v.OscR1 + v.OscR2);
        var inside = (1 - beta) * Math.Min(lp, -lm) - shape.AmpOffsetV;
        checks.Add("oscillator can switch", inside, "V",
            $"The thresholds β·L± ({beta * lm:G4} V, {beta * lp:G4} V about the reference, β = {beta:G4}) must lie inside the output swing {lm:G4}…{lp:G4} V by more than the input offset.");
        var hyst = beta * (lp - lm);
        checks.Add("hysteresis above offset", hyst - HysteresisOffsets * shape.AmpOffsetV, "V",
            $"Hysteresis {hyst:G4} V against {HysteresisOffsets} × the input offset {shape.AmpOffsetV:G3} V: below that the offset, not the parts, sets the timing (common practice).");
    }

    private static void CommonMode(CheckList checks, CircuitDesign design, in Waveform w)
    {
        var r = w.ReferenceV;
        if (design.Topology == TopologyKind.Loop)
        {
            InputRange(checks, design, design.Amplifier, "schmitt", Math.Min(r, r + w.SchmittNodeMinRel), Math.Max(r, r + w.SchmittNodeMaxRel));
        }
        else
        {
            InputRange(checks, design, design.Amplifier, "oscillator", r + w.Ratio * w.LevelLowRel, r + w.Ratio * w.LevelHighRel);
        }

        if (design.Topology != TopologyKind.RcRamp)
            InputRange(checks, design, design.Amplifier, "integrator", r, r);
        InputRange(checks, design, design.ComparatorPart, "comparator",
            Math.Min(w.RampMinV, w.ThresholdMinV), Math.Max(w.RampMaxV, w.ThresholdMaxV));
        if (design.BufferReference)
            InputRange(checks, design, design.Amplifier, "reference buffer", r, r);
    }

    private static void InputRange(CheckList checks, CircuitDesign design, OpAmpSpec part, string section, double lowV, double highV)
    {
        var floor = design.Supply.NegativeV + part.InputHeadroomLowV;
        var ceiling = design.Supply.PositiveV - part.InputHeadroomHighV;
        checks.Add($"input common-mode range ({section})", Math.Min(lowV - floor, ceiling - highV), "V",
            $"The {section} inputs see {lowV:G4}…{highV:G4} V; the part accepts {floor:G4}…{ceiling:G4} V.");
    }

    private static void Operation(CheckList checks, CircuitDesign design, in CircuitValues v, in Waveform w)
    {
        if (design.Topology != TopologyKind.RcRamp)
        {
            var limit = SlewShare * v.AmpSlewRate;
            checks.Add("integrator slope below slew rate", 1 - w.IntegratorSlopeMax / limit, "1",
                $"The integrator ramps at up to {w.IntegratorSlopeMax:G4} V/s; keep it below {SlewShare:P0} of the slew rate, {limit:G4} V/s (common practice).");
            var top = design.Supply.PositiveV - v.AmpHeadroomHigh;
            var bottom = design.Supply.NegativeV + v.AmpHeadroomLow;
            checks.Add("triangle inside integrator swing", Math.Min(top - w.RampMaxV, w.RampMinV - bottom), "V",
                $"The triangle spans {w.RampMinV:G4}…{w.RampMaxV:G4} V; the integrator swings {bottom:G4}…{top:G4} V.");
        }

        if (design.Topology == TopologyKind.ThreeStage)
        {
            // The shunted integrator amplifies its own input offset by its DC noise gain 1 + Rf/Ri.
            var shift = (1 + v.IntRf / v.IntR) * design.Amplifier.InputOffsetV;
            var allowed = OffsetShiftShare * (w.RampMaxRel - w.RampMinRel);
            checks.Add("integrator offset shift", 1 - shift / allowed, "1",
                $"The integrator's input offset, times its DC noise gain 1 + Rf/Ri, may shift the triangle by {shift:G4} V; keep it below {OffsetShiftShare:P0} of the peak-to-peak, {allowed:G4} V (common practice).",
                CheckSeverity.Warning);
        }

        var frequency = 1 / w.PeriodS;
        var bandwidth = BandwidthShare * design.Amplifier.GainBandwidthHz;
        checks.Add("frequency well below gain-bandwidth", 1 - frequency / bandwidth, "1",
            $"{frequency:G4} Hz against {BandwidthShare:P0} of the gain-bandwidth product, {bandwidth:G4} Hz (common practice).",
            CheckSeverity.Warning);

        double low = w.ThresholdMinV, high = w.ThresholdMaxV, rampLow = w.RampMinV, rampHigh = w.RampMaxV;
        checks.Add("duty adjustable", Math.Min(high - rampLow, rampHigh - low), "V",
            $"The threshold range {low:G4}…{high:G4} V must overlap the ramp {rampLow:G4}…{rampHigh:G4} V, or the output never switches.");
        checks.Add("threshold range inside the ramp", Math.Min(low - rampLow, rampHigh - high), "V",
            $"Thresholds {low:G4}…{high:G4} V against the ramp {rampLow:G4}…{rampHigh:G4} V: settings beyond the ramp give a dead band at 0 % or 100 %.",
            CheckSeverity.Warning);

        // Overdrive matters only at an end where the threshold lies inside the ramp (elsewhere the output rests).
        var wanted = OverdriveV + design.ComparatorPart.InputOffsetV;
        var overdrive = double.PositiveInfinity;
        if (low > rampLow && low < rampHigh)
            overdrive = Math.Min(overdrive, low - rampLow);
        if (high > rampLow && high < rampHigh)
            overdrive = Math.Min(overdrive, rampHigh - high);
        if (double.IsFinite(overdrive))
            checks.Add("comparator overdrive", overdrive - wanted, "V",
                $"At the duty extremes the ramp passes the threshold by {overdrive:G4} V; want {OverdriveV:G2} V plus the input offset (common practice).",
                CheckSeverity.Warning);

        var edges = 2 * w.EdgeTimeS;
        checks.Add("output edges short against the period", 1 - edges / (EdgeShareOfPeriod * w.PeriodS), "1",
            $"Rise plus fall {edges:G4} s against {EdgeShareOfPeriod:P0} of the period {w.PeriodS:G4} s (common practice).");

        var shortest = double.PositiveInfinity;
        foreach (var duty in (ReadOnlySpan<double>)[w.DutyMin, w.DutyMax])
        {
            if (duty > 0 && duty < 1)
                shortest = Math.Min(shortest, Math.Min(duty, 1 - duty) * w.PeriodS);
        }

        if (double.IsFinite(shortest))
            checks.Add("shortest pulse reaches full swing", shortest / edges - 1, "1",
                $"The shortest pulse at the duty extremes lasts {shortest:G4} s; it reaches full swing only if longer than rise plus fall, {edges:G4} s.",
                CheckSeverity.Warning);
    }

    /// <summary>Share of the returned load the reference's source resistance may be, at most (common practice).</summary>
    public const double ReferenceSourceShare = 0.01;

    /// <summary>Bypass time constant wanted, in periods (common practice).</summary>
    public const double BypassPeriods = 10;

    private static void StiffReference(CheckList checks, CircuitDesign design, in CircuitValues v, in Waveform w)
    {
        var source = v.RefRtop * v.RefRbottom / (v.RefRtop + v.RefRbottom);
        if (design.Topology != TopologyKind.Loop)
        {
            // The hysteresis divider returns its current to the reference; the loop returns only input currents.
            var load = v.OscR1 + v.OscR2;
            checks.Add("reference stiff against its load", 1 - source / (ReferenceSourceShare * load), "1",
                $"The unbuffered reference's source resistance {source:G4} Ω against {ReferenceSourceShare:P0} of the osc.r1 + osc.r2 load, {load:G4} Ω (common practice).",
                CheckSeverity.Warning);
        }

        var bypass = source * v.RefC;
        checks.Add("reference bypass", bypass / (BypassPeriods * w.PeriodS) - 1, "1",
            $"The bypass time constant {bypass:G4} s against {BypassPeriods} periods, {BypassPeriods * w.PeriodS:G4} s (common practice).",
            CheckSeverity.Warning);
    }

    private static void OutputCurrents(CheckList checks, CircuitDesign design, CircuitShape shape, in CircuitValues v, in Waveform w)
    {
        double lp = w.LevelHighRel, lm = w.LevelLowRel, level = Math.Max(lp, -lm);
        switch (design.Topology)
        {
            case TopologyKind.Loop:
                var tap = Math.Max(w.RampMaxRel - lm, lp - w.RampMinRel) / (v.SchR1 + v.SchR2);
                OutputCurrent(checks, design.Amplifier, "schmitt", level / v.IntR + tap);
                OutputCurrent(checks, design.Amplifier, "integrator", level / v.IntR + tap);
                break;
            default:
                var beta = w.Ratio;
                var oscillator = Math.Max(lp - beta * lm, beta * lp - lm) / v.OscR + level / (v.OscR1 + v.OscR2);
                if (design.Topology == TopologyKind.ThreeStage)
                {
                    oscillator += level / v.IntR;
                    OutputCurrent(checks, design.Amplifier, "integrator", level / v.IntR);
                }

                OutputCurrent(checks, design.Amplifier, "oscillator", oscillator);
                break;
        }

        if (shape.OpenDrain)
            OutputCurrent(checks, design.ComparatorPart, "comparator", (shape.PositiveV - w.OutputLowV) / v.CmpPullup);
    }

    private static void OutputCurrent(CheckList checks, OpAmpSpec part, string section, double currentA) =>
        checks.Add($"output current ({section})", 1 - currentA / part.MaxOutputCurrentA, "1",
            $"The {section} output drives up to {currentA * 1e3:G4} mA into its networks; the part delivers {part.MaxOutputCurrentA * 1e3:G4} mA.");

    /// <summary>
    /// A check from its margin. Margins are kept finite (±double.MaxValue at worst) so that every result
    /// serialises; a margin that cannot be computed (NaN) fails.
    /// </summary>
    internal static CircuitCheck Check(string name, double margin, string unit, string reason,
        CheckSeverity severity = CheckSeverity.Failure)
    {
        var finite = double.IsNaN(margin) ? -double.MaxValue : Math.Clamp(margin, -double.MaxValue, double.MaxValue);
        return new(name, margin >= 0, finite, unit, reason, severity);
    }

}
