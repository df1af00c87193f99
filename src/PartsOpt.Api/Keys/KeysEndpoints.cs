using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.EntityFrameworkCore;
using PartsOpt.Api.Movements;
using PartsOpt.Api.Persistence;

namespace PartsOpt.Api.Keys;

/// <summary>
/// /api/v1/keys, admin only: create (the key text is in the 201 answer and nowhere else, ever), list, read,
/// revoke. Revoking is DELETE or POST …/revoke; the row stays, so the name stays taken and the history stays
/// readable. The last active admin key cannot be revoked (nobody could create another).
/// Creation takes no Idempotency-Key on purpose: replaying the answer would mean storing the key text.
/// </summary>
public static class KeysEndpoints
{
    public static IEndpointRouteBuilder MapKeys(this IEndpointRouteBuilder app)
    {
        var keys = app.MapGroup("/api/v1/keys").WithTags("Keys").RequireAuthorization(Policies.Admin);

        keys.MapPost("/", Create).WithName("CreateKey")
            .WithSummary("Creates a key; the answer holds the key text, shown this once only.")
            .ProducesValidationProblem()
            .ProducesProblem(StatusCodes.Status409Conflict);
        keys.MapGet("/", List).WithName("ListKeys")
            .WithSummary("Every key, active or not, without the key text.");
        keys.MapGet("/{id:int}", Get).WithName("GetKey")
            .WithSummary("One key, without the key text.")
            .ProducesProblem(StatusCodes.Status404NotFound);
        keys.MapDelete("/{id:int}", Revoke).WithName("RevokeKey")
            .WithSummary("Revokes a key at once; it answers 401 from the next request on.")
            .ProducesProblem(StatusCodes.Status404NotFound)
            .ProducesProblem(StatusCodes.Status409Conflict);
        keys.MapPost("/{id:int}/revoke", Revoke).WithName("RevokeKeyByPost")
            .WithSummary("The same as DELETE, for clients that cannot send DELETE.")
            .ProducesProblem(StatusCodes.Status404NotFound)
            .ProducesProblem(StatusCodes.Status409Conflict);
        return app;
    }

    private static async Task<Results<Created<CreatedKeyDto>, ValidationProblem, ProblemHttpResult>> Create(
        CreateKeyInput input, PartsOptDbContext db, HttpContext http, TimeProvider clock, CancellationToken ct)
    {
        var now = clock.GetUtcNow().UtcDateTime;
        if (KeyRules.Validate(input, now) is { Count: > 0 } errors)
            return TypedResults.ValidationProblem(errors);
        var name = input.Name!;
        if (await db.ApiKeys.AnyAsync(k => k.Name == name, ct))
            return NameTaken(name);

        var (key, text) = NewKey(name, input.Roles!.Select(r => r!), input.ExpiresAt?.UtcDateTime, Actor.Of(http), now);
        db.ApiKeys.Add(key);
        try
        {
            await db.SaveChangesAsync(ct);
        }
        catch (DbUpdateException)
        {
            db.ChangeTracker.Clear();
            if (await db.ApiKeys.AnyAsync(k => k.Name == name, ct))
                return NameTaken(name); // lost a race with another create of the same name
            throw;
        }
        return TypedResults.Created($"/api/v1/keys/{key.Id}",
            new CreatedKeyDto(key.Id, key.Name, key.Prefix, key.RoleList, key.CreatedAtUtc, key.ExpiresAtUtc, text));
    }

    /// <summary>A new key row and its text; the row holds only the hash.</summary>
    internal static (ApiKey Key, string Text) NewKey(string name, IEnumerable<string> roles, DateTime? expiresAtUtc,
        string createdBy, DateTime nowUtc)
    {
        var text = ApiKeyTokens.Generate();
        return (new ApiKey
        {
            Name = name,
            Prefix = ApiKeyTokens.PrefixOf(text),
            Hash = ApiKeyTokens.Hash(text),
            Roles = string.Join(' ', roles.Distinct()),
            CreatedBy = createdBy,
            CreatedAtUtc = nowUtc,
            ExpiresAtUtc = expiresAtUtc,
        }, text);
    }

    private static async Task<Ok<List<KeyDto>>> List(PartsOptDbContext db, TimeProvider clock, CancellationToken ct)
    {
        var now = clock.GetUtcNow().UtcDateTime;
        var keys = await db.ApiKeys.AsNoTracking().OrderBy(k => k.Id).ToListAsync(ct);
        return TypedResults.Ok(keys.ConvertAll(k => KeyDto.From(k, now)));
    }

    private static async Task<Results<Ok<KeyDto>, ProblemHttpResult>> Get(
        int id, PartsOptDbContext db, TimeProvider clock, CancellationToken ct)
    {
        var key = await db.ApiKeys.AsNoTracking().SingleOrDefaultAsync(k => k.Id == id, ct);
        return key is null ? NoSuchKey(id) : TypedResults.Ok(KeyDto.From(key, clock.GetUtcNow().UtcDateTime));
    }

    private static async Task<Results<NoContent, ProblemHttpResult>> Revoke(
        int id, PartsOptDbContext db, HttpContext http, TimeProvider clock, CancellationToken ct)
    {
        var now = clock.GetUtcNow().UtcDateTime;
        var key = await db.ApiKeys.SingleOrDefaultAsync(k => k.Id == id, ct);
        if (key is null)
            return NoSuchKey(id);
        if (key.RevokedAtUtc is not null)
            return TypedResults.NoContent(); // already revoked: the same outcome, the first revocation stands
        if (key.IsActiveAt(now) && KeyRoles.Expand(key.RoleList).Contains(KeyRoles.Admin))
        {
            var admins = await db.ApiKeys.AsNoTracking()
                .Where(k => k.RevokedAtUtc == null && (k.ExpiresAtUtc == null || k.ExpiresAtUtc > now)).ToListAsync(ct);
            if (admins.Count(k => k.RoleList.Contains(KeyRoles.Admin)) <= 1)
                return TypedResults.Problem(statusCode: StatusCodes.Status409Conflict, title: "The last admin key stays.",
                    detail: "Create another admin key before revoking this one.");
        }
        key.RevokedAtUtc = now;
        key.RevokedBy = Actor.Of(http);
        await db.SaveChangesAsync(ct);
        return TypedResults.NoContent();
    }

    private static ProblemHttpResult NameTaken(string name) =>
        TypedResults.Problem(statusCode: StatusCodes.Status409Conflict, title: "The name is taken.",
            detail: $"A key named '{name}' exists or existed; names stay unique so the ledger's actors do.");

    private static ProblemHttpResult NoSuchKey(int id) =>
        TypedResults.Problem(statusCode: StatusCodes.Status404NotFound, title: "No such key.", detail: $"There is no key {id}.");
}
