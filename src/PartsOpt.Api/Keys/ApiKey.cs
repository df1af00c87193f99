namespace PartsOpt.Api.Keys;

/// <summary>
/// An API key as stored: its name (the actor every change it makes is booked to), its roles and the SHA-256
/// of the key text. The key itself is shown once, at creation, and never stored.
/// </summary>
public sealed class ApiKey
{
    public int Id { get; set; }
    public string Name { get; set; } = "";

    /// <summary>The first characters of the key ("po_Ab3x…"), so a person can tell keys apart in a list.</summary>
    public string Prefix { get; set; } = "";

    public byte[] Hash { get; set; } = [];

    /// <summary>The roles as granted, space-separated (the implied ones are added at sign-in).</summary>
    public string Roles { get; set; } = "";

    public string CreatedBy { get; set; } = "";
    public DateTime CreatedAtUtc { get; set; }
    public DateTime? ExpiresAtUtc { get; set; }
    public DateTime? RevokedAtUtc { get; set; }
    public string? RevokedBy { get; set; }

    public IReadOnlyList<string> RoleList => Roles.Split(' ', StringSplitOptions.RemoveEmptyEntries);

    public bool IsActiveAt(DateTime nowUtc) => RevokedAtUtc is null && (ExpiresAtUtc is null || ExpiresAtUtc > nowUtc);
}
