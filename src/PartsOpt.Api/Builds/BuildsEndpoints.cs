using PartsOpt.Api.Common;
using System.Globalization;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.EntityFrameworkCore;
using PartsOpt.Api.Keys;
using PartsOpt.Api.Parts;
using PartsOpt.Api.Persistence;
using PartsOpt.Api.Problems;
using PartsOpt.Api.Security;

namespace PartsOpt.Api.Builds;

/// <summary>
/// /api/v1/builds: production runs of stored designs. A build reserves its whole BOM or nothing, then is
/// completed (the reservation is consumed) or cancelled (released). See docs/builds.md.
/// </summary>
public static class BuildsEndpoints
{
    public static IEndpointRouteBuilder MapBuilds(this IEndpointRouteBuilder app)
    {
        // Reads for viewers; reserving and using stock is the stockkeepers' work.
        var builds = app.MapGroup("/api/v1/builds").WithTags("Builds")
            .RequireAccess(readPolicy: Policies.Viewer, writePolicy: Policies.Stockkeeper);

        builds.MapGet("/", List).WithName("ListBuilds")
            .WithSummary("Builds, newest first, filtered by status; paged.");
        builds.MapGet("/{id:int}", Get).WithName("GetBuild")
            .WithSummary("One build with its lines.")
            .ProducesProblem(StatusCodes.Status404NotFound);
        builds.MapPost("/", BuildBooking.Reserve).WithName("CreateBuild")
            .WithSummary("Reserves every part of a stored design's BOM for a build, all in one transaction or nothing.")
            .Validate<BuildInput>(BuildRules.Validate)
            .WithIdempotency()
            .ProducesProblem(StatusCodes.Status404NotFound)
            .ProducesProblem(StatusCodes.Status409Conflict);
        builds.MapPost("/{id:int}/complete", BuildBooking.Complete).WithName("CompleteBuild")
            .WithSummary("Consumes a build's reservation; repeating it changes nothing.")
            .ProducesProblem(StatusCodes.Status404NotFound)
            .ProducesProblem(StatusCodes.Status409Conflict);
        builds.MapPost("/{id:int}/cancel", BuildBooking.Cancel).WithName("CancelBuild")
            .WithSummary("Releases a build's reservation; repeating it changes nothing.")
            .ProducesProblem(StatusCodes.Status404NotFound)
            .ProducesProblem(StatusCodes.Status409Conflict);

        app.MapDesignShortages();
        return app;
    }

    public static string PathOf(int id) => string.Create(CultureInfo.InvariantCulture, $"/api/v1/builds/{id}");

    internal static ProblemHttpResult NoSuchBuild(int id) =>
        TypedResults.Problem(statusCode: StatusCodes.Status404NotFound, title: "No such build.",
            detail: string.Create(CultureInfo.InvariantCulture, $"There is no build {id}."));

    /// <param name="status">reserved, completed or cancelled.</param>
    /// <param name="page">1-based page number.</param>
    /// <param name="pageSize">Items per page, 1 to 200 (default 50).</param>
    /// <param name="db">The database.</param>
    /// <param name="ct">Cancellation.</param>
    private static async Task<Results<Ok<PagedList<BuildDto>>, ValidationProblem>> List(
        string? status, int? page, int? pageSize, PartsOptDbContext db, CancellationToken ct)
    {
        var errors = new ErrorList();
        BuildStatus? statusFilter = null;
        if (status is not null)
        {
            if (BuildRules.TryParseStatus(status, out var s))
                statusFilter = s;
            else
                errors.Add("status", $"Unknown status '{status}': expected one of {string.Join(", ", BuildRules.StatusNames)}.");
        }
        Paging.Check(errors, page, pageSize);
        if (errors.ToDictionary() is { Count: > 0 } problems)
            return TypedResults.ValidationProblem(problems);

        var query = db.Builds.AsNoTracking();
        if (statusFilter is { } sf)
            query = query.Where(b => b.Status == sf);
        var size = pageSize ?? Paging.DefaultSize;
        var number = page ?? 1;
        var total = await query.CountAsync(ct);
        var rows = await query.OrderByDescending(b => b.Id).Skip((number - 1) * size).Take(size)
            .Include(b => b.Lines).ToListAsync(ct);
        return TypedResults.Ok(new PagedList<BuildDto>(rows.ConvertAll(BuildDto.From), number, size, total));
    }

    private static async Task<Results<Ok<BuildDto>, ProblemHttpResult>> Get(int id, PartsOptDbContext db, CancellationToken ct)
    {
        var build = await db.Builds.AsNoTracking().Include(b => b.Lines).SingleOrDefaultAsync(b => b.Id == id, ct);
        return build is null ? NoSuchBuild(id) : TypedResults.Ok(BuildDto.From(build));
    }
}
