using Microsoft.EntityFrameworkCore;
using PartsOpt.Analysis;
using PartsOpt.Api.Common;
using PartsOpt.Api.Parts;
using PartsOpt.Api.Persistence;
using PartsOpt.Topologies;
using PartsOpt.Values;

namespace PartsOpt.Api.Circuits;

/// <summary>
/// Turns an evaluate request into the library's <see cref="CircuitDesign"/> and an analysis plan, looking
/// stocked parts up by number. Every problem is collected by field name, so one answer lists them all.
/// </summary>
internal static class CircuitRequestBinder
{
    public const int MinSamples = 100, MaxSamples = 100_000, DefaultSamples = 2_000;
    public const int MaxWaveformPoints = 5_000, DefaultWaveformPoints = 400;

    private static readonly string[] AllMethods = ["worstCase", "rootSumSquare", "monteCarlo"];

    public static async Task<(CircuitDesign? Design, AnalysisPlan Plan)> BindAsync(
        EvaluateCircuitRequest request, PartsOptDbContext db, ErrorList errors, CancellationToken ct)
    {
        var plan = BindPlan(request.Analysis, errors);

        TopologyKind topology = default;
        if (string.IsNullOrWhiteSpace(request.Topology))
            errors.Add("topology", "Required: three-stage, loop or rc-ramp.");
        else if (!TopologyNames.TryParse(request.Topology, out topology))
            errors.Add("topology", $"'{request.Topology}' is not a topology; use three-stage, loop or rc-ramp.");

        var supply = BindSupply(request.Supply, errors);
        var amplifier = await BindOpAmpAsync(request.OpAmp, "opAmp", required: true, db, errors, ct);
        var comparator = await BindOpAmpAsync(request.Comparator, "comparator", required: false, db, errors, ct);
        var duty = BindDuty(request.Duty, errors);
        var roles = await BindRolesAsync(request.Roles, db, errors, ct);

        if (errors.Count > 0 || supply is null || amplifier is null || duty is null || roles is null)
            return (null, plan);
        var design = new CircuitDesign(topology, supply, amplifier, roles, duty, comparator, request.BufferReference ?? false);
        return (design, plan);
    }

    private static Supply? BindSupply(SupplyInput? input, ErrorList errors)
    {
        if (input is null)
        {
            errors.Add("supply", "Required: {positive, negative} in volts (negative 0 for a single supply).");
            return null;
        }

        var ok = errors.Finite("supply.positive", input.Positive, required: true)
            & errors.Finite("supply.negative", input.Negative, required: true);
        return ok ? new Supply(input.Positive!.Value, input.Negative!.Value) : null;
    }

    private static DutyControl? BindDuty(DutyInput? input, ErrorList errors)
    {
        var adjust = input?.Adjust ?? "potentiometer";
        if (adjust == "potentiometer")
            return DutyControl.Potentiometer;
        if (adjust != "controlVoltage")
        {
            errors.Add("duty.adjust", $"'{adjust}' is not a way to set the duty; use potentiometer or controlVoltage.");
            return null;
        }

        var range = input!.ControlRange;
        if (range is null)
        {
            errors.Add("duty.controlRange", "Required with controlVoltage: {min, max} in volts.");
            return null;
        }

        var ok = errors.Finite("duty.controlRange.min", range.Min, required: true)
            & errors.Finite("duty.controlRange.max", range.Max, required: true);
        return ok ? DutyControl.ControlVoltage(range.Min!.Value, range.Max!.Value) : null;
    }

    private static async Task<OpAmpSpec?> BindOpAmpAsync(OpAmpInput? input, string field, bool required,
        PartsOptDbContext db, ErrorList errors, CancellationToken ct)
    {
        if (input is null)
        {
            if (required)
                errors.Add(field, "Required: a stocked partNumber, or the op-amp's limits.");
            return null;
        }

        if ((input.PartNumber is null) == (input.Limits is null))
        {
            errors.Add(field, "Give a stocked partNumber or the limits, one of the two.");
            return null;
        }

        if (input.Limits is { } limits)
        {
            // The same rules and the same row-to-spec mapping as a stocked op-amp.
            var before = errors.Count;
            PartRules.ValidateOpAmp(errors, limits, $"{field}.limits");
            if (errors.Count > before)
                return null;
            var row = new Part { PartNumber = "(given)" };
            new PartInput { Kind = PartKinds.Name(PartKind.OpAmp), OpAmp = limits }.ApplyTo(row);
            return PartEngineering.ToOpAmpSpec(row) with { PartNumber = null };
        }

        var partNumber = input.PartNumber!;
        var part = await db.Parts.AsNoTracking().SingleOrDefaultAsync(p => p.PartNumber == partNumber, ct);
        if (part is null)
            errors.Add($"{field}.partNumber", $"There is no part '{partNumber}' in stock.");
        else if (part.Kind != PartKind.OpAmp)
            errors.Add($"{field}.partNumber", $"Part '{partNumber}' is a {PartKinds.Name(part.Kind)}, not an op-amp.");
        else
            return PartEngineering.ToOpAmpSpec(part);
        return null;
    }

    private static async Task<Dictionary<string, RolePart>?> BindRolesAsync(Dictionary<string, RoleInput>? input,
        PartsOptDbContext db, ErrorList errors, CancellationToken ct)
    {
        if (input is null || input.Count == 0)
        {
            errors.Add("roles", "Required: a part for each role of the topology (osc.r, osc.c, …).");
            return null;
        }

        var roles = new Dictionary<string, RolePart>(StringComparer.Ordinal);
        foreach (var (role, part) in input)
        {
            var field = $"roles.{role}";
            if (!Roles.All.Contains(role))
            {
                errors.Add(field, $"Unknown role '{role}'. Roles: {string.Join(", ", Roles.All)}.");
                continue;
            }

            if (part is null)
            {
                errors.Add(field, "Required: a partNumber or a value.");
                continue;
            }

            if (await BindRoleAsync(role, field, part, db, errors, ct) is { } bound)
                roles[role] = bound;
        }

        return roles;
    }

    private static async Task<RolePart?> BindRoleAsync(string role, string field, RoleInput input,
        PartsOptDbContext db, ErrorList errors, CancellationToken ct)
    {
        var kind = PartEngineering.KindFor(role);
        if (input.PartNumber is { } partNumber)
        {
            var part = await db.Parts.AsNoTracking().SingleOrDefaultAsync(p => p.PartNumber == partNumber, ct);
            if (part is null)
                errors.Add($"{field}.partNumber", $"There is no part '{partNumber}' in stock.");
            else if (part.Kind != kind)
                errors.Add($"{field}.partNumber",
                    $"Role {role} takes a {PartKinds.Name(kind)}; part '{partNumber}' is a {PartKinds.Name(part.Kind)}.");
            else
                return PartEngineering.ToRolePart(part);
            return null;
        }

        var quantity = kind == PartKind.Capacitor ? Quantity.Capacitance : Quantity.Resistance;
        double? value = null;
        if (input.Value is not { } written)
            errors.Add($"{field}.value", "Required: a partNumber, or a value (number in SI units or text such as \"4k7\").");
        else if (written.Read(quantity) is not { } read)
            errors.Add($"{field}.value", $"'{written}' does not read as a {quantity.ToString().ToLowerInvariant()} value.");
        else if (read <= 0)
            errors.Add($"{field}.value", "Must be greater than zero.");
        else
            value = read;

        var tolerance = BindTolerance(field, input, value, quantity, errors);
        var dielectric = Dielectric.C0G;
        if (kind == PartKind.Capacitor && input.Dielectric is { } text && !PartKinds.TryParseDielectric(text, out dielectric))
            errors.Add($"{field}.dielectric", $"'{text}' is not a dielectric; use {PartKinds.DielectricExpected}.");
        errors.Finite($"{field}.tempcoPpmPerK", input.TempcoPpmPerK);
        errors.Positive($"{field}.powerRatingW", input.PowerRatingW, required: false);
        errors.Positive($"{field}.voltageRatingV", input.VoltageRatingV, required: false);
        if (value is not { } v || tolerance is not { } t)
            return null;

        if (kind == PartKind.Capacitor)
        {
            var temperature = dielectric == Dielectric.Film && input.TempcoPpmPerK is { } ppm
                ? DielectricCharacteristics.For(dielectric, ppm)
                : DielectricCharacteristics.For(dielectric);
            return new RolePart(v, t.Minus, t.Plus, temperature, null, null, input.VoltageRatingV, dielectric,
                DielectricCharacteristics.IsPolarised(dielectric));
        }

        return new RolePart(v, t.Minus, t.Plus,
            TemperatureBehaviour.Linear(input.TempcoPpmPerK ?? PartEngineering.DefaultResistorPpmPerK), null,
            input.PowerRatingW);
    }

    private static Tolerance? BindTolerance(string field, RoleInput input, double? value, Quantity quantity, ErrorList errors)
    {
        if (input.Tolerance is not null && input.ToleranceCode is not null)
        {
            errors.Add($"{field}.tolerance", "Give tolerance or toleranceCode, not both.");
            return null;
        }

        if (input.ToleranceCode is { } code)
        {
            var capacitance = quantity == Quantity.Capacitance ? value : null;
            if (!ToleranceCode.TryParse(code, out var parsed, capacitance))
            {
                errors.Add($"{field}.toleranceCode", $"'{code}' is not a tolerance; use a letter (F, J, K…) or e.g. \"5%\".");
                return null;
            }

            return parsed.IsAbsolute && value is { } v ? parsed.RelativeTo(v) : parsed;
        }

        if (!errors.Finite($"{field}.tolerance", input.Tolerance, required: true))
            return null;
        var fraction = input.Tolerance!.Value;
        if (fraction is < 0 or >= 1)
        {
            errors.Add($"{field}.tolerance", "A fraction from 0 up to (not including) 1: 0.01 for 1 %.");
            return null;
        }

        return Tolerance.Symmetric(fraction);
    }

    private static AnalysisPlan BindPlan(AnalysisInput? input, ErrorList errors)
    {
        input ??= new AnalysisInput();
        var methods = input.Methods ?? AllMethods;
        foreach (var method in methods.Where(m => !AllMethods.Contains(m)))
            errors.Add("analysis.methods", $"'{method}' is not a tolerance method; use {string.Join(", ", AllMethods)}.");

        var samples = input.Samples ?? DefaultSamples;
        if (samples is < MinSamples or > MaxSamples)
            errors.Add("analysis.samples", $"From {MinSamples} to {MaxSamples} samples.");

        var distribution = SpreadDistribution.Uniform;
        if (input.Distribution is { } d && !Enum.TryParse(d, ignoreCase: true, out distribution))
            errors.Add("analysis.distribution", $"'{d}' is not a distribution; use uniform or normal.");

        var headroomSpread = input.HeadroomSpread ?? 0;
        if (!double.IsFinite(headroomSpread) || headroomSpread is < 0 or >= 1)
            errors.Add("analysis.headroomSpread", "A fraction from 0 up to (not including) 1: 0.2 for ±20 %.");

        PartsOpt.Analysis.TemperatureRange? temperature = null;
        if (input.Temperature is { } t
            && errors.Finite("analysis.temperature.min", t.Min, required: true)
            & errors.Finite("analysis.temperature.max", t.Max, required: true))
        {
            if (t.Min > t.Max || t.Min < -273.15 || t.Max > 500)
                errors.Add("analysis.temperature", "Need −273.15 ≤ min ≤ max ≤ 500 °C.");
            else
                temperature = new PartsOpt.Analysis.TemperatureRange(t.Min!.Value, t.Max!.Value);
        }

        var bands = new List<FigureBand>();
        foreach (var (band, i) in (input.Bands ?? []).Select((b, i) => (b, i)))
        {
            var field = $"analysis.bands[{i}]";
            if (band?.Figure is not { } figure || !FigureNames.All.Contains(figure))
            {
                errors.Add($"{field}.figure", $"Name a figure: {string.Join(", ", FigureNames.All)}.");
                continue;
            }

            errors.Finite($"{field}.min", band.Min);
            errors.Finite($"{field}.max", band.Max);
            if (band.Min is null && band.Max is null)
                errors.Add(field, "Give min, max or both.");
            else if (band.Min > band.Max)
                errors.Add(field, "min is above max.");
            bands.Add(new FigureBand(figure, band.Min, band.Max));
        }

        var points = input.WaveformPoints ?? DefaultWaveformPoints;
        if (points != 0 && points is < 10 or > MaxWaveformPoints)
            errors.Add("analysis.waveformPoints", $"0 (no simulation) or from 10 to {MaxWaveformPoints}.");
        var setting = input.SimulationSetting ?? 0.5;
        if (!double.IsFinite(setting) || setting is < 0 or > 1)
            errors.Add("analysis.simulationSetting", "A setting from 0 to 1.");
        var curvePoints = input.DutyCurvePoints ?? 21;
        if (curvePoints is < 2 or > 201)
            errors.Add("analysis.dutyCurvePoints", "From 2 to 201 points.");

        return new AnalysisPlan(
            methods.Contains("worstCase"), methods.Contains("rootSumSquare"), methods.Contains("monteCarlo"),
            samples, input.Seed ?? 1, distribution, headroomSpread, temperature, bands, points, setting, curvePoints);
    }
}

/// <summary>What the evaluate endpoint runs, after validation.</summary>
internal sealed record AnalysisPlan(
    bool WorstCase,
    bool RootSumSquare,
    bool MonteCarlo,
    int Samples,
    int Seed,
    SpreadDistribution Distribution,
    double HeadroomSpread,
    PartsOpt.Analysis.TemperatureRange? Temperature,
    IReadOnlyList<FigureBand> Bands,
    int WaveformPoints,
    double SimulationSetting,
    int DutyCurvePoints);
