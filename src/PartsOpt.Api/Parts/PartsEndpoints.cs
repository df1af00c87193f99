using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.EntityFrameworkCore;
using PartsOpt.Api.Keys;
using PartsOpt.Api.Movements;
using PartsOpt.Api.Persistence;
using PartsOpt.Api.Parts.Csv;
using PartsOpt.Api.Problems;
using PartsOpt.Api.Security;

namespace PartsOpt.Api.Parts;

/// <summary>/api/v1/parts: the stock of parts. Quantities move only through the ledger (movements).</summary>
public static class PartsEndpoints
{
    public static IEndpointRouteBuilder MapParts(this IEndpointRouteBuilder app)
    {
        // Reads for viewers, writes for stockkeepers (the movements and CSV endpoints are in the group too).
        var parts = app.MapGroup("/api/v1/parts").WithTags("Parts")
            .RequireAccess(readPolicy: Policies.Viewer, writePolicy: Policies.Stockkeeper);

        parts.MapGet("/", PartQueries.List).WithName("ListParts")
            .WithSummary("Parts in part-number order, filtered by kind, value range and text; paged.");
        parts.MapGet("/{partNumber}", Get).WithName("GetPart")
            .WithSummary("One part with its stock figures.")
            .ProducesProblem(StatusCodes.Status404NotFound);
        parts.MapPost("/", Create).WithName("CreatePart")
            .WithSummary("Adds a part; an initialQuantity is booked as a receipt.")
            .ProducesProblem(StatusCodes.Status409Conflict)
            .Validate<PartInput>(PartRules.Validate)
            .WithIdempotency();
        parts.MapPut("/{partNumber}", Update).WithName("UpdatePart")
            .WithSummary("Replaces a part's fields (never its quantity; the kind cannot change). With If-Match, only while the ETag is current.")
            .ProducesProblem(StatusCodes.Status404NotFound)
            .ProducesProblem(StatusCodes.Status412PreconditionFailed)
            .Validate<PartInput>(PartRules.Validate);
        parts.MapDelete("/{partNumber}", Delete).WithName("DeletePart")
            .WithSummary("Removes a part and its ledger; refused while any of it is reserved.")
            .ProducesProblem(StatusCodes.Status404NotFound)
            .ProducesProblem(StatusCodes.Status409Conflict);

        parts.MapMovements();
        parts.MapPartsCsv();
        return app;
    }

    internal static ProblemHttpResult NoSuchPart(string partNumber) =>
        TypedResults.Problem(statusCode: StatusCodes.Status404NotFound, title: "No such part.",
            detail: $"There is no part '{partNumber}'.");

    private static async Task<Results<Ok<PartDto>, ProblemHttpResult>> Get(
        string partNumber, PartsOptDbContext db, HttpContext http, CancellationToken ct)
    {
        var part = await db.Parts.AsNoTracking().SingleOrDefaultAsync(p => p.PartNumber == partNumber, ct);
        if (part is null)
            return NoSuchPart(partNumber);
        var figures = await StockLedger.FiguresAsync(db, part.Id, ct);
        http.Response.Headers.ETag = PartVersion.ETagOf(part);
        return TypedResults.Ok(part.ToDto(figures.OnHand, figures.Reserved));
    }

    private static async Task<Results<Created<PartDto>, ValidationProblem, ProblemHttpResult>> Create(
        PartInput input, PartsOptDbContext db, HttpContext http, TimeProvider clock, CancellationToken ct)
    {
        var partNumber = input.PartNumber!;
        if (await db.Parts.AnyAsync(p => p.PartNumber == partNumber, ct))
            return PartExists(partNumber);

        var part = new Part { PartNumber = partNumber };
        input.ApplyTo(part);
        db.Parts.Add(part);
        var initial = input.InitialQuantity ?? 0;
        if (initial > 0)
            StockLedger.Book(db, part, MovementKind.Receipt, initial, "initial stock", Actor.Of(http),
                clock.GetUtcNow().UtcDateTime);
        try
        {
            await db.SaveChangesAsync(ct); // the part and its first receipt in one transaction
        }
        catch (DbUpdateException)
        {
            db.ChangeTracker.Clear();
            if (await db.Parts.AnyAsync(p => p.PartNumber == partNumber, ct))
                return PartExists(partNumber); // lost a race with another create of the same number
            throw;
        }
        http.Response.Headers.ETag = PartVersion.ETagOf(part);
        return TypedResults.Created(PartMapping.PathOf(part.PartNumber), part.ToDto(initial, 0));
    }

    private static ProblemHttpResult PartExists(string partNumber) =>
        TypedResults.Problem(statusCode: StatusCodes.Status409Conflict, title: "The part number is taken.",
            detail: $"A part '{partNumber}' exists already; change it with PUT {PartMapping.PathOf(partNumber)}.");

    // If-Match is optional: without it a PUT replaces the fields as it always has (last writer wins). With
    // it, the check and the write share one transaction, and the version is a concurrency token besides.
    private static async Task<Results<Ok<PartDto>, ValidationProblem, ProblemHttpResult>> Update(
        string partNumber, PartInput input, PartsOptDbContext db, HttpContext http, CancellationToken ct)
    {
        await using var transaction = await db.Database.BeginTransactionAsync(ct);
        var part = await db.Parts.SingleOrDefaultAsync(p => p.PartNumber == partNumber, ct);
        if (part is null)
            return NoSuchPart(partNumber);
        switch (PartVersion.Allows(http.Request, part))
        {
            case null:
                return TypedResults.ValidationProblem(new Dictionary<string, string[]>
                {
                    ["If-Match"] = ["Entity tags in quotes, as GET gave them in its ETag header, or *."],
                });
            case false:
                return Stale(part);
        }

        var errors = new Dictionary<string, string[]>();
        if (!string.Equals(input.PartNumber, part.PartNumber, StringComparison.OrdinalIgnoreCase))
            errors["partNumber"] = [$"The body's part number must be the URL's ('{part.PartNumber}'); part numbers are not renamed."];
        if (PartKinds.TryParse(input.Kind, out var kind) && kind != part.Kind)
            errors["kind"] = [$"This part is a {PartKinds.Name(part.Kind)}; a kind cannot change (delete and create instead)."];
        if (input.InitialQuantity is not null)
            errors["initialQuantity"] = ["Quantity changes only through movements (POST .../movements)."];
        if (errors.Count > 0)
            return TypedResults.ValidationProblem(errors);

        input.ApplyTo(part);
        try
        {
            await db.SaveChangesAsync(ct);
        }
        catch (DbUpdateConcurrencyException)
        {
            return Stale(part); // only another writer outside this transaction could do it; refuse, never guess
        }
        await transaction.CommitAsync(ct);
        var figures = await StockLedger.FiguresAsync(db, part.Id, ct);
        http.Response.Headers.ETag = PartVersion.ETagOf(part);
        return TypedResults.Ok(part.ToDto(figures.OnHand, figures.Reserved));
    }

    private static ProblemHttpResult Stale(Part part) =>
        TypedResults.Problem(statusCode: StatusCodes.Status412PreconditionFailed, title: "The part has changed since it was read.",
            detail: $"'{part.PartNumber}' was changed after the ETag you sent was issued; GET it again, reapply your change, and PUT with the new ETag.");

    // Deleting removes the part AND its ledger rows, in one transaction, and only while nothing is
    // reserved: a reservation belongs to a build that still needs the part. The ledger is append-only for
    // as long as its part exists; a deleted part's history goes with it (export first to keep a record).
    private static async Task<Results<NoContent, ProblemHttpResult>> Delete(
        string partNumber, PartsOptDbContext db, CancellationToken ct)
    {
        await using var transaction = await db.Database.BeginTransactionAsync(ct);
        var part = await db.Parts.AsNoTracking().SingleOrDefaultAsync(p => p.PartNumber == partNumber, ct);
        if (part is null)
            return NoSuchPart(partNumber);
        var figures = await StockLedger.FiguresAsync(db, part.Id, ct);
        if (figures.Reserved > 0)
            return TypedResults.Problem(statusCode: StatusCodes.Status409Conflict, title: "The part is reserved.",
                detail: $"{figures.Reserved} of '{part.PartNumber}' are reserved for builds; release them first.");

        await db.Movements.Where(m => m.PartId == part.Id).ExecuteDeleteAsync(ct);
        await db.Parts.Where(p => p.Id == part.Id).ExecuteDeleteAsync(ct);
        await transaction.CommitAsync(ct);
        return TypedResults.NoContent();
    }
}
