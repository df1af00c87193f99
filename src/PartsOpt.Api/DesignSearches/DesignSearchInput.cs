using System.Text.Json.Serialization;
using PartsOpt.Api.Common;
using PartsOpt.Api.Parts;

namespace PartsOpt.Api.DesignSearches;

// The body of POST /api/v1/design-searches. Every property is nullable so that a missing field is named
// in the 400 rather than read as zero. Volts and hertz take SI numbers or the text a person types ("12V",
// "20k"); tolerances and duty are fractions. The validated input, defaults filled in, is stored and echoed
// as the search's "requirement".

/// <summary>What the team wants built, as a client sends it.</summary>
public sealed record DesignSearchInput
{
    public SupplyInput? Supply { get; init; }
    public SearchBandInput? Frequency { get; init; }

    /// <summary>Peak-to-peak of the triangle or ramp, V; absent when any amplitude will do.</summary>
    public SearchBandInput? TrianglePeakToPeak { get; init; }

    public SearchDutyInput? Duty { get; init; }

    /// <summary>Output levels the PWM output must reach; absent when any will do.</summary>
    public OutputInput? Output { get; init; }

    /// <summary>Boards to build: the stock must cover every one of them.</summary>
    public int? BuildQuantity { get; init; }

    /// <summary>"three-stage", "loop", "rc-ramp"; absent or empty for all three.</summary>
    public IReadOnlyList<string>? Topologies { get; init; }

    public YieldInput? Yield { get; init; }

    /// <summary>Ambient range, °C.</summary>
    public RangeInput? Temperature { get; init; }

    /// <summary>Let a resistor or capacitor role take two stocked parts in series or parallel (default false).</summary>
    public bool? AllowCombinations { get; init; }

    public CostModelInput? CostModel { get; init; }

    /// <summary>Designs to return at most, 1–50 (default 10); the best of each feasible topology is always added.</summary>
    public int? MaxResults { get; init; }

    /// <summary>Wall time the search may take, seconds, up to 60 (default 10).</summary>
    public double? TimeLimitSeconds { get; init; }
}

/// <summary>A target and the fraction either side of it (0.05 for ±5 %).</summary>
public sealed record SearchBandInput
{
    public double? Target { get; init; }
    public double? Tolerance { get; init; }
}

/// <summary>The duty range the adjustment must reach, and what adjusts it.</summary>
public sealed record SearchDutyInput
{
    public double? Min { get; init; }
    public double? Max { get; init; }

    /// <summary>"potentiometer" (default) or "controlVoltage".</summary>
    public string? Adjust { get; init; }

    /// <summary>The control voltage's range (absolute, V); required with "controlVoltage" only.</summary>
    public RangeInput? ControlRange { get; init; }
}

/// <summary>The high level must reach at least <see cref="MinHigh"/>, the low level at most <see cref="MaxLow"/> (V).</summary>
public sealed record OutputInput
{
    [JsonConverter(typeof(VoltsJson))]
    public double? MinHigh { get; init; }

    [JsonConverter(typeof(VoltsJson))]
    public double? MaxLow { get; init; }
}

/// <summary>The fraction of boards that must meet the bands; "worstCase" (default) or "monteCarlo".</summary>
public sealed record YieldInput
{
    public double? Target { get; init; }
    public string? Method { get; init; }
    public int? Samples { get; init; }
}

/// <summary>Charges beyond the parts: per placed part, and per distinct part number for the whole build.</summary>
public sealed record CostModelInput
{
    public decimal? Placement { get; init; }
    public decimal? LineItemSetup { get; init; }
}
