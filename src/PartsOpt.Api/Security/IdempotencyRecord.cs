using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace PartsOpt.Api.Security;

/// <summary>
/// One Idempotency-Key of one API key: the SHA-256 of the request (method, path, query, body) and, once the
/// work is done, the answer to replay. A row without a status is work in progress.
/// </summary>
public sealed class IdempotencyRecord
{
    public long Id { get; set; }
    public int ApiKeyId { get; set; }
    public string Key { get; set; } = "";
    public byte[] RequestHash { get; set; } = [];
    public int? StatusCode { get; set; }
    public string? ContentType { get; set; }
    public string? Location { get; set; }
    public byte[]? Body { get; set; }
    public DateTime CreatedAtUtc { get; set; }
    public DateTime ExpiresAtUtc { get; set; }
}

/// <summary>The IdempotencyRecords table: one row per (API key, Idempotency-Key).</summary>
internal sealed class IdempotencyRecordConfiguration : IEntityTypeConfiguration<IdempotencyRecord>
{
    public void Configure(EntityTypeBuilder<IdempotencyRecord> record)
    {
        record.ToTable("IdempotencyRecords");
        record.HasKey(r => r.Id);
        record.HasIndex(r => new { r.ApiKeyId, r.Key }).IsUnique();
        record.HasIndex(r => r.ExpiresAtUtc);
        record.HasOne<Keys.ApiKey>().WithMany().HasForeignKey(r => r.ApiKeyId).OnDelete(DeleteBehavior.Cascade);
        record.Property(r => r.Key).HasMaxLength(Idempotency.MaxKeyLength);
        record.Property(r => r.RequestHash).HasMaxLength(32);
        record.Property(r => r.ContentType).HasMaxLength(200);
        record.Property(r => r.Location).HasMaxLength(2000);
        record.Property(r => r.CreatedAtUtc).HasConversion(v => v, v => DateTime.SpecifyKind(v, DateTimeKind.Utc));
        record.Property(r => r.ExpiresAtUtc).HasConversion(v => v, v => DateTime.SpecifyKind(v, DateTimeKind.Utc));
    }
}
