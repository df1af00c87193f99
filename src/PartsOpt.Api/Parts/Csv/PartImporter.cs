using Microsoft.EntityFrameworkCore;
using PartsOpt.Api.Movements;
using PartsOpt.Api.Persistence;
using PartsOpt.Api.Webhooks;

namespace PartsOpt.Api.Parts.Csv;

/// <summary>What an import did (or, on a dry run, would do).</summary>
public sealed record ImportReport(
    bool DryRun, IReadOnlyList<string> Created, IReadOnlyList<string> Updated, int Unchanged, int Movements);

/// <summary>The outcome of an import: a report, or every error and nothing changed.</summary>
public sealed record ImportOutcome(ImportReport? Report, IReadOnlyList<CsvLineError> Errors);

/// <summary>
/// Upserts a CSV file by part number, all or nothing, in ONE transaction. A new part's quantity is booked
/// as a receipt, an existing part's as an adjustment by the difference (reason "import"); a blank quantity
/// leaves an existing part's stock alone, as a column the file leaves out leaves that field. A dry run does all the work and rolls it back.
/// </summary>
public static class PartImporter
{
    public const string Reason = "import";

    public static async Task<ImportOutcome> ImportAsync(PartsOptDbContext db, TextReader text, bool dryRun,
        string actor, DateTime atUtc, CancellationToken ct)
    {
        // A small firm's stock fits in memory; loading it inside the transaction keeps the upsert consistent.
        await using var transaction = await db.Database.BeginTransactionAsync(ct);
        var existing = (await db.Parts.ToListAsync(ct)).ToDictionary(p => p.PartNumber, StringComparer.OrdinalIgnoreCase);
        var read = PartCsvReader.Read(text, number => existing.GetValueOrDefault(number));
        var errors = read.Errors.ToList();

        var created = new List<string>();
        var updated = new List<string>();
        var unchanged = 0;
        var movements = 0;
        var nowLow = new List<(Part Part, StockFigures After)>();
        foreach (var row in read.Rows)
        {
            var number = row.Input.PartNumber!;
            if (!existing.TryGetValue(number, out var part))
            {
                part = new Part { PartNumber = number };
                row.Input.ApplyTo(part);
                db.Parts.Add(part);
                created.Add(number);
                if (row.Quantity is > 0)
                {
                    StockLedger.Book(db, part, MovementKind.Receipt, row.Quantity.Value, Reason, actor, atUtc);
                    movements++;
                }
                // A part that arrives below its level is a part to reorder: it counts as crossing.
                var arrived = new StockFigures(row.Quantity ?? 0, 0);
                if (arrived.Available < part.ReorderLevel)
                    nowLow.Add((part, arrived));
                continue;
            }

            var levelBefore = part.ReorderLevel;
            var before = await StockLedger.FiguresAsync(db, part.Id, ct);
            var afterFigures = before;
            row.Input.ApplyTo(part);
            db.ChangeTracker.DetectChanges();
            var changed = db.Entry(part).State == EntityState.Modified;
            if (row.Quantity is { } quantity)
            {
                var difference = quantity - before.OnHand;
                if (difference != 0)
                {
                    if (StockLedger.AdjustmentProblem(before, difference) is { } problem)
                    {
                        errors.Add(new(row.Line, PartCsvColumns.Quantity, quantity.ToString(System.Globalization.CultureInfo.InvariantCulture), problem));
                        continue;
                    }
                    StockLedger.Book(db, part, MovementKind.Adjustment, difference, Reason, actor, atUtc);
                    afterFigures = before with { OnHand = quantity };
                    movements++;
                    changed = true;
                }
            }
            if (StockEvents.CrossesBelow(before.Available, levelBefore, afterFigures.Available, part.ReorderLevel))
                nowLow.Add((part, afterFigures));
            if (changed)
                updated.Add(part.PartNumber);
            else
                unchanged++;
        }

        if (errors.Count > 0)
            return new ImportOutcome(null, errors.OrderBy(e => e.Line).ToList()); // disposing rolls back
        var report = new ImportReport(dryRun, created, updated, unchanged, movements);
        if (!dryRun)
        {
            // The events commit in the import's own transaction: a rejected file or a dry run publishes nothing.
            foreach (var (part, after) in nowLow)
                StockEvents.Low(db, part, after, actor, "import", atUtc);
            StockEvents.Imported(db, report, actor, atUtc);
            await db.SaveChangesAsync(ct);
            await transaction.CommitAsync(ct);
        }
        db.ChangeTracker.Clear();
        return new ImportOutcome(report, []);
    }
}
