using System.Globalization;
using System.Text.Json;
using System.Text.Json.Serialization;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.EntityFrameworkCore;
using PartsOpt.Api.Common;
using PartsOpt.Api.Movements;
using PartsOpt.Api.Persistence;
using PartsOpt.Api.Webhooks;
using PartsOpt.Api.Problems;
using PartsOpt.Api.Keys;
using PartsOpt.Api.Security;
using PartsOpt.Search;
using PartsOpt.Topologies;
using PartsOpt.Values;

namespace PartsOpt.Api.DesignSearches;

/// <summary>
/// /api/v1/design-searches and /api/v1/designs: search the stock for the cheapest PWM generator designs,
/// keep each search with its designs, and tell when the stock no longer covers a design.
/// </summary>
public static class DesignSearchesEndpoints
{
    /// <summary>How the JSON columns are written: the API's own shape (camelCase, nulls left out).</summary>
    internal static readonly JsonSerializerOptions Storage = new(JsonSerializerDefaults.Web)
    {
        DefaultIgnoreCondition = JsonIgnoreCondition.WhenWritingNull,
    };

    public static IEndpointRouteBuilder MapDesignSearches(this IEndpointRouteBuilder app)
    {
        var searches = app.MapGroup("/api/v1/design-searches").WithTags("Design searches")
            .RequireAccess(readPolicy: Policies.Viewer, writePolicy: Policies.Designer)
            .RequireRateLimiting(RateLimits.Solver)
            .WithIdempotency();
        searches.MapPost("/", Create).WithName("CreateDesignSearch")
            .WithSummary("Searches the available stock for the cheapest designs meeting a requirement; stores and returns them.")
            .Validate<DesignSearchInput>(DesignSearchRules.Validate);
        searches.MapGet("/{id:int}", Get).WithName("GetDesignSearch")
            .WithSummary("A stored search with its designs in rank order, each flagged stale when the stock has fallen short.")
            .ProducesProblem(StatusCodes.Status404NotFound);

        var designs = app.MapGroup("/api/v1/designs").WithTags("Designs")
            .RequireAccess(readPolicy: Policies.Viewer, writePolicy: Policies.Designer);
        designs.MapGet("/{id:int}", GetDesign).WithName("GetDesign")
            .WithSummary("One stored design, flagged stale when the stock has fallen short.")
            .ProducesProblem(StatusCodes.Status404NotFound);
        designs.MapGet("/{id:int}/bom.csv", DesignBomCsv.Get).WithName("GetDesignBom")
            .WithSummary("A design's bill of materials as CSV, quantities for one board and for the build.")
            .Produces<string>(StatusCodes.Status200OK, DesignBomCsv.CsvType)
            .ProducesProblem(StatusCodes.Status404NotFound);
        return app;
    }

    public static string PathOf(int searchId) => string.Create(CultureInfo.InvariantCulture, $"/api/v1/design-searches/{searchId}");

    internal static ProblemHttpResult NoSuchDesign(int id) =>
        TypedResults.Problem(statusCode: StatusCodes.Status404NotFound, title: "No such design.",
            detail: string.Create(CultureInfo.InvariantCulture, $"There is no design {id}."));

    private static async Task<Results<Created<DesignSearchDto>, ValidationProblem>> Create(
        DesignSearchInput input, PartsOptDbContext db, HttpContext http, TimeProvider clock, CancellationToken ct)
    {
        var normalised = DesignSearchRules.Normalise(input);
        var requirement = DesignSearchRules.ToRequirement(normalised);
        var stockroom = await Stockroom.ReadAsync(db, ct);
        var options = new SearchOptions(TimeSpan.FromSeconds(normalised.TimeLimitSeconds!.Value));
        SearchOutcome outcome;
        try
        {
            // CP-SAT holds its thread for up to the time limit: run it off the request threads. The token is
            // the request's: a client that goes away stops the search, and nothing is stored.
            outcome = await Task.Run(() => DesignSearch.Run(requirement, stockroom.Stock, options, ct), ct);
        }
        catch (ArgumentException invalid) when (invalid.GetType() == typeof(ArgumentException))
        {
            // The library's own requirement rules, should they ever be stricter than ours.
            return TypedResults.ValidationProblem(new Dictionary<string, string[]> { [invalid.ParamName ?? "$"] = [invalid.Message] });
        }
        ct.ThrowIfCancellationRequested();

        var saved = new SavedSearch
        {
            CreatedAtUtc = clock.GetUtcNow().UtcDateTime,
            Actor = Actor.Of(http),
            RequirementJson = JsonSerializer.Serialize(normalised, Storage),
            Status = StatusName(outcome.Status),
            OptimalityProved = outcome.Status == SearchStatus.Optimal,
            ElapsedSeconds = outcome.Elapsed.TotalSeconds,
            Solves = outcome.Solves,
            NotesJson = JsonSerializer.Serialize<IReadOnlyList<string>>([.. stockroom.Notes, .. outcome.Notes], Storage),
            TopologiesJson = JsonSerializer.Serialize(outcome.Topologies.Select(ToDto).ToList(), Storage),
        };
        foreach (var found in outcome.Designs)
        {
            var result = DesignResults.From(found, stockroom);
            var design = new SavedDesign
            {
                Rank = found.Rank,
                Topology = found.Topology.ToWireName(),
                BestOfTopology = found.BestOfTopology,
                CostPerBoard = found.Cost.PerBoard,
                ResultJson = JsonSerializer.Serialize(result, Storage),
            };
            design.Needs.AddRange(found.Bom.Select(line => new DesignNeed
            {
                PartNumber = line.PartNumber,
                QuantityForBuild = line.ForBuild,
                AvailableAtSearch = line.Available,
            }));
            saved.Designs.Add(design);
        }
        // The search, its designs, their needs and the event that reports them: one transaction. The event
        // names the search, whose id exists only once the first SaveChanges has run.
        await using (var transaction = await db.Database.BeginTransactionAsync(ct))
        {
            db.DesignSearches.Add(saved);
            await db.SaveChangesAsync(ct);
            EventOutbox.Add(db, EventTypes.DesignSearchCompleted, new
            {
                searchId = saved.Id,
                status = saved.Status,
                designs = saved.Designs.Select(d => new { id = d.Id, d.Rank, d.Topology, d.CostPerBoard }).ToList(),
                actor = saved.Actor,
            }, saved.CreatedAtUtc);
            await db.SaveChangesAsync(ct);
            await transaction.CommitAsync(ct);
        }

        var shortages = await DesignStaleness.ShortagesAsync(db, saved.Designs.ConvertAll(d => d.Id), ct);
        return TypedResults.Created(PathOf(saved.Id), ToDto(saved, shortages));
    }

    private static async Task<Results<Ok<DesignSearchDto>, ProblemHttpResult>> Get(int id, PartsOptDbContext db, CancellationToken ct)
    {
        var saved = await db.DesignSearches.AsNoTracking().Include(s => s.Designs).SingleOrDefaultAsync(s => s.Id == id, ct);
        if (saved is null)
            return TypedResults.Problem(statusCode: StatusCodes.Status404NotFound, title: "No such design search.",
                detail: string.Create(CultureInfo.InvariantCulture, $"There is no design search {id}."));
        var shortages = await DesignStaleness.ShortagesAsync(db, saved.Designs.ConvertAll(d => d.Id), ct);
        return TypedResults.Ok(ToDto(saved, shortages));
    }

    private static async Task<Results<Ok<DesignDto>, ProblemHttpResult>> GetDesign(int id, PartsOptDbContext db, CancellationToken ct)
    {
        var design = await db.Designs.AsNoTracking().SingleOrDefaultAsync(d => d.Id == id, ct);
        if (design is null)
            return NoSuchDesign(id);
        var shortages = await DesignStaleness.ShortagesAsync(db, [id], ct);
        return TypedResults.Ok(ToDto(design, shortages[id]));
    }

    private static DesignSearchDto ToDto(SavedSearch saved, Dictionary<int, IReadOnlyList<ShortageDto>> shortages) => new(
        saved.Id,
        saved.CreatedAtUtc,
        saved.Actor,
        JsonSerializer.Deserialize<DesignSearchInput>(saved.RequirementJson, Storage)!,
        saved.Status,
        saved.OptimalityProved,
        saved.ElapsedSeconds,
        saved.Solves,
        JsonSerializer.Deserialize<List<string>>(saved.NotesJson, Storage)!,
        JsonSerializer.Deserialize<List<TopologyReportDto>>(saved.TopologiesJson, Storage)!,
        saved.Designs.OrderBy(d => d.Rank).Select(d => ToDto(d, shortages[d.Id])).ToList(),
        Cautions.PowerStage);

    internal static DesignDto ToDto(SavedDesign design, IReadOnlyList<ShortageDto> shortages) => new(
        design.Id, design.SearchId, design.Rank, design.Topology, design.BestOfTopology,
        shortages.Count > 0, shortages,
        JsonSerializer.Deserialize<DesignResult>(design.ResultJson, Storage)!,
        Cautions.PowerStage);

    private static TopologyReportDto ToDto(TopologyReport report) => new(
        report.Topology.ToWireName(), report.Feasible, report.Proved, report.Blocking,
        report.Nearest is { } near
            ? new NearMissDto(near.RoleParts,
                near.Figures.ToDictionary(f => f.Key, f => f.Value is { } v && double.IsFinite(v) ? v : (double?)null),
                near.Misses)
            : null,
        report.Purchase is { } buy
            ? new PurchaseDto(buy.Role, buy.Kind == RoleKind.Capacitor ? "capacitor" : "resistor", buy.Value,
                EngineeringValue.Format(buy.Value, buy.Kind == RoleKind.Capacitor ? Quantity.Capacitance : Quantity.Resistance),
                buy.Series, buy.Explanation)
            : null,
        report.PurchaseNote);

    private static string StatusName(SearchStatus status) => status switch
    {
        SearchStatus.Optimal => "optimal",
        SearchStatus.Feasible => "feasible",
        SearchStatus.Infeasible => "infeasible",
        _ => "unknown",
    };
}
