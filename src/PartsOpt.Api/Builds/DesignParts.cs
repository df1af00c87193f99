using System.Text.Json;
using PartsOpt.Api.DesignSearches;

namespace PartsOpt.Api.Builds;

/// <summary>One part of a stored design's BOM: how many go on each board, and its price when searched.</summary>
public sealed record DesignPart(string PartNumber, int PerUnit, decimal UnitCost, string Currency);

/// <summary>
/// The parts of a stored design, read from its BOM as answered: every line, the op-amp packages and the
/// decoupling capacitors included. A part on two lines (never written so, but cheap to allow) is one part.
/// </summary>
public static class DesignParts
{
    public static IReadOnlyList<DesignPart> Of(SavedDesign design)
    {
        var result = JsonSerializer.Deserialize<DesignResult>(design.ResultJson, DesignSearchesEndpoints.Storage)
            ?? throw new InvalidOperationException($"Design {design.Id} has no stored result.");
        return result.Bom
            .GroupBy(line => line.PartNumber, StringComparer.OrdinalIgnoreCase)
            .Select(g => new DesignPart(g.First().PartNumber, g.Sum(line => line.PerUnit), g.First().UnitCost, g.First().Currency))
            .OrderBy(p => p.PartNumber, StringComparer.Ordinal)
            .ToList();
    }
}
