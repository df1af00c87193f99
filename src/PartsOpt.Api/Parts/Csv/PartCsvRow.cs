using System.Globalization;
using PartsOpt.Values;
using C = PartsOpt.Api.Parts.Csv.PartCsvColumns;

namespace PartsOpt.Api.Parts.Csv;

/// <summary>
/// Reads one line's cells into a <see cref="PartInput"/>: values with SI prefixes or RKM codes
/// (EngineeringValue), tolerances as IEC 60062 letters or percentages (ToleranceCode), then the same
/// rules as the JSON API (PartRules), each error reported against its column.
/// </summary>
internal sealed class PartCsvRow(int line, IReadOnlyDictionary<string, string> cells, List<CsvLineError> errors)
{
    private readonly HashSet<string> _badColumns = [];

    public CsvPartRow? Read()
    {
        var before = errors.Count;
        var kindText = Text(C.Kind);
        if (!PartKinds.TryParse(kindText, out var kind))
        {
            Error(C.Kind, $"The kind is one of {PartKinds.Expected}.");
            return null;
        }
        var own = C.For(kind);
        foreach (var (column, text) in cells)
            if (text.Trim().Length > 0 && !C.Common.Contains(column) && !own.Contains(column))
                Error(column, $"Not used for a {PartKinds.Name(kind)}; leave it blank.");

        var capacitance = kind == PartKind.Capacitor ? Value(C.Capacitance, Quantity.Capacitance) : null;
        var resistance = kind is PartKind.Resistor or PartKind.Potentiometer ? Value(C.Resistance, Quantity.Resistance) : null;
        var tolerance = kind == PartKind.OpAmp ? null : ReadTolerance(capacitance, kind);
        var input = new PartInput
        {
            PartNumber = Text(C.PartNumber)?.Trim(),
            Kind = kindText,
            Description = Text(C.Description),
            Package = Text(C.Package),
            UnitCost = Decimal(C.UnitCost),
            Currency = Text(C.Currency)?.Trim(),
            ReorderLevel = Integer(C.ReorderLevel),
            Location = Text(C.Location),
            Notes = Text(C.Notes),
            Resistor = kind != PartKind.Resistor ? null : new ResistorFields
            {
                ResistanceOhms = resistance,
                ToleranceMinus = tolerance?.Minus,
                TolerancePlus = tolerance?.Plus,
                TempcoPpmPerK = Number(C.TempcoPpmPerK),
                PowerRatingW = Value(C.PowerRating, Quantity.Power),
            },
            Capacitor = kind != PartKind.Capacitor ? null : new CapacitorFields
            {
                CapacitanceF = capacitance,
                ToleranceMinus = tolerance?.Minus,
                TolerancePlus = tolerance?.Plus,
                ToleranceAbsolute = tolerance?.IsAbsolute ?? false,
                Dielectric = Text(C.Dielectric),
                VoltageRatingV = Value(C.VoltageRating, Quantity.Voltage),
                Polarised = Bool(C.Polarised),
                TempcoPpmPerK = Number(C.TempcoPpmPerK),
            },
            Potentiometer = kind != PartKind.Potentiometer ? null : new PotentiometerFields
            {
                ResistanceOhms = resistance,
                ToleranceMinus = tolerance?.Minus,
                TolerancePlus = tolerance?.Plus,
                Taper = Text(C.Taper),
                PowerRatingW = Value(C.PowerRating, Quantity.Power),
                Trimmer = Bool(C.Trimmer),
            },
            OpAmp = kind != PartKind.OpAmp ? null : new OpAmpFields
            {
                Sections = Integer(C.Sections),
                SupplyMinV = Value(C.SupplyMin, Quantity.Voltage),
                SupplyMaxV = Value(C.SupplyMax, Quantity.Voltage),
                GainBandwidthHz = Value(C.GainBandwidth, Quantity.Frequency),
                SlewRateVPerS = SlewRate(C.SlewRateVPerUs),
                OutputHeadroomLowV = Value(C.OutputHeadroomLow, Quantity.Voltage),
                OutputHeadroomHighV = Value(C.OutputHeadroomHigh, Quantity.Voltage),
                InputHeadroomLowV = Value(C.InputHeadroomLow, Quantity.Voltage),
                InputHeadroomHighV = Value(C.InputHeadroomHigh, Quantity.Voltage),
                InputOffsetV = Value(C.InputOffset, Quantity.Voltage),
                OutputCurrentMaxA = Value(C.OutputCurrentMax, Quantity.Current),
                QuiescentCurrentPerSectionA = Value(C.QuiescentCurrent, Quantity.Current),
                Comparator = Bool(C.Comparator),
                OpenDrain = Bool(C.OpenDrain),
            },
        };
        var quantity = Integer(C.Quantity);
        if (quantity < 0)
            Error(C.Quantity, "The quantity on hand may not be negative.");

        // The JSON rules, for what the cells could be read into; a cell that did not read is reported once.
        foreach (var (field, messages) in PartRules.Validate(input))
        {
            var column = C.ForField(field);
            if (!_badColumns.Contains(column))
                foreach (var message in messages)
                    Error(column, message);
        }
        return errors.Count == before ? new CsvPartRow(line, input, quantity) : null;
    }

    private string? Text(string column) =>
        cells.TryGetValue(column, out var text) && text.Trim().Length > 0 ? text : null;

    private void Error(string column, string message)
    {
        _badColumns.Add(column);
        errors.Add(new CsvLineError(line, column, cells.GetValueOrDefault(column, ""), message));
    }

    private double? Value(string column, Quantity quantity)
    {
        if (Text(column) is not { } text)
            return null;
        try
        {
            return EngineeringValue.Parse(text, quantity);
        }
        catch (FormatException e)
        {
            Error(column, e.Message);
            return null;
        }
    }

    private Tolerance? ReadTolerance(double? capacitanceF, PartKind kind)
    {
        if (Text(C.Tolerance) is not { } text)
            return null;
        try
        {
            var tolerance = ToleranceCode.Parse(text, capacitanceF);
            if (tolerance.IsAbsolute && kind != PartKind.Capacitor)
            {
                Error(C.Tolerance, "Only a capacitor's tolerance may be absolute (±pF).");
                return null;
            }
            return tolerance;
        }
        catch (FormatException e)
        {
            Error(C.Tolerance, e.Message);
            return null;
        }
    }

    private double? Number(string column)
    {
        if (Text(column) is not { } text)
            return null;
        if (double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out var value) && double.IsFinite(value))
            return value;
        Error(column, "Expected a plain number, e.g. 100 or -200.");
        return null;
    }

    private double? SlewRate(string column)
    {
        if (Text(column) is not { } text)
            return null;
        if (CsvCells.TryReadSlewRate(text.Trim(), out var value))
            return value;
        Error(column, "Expected the slew rate in V/µs as a plain number, e.g. 0.5 or 20.");
        return null;
    }

    private decimal? Decimal(string column)
    {
        if (Text(column) is not { } text)
            return null;
        if (decimal.TryParse(text, NumberStyles.AllowDecimalPoint | NumberStyles.AllowLeadingSign | NumberStyles.AllowLeadingWhite | NumberStyles.AllowTrailingWhite, CultureInfo.InvariantCulture, out var value))
            return value;
        Error(column, "Expected an amount with a decimal point, e.g. 0.012 (no currency sign, no thousands separator).");
        return null;
    }

    private int? Integer(string column)
    {
        if (Text(column) is not { } text)
            return null;
        if (int.TryParse(text, NumberStyles.AllowLeadingSign | NumberStyles.AllowLeadingWhite | NumberStyles.AllowTrailingWhite,
                CultureInfo.InvariantCulture, out var value))
            return value;
        Error(column, "Expected a whole number.");
        return null;
    }

    private bool? Bool(string column)
    {
        if (Text(column) is not { } text)
            return null;
        if (CsvCells.TryReadBool(text, out var value))
            return value;
        Error(column, "Expected yes or no.");
        return null;
    }
}
