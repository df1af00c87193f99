using System.Globalization;
using System.Text.Json;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.EntityFrameworkCore;
using PartsOpt.Api.DesignSearches;
using PartsOpt.Api.Keys;
using PartsOpt.Api.Persistence;
using PartsOpt.Api.Problems;
using PartsOpt.Api.Security;
using PartsOpt.Planning;

namespace PartsOpt.Api.Planning;

/// <summary>
/// POST /api/v1/design-searches/{id}/what-if: for a stored search, which single value added to today's
/// stock lowers the best cost per board the most, or makes the search feasible (docs/what-if.md). Nothing is stored.
/// </summary>
public static class WhatIfEndpoints
{
    public static IEndpointRouteBuilder MapWhatIf(this IEndpointRouteBuilder app)
    {
        var group = app.MapGroup("/api/v1/design-searches").WithTags("Design searches")
            .RequireAccess(readPolicy: Policies.Viewer, writePolicy: Policies.Designer)
            .RequireRateLimiting(RateLimits.Solver);
        group.MapPost("/{id:int}/what-if", Create).WithName("CreateWhatIf")
            .WithSummary("Ranks single values to add to the stock by how much each lowers the stored search's best cost, or makes it feasible.")
            .Validate<WhatIfInput>(WhatIfRules.Validate)
            .ProducesProblem(StatusCodes.Status404NotFound);
        return app;
    }

    private static async Task<Results<Ok<WhatIfDto>, ValidationProblem, ProblemHttpResult>> Create(
        int id, WhatIfInput input, PartsOptDbContext db, CancellationToken ct)
    {
        var json = await db.DesignSearches.AsNoTracking().Where(s => s.Id == id).Select(s => s.RequirementJson).SingleOrDefaultAsync(ct);
        if (json is null)
            return TypedResults.Problem(statusCode: StatusCodes.Status404NotFound, title: "No such design search.",
                detail: string.Create(CultureInfo.InvariantCulture, $"There is no design search {id}."));
        var stored = JsonSerializer.Deserialize<DesignSearchInput>(json, DesignSearchesEndpoints.Storage)!;
        var requirement = DesignSearchRules.ToRequirement(DesignSearchRules.Normalise(stored));
        var stockroom = await Stockroom.ReadAsync(db, ct);
        var candidates = WhatIfRules.ToCandidates(input);
        var taken = candidates.Where(c => stockroom.Parts.ContainsKey(c.PartNumber)).Select(c => c.PartNumber).ToList();
        if (taken.Count > 0)
            return TypedResults.ValidationProblem(new Dictionary<string, string[]>
            {
                ["candidates"] = [$"In stock already, so not a candidate: {string.Join(", ", taken)}."],
            });

        var options = new WhatIfOptions(TimeSpan.FromSeconds(input.TimeLimitSeconds ?? WhatIfRules.DefaultSeconds),
            TimeSpan.FromSeconds(stored.TimeLimitSeconds ?? DesignSearchRules.DefaultTimeLimitSeconds));
        var outcome = await Task.Run(() => WhatIf.Rank(requirement, stockroom.Stock, candidates, options, ct), ct);
        ct.ThrowIfCancellationRequested();
        return TypedResults.Ok(WhatIfAnswers.From(id, outcome, candidates.Count, input.MaxResults ?? WhatIfRules.DefaultMaxResults, stockroom.Notes));
    }
}
