using PartsOpt.Api.Parts;
using PartsOpt.Search;
using PartsOpt.Topologies;

namespace PartsOpt.Api.DesignSearches;

/// <summary>
/// Which design-search requests mean something, field by field, and the library's requirement they become.
/// </summary>
public static class DesignSearchRules
{
    /// <summary>
    /// Above 1 MHz no op-amp relaxation oscillator of the three topologies switches cleanly: slew-limited
    /// edges of general-purpose parts take a large share of the period (common practice).
    /// </summary>
    public const double MaxFrequencyHz = 1e6;

    public const int DefaultMaxResults = 10;
    public const int MaxMaxResults = 50;
    public const double DefaultTimeLimitSeconds = 10;
    public const double MaxTimeLimitSeconds = 60;
    public const int MaxBuildQuantity = 1_000_000;
    public const int DefaultSamples = 2000;
    public const int MaxSamples = 100_000;
    public const string Potentiometer = "potentiometer";
    public const string ControlVoltage = "controlVoltage";
    public const string WorstCase = "worstCase";
    public const string MonteCarlo = "monteCarlo";

    public static Dictionary<string, string[]> Validate(DesignSearchInput input)
    {
        var errors = new ErrorList();
        double? positive = null, negative = 0;
        if (input.Supply is not { } supply)
            errors.Add("supply", "Required: {positive, negative} in volts (negative 0 for a single supply).");
        else
        {
            errors.Positive("supply.positive", supply.Positive, required: true);
            if (errors.Finite("supply.negative", supply.Negative) && supply.Negative > 0)
                errors.Add("supply.negative", "The negative rail is at or below 0 V (0 for a single supply).");
            positive = supply.Positive is > 0 and { } p && double.IsFinite(p) ? p : null;
            negative = supply.Negative is { } n && double.IsFinite(n) && n <= 0 ? n : supply.Negative is null ? 0 : null;
        }

        if (input.Frequency is null)
            errors.Add("frequency", "Required: {target, tolerance}, hertz and a fraction.");
        else
        {
            Band(errors, "frequency", input.Frequency);
            if (input.Frequency.Target is > MaxFrequencyHz and { } f && double.IsFinite(f))
                errors.Add("frequency.target", $"At most {MaxFrequencyHz:G} Hz: no topology here switches cleanly above that.");
        }
        if (input.TrianglePeakToPeak is { } triangle)
        {
            Band(errors, "trianglePeakToPeak", triangle);
            if (triangle.Target is { } t && positive is { } pos && negative is { } neg && t > pos - neg)
                errors.Add("trianglePeakToPeak.target", $"A ramp cannot swing more than the supply ({pos - neg:G} V).");
        }

        Duty(errors, input.Duty, positive, negative);

        if (input.Output is { } output)
        {
            var high = errors.Finite("output.minHigh", output.MinHigh, required: true);
            var low = errors.Finite("output.maxLow", output.MaxLow, required: true);
            if (high && low && output.MaxLow >= output.MinHigh)
                errors.Add("output.maxLow", "The low level's ceiling must lie below the high level's floor.");
            if (high && positive is { } pos && output.MinHigh > pos)
                errors.Add("output.minHigh", "No output swings above the positive rail.");
            if (low && negative is { } neg && output.MaxLow < neg)
                errors.Add("output.maxLow", "No output swings below the negative rail.");
        }

        if (input.BuildQuantity is null)
            errors.Add("buildQuantity", "Required: the number of boards to build.");
        else if (input.BuildQuantity is < 1 or > MaxBuildQuantity)
            errors.Add("buildQuantity", $"Between 1 and {MaxBuildQuantity}.");

        for (var i = 0; i < (input.Topologies?.Count ?? 0); i++)
            if (!TopologyNames.TryParse(input.Topologies![i], out _))
                errors.Add($"topologies[{i}]", $"Unknown topology '{input.Topologies[i]}': expected one of {string.Join(", ", TopologyNames.All)}.");

        if (input.Yield is { } yield)
        {
            if (errors.Finite("yield.target", yield.Target, required: true) && yield.Target is <= 0 or > 1)
                errors.Add("yield.target", "A fraction above 0 and at most 1 (0.99 for 99 %).");
            if (yield.Method is not (null or WorstCase or MonteCarlo))
                errors.Add("yield.method", $"'{WorstCase}' or '{MonteCarlo}'.");
            if (yield.Samples is < 1 or > MaxSamples)
                errors.Add("yield.samples", $"Between 1 and {MaxSamples}.");
        }
        if (input.Temperature is { } temperature
            && errors.Finite("temperature.min", temperature.Min, required: true)
            & errors.Finite("temperature.max", temperature.Max, required: true))
        {
            if (temperature.Min > temperature.Max)
                errors.Add("temperature.min", "The lowest ambient lies above the highest.");
            if (temperature.Min < -273.15)
                errors.Add("temperature.min", "Below absolute zero.");
        }
        if (input.CostModel is { } costs)
        {
            if (costs.Placement < 0)
                errors.Add("costModel.placement", "May not be negative.");
            if (costs.LineItemSetup < 0)
                errors.Add("costModel.lineItemSetup", "May not be negative.");
        }
        if (input.MaxResults is < 1 or > MaxMaxResults)
            errors.Add("maxResults", $"Between 1 and {MaxMaxResults}.");
        if (errors.Finite("timeLimitSeconds", input.TimeLimitSeconds) && input.TimeLimitSeconds is <= 0 or > MaxTimeLimitSeconds)
            errors.Add("timeLimitSeconds", $"Above 0 and at most {MaxTimeLimitSeconds} seconds.");
        return errors.ToDictionary();
    }

    private static void Band(ErrorList errors, string field, SearchBandInput band)
    {
        errors.Positive($"{field}.target", band.Target, required: true);
        if (errors.Finite($"{field}.tolerance", band.Tolerance, required: true) && band.Tolerance is <= 0 or >= 1)
            errors.Add($"{field}.tolerance", "A fraction above 0 and below 1 (0.05 for ±5 %).");
    }

    private static void Duty(ErrorList errors, SearchDutyInput? duty, double? positive, double? negative)
    {
        if (duty is null)
        {
            errors.Add("duty", "Required: {min, max, adjust}, fractions of the period.");
            return;
        }
        var min = errors.Finite("duty.min", duty.Min, required: true);
        var max = errors.Finite("duty.max", duty.Max, required: true);
        if (min && duty.Min is < 0 or > 1)
            errors.Add("duty.min", "A fraction from 0 to 1.");
        if (max && duty.Max is < 0 or > 1)
            errors.Add("duty.max", "A fraction from 0 to 1.");
        if (min && max && duty.Min > duty.Max)
            errors.Add("duty.min", "The lowest duty lies above the highest.");
        switch (duty.Adjust)
        {
            case null or Potentiometer:
                if (duty.ControlRange is not null)
                    errors.Add("duty.controlRange", $"Only with adjust '{ControlVoltage}'.");
                break;
            case ControlVoltage:
                if (duty.ControlRange is not { } range)
                {
                    errors.Add("duty.controlRange", "Required with a control voltage: {min, max} in volts.");
                    break;
                }
                var low = errors.Finite("duty.controlRange.min", range.Min, required: true);
                var high = errors.Finite("duty.controlRange.max", range.Max, required: true);
                if (low && high && range.Min >= range.Max)
                    errors.Add("duty.controlRange.min", "The range needs min below max.");
                if (low && negative is { } neg && range.Min < neg)
                    errors.Add("duty.controlRange.min", "The control voltage must stay between the rails.");
                if (high && positive is { } pos && range.Max > pos)
                    errors.Add("duty.controlRange.max", "The control voltage must stay between the rails.");
                break;
            default:
                errors.Add("duty.adjust", $"'{Potentiometer}' or '{ControlVoltage}'.");
                break;
        }
    }

    /// <summary>A validated input with every default filled in: what is stored and echoed.</summary>
    public static DesignSearchInput Normalise(DesignSearchInput input) => input with
    {
        Supply = input.Supply! with { Negative = input.Supply!.Negative ?? 0 },
        Duty = input.Duty! with { Adjust = input.Duty!.Adjust ?? Potentiometer },
        Topologies = input.Topologies is { Count: > 0 } chosen ? chosen.Distinct().ToList() : TopologyNames.All,
        Yield = input.Yield is { } y ? y with { Method = y.Method ?? WorstCase, Samples = y.Samples ?? DefaultSamples } : null,
        AllowCombinations = input.AllowCombinations ?? false,
        CostModel = new CostModelInput
        {
            Placement = input.CostModel?.Placement ?? CostModel.Default.PlacementCost,
            LineItemSetup = input.CostModel?.LineItemSetup ?? CostModel.Default.LineItemSetupCost,
        },
        MaxResults = input.MaxResults ?? DefaultMaxResults,
        TimeLimitSeconds = input.TimeLimitSeconds ?? DefaultTimeLimitSeconds,
    };

    /// <summary>The library's requirement for a validated, normalised input.</summary>
    public static SearchRequirement ToRequirement(DesignSearchInput input)
    {
        var duty = input.Duty!;
        var dutyRequirement = duty.Adjust == ControlVoltage
            ? new DutyRequirement(duty.Min!.Value, duty.Max!.Value, DutyAdjust.ControlVoltage,
                duty.ControlRange!.Min!.Value, duty.ControlRange.Max!.Value)
            : new DutyRequirement(duty.Min!.Value, duty.Max!.Value);
        return new SearchRequirement(
            new Supply(input.Supply!.Positive!.Value, input.Supply.Negative!.Value),
            ToBand(input.Frequency!), dutyRequirement, input.BuildQuantity!.Value)
        {
            TrianglePeakToPeak = input.TrianglePeakToPeak is { } t ? ToBand(t) : null,
            Output = input.Output is { } o ? new OutputRequirement(o.MinHigh!.Value, o.MaxLow!.Value) : null,
            Topologies = input.Topologies!.Select(TopologyNames.Parse).ToList(),
            Yield = input.Yield is { } y
                ? new YieldRequirement(y.Target!.Value, y.Method == MonteCarlo ? YieldMethod.MonteCarlo : YieldMethod.WorstCase,
                    y.Samples!.Value)
                : null,
            Temperature = input.Temperature is { } range ? new PartsOpt.Analysis.TemperatureRange(range.Min!.Value, range.Max!.Value) : null,
            AllowCombinations = input.AllowCombinations!.Value,
            Costs = new CostModel(input.CostModel!.Placement!.Value, input.CostModel.LineItemSetup!.Value),
            MaxResults = input.MaxResults!.Value,
        };
    }

    private static Band ToBand(SearchBandInput band) => new(band.Target!.Value, band.Tolerance!.Value);
}
