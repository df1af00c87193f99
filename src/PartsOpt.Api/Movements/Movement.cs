using PartsOpt.Api.Parts;

namespace PartsOpt.Api.Movements;

/// <summary>Why stock moved.</summary>
public enum MovementKind
{
    /// <summary>Goods in: on hand rises.</summary>
    Receipt,
    /// <summary>A count correction, either sign: on hand changes.</summary>
    Adjustment,
    /// <summary>Stock set aside for a build: reserved rises, on hand unchanged.</summary>
    Reservation,
    /// <summary>A reservation given back: reserved falls, on hand unchanged.</summary>
    Release,
    /// <summary>Reserved stock used by a build: on hand and reserved both fall.</summary>
    Consumption,
}

/// <summary>
/// One row of the append-only stock ledger. Each row carries two signed changes, so that both figures are
/// plain sums over the ledger: quantity on hand = Σ <see cref="OnHandChange"/>, reserved = Σ
/// <see cref="ReservedChange"/>. The signs each kind may carry are CHECK constraints in the database.
/// </summary>
public sealed class Movement
{
    public long Id { get; set; }
    public int PartId { get; set; }
    public Part? Part { get; set; }
    public MovementKind Kind { get; set; }
    public int OnHandChange { get; set; }
    public int ReservedChange { get; set; }
    public string Reason { get; set; } = "";
    public string Actor { get; set; } = "";
    public DateTime AtUtc { get; set; }
}
