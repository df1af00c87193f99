using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace PartsOpt.Api.Movements;

/// <summary>The Movements table: the append-only ledger, with the sign rules of each kind as a CHECK.</summary>
internal sealed class MovementConfiguration : IEntityTypeConfiguration<Movement>
{
    public void Configure(EntityTypeBuilder<Movement> movement)
    {
        movement.ToTable("Movements", table => table.HasCheckConstraint("CK_Movements_Signs",
            "(Kind = 'Receipt' AND OnHandChange > 0 AND ReservedChange = 0)"
            + " OR (Kind = 'Adjustment' AND OnHandChange <> 0 AND ReservedChange = 0)"
            + " OR (Kind = 'Reservation' AND OnHandChange = 0 AND ReservedChange > 0)"
            + " OR (Kind = 'Release' AND OnHandChange = 0 AND ReservedChange < 0)"
            + " OR (Kind = 'Consumption' AND OnHandChange < 0 AND ReservedChange = OnHandChange)"));

        movement.HasKey(m => m.Id);
        movement.HasIndex(m => new { m.PartId, m.Id });
        movement.Property(m => m.Kind).HasConversion<string>().HasMaxLength(16);
        movement.Property(m => m.Reason).HasMaxLength(200);
        movement.Property(m => m.Actor).HasMaxLength(100);
        // SQLite keeps no time zone: every time written is UTC, so every time read is marked UTC.
        movement.Property(m => m.AtUtc).HasConversion(
            v => v, v => DateTime.SpecifyKind(v, DateTimeKind.Utc));
    }
}
