using PartsOpt.Values;

namespace PartsOpt.Topologies;

/// <summary>
/// Checks of each part against its ratings (when the part gives one) and of the timing capacitors'
/// dielectric: resistors at ≤ 50 % of rated power, ceramic and film capacitors at ≤ 50 % and
/// electrolytics at ≤ 80 % of rated voltage (common practice); timing capacitors see both polarities,
/// so no polarised part; class-2 ceramics for timing draw a warning.
/// </summary>
internal static class PartRatingChecks
{
    public const double PowerDerating = 0.5;
    public const double CeramicVoltageDerating = 0.5;
    public const double ElectrolyticVoltageDerating = 0.8;

    public static void Add(CheckList checks, CircuitDesign design, CircuitShape shape, in CircuitValues v, in Waveform w)
    {
        foreach (var role in design.RequiredRoles())
        {
            var part = design.Roles[role];
            var volts = PeakVoltage(role, shape, in v, in w);
            if (Roles.KindOf(role) == RoleKind.Capacitor)
            {
                Capacitor(checks, role, part, volts);
                continue;
            }

            if (part.PowerRatingW is { } rating && double.IsFinite(volts))
            {
                // Peak voltage squared over R: conservative for a part that sees it only part of the time.
                var watts = volts * volts / part.Value;
                var limit = PowerDerating * rating;
                checks.Add($"power ({role})", 1 - watts / limit, "1",
                    $"{role} dissipates up to {watts * 1e3:G4} mW; keep it at {PowerDerating:P0} of its {rating:G3} W rating (common practice).");
            }
        }
    }

    private static void Capacitor(CheckList checks, string role, RolePart part, double volts)
    {
        var timing = role is Roles.OscC or Roles.IntC;
        var polarised = part.IsPolarised || part.Dielectric == Dielectric.Electrolytic;
        if (timing && polarised)
            checks.Add($"non-polarised ({role})", -1, "1",
                $"{role} sees both polarities: a polarised capacitor is reverse-biased for half of every period (common practice).");
        if (timing && part.Dielectric is { } dielectric && !DielectricCharacteristics.SuitsTiming(dielectric) && !polarised)
            checks.Add($"timing dielectric ({role})", -1, "1",
                $"{role} is {dielectric}, a class-2 ceramic: it drifts with temperature, DC bias and age. Prefer C0G or film for timing (common practice).",
                CheckSeverity.Warning);
        if (part.VoltageRatingV is { } rating && double.IsFinite(volts))
        {
            var derating = polarised ? ElectrolyticVoltageDerating : CeramicVoltageDerating;
            var limit = derating * rating;
            checks.Add($"voltage ({role})", 1 - volts / limit, "1",
                $"{role} sees up to {volts:G4} V; keep it at {derating:P0} of its {rating:G3} V rating (common practice).");
        }
    }

    /// <summary>The largest voltage across a role's part; NaN where the waveform is needed but does not exist.</summary>
    private static double PeakVoltage(string role, CircuitShape shape, in CircuitValues v, in Waveform w)
    {
        double lp = w.LevelHighRel, lm = w.LevelLowRel, level = Math.Max(Math.Abs(lp), Math.Abs(lm));
        var span = shape.PositiveV - shape.NegativeV;
        var divider = v.CmpRa + v.CmpPot + v.CmpRb;
        var ramp = w.Oscillates ? Math.Max(Math.Abs(w.RampMaxRel), Math.Abs(w.RampMinRel)) : double.NaN;
        var beta = w.Ratio;
        return role switch
        {
            Roles.OscR => Math.Max(lp - beta * lm, beta * lp - lm),
            Roles.OscR1 => (1 - beta) * level,
            Roles.OscR2 or Roles.OscC => beta * level,
            Roles.IntR => level,
            Roles.IntRf or Roles.IntC => ramp,
            Roles.SchR1 or Roles.SchR2 when w.Oscillates =>
                Math.Max(w.RampMaxRel - lm, lp - w.RampMinRel) * (role == Roles.SchR1 ? v.SchR1 : v.SchR2) / (v.SchR1 + v.SchR2),
            Roles.CmpRa => span * v.CmpRa / divider,
            Roles.CmpPot => span * v.CmpPot / divider,
            Roles.CmpRb => span * v.CmpRb / divider,
            Roles.CmpPullup => shape.PositiveV - w.OutputLowV,
            Roles.RefRtop => shape.PositiveV - w.ReferenceV,
            Roles.RefRbottom or Roles.RefC => w.ReferenceV,
            _ => double.NaN,
        };
    }
}
