using PartsOpt.Api.Movements;
using PartsOpt.Values;

namespace PartsOpt.Api.Parts;

/// <summary>The four kinds of part the stockroom keeps.</summary>
public enum PartKind
{
    Resistor,
    Capacitor,
    Potentiometer,
    OpAmp,
}

/// <summary>How a potentiometer's resistance follows its shaft.</summary>
public enum Taper
{
    Linear,
    Log,
}

/// <summary>
/// A stocked part. All kinds live in ONE table ("Parts") with a <see cref="Kind"/> column and nullable
/// kind-specific columns: four kinds with a dozen fields each do not earn four tables and joins, a
/// value-range filter is a plain indexed column comparison, and CHECK constraints (see
/// <see cref="PartConfiguration"/>) make sure each kind's required columns are filled. SI units in doubles.
/// The quantity on hand is not a column: it is the sum of the part's <see cref="Movements"/>.
/// </summary>
public sealed class Part
{
    public int Id { get; set; }

    /// <summary>The team's own part number, unique (case-insensitive) and used in URLs.</summary>
    public required string PartNumber { get; set; }

    public PartKind Kind { get; set; }
    public string Description { get; set; } = "";
    public string Package { get; set; } = "";

    /// <summary>Stored as TEXT by the SQLite provider, so exact; never sorted or summed in SQL.</summary>
    public decimal UnitCost { get; set; }

    /// <summary>ISO 4217 alphabetic code, upper case.</summary>
    public string Currency { get; set; } = "EUR";

    public int ReorderLevel { get; set; }
    public string Location { get; set; } = "";
    public string Notes { get; set; } = "";

    // Resistors and potentiometers.
    public double? ResistanceOhms { get; set; }
    public double? PowerRatingW { get; set; }

    // Passives: tolerance as fractions, or (capacitors, ToleranceIsAbsolute) in farads.
    public double? ToleranceMinus { get; set; }
    public double? TolerancePlus { get; set; }
    public bool ToleranceIsAbsolute { get; set; }
    public double? TempcoPpmPerK { get; set; }

    // Capacitors.
    public double? CapacitanceF { get; set; }
    public Dielectric? Dielectric { get; set; }
    public double? VoltageRatingV { get; set; }
    public bool? Polarised { get; set; }

    // Potentiometers.
    public Taper? Taper { get; set; }
    public bool? Trimmer { get; set; }

    // Op-amps and comparators.
    public int? Sections { get; set; }
    public double? SupplyMinV { get; set; }
    public double? SupplyMaxV { get; set; }
    public double? GainBandwidthHz { get; set; }
    public double? SlewRateVPerS { get; set; }
    public double? OutputHeadroomLowV { get; set; }
    public double? OutputHeadroomHighV { get; set; }
    public double? InputHeadroomLowV { get; set; }
    public double? InputHeadroomHighV { get; set; }
    public double? InputOffsetV { get; set; }
    public double? OutputCurrentMaxA { get; set; }
    public double? QuiescentCurrentPerSectionA { get; set; }
    public bool? Comparator { get; set; }
    public bool? OpenDrain { get; set; }

    /// <summary>
    /// Raised by every saved change of the row; a concurrency token, so a stale update fails. Its ETag is
    /// <see cref="PartVersion.ETagOf"/>.
    /// </summary>
    public int Version { get; set; }

    public List<Movement> Movements { get; } = [];
}
