namespace PartsOpt.Topologies;

/// <summary>How serious a failed check is.</summary>
public enum CheckSeverity
{
    /// <summary>The circuit does not work as designed, or a part is outside its rating.</summary>
    Failure,

    /// <summary>The circuit works, but a habit of good practice is broken (e.g. a class-2 ceramic for timing).</summary>
    Warning,
}

/// <summary>
/// One check of the design against a limit.
/// </summary>
/// <param name="Name">Short stable name, e.g. "oscillator can switch".</param>
/// <param name="Passed">True when the design meets the limit.</param>
/// <param name="Margin">Distance to the limit, positive inside it, in <paramref name="MarginUnit"/>; always finite.</param>
/// <param name="MarginUnit">"V", "s", or "1" for a fraction of the limit.</param>
/// <param name="Reason">What was checked and what came out, in plain words.</param>
/// <param name="Severity">How serious a failure of this check is.</param>
public sealed record CircuitCheck(
    string Name,
    bool Passed,
    double Margin,
    string MarginUnit,
    string Reason,
    CheckSeverity Severity = CheckSeverity.Failure);

/// <summary>A figure of the evaluated design; <see cref="Value"/> is null where the figure does not exist.</summary>
/// <param name="Name">Figure name (see <see cref="FigureNames"/>).</param>
/// <param name="Value">Value in <paramref name="Unit"/>; null when the circuit cannot produce it.</param>
/// <param name="Unit">SI unit, "1" for a fraction, "%" for a percentage.</param>
public sealed record FigureValue(string Name, double? Value, string Unit);

/// <summary>One point of the duty-versus-setting curve.</summary>
/// <param name="Setting">0 … 1 across the potentiometer (0 at the <c>cmp.rb</c> end) or the control range.</param>
/// <param name="ThresholdV">The comparator threshold at this setting, absolute, V.</param>
/// <param name="Duty">The duty cycle, fraction; null when the circuit does not oscillate.</param>
public sealed record DutyPoint(double Setting, double ThresholdV, double? Duty);

/// <summary>An op-amp section and where it sits.</summary>
/// <param name="Function">"oscillator", "integrator", "schmitt", "comparator" or "reference buffer".</param>
/// <param name="Designator">Package and section, e.g. "U1A".</param>
/// <param name="PartNumber">The part, if known.</param>
public sealed record SectionAssignment(string Function, string Designator, string? PartNumber);

/// <summary>Everything the closed-form analysis says about one design.</summary>
/// <param name="Topology">The topology analysed.</param>
/// <param name="Figures">The figures, in <see cref="FigureNames.All"/> order.</param>
/// <param name="IntegratorDcGain">DC gain −Rf/Ri of the three-stage integrator; null for other topologies.</param>
/// <param name="IntegratorCornerHz">Corner 1/(2π·Rf·Ci) of the three-stage integrator, Hz; null otherwise.</param>
/// <param name="ReferenceV">The voltage the stages return to: 0 V with a split supply, the mid-rail divider otherwise.</param>
/// <param name="DutyCurve">Duty versus setting, evenly spaced from 0 to 1.</param>
/// <param name="Designators">Reference designator of each role (R1…, C1…, RV1…).</param>
/// <param name="Sections">The op-amp sections and their designators (U1A…).</param>
/// <param name="Notes">Assumptions and remarks that qualify the figures.</param>
/// <param name="Checks">Every check made.</param>
public sealed record CircuitEvaluation(
    TopologyKind Topology,
    IReadOnlyList<FigureValue> Figures,
    double? IntegratorDcGain,
    double? IntegratorCornerHz,
    double ReferenceV,
    IReadOnlyList<DutyPoint> DutyCurve,
    IReadOnlyDictionary<string, string> Designators,
    IReadOnlyList<SectionAssignment> Sections,
    IReadOnlyList<string> Notes,
    IReadOnlyList<CircuitCheck> Checks)
{
    /// <summary>True when no check of severity <see cref="CheckSeverity.Failure"/> failed.</summary>
    public bool Works => Checks.All(c => c.Passed || c.Severity != CheckSeverity.Failure);

    /// <summary>The value of a figure by name; null when it does not exist for this design.</summary>
    /// <exception cref="ArgumentException">No figure has that name (see <see cref="FigureNames"/>).</exception>
    public double? Figure(string name) =>
        (Figures.FirstOrDefault(f => f.Name == name) ?? throw new ArgumentException($"Unknown figure '{name}'.", nameof(name))).Value;
}
