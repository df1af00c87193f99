namespace PartsOpt.Simulation;

/// <summary>
/// Time-domain simulation of a whole PWM generator with op-amps that saturate and slew: the independent
/// numerical check of the closed-form figures. See docs/simulation.md for the method.
/// </summary>
/// <remarks>
/// Method: the circuit is a hybrid system (<see cref="CircuitDynamics"/>). While its modes hold, every input
/// is a straight line, so the voltages have an exact solution (linear, parabolic, or a first-order lag of a
/// ramp). The run advances by that solution in steps of at most the estimated period over
/// <see cref="SimulationOptions.StepsPerPeriod"/>; after each step every switching function is checked, and
/// when one has crossed zero its crossing time inside the step is found by the Illinois variant of regula
/// falsi on the exact solution (to a billionth of the step), the run advances exactly there, and the
/// switch is made. Nothing is truncated, so there is no stiffness: the step only sets how finely the
/// waveforms are sampled and how narrow a pulse can be before it may be missed.
/// </remarks>
public static class TransientSimulator
{
    private const double RootTolerance = 1e-9; // of the step
    private const int RootIterations = 200;
    private const double RestTolerance = 1e-9; // of the supply span
    private const int RestCheckInterval = 16; // steps

    /// <summary>
    /// Simulates <paramref name="circuit"/> from power-up until it has settled for
    /// <see cref="SimulationOptions.SettlePeriods"/> and been measured for
    /// <see cref="SimulationOptions.MeasurePeriods"/> oscillator periods.
    /// </summary>
    /// <returns>The waveforms (each reduced to <see cref="SimulationOptions.OutputPoints"/>) and, when the
    /// circuit oscillated, the measured figures. A circuit that does not oscillate, or a run that hits the
    /// work cap, is reported through <see cref="SimulationResult.Outcome"/> and
    /// <see cref="SimulationResult.Reason"/>, never by an exception or an endless loop.</returns>
    /// <exception cref="ArgumentException">A value of the circuit or the options is out of range.</exception>
    public static SimulationResult Run(SimulatedCircuit circuit, SimulationOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(circuit);
        options ??= new SimulationOptions();
        circuit.Validate();
        options.Validate();
        var dynamics = new CircuitDynamics(circuit);
        var estimate = EstimatedPeriod(circuit);
        var maxStep = options.MaxStep ?? estimate / options.StepsPerPeriod;
        var restTolerance = RestTolerance * (circuit.SupplyPositive - circuit.SupplyNegative);
        var run = new EventRun(dynamics, maxStep, options);
        var (outcome, reason) = run.Execute(options.SilencePeriods * estimate, restTolerance);

        var trace = run.Trace;
        var figures = outcome == SimulationOutcome.Measured
            ? SteadyStateMeasurement.Measure(trace, dynamics, options.SettlePeriods, options.MeasurePeriods)
            : null;
        var points = options.OutputPoints;
        return new SimulationResult(
            outcome,
            reason,
            figures,
            WaveformReduction.Reduce(circuit.Topology == SimulatedTopology.Loop ? "schmitt" : "oscillator", trace.Time, trace.Osc, points),
            dynamics.HasCapacitor ? WaveformReduction.Reduce("capacitor", trace.Time, trace.Cap, points) : null,
            dynamics.HasIntegrator ? WaveformReduction.Reduce("integrator", trace.Time, trace.Int, points) : null,
            WaveformReduction.Reduce("comparator", trace.Time, trace.Cmp, points),
            run.Time,
            run.Steps,
            run.Events)
        {
            Oscillates = trace.RisingEdges.Count >= 2,
        };
    }

    /// <summary>
    /// A rough period from the ideal closed forms plus the slewing time of the oscillator's edges: it only
    /// sizes the step and the silence limit, and nothing is measured from it.
    /// </summary>
    internal static double EstimatedPeriod(SimulatedCircuit circuit)
    {
        var swing = circuit.HighLimit(circuit.Oscillator) - circuit.LowLimit(circuit.Oscillator);
        var slewing = 2 * swing / circuit.Oscillator.SlewRate;
        if (circuit.Topology == SimulatedTopology.Loop)
        {
            var ratio = circuit.SchR1 / circuit.SchR2;
            var rampSlewing = 2 * swing * ratio / circuit.Integrator.SlewRate;
            return 4 * ratio * circuit.IntR * circuit.IntC + slewing + rampSlewing;
        }
        var beta = circuit.OscR2 / (circuit.OscR1 + circuit.OscR2);
        return 2 * circuit.OscR * circuit.OscC * Math.Log((1 + beta) / (1 - beta)) + slewing;
    }

    /// <summary>The stepping loop of one run: exact steps cut short at switching events.</summary>
    private sealed class EventRun(CircuitDynamics dynamics, double maxStep, SimulationOptions options)
    {
        private readonly double[] x = new double[CircuitDynamics.StateSize];
        private readonly double[] trial = new double[CircuitDynamics.StateSize];
        private readonly double[] guards = new double[CircuitDynamics.GuardCount];
        private readonly double[] probe = new double[CircuitDynamics.GuardCount];
        private readonly double[] scratch = new double[CircuitDynamics.StateSize];

        public Trace Trace { get; } = new((dynamics.OscHigh + dynamics.OscLow) / 2);
        public double Time { get; private set; }
        public int Steps { get; private set; }
        public int Events { get; private set; }

        public (SimulationOutcome, string?) Execute(double silenceLimit, double restTolerance)
        {
            dynamics.Initialise(x);
            Trace.Add(0, x);
            var edgesNeeded = options.SettlePeriods + options.MeasurePeriods + 1;
            while (true)
            {
                if (!ApplyPendingEvents())
                    return (SimulationOutcome.WorkLimitReached,
                        $"more than {options.MaxEvents} switching events by t = {Time:G6} s (MaxEvents)");
                if (Trace.RisingEdges.Count >= edgesNeeded)
                    return (SimulationOutcome.Measured, null);
                var lastEdge = Trace.RisingEdges.Count > 0 ? Trace.RisingEdges[^1] : 0;
                if (Time - lastEdge > silenceLimit)
                    return (SimulationOutcome.DoesNotOscillate, SilenceReason(lastEdge));
                if (Steps % RestCheckInterval == 0 && dynamics.IsQuiescent(x, probe, silenceLimit, restTolerance))
                    return (SimulationOutcome.DoesNotOscillate, RestReason());
                if (Steps >= options.MaxSteps)
                    return (SimulationOutcome.WorkLimitReached,
                        $"{options.MaxSteps} steps taken by t = {Time:G6} s before the measurement finished (MaxSteps)");
                Step();
            }
        }

        private string RestReason() =>
            $"the circuit came to rest at t = {Time:G4} s with the oscillator output held at {x[CircuitDynamics.Osc]:G4} V "
            + "and no switching threshold within reach (e.g. outside the output swing or beyond the integrator's limits)";

        private string SilenceReason(double lastEdge) =>
            $"the oscillator output has not risen through mid-level for {Time - lastEdge:G4} s "
            + $"({options.SilencePeriods:G4} estimated periods) and sits at {x[CircuitDynamics.Osc]:G4} V: "
            + (Trace.RisingEdges.Count == 0 ? "it never completed a cycle" : "it stopped switching")
            + " (a switching threshold the circuit cannot reach, e.g. outside the output swing or beyond the integrator's limits)";

        /// <summary>Makes every switch whose function is below zero; false when the event cap is passed.</summary>
        private bool ApplyPendingEvents()
        {
            var any = false;
            while (true)
            {
                dynamics.Guards(x, guards);
                var due = Array.FindIndex(guards, g => g < 0);
                if (due < 0) break;
                any = true;
                dynamics.Apply(due, x);
                if (++Events > options.MaxEvents) return false;
            }
            if (any) Trace.Add(Time, x);
            return true;
        }

        private void Step()
        {
            dynamics.Advance(x, maxStep, trial);
            dynamics.Guards(trial, guards);
            var step = maxStep;
            for (var i = 0; i < guards.Length; i++)
            {
                if (guards[i] < 0) step = Math.Min(step, Crossing(i, step, guards[i]));
            }
            if (step < maxStep) dynamics.Advance(x, step, trial);
            Array.Copy(trial, x, x.Length);
            Time += step;
            Steps++;
            Trace.Add(Time, x);
        }

        /// <summary>
        /// The step length at which guard <paramref name="guard"/> has just crossed below zero (Illinois
        /// regula falsi); the returned end of the bracket always has the guard below zero.
        /// </summary>
        private double Crossing(int guard, double step, double atStep)
        {
            dynamics.Guards(x, probe);
            double a = 0, ga = Math.Max(probe[guard], 0), b = step, gb = atStep;
            var tolerance = RootTolerance * step;
            var side = 0;
            for (var n = 0; n < RootIterations && b - a > tolerance; n++)
            {
                var c = (a * gb - b * ga) / (gb - ga);
                c = Math.Clamp(double.IsFinite(c) ? c : (a + b) / 2, a + tolerance / 2, b - tolerance / 2);
                dynamics.Advance(x, c, scratch);
                dynamics.Guards(scratch, probe);
                var gc = probe[guard];
                if (gc < 0)
                {
                    b = c; gb = gc;
                    if (side == -1) ga /= 2;
                    side = -1;
                }
                else
                {
                    a = c; ga = gc;
                    if (side == 1) gb /= 2;
                    side = 1;
                }
            }
            return b;
        }
    }
}
