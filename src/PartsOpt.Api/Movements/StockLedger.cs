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

    /// <summary>
    /// The figures of several parts at once, by part number (case-insensitive, as the Parts table compares
    /// them); a part number with no part is absent. Read inside the caller's transaction when booking.
    /// </summary>
    public static async Task<Dictionary<string, (Part Part, StockFigures Figures)>> FiguresOfAsync(
        PartsOptDbContext db, IReadOnlyCollection<string> partNumbers, CancellationToken ct)
    {
        var rows = await db.Parts.AsNoTracking()
            .Where(p => partNumbers.Contains(p.PartNumber))
            .Select(p => new
            {
                Part = p,
                OnHand = p.Movements.Sum(m => m.OnHandChange),
                Reserved = p.Movements.Sum(m => m.ReservedChange),
            })
            .ToListAsync(ct);
        return rows.ToDictionary(r => r.Part.PartNumber, r => (r.Part, new StockFigures(r.OnHand, r.Reserved)),
            StringComparer.OrdinalIgnoreCase);
    }

    /// <summary>
    /// Adds a build's row to the context (saved by the caller): a reservation (reserved +quantity), a release
    /// (reserved −quantity) or a consumption (on hand and reserved both −quantity). The caller has checked the
    /// figures inside its transaction: available for a reservation, reserved for a release or consumption.
    /// </summary>
    public static Movement BookForBuild(PartsOptDbContext db, int partId, MovementKind kind, int quantity,
        string reason, string actor, DateTime atUtc)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(quantity, 1);
        var (onHandChange, reservedChange) = kind switch
        {
            MovementKind.Reservation => (0, quantity),
            MovementKind.Release => (0, -quantity),
            MovementKind.Consumption => (-quantity, -quantity),
            _ => throw new ArgumentOutOfRangeException(nameof(kind), kind, "Builds book reservations, releases and consumption."),
        };
        var movement = new Movement
        {
            PartId = partId,
            Kind = kind,
            OnHandChange = onHandChange,
            ReservedChange = reservedChange,
            Reason = reason.Length > MovementsEndpoints.MaxReasonLength ? reason[..MovementsEndpoints.MaxReasonLength] : reason,
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
