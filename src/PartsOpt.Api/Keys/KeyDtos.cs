namespace PartsOpt.Api.Keys;

/// <summary>A new key: its name (the actor its changes are booked to), roles, and optionally when it expires.</summary>
public sealed record CreateKeyInput(string? Name, IReadOnlyList<string?>? Roles, DateTimeOffset? ExpiresAt);

/// <summary>A key as listed: never the key text nor its hash.</summary>
public sealed record KeyDto(
    int Id, string Name, string Prefix, IReadOnlyList<string> Roles, string CreatedBy, DateTime CreatedAtUtc,
    DateTime? ExpiresAtUtc, DateTime? RevokedAtUtc, string? RevokedBy, bool Active)
{
    public static KeyDto From(ApiKey k, DateTime nowUtc) => new(k.Id, k.Name, k.Prefix, k.RoleList, k.CreatedBy,
        k.CreatedAtUtc, k.ExpiresAtUtc, k.RevokedAtUtc, k.RevokedBy, k.IsActiveAt(nowUtc));
}

/// <summary>The answer to a creation, the only time the key text is shown: store it now, it cannot be shown again.</summary>
public sealed record CreatedKeyDto(
    int Id, string Name, string Prefix, IReadOnlyList<string> Roles, DateTime CreatedAtUtc, DateTime? ExpiresAtUtc, string Key);
