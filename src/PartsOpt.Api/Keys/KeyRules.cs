using System.Text.RegularExpressions;

namespace PartsOpt.Api.Keys;

/// <summary>What a new key must be: a plain name (it is the actor in the ledger), known roles, a future expiry.</summary>
internal static partial class KeyRules
{
    public const int MaxNameLength = 100;

    [GeneratedRegex("^[A-Za-z0-9][A-Za-z0-9._@-]*$")]
    private static partial Regex NamePattern();

    public static Dictionary<string, string[]> Validate(CreateKeyInput input, DateTime nowUtc)
    {
        var errors = new Dictionary<string, string[]>();
        if (string.IsNullOrWhiteSpace(input.Name))
            errors["name"] = ["Required."];
        else if (input.Name.Length > MaxNameLength || !NamePattern().IsMatch(input.Name))
            errors["name"] = [$"Letters, digits and . _ @ - only, starting with a letter or digit; at most {MaxNameLength} characters."];
        if (input.Roles is not { Count: > 0 })
            errors["roles"] = [$"At least one of: {string.Join(", ", KeyRoles.All)}."];
        else if (input.Roles.Any(r => r is null || !KeyRoles.IsKnown(r)))
            errors["roles"] = [$"Unknown role '{input.Roles.First(r => r is null || !KeyRoles.IsKnown(r)) ?? "null"}'; " +
                $"roles are {string.Join(", ", KeyRoles.All)}."];
        if (input.ExpiresAt is { } expires && expires.UtcDateTime <= nowUtc)
            errors["expiresAt"] = ["Must be in the future."];
        return errors;
    }
}
