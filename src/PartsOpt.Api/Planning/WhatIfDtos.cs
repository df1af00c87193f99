using PartsOpt.Planning;
using PartsOpt.Search;
using PartsOpt.Topologies;
using PartsOpt.Values;

namespace PartsOpt.Api.Planning;

/// <summary>Which one value to add to the stock for a stored search, ranked.</summary>
/// <remarks>
/// <c>baseStatus</c>, <c>basePerBoard</c>: the search on today's stock, run again now.<br/>
/// <c>ranked</c>: the candidates that help — those that make the search feasible first (cheapest first), then the largest
/// drop of the best cost per board.<br/>
/// <c>pruned</c>: candidates set aside without a search because they cannot lower the cost (docs/what-if.md).<br/>
/// <c>cutShort</c>: true when the time limit left candidates unsearched (<c>notExamined</c>) or searches unfinished (<c>unproved</c>).<br/>
/// </remarks>
public sealed record WhatIfDto(
    int SearchId, string BaseStatus, decimal? BasePerBoard, IReadOnlyList<WhatIfCandidateDto> Ranked,
    int Candidates, int Examined, int Pruned, int NotExamined, int Unproved, bool CutShort, double ElapsedSeconds,
    IReadOnlyList<string> Notes, IReadOnlyList<string> Cautions);

/// <summary>One candidate that helps: the value, what the best design costs with it, and that design.</summary>
public sealed record WhatIfCandidateDto(
    int Rank, string PartNumber, string Kind, double Value, string ValueText, double Tolerance, decimal UnitCost,
    bool MakesFeasible, string Status, decimal? PerBoard, decimal? Improvement, WhatIfDesignDto? Design);

/// <summary>The new best design with the candidate added.</summary>
public sealed record WhatIfDesignDto(string Topology, decimal PerBoard, string Amplifier, string? Comparator,
    IReadOnlyList<PlannedRoleDto> Roles, IReadOnlyList<string> Lines);

internal static class WhatIfAnswers
{
    public static WhatIfDto From(int searchId, WhatIfOutcome outcome, int candidates, int maxResults, IReadOnlyList<string> notes) => new(
        searchId,
        StockingPlanAnswers.Status(outcome.BaseStatus),
        outcome.BasePerBoard,
        outcome.Ranked.Take(maxResults).Select((r, i) => Candidate(i + 1, r)).ToList(),
        candidates,
        outcome.Examined,
        outcome.Pruned,
        outcome.NotExamined,
        outcome.Unproved,
        outcome.CutShort,
        outcome.Elapsed.TotalSeconds,
        outcome.CutShort ? [.. notes, "The time limit cut the list short: candidates not searched, or searched only in part, may rank higher."] : notes,
        Common.Cautions.PowerStage);

    private static WhatIfCandidateDto Candidate(int rank, WhatIfResult result)
    {
        var part = result.Part;
        var capacitor = part.Kind == RoleKind.Capacitor;
        return new WhatIfCandidateDto(rank, part.PartNumber, capacitor ? "capacitor" : "resistor", part.Value,
            EngineeringValue.Format(part.Value, capacitor ? Quantity.Capacitance : Quantity.Resistance), part.Tolerance, part.UnitCost,
            result.MakesFeasible, StockingPlanAnswers.Status(result.Status), result.BestPerBoard, result.Improvement,
            result.Design is { } d
                ? new WhatIfDesignDto(d.Topology.ToWireName(), d.Cost.PerBoard, d.Design.Amplifier.PartNumber ?? "", d.Design.Comparator?.PartNumber,
                    [.. StockingPlanAnswers.RolesOf(d)], d.Bom.Select(b => b.PartNumber).ToList())
                : null);
    }
}
