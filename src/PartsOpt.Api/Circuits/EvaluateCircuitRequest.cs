using System.Text.Json.Serialization;
using PartsOpt.Api.Common;
using PartsOpt.Api.Parts;

namespace PartsOpt.Api.Circuits;

// The body of POST /api/v1/circuits/evaluate. Every property is nullable so a missing one is reported by
// name rather than read as zero. Numbers are SI; value fields also take the text a person types.

/// <summary>A hand-made design to analyse: its topology, supply, op-amp and a part for each role.</summary>
public sealed record EvaluateCircuitRequest
{
    /// <summary>"three-stage", "loop" or "rc-ramp".</summary>
    public string? Topology { get; init; }

    /// <summary>The rails; a negative rail of 0 is a single supply (a mid-rail reference then needs ref.* roles).</summary>
    public SupplyInput? Supply { get; init; }

    /// <summary>The op-amp of the analog sections: a stock part number, or its limits.</summary>
    public OpAmpInput? OpAmp { get; init; }

    /// <summary>A separate part for the comparator section (a dedicated comparator); default the op-amp.</summary>
    public OpAmpInput? Comparator { get; init; }

    /// <summary>How the duty is set; default a potentiometer in the threshold divider.</summary>
    public DutyInput? Duty { get; init; }

    /// <summary>Single supply only: buffer the mid-rail reference with a spare section.</summary>
    public bool? BufferReference { get; init; }

    /// <summary>A part for each role of the topology, by role name (osc.r, int.c, cmp.pot…).</summary>
    public Dictionary<string, RoleInput>? Roles { get; init; }

    /// <summary>Which analyses to run and how; defaults run them all at moderate cost.</summary>
    public AnalysisInput? Analysis { get; init; }
}

/// <summary>An op-amp or comparator: a stocked part, or its limits written out.</summary>
public sealed record OpAmpInput
{
    /// <summary>A stocked op-amp or comparator.</summary>
    public string? PartNumber { get; init; }

    /// <summary>Instead of a part number: the limits, in the same shape as a part's "opAmp" object.</summary>
    public OpAmpFields? Limits { get; init; }
}

/// <summary>How the duty is adjusted.</summary>
public sealed record DutyInput
{
    /// <summary>"potentiometer" (cmp.ra, cmp.pot, cmp.rb roles) or "controlVoltage".</summary>
    public string? Adjust { get; init; }

    /// <summary>With "controlVoltage": the range of the threshold voltage in volts.</summary>
    public RangeInput? ControlRange { get; init; }
}

/// <summary>The part in one role: a stocked part number, or a value with its tolerance and drift.</summary>
public sealed record RoleInput
{
    /// <summary>A stocked part of the role's kind; when given, its value, tolerance, drift and ratings are used.</summary>
    public string? PartNumber { get; init; }

    /// <summary>Ω or F as a number, or text such as "4k7", "4.7 kΩ", "100n".</summary>
    public PartValue? Value { get; init; }

    /// <summary>Symmetric tolerance as a fraction (0.01 for 1 %).</summary>
    public double? Tolerance { get; init; }

    /// <summary>Tolerance as written on a part: an IEC 60062 letter ("F", "J", "Z") or "5%", "+80/-20%".</summary>
    public string? ToleranceCode { get; init; }

    /// <summary>Resistors and film capacitors: temperature coefficient, ±ppm/K.</summary>
    public double? TempcoPpmPerK { get; init; }

    /// <summary>Capacitors: C0G, X7R, X5R, Y5V, Z5U, Film or Electrolytic (default C0G).</summary>
    public string? Dielectric { get; init; }

    /// <summary>Resistors: power rating in W, for the derating check.</summary>
    public double? PowerRatingW { get; init; }

    /// <summary>Capacitors: voltage rating in V, for the derating check.</summary>
    public double? VoltageRatingV { get; init; }
}

/// <summary>Which analyses to run on the design.</summary>
public sealed record AnalysisInput
{
    /// <summary>Tolerance methods: any of "worstCase", "rootSumSquare", "monteCarlo"; default all three, [] for none.</summary>
    public string[]? Methods { get; init; }

    /// <summary>Monte Carlo samples, 100…100,000 (default 2,000).</summary>
    public int? Samples { get; init; }

    /// <summary>Monte Carlo seed: the same seed gives the same figures (default 1).</summary>
    public int? Seed { get; init; }

    /// <summary>How parts spread inside their tolerance: "uniform" (default) or "normal" (band = ±3σ).</summary>
    public string? Distribution { get; init; }

    /// <summary>
    /// Spread of the op-amps' output headroom as a fraction (0.2 for ±20 % of the stated headroom), for data
    /// sheets that give it as typical; default 0 (taken as stated).
    /// </summary>
    public double? HeadroomSpread { get; init; }

    /// <summary>Temperature range in °C for drift (and for worst case and Monte Carlo when given).</summary>
    public RangeInput? Temperature { get; init; }

    /// <summary>Bands the yield is counted against, by figure name.</summary>
    public List<BandInput>? Bands { get; init; }

    /// <summary>Points per simulated waveform, 0 (no simulation) or 10…5,000 (default 400).</summary>
    public int? WaveformPoints { get; init; }

    /// <summary>The setting 0…1 (pot position or control range) at which the simulation runs (default 0.5).</summary>
    public double? SimulationSetting { get; init; }

    /// <summary>Points on the duty-versus-setting curve, 2…201 (default 21).</summary>
    public int? DutyCurvePoints { get; init; }
}

/// <summary>A band a figure must stay inside for a sample to count towards the yield.</summary>
public sealed record BandInput
{
    /// <summary>Figure name (frequency, trianglePeakToPeak, dutyAtSettingMin…).</summary>
    public string? Figure { get; init; }
    public double? Min { get; init; }
    public double? Max { get; init; }
}
