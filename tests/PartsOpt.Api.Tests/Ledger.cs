using Microsoft.EntityFrameworkCore;
using PartsOpt.Api.Movements;

namespace PartsOpt.Api.Tests;

/// <summary>
/// Reservations and releases are booked by builds (/api/v1/builds), not by the movements API; these tests,
/// which need a reservation without a stored design, write
/// those ledger rows straight through the service's DbContext.
/// </summary>
internal static class Ledger
{
    public static Task ReserveAsync(StockFactory factory, string partNumber, int quantity) =>
        AddAsync(factory, partNumber, MovementKind.Reservation, 0, quantity);

    public static Task ReleaseAsync(StockFactory factory, string partNumber, int quantity) =>
        AddAsync(factory, partNumber, MovementKind.Release, 0, -quantity);

    private static Task AddAsync(StockFactory factory, string partNumber, MovementKind kind, int onHand, int reserved) =>
        factory.WithDbAsync(async db =>
        {
            var part = await db.Parts.SingleAsync(p => p.PartNumber == partNumber);
            db.Movements.Add(new Movement
            {
                PartId = part.Id, Kind = kind, OnHandChange = onHand, ReservedChange = reserved,
                Reason = "test build", Actor = "test", AtUtc = DateTime.UtcNow,
            });
            await db.SaveChangesAsync();
        });
}
