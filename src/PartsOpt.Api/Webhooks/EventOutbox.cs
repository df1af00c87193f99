using System.Text.Json;
using PartsOpt.Api.Persistence;

namespace PartsOpt.Api.Webhooks;

/// <summary>
/// The one way to publish an event. <see cref="Add"/> only adds a row to the caller's context, so the event
/// is committed by the caller's own SaveChanges (and transaction) together with the change it reports, or
/// not at all. The delivery worker takes it from there.
/// </summary>
public static class EventOutbox
{
    /// <summary>Adds an event of <paramref name="type"/> (one of <see cref="EventTypes"/>) to the context.</summary>
    /// <param name="db">The context the change is being made in; nothing is saved here.</param>
    /// <param name="type">One of <see cref="EventTypes.All"/>.</param>
    /// <param name="payload">Any object; serialised as camelCase JSON into the body's "data".</param>
    /// <param name="occurredAtUtc">When the change happened (the caller's clock).</param>
    public static OutboxEvent Add(PartsOptDbContext db, string type, object payload, DateTime occurredAtUtc)
    {
        if (!EventTypes.IsKnown(type))
            throw new ArgumentOutOfRangeException(nameof(type), type, "Not one of EventTypes.All.");
        var row = new OutboxEvent
        {
            EventId = Guid.NewGuid(),
            Type = type,
            OccurredAtUtc = DateTime.SpecifyKind(occurredAtUtc, DateTimeKind.Utc),
            Payload = JsonSerializer.Serialize(payload, JsonSerializerOptions.Web),
        };
        db.OutboxEvents.Add(row);
        return row;
    }
}
