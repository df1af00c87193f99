using PartsOpt.Topologies;
using PartsOpt.Values;

namespace PartsOpt.Search;

/// <summary>
/// A passive part the stockroom holds: resistor, capacitor or potentiometer, with what the search and the
/// engine's checks need to know about it.
/// </summary>
/// <param name="PartNumber">The stock part number (one line item on a BOM).</param>
/// <param name="Kind">Resistor, capacitor or potentiometer.</param>
/// <param name="Value">Nominal value, SI units: Ω for resistors and potentiometers (end to end), F for capacitors.</param>
/// <param name="Tolerance">Symmetric tolerance as a fraction (0.05 for ±5 %).</param>
/// <param name="UnitCost">Cost of one piece.</param>
/// <param name="Available">Pieces on hand less reserved.</param>
public sealed record StockPart(string PartNumber, RoleKind Kind, double Value, double Tolerance, decimal UnitCost, int Available)
{
    /// <summary>Temperature coefficient of a resistor or potentiometer, ±ppm/K; null when not recorded.</summary>
    public double? TempcoPpmPerK { get; init; }

    /// <summary>Dielectric of a capacitor; null for resistors and potentiometers.</summary>
    public Dielectric? Dielectric { get; init; }

    /// <summary>Rated power of a resistor or potentiometer, W; null when not recorded.</summary>
    public double? PowerRatingW { get; init; }

    /// <summary>Rated voltage of a capacitor, V; null when not recorded.</summary>
    public double? VoltageRatingV { get; init; }

    /// <summary>The part as the engine sees it in a role.</summary>
    public RolePart ToRolePart() => Kind == RoleKind.Capacitor && Dielectric is { } dielectric
        ? RolePart.Capacitor(Value, Tolerance, dielectric, VoltageRatingV, PartNumber)
        : new RolePart(Value, Tolerance, Tolerance,
            TempcoPpmPerK is { } ppm ? Analysis.TemperatureBehaviour.Linear(ppm) : null,
            PartNumber, PowerRatingW, VoltageRatingV);
}

/// <summary>An op-amp or comparator part the stockroom holds, priced and counted per package.</summary>
/// <param name="PartNumber">The stock part number.</param>
/// <param name="Spec">The part's limits (sections per package, swing, slew rate…).</param>
/// <param name="UnitCost">Cost of one package.</param>
/// <param name="Available">Packages on hand less reserved.</param>
public sealed record StockOpAmp(string PartNumber, OpAmpSpec Spec, decimal UnitCost, int Available);

/// <summary>Everything the stockroom holds that a design may use.</summary>
/// <param name="Parts">Resistors, capacitors and potentiometers.</param>
/// <param name="OpAmps">Op-amps and comparators.</param>
public sealed record Stock(IReadOnlyList<StockPart> Parts, IReadOnlyList<StockOpAmp> OpAmps);
