using System.Text.RegularExpressions;

namespace PartsOpt.Api.Parts;

/// <summary>
/// What a valid part looks like. Errors are keyed by the JSON field path ("resistor.resistanceOhms"), so
/// the JSON endpoints return them as they are and the CSV import maps them to its column names.
/// </summary>
public static partial class PartRules
{
    public const int PartNumberMaxLength = 64;
    public const int ShortTextMaxLength = 64;
    public const int TextMaxLength = 500;

    [GeneratedRegex("^[A-Za-z0-9][A-Za-z0-9._-]*$")]
    private static partial Regex PartNumberPattern();

    [GeneratedRegex("^[A-Z]{3}$")]
    private static partial Regex CurrencyPattern();

    // Literal route segments under /api/v1/parts; a part may not be named like them.
    private static readonly string[] ReservedPartNumbers = ["import", "export"];

    /// <summary>Checks a part number: letters, digits, '.', '_' and '-', starting with a letter or digit.</summary>
    public static string? PartNumberProblem(string? partNumber)
    {
        if (string.IsNullOrWhiteSpace(partNumber))
            return "A part number is required.";
        if (partNumber.Length > PartNumberMaxLength)
            return $"A part number has at most {PartNumberMaxLength} characters.";
        if (!PartNumberPattern().IsMatch(partNumber))
            return "A part number holds letters, digits, '.', '_' and '-' and starts with a letter or digit.";
        if (ReservedPartNumbers.Contains(partNumber, StringComparer.OrdinalIgnoreCase))
            return $"'{partNumber}' is a reserved word, not a part number.";
        return null;
    }

    /// <summary>Validates a whole part input; an empty dictionary means valid.</summary>
    public static Dictionary<string, string[]> Validate(PartInput input)
    {
        var errors = new ErrorList();
        errors.AddIf("partNumber", PartNumberProblem(input.PartNumber));
        errors.Text("description", input.Description, TextMaxLength);
        errors.Text("package", input.Package, ShortTextMaxLength);
        errors.Text("location", input.Location, ShortTextMaxLength);
        errors.Text("notes", input.Notes, TextMaxLength);
        if (input.UnitCost is < 0)
            errors.Add("unitCost", "The unit cost may not be negative.");
        if (input.Currency is not null && !CurrencyPattern().IsMatch(input.Currency))
            errors.Add("currency", "The currency is an ISO 4217 code of three capital letters, e.g. EUR.");
        if (input.ReorderLevel is < 0)
            errors.Add("reorderLevel", "The reorder level may not be negative.");
        if (input.InitialQuantity is < 0)
            errors.Add("initialQuantity", "The initial quantity may not be negative.");

        if (!PartKinds.TryParse(input.Kind, out var kind))
        {
            errors.Add("kind", input.Kind is null
                ? $"The kind is required: one of {PartKinds.Expected}."
                : $"Unknown kind '{input.Kind}': expected one of {PartKinds.Expected}.");
            return errors.ToDictionary();
        }

        CheckOnlyOwnFields(errors, kind, input);
        switch (kind)
        {
            case PartKind.Resistor when input.Resistor is { } r:
                errors.Positive("resistor.resistanceOhms", r.ResistanceOhms, required: true);
                errors.Tolerance("resistor", r.ToleranceMinus, r.TolerancePlus, absolute: false);
                errors.Finite("resistor.tempcoPpmPerK", r.TempcoPpmPerK);
                errors.Positive("resistor.powerRatingW", r.PowerRatingW, required: false);
                break;
            case PartKind.Capacitor when input.Capacitor is { } c:
                errors.Positive("capacitor.capacitanceF", c.CapacitanceF, required: true);
                errors.Tolerance("capacitor", c.ToleranceMinus, c.TolerancePlus, c.ToleranceAbsolute ?? false);
                if (!PartKinds.TryParseDielectric(c.Dielectric, out _))
                    errors.Add("capacitor.dielectric", $"The dielectric is one of {PartKinds.DielectricExpected}.");
                errors.Positive("capacitor.voltageRatingV", c.VoltageRatingV, required: true);
                errors.Required("capacitor.polarised", c.Polarised);
                errors.Finite("capacitor.tempcoPpmPerK", c.TempcoPpmPerK);
                break;
            case PartKind.Potentiometer when input.Potentiometer is { } p:
                errors.Positive("potentiometer.resistanceOhms", p.ResistanceOhms, required: true);
                errors.Tolerance("potentiometer", p.ToleranceMinus, p.TolerancePlus, absolute: false);
                if (!PartKinds.TryParseTaper(p.Taper, out _))
                    errors.Add("potentiometer.taper", "The taper is 'linear' or 'log'.");
                errors.Positive("potentiometer.powerRatingW", p.PowerRatingW, required: false);
                errors.Required("potentiometer.trimmer", p.Trimmer);
                break;
            case PartKind.OpAmp when input.OpAmp is { } o:
                ValidateOpAmp(errors, o, "opAmp");
                break;
            default:
                var field = KindField(kind);
                errors.Add(field, $"A {PartKinds.Name(kind)} needs its \"{field}\" object.");
                break;
        }
        return errors.ToDictionary();
    }

    /// <summary>An op-amp's limits, with messages under <paramref name="prefix"/> (\"opAmp\" in a part).</summary>
    internal static void ValidateOpAmp(ErrorList errors, OpAmpFields o, string prefix)
    {
        if (o.Sections is not (1 or 2 or 4))
            errors.Add($"{prefix}.sections", "Sections per package is 1, 2 or 4.");
        errors.Positive($"{prefix}.supplyMinV", o.SupplyMinV, required: true);
        errors.Positive($"{prefix}.supplyMaxV", o.SupplyMaxV, required: true);
        if (o.SupplyMinV > o.SupplyMaxV)
            errors.Add($"{prefix}.supplyMaxV", "The maximum supply is below the minimum.");
        errors.Positive($"{prefix}.gainBandwidthHz", o.GainBandwidthHz, required: o.Comparator == false);
        errors.Positive($"{prefix}.slewRateVPerS", o.SlewRateVPerS, required: true);
        errors.NonNegative($"{prefix}.outputHeadroomLowV", o.OutputHeadroomLowV, required: true);
        errors.NonNegative($"{prefix}.outputHeadroomHighV", o.OutputHeadroomHighV, required: true);
        errors.Finite($"{prefix}.inputHeadroomLowV", o.InputHeadroomLowV, required: true);
        errors.Finite($"{prefix}.inputHeadroomHighV", o.InputHeadroomHighV, required: true);
        errors.NonNegative($"{prefix}.inputOffsetV", o.InputOffsetV, required: false);
        errors.Positive($"{prefix}.outputCurrentMaxA", o.OutputCurrentMaxA, required: false);
        errors.NonNegative($"{prefix}.quiescentCurrentPerSectionA", o.QuiescentCurrentPerSectionA, required: false);
        errors.Required($"{prefix}.comparator", o.Comparator);
        errors.Required($"{prefix}.openDrain", o.OpenDrain);
    }

    /// <summary>The JSON property holding a kind's fields.</summary>
    public static string KindField(PartKind kind) => kind switch
    {
        PartKind.Resistor => "resistor",
        PartKind.Capacitor => "capacitor",
        PartKind.Potentiometer => "potentiometer",
        _ => "opAmp",
    };

    private static void CheckOnlyOwnFields(ErrorList errors, PartKind kind, PartInput input)
    {
        void Foreign(PartKind other, object? fields)
        {
            if (fields is not null && other != kind)
                errors.Add(KindField(other), $"A {PartKinds.Name(kind)} has no \"{KindField(other)}\" fields.");
        }
        Foreign(PartKind.Resistor, input.Resistor);
        Foreign(PartKind.Capacitor, input.Capacitor);
        Foreign(PartKind.Potentiometer, input.Potentiometer);
        Foreign(PartKind.OpAmp, input.OpAmp);
    }
}
