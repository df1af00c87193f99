using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace PartsOpt.Api.Webhooks;

/// <summary>
/// One event owed to one subscription: pending until a 2xx answer sets <see cref="DeliveredAtUtc"/>.
/// A subscription's pending deliveries go out strictly in event order (<see cref="OutboxEventId"/>).
/// </summary>
public sealed class Delivery
{
    public long Id { get; set; }
    public long SubscriptionId { get; set; }
    public Subscription? Subscription { get; set; }
    public long OutboxEventId { get; set; }
    public OutboxEvent? Event { get; set; }
    public int Attempts { get; set; }
    public DateTime NextAttemptAtUtc { get; set; }
    public DateTime? DeliveredAtUtc { get; set; }
    public List<DeliveryAttempt> AttemptLog { get; } = [];
}

/// <summary>One HTTP request of a delivery and how it ended.</summary>
public sealed class DeliveryAttempt
{
    public long Id { get; set; }
    public long DeliveryId { get; set; }
    public Delivery? Delivery { get; set; }
    public int Number { get; set; }
    public DateTime AtUtc { get; set; }

    /// <summary>The receiver's HTTP status, or null when no answer came (see <see cref="Error"/>).</summary>
    public int? StatusCode { get; set; }

    public string? Error { get; set; }
    public double DurationMs { get; set; }
    public bool Succeeded { get; set; }

    /// <summary>When the next attempt is due after this failure; null after a success or a disable.</summary>
    public DateTime? NextRetryAtUtc { get; set; }
}

/// <summary>The WebhookDeliveries table.</summary>
internal sealed class DeliveryConfiguration : IEntityTypeConfiguration<Delivery>
{
    public void Configure(EntityTypeBuilder<Delivery> delivery)
    {
        delivery.ToTable("WebhookDeliveries");
        delivery.HasKey(d => d.Id);
        delivery.HasIndex(d => new { d.SubscriptionId, d.OutboxEventId }).IsUnique();
        delivery.HasIndex(d => new { d.DeliveredAtUtc, d.SubscriptionId, d.OutboxEventId });
        delivery.HasOne(d => d.Event).WithMany().HasForeignKey(d => d.OutboxEventId).OnDelete(DeleteBehavior.Cascade);
        delivery.HasMany(d => d.AttemptLog).WithOne(a => a.Delivery).HasForeignKey(a => a.DeliveryId)
            .OnDelete(DeleteBehavior.Cascade);
        delivery.Property(d => d.NextAttemptAtUtc).HasConversion(Utc.Converter);
        delivery.Property(d => d.DeliveredAtUtc).HasConversion(Utc.Converter);
    }
}

/// <summary>The WebhookAttempts table.</summary>
internal sealed class DeliveryAttemptConfiguration : IEntityTypeConfiguration<DeliveryAttempt>
{
    public void Configure(EntityTypeBuilder<DeliveryAttempt> attempt)
    {
        attempt.ToTable("WebhookAttempts");
        attempt.HasKey(a => a.Id);
        attempt.HasIndex(a => new { a.DeliveryId, a.Number });
        attempt.Property(a => a.Error).HasMaxLength(500);
        attempt.Property(a => a.AtUtc).HasConversion(Utc.Converter);
        attempt.Property(a => a.NextRetryAtUtc).HasConversion(Utc.Converter);
    }
}
