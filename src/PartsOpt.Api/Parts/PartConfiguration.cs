using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace PartsOpt.Api.Parts;

/// <summary>The Parts table: one row per part, kind-specific columns nullable, kept honest by CHECKs.</summary>
internal sealed class PartConfiguration : IEntityTypeConfiguration<Part>
{
    public void Configure(EntityTypeBuilder<Part> part)
    {
        part.ToTable("Parts", table =>
        {
            table.HasCheckConstraint("CK_Parts_Resistor",
                "Kind <> 'Resistor' OR (ResistanceOhms IS NOT NULL AND ToleranceMinus IS NOT NULL AND TolerancePlus IS NOT NULL)");
            table.HasCheckConstraint("CK_Parts_Capacitor",
                "Kind <> 'Capacitor' OR (CapacitanceF IS NOT NULL AND Dielectric IS NOT NULL AND VoltageRatingV IS NOT NULL AND Polarised IS NOT NULL)");
            table.HasCheckConstraint("CK_Parts_Potentiometer",
                "Kind <> 'Potentiometer' OR (ResistanceOhms IS NOT NULL AND Taper IS NOT NULL AND Trimmer IS NOT NULL)");
            table.HasCheckConstraint("CK_Parts_OpAmp",
                "Kind <> 'OpAmp' OR (Sections IN (1, 2, 4) AND SupplyMinV IS NOT NULL AND SupplyMaxV IS NOT NULL AND Comparator IS NOT NULL AND OpenDrain IS NOT NULL)");
            table.HasCheckConstraint("CK_Parts_ReorderLevel", "ReorderLevel >= 0");
        });

        part.HasKey(p => p.Id);
        // NOCASE: "r-0603-4k7-1" and "R-0603-4K7-1" are the same part to a person, so to the index too.
        part.Property(p => p.PartNumber).HasMaxLength(PartRules.PartNumberMaxLength).UseCollation("NOCASE");
        part.HasIndex(p => p.PartNumber).IsUnique();
        part.HasIndex(p => new { p.Kind, p.ResistanceOhms });
        part.HasIndex(p => new { p.Kind, p.CapacitanceF });

        part.Property(p => p.Version).IsConcurrencyToken();
        part.Property(p => p.Kind).HasConversion<string>().HasMaxLength(16);
        part.Property(p => p.Dielectric).HasConversion<string>().HasMaxLength(16);
        part.Property(p => p.Taper).HasConversion<string>().HasMaxLength(8);
        part.Property(p => p.Currency).HasMaxLength(3).IsFixedLength();
        part.Property(p => p.Description).HasMaxLength(PartRules.TextMaxLength);
        part.Property(p => p.Package).HasMaxLength(PartRules.ShortTextMaxLength);
        part.Property(p => p.Location).HasMaxLength(PartRules.ShortTextMaxLength);
        part.Property(p => p.Notes).HasMaxLength(PartRules.TextMaxLength);

        part.HasMany(p => p.Movements).WithOne(m => m.Part).HasForeignKey(m => m.PartId)
            .OnDelete(DeleteBehavior.Cascade);
    }
}
