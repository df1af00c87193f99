using System.Globalization;
using System.Text;
using CsvHelper;
using CsvHelper.Configuration;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.EntityFrameworkCore;
using PartsOpt.Api.Parts.Csv;
using PartsOpt.Api.Persistence;

namespace PartsOpt.Api.DesignSearches;

/// <summary>
/// GET /api/v1/designs/{id}/bom.csv: one row per BOM line, quantities per board and for the build, costs
/// for the build. RFC 4180 quoting, CRLF, UTF-8 with a byte-order mark; text cells neutralised against
/// formula injection as the parts export does.
/// </summary>
public static class DesignBomCsv
{
    public const string CsvType = "text/csv";

    public static readonly IReadOnlyList<string> Columns =
    [
        "designators", "part_number", "description", "value", "quantity_per_unit", "quantity_for_build",
        "unit_cost", "line_cost", "currency",
    ];

    internal static async Task<Results<FileContentHttpResult, ProblemHttpResult>> Get(
        int id, PartsOptDbContext db, HttpContext http, CancellationToken ct)
    {
        var design = await db.Designs.AsNoTracking().SingleOrDefaultAsync(d => d.Id == id, ct);
        if (design is null)
            return DesignSearchesEndpoints.NoSuchDesign(id);
        var result = DesignSearchesEndpoints.ToDto(design, []).Result;
        var text = new StringWriter();
        Write(text, result.Bom);
        var bytes = Encoding.UTF8.GetPreamble().Concat(Encoding.UTF8.GetBytes(text.ToString())).ToArray();
        http.Response.Headers.ContentDisposition =
            string.Create(CultureInfo.InvariantCulture, $"attachment; filename=\"design-{id}-bom.csv\"");
        return TypedResults.File(bytes, $"{CsvType}; charset=utf-8");
    }

    public static void Write(TextWriter text, IEnumerable<BomLineDto> lines)
    {
        using var csv = new CsvWriter(text, new CsvConfiguration(CultureInfo.InvariantCulture) { NewLine = "\r\n" }, leaveOpen: true);
        foreach (var column in Columns)
            csv.WriteField(column);
        csv.NextRecord();
        foreach (var line in lines)
        {
            string[] cells =
            [
                string.Join(' ', line.Designators), line.PartNumber, line.Description, line.Value,
                CsvCells.WholeNumber(line.PerUnit), CsvCells.WholeNumber(line.ForBuild),
                CsvCells.Number(line.UnitCost), CsvCells.Number(line.LineCost), line.Currency,
            ];
            foreach (var cell in cells)
                csv.WriteField(CsvCells.Neutralise(cell));
            csv.NextRecord();
        }
    }
}
