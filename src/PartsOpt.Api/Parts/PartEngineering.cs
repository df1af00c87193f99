using PartsOpt.Analysis;
using PartsOpt.Topologies;
using PartsOpt.Values;

namespace PartsOpt.Api.Parts;

/// <summary>
/// A stocked part as the circuit engine sees it: the one place that turns database rows into
/// <see cref="OpAmpSpec"/> and <see cref="RolePart"/>, shared by circuit evaluation and design search.
/// </summary>
public static class PartEngineering
{
    /// <summary>Resistors without a stated coefficient are taken as ±100 ppm/K (thick film, common practice).</summary>
    public const double DefaultResistorPpmPerK = 100;

    /// <summary>Comparators seldom state a gain-bandwidth product; where none is stored it is taken as not
    /// limiting (the engine uses it only for a warning about frequency against bandwidth).</summary>
    public const double UnstatedGainBandwidthHz = 1e12;

    /// <summary>The op-amp's limits. Only for parts of kind <see cref="PartKind.OpAmp"/>; the database's CHECK
    /// constraints guarantee every limit is present for that kind.</summary>
    public static OpAmpSpec ToOpAmpSpec(Part part)
    {
        ArgumentNullException.ThrowIfNull(part);
        if (part.Kind != PartKind.OpAmp)
            throw new ArgumentException($"Part {part.PartNumber} is a {part.Kind}, not an op-amp.", nameof(part));
        return new OpAmpSpec(
            part.Sections ?? 1,
            part.SupplyMinV ?? 0,
            part.SupplyMaxV ?? 0,
            part.GainBandwidthHz ?? UnstatedGainBandwidthHz,
            part.SlewRateVPerS ?? 0,
            part.OutputHeadroomHighV ?? 0,
            part.OutputHeadroomLowV ?? 0,
            part.InputHeadroomHighV ?? 0,
            part.InputHeadroomLowV ?? 0,
            part.InputOffsetV ?? 0,
            part.OutputCurrentMaxA ?? 0,
            part.QuiescentCurrentPerSectionA ?? 0,
            part.Comparator ?? false,
            part.OpenDrain ?? false,
            part.PartNumber);
    }

    /// <summary>The part's value, tolerance, temperature behaviour and ratings, for a resistor, capacitor or
    /// potentiometer role. An absolute capacitor tolerance (tiny C0G parts) becomes a fraction of the value.</summary>
    public static RolePart ToRolePart(Part part)
    {
        ArgumentNullException.ThrowIfNull(part);
        var (minus, plus) = (part.ToleranceMinus ?? 0, part.TolerancePlus ?? 0);
        switch (part.Kind)
        {
            case PartKind.Capacitor:
                var farads = part.CapacitanceF ?? 0;
                if (part.ToleranceIsAbsolute && farads > 0)
                    (minus, plus) = (minus / farads, plus / farads);
                var dielectric = part.Dielectric ?? Dielectric.C0G;
                var temperature = dielectric == Dielectric.Film && part.TempcoPpmPerK is { } filmPpm
                    ? DielectricCharacteristics.For(dielectric, filmPpm)
                    : DielectricCharacteristics.For(dielectric);
                return new RolePart(farads, minus, plus, temperature, part.PartNumber, null, part.VoltageRatingV,
                    dielectric, part.Polarised ?? DielectricCharacteristics.IsPolarised(dielectric));
            case PartKind.Resistor:
            case PartKind.Potentiometer:
                return new RolePart(part.ResistanceOhms ?? 0, minus, plus,
                    TemperatureBehaviour.Linear(part.TempcoPpmPerK ?? DefaultResistorPpmPerK), part.PartNumber,
                    part.PowerRatingW);
            default:
                throw new ArgumentException($"Part {part.PartNumber} is an op-amp; it fills no resistor or capacitor role.", nameof(part));
        }
    }

    /// <summary>The part kind a role takes: potentiometer roles take potentiometers, and so on.</summary>
    public static PartKind KindFor(string role) => Roles.KindOf(role) switch
    {
        RoleKind.Capacitor => PartKind.Capacitor,
        RoleKind.Potentiometer => PartKind.Potentiometer,
        _ => PartKind.Resistor,
    };
}
