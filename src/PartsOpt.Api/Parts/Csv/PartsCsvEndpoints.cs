using System.Text;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.EntityFrameworkCore;
using PartsOpt.Api.Movements;
using PartsOpt.Api.Persistence;
using PartsOpt.Api.Security;

namespace PartsOpt.Api.Parts.Csv;

/// <summary>POST /api/v1/parts/import and GET /api/v1/parts/export: the stock as CSV (docs/csv-format.md).</summary>
public static class PartsCsvEndpoints
{
    public const string MaxBytesKey = "Import:MaxBytes";
    public const long DefaultMaxBytes = 4 * 1024 * 1024;
    private const string CsvType = "text/csv";

    public static RouteGroupBuilder MapPartsCsv(this RouteGroupBuilder parts)
    {
        parts.MapPost("/import", Import).WithName("ImportParts")
            .WithSummary("Upserts parts from CSV, all or nothing; ?dryRun=true only reports what would change.")
            .Accepts<string>(CsvType)
            .ProducesValidationProblem()
            .ProducesProblem(StatusCodes.Status413PayloadTooLarge)
            .ProducesProblem(StatusCodes.Status415UnsupportedMediaType)
            .WithBodyLimit(null) // bounded below by Import:MaxBytes instead of the general limit
            .WithIdempotency();
        parts.MapGet("/export", Export).WithName("ExportParts")
            .WithSummary("Every part as CSV, in the import format (imports back unchanged).")
            .Produces<string>(StatusCodes.Status200OK, CsvType);
        return parts;
    }

    private static async Task<Results<Ok<ImportReport>, ValidationProblem, ProblemHttpResult>> Import(
        HttpRequest request, bool? dryRun, PartsOptDbContext db, TimeProvider clock, IConfiguration configuration,
        CancellationToken ct)
    {
        if (!IsCsv(request.ContentType))
            return TypedResults.Problem(statusCode: StatusCodes.Status415UnsupportedMediaType,
                title: "Send CSV.", detail: $"The body must be {CsvType} (RFC 4180).");
        var maxBytes = configuration.GetValue(MaxBytesKey, DefaultMaxBytes);
        var body = await ReadBoundedAsync(request.Body, maxBytes, ct);
        if (body is null)
            return TypedResults.Problem(statusCode: StatusCodes.Status413PayloadTooLarge,
                title: "The file is too large.", detail: $"An import holds at most {maxBytes} bytes; split the file.");

        using var text = new StreamReader(new MemoryStream(body), Encoding.UTF8, detectEncodingFromByteOrderMarks: true);
        var outcome = await PartImporter.ImportAsync(db, text, dryRun ?? false, Actor.Of(request.HttpContext),
            clock.GetUtcNow().UtcDateTime, ct);
        return outcome.Report is { } report ? TypedResults.Ok(report) : Problem(outcome.Errors);
    }

    /// <summary>400 naming every bad cell: errors keyed "lines[12].capacitance", and the list in "lineErrors".</summary>
    internal static ValidationProblem Problem(IReadOnlyList<CsvLineError> errors)
    {
        var byKey = errors
            .GroupBy(e => e.Column.Length == 0 ? $"lines[{e.Line}]" : $"lines[{e.Line}].{e.Column}")
            .ToDictionary(g => g.Key, g => g.Select(e => e.Message).ToArray());
        return TypedResults.ValidationProblem(byKey,
            detail: $"{errors.Count} error(s) in the file; nothing was imported.",
            title: "The CSV file has errors.",
            extensions: new Dictionary<string, object?> { ["lineErrors"] = errors });
    }

    private static async Task<FileContentHttpResult> Export(PartsOptDbContext db, HttpContext http, CancellationToken ct)
    {
        var rows = await db.Parts.AsNoTracking().OrderBy(p => p.PartNumber)
            .Select(p => new { Part = p, OnHand = p.Movements.Sum(m => m.OnHandChange) })
            .ToListAsync(ct);
        var text = new StringWriter();
        PartCsvWriter.Write(text, rows.Select(r => (r.Part, r.OnHand)));
        // UTF-8 with a byte-order mark, so spreadsheets read Ω and µ; the import skips the mark.
        var bytes = Encoding.UTF8.GetPreamble().Concat(Encoding.UTF8.GetBytes(text.ToString())).ToArray();
        http.Response.Headers.ContentDisposition = "attachment; filename=\"parts.csv\"";
        return TypedResults.File(bytes, $"{CsvType}; charset=utf-8");
    }

    private static bool IsCsv(string? contentType) =>
        contentType is not null && contentType.Split(';')[0].Trim().Equals(CsvType, StringComparison.OrdinalIgnoreCase);

    /// <summary>The whole body, or null when it passes <paramref name="maxBytes"/>.</summary>
    private static async Task<byte[]?> ReadBoundedAsync(Stream body, long maxBytes, CancellationToken ct)
    {
        using var buffer = new MemoryStream();
        var chunk = new byte[81920];
        int read;
        while ((read = await body.ReadAsync(chunk, ct)) > 0)
        {
            if (buffer.Length + read > maxBytes)
                return null;
            buffer.Write(chunk, 0, read);
        }
        return buffer.ToArray();
    }
}
