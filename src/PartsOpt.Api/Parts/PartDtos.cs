using System.Text.Json.Serialization;

namespace PartsOpt.Api.Parts;

// The part as JSON: common fields plus ONE kind-specific object named after the kind ("resistor",
// "capacitor", "potentiometer", "opAmp"); the others are absent. Numbers are SI (ohms, farads, volts, amps,
// hertz, V/s); tolerances are fractions (0.05 for 5 %) unless "toleranceAbsolute" (capacitors: farads).
// The same records serve input and output; every property is nullable so that a missing field is reported
// by name rather than read as zero.

/// <summary>A part as the API returns it.</summary>
public sealed record PartDto(
    string PartNumber,
    string Kind,
    string Description,
    string Package,
    int QuantityOnHand,
    int Reserved,
    int Available,
    decimal UnitCost,
    string Currency,
    int ReorderLevel,
    bool BelowReorderLevel,
    string Location,
    string Notes,
    ResistorFields? Resistor,
    CapacitorFields? Capacitor,
    PotentiometerFields? Potentiometer,
    OpAmpFields? OpAmp);

/// <summary>A part as a client sends it (POST creates, PUT replaces the fields; quantity never).</summary>
public sealed record PartInput
{
    public string? PartNumber { get; init; }
    public string? Kind { get; init; }
    public string? Description { get; init; }
    public string? Package { get; init; }
    public decimal? UnitCost { get; init; }
    public string? Currency { get; init; }
    public int? ReorderLevel { get; init; }
    public string? Location { get; init; }
    public string? Notes { get; init; }

    /// <summary>POST only: booked as a receipt ("initial stock"). Quantity never changes through PUT.</summary>
    public int? InitialQuantity { get; init; }

    public ResistorFields? Resistor { get; init; }
    public CapacitorFields? Capacitor { get; init; }
    public PotentiometerFields? Potentiometer { get; init; }
    public OpAmpFields? OpAmp { get; init; }
}

public sealed record ResistorFields
{
    [JsonConverter(typeof(OhmsJson))]
    public double? ResistanceOhms { get; init; }
    public double? ToleranceMinus { get; init; }
    public double? TolerancePlus { get; init; }
    public double? TempcoPpmPerK { get; init; }
    [JsonConverter(typeof(WattsJson))]
    public double? PowerRatingW { get; init; }
}

public sealed record CapacitorFields
{
    [JsonConverter(typeof(FaradsJson))]
    public double? CapacitanceF { get; init; }
    public double? ToleranceMinus { get; init; }
    public double? TolerancePlus { get; init; }

    /// <summary>True when the tolerance is in farads (e.g. ±0.25 pF on a small C0G), not a fraction.</summary>
    public bool? ToleranceAbsolute { get; init; }

    /// <summary>C0G, X7R, X5R, Y5V, Z5U, Film or Electrolytic.</summary>
    public string? Dielectric { get; init; }

    [JsonConverter(typeof(VoltsJson))]
    public double? VoltageRatingV { get; init; }
    public bool? Polarised { get; init; }
    public double? TempcoPpmPerK { get; init; }
}

public sealed record PotentiometerFields
{
    [JsonConverter(typeof(OhmsJson))]
    public double? ResistanceOhms { get; init; }
    public double? ToleranceMinus { get; init; }
    public double? TolerancePlus { get; init; }

    /// <summary>"linear" or "log".</summary>
    public string? Taper { get; init; }

    [JsonConverter(typeof(WattsJson))]
    public double? PowerRatingW { get; init; }

    /// <summary>True for a board-mounted trimmer, false for a panel potentiometer.</summary>
    public bool? Trimmer { get; init; }
}

public sealed record OpAmpFields
{
    /// <summary>Amplifiers (or comparators) per package: 1, 2 or 4.</summary>
    public int? Sections { get; init; }

    /// <summary>Total supply (V+ − V−) range.</summary>
    [JsonConverter(typeof(VoltsJson))]
    public double? SupplyMinV { get; init; }
    [JsonConverter(typeof(VoltsJson))]
    public double? SupplyMaxV { get; init; }
    [JsonConverter(typeof(HertzJson))]
    public double? GainBandwidthHz { get; init; }
    public double? SlewRateVPerS { get; init; }

    /// <summary>How close the output swings to each rail (≥ 0).</summary>
    [JsonConverter(typeof(VoltsJson))]
    public double? OutputHeadroomLowV { get; init; }
    [JsonConverter(typeof(VoltsJson))]
    public double? OutputHeadroomHighV { get; init; }

    /// <summary>Input common-mode headroom to each rail; negative means the range extends beyond the rail.</summary>
    [JsonConverter(typeof(VoltsJson))]
    public double? InputHeadroomLowV { get; init; }
    [JsonConverter(typeof(VoltsJson))]
    public double? InputHeadroomHighV { get; init; }
    [JsonConverter(typeof(VoltsJson))]
    public double? InputOffsetV { get; init; }
    [JsonConverter(typeof(AmpsJson))]
    public double? OutputCurrentMaxA { get; init; }
    [JsonConverter(typeof(AmpsJson))]
    public double? QuiescentCurrentPerSectionA { get; init; }

    /// <summary>A dedicated comparator (no compensation, not for linear use).</summary>
    public bool? Comparator { get; init; }

    /// <summary>Open-drain (open-collector) output: needs a pull-up.</summary>
    public bool? OpenDrain { get; init; }
}

/// <summary>A page of a list.</summary>
public sealed record PagedList<T>(IReadOnlyList<T> Items, int Page, int PageSize, int Total);
