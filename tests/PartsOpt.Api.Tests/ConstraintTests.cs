using Microsoft.EntityFrameworkCore;
using PartsOpt.Api.Movements;
using PartsOpt.Api.Parts;

namespace PartsOpt.Api.Tests;

/// <summary>The database itself refuses rows the rules forbid, whatever code writes them.</summary>
public sealed class ConstraintTests : IClassFixture<StockFactory>
{
    private readonly StockFactory _factory;

    public ConstraintTests(StockFactory factory)
    {
        _factory = factory;
        _ = factory.CreateClient(); // start the service: migrations applied
    }

    [Theory]
    [InlineData(MovementKind.Receipt, -1, 0)]
    [InlineData(MovementKind.Adjustment, 0, 0)]
    [InlineData(MovementKind.Reservation, 1, 1)]
    [InlineData(MovementKind.Release, 0, 2)]
    [InlineData(MovementKind.Consumption, -2, -1)]
    public async Task Ledger_rows_with_the_wrong_signs_are_refused(MovementKind kind, int onHand, int reserved)
    {
        var partNumber = $"R-CK-{kind}";
        await _factory.WithDbAsync(async db =>
        {
            db.Parts.Add(new Part
            {
                PartNumber = partNumber, Kind = PartKind.Resistor, ResistanceOhms = 1, ToleranceMinus = 0.01, TolerancePlus = 0.01,
            });
            await db.SaveChangesAsync();
        });
        await Assert.ThrowsAsync<DbUpdateException>(() => _factory.WithDbAsync(async db =>
        {
            var part = await db.Parts.SingleAsync(p => p.PartNumber == partNumber);
            db.Movements.Add(new Movement
            {
                PartId = part.Id, Kind = kind, OnHandChange = onHand, ReservedChange = reserved,
                Reason = "bad", Actor = "test", AtUtc = DateTime.UtcNow,
            });
            await db.SaveChangesAsync();
        }));
    }

    [Fact]
    public async Task A_part_without_its_kinds_required_columns_is_refused()
    {
        await Assert.ThrowsAsync<DbUpdateException>(() => _factory.WithDbAsync(async db =>
        {
            db.Parts.Add(new Part { PartNumber = "C-CK-EMPTY", Kind = PartKind.Capacitor });
            await db.SaveChangesAsync();
        }));
        await Assert.ThrowsAsync<DbUpdateException>(() => _factory.WithDbAsync(async db =>
        {
            db.Parts.Add(new Part
            {
                PartNumber = "U-CK-3", Kind = PartKind.OpAmp, Sections = 3, SupplyMinV = 3, SupplyMaxV = 30,
                Comparator = false, OpenDrain = false,
            });
            await db.SaveChangesAsync();
        }));
    }
}
