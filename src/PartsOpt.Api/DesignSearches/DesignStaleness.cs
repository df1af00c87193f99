using Microsoft.EntityFrameworkCore;
using PartsOpt.Api.Persistence;

namespace PartsOpt.Api.DesignSearches;

/// <summary>
/// Whether designs can still be built: each need (part number, quantity for the build) against what is
/// available now, on hand less reserved summed over the ledger. A part deleted since counts as none.
/// </summary>
public static class DesignStaleness
{
    public static async Task<Dictionary<int, IReadOnlyList<ShortageDto>>> ShortagesAsync(
        PartsOptDbContext db, IReadOnlyCollection<int> designIds, CancellationToken ct)
    {
        var needs = await db.DesignNeeds.AsNoTracking()
            .Where(n => designIds.Contains(n.DesignId))
            .Select(n => new
            {
                n.DesignId,
                n.PartNumber,
                n.QuantityForBuild,
                Available = db.Parts.Where(p => p.PartNumber == n.PartNumber)
                    .Select(p => (int?)p.Movements.Sum(m => m.OnHandChange - m.ReservedChange))
                    .FirstOrDefault() ?? 0,
            })
            .ToListAsync(ct);
        var shortages = designIds.ToDictionary(id => id, _ => (IReadOnlyList<ShortageDto>)[]);
        foreach (var group in needs.Where(n => n.Available < n.QuantityForBuild).GroupBy(n => n.DesignId))
            shortages[group.Key] = group.OrderBy(n => n.PartNumber, StringComparer.Ordinal)
                .Select(n => new ShortageDto(n.PartNumber, n.QuantityForBuild, n.Available)).ToList();
        return shortages;
    }
}
