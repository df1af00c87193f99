using PartsOpt.Topologies;

namespace PartsOpt.Search;

/// <summary>Which requirement a design missed; decides which roles a no-good cut may range over.</summary>
public enum MissedTarget
{
    /// <summary>Nothing missed: the design is accepted.</summary>
    None,

    /// <summary>The nominal frequency is outside its band (or the circuit does not oscillate).</summary>
    Frequency,

    /// <summary>The triangle (ramp) peak-to-peak is outside its band.</summary>
    TriangleAmplitude,

    /// <summary>The PWM output levels do not reach the required high and low.</summary>
    OutputLevels,

    /// <summary>The adjustment does not reach the duty range at one end or both.</summary>
    DutyRange,

    /// <summary>A failure-severity check of the engine failed.</summary>
    Check,

    /// <summary>The yield check found too many boards outside the bands.</summary>
    Yield,
}

/// <summary>
/// The exact verdict on one design: the engine's nominal figures against the requirement's bands and the
/// engine's failure checks.
/// </summary>
/// <param name="Evaluation">The engine's analysis: figures and checks (the judge leaves notes and designators out).</param>
/// <param name="Missed">The requirements missed, most local first (frequency before duty); empty when accepted.</param>
/// <param name="Reasons">Each miss in a designer's words, in the order of <paramref name="Missed"/>.</param>
/// <param name="FrequencyError">|f − target| / target (infinite when the circuit does not oscillate).</param>
/// <param name="Margin">Smallest slack of a banded figure, relative to its band (negative: outside).</param>
/// <param name="FailedChecks">Names of the failure-severity checks that failed.</param>
/// <param name="Shortfall">How far outside the bands, summed (relative excess per figure, 1 per failed
/// check, 1 for a figure that does not exist): 0 when accepted; ranks near misses.</param>
public sealed record DesignJudgement(
    CircuitEvaluation Evaluation,
    IReadOnlyList<MissedTarget> Missed,
    IReadOnlyList<string> Reasons,
    double FrequencyError,
    double Margin,
    IReadOnlyList<string> FailedChecks,
    double Shortfall)
{
    /// <summary>True when the lowest duty the adjustment reaches is above the required minimum.</summary>
    public bool MissesLowDuty { get; init; }

    /// <summary>True when the highest duty the adjustment reaches is below the required maximum.</summary>
    public bool MissesHighDuty { get; init; }

    /// <summary>True when the design meets every band and passes every failure check.</summary>
    public bool Accepted => Missed.Count == 0;
}
