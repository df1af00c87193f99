namespace PartsOpt.Simulation;

/// <summary>
/// How long and how finely <see cref="TransientSimulator"/> runs, and how much work it may do.
/// The defaults suit a quick, accurate check of one design (a few milliseconds of CPU).
/// </summary>
public sealed record SimulationOptions
{
    /// <summary>Oscillator periods left to settle before measuring (default 3). Raise it for an
    /// integrator whose shunt time constant Rf·Ci is long against the period.</summary>
    public int SettlePeriods { get; init; } = 3;

    /// <summary>Oscillator periods measured after settling (default 5); figures are averaged over them.</summary>
    public int MeasurePeriods { get; init; } = 5;

    /// <summary>Largest step as a fraction of the estimated period: the step is at most
    /// estimated period / <see cref="StepsPerPeriod"/> (default 500).</summary>
    public int StepsPerPeriod { get; init; } = 500;

    /// <summary>An explicit largest step (s) that overrides <see cref="StepsPerPeriod"/>; null to derive it.</summary>
    public double? MaxStep { get; init; }

    /// <summary>Most points per returned waveform, endpoints included (default 2000, at least 2).</summary>
    public int OutputPoints { get; init; } = 2000;

    /// <summary>Most integration steps before the run stops with
    /// <see cref="SimulationOutcome.WorkLimitReached"/> (default 1 000 000).</summary>
    public int MaxSteps { get; init; } = 1_000_000;

    /// <summary>Most switching events (output flips, arrivals at a limit) before the run stops with
    /// <see cref="SimulationOutcome.WorkLimitReached"/> (default 100 000).</summary>
    public int MaxEvents { get; init; } = 100_000;

    /// <summary>How many estimated periods the oscillator may go without a rising edge before the run
    /// stops with <see cref="SimulationOutcome.DoesNotOscillate"/> (default 20).</summary>
    public double SilencePeriods { get; init; } = 20;

    /// <summary>Throws <see cref="ArgumentException"/> naming the first option out of range.</summary>
    public void Validate()
    {
        if (SettlePeriods < 0)
            throw new ArgumentException("SettlePeriods must be ≥ 0.", nameof(SettlePeriods));
        if (MeasurePeriods < 1)
            throw new ArgumentException("MeasurePeriods must be ≥ 1.", nameof(MeasurePeriods));
        if (StepsPerPeriod < 10)
            throw new ArgumentException("StepsPerPeriod must be ≥ 10.", nameof(StepsPerPeriod));
        if (MaxStep is { } step && !(step > 0 && double.IsFinite(step)))
            throw new ArgumentException("MaxStep must be a finite positive time.", nameof(MaxStep));
        if (OutputPoints < 2)
            throw new ArgumentException("OutputPoints must be ≥ 2 (the two endpoints).", nameof(OutputPoints));
        if (MaxSteps < 1)
            throw new ArgumentException("MaxSteps must be ≥ 1.", nameof(MaxSteps));
        if (MaxEvents < 1)
            throw new ArgumentException("MaxEvents must be ≥ 1.", nameof(MaxEvents));
        if (!(SilencePeriods > 0) || !double.IsFinite(SilencePeriods))
            throw new ArgumentException("SilencePeriods must be a finite positive number.", nameof(SilencePeriods));
    }
}
