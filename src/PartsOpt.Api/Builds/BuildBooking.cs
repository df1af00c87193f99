using System.Globalization;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.EntityFrameworkCore;
using PartsOpt.Api.DesignSearches;
using PartsOpt.Api.Movements;
using PartsOpt.Api.Persistence;
using PartsOpt.Api.Webhooks;

namespace PartsOpt.Api.Builds;

/// <summary>
/// The three writes of a build: reserve, complete, cancel. Each runs in ONE transaction that SQLite begins
/// IMMEDIATE (Microsoft.Data.Sqlite's default), so it holds the database's write lock from its first read:
/// the stock figures it checks cannot change before it books, and a second build waiting for the lock
/// (Microsoft.Data.Sqlite retries a busy database up to the command timeout) reads the figures this one left.
/// </summary>
internal static class BuildBooking
{
    public static async Task<Results<Created<BuildDto>, ValidationProblem, ProblemHttpResult>> Reserve(
        BuildInput input, PartsOptDbContext db, HttpContext http, TimeProvider clock, CancellationToken ct)
    {
        var quantity = input.Quantity!.Value;
        await using var transaction = await db.Database.BeginTransactionAsync(ct);
        var design = await db.Designs.AsNoTracking().SingleOrDefaultAsync(d => d.Id == input.DesignId, ct);
        if (design is null)
            return DesignSearchesEndpoints.NoSuchDesign(input.DesignId!.Value);

        var parts = DesignParts.Of(design);
        var stock = await StockLedger.FiguresOfAsync(db, parts.Select(p => p.PartNumber).ToList(), ct);
        var shortages = new List<ShortageDto>();
        foreach (var part in parts)
        {
            var needed = checked(part.PerUnit * quantity);
            var available = stock.TryGetValue(part.PartNumber, out var s) ? s.Figures.Available : 0;
            if (available < needed)
                shortages.Add(new ShortageDto(part.PartNumber, needed, Math.Max(available, 0)));
        }
        if (shortages.Count > 0)
            return TypedResults.Problem(statusCode: StatusCodes.Status409Conflict,
                title: "Not enough stock for this build.",
                detail: string.Create(CultureInfo.InvariantCulture,
                    $"{shortages.Count} of the design's {parts.Count} parts are short for {quantity} boards; nothing was reserved."),
                extensions: new Dictionary<string, object?> { ["shortages"] = shortages });

        var actor = Actor.Of(http);
        var atUtc = clock.GetUtcNow().UtcDateTime;
        var build = new Build
        {
            DesignId = design.Id,
            Quantity = quantity,
            Reference = input.Reference!.Trim(),
            Note = input.Note?.Trim() ?? "",
            Status = BuildStatus.Reserved,
            Actor = actor,
            ReservedAtUtc = atUtc,
        };
        build.Lines.AddRange(parts.Select(p => new BuildLine
        {
            PartNumber = stock[p.PartNumber].Part.PartNumber,
            PerUnit = p.PerUnit,
            Reserved = p.PerUnit * quantity,
        }));
        db.Builds.Add(build);
        await db.SaveChangesAsync(ct); // the build's id names it in the ledger rows

        foreach (var line in build.Lines)
        {
            var (part, before) = stock[line.PartNumber];
            StockLedger.BookForBuild(db, part.Id, MovementKind.Reservation, line.Reserved, ReasonOf(build), actor, atUtc);
            var after = before with { Reserved = before.Reserved + line.Reserved };
            if (StockEvents.CrossesBelow(before.Available, part.ReorderLevel, after.Available, part.ReorderLevel))
                StockEvents.Low(db, part, after, actor, "build", atUtc);
        }
        Publish(db, EventTypes.BuildReserved, build, actor, atUtc);
        await db.SaveChangesAsync(ct);
        await transaction.CommitAsync(ct);
        return TypedResults.Created(BuildsEndpoints.PathOf(build.Id), BuildDto.From(build));
    }

    public static Task<Results<Ok<BuildDto>, ProblemHttpResult>> Complete(
        int id, PartsOptDbContext db, HttpContext http, TimeProvider clock, CancellationToken ct) =>
        Close(id, BuildStatus.Completed, db, http, clock, ct);

    public static Task<Results<Ok<BuildDto>, ProblemHttpResult>> Cancel(
        int id, PartsOptDbContext db, HttpContext http, TimeProvider clock, CancellationToken ct) =>
        Close(id, BuildStatus.Cancelled, db, http, clock, ct);

    // Completing consumes every line's reservation; cancelling releases it. A build already in the asked-for
    // state answers as it stands and writes nothing (a retried request is harmless); one in the other final
    // state is a conflict.
    private static async Task<Results<Ok<BuildDto>, ProblemHttpResult>> Close(
        int id, BuildStatus target, PartsOptDbContext db, HttpContext http, TimeProvider clock, CancellationToken ct)
    {
        await using var transaction = await db.Database.BeginTransactionAsync(ct);
        var build = await db.Builds.Include(b => b.Lines).SingleOrDefaultAsync(b => b.Id == id, ct);
        if (build is null)
            return BuildsEndpoints.NoSuchBuild(id);
        if (build.Status == target)
            return TypedResults.Ok(BuildDto.From(build));
        if (build.Status != BuildStatus.Reserved)
            return TypedResults.Problem(statusCode: StatusCodes.Status409Conflict,
                title: target == BuildStatus.Completed ? "A cancelled build cannot be completed." : "A completed build cannot be cancelled.",
                detail: string.Create(CultureInfo.InvariantCulture,
                    $"Build {id} was {BuildRules.StatusName(build.Status)} by {build.ClosedBy} at {build.ClosedAtUtc:O}; start a new build instead."));

        var stock = await StockLedger.FiguresOfAsync(db, build.Lines.ConvertAll(l => l.PartNumber), ct);
        var kind = target == BuildStatus.Completed ? MovementKind.Consumption : MovementKind.Release;
        var actor = Actor.Of(http);
        var atUtc = clock.GetUtcNow().UtcDateTime;
        foreach (var line in build.Lines)
        {
            // Parts cannot be deleted or counted below what is reserved, so a reserved line always finds its
            // stock; should the ledger say otherwise, refuse rather than book it below zero.
            if (!stock.TryGetValue(line.PartNumber, out var s) || s.Figures.Reserved < line.Reserved || s.Figures.OnHand < line.Reserved)
                return TypedResults.Problem(statusCode: StatusCodes.Status409Conflict,
                    title: "The ledger no longer holds this build's reservation.",
                    detail: $"'{line.PartNumber}' has less reserved or on hand than build {id} set aside; nothing was booked.");
            StockLedger.BookForBuild(db, s.Part.Id, kind, line.Reserved, ReasonOf(build), actor, atUtc);
            if (target == BuildStatus.Completed)
                line.Consumed = line.Reserved;
        }
        build.Status = target;
        build.ClosedBy = actor;
        build.ClosedAtUtc = atUtc;
        Publish(db, target == BuildStatus.Completed ? EventTypes.BuildCompleted : EventTypes.BuildCancelled,
            build, actor, atUtc);
        await db.SaveChangesAsync(ct);
        await transaction.CommitAsync(ct);
        return TypedResults.Ok(BuildDto.From(build));
    }

    private static string ReasonOf(Build build) =>
        string.Create(CultureInfo.InvariantCulture, $"build {build.Id}: {build.Reference}");

    // Every event names each part with the quantity that moved: reserved, consumed or released, which for a
    // whole build are the same figure.
    private static void Publish(PartsOptDbContext db, string type, Build build, string actor, DateTime atUtc) =>
        EventOutbox.Add(db, type, new BuildEventPayload(build.Id, build.DesignId, build.Quantity, build.Reference,
            BuildRules.StatusName(build.Status),
            build.Lines.OrderBy(l => l.PartNumber, StringComparer.Ordinal).Select(l => new BuildEventPart(l.PartNumber, l.Reserved)).ToList(),
            actor), atUtc);
}
