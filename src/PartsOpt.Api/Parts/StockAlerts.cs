using PartsOpt.Api.Common;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.EntityFrameworkCore;
using PartsOpt.Api.Keys;
using PartsOpt.Api.Persistence;

namespace PartsOpt.Api.Parts;

/// <summary>A part to reorder: available (on hand − reserved) at or below its reorder level.</summary>
/// <remarks>
/// <c>shortfall</c>: reorderLevel − available; 0 for a part exactly at its level.<br/>
/// </remarks>
public sealed record StockAlertDto(
    string PartNumber, string Kind, string Description, int QuantityOnHand, int Reserved, int Available,
    int ReorderLevel, int Shortfall, decimal UnitCost, string Currency);

/// <summary>GET /api/v1/stock/alerts: the parts to reorder now, figures summed from the ledger.</summary>
public static class StockAlerts
{
    public static IEndpointRouteBuilder MapStockAlerts(this IEndpointRouteBuilder app)
    {
        app.MapGroup("/api/v1/stock").WithTags("Stock")
            .RequireAccess(readPolicy: Policies.Viewer, writePolicy: Policies.Stockkeeper)
            .MapGet("/alerts", List).WithName("ListStockAlerts")
            .WithSummary("Parts whose available quantity is at or below their reorder level, largest shortfall first; paged.");
        return app;
    }

    /// <param name="page">1-based page number.</param>
    /// <param name="pageSize">Items per page, 1 to 200 (default 50).</param>
    /// <param name="db">The database.</param>
    /// <param name="ct">Cancellation.</param>
    private static async Task<Results<Ok<PagedList<StockAlertDto>>, ValidationProblem>> List(
        int? page, int? pageSize, PartsOptDbContext db, CancellationToken ct)
    {
        var errors = new ErrorList();
        Paging.Check(errors, page, pageSize);
        if (errors.ToDictionary() is { Count: > 0 } problems)
            return TypedResults.ValidationProblem(problems);

        var alerts = db.Parts.AsNoTracking()
            .Select(p => new { Part = p, OnHand = p.Movements.Sum(m => m.OnHandChange), Reserved = p.Movements.Sum(m => m.ReservedChange) })
            .Where(r => r.OnHand - r.Reserved <= r.Part.ReorderLevel);
        var size = pageSize ?? Paging.DefaultSize;
        var number = page ?? 1;
        var total = await alerts.CountAsync(ct);
        var rows = await alerts
            .OrderByDescending(r => r.Part.ReorderLevel - (r.OnHand - r.Reserved)).ThenBy(r => r.Part.PartNumber)
            .Skip((number - 1) * size).Take(size).ToListAsync(ct);
        var items = rows.ConvertAll(r => new StockAlertDto(r.Part.PartNumber, PartKinds.Name(r.Part.Kind), r.Part.Description,
            r.OnHand, r.Reserved, r.OnHand - r.Reserved, r.Part.ReorderLevel, r.Part.ReorderLevel - (r.OnHand - r.Reserved),
            r.Part.UnitCost, r.Part.Currency));
        return TypedResults.Ok(new PagedList<StockAlertDto>(items, number, size, total));
    }
}
