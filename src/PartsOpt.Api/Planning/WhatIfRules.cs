using PartsOpt.Api.Parts;
using PartsOpt.Planning;
using PartsOpt.Search;
using PartsOpt.Topologies;
using PartsOpt.Values;

namespace PartsOpt.Api.Planning;

/// <summary>Which what-if requests mean something, and the candidate lines they become.</summary>
public static class WhatIfRules
{
    public const int DefaultMaxResults = 10;
    public const int MaxMaxResults = 100;
    public const int MaxCandidates = 400;
    public const double DefaultSeconds = 60;
    public const double MaxSeconds = 300;

    public static Dictionary<string, string[]> Validate(WhatIfInput input)
    {
        var errors = new ErrorList();
        var count = 0;
        if (input.Series is null && input.Candidates is not { Count: > 0 })
            errors.Add("series", "Give a series of values to try, candidates, or both.");
        if (input.Series is { } s)
        {
            count += SeriesRangeRules.Count(errors, "series.resistor", "series.resistors", s.Resistors, s.ResistorRange, s.ResistorTolerance, s.ResistorUnitCost, MaxCandidates);
            count += SeriesRangeRules.Count(errors, "series.capacitor", "series.capacitors", s.Capacitors, s.CapacitorRange, s.CapacitorTolerance, s.CapacitorUnitCost, MaxCandidates);
            if (s.CapacitorDielectric is { } d && !PartKinds.TryParseDielectric(d, out _))
                errors.Add("series.capacitorDielectric", $"The dielectric is one of {PartKinds.DielectricExpected}.");
            errors.Positive("series.capacitorVoltageRating", s.CapacitorVoltageRating, required: false);
            if (s.Resistors is null && s.Capacitors is null)
                errors.Add("series", "Name a resistor series, a capacitor series, or both.");
        }
        for (var i = 0; i < (input.Candidates?.Count ?? 0); i++)
        {
            var field = $"candidates[{i}]";
            if (input.Candidates![i] is not { } c)
            {
                errors.Add(field, "Required: {kind, value, tolerance, unitCost}.");
                continue;
            }
            var kind = c.Kind switch { "resistor" => RoleKind.Resistor, "capacitor" => RoleKind.Capacitor, _ => (RoleKind?)null };
            if (kind is null)
                errors.Add($"{field}.kind", "\"resistor\" or \"capacitor\".");
            if (c.Value is not { } value)
                errors.Add($"{field}.value", "Required: ohms or farads, a number or text such as \"4k7\".");
            else if (kind is { } k && !(value.Read(QuantityOf(k)) is > 0 and { } v && double.IsFinite(v)))
                errors.Add($"{field}.value", $"'{value}' is not a positive {(k == RoleKind.Capacitor ? "capacitance" : "resistance")}.");
            if (errors.Finite($"{field}.tolerance", c.Tolerance, required: true) && c.Tolerance is < 0 or >= 1)
                errors.Add($"{field}.tolerance", "A fraction from 0 to below 1.");
            if (c.UnitCost is null)
                errors.Add($"{field}.unitCost", "Required: the price of one piece.");
            else if (c.UnitCost < 0)
                errors.Add($"{field}.unitCost", "May not be negative.");
            if (c.Dielectric is { } dielectric && (kind != RoleKind.Capacitor || !PartKinds.TryParseDielectric(dielectric, out _)))
                errors.Add($"{field}.dielectric", kind == RoleKind.Capacitor ? $"The dielectric is one of {PartKinds.DielectricExpected}." : "Only capacitors have a dielectric.");
            errors.Positive($"{field}.voltageRating", c.VoltageRating, required: false);
            if (c.PartNumber is not null)
                errors.AddIf($"{field}.partNumber", PartRules.PartNumberProblem(c.PartNumber));
            count++;
        }
        if (count > MaxCandidates)
            errors.Add("series", $"{count} candidates; at most {MaxCandidates}: narrow a range or pick a coarser series.");
        if (input.MaxResults is < 1 or > MaxMaxResults)
            errors.Add("maxResults", $"Between 1 and {MaxMaxResults}.");
        if (errors.Finite("timeLimitSeconds", input.TimeLimitSeconds) && input.TimeLimitSeconds is <= 0 or > MaxSeconds)
            errors.Add("timeLimitSeconds", $"Above 0 and at most {MaxSeconds} seconds.");
        return errors.ToDictionary();
    }

    /// <summary>The candidate lines of a validated input, part numbers made up where none was given.</summary>
    public static IReadOnlyList<StockPart> ToCandidates(WhatIfInput input)
    {
        var none = new Stock([], []);
        var parts = new List<StockPart>();
        if (input.Series is { } s)
        {
            if (s.Resistors is { } resistors)
                parts.AddRange(CandidateCatalogue.FromSeries(new SeriesCandidates(RoleKind.Resistor, PreferredValues.Parse(resistors),
                    s.ResistorRange!.Min!.Value, s.ResistorRange.Max!.Value, s.ResistorTolerance ?? StockingPlanRules.DefaultResistorTolerance,
                    s.ResistorUnitCost!.Value), none));
            if (s.Capacitors is { } capacitors)
                parts.AddRange(CandidateCatalogue.FromSeries(new SeriesCandidates(RoleKind.Capacitor, PreferredValues.Parse(capacitors),
                    s.CapacitorRange!.Min!.Value, s.CapacitorRange.Max!.Value, s.CapacitorTolerance ?? StockingPlanRules.DefaultCapacitorTolerance,
                    s.CapacitorUnitCost!.Value)
                {
                    Dielectric = PartKinds.TryParseDielectric(s.CapacitorDielectric, out var d) ? d : Dielectric.C0G,
                    VoltageRatingV = s.CapacitorVoltageRating ?? StockingPlanRules.DefaultCapacitorVoltage,
                }, none));
        }
        foreach (var c in input.Candidates ?? [])
        {
            var kind = c.Kind == "capacitor" ? RoleKind.Capacitor : RoleKind.Resistor;
            var value = c.Value!.Value.Read(QuantityOf(kind))!.Value;
            var capacitor = kind == RoleKind.Capacitor;
            var dielectric = PartKinds.TryParseDielectric(c.Dielectric, out var d) ? d : Dielectric.C0G;
            var made = CandidateCatalogue.PartNumberFor(kind, value, c.Tolerance!.Value, capacitor ? dielectric : null);
            parts.Add(new StockPart(c.PartNumber ?? made, kind, value, c.Tolerance!.Value, c.UnitCost!.Value, 0)
            {
                Dielectric = capacitor ? dielectric : null,
                VoltageRatingV = capacitor ? c.VoltageRating ?? StockingPlanRules.DefaultCapacitorVoltage : null,
                TempcoPpmPerK = capacitor ? null : PartEngineering.DefaultResistorPpmPerK,
            });
        }
        // The same part number twice (a value in a series and again by hand): the first stands.
        return parts.DistinctBy(p => p.PartNumber, StringComparer.OrdinalIgnoreCase).ToList();
    }

    private static Quantity QuantityOf(RoleKind kind) => kind == RoleKind.Capacitor ? Quantity.Capacitance : Quantity.Resistance;
}
