using System.Globalization;

namespace PartsOpt.Api.Parts;

/// <summary>Between the Parts row and its JSON shape, by hand: a dozen lines per kind need no library.</summary>
public static class PartMapping
{
    /// <summary>Writes a validated input's fields onto a row; clears the other kinds' columns. Never quantity.</summary>
    public static void ApplyTo(this PartInput input, Part part)
    {
        var kind = PartKinds.Parse(input.Kind);
        part.Kind = kind;
        part.Description = input.Description ?? "";
        part.Package = input.Package ?? "";
        part.UnitCost = input.UnitCost ?? 0m;
        part.Currency = input.Currency ?? "EUR";
        part.ReorderLevel = input.ReorderLevel ?? 0;
        part.Location = input.Location ?? "";
        part.Notes = input.Notes ?? "";

        var r = kind == PartKind.Resistor ? input.Resistor : null;
        var c = kind == PartKind.Capacitor ? input.Capacitor : null;
        var p = kind == PartKind.Potentiometer ? input.Potentiometer : null;
        var o = kind == PartKind.OpAmp ? input.OpAmp : null;

        part.ResistanceOhms = r?.ResistanceOhms ?? p?.ResistanceOhms;
        part.PowerRatingW = r?.PowerRatingW ?? p?.PowerRatingW;
        part.ToleranceMinus = r?.ToleranceMinus ?? c?.ToleranceMinus ?? p?.ToleranceMinus;
        part.TolerancePlus = r?.TolerancePlus ?? c?.TolerancePlus ?? p?.TolerancePlus;
        part.ToleranceIsAbsolute = c?.ToleranceAbsolute ?? false;
        part.TempcoPpmPerK = r?.TempcoPpmPerK ?? c?.TempcoPpmPerK;

        part.CapacitanceF = c?.CapacitanceF;
        part.Dielectric = PartKinds.TryParseDielectric(c?.Dielectric, out var dielectric) ? dielectric : null;
        part.VoltageRatingV = c?.VoltageRatingV;
        part.Polarised = c?.Polarised;

        part.Taper = PartKinds.TryParseTaper(p?.Taper, out var taper) ? taper : null;
        part.Trimmer = p?.Trimmer;

        part.Sections = o?.Sections;
        part.SupplyMinV = o?.SupplyMinV;
        part.SupplyMaxV = o?.SupplyMaxV;
        part.GainBandwidthHz = o?.GainBandwidthHz;
        part.SlewRateVPerS = o?.SlewRateVPerS;
        part.OutputHeadroomLowV = o?.OutputHeadroomLowV;
        part.OutputHeadroomHighV = o?.OutputHeadroomHighV;
        part.InputHeadroomLowV = o?.InputHeadroomLowV;
        part.InputHeadroomHighV = o?.InputHeadroomHighV;
        part.InputOffsetV = o?.InputOffsetV;
        part.OutputCurrentMaxA = o?.OutputCurrentMaxA;
        part.QuiescentCurrentPerSectionA = o?.QuiescentCurrentPerSectionA;
        part.Comparator = o?.Comparator;
        part.OpenDrain = o?.OpenDrain;
    }

    /// <summary>The input that would recreate this row (used by the CSV export and by tests).</summary>
    public static PartInput ToInput(this Part part) => new()
    {
        PartNumber = part.PartNumber,
        Kind = PartKinds.Name(part.Kind),
        Description = part.Description,
        Package = part.Package,
        UnitCost = part.UnitCost,
        Currency = part.Currency,
        ReorderLevel = part.ReorderLevel,
        Location = part.Location,
        Notes = part.Notes,
        Resistor = part.Kind != PartKind.Resistor ? null : new ResistorFields
        {
            ResistanceOhms = part.ResistanceOhms,
            ToleranceMinus = part.ToleranceMinus,
            TolerancePlus = part.TolerancePlus,
            TempcoPpmPerK = part.TempcoPpmPerK,
            PowerRatingW = part.PowerRatingW,
        },
        Capacitor = part.Kind != PartKind.Capacitor ? null : new CapacitorFields
        {
            CapacitanceF = part.CapacitanceF,
            ToleranceMinus = part.ToleranceMinus,
            TolerancePlus = part.TolerancePlus,
            ToleranceAbsolute = part.ToleranceIsAbsolute,
            Dielectric = part.Dielectric?.ToString(),
            VoltageRatingV = part.VoltageRatingV,
            Polarised = part.Polarised,
            TempcoPpmPerK = part.TempcoPpmPerK,
        },
        Potentiometer = part.Kind != PartKind.Potentiometer ? null : new PotentiometerFields
        {
            ResistanceOhms = part.ResistanceOhms,
            ToleranceMinus = part.ToleranceMinus,
            TolerancePlus = part.TolerancePlus,
            Taper = part.Taper is { } t ? PartKinds.TaperName(t) : null,
            PowerRatingW = part.PowerRatingW,
            Trimmer = part.Trimmer,
        },
        OpAmp = part.Kind != PartKind.OpAmp ? null : new OpAmpFields
        {
            Sections = part.Sections,
            SupplyMinV = part.SupplyMinV,
            SupplyMaxV = part.SupplyMaxV,
            GainBandwidthHz = part.GainBandwidthHz,
            SlewRateVPerS = part.SlewRateVPerS,
            OutputHeadroomLowV = part.OutputHeadroomLowV,
            OutputHeadroomHighV = part.OutputHeadroomHighV,
            InputHeadroomLowV = part.InputHeadroomLowV,
            InputHeadroomHighV = part.InputHeadroomHighV,
            InputOffsetV = part.InputOffsetV,
            OutputCurrentMaxA = part.OutputCurrentMaxA,
            QuiescentCurrentPerSectionA = part.QuiescentCurrentPerSectionA,
            Comparator = part.Comparator,
            OpenDrain = part.OpenDrain,
        },
    };

    public static PartDto ToDto(this Part part, int onHand, int reserved)
    {
        var input = part.ToInput();
        return new PartDto(
            part.PartNumber, input.Kind!, part.Description, part.Package,
            onHand, reserved, onHand - reserved,
            part.UnitCost, part.Currency, part.ReorderLevel, onHand - reserved < part.ReorderLevel,
            part.Location, part.Notes,
            input.Resistor, input.Capacitor, input.Potentiometer, input.OpAmp);
    }

    /// <summary>The path of a part's resource, for Location headers.</summary>
    public static string PathOf(string partNumber) =>
        string.Create(CultureInfo.InvariantCulture, $"/api/v1/parts/{Uri.EscapeDataString(partNumber)}");
}
