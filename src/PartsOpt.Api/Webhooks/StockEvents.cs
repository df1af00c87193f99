using PartsOpt.Api.Movements;
using PartsOpt.Api.Parts;
using PartsOpt.Api.Parts.Csv;
using PartsOpt.Api.Persistence;

namespace PartsOpt.Api.Webhooks;

/// <summary>The stock events: what the ledger and the import publish, and when.</summary>
public static class StockEvents
{
    /// <summary>
    /// True when stock goes from at/above its reorder level to below it. A part already below stays quiet
    /// until it has come back up; a level raised above the available quantity counts as a crossing too.
    /// </summary>
    public static bool CrossesBelow(int availableBefore, int levelBefore, int availableAfter, int levelAfter) =>
        availableBefore >= levelBefore && availableAfter < levelAfter;

    /// <summary>Publishes stock.low for <paramref name="part"/> with its figures after the change.</summary>
    public static void Low(PartsOptDbContext db, Part part, StockFigures after, string actor, string cause,
        DateTime atUtc) =>
        EventOutbox.Add(db, EventTypes.StockLow, new StockLowPayload(part.PartNumber, after.OnHand, after.Reserved,
            after.Available, part.ReorderLevel, actor, cause), atUtc);

    /// <summary>Publishes stock.imported for a committed import.</summary>
    public static void Imported(PartsOptDbContext db, ImportReport report, string actor, DateTime atUtc) =>
        EventOutbox.Add(db, EventTypes.StockImported, new StockImportedPayload(report.Created.Count,
            report.Updated.Count, report.Unchanged, report.Movements, report.Created, report.Updated, actor), atUtc);
}

/// <summary>The data of stock.low. <c>cause</c> is "movement", "import" or "build" (a reservation).</summary>
public sealed record StockLowPayload(string PartNumber, int QuantityOnHand, int Reserved, int Available,
    int ReorderLevel, string Actor, string Cause);

/// <summary>The data of stock.imported: counts, and the part numbers created and updated.</summary>
public sealed record StockImportedPayload(int Created, int Updated, int Unchanged, int Movements,
    IReadOnlyList<string> CreatedParts, IReadOnlyList<string> UpdatedParts, string Actor);
