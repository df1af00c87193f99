namespace PartsOpt.Simulation;

/// <summary>
/// The right-hand side, switching functions and switching actions of one circuit: a hybrid system of
/// four continuous states and a few discrete modes. The run loop in <see cref="TransientSimulator"/>
/// integrates it between events and calls <see cref="Apply"/> at each one.
/// </summary>
/// <remarks>
/// Continuous states: the oscillator (or Schmitt) output, the oscillator capacitor, the integrator output,
/// the comparator output. A saturating section (oscillator, Schmitt, comparator) is either slewing at ±SR
/// towards the limit its inputs call for, or held at that limit; it leaves the hold only when its inputs
/// flip it. The integrator is free (ideal op-amp, slope clipped to ±SR) or held at a limit; it leaves the
/// hold at once when its unlimited slope points back into the range, i.e. recovery from saturation is
/// instantaneous (real op-amps may lag there: not modelled).
/// Every switching function is positive while nothing happens; an event is its crossing below zero.
/// </remarks>
internal sealed class CircuitDynamics
{
    public const int Osc = 0, Cap = 1, Int = 2, Cmp = 3, StateSize = 4, GuardCount = 6;

    private const int OscFlip = 0, OscArrive = 1, CmpFlip = 2, CmpArrive = 3, IntTop = 4, IntBottom = 5;

    private readonly SimulatedTopology topology;
    private readonly double vref, threshold, beta, rcInverse;
    private readonly double riCiInverse, rfCiInverse, schR1, schR2;
    private readonly bool hasCapacitor, hasIntegrator;

    public CircuitDynamics(SimulatedCircuit circuit)
    {
        topology = circuit.Topology;
        vref = circuit.Reference;
        threshold = circuit.Threshold;
        hasCapacitor = topology != SimulatedTopology.Loop;
        hasIntegrator = topology != SimulatedTopology.RcRamp;
        if (hasCapacitor)
        {
            beta = circuit.OscR2 / (circuit.OscR1 + circuit.OscR2);
            rcInverse = 1 / (circuit.OscR * circuit.OscC);
        }
        if (hasIntegrator)
        {
            riCiInverse = 1 / (circuit.IntR * circuit.IntC);
            rfCiInverse = double.IsPositiveInfinity(circuit.IntRf) ? 0 : 1 / (circuit.IntRf * circuit.IntC);
            IntHigh = circuit.HighLimit(circuit.Integrator);
            IntLow = circuit.LowLimit(circuit.Integrator);
            IntSlew = circuit.Integrator.SlewRate;
        }
        schR1 = circuit.SchR1;
        schR2 = circuit.SchR2;
        OscHigh = circuit.HighLimit(circuit.Oscillator);
        OscLow = circuit.LowLimit(circuit.Oscillator);
        OscSlew = circuit.Oscillator.SlewRate;
        CmpHigh = circuit.HighLimit(circuit.Comparator);
        CmpLow = circuit.LowLimit(circuit.Comparator);
        CmpSlew = circuit.Comparator.SlewRate;
    }

    public double OscHigh { get; }
    public double OscLow { get; }
    public double OscSlew { get; }
    public double CmpHigh { get; }
    public double CmpLow { get; }
    public double CmpSlew { get; }
    public double IntHigh { get; }
    public double IntLow { get; }
    public double IntSlew { get; }
    public bool HasCapacitor => hasCapacitor;
    public bool HasIntegrator => hasIntegrator;

    // Discrete modes.
    public bool OscTargetHigh { get; private set; }
    public bool OscHeld { get; private set; }
    public bool CmpTargetHigh { get; private set; }
    public bool CmpHeld { get; private set; }
    public int IntHeld { get; private set; } // 0 free, +1 at the top limit, −1 at the bottom limit

    /// <summary>Power-up: capacitors at the reference, the oscillator at its high limit, the comparator at
    /// whichever limit its inputs call for.</summary>
    public void Initialise(Span<double> x)
    {
        x[Osc] = OscHigh;
        x[Cap] = vref;
        x[Int] = hasIntegrator ? vref : 0;
        OscTargetHigh = true;
        OscHeld = true;
        IntHeld = 0;
        CmpTargetHigh = ComparatorInput(x) >= 0;
        CmpHeld = true;
        x[Cmp] = CmpTargetHigh ? CmpHigh : CmpLow;
    }

    /// <summary>The voltage on the comparator's non-inverting input: the triangle or the capacitor ramp.</summary>
    public double Ramp(ReadOnlySpan<double> x) => hasIntegrator ? x[Int] : x[Cap];

    public void Derivative(ReadOnlySpan<double> x, Span<double> dx)
    {
        dx[Osc] = OscHeld ? 0 : OscTargetHigh ? OscSlew : -OscSlew;
        dx[Cap] = hasCapacitor ? (x[Osc] - x[Cap]) * rcInverse : 0;
        dx[Int] = hasIntegrator && IntHeld == 0 ? Math.Clamp(IntegratorSlope(x), -IntSlew, IntSlew) : 0;
        dx[Cmp] = CmpHeld ? 0 : CmpTargetHigh ? CmpSlew : -CmpSlew;
    }

    /// <summary>Slope of the integrator output with an ideal op-amp (virtual ground at the reference).</summary>
    private double IntegratorSlope(ReadOnlySpan<double> x) =>
        -(x[Osc] - vref) * riCiInverse - (x[Int] - vref) * rfCiInverse;

    /// <summary>v+ − v− of the oscillator or Schmitt section.</summary>
    private double OscillatorInput(ReadOnlySpan<double> x) => topology == SimulatedTopology.Loop
        ? (schR2 * x[Int] + schR1 * x[Osc]) / (schR1 + schR2) - vref
        : vref + beta * (x[Osc] - vref) - x[Cap];

    private double ComparatorInput(ReadOnlySpan<double> x) => Ramp(x) - threshold;

    public void Guards(ReadOnlySpan<double> x, Span<double> g)
    {
        var oscInput = OscillatorInput(x);
        g[OscFlip] = OscTargetHigh ? oscInput : -oscInput;
        g[OscArrive] = OscHeld ? double.PositiveInfinity : OscTargetHigh ? OscHigh - x[Osc] : x[Osc] - OscLow;
        var cmpInput = ComparatorInput(x);
        g[CmpFlip] = CmpTargetHigh ? cmpInput : -cmpInput;
        g[CmpArrive] = CmpHeld ? double.PositiveInfinity : CmpTargetHigh ? CmpHigh - x[Cmp] : x[Cmp] - CmpLow;
        if (!hasIntegrator)
        {
            g[IntTop] = g[IntBottom] = double.PositiveInfinity;
            return;
        }
        var slope = IntegratorSlope(x);
        g[IntTop] = IntHeld switch { 0 => IntHigh - x[Int], 1 => slope, _ => double.PositiveInfinity };
        g[IntBottom] = IntHeld switch { 0 => x[Int] - IntLow, -1 => -slope, _ => double.PositiveInfinity };
    }

    /// <summary>
    /// True when no switch can happen again: both open-loop outputs held, the continuous states so near rest
    /// that all their remaining drift is below <paramref name="tolerance"/> (V), and both flips further than
    /// that from happening. With the modes fixed, each continuous state decays towards its resting value
    /// (|slope|·τ bounds what is left), or, for an integrator without shunt, moves at a constant slope, which
    /// is bounded over <paramref name="horizon"/> (s).
    /// </summary>
    public bool IsQuiescent(ReadOnlySpan<double> x, Span<double> dx, Span<double> g, double horizon, double tolerance)
    {
        if (!OscHeld || !CmpHeld) return false;
        Derivative(x, dx);
        var drift = hasCapacitor ? Math.Abs(dx[Cap]) / rcInverse : 0;
        if (hasIntegrator && IntHeld == 0)
            drift = Math.Max(drift, Math.Abs(dx[Int]) * (rfCiInverse > 0 ? 1 / rfCiInverse : horizon));
        if (!(drift < tolerance)) return false;
        Guards(x, g);
        return g[OscFlip] > tolerance && g[CmpFlip] > tolerance;
    }

    /// <summary>Carries out the switching action of guard <paramref name="guard"/>, which has just crossed zero.</summary>
    public void Apply(int guard, Span<double> x)
    {
        switch (guard)
        {
            case OscFlip:
                OscTargetHigh = !OscTargetHigh;
                OscHeld = double.IsPositiveInfinity(OscSlew);
                if (OscHeld) x[Osc] = OscTargetHigh ? OscHigh : OscLow;
                break;
            case OscArrive:
                x[Osc] = OscTargetHigh ? OscHigh : OscLow;
                OscHeld = true;
                break;
            case CmpFlip:
                CmpTargetHigh = !CmpTargetHigh;
                CmpHeld = double.IsPositiveInfinity(CmpSlew);
                if (CmpHeld) x[Cmp] = CmpTargetHigh ? CmpHigh : CmpLow;
                break;
            case CmpArrive:
                x[Cmp] = CmpTargetHigh ? CmpHigh : CmpLow;
                CmpHeld = true;
                break;
            case IntTop:
                if (IntHeld == 0) { x[Int] = IntHigh; IntHeld = 1; }
                else IntHeld = 0;
                break;
            case IntBottom:
                if (IntHeld == 0) { x[Int] = IntLow; IntHeld = -1; }
                else IntHeld = 0;
                break;
            default:
                throw new ArgumentOutOfRangeException(nameof(guard));
        }
    }
}
