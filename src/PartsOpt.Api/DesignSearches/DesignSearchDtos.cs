namespace PartsOpt.Api.DesignSearches;

// What the design-search endpoints answer. SI units throughout (V, Hz, s, A); tolerances, duty and
// frequency error are fractions. A design's "result" part (everything but its id, search, stale flag and
// the fixed cautions) is stored as JSON exactly as first answered, so a read gives back the same figures.

/// <summary>A stored search: the requirement, how the search ended, and its designs in rank order.</summary>
/// <remarks>
/// <c>optimalityProved</c>: True when the solver proved no cheaper design exists (status "optimal").<br/>
/// <c>elapsedSeconds</c>: Wall time the search took.<br/>
/// <c>solves</c>: the search's units of work (designs the engine judged, whole or partial).<br/>
/// <c>topologies</c>: Per topology: feasible, or what blocked it, the nearest miss and a purchase hint.<br/>
/// <c>cautions</c>: Read before building: the PWM output usually drives a power stage.<br/>
/// </remarks>
public sealed record DesignSearchDto(
    int Id,
    DateTime CreatedAt,
    string Actor,
    DesignSearchInput Requirement,
    string Status,
    bool OptimalityProved,
    double ElapsedSeconds,
    int Solves,
    IReadOnlyList<string> Notes,
    IReadOnlyList<TopologyReportDto> Topologies,
    IReadOnlyList<DesignDto> Designs,
    IReadOnlyList<string> Cautions);

/// <summary>What the search found for one topology.</summary>
/// <remarks>
/// <c>proved</c>: the answer for this topology is proved (optimal, or nothing fits).<br/>
/// <c>blocking</c>: why nothing fits, in a designer's words; absent when feasible.<br/>
/// <c>nearestMiss</c>: the closest candidate and what it missed; absent when feasible or none got that far.<br/>
/// <c>purchase</c>: one value to buy that brings the nearest design into the frequency band, when found cheaply.<br/>
/// <c>purchaseNote</c>: why no purchase is suggested, when none is.<br/>
/// </remarks>
public sealed record TopologyReportDto(
    string Topology, bool Feasible, bool Proved, string? Blocking, NearMissDto? NearestMiss,
    PurchaseDto? Purchase, string? PurchaseNote);

/// <summary>A value to buy: the role it fills, "resistor" or "capacitor", the value (Ω or F) and its E series.</summary>
public sealed record PurchaseDto(string Role, string Kind, double Value, string ValueText, string Series, string Explanation);

/// <summary>The nearest miss of an infeasible topology: its parts by role, its figures and its misses.</summary>
public sealed record NearMissDto(
    IReadOnlyDictionary<string, string> Roles, IReadOnlyDictionary<string, double?> Figures, IReadOnlyList<string> Misses);

/// <summary>One design of a search, with its stock status now.</summary>
/// <remarks>
/// <c>stale</c>: True when the stock available now no longer covers the build (see <paramref name="Shortages"/>).<br/>
/// <c>result</c>: The design as the search found it.<br/>
/// </remarks>
public sealed record DesignDto(
    int Id,
    int SearchId,
    int Rank,
    string Topology,
    bool BestOfTopology,
    bool Stale,
    IReadOnlyList<ShortageDto> Shortages,
    DesignResult Result,
    IReadOnlyList<string> Cautions);

/// <summary>A part the design needs more of than is available now.</summary>
public sealed record ShortageDto(string PartNumber, int Needed, int Available);

/// <summary>A design as the search found it (stored as JSON).</summary>
/// <remarks>
/// <c>buildQuantity</c>: Boards the quantities and the total are for.<br/>
/// <c>amplifier</c>: Op-amp part for the analog sections.<br/>
/// <c>comparator</c>: A separate comparator part; absent when a section of the amplifier compares.<br/>
/// <c>dutyAdjust</c>: "potentiometer" or "controlVoltage".<br/>
/// <c>frequencyError</c>: |f − target| / target, nominal.<br/>
/// <c>margin</c>: Smallest relative slack of a banded figure.<br/>
/// </remarks>
public sealed record DesignResult(
    int BuildQuantity,
    SupplyDto Supply,
    string Amplifier,
    string? Comparator,
    bool BufferReference,
    string DutyAdjust,
    CostDto Cost,
    IReadOnlyList<RoleDto> Roles,
    IReadOnlyList<BomLineDto> Bom,
    IReadOnlyList<FigureDto> Figures,
    IReadOnlyList<CheckDto> Checks,
    IReadOnlyList<SectionDto> Sections,
    double? FrequencyError,
    double? Margin,
    IReadOnlyList<string> Notes);

public sealed record SupplyDto(double Positive, double Negative);

/// <summary>Cost per board = parts + placements × placement charge + line items × setup charge / build quantity.</summary>
public sealed record CostDto(
    decimal PartsCost, int Placements, int LineItems, decimal PlacementCost, decimal LineItemSetupCost,
    decimal PerBoard, decimal TotalForBuild, string Currency);

/// <summary>The part(s) filling one role: "series" or "parallel" when two parts make the value.</summary>
/// <remarks>
/// <c>value</c>: The role's value as the engine sees it, SI units.<br/>
/// <c>valueText</c>: The value as a person writes it ("4.7 kΩ").<br/>
/// </remarks>
public sealed record RoleDto(
    string Role, string Designator, IReadOnlyList<string> PartNumbers, double Value, string ValueText,
    string? Combination, double ToleranceMinus, double TolerancePlus);

/// <summary>A BOM line: one part number, where it goes, and how many.</summary>
/// <remarks>
/// <c>uses</c>: Roles, "decoupling" or the op-amp's functions.<br/>
/// <c>value</c>: The part's value as a person writes it; empty for op-amps.<br/>
/// <c>onHand</c>: On hand when the search ran.<br/>
/// <c>available</c>: On hand less reserved when the search ran.<br/>
/// </remarks>
public sealed record BomLineDto(
    IReadOnlyList<string> Designators, string PartNumber, string Description, string Value,
    IReadOnlyList<string> Uses, int PerUnit, int ForBuild, decimal UnitCost, decimal LineCost, string Currency,
    int OnHand, int Available);

/// <summary>A nominal figure; value absent where the circuit cannot produce it.</summary>
public sealed record FigureDto(string Name, double? Value, string Unit);

/// <summary>A check of the design: margin positive inside the limit; severity "failure" or "warning".</summary>
public sealed record CheckDto(string Name, bool Passed, double? Margin, string MarginUnit, string Severity, string Reason);

/// <summary>An op-amp section: what it does and where it sits (U1A…).</summary>
public sealed record SectionDto(string Function, string Designator, string? PartNumber);
