using PartsOpt.Api.Common;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.EntityFrameworkCore;
using PartsOpt.Api.Parts;
using PartsOpt.Api.Persistence;
using PartsOpt.Api.Problems;
using PartsOpt.Api.Webhooks;
using PartsOpt.Api.Security;

namespace PartsOpt.Api.Movements;

/// <summary>/api/v1/parts/{partNumber}/movements: a part's ledger, newest first; receipts and adjustments.</summary>
public static class MovementsEndpoints
{
    public const int MaxReasonLength = 200;

    public static RouteGroupBuilder MapMovements(this RouteGroupBuilder parts)
    {
        var movements = parts.MapGroup("/{partNumber}/movements").WithTags("Movements");

        movements.MapGet("/", List).WithName("ListMovements")
            .WithSummary("A part's ledger rows, newest first; paged.")
            .ProducesProblem(StatusCodes.Status404NotFound);
        movements.MapGet("/{id:long}", Get).WithName("GetMovement")
            .WithSummary("One ledger row.")
            .ProducesProblem(StatusCodes.Status404NotFound);
        movements.MapPost("/", Post).WithName("PostMovement")
            .WithSummary("Books a receipt (quantity > 0) or an adjustment (either sign) against a part.")
            .Validate<MovementInput>(Validate)
            .WithIdempotency()
            .ProducesProblem(StatusCodes.Status404NotFound)
            .ProducesProblem(StatusCodes.Status409Conflict);
        return parts;
    }

    private static async Task<Results<Ok<PagedList<MovementDto>>, ValidationProblem, ProblemHttpResult>> List(
        string partNumber, int? page, int? pageSize, PartsOptDbContext db, CancellationToken ct)
    {
        if (Paging.Problems(page, pageSize) is { } paging)
            return TypedResults.ValidationProblem(paging);
        var partId = await db.Parts.Where(p => p.PartNumber == partNumber).Select(p => (int?)p.Id).SingleOrDefaultAsync(ct);
        if (partId is null)
            return PartsEndpoints.NoSuchPart(partNumber);

        var size = pageSize ?? Paging.DefaultSize;
        var number = page ?? 1;
        var rows = db.Movements.AsNoTracking().Where(m => m.PartId == partId);
        var total = await rows.CountAsync(ct);
        // Ids grow with every insert, so they order the ledger exactly even within one clock tick.
        var items = await rows.OrderByDescending(m => m.Id).Skip((number - 1) * size).Take(size).ToListAsync(ct);
        return TypedResults.Ok(new PagedList<MovementDto>(items.ConvertAll(MovementDto.From), number, size, total));
    }

    private static async Task<Results<Ok<MovementDto>, ProblemHttpResult>> Get(
        string partNumber, long id, PartsOptDbContext db, CancellationToken ct)
    {
        var movement = await db.Movements.AsNoTracking()
            .SingleOrDefaultAsync(m => m.Id == id && m.Part!.PartNumber == partNumber, ct);
        return movement is null
            ? TypedResults.Problem(statusCode: StatusCodes.Status404NotFound, title: "No such movement.",
                detail: $"Part '{partNumber}' has no movement {id}.")
            : TypedResults.Ok(MovementDto.From(movement));
    }

    private static async Task<Results<Created<MovementDto>, ProblemHttpResult>> Post(
        string partNumber, MovementInput input, PartsOptDbContext db, HttpContext http, TimeProvider clock,
        CancellationToken ct)
    {
        var kind = input.Kind!.Equals("receipt", StringComparison.OrdinalIgnoreCase)
            ? MovementKind.Receipt : MovementKind.Adjustment;

        // BEGIN IMMEDIATE: the check against the current figures and the booking happen as one.
        await using var transaction = await db.Database.BeginTransactionAsync(ct);
        var part = await db.Parts.SingleOrDefaultAsync(p => p.PartNumber == partNumber, ct);
        if (part is null)
            return PartsEndpoints.NoSuchPart(partNumber);
        var figures = await StockLedger.FiguresAsync(db, part.Id, ct);
        if (StockLedger.AdjustmentProblem(figures, input.Quantity!.Value) is { } problem)
            return TypedResults.Problem(statusCode: StatusCodes.Status409Conflict,
                title: "Not enough stock for this adjustment.", detail: problem);

        var actor = Actor.Of(http);
        var atUtc = clock.GetUtcNow().UtcDateTime;
        var movement = StockLedger.Book(db, part, kind, input.Quantity.Value, input.Reason!.Trim(), actor, atUtc);
        var after = figures with { OnHand = figures.OnHand + input.Quantity.Value };
        if (StockEvents.CrossesBelow(figures.Available, part.ReorderLevel, after.Available, part.ReorderLevel))
            StockEvents.Low(db, part, after, actor, "movement", atUtc); // committed with the movement or not at all
        await db.SaveChangesAsync(ct);
        await transaction.CommitAsync(ct);
        return TypedResults.Created($"{PartMapping.PathOf(part.PartNumber)}/movements/{movement.Id}",
            MovementDto.From(movement));
    }

    internal static Dictionary<string, string[]> Validate(MovementInput input)
    {
        var errors = new Dictionary<string, string[]>();
        var kind = input.Kind?.Trim().ToUpperInvariant();
        if (kind is not ("RECEIPT" or "ADJUSTMENT"))
            errors["kind"] = [kind is "RESERVATION" or "RELEASE" or "CONSUMPTION"
                ? $"'{input.Kind}' is booked by builds, not posted."
                : "The kind is 'receipt' or 'adjustment'."];
        if (input.Quantity is null or 0)
            errors["quantity"] = ["A quantity other than zero is required."];
        else if (kind == "RECEIPT" && input.Quantity < 0)
            errors["quantity"] = ["A receipt brings stock in: its quantity is positive (use an adjustment to correct a count)."];
        if (string.IsNullOrWhiteSpace(input.Reason))
            errors["reason"] = ["Say why the stock moved."];
        else if (input.Reason.Length > MaxReasonLength)
            errors["reason"] = [$"At most {MaxReasonLength} characters."];
        return errors;
    }
}
