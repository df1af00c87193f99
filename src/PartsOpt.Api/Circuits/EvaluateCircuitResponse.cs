using PartsOpt.Analysis;
using PartsOpt.Simulation;
using PartsOpt.Topologies;

namespace PartsOpt.Api.Circuits;

/// <summary>Everything PartsOpt knows about a design: figures, checks, tolerance, drift and simulation.</summary>
/// <param name="Topology">The topology's wire name.</param>
/// <param name="Works">True when every check of failure severity passes.</param>
/// <param name="Figures">Nominal figures in SI units; null where a figure does not exist (no oscillation).</param>
/// <param name="Integrator">Three-stage only: the lossy integrator's DC gain and corner frequency.</param>
/// <param name="ReferenceV">The voltage every stage returns to: 0 V split supply, the mid-rail divider single supply.</param>
/// <param name="DutyCurve">Duty cycle against the setting (0 = wiper at cmp.rb or the lowest control voltage).</param>
/// <param name="Roles">Each role with its reference designator and the value analysed.</param>
/// <param name="Sections">Which op-amp section does what.</param>
/// <param name="Checks">Each check with its margin (positive = inside the limit) and a plain reason.</param>
/// <param name="Notes">Modelling notes for this design.</param>
/// <param name="Cautions">Safety cautions for the power stage the PWM drives.</param>
/// <param name="Sensitivity">Normalised sensitivities S = (x/y)·∂y/∂x and each part's share of the variance.</param>
/// <param name="WorstCase">Extreme-value analysis over tolerance corners.</param>
/// <param name="RootSumSquare">Root-sum-square band from the sensitivities.</param>
/// <param name="MonteCarlo">Seeded Monte Carlo: statistics of every figure and the yield against the bands.</param>
/// <param name="Temperature">Drift of every figure over the requested temperature range.</param>
/// <param name="Simulation">Time-domain simulation at one setting, with its agreement with the closed forms.</param>
public sealed record EvaluateCircuitResponse(
    string Topology,
    bool Works,
    IReadOnlyList<FigureValue> Figures,
    IntegratorFigures? Integrator,
    double ReferenceV,
    IReadOnlyList<DutyPoint> DutyCurve,
    IReadOnlyList<RoleAnswer> Roles,
    IReadOnlyList<SectionAssignment> Sections,
    IReadOnlyList<CircuitCheck> Checks,
    IReadOnlyList<string> Notes,
    IReadOnlyList<string> Cautions,
    SensitivityAnswer? Sensitivity,
    WorstCaseResult? WorstCase,
    RootSumSquareResult? RootSumSquare,
    MonteCarloResult? MonteCarlo,
    TemperatureDriftResult? Temperature,
    SimulationAnswer? Simulation);

/// <summary>The lossy integrator: DC gain −Rf/Ri and corner 1/(2π·Rf·Ci).</summary>
public sealed record IntegratorFigures(double? DcGain, double? CornerHz);

/// <summary>A role as analysed.</summary>
public sealed record RoleAnswer(string Role, string? Designator, double Value, string Written, double ToleranceMinus,
    double TolerancePlus, string? PartNumber);

/// <summary>Sensitivities by central differences, and the frequency's analytic ones where a closed form exists.</summary>
public sealed record SensitivityAnswer(SensitivityResult Numerical, IReadOnlyDictionary<string, double> AnalyticFrequency);

/// <summary>A time-domain run of the whole circuit.</summary>
/// <param name="Outcome">measured, doesNotOscillate or workLimitReached.</param>
/// <param name="Reason">Why it did not measure, where it did not.</param>
/// <param name="Setting">The setting simulated (0…1).</param>
/// <param name="ThresholdV">The comparator threshold at that setting.</param>
/// <param name="SettlePeriods">Periods run before measuring: ten of the slowest time constant.</param>
/// <param name="Measured">Figures measured on the waveforms after settling.</param>
/// <param name="Agreement">Closed form against simulation, figure by figure.</param>
/// <param name="Waveforms">Every stage output, reduced to the requested number of points.</param>
/// <param name="Method">How the simulation works.</param>
public sealed record SimulationAnswer(
    SimulationOutcome Outcome,
    string? Reason,
    double Setting,
    double ThresholdV,
    int SettlePeriods,
    SteadyStateFigures? Measured,
    IReadOnlyList<FigureAgreement> Agreement,
    IReadOnlyList<PartsOpt.Simulation.Waveform> Waveforms,
    string Method);
