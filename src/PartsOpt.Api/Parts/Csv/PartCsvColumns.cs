namespace PartsOpt.Api.Parts.Csv;

/// <summary>
/// The columns of our CSV format (docs/csv-format.md), in the order the export writes them. One file holds
/// every kind: <c>kind</c> says which, and columns that do not apply to a kind stay blank.
/// </summary>
public static class PartCsvColumns
{
    public const string PartNumber = "part_number";
    public const string Kind = "kind";
    public const string Description = "description";
    public const string Package = "package";
    public const string Quantity = "quantity";
    public const string UnitCost = "unit_cost";
    public const string Currency = "currency";
    public const string ReorderLevel = "reorder_level";
    public const string Location = "location";
    public const string Notes = "notes";
    public const string Resistance = "resistance";
    public const string Capacitance = "capacitance";
    public const string Tolerance = "tolerance";
    public const string TempcoPpmPerK = "tempco_ppm_per_k";
    public const string PowerRating = "power_rating";
    public const string Dielectric = "dielectric";
    public const string VoltageRating = "voltage_rating";
    public const string Polarised = "polarised";
    public const string Taper = "taper";
    public const string Trimmer = "trimmer";
    public const string Sections = "sections";
    public const string SupplyMin = "supply_min";
    public const string SupplyMax = "supply_max";
    public const string GainBandwidth = "gain_bandwidth";
    public const string SlewRateVPerUs = "slew_rate_v_per_us";
    public const string OutputHeadroomLow = "output_headroom_low";
    public const string OutputHeadroomHigh = "output_headroom_high";
    public const string InputHeadroomLow = "input_headroom_low";
    public const string InputHeadroomHigh = "input_headroom_high";
    public const string InputOffset = "input_offset";
    public const string OutputCurrentMax = "output_current_max";
    public const string QuiescentCurrent = "quiescent_current";
    public const string Comparator = "comparator";
    public const string OpenDrain = "open_drain";

    public static IReadOnlyList<string> All { get; } =
    [
        PartNumber, Kind, Description, Package, Quantity, UnitCost, Currency, ReorderLevel, Location, Notes,
        Resistance, Capacitance, Tolerance, TempcoPpmPerK, PowerRating,
        Dielectric, VoltageRating, Polarised, Taper, Trimmer,
        Sections, SupplyMin, SupplyMax, GainBandwidth, SlewRateVPerUs,
        OutputHeadroomLow, OutputHeadroomHigh, InputHeadroomLow, InputHeadroomHigh,
        InputOffset, OutputCurrentMax, QuiescentCurrent, Comparator, OpenDrain,
    ];

    /// <summary>The columns each kind uses beyond the common ones; any other must be blank.</summary>
    public static IReadOnlySet<string> For(PartKind kind) => kind switch
    {
        PartKind.Resistor => new HashSet<string> { Resistance, Tolerance, TempcoPpmPerK, PowerRating },
        PartKind.Capacitor => new HashSet<string> { Capacitance, Tolerance, TempcoPpmPerK, Dielectric, VoltageRating, Polarised },
        PartKind.Potentiometer => new HashSet<string> { Resistance, Tolerance, PowerRating, Taper, Trimmer },
        _ => new HashSet<string>
        {
            Sections, SupplyMin, SupplyMax, GainBandwidth, SlewRateVPerUs, OutputHeadroomLow, OutputHeadroomHigh,
            InputHeadroomLow, InputHeadroomHigh, InputOffset, OutputCurrentMax, QuiescentCurrent, Comparator, OpenDrain,
        },
    };

    public static IReadOnlySet<string> Common { get; } = new HashSet<string>
    {
        PartNumber, Kind, Description, Package, Quantity, UnitCost, Currency, ReorderLevel, Location, Notes,
    };

    // PartRules names fields by JSON path ("resistor.resistanceOhms"); the import reports them by column.
    private static readonly Dictionary<string, string> ByField = new(StringComparer.Ordinal)
    {
        ["partNumber"] = PartNumber, ["kind"] = Kind, ["description"] = Description, ["package"] = Package,
        ["unitCost"] = UnitCost, ["currency"] = Currency, ["reorderLevel"] = ReorderLevel,
        ["location"] = Location, ["notes"] = Notes, ["initialQuantity"] = Quantity,
        ["resistanceOhms"] = Resistance, ["capacitanceF"] = Capacitance, ["toleranceMinus"] = Tolerance,
        ["tolerancePlus"] = Tolerance, ["toleranceAbsolute"] = Tolerance, ["tempcoPpmPerK"] = TempcoPpmPerK,
        ["powerRatingW"] = PowerRating, ["dielectric"] = Dielectric, ["voltageRatingV"] = VoltageRating,
        ["polarised"] = Polarised, ["taper"] = Taper, ["trimmer"] = Trimmer, ["sections"] = Sections,
        ["supplyMinV"] = SupplyMin, ["supplyMaxV"] = SupplyMax, ["gainBandwidthHz"] = GainBandwidth,
        ["slewRateVPerS"] = SlewRateVPerUs, ["outputHeadroomLowV"] = OutputHeadroomLow,
        ["outputHeadroomHighV"] = OutputHeadroomHigh, ["inputHeadroomLowV"] = InputHeadroomLow,
        ["inputHeadroomHighV"] = InputHeadroomHigh, ["inputOffsetV"] = InputOffset,
        ["outputCurrentMaxA"] = OutputCurrentMax, ["quiescentCurrentPerSectionA"] = QuiescentCurrent,
        ["comparator"] = Comparator, ["openDrain"] = OpenDrain,
    };

    /// <summary>The column a JSON field path is read from ("capacitor.capacitanceF" → "capacitance").</summary>
    public static string ForField(string field)
    {
        var name = field[(field.LastIndexOf('.') + 1)..];
        return ByField.TryGetValue(name, out var column) ? column : Kind;
    }
}
