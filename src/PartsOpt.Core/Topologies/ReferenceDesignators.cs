namespace PartsOpt.Topologies;

/// <summary>Reference designators of a design's parts: R1…, C1…, RV1… assigned per kind in role order.</summary>
public static class ReferenceDesignators
{
    /// <summary>
    /// Designators for the given roles (in the order given, which should be role order, as
    /// <see cref="CircuitDesign.RequiredRoles()"/> returns them).
    /// </summary>
    public static IReadOnlyDictionary<string, string> ForRoles(IEnumerable<string> roles)
    {
        ArgumentNullException.ThrowIfNull(roles);
        int resistors = 0, capacitors = 0, pots = 0;
        var result = new Dictionary<string, string>();
        foreach (var role in roles)
        {
            result[role] = Roles.KindOf(role) switch
            {
                RoleKind.Capacitor => $"C{++capacitors}",
                RoleKind.Potentiometer => $"RV{++pots}",
                _ => $"R{++resistors}",
            };
        }

        return result;
    }
}
