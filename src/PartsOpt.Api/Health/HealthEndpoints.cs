using System.Data.Common;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.EntityFrameworkCore;
using PartsOpt.Api.Persistence;

namespace PartsOpt.Api.Health;

/// <summary>GET /health: 200 when the database answers a query on the parts table, else 503.</summary>
public static class HealthEndpoints
{
    public sealed record HealthReport(string Status);

    public static IEndpointRouteBuilder MapHealth(this IEndpointRouteBuilder app)
    {
        app.MapGet("/health", Check)
            .WithName("Health")
            .WithSummary("Is the service up and its database reachable?")
            .WithTags("Health")
            .AllowAnonymous()
            .ProducesProblem(StatusCodes.Status503ServiceUnavailable);
        return app;
    }

    private static async Task<Results<Ok<HealthReport>, ProblemHttpResult>> Check(
        PartsOptDbContext db, CancellationToken ct)
    {
        try
        {
            await db.Parts.AnyAsync(ct);
            return TypedResults.Ok(new HealthReport("healthy"));
        }
        catch (DbException e)
        {
            return TypedResults.Problem(statusCode: StatusCodes.Status503ServiceUnavailable,
                title: "The database is not reachable.", detail: e.Message);
        }
    }
}
