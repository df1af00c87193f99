using System.Globalization;
using CsvHelper;
using CsvHelper.Configuration;
using PartsOpt.Values;
using C = PartsOpt.Api.Parts.Csv.PartCsvColumns;

namespace PartsOpt.Api.Parts.Csv;

/// <summary>
/// Writes parts in our CSV format: every column, in <see cref="PartCsvColumns.All"/> order, CRLF line ends
/// and quoting as RFC 4180 section 2 says; text cells neutralised against formula injection.
/// </summary>
public static class PartCsvWriter
{
    public static void Write(TextWriter text, IEnumerable<(Part Part, int OnHand)> parts)
    {
        var config = new CsvConfiguration(CultureInfo.InvariantCulture) { NewLine = "\r\n" };
        using var csv = new CsvWriter(text, config, leaveOpen: true);
        foreach (var column in C.All)
            csv.WriteField(column);
        csv.NextRecord();
        foreach (var (part, onHand) in parts)
        {
            var cells = CellsOf(part);
            cells[C.Quantity] = CsvCells.WholeNumber(onHand);
            foreach (var column in C.All)
                csv.WriteField(CsvCells.Neutralise(cells.GetValueOrDefault(column, "")));
            csv.NextRecord();
        }
    }

    /// <summary>A part's cells as the export writes them before neutralising, without the quantity.</summary>
    public static Dictionary<string, string> CellsOf(Part p)
    {
        var cells = new Dictionary<string, string>
        {
            [C.PartNumber] = p.PartNumber,
            [C.Kind] = PartKinds.Name(p.Kind),
            [C.Description] = p.Description,
            [C.Package] = p.Package,
            [C.UnitCost] = CsvCells.Number(p.UnitCost),
            [C.Currency] = p.Currency,
            [C.ReorderLevel] = CsvCells.WholeNumber(p.ReorderLevel),
            [C.Location] = p.Location,
            [C.Notes] = p.Notes,
        };
        void Put(string column, double? value, Quantity quantity)
        {
            if (value is { } v)
                cells[column] = CsvCells.Value(v, quantity);
        }
        void PutBool(string column, bool? value)
        {
            if (value is { } b)
                cells[column] = CsvCells.YesNo(b);
        }

        Put(C.Resistance, p.ResistanceOhms, Quantity.Resistance);
        Put(C.Capacitance, p.CapacitanceF, Quantity.Capacitance);
        if (p.ToleranceMinus is { } minus && p.TolerancePlus is { } plus)
            cells[C.Tolerance] = CsvCells.Tolerance(new Tolerance(minus, plus, p.ToleranceIsAbsolute), p.CapacitanceF);
        if (p.TempcoPpmPerK is { } tempco)
            cells[C.TempcoPpmPerK] = CsvCells.Number(tempco);
        Put(C.PowerRating, p.PowerRatingW, Quantity.Power);
        if (p.Dielectric is { } dielectric)
            cells[C.Dielectric] = dielectric.ToString();
        Put(C.VoltageRating, p.VoltageRatingV, Quantity.Voltage);
        PutBool(C.Polarised, p.Polarised);
        if (p.Taper is { } taper)
            cells[C.Taper] = PartKinds.TaperName(taper);
        PutBool(C.Trimmer, p.Trimmer);
        if (p.Sections is { } sections)
            cells[C.Sections] = CsvCells.WholeNumber(sections);
        Put(C.SupplyMin, p.SupplyMinV, Quantity.Voltage);
        Put(C.SupplyMax, p.SupplyMaxV, Quantity.Voltage);
        Put(C.GainBandwidth, p.GainBandwidthHz, Quantity.Frequency);
        if (p.SlewRateVPerS is { } slew)
            cells[C.SlewRateVPerUs] = CsvCells.SlewRate(slew);
        Put(C.OutputHeadroomLow, p.OutputHeadroomLowV, Quantity.Voltage);
        Put(C.OutputHeadroomHigh, p.OutputHeadroomHighV, Quantity.Voltage);
        Put(C.InputHeadroomLow, p.InputHeadroomLowV, Quantity.Voltage);
        Put(C.InputHeadroomHigh, p.InputHeadroomHighV, Quantity.Voltage);
        Put(C.InputOffset, p.InputOffsetV, Quantity.Voltage);
        Put(C.OutputCurrentMax, p.OutputCurrentMaxA, Quantity.Current);
        Put(C.QuiescentCurrent, p.QuiescentCurrentPerSectionA, Quantity.Current);
        PutBool(C.Comparator, p.Comparator);
        PutBool(C.OpenDrain, p.OpenDrain);
        return cells;
    }
}
