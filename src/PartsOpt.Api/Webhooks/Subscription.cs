using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace PartsOpt.Api.Webhooks;

/// <summary>
/// A receiver of events. The signing secret is stored as issued: the worker needs it in clear to sign every
/// delivery, so a hash would not do; whoever can read the database file can read it (docs/webhooks.md).
/// </summary>
public sealed class Subscription
{
    public long Id { get; set; }
    public required string Url { get; set; }

    /// <summary>Event types separated by spaces, or "*" for every type.</summary>
    public required string Events { get; set; }

    public string Description { get; set; } = "";
    public required string Secret { get; set; }
    public bool Enabled { get; set; } = true;

    /// <summary>Failed attempts since the last success or re-enable; at the limit the subscription is disabled.</summary>
    public int ConsecutiveFailures { get; set; }

    public DateTime CreatedAtUtc { get; set; }
    public string CreatedBy { get; set; } = "";
    public DateTime? DisabledAtUtc { get; set; }

    public List<Delivery> Deliveries { get; } = [];

    public IReadOnlyList<string> EventList => Events.Split(' ', StringSplitOptions.RemoveEmptyEntries);

    public bool Wants(string type) => Events == EventTypes.Wildcard || EventList.Contains(type, StringComparer.Ordinal);
}

/// <summary>The WebhookSubscriptions table.</summary>
internal sealed class SubscriptionConfiguration : IEntityTypeConfiguration<Subscription>
{
    public void Configure(EntityTypeBuilder<Subscription> subscription)
    {
        subscription.ToTable("WebhookSubscriptions");
        subscription.HasKey(s => s.Id);
        subscription.Property(s => s.Url).HasMaxLength(WebhookRules.UrlMaxLength);
        subscription.Property(s => s.Events).HasMaxLength(500);
        subscription.Property(s => s.Description).HasMaxLength(WebhookRules.DescriptionMaxLength);
        subscription.Property(s => s.Secret).HasMaxLength(128);
        subscription.Property(s => s.CreatedBy).HasMaxLength(100);
        subscription.Property(s => s.CreatedAtUtc).HasConversion(Utc.Converter);
        subscription.Property(s => s.DisabledAtUtc).HasConversion(Utc.Converter);
        subscription.Ignore(s => s.EventList);
        subscription.HasMany(s => s.Deliveries).WithOne(d => d.Subscription).HasForeignKey(d => d.SubscriptionId)
            .OnDelete(DeleteBehavior.Cascade);
    }
}
