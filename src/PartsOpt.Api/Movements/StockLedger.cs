using Microsoft.EntityFrameworkCore;
using PartsOpt.Api.Parts;
using PartsOpt.Api.Persistence;

namespace PartsOpt.Api.Movements;

/// <summary>A part's stock figures, both sums over its ledger.</summary>
public readonly record struct StockFigures(int OnHand, int Reserved)
{
    public int Available => OnHand - Reserved;
}

/// <summary>
/// The only code that writes ledger rows. Quantity on hand and reserved are never stored: they are sums
/// over the rows, so they cannot drift from the ledger. Callers that check a figure and then book against
/// it do so inside a transaction (SQLite's BEGIN IMMEDIATE, Microsoft.Data.Sqlite's default), so two
/// writers cannot both pass the check.
/// </summary>
public static class StockLedger
{
    public static async Task<StockFigures> FiguresAsync(PartsOptDbContext db, int partId, CancellationToken ct)
    {
        var sums = await db.Movements.Where(m => m.PartId == partId)
            .GroupBy(m => m.PartId)
            .Select(g => new { OnHand = g.Sum(m => m.OnHandChange), Reserved = g.Sum(m => m.ReservedChange) })
            .SingleOrDefaultAsync(ct);
        return sums is null ? default : new StockFigures(sums.OnHand, sums.Reserved);
    }

    /// <summary>Adds a receipt or an adjustment row to the context (saved by the caller).</summary>
    public static Movement Book(PartsOptDbContext db, Part part, MovementKind kind, int onHandChange,
        string reason, string actor, DateTime atUtc)
    {
        if (kind is not (MovementKind.Receipt or MovementKind.Adjustment))
            throw new ArgumentOutOfRangeException(nameof(kind), kind, "Only receipts and adjustments are booked here.");
        var movement = new Movement
        {
            Part = part,
            Kind = kind,
            OnHandChange = onHandChange,
            ReservedChange = 0,
            Reason = reason,
            Actor = actor,
            AtUtc = atUtc,
        };
        db.Movements.Add(movement);
        return movement;
    }

    /// <summary>Why an on-hand change may not be booked, or null when it may.</summary>
    public static string? AdjustmentProblem(StockFigures figures, int onHandChange)
    {
        var after = figures.OnHand + onHandChange;
        if (after < 0)
            return $"The change of {onHandChange} would leave {after} on hand; stock cannot go below zero.";
        if (after < figures.Reserved)
            return $"The change of {onHandChange} would leave {after} on hand, below the {figures.Reserved} reserved for builds.";
        return null;
    }
}
