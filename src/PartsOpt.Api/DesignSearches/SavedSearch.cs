using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace PartsOpt.Api.DesignSearches;

/// <summary>
/// A design search as run: the requirement, how it ended, its notes and topology reports. JSON columns are
/// TEXT holding exactly what the API answered; nothing queries inside them.
/// </summary>
public sealed class SavedSearch
{
    public int Id { get; set; }
    public DateTime CreatedAtUtc { get; set; }
    public string Actor { get; set; } = "";

    /// <summary>The validated request with its defaults filled in (<see cref="DesignSearchInput"/>).</summary>
    public string RequirementJson { get; set; } = "";

    /// <summary>"optimal", "feasible", "infeasible" or "unknown".</summary>
    public string Status { get; set; } = "";
    public bool OptimalityProved { get; set; }
    public double ElapsedSeconds { get; set; }
    public int Solves { get; set; }
    public string NotesJson { get; set; } = "[]";
    public string TopologiesJson { get; set; } = "[]";
    public List<SavedDesign> Designs { get; } = [];
}

/// <summary>
/// One design of a search: its rank, topology and cost, the result as answered (JSON), and the stock it
/// needs for the whole build as <see cref="DesignNeed"/> rows, so staleness is a query against the ledger.
/// </summary>
public sealed class SavedDesign
{
    public int Id { get; set; }
    public int SearchId { get; set; }
    public SavedSearch? Search { get; set; }
    public int Rank { get; set; }
    public string Topology { get; set; } = "";
    public bool BestOfTopology { get; set; }

    /// <summary>Stored as TEXT by the SQLite provider (exact); never sorted in SQL, the rank orders.</summary>
    public decimal CostPerBoard { get; set; }

    /// <summary>The <see cref="DesignResult"/> as JSON.</summary>
    public string ResultJson { get; set; } = "";
    public List<DesignNeed> Needs { get; } = [];
}

/// <summary>
/// The stock snapshot of a design: a part number, how many the build needs, and how many were available
/// when the search ran. Keyed by part number, not a foreign key: deleting a part must not erase what a
/// design relied on (it makes the design stale instead).
/// </summary>
public sealed class DesignNeed
{
    public long Id { get; set; }
    public int DesignId { get; set; }
    public string PartNumber { get; set; } = "";
    public int QuantityForBuild { get; set; }
    public int AvailableAtSearch { get; set; }
}

internal sealed class SavedSearchConfiguration : IEntityTypeConfiguration<SavedSearch>
{
    public void Configure(EntityTypeBuilder<SavedSearch> search)
    {
        search.ToTable("DesignSearches");
        search.HasKey(s => s.Id);
        search.Property(s => s.Status).HasMaxLength(16);
        search.Property(s => s.Actor).HasMaxLength(100);
        search.Property(s => s.CreatedAtUtc).HasConversion(v => v, v => DateTime.SpecifyKind(v, DateTimeKind.Utc));
        search.HasMany(s => s.Designs).WithOne(d => d.Search).HasForeignKey(d => d.SearchId).OnDelete(DeleteBehavior.Cascade);
    }
}

internal sealed class SavedDesignConfiguration : IEntityTypeConfiguration<SavedDesign>
{
    public void Configure(EntityTypeBuilder<SavedDesign> design)
    {
        design.ToTable("Designs", table => table.HasCheckConstraint("CK_Designs_Rank", "Rank >= 1"));
        design.HasKey(d => d.Id);
        design.HasIndex(d => new { d.SearchId, d.Rank }).IsUnique();
        design.Property(d => d.Topology).HasMaxLength(16);
        design.HasMany(d => d.Needs).WithOne().HasForeignKey(n => n.DesignId).OnDelete(DeleteBehavior.Cascade);
    }
}

internal sealed class DesignNeedConfiguration : IEntityTypeConfiguration<DesignNeed>
{
    public void Configure(EntityTypeBuilder<DesignNeed> need)
    {
        need.ToTable("DesignNeeds", table => table.HasCheckConstraint("CK_DesignNeeds_Quantity", "QuantityForBuild > 0"));
        need.HasKey(n => n.Id);
        need.HasIndex(n => new { n.DesignId, n.PartNumber }).IsUnique();
        // Compared as the Parts table compares part numbers.
        need.Property(n => n.PartNumber).HasMaxLength(Parts.PartRules.PartNumberMaxLength).UseCollation("NOCASE");
    }
}
