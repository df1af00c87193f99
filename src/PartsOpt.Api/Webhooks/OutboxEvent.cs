using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace PartsOpt.Api.Webhooks;

/// <summary>
/// One event in the outbox, written by <see cref="EventOutbox.Add"/> in the same transaction as the change
/// it reports. <see cref="Id"/> grows with every insert and orders delivery; <see cref="EventId"/> is the
/// identity receivers see and de-duplicate by. The delivery worker fans a new event out into one
/// <see cref="Delivery"/> per matching subscription and then marks it <see cref="FannedOut"/>, both in one
/// SaveChanges, so a restart neither loses nor doubles the fan-out.
/// </summary>
public sealed class OutboxEvent
{
    public long Id { get; set; }
    public Guid EventId { get; set; }
    public required string Type { get; set; }
    public DateTime OccurredAtUtc { get; set; }

    /// <summary>The event's data as JSON text (camelCase), sent as the body's "data" member.</summary>
    public required string Payload { get; set; }

    public bool FannedOut { get; set; }
}

/// <summary>The WebhookEvents table.</summary>
internal sealed class OutboxEventConfiguration : IEntityTypeConfiguration<OutboxEvent>
{
    public void Configure(EntityTypeBuilder<OutboxEvent> outboxEvent)
    {
        outboxEvent.ToTable("WebhookEvents");
        outboxEvent.HasKey(e => e.Id);
        outboxEvent.HasIndex(e => e.EventId).IsUnique();
        outboxEvent.HasIndex(e => new { e.FannedOut, e.Id });
        outboxEvent.Property(e => e.Type).HasMaxLength(64);
        outboxEvent.Property(e => e.OccurredAtUtc).HasConversion(Utc.Converter);
    }
}
