namespace PartsOpt.Api.Keys;

/// <summary>
/// The roles a key can hold. <c>designer</c> and <c>stockkeeper</c> imply <c>viewer</c>; <c>admin</c>
/// implies every role. The implied roles are added to the principal at sign-in, so a policy names one role.
/// </summary>
public static class KeyRoles
{
    public const string Viewer = "viewer";
    public const string Designer = "designer";
    public const string Stockkeeper = "stockkeeper";
    public const string Admin = "admin";

    public static readonly IReadOnlyList<string> All = [Viewer, Designer, Stockkeeper, Admin];

    public static bool IsKnown(string role) => All.Contains(role);

    /// <summary>The granted roles with every role they imply, in <see cref="All"/> order.</summary>
    public static IReadOnlyList<string> Expand(IEnumerable<string> granted)
    {
        var roles = new HashSet<string>(granted);
        if (roles.Contains(Admin))
            roles.UnionWith(All);
        if (roles.Contains(Designer) || roles.Contains(Stockkeeper))
            roles.Add(Viewer);
        return All.Where(roles.Contains).ToList();
    }
}
