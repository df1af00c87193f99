using System.Globalization;
using System.Security.Claims;
using System.Text.Encodings.Web;
using Microsoft.AspNetCore.Authentication;
using Microsoft.AspNetCore.Mvc;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.Options;
using PartsOpt.Api.Persistence;

namespace PartsOpt.Api.Keys;

/// <summary>
/// The "ApiKey" scheme: <c>Authorization: Bearer po_…</c>, looked up by its SHA-256 in the ApiKeys table on
/// every request (no cache), so a revocation or an expiry takes effect on the very next request. Failures
/// answer 401 (no key, unknown, expired or revoked) or 403 (a valid key without the role) as problem details.
/// </summary>
internal sealed class ApiKeyAuthenticationHandler(
    IOptionsMonitor<AuthenticationSchemeOptions> options, ILoggerFactory logger, UrlEncoder encoder,
    PartsOptDbContext db, TimeProvider clock, IProblemDetailsService problems)
    : AuthenticationHandler<AuthenticationSchemeOptions>(options, logger, encoder)
{
    public const string SchemeName = "ApiKey";
    public const string KeyIdClaim = "partsopt:key-id";
    private const string BearerPrefix = "Bearer ";
    private string? _failure;

    protected override async Task<AuthenticateResult> HandleAuthenticateAsync()
    {
        var header = Request.Headers.Authorization.ToString();
        if (header.Length == 0)
            return AuthenticateResult.NoResult();
        if (!header.StartsWith(BearerPrefix, StringComparison.OrdinalIgnoreCase))
            return Fail("The Authorization header must be 'Bearer <key>'.");
        var text = header[BearerPrefix.Length..].Trim();
        if (text.Length is 0 or > ApiKeyTokens.MaxLength)
            return Fail("The key is not valid.");

        var hash = ApiKeyTokens.Hash(text);
        var key = await db.ApiKeys.AsNoTracking().SingleOrDefaultAsync(k => k.Hash == hash, Context.RequestAborted);
        if (key is null || !ApiKeyTokens.Matches(key.Hash, hash))
            return Fail("The key is not valid.");
        var now = clock.GetUtcNow().UtcDateTime;
        if (key.RevokedAtUtc is not null)
            return Fail("The key has been revoked.");
        if (key.ExpiresAtUtc <= now)
            return Fail("The key has expired.");

        List<Claim> claims = [new(ClaimTypes.Name, key.Name), new(KeyIdClaim, key.Id.ToString(CultureInfo.InvariantCulture))];
        claims.AddRange(KeyRoles.Expand(key.RoleList).Select(role => new Claim(ClaimTypes.Role, role)));
        var principal = new ClaimsPrincipal(new ClaimsIdentity(claims, SchemeName, ClaimTypes.Name, ClaimTypes.Role));
        return AuthenticateResult.Success(new AuthenticationTicket(principal, SchemeName));
    }

    private AuthenticateResult Fail(string reason)
    {
        _failure = reason;
        return AuthenticateResult.Fail(reason);
    }

    protected override async Task HandleChallengeAsync(AuthenticationProperties properties)
    {
        Response.StatusCode = StatusCodes.Status401Unauthorized;
        Response.Headers.WWWAuthenticate = _failure is null ? "Bearer" : "Bearer error=\"invalid_token\"";
        await Write(new ProblemDetails
        {
            Status = StatusCodes.Status401Unauthorized,
            Title = "An API key is needed.",
            Detail = _failure ?? "Send a key as 'Authorization: Bearer <key>'.",
        });
    }

    protected override async Task HandleForbiddenAsync(AuthenticationProperties properties)
    {
        Response.StatusCode = StatusCodes.Status403Forbidden;
        await Write(new ProblemDetails
        {
            Status = StatusCodes.Status403Forbidden,
            Title = "This key may not do that.",
            Detail = $"The key '{Context.User.Identity?.Name}' lacks the role this endpoint needs.",
        });
    }

    private async Task Write(ProblemDetails problem) =>
        await problems.WriteAsync(new ProblemDetailsContext { HttpContext = Context, ProblemDetails = problem });
}
