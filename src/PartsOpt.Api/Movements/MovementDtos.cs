namespace PartsOpt.Api.Movements;

/// <summary>A ledger row as JSON.</summary>
public sealed record MovementDto(
    long Id, string Kind, int OnHandChange, int ReservedChange, string Reason, string Actor, DateTime AtUtc)
{
    public static MovementDto From(Movement m) =>
        new(m.Id, Name(m.Kind), m.OnHandChange, m.ReservedChange, m.Reason, m.Actor, m.AtUtc);

    public static string Name(MovementKind kind) => kind.ToString().ToLowerInvariant();
}

/// <summary>
/// What a client may book: a "receipt" (quantity &gt; 0) or an "adjustment" (quantity ≠ 0, either sign).
/// Reservations, releases and consumption are booked by builds, not posted.
/// </summary>
public sealed record MovementInput(string? Kind, int? Quantity, string? Reason);
