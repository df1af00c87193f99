using MathNet.Numerics;

namespace PartsOpt.Simulation;

/// <summary>How the integrator's output is moving.</summary>
internal enum IntegratorMode
{
    /// <summary>Ideal op-amp in its linear region: the exact lossy-integrator solution.</summary>
    Linear,
    /// <summary>The ideal slope would exceed +SR: the output rises at the slew rate.</summary>
    SlewingUp,
    /// <summary>The ideal slope would exceed −SR: the output falls at the slew rate.</summary>
    SlewingDown,
    /// <summary>Saturated at the high limit.</summary>
    HeldHigh,
    /// <summary>Saturated at the low limit.</summary>
    HeldLow,
}

/// <summary>
/// One circuit as a hybrid system: four voltages, a few discrete modes, the exact solution of the voltages
/// while the modes hold (<see cref="Advance"/>), the switching functions (<see cref="Guards"/>) and the
/// switching actions (<see cref="Apply"/>).
/// </summary>
/// <remarks>
/// Voltages: the oscillator (or Schmitt) output, the oscillator capacitor, the integrator output, the
/// comparator output. An open-loop section (oscillator, Schmitt, comparator) is either slewing at ±SR
/// towards the limit its inputs call for, or held at that limit; it leaves the hold only when its inputs
/// flip it. The integrator is linear (ideal op-amp, virtual ground at the reference), slewing at ±SR while
/// the ideal slope would be steeper, or held at a limit; it leaves a hold at once when its ideal slope
/// points back into the range, i.e. recovery from saturation is instantaneous (real op-amps may lag there:
/// not modelled). Every switching function is positive while nothing happens; an event is its crossing
/// below zero.
/// </remarks>
internal sealed class CircuitDynamics
{
    public const int Osc = 0, Cap = 1, Int = 2, Cmp = 3, StateSize = 4, GuardCount = 8;

    private const int OscFlip = 0, OscArrive = 1, CmpFlip = 2, CmpArrive = 3;
    private const int IntTop = 4, IntBottom = 5, IntFastUp = 6, IntFastDown = 7;

    private readonly SimulatedTopology topology;
    private readonly double vref, threshold, beta, rc;
    private readonly double riCi, tauShunt, shuntGain, schR1, schR2;
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
            rc = circuit.OscR * circuit.OscC;
        }
        if (hasIntegrator)
        {
            riCi = circuit.IntR * circuit.IntC;
            tauShunt = circuit.IntRf * circuit.IntC; // +∞ without a shunt
            shuntGain = circuit.IntRf / circuit.IntR;
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
    public IntegratorMode IntMode { get; private set; }

    /// <summary>Power-up: capacitors at the reference, the oscillator at its high limit, the comparator at
    /// whichever limit its inputs call for. Switching functions already below zero fire at t = 0.</summary>
    public void Initialise(Span<double> x)
    {
        x[Osc] = OscHigh;
        x[Cap] = vref;
        x[Int] = hasIntegrator ? vref : 0;
        OscTargetHigh = true;
        OscHeld = true;
        IntMode = IntegratorMode.Linear;
        CmpTargetHigh = ComparatorInput(x) >= 0;
        CmpHeld = true;
        x[Cmp] = CmpTargetHigh ? CmpHigh : CmpLow;
    }

    /// <summary>The voltage on the comparator's non-inverting input: the triangle or the capacitor ramp.</summary>
    public double Ramp(ReadOnlySpan<double> x) => hasIntegrator ? x[Int] : x[Cap];

    private double OscSlope => OscHeld ? 0 : OscTargetHigh ? OscSlew : -OscSlew;

    private double CmpSlope => CmpHeld ? 0 : CmpTargetHigh ? CmpSlew : -CmpSlew;

    /// <summary>
    /// The state <paramref name="h"/> seconds on, with the modes unchanged: exact, because every input is a
    /// straight line while the modes hold. Open-loop outputs move linearly; the capacitor and the shunted
    /// integrator follow a first-order lag of a ramp input (particular ramp plus decaying exponential); the
    /// unshunted integrator integrates the ramp (a parabola).
    /// </summary>
    public void Advance(ReadOnlySpan<double> x, double h, Span<double> result)
    {
        var oscSlope = OscSlope;
        result[Osc] = x[Osc] + oscSlope * h;
        result[Cmp] = x[Cmp] + CmpSlope * h;
        result[Cap] = x[Cap];
        if (hasCapacitor)
        {
            // vc' = (vo − vc)/RC with vo = vo0 + m·t: vc = vo − m·RC + (vc0 − vo0 + m·RC)·e^(−t/RC).
            var decay = SpecialFunctions.Expm1(-h / rc);
            result[Cap] = x[Cap] + oscSlope * h + (x[Cap] - x[Osc] + oscSlope * rc) * decay;
        }
        result[Int] = hasIntegrator ? AdvanceIntegrator(x, h, oscSlope) : x[Int];
    }

    private double AdvanceIntegrator(ReadOnlySpan<double> x, double h, double oscSlope)
    {
        switch (IntMode)
        {
            case IntegratorMode.SlewingUp: return x[Int] + IntSlew * h;
            case IntegratorMode.SlewingDown: return x[Int] - IntSlew * h;
            case IntegratorMode.HeldHigh or IntegratorMode.HeldLow: return x[Int];
        }
        double u = x[Int] - vref, w = x[Osc] - vref;
        if (double.IsPositiveInfinity(tauShunt))
            return x[Int] - (w * h + oscSlope * h * h / 2) / riCi;
        // u' = −w/(Ri·Ci) − u/τ, w = w0 + m·t, g = Rf/Ri: u = A + B·t + (u0 − A)·e^(−t/τ),
        // A = −g·(w0 − m·τ), B = −g·m.
        var a = -shuntGain * (w - oscSlope * tauShunt);
        var b = -shuntGain * oscSlope;
        return vref + u + b * h + (u - a) * SpecialFunctions.Expm1(-h / tauShunt);
    }

    /// <summary>Slope of the integrator output with an ideal op-amp (virtual ground at the reference).</summary>
    private double IntegratorSlope(ReadOnlySpan<double> x) =>
        -(x[Osc] - vref) / riCi - (x[Int] - vref) / tauShunt;

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
        g[IntTop] = g[IntBottom] = g[IntFastUp] = g[IntFastDown] = double.PositiveInfinity;
        if (!hasIntegrator) return;
        var slope = IntegratorSlope(x);
        switch (IntMode)
        {
            case IntegratorMode.Linear:
                g[IntTop] = IntHigh - x[Int];
                g[IntBottom] = x[Int] - IntLow;
                g[IntFastUp] = IntSlew - slope;
                g[IntFastDown] = IntSlew + slope;
                break;
            case IntegratorMode.SlewingUp:
                g[IntTop] = IntHigh - x[Int];
                g[IntFastUp] = slope - IntSlew;
                break;
            case IntegratorMode.SlewingDown:
                g[IntBottom] = x[Int] - IntLow;
                g[IntFastDown] = -slope - IntSlew;
                break;
            case IntegratorMode.HeldHigh:
                g[IntTop] = slope;
                break;
            case IntegratorMode.HeldLow:
                g[IntBottom] = -slope;
                break;
        }
    }

    /// <summary>
    /// True when no switch can happen again: both open-loop outputs held, the continuous states so near rest
    /// that all their remaining drift is below <paramref name="tolerance"/> (V), and both flips further than
    /// that from happening. With the modes fixed, the capacitor and a shunted integrator settle exponentially
    /// (|slope|·τ is what is left); an unshunted integrator moves at a constant slope, bounded over
    /// <paramref name="horizon"/> (s).
    /// </summary>
    public bool IsQuiescent(ReadOnlySpan<double> x, Span<double> g, double horizon, double tolerance)
    {
        if (!OscHeld || !CmpHeld) return false;
        var drift = hasCapacitor ? Math.Abs(x[Osc] - x[Cap]) : 0;
        if (hasIntegrator && IntMode is IntegratorMode.SlewingUp or IntegratorMode.SlewingDown) return false;
        if (hasIntegrator && IntMode == IntegratorMode.Linear)
            drift = Math.Max(drift, Math.Abs(IntegratorSlope(x)) * (double.IsPositiveInfinity(tauShunt) ? horizon : tauShunt));
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
            case IntTop when IntMode == IntegratorMode.HeldHigh:
            case IntBottom when IntMode == IntegratorMode.HeldLow:
                IntMode = FreeMode(IntegratorSlope(x));
                break;
            case IntTop:
                x[Int] = IntHigh;
                IntMode = IntegratorMode.HeldHigh;
                break;
            case IntBottom:
                x[Int] = IntLow;
                IntMode = IntegratorMode.HeldLow;
                break;
            case IntFastUp:
                IntMode = IntMode == IntegratorMode.Linear ? IntegratorMode.SlewingUp : IntegratorMode.Linear;
                break;
            case IntFastDown:
                IntMode = IntMode == IntegratorMode.Linear ? IntegratorMode.SlewingDown : IntegratorMode.Linear;
                break;
            default:
                throw new ArgumentOutOfRangeException(nameof(guard));
        }
    }

    private IntegratorMode FreeMode(double slope) =>
        slope > IntSlew ? IntegratorMode.SlewingUp : slope < -IntSlew ? IntegratorMode.SlewingDown : IntegratorMode.Linear;
}
