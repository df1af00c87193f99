using System.Globalization;
using CsvHelper;
using CsvHelper.Configuration;

namespace PartsOpt.Api.Parts.Csv;

/// <summary>One bad cell (or line) of an import: where, what was written, and what is wrong.</summary>
public sealed record CsvLineError(int Line, string Column, string Text, string Message);

/// <summary>A line of the file read into a part; <see cref="Quantity"/> is null when the cell was blank.</summary>
public sealed record CsvPartRow(int Line, PartInput Input, int? Quantity);

/// <summary>Everything read from a file: the good rows and every error (the import applies none if any).</summary>
public sealed record CsvReadResult(IReadOnlyList<CsvPartRow> Rows, IReadOnlyList<CsvLineError> Errors);

/// <summary>
/// Reads our CSV format with CsvHelper (RFC 4180 quoting). It reads the whole file and reports every bad
/// line and column rather than stopping at the first. Lines are counted as a text editor counts them, the
/// header being line 1.
/// For a part already in stock, a column the file leaves out keeps the part's current value (a blank cell
/// in a column the file has clears it), so a file of just part numbers and prices changes only prices.
/// </summary>
public static class PartCsvReader
{
    /// <param name="text">The file.</param>
    /// <param name="inStock">The part in stock with a part number (ignoring case), or null.</param>
    public static CsvReadResult Read(TextReader text, Func<string, Part?> inStock)
    {
        var errors = new List<CsvLineError>();
        var rows = new List<CsvPartRow>();
        var config = new CsvConfiguration(CultureInfo.InvariantCulture)
        {
            MissingFieldFound = null,
            BadDataFound = args => errors.Add(new CsvLineError(args.Context.Parser?.RawRow ?? 0, "", args.RawRecord.TrimEnd(),
                "Bad quoting: a quoted cell must be wholly quoted, with quotes inside doubled (RFC 4180, section 2).")),
        };
        using var csv = new CsvReader(text, config);
        if (!csv.Read())
            return new([], [new CsvLineError(1, "", "", "The file is empty; its first line names the columns.")]);
        csv.ReadHeader();
        var header = csv.HeaderRecord ?? [];
        if (CheckHeader(header) is { Count: > 0 } headerErrors)
            return new([], headerErrors);

        var seen = new Dictionary<string, int>(StringComparer.OrdinalIgnoreCase);
        var lastRawRow = csv.Parser.RawRow;
        while (csv.Read())
        {
            var line = lastRawRow + 1;
            lastRawRow = csv.Parser.RawRow;
            if (csv.Parser.Count > header.Length)
            {
                errors.Add(new(line, "", csv.Parser.RawRecord.TrimEnd(),
                    $"The line has {csv.Parser.Count} cells; the header names {header.Length} columns."));
                continue;
            }
            var cells = header.ToDictionary(h => h, h => CsvCells.Restore(csv.GetField(h) ?? ""), StringComparer.Ordinal);
            if (inStock(cells[PartCsvColumns.PartNumber].Trim()) is { } part)
            {
                if (PartKinds.TryParse(cells[PartCsvColumns.Kind], out var kind) && kind != part.Kind)
                {
                    errors.Add(new(line, PartCsvColumns.Kind, cells[PartCsvColumns.Kind],
                        $"'{part.PartNumber}' is a {PartKinds.Name(part.Kind)} in stock; a kind cannot change."));
                    continue;
                }
                foreach (var (column, current) in PartCsvWriter.CellsOf(part))
                    cells.TryAdd(column, current);
            }
            var row = new PartCsvRow(line, cells, errors).Read();
            if (row is null)
                continue;
            if (seen.TryGetValue(row.Input.PartNumber!, out var first))
                errors.Add(new(line, PartCsvColumns.PartNumber, row.Input.PartNumber!,
                    $"The part number is on line {first} already; a file lists each part once."));
            else
                seen[row.Input.PartNumber!] = line;
            rows.Add(row);
        }
        return new(rows, errors.OrderBy(e => e.Line).ToList());
    }

    private static List<CsvLineError> CheckHeader(string[] header)
    {
        var errors = new List<CsvLineError>();
        var known = PartCsvColumns.All.ToHashSet(StringComparer.Ordinal);
        foreach (var name in header.Where(h => !known.Contains(h)))
            errors.Add(new(1, name, name, $"Unknown column; the columns are: {string.Join(", ", PartCsvColumns.All)}."));
        foreach (var name in header.GroupBy(h => h).Where(g => g.Count() > 1).Select(g => g.Key))
            errors.Add(new(1, name, name, "The column is named twice."));
        foreach (var name in new[] { PartCsvColumns.PartNumber, PartCsvColumns.Kind }.Where(r => !header.Contains(r)))
            errors.Add(new(1, name, "", "This column is required."));
        return errors;
    }
}
