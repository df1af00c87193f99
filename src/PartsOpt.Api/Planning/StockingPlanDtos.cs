using PartsOpt.Planning;
using PartsOpt.Search;
using PartsOpt.Topologies;
using PartsOpt.Values;

namespace PartsOpt.Api.Planning;

// What POST /api/v1/stocking-plans answers. Costs are in the stock's currency; values SI (Ω, F).

/// <summary>A stocking plan: the lines to hold, the design of each product, and the year's cost against today's stock.</summary>
/// <remarks>
/// <c>optimality</c>: "proved", "bestFound" (a cheaper plan may exist; see <c>optimalityText</c>) or "none".<br/>
/// <c>yearlyCost</c>: Σ unitsPerYear × cost per board + <c>yearlyHoldingCost</c>.<br/>
/// <c>yearlyHoldingCost</c>: packageCostPerLine × every line of the plan, today's kept lines included.<br/>
/// <c>today</c>: today's lines unchanged (replenished, none added or dropped).<br/>
/// <c>changeAgainstToday</c>: yearlyCost − today.yearlyCost; negative saves. Compare only when both meet the same requirements.<br/>
/// <c>lowerBound</c>: no plan costs less a year; equal to yearlyCost when proved, null when no bound was found. The gap to yearlyCost is what a "bestFound" plan may leave on the table.<br/>
/// <c>infeasible</c>: requirements no candidate line set meets, with the search's reason.<br/>
/// <c>cautions</c>: Read before building: the PWM output usually drives a power stage.<br/>
/// </remarks>
public sealed record StockingPlanDto(
    string Optimality,
    string OptimalityText,
    string SolverStatus,
    decimal YearlyCost,
    decimal YearlyHoldingCost,
    decimal ChangeAgainstToday,
    decimal? LowerBound,
    IReadOnlyList<PlannedLineDto> Lines,
    IReadOnlyList<string> Added,
    IReadOnlyList<string> Dropped,
    IReadOnlyList<PlannedDesignDto> Designs,
    IReadOnlyList<UnmetRequirementDto> Infeasible,
    TodayStockDto Today,
    int Rounds,
    IReadOnlyDictionary<string, int> CandidateDesigns,
    double ElapsedSeconds,
    IReadOnlyList<string> Notes,
    IReadOnlyList<string> Cautions);

/// <summary>A line of the plan: "new" to buy or "existing" to keep, and the requirements that use it (why it is held).</summary>
public sealed record PlannedLineDto(
    string PartNumber, string Kind, double? Value, string? ValueText, string? Series, double? Tolerance, decimal UnitCost,
    string Status, IReadOnlyList<string> UsedBy);

/// <summary>The design that meets one requirement from the plan's lines.</summary>
public sealed record PlannedDesignDto(
    string Requirement, int UnitsPerYear, string Topology, decimal PerBoard, decimal YearlyCost,
    string Amplifier, string? Comparator, IReadOnlyList<PlannedRoleDto> Roles, IReadOnlyList<string> Lines, IReadOnlyList<string> Notes);

/// <summary>A role of a planned design, the part number(s) filling it and their value.</summary>
public sealed record PlannedRoleDto(string Role, IReadOnlyList<string> PartNumbers, double Value, string ValueText);

/// <summary>A requirement that cannot be met: status "infeasible" (proved) or "unknown" (time ran out).</summary>
public sealed record UnmetRequirementDto(string Requirement, string Status, string Reason);

/// <summary>Today's lines unchanged: the year's cost over the requirements they meet, and those they do not.</summary>
public sealed record TodayStockDto(decimal YearlyCost, IReadOnlyList<TodayDesignDto> Designs, IReadOnlyList<UnmetRequirementDto> Infeasible);

/// <summary>One requirement on today's lines: the search's status and the best cost per board, if any.</summary>
public sealed record TodayDesignDto(string Requirement, string Status, decimal? PerBoard);

internal static class StockingPlanAnswers
{
    public static StockingPlanDto From(StockingPlan plan, IReadOnlyList<string> notes) => new(
        plan.Optimality switch
        {
            PlanOptimality.Proved => "proved",
            PlanOptimality.BestFound => "bestFound",
            _ => "none",
        },
        plan.OptimalityText,
        plan.SolverStatus,
        plan.YearlyCost,
        plan.YearlyHoldingCost,
        plan.ChangeAgainstToday,
        plan.LowerBound,
        plan.Lines.Select(Line).ToList(),
        plan.Lines.Where(l => !l.Existing).Select(l => l.PartNumber).ToList(),
        plan.Dropped,
        plan.Designs.Select(Design).ToList(),
        plan.Unmet.Select(Unmet).ToList(),
        new TodayStockDto(plan.Today.YearlyCost,
            plan.Today.Designs.Select(d => new TodayDesignDto(d.Requirement, Status(d.Status), d.PerBoard)).ToList(),
            plan.Today.Unmet.Select(Unmet).ToList()),
        plan.Rounds,
        plan.CandidateDesigns,
        plan.Elapsed.TotalSeconds,
        [.. notes, .. plan.Notes],
        Common.Cautions.PowerStage);

    internal static UnmetRequirementDto Unmet(UnmetRequirement unmet) => new(unmet.Requirement, Status(unmet.Status), unmet.Reason);

    internal static string Status(SearchStatus status) => status switch
    {
        SearchStatus.Optimal => "optimal",
        SearchStatus.Feasible => "feasible",
        SearchStatus.Infeasible => "infeasible",
        _ => "unknown",
    };

    private static PlannedLineDto Line(PlannedLine line) => new(
        line.PartNumber,
        line.Kind switch
        {
            LineKind.Capacitor => "capacitor",
            LineKind.Potentiometer => "potentiometer",
            LineKind.OpAmp => "op-amp",
            _ => "resistor",
        },
        line.Value,
        line.Value is { } v ? EngineeringValue.Format(v, line.Kind == LineKind.Capacitor ? Quantity.Capacitance : Quantity.Resistance) : null,
        line.Series,
        line.Tolerance,
        line.UnitCost,
        line.Existing ? "existing" : "new",
        line.UsedBy);

    private static PlannedDesignDto Design(PlannedDesign planned)
    {
        var found = planned.Design;
        return new PlannedDesignDto(planned.Requirement, planned.UnitsPerYear, found.Topology.ToWireName(), planned.PerBoard, planned.YearlyCost,
            found.Design.Amplifier.PartNumber ?? "", found.Design.Comparator?.PartNumber,
            [.. RolesOf(found)], planned.Lines, found.Notes);
    }

    internal static IEnumerable<PlannedRoleDto> RolesOf(FoundDesign found) =>
        found.Design.RequiredRoles().Select(role =>
        {
            var part = found.Design.Roles[role];
            var numbers = found.RoleParts.TryGetValue(role, out var n) ? n : [part.PartNumber ?? ""];
            var quantity = Roles.KindOf(role) == RoleKind.Capacitor ? Quantity.Capacitance : Quantity.Resistance;
            return new PlannedRoleDto(role, numbers, part.Value, EngineeringValue.Format(part.Value, quantity));
        });
}
