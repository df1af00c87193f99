using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;
using PartsOpt.Api.Parts;

namespace PartsOpt.Api.Builds;

/// <summary>Where a build stands. Reserved is the only state a build leaves; the other two are final.</summary>
public enum BuildStatus
{
    /// <summary>The parts are set aside (reservation rows in the ledger).</summary>
    Reserved,
    /// <summary>The boards were built: the reservation was consumed (on hand and reserved both fell).</summary>
    Completed,
    /// <summary>The build was called off: the reservation was released (reserved fell).</summary>
    Cancelled,
}

/// <summary>
/// A production run of a stored design: how many boards, the caller's work-order reference, and one
/// <see cref="BuildLine"/> per part it set aside. The stock itself moves only through ledger rows
/// (<see cref="Movements.StockLedger"/>); the lines say what this build reserved and consumed.
/// </summary>
public sealed class Build
{
    public int Id { get; set; }

    /// <summary>The stored design built. Not a foreign key: the build keeps its own lines.</summary>
    public int DesignId { get; set; }

    public int Quantity { get; set; }
    public string Reference { get; set; } = "";
    public string Note { get; set; } = "";
    public BuildStatus Status { get; set; }

    /// <summary>The key that reserved the parts.</summary>
    public string Actor { get; set; } = "";
    public DateTime ReservedAtUtc { get; set; }

    /// <summary>The key that completed or cancelled the build, and when; absent while reserved.</summary>
    public string? ClosedBy { get; set; }
    public DateTime? ClosedAtUtc { get; set; }

    public List<BuildLine> Lines { get; } = [];
}

/// <summary>
/// One part of a build: per board, reserved for the build, and consumed once it is complete. Keyed by part
/// number (as a design's needs are), so a part deleted after the build leaves its history readable.
/// </summary>
public sealed class BuildLine
{
    public long Id { get; set; }
    public int BuildId { get; set; }
    public string PartNumber { get; set; } = "";
    public int PerUnit { get; set; }
    public int Reserved { get; set; }
    public int Consumed { get; set; }
}

internal sealed class BuildConfiguration : IEntityTypeConfiguration<Build>
{
    public void Configure(EntityTypeBuilder<Build> build)
    {
        build.ToTable("Builds", table => table.HasCheckConstraint("CK_Builds_Quantity", "Quantity >= 1"));
        build.HasKey(b => b.Id);
        build.HasIndex(b => new { b.Status, b.Id });
        build.Property(b => b.Status).HasConversion<string>().HasMaxLength(16);
        build.Property(b => b.Reference).HasMaxLength(BuildRules.ReferenceMaxLength);
        build.Property(b => b.Note).HasMaxLength(BuildRules.NoteMaxLength);
        build.Property(b => b.Actor).HasMaxLength(100);
        build.Property(b => b.ClosedBy).HasMaxLength(100);
        // SQLite keeps no time zone: every time written is UTC, so every time read is marked UTC.
        build.Property(b => b.ReservedAtUtc).HasConversion(v => v, v => DateTime.SpecifyKind(v, DateTimeKind.Utc));
        build.Property(b => b.ClosedAtUtc).HasConversion(
            v => v, v => v.HasValue ? DateTime.SpecifyKind(v.Value, DateTimeKind.Utc) : v);
        build.HasMany(b => b.Lines).WithOne().HasForeignKey(l => l.BuildId).OnDelete(DeleteBehavior.Cascade);
    }
}

internal sealed class BuildLineConfiguration : IEntityTypeConfiguration<BuildLine>
{
    public void Configure(EntityTypeBuilder<BuildLine> line)
    {
        line.ToTable("BuildLines", table => table.HasCheckConstraint("CK_BuildLines_Quantities",
            "PerUnit >= 1 AND Reserved >= 1 AND Consumed >= 0 AND Consumed <= Reserved"));
        line.HasKey(l => l.Id);
        line.HasIndex(l => new { l.BuildId, l.PartNumber }).IsUnique();
        // Compared as the Parts table compares part numbers.
        line.Property(l => l.PartNumber).HasMaxLength(PartRules.PartNumberMaxLength).UseCollation("NOCASE");
    }
}
