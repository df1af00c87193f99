using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace PartsOpt.Api.Keys;

/// <summary>The ApiKeys table: names are unique for ever (a revoked key's name stays taken, so the ledger's actor stays unambiguous).</summary>
internal sealed class ApiKeyConfiguration : IEntityTypeConfiguration<ApiKey>
{
    public void Configure(EntityTypeBuilder<ApiKey> key)
    {
        key.ToTable("ApiKeys");
        key.HasKey(k => k.Id);
        key.HasIndex(k => k.Name).IsUnique();
        key.HasIndex(k => k.Hash).IsUnique();
        key.Property(k => k.Name).HasMaxLength(KeyRules.MaxNameLength);
        key.Property(k => k.Prefix).HasMaxLength(16);
        key.Property(k => k.Hash).HasMaxLength(32);
        key.Property(k => k.Roles).HasMaxLength(100);
        key.Property(k => k.CreatedBy).HasMaxLength(KeyRules.MaxNameLength);
        key.Property(k => k.RevokedBy).HasMaxLength(KeyRules.MaxNameLength);
        key.Ignore(k => k.RoleList);
        // SQLite keeps no time zone: every time written is UTC, so every time read is marked UTC.
        key.Property(k => k.CreatedAtUtc).HasConversion(v => v, v => DateTime.SpecifyKind(v, DateTimeKind.Utc));
        key.Property(k => k.ExpiresAtUtc).HasConversion(v => v, v => v.HasValue ? DateTime.SpecifyKind(v.Value, DateTimeKind.Utc) : v);
        key.Property(k => k.RevokedAtUtc).HasConversion(v => v, v => v.HasValue ? DateTime.SpecifyKind(v.Value, DateTimeKind.Utc) : v);
    }
}
