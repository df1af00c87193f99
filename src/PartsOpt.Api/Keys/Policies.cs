using Microsoft.AspNetCore.Authorization;

namespace PartsOpt.Api.Keys;

/// <summary>
/// Authorisation policies, one per role (see docs/security.md for the table). A group opts in with one call:
/// <c>group.RequireAuthorization(Policies.Admin)</c>, or <c>group.RequireAccess(Policies.Viewer, Policies.Designer)</c>
/// for "read with one role, write with another". Endpoints with no policy still need a valid key (the
/// fallback policy); only <c>AllowAnonymous()</c> endpoints (health) are open.
/// </summary>
public static class Policies
{
    public const string Viewer = KeyRoles.Viewer;
    public const string Designer = KeyRoles.Designer;
    public const string Stockkeeper = KeyRoles.Stockkeeper;
    public const string Admin = KeyRoles.Admin;

    public static IServiceCollection AddKeyAuthorization(this IServiceCollection services)
    {
        services.AddAuthentication(ApiKeyAuthenticationHandler.SchemeName)
            .AddScheme<Microsoft.AspNetCore.Authentication.AuthenticationSchemeOptions, ApiKeyAuthenticationHandler>(
                ApiKeyAuthenticationHandler.SchemeName, null);
        var authorization = services.AddAuthorizationBuilder()
            .SetFallbackPolicy(new AuthorizationPolicyBuilder(ApiKeyAuthenticationHandler.SchemeName).RequireAuthenticatedUser().Build());
        foreach (var role in KeyRoles.All)
            authorization.AddPolicy(role, policy => policy.RequireAuthenticatedUser().RequireRole(role));
        return services;
    }

    /// <summary>
    /// Reads (GET, HEAD) need <paramref name="readPolicy"/>, every other method <paramref name="writePolicy"/>.
    /// An endpoint whose methods are unknown gets the write policy.
    /// </summary>
    public static TBuilder RequireAccess<TBuilder>(this TBuilder builder, string readPolicy, string writePolicy)
        where TBuilder : IEndpointConventionBuilder
    {
        builder.Add(endpoint =>
        {
            var methods = endpoint.Metadata.OfType<IHttpMethodMetadata>().LastOrDefault()?.HttpMethods;
            var reads = methods is { Count: > 0 } && methods.All(m => HttpMethods.IsGet(m) || HttpMethods.IsHead(m));
            endpoint.Metadata.Add(new AuthorizeAttribute(reads ? readPolicy : writePolicy));
        });
        return builder;
    }
}
