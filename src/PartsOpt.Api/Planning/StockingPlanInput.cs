using PartsOpt.Api.Common;
using PartsOpt.Api.DesignSearches;
using PartsOpt.Api.Parts;

namespace PartsOpt.Api.Planning;

// The body of POST /api/v1/stocking-plans. Every property is nullable so that a missing field is named in
// the 400. Values are SI (Ω, F, V); tolerances are fractions; prices per piece in the stock's currency.

/// <summary>"Which values should we stock?": the products of the year and the lines that could be bought.</summary>
public sealed record StockingPlanInput
{
    /// <summary>The products, at least one, at most 50.</summary>
    public IReadOnlyList<YearlyRequirementInput>? Requirements { get; init; }

    public CandidatesInput? Candidates { get; init; }

    /// <summary>True (default): every line in stock today stays; false: lines nothing uses may be dropped.</summary>
    public bool? KeepExisting { get; init; }

    /// <summary>Designs first asked of each requirement's search over every candidate line, 1–320 (default 40).</summary>
    public int? PoolSize { get; init; }

    /// <summary>Wall time of one design search, seconds, up to 60 (default 10).</summary>
    public double? SearchTimeLimitSeconds { get; init; }

    /// <summary>Wall time of the whole plan, seconds, up to 600 (default 120); when it runs out the plan found so far is answered, not proved.</summary>
    public double? TimeLimitSeconds { get; init; }
}

/// <summary>One product: a design-search requirement and how many boards a year.</summary>
public sealed record YearlyRequirementInput
{
    /// <summary>Unique name, up to 100 characters.</summary>
    public string? Name { get; init; }

    /// <summary>The same body as POST /api/v1/design-searches (its buildQuantity is the lot size; its time limit
    /// and maxResults are not used here).</summary>
    public DesignSearchInput? Requirement { get; init; }

    /// <summary>Boards a year, above 0.</summary>
    public int? UnitsPerYear { get; init; }
}

/// <summary>The lines that could be added: preferred-value ranges, op-amps, prices, and the yearly holding cost of a line.</summary>
public sealed record CandidatesInput
{
    /// <summary>IEC 60063 series of the resistors to consider ("E24"); absent for none.</summary>
    public string? ResistorSeries { get; init; }

    /// <summary>Ω, min ≤ max.</summary>
    public RangeInput? ResistorRange { get; init; }

    /// <summary>Fraction (default 0.01).</summary>
    public double? ResistorTolerance { get; init; }

    /// <summary>Price of one resistor piece.</summary>
    public decimal? ResistorUnitCost { get; init; }

    /// <summary>IEC 60063 series of the capacitors to consider ("E12"); absent for none.</summary>
    public string? CapacitorSeries { get; init; }

    /// <summary>F, min ≤ max.</summary>
    public RangeInput? CapacitorRange { get; init; }

    /// <summary>C0G (default), X7R, X5R, Film…</summary>
    public string? CapacitorDielectric { get; init; }

    /// <summary>Fraction (default 0.05).</summary>
    public double? CapacitorTolerance { get; init; }

    /// <summary>Rated voltage of the capacitors, V (default 50).</summary>
    public double? CapacitorVoltageRating { get; init; }

    /// <summary>Price of one capacitor piece.</summary>
    public decimal? CapacitorUnitCost { get; init; }

    /// <summary>Op-amps or comparators that could be bought, limits in the parts API's shape.</summary>
    public IReadOnlyList<CandidateOpAmpInput>? OpAmps { get; init; }

    /// <summary>Cost of holding one stocked line item for a year (≥ 0), charged for every line of the plan.</summary>
    public decimal? PackageCostPerLine { get; init; }
}

/// <summary>An op-amp that could be bought.</summary>
public sealed record CandidateOpAmpInput
{
    public string? PartNumber { get; init; }
    public OpAmpFields? OpAmp { get; init; }
    public decimal? UnitCost { get; init; }
}
