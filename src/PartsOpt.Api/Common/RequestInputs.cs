using System.Text.Json.Serialization;
using PartsOpt.Api.Parts;

namespace PartsOpt.Api.Common;

// Request shapes more than one feature takes. Every property is nullable so that a missing one is reported
// by name; each feature's rules say what is required and what the defaults are.

/// <summary>Supply rails in volts; a negative rail of 0 is a single supply.</summary>
public sealed record SupplyInput
{
    /// <summary>V+ in volts (above 0).</summary>
    [JsonConverter(typeof(VoltsJson))]
    public double? Positive { get; init; }

    /// <summary>V− in volts (0 for a single supply, else below 0).</summary>
    [JsonConverter(typeof(VoltsJson))]
    public double? Negative { get; init; }
}

/// <summary>A closed range, min to max.</summary>
public sealed record RangeInput
{
    public double? Min { get; init; }
    public double? Max { get; init; }
}
