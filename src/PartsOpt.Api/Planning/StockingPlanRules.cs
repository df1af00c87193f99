using PartsOpt.Api.Common;
using PartsOpt.Api.DesignSearches;
using PartsOpt.Api.Parts;
using PartsOpt.Planning;
using PartsOpt.Search;
using PartsOpt.Topologies;
using PartsOpt.Values;

namespace PartsOpt.Api.Planning;

/// <summary>Which stocking-plan requests mean something, field by field, and the library's question they become.</summary>
public static class StockingPlanRules
{
    public const int MaxRequirements = 50;
    public const int MaxNameLength = 100;
    public const int MaxUnitsPerYear = 100_000_000;
    public const int MaxCandidateLines = 400;
    public const int DefaultPoolSize = 40;
    public const int MaxPoolSize = 320;
    public const double DefaultSearchSeconds = 10;
    public const double MaxSearchSeconds = 60;
    public const double DefaultPlanSeconds = 120;
    public const double MaxPlanSeconds = 600;
    public const double DefaultResistorTolerance = 0.01;
    public const double DefaultCapacitorTolerance = 0.05;
    public const double DefaultCapacitorVoltage = 50;

    public static Dictionary<string, string[]> Validate(StockingPlanInput input)
    {
        var errors = new ErrorList();
        if (input.Requirements is not { Count: > 0 } requirements)
            errors.Add("requirements", "Plan for at least one requirement: [{name, requirement, unitsPerYear}].");
        else if (requirements.Count > MaxRequirements)
            errors.Add("requirements", $"At most {MaxRequirements} requirements.");
        else
        {
            var names = new HashSet<string>(StringComparer.Ordinal);
            for (var i = 0; i < requirements.Count; i++)
            {
                var field = $"requirements[{i}]";
                if (requirements[i] is not { } item)
                {
                    errors.Add(field, "Required: {name, requirement, unitsPerYear}.");
                    continue;
                }
                if (string.IsNullOrWhiteSpace(item.Name))
                    errors.Add($"{field}.name", "Required: a name for the product.");
                else if (item.Name.Length > MaxNameLength)
                    errors.Add($"{field}.name", $"At most {MaxNameLength} characters.");
                else if (!names.Add(item.Name))
                    errors.Add($"{field}.name", $"'{item.Name}' names two requirements.");
                if (item.UnitsPerYear is null)
                    errors.Add($"{field}.unitsPerYear", "Required: boards built a year.");
                else if (item.UnitsPerYear is < 1 or > MaxUnitsPerYear)
                    errors.Add($"{field}.unitsPerYear", $"Between 1 and {MaxUnitsPerYear}.");
                if (item.Requirement is null)
                    errors.Add($"{field}.requirement", "Required: the same body as POST /api/v1/design-searches.");
                else
                    foreach (var (key, messages) in DesignSearchRules.Validate(item.Requirement))
                        foreach (var message in messages)
                            errors.Add($"{field}.requirement.{key}", message);
            }
        }

        if (input.Candidates is not { } candidates)
            errors.Add("candidates", "Required: the lines that could be added and the holding cost of a line.");
        else
            Candidates(errors, candidates);

        if (input.PoolSize is < 1 or > MaxPoolSize)
            errors.Add("poolSize", $"Between 1 and {MaxPoolSize}.");
        if (errors.Finite("searchTimeLimitSeconds", input.SearchTimeLimitSeconds) && input.SearchTimeLimitSeconds is <= 0 or > MaxSearchSeconds)
            errors.Add("searchTimeLimitSeconds", $"Above 0 and at most {MaxSearchSeconds} seconds.");
        if (errors.Finite("timeLimitSeconds", input.TimeLimitSeconds) && input.TimeLimitSeconds is <= 0 or > MaxPlanSeconds)
            errors.Add("timeLimitSeconds", $"Above 0 and at most {MaxPlanSeconds} seconds.");
        return errors.ToDictionary();
    }

    private static void Candidates(ErrorList errors, CandidatesInput c)
    {
        const string prefix = "candidates";
        var lines = 0;
        lines += SeriesRangeRules.Count(errors, $"{prefix}.resistor", $"{prefix}.resistorSeries", c.ResistorSeries, c.ResistorRange, c.ResistorTolerance, c.ResistorUnitCost, MaxCandidateLines);
        lines += SeriesRangeRules.Count(errors, $"{prefix}.capacitor", $"{prefix}.capacitorSeries", c.CapacitorSeries, c.CapacitorRange, c.CapacitorTolerance, c.CapacitorUnitCost, MaxCandidateLines);
        if (c.CapacitorDielectric is { } dielectric && !PartKinds.TryParseDielectric(dielectric, out _))
            errors.Add($"{prefix}.capacitorDielectric", $"The dielectric is one of {PartKinds.DielectricExpected}.");
        errors.Positive($"{prefix}.capacitorVoltageRating", c.CapacitorVoltageRating, required: false);
        var partNumbers = new HashSet<string>(StringComparer.OrdinalIgnoreCase);
        for (var i = 0; i < (c.OpAmps?.Count ?? 0); i++)
        {
            var field = $"{prefix}.opAmps[{i}]";
            if (c.OpAmps![i] is not { } opAmp)
            {
                errors.Add(field, "Required: {partNumber, opAmp, unitCost}.");
                continue;
            }
            if (string.IsNullOrWhiteSpace(opAmp.PartNumber))
                errors.Add($"{field}.partNumber", "Required.");
            else if (opAmp.PartNumber.Length > PartRules.PartNumberMaxLength)
                errors.Add($"{field}.partNumber", $"At most {PartRules.PartNumberMaxLength} characters.");
            else if (!partNumbers.Add(opAmp.PartNumber))
                errors.Add($"{field}.partNumber", $"{opAmp.PartNumber} is listed twice.");
            if (opAmp.UnitCost is null)
                errors.Add($"{field}.unitCost", "Required: the price of one package.");
            else if (opAmp.UnitCost < 0)
                errors.Add($"{field}.unitCost", "May not be negative.");
            if (opAmp.OpAmp is null)
                errors.Add($"{field}.opAmp", "Required: the op-amp's limits, as the parts API takes them.");
            else
                PartRules.ValidateOpAmp(errors, opAmp.OpAmp, $"{field}.opAmp");
            lines++;
        }
        if (lines > MaxCandidateLines)
            errors.Add(prefix, $"The ranges give {lines} candidate lines; at most {MaxCandidateLines}: narrow a range or pick a coarser series.");
        if (c.PackageCostPerLine is null)
            errors.Add($"{prefix}.packageCostPerLine", "Required: the cost of holding one stocked line for a year (0 for none).");
        else if (c.PackageCostPerLine < 0)
            errors.Add($"{prefix}.packageCostPerLine", "May not be negative.");
    }

    /// <summary>The library's question for a validated input and today's stock.</summary>
    public static StockingQuestion ToQuestion(StockingPlanInput input, Stock existing)
    {
        var c = input.Candidates!;
        var parts = new List<StockPart>();
        if (c.ResistorSeries is { } resistors)
            parts.AddRange(CandidateCatalogue.FromSeries(new SeriesCandidates(RoleKind.Resistor, PreferredValues.Parse(resistors),
                c.ResistorRange!.Min!.Value, c.ResistorRange.Max!.Value, c.ResistorTolerance ?? DefaultResistorTolerance, c.ResistorUnitCost!.Value), existing));
        if (c.CapacitorSeries is { } capacitors)
            parts.AddRange(CandidateCatalogue.FromSeries(new SeriesCandidates(RoleKind.Capacitor, PreferredValues.Parse(capacitors),
                c.CapacitorRange!.Min!.Value, c.CapacitorRange.Max!.Value, c.CapacitorTolerance ?? DefaultCapacitorTolerance, c.CapacitorUnitCost!.Value)
            {
                Dielectric = PartKinds.TryParseDielectric(c.CapacitorDielectric, out var dielectric) ? dielectric : Dielectric.C0G,
                VoltageRatingV = c.CapacitorVoltageRating ?? DefaultCapacitorVoltage,
            }, existing));
        var opAmps = (c.OpAmps ?? []).Select(o =>
        {
            var part = new Part { PartNumber = o.PartNumber! };
            new PartInput { Kind = PartKinds.Name(PartKind.OpAmp), OpAmp = o.OpAmp }.ApplyTo(part);
            return new StockOpAmp(o.PartNumber!, PartEngineering.ToOpAmpSpec(part), o.UnitCost!.Value, 0);
        }).ToList();
        var requirements = input.Requirements!.Select(r => new YearlyRequirement(r.Name!,
            DesignSearchRules.ToRequirement(DesignSearchRules.Normalise(r.Requirement!)), r.UnitsPerYear!.Value)).ToList();
        return new StockingQuestion(requirements, existing, new Stock(parts, opAmps), c.PackageCostPerLine!.Value, input.KeepExisting ?? true);
    }

    public static StockingOptions ToOptions(StockingPlanInput input) => new(
        PoolSize: input.PoolSize ?? DefaultPoolSize,
        SearchTimeLimit: TimeSpan.FromSeconds(input.SearchTimeLimitSeconds ?? DefaultSearchSeconds));
}
