using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.EntityFrameworkCore;
using PartsOpt.Api.DesignSearches;
using PartsOpt.Api.Keys;
using PartsOpt.Api.Movements;
using PartsOpt.Api.Persistence;

namespace PartsOpt.Api.Builds;

/// <summary>What building a stored design N times lacks: per BOM line and in total, with the cost to buy it.</summary>
/// <remarks>
/// <c>quantity</c>: Boards asked about.<br/>
/// <c>buildable</c>: True when nothing is missing (a build of this quantity would reserve now).<br/>
/// <c>costToBuy</c>: Σ of the lines' cost to buy; <c>currency</c> lists the currencies added (without conversion).<br/>
/// </remarks>
public sealed record DesignShortagesDto(
    int DesignId, int Quantity, bool Buildable, IReadOnlyList<ShortageLineDto> Lines, decimal CostToBuy, string Currency);

/// <summary>One BOM line: needed = per unit × quantity, missing = needed − available (never below zero).</summary>
/// <remarks>
/// <c>available</c>: On hand less reserved now; 0 for a part deleted since the search.<br/>
/// <c>unitCost</c>: The part's unit cost now; the design's when the part no longer exists.<br/>
/// <c>costToBuy</c>: missing × unitCost.<br/>
/// </remarks>
public sealed record ShortageLineDto(
    string PartNumber, int PerUnit, int Needed, int Available, int Missing, decimal UnitCost, decimal CostToBuy, string Currency);

/// <summary>GET /api/v1/designs/{id}/shortages?quantity=N.</summary>
public static class DesignShortages
{
    public static IEndpointRouteBuilder MapDesignShortages(this IEndpointRouteBuilder app)
    {
        app.MapGet("/api/v1/designs/{id:int}/shortages", Get).WithTags("Designs").WithName("GetDesignShortages")
            .WithSummary("What is missing to build a stored design N times, per BOM line, and what buying it costs.")
            .RequireAccess(readPolicy: Policies.Viewer, writePolicy: Policies.Designer)
            .ProducesProblem(StatusCodes.Status404NotFound);
        return app;
    }

    /// <param name="id">The stored design.</param>
    /// <param name="quantity">Boards, 1 to 100000; the design's own build quantity when absent.</param>
    /// <param name="db">The database.</param>
    /// <param name="ct">Cancellation.</param>
    private static async Task<Results<Ok<DesignShortagesDto>, ValidationProblem, ProblemHttpResult>> Get(
        int id, int? quantity, PartsOptDbContext db, CancellationToken ct)
    {
        if (BuildRules.QuantityProblem(quantity, required: false) is { } problem)
            return TypedResults.ValidationProblem(new Dictionary<string, string[]> { ["quantity"] = [problem] });
        var design = await db.Designs.AsNoTracking().SingleOrDefaultAsync(d => d.Id == id, ct);
        if (design is null)
            return DesignSearchesEndpoints.NoSuchDesign(id);

        var boards = quantity ?? DesignSearchesEndpoints.ToDto(design, []).Result.BuildQuantity;
        var parts = DesignParts.Of(design);
        var stock = await StockLedger.FiguresOfAsync(db, parts.Select(p => p.PartNumber).ToList(), ct);
        var lines = parts.Select(p =>
        {
            var needed = checked(p.PerUnit * boards);
            var found = stock.TryGetValue(p.PartNumber, out var s);
            var available = found ? Math.Max(s.Figures.Available, 0) : 0;
            var missing = Math.Max(needed - available, 0);
            var unitCost = found ? s.Part.UnitCost : p.UnitCost;
            var currency = found ? s.Part.Currency : p.Currency;
            return new ShortageLineDto(p.PartNumber, p.PerUnit, needed, available, missing, unitCost, missing * unitCost, currency);
        }).ToList();
        var currencies = lines.Select(l => l.Currency)
            .Distinct(StringComparer.Ordinal).Order(StringComparer.Ordinal);
        return TypedResults.Ok(new DesignShortagesDto(design.Id, boards, lines.All(l => l.Missing == 0), lines,
            lines.Sum(l => l.CostToBuy), string.Join('/', currencies)));
    }
}
