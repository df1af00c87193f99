using Microsoft.AspNetCore.Http.HttpResults;
using PartsOpt.Api.DesignSearches;
using PartsOpt.Api.Keys;
using PartsOpt.Api.Persistence;
using PartsOpt.Api.Problems;
using PartsOpt.Api.Security;
using PartsOpt.Planning;

namespace PartsOpt.Api.Planning;

/// <summary>
/// /api/v1/stocking-plans: which lines to add to (or drop from) the stock so every product of the year has a
/// design and the year's cost is lowest (docs/stocking-plans.md). Nothing is stored: the answer is the plan.
/// </summary>
public static class StockingPlansEndpoints
{
    public static IEndpointRouteBuilder MapStockingPlans(this IEndpointRouteBuilder app)
    {
        var plans = app.MapGroup("/api/v1/stocking-plans").WithTags("Stocking plans")
            .RequireAccess(readPolicy: Policies.Viewer, writePolicy: Policies.Designer)
            .RequireRateLimiting(RateLimits.Solver);
        plans.MapPost("/", Create).WithName("CreateStockingPlan")
            .WithSummary("Chooses the lines to stock so every requirement has a design and the yearly cost is lowest.")
            .Validate<StockingPlanInput>(StockingPlanRules.Validate);
        return app;
    }

    private static async Task<Results<Ok<StockingPlanDto>, ValidationProblem>> Create(
        StockingPlanInput input, PartsOptDbContext db, CancellationToken ct)
    {
        var stockroom = await Stockroom.ReadAsync(db, ct);
        var taken = input.Candidates!.OpAmps?.Select((o, i) => (o, i)).Where(x => stockroom.Parts.ContainsKey(x.o.PartNumber!)).ToList() ?? [];
        if (taken.Count > 0)
            return TypedResults.ValidationProblem(taken.ToDictionary(x => $"candidates.opAmps[{x.i}].partNumber",
                x => new[] { $"{x.o.PartNumber} is in stock already: it is an existing line, not a candidate." }));

        StockingQuestion question;
        try
        {
            question = StockingPlanRules.ToQuestion(input, stockroom.Stock);
        }
        catch (ArgumentException invalid) when (invalid.GetType() == typeof(ArgumentException))
        {
            return TypedResults.ValidationProblem(new Dictionary<string, string[]> { [invalid.ParamName ?? "$"] = [invalid.Message] });
        }
        // The planner runs many searches, each holding a thread for up to its limit: off the request threads,
        // stopped when the client goes away or the plan's own time limit passes (the plan so far is answered).
        using var budget = CancellationTokenSource.CreateLinkedTokenSource(ct);
        budget.CancelAfter(TimeSpan.FromSeconds(input.TimeLimitSeconds ?? StockingPlanRules.DefaultPlanSeconds));
        StockingPlan plan;
        try
        {
            plan = await Task.Run(() => StockingPlanner.Plan(question, StockingPlanRules.ToOptions(input), budget.Token), ct);
        }
        catch (ArgumentException invalid) when (invalid.GetType() == typeof(ArgumentException))
        {
            return TypedResults.ValidationProblem(new Dictionary<string, string[]> { [invalid.ParamName ?? "$"] = [invalid.Message] });
        }
        ct.ThrowIfCancellationRequested();
        var notes = budget.IsCancellationRequested
            ? [.. stockroom.Notes, "The plan's time limit ran out: the answer is the plan found so far."]
            : stockroom.Notes;
        return TypedResults.Ok(StockingPlanAnswers.From(plan, notes));
    }
}
