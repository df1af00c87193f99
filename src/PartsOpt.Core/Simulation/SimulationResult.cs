namespace PartsOpt.Simulation;

/// <summary>How a simulation run ended.</summary>
public enum SimulationOutcome
{
    /// <summary>The circuit oscillated, settled and was measured over the requested periods.</summary>
    Measured,

    /// <summary>The oscillator stopped switching (or never started): no figures.</summary>
    DoesNotOscillate,

    /// <summary>The step or event cap was reached before the measurement finished: no figures.</summary>
    WorkLimitReached,
}

/// <summary>One waveform: sample times (s) and values (V), in time order, of equal length.</summary>
/// <param name="Name">What the trace is ("oscillator", "capacitor", "integrator", "comparator").</param>
/// <param name="Time">Sample times (s), non-decreasing; an instantaneous edge shows as two samples at one time.</param>
/// <param name="Value">Sample values (V).</param>
public sealed record Waveform(string Name, IReadOnlyList<double> Time, IReadOnlyList<double> Value);

/// <summary>
/// Figures measured on the settled waveforms, averaged over the measured periods. Names follow the
/// project's stable figure names. Times are taken where an output crosses the middle of its two limits.
/// </summary>
/// <param name="Frequency">Oscillator frequency (Hz): measured periods over the time between the first
/// and last rising edges of the oscillator (or Schmitt) output.</param>
/// <param name="HighTime">Average time the oscillator output spends above the middle of its limits (s).</param>
/// <param name="LowTime">Average time it spends below (s).</param>
/// <param name="TrianglePeakToPeak">Peak-to-peak of the comparator's ramp input, the integrator output
/// (three-stage, loop) or the oscillator capacitor (rc-ramp), averaged per period (V).</param>
/// <param name="TriangleCentre">Midpoint between the ramp's peaks, averaged per period (V).</param>
/// <param name="DutyCycle">Fraction of the measured time the comparator output is above the middle of its limits.</param>
/// <param name="OutputHigh">Highest comparator output seen while measuring (V).</param>
/// <param name="OutputLow">Lowest comparator output seen while measuring (V); equal to
/// <see cref="OutputHigh"/> when the comparator does not switch.</param>
/// <param name="EdgeTime">Average 10–90 % transition time of the comparator output over its rising and
/// falling edges (s); NaN when it does not switch.</param>
/// <param name="MeasuredPeriods">How many oscillator periods were measured.</param>
public sealed record SteadyStateFigures(
    double Frequency,
    double HighTime,
    double LowTime,
    double TrianglePeakToPeak,
    double TriangleCentre,
    double DutyCycle,
    double OutputHigh,
    double OutputLow,
    double EdgeTime,
    int MeasuredPeriods);

/// <summary>What <see cref="TransientSimulator.Run"/> returns: how it ended, the waveforms, the figures.</summary>
/// <param name="Outcome">How the run ended.</param>
/// <param name="Reason">Why a run ended without figures; null when measured.</param>
/// <param name="Figures">Measured figures; null unless <see cref="Outcome"/> is <see cref="SimulationOutcome.Measured"/>.</param>
/// <param name="Oscillator">Oscillator (or loop Schmitt trigger) output.</param>
/// <param name="Capacitor">Oscillator capacitor voltage; null for the loop.</param>
/// <param name="IntegratorOutput">Integrator output (the triangle); null for rc-ramp.</param>
/// <param name="ComparatorOutput">Comparator output (the PWM).</param>
/// <param name="SimulatedTime">Time simulated (s).</param>
/// <param name="Steps">Integration steps taken.</param>
/// <param name="Events">Switching events handled.</param>
public sealed record SimulationResult(
    SimulationOutcome Outcome,
    string? Reason,
    SteadyStateFigures? Figures,
    Waveform Oscillator,
    Waveform? Capacitor,
    Waveform? IntegratorOutput,
    Waveform ComparatorOutput,
    double SimulatedTime,
    int Steps,
    int Events)
{
    /// <summary>True when the oscillator was seen to switch repeatedly (two or more rising edges), even if
    /// the work cap stopped the run before it was measured.</summary>
    public bool Oscillates { get; init; }
}
