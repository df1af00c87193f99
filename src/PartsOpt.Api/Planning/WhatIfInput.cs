using PartsOpt.Api.Common;
using PartsOpt.Api.Circuits;

namespace PartsOpt.Api.Planning;

// The body of POST /api/v1/design-searches/{id}/what-if: preferred-value ranges ("series"), single
// candidate values ("candidates"), or both. Values SI (Ω, F); tolerances fractions.

/// <summary>Which single values to try adding to the stock for a stored search.</summary>
public sealed record WhatIfInput
{
    public WhatIfSeriesInput? Series { get; init; }
    public IReadOnlyList<WhatIfCandidateInput>? Candidates { get; init; }

    /// <summary>Candidates to list at most, 1–100 (default 10).</summary>
    public int? MaxResults { get; init; }

    /// <summary>Wall time for all candidates together, seconds, up to 300 (default 60).</summary>
    public double? TimeLimitSeconds { get; init; }
}

/// <summary>Ranges of preferred values to try, resistors and/or capacitors.</summary>
public sealed record WhatIfSeriesInput
{
    /// <summary>IEC 60063 series of resistors ("E24").</summary>
    public string? Resistors { get; init; }
    public RangeInput? ResistorRange { get; init; }
    public double? ResistorTolerance { get; init; }
    public decimal? ResistorUnitCost { get; init; }

    /// <summary>IEC 60063 series of capacitors ("E12").</summary>
    public string? Capacitors { get; init; }
    public RangeInput? CapacitorRange { get; init; }
    public string? CapacitorDielectric { get; init; }
    public double? CapacitorTolerance { get; init; }
    public double? CapacitorVoltageRating { get; init; }
    public decimal? CapacitorUnitCost { get; init; }
}

/// <summary>One value to try.</summary>
public sealed record WhatIfCandidateInput
{
    /// <summary>"resistor" or "capacitor".</summary>
    public string? Kind { get; init; }

    /// <summary>Ω or F, a number or text such as "4k7" or "22n".</summary>
    public PartValue? Value { get; init; }
    public double? Tolerance { get; init; }
    public decimal? UnitCost { get; init; }

    /// <summary>Capacitors: C0G (default), X7R…</summary>
    public string? Dielectric { get; init; }

    /// <summary>Capacitors: rated voltage, V (default 50).</summary>
    public double? VoltageRating { get; init; }

    /// <summary>A part number for it; made up from the value when absent.</summary>
    public string? PartNumber { get; init; }
}
