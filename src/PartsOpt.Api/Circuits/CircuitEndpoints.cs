using Microsoft.AspNetCore.Http.HttpResults;
using PartsOpt.Analysis;
using PartsOpt.Api.Common;
using PartsOpt.Api.Keys;
using PartsOpt.Api.Parts;
using PartsOpt.Api.Persistence;
using PartsOpt.Api.Security;
using PartsOpt.Simulation;
using PartsOpt.Topologies;
using PartsOpt.Values;

namespace PartsOpt.Api.Circuits;

/// <summary>/api/v1/circuits: analyse a hand-made design with real op-amp limits and tolerances.</summary>
public static class CircuitEndpoints
{
    private const string SimulationMethod =
        "Exact piecewise solution between switching events: op-amp outputs saturate at the rails minus their headroom and slew at the part's slew rate; the integrator is an ideal op-amp limited by slew and swing; recovery from saturation is immediate.";

    public static IEndpointRouteBuilder MapCircuits(this IEndpointRouteBuilder app)
    {
        var circuits = app.MapGroup("/api/v1/circuits").WithTags("Circuits")
            .RequireAuthorization(Policies.Designer)
            .RequireRateLimiting(RateLimits.Solver);
        circuits.MapPost("/evaluate", Evaluate).WithName("EvaluateCircuit")
            .WithSummary("Analyses a design: figures, checks, sensitivities, worst case, root-sum-square, Monte Carlo, temperature drift and a time-domain simulation.");
        return app;
    }

    private static async Task<Results<Ok<EvaluateCircuitResponse>, ValidationProblem>> Evaluate(
        EvaluateCircuitRequest request, PartsOptDbContext db, CancellationToken ct)
    {
        var errors = new ErrorList();
        var (design, plan) = await CircuitRequestBinder.BindAsync(request, db, errors, ct);
        if (design is null || errors.Count > 0)
            return TypedResults.ValidationProblem(errors.ToDictionary());

        // The library validates what needs the whole design (required roles, supply against the part's range);
        // its field names are translated to the request's spelling.
        try
        {
            design.Validate();
        }
        catch (DesignValidationException invalid)
        {
            return TypedResults.ValidationProblem(new Dictionary<string, string[]>
            {
                [RequestField(invalid.Field)] = [invalid.Message],
            });
        }

        var evaluation = CircuitAnalysis.Analyse(design, plan.DutyCurvePoints);
        return TypedResults.Ok(Answer(design, evaluation, plan));
    }

    private static EvaluateCircuitResponse Answer(CircuitDesign design, CircuitEvaluation evaluation, AnalysisPlan plan)
    {
        IFigureModel model = CircuitFigureModel.For(design).WithDistribution(plan.Distribution);
        if (plan.HeadroomSpread > 0)
            model = model.WithTolerance(IsHeadroom, plan.HeadroomSpread);
        var sensitivity = new SensitivityAnswer(SensitivityAnalysis.Analyse(model), FrequencySensitivity.Analytic(design));
        return new EvaluateCircuitResponse(
            design.Topology.ToWireName(),
            evaluation.Works,
            evaluation.Figures,
            design.Topology == TopologyKind.ThreeStage
                ? new IntegratorFigures(evaluation.IntegratorDcGain, evaluation.IntegratorCornerHz)
                : null,
            evaluation.ReferenceV,
            evaluation.DutyCurve,
            RolesOf(design, evaluation),
            evaluation.Sections,
            evaluation.Checks,
            evaluation.Notes,
            Cautions.PowerStage,
            sensitivity,
            plan.WorstCase ? WorstCase.Analyse(model, plan.Temperature) : null,
            plan.RootSumSquare ? RootSumSquare.Analyse(model) : null,
            plan.MonteCarlo ? MonteCarlo.Analyse(model, plan.Samples, plan.Seed, plan.Bands, plan.Temperature) : null,
            plan.Temperature is { } range ? TemperatureDrift.Analyse(model, range) : null,
            plan.WaveformPoints > 0 ? Simulate(design, evaluation, plan) : null);
    }

    private static bool IsHeadroom(string parameter) => parameter is CircuitFigureModel.AmpHeadroomHigh
        or CircuitFigureModel.AmpHeadroomLow or CircuitFigureModel.CmpHeadroomHigh or CircuitFigureModel.CmpHeadroomLow;

    private static string RequestField(string libraryField) => libraryField switch
    {
        _ when libraryField.StartsWith("amplifier", StringComparison.Ordinal) => "opAmp.limits" + libraryField["amplifier".Length..],
        _ when libraryField.StartsWith("comparator", StringComparison.Ordinal) => "comparator.limits" + libraryField["comparator".Length..],
        "dutyControl" => "duty.controlRange",
        _ => libraryField,
    };

    private static List<RoleAnswer> RolesOf(CircuitDesign design, CircuitEvaluation evaluation) =>
        design.RequiredRoles().Select(role =>
        {
            var part = design.Roles[role];
            var quantity = Roles.KindOf(role) == RoleKind.Capacitor ? Quantity.Capacitance : Quantity.Resistance;
            return new RoleAnswer(role, evaluation.Designators.GetValueOrDefault(role), part.Value,
                EngineeringValue.Format(part.Value, quantity), part.ToleranceMinus, part.TolerancePlus, part.PartNumber);
        }).ToList();

    private static SimulationAnswer Simulate(CircuitDesign design, CircuitEvaluation evaluation, AnalysisPlan plan)
    {
        var threshold = DesignSimulation.ThresholdAt(evaluation, plan.SimulationSetting);
        var settle = DesignSimulation.SettlePeriods(design, evaluation);
        var options = new SimulationOptions
        {
            SettlePeriods = settle,
            MeasurePeriods = 4,
            // The solution between events is exact; the step sets how finely the waveform is sampled, and the
            // measured peaks are read from those samples. Long settling (a large shunt time constant) gets fewer
            // steps per period so a run stays near 600,000 steps.
            StepsPerPeriod = Math.Clamp(600_000 / (settle + 4), 100, 500),
            OutputPoints = plan.WaveformPoints,
        };
        var run = TransientSimulator.Run(DesignSimulation.FromDesign(design, threshold), options);
        var agreement = run.Figures is { } measured
            ? DesignSimulation.Compare(evaluation, plan.SimulationSetting, measured)
            : [];
        var waveforms = new[] { run.Oscillator, run.Capacitor, run.IntegratorOutput, run.ComparatorOutput }
            .OfType<PartsOpt.Simulation.Waveform>().ToList();
        return new SimulationAnswer(run.Outcome, run.Reason, plan.SimulationSetting, threshold, settle, run.Figures,
            agreement, waveforms, SimulationMethod);
    }
}
