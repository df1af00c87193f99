namespace PartsOpt.Simulation;

/// <summary>Which PWM generator the simulator wires up.</summary>
public enum SimulatedTopology
{
    /// <summary>Relaxation oscillator → inverting integrator (with optional shunt) → comparator.</summary>
    ThreeStage,

    /// <summary>Non-inverting Schmitt trigger and inverting integrator in a loop → comparator on the triangle.</summary>
    Loop,

    /// <summary>Relaxation oscillator whose capacitor ramp feeds the comparator directly.</summary>
    RcRamp,
}

/// <summary>
/// The limits of one op-amp section: where its output saturates and how fast it can move.
/// </summary>
/// <param name="HeadroomHigh">How far below V+ the output saturates (V, ≥ 0).</param>
/// <param name="HeadroomLow">How far above V− the output saturates (V, ≥ 0).</param>
/// <param name="SlewRate">Largest rate of change of the output (V/s, &gt; 0);
/// <see cref="double.PositiveInfinity"/> for an output that switches instantly.</param>
public sealed record OpAmpSection(double HeadroomHigh, double HeadroomLow, double SlewRate)
{
    /// <summary>An ideal section: saturates at the rails and does not slew.</summary>
    public static OpAmpSection Ideal { get; } = new(0, 0, double.PositiveInfinity);

    internal void Validate(string name)
    {
        if (!(HeadroomHigh >= 0) || !double.IsFinite(HeadroomHigh))
            throw new ArgumentException($"{name}: headroom high must be a finite voltage ≥ 0.", name);
        if (!(HeadroomLow >= 0) || !double.IsFinite(HeadroomLow))
            throw new ArgumentException($"{name}: headroom low must be a finite voltage ≥ 0.", name);
        if (!(SlewRate > 0))
            throw new ArgumentException($"{name}: slew rate must be positive (V/s).", name);
    }
}

/// <summary>
/// A PWM generator reduced to plain numbers in SI units (V, Ω, F, V/s), as the transient simulator takes
/// it. Only the values the chosen <see cref="Topology"/> uses are read; the others are ignored.
/// </summary>
/// <remarks>
/// Every "ground" return (the oscillator's capacitor and lower divider resistor, the integrator's
/// non-inverting input, the Schmitt trigger's inverting input) goes to <see cref="Reference"/>: 0 V on a
/// dual supply, mid-rail on a single supply.
/// </remarks>
public sealed record SimulatedCircuit
{
    /// <summary>The topology.</summary>
    public required SimulatedTopology Topology { get; init; }

    /// <summary>Positive supply rail V+ (V).</summary>
    public required double SupplyPositive { get; init; }

    /// <summary>Negative supply rail V− (V); 0 for a single supply.</summary>
    public required double SupplyNegative { get; init; }

    /// <summary>Reference voltage the ground returns go to (V): 0 on a dual supply, mid-rail on a single one.</summary>
    public double Reference { get; init; }

    /// <summary>Op-amp limits of the relaxation oscillator, or of the loop's Schmitt trigger.</summary>
    public OpAmpSection Oscillator { get; init; } = OpAmpSection.Ideal;

    /// <summary>Op-amp limits of the integrator.</summary>
    public OpAmpSection Integrator { get; init; } = OpAmpSection.Ideal;

    /// <summary>Op-amp limits of the comparator.</summary>
    public OpAmpSection Comparator { get; init; } = OpAmpSection.Ideal;

    /// <summary>Oscillator timing resistor, output → inverting input (Ω; role osc.r).</summary>
    public double OscR { get; init; }

    /// <summary>Oscillator timing capacitor, inverting input → reference (F; role osc.c).</summary>
    public double OscC { get; init; }

    /// <summary>Oscillator divider, output → non-inverting input (Ω; role osc.r1).</summary>
    public double OscR1 { get; init; }

    /// <summary>Oscillator divider, non-inverting input → reference (Ω; role osc.r2).</summary>
    public double OscR2 { get; init; }

    /// <summary>Integrator input resistor (Ω; role int.r).</summary>
    public double IntR { get; init; }

    /// <summary>Integrator feedback capacitor (F; role int.c).</summary>
    public double IntC { get; init; }

    /// <summary>Shunt across the integrator capacitor (Ω; role int.rf); <see cref="double.PositiveInfinity"/>
    /// for none. The loop normally has none.</summary>
    public double IntRf { get; init; } = double.PositiveInfinity;

    /// <summary>Loop Schmitt trigger: triangle → non-inverting input (Ω; role sch.r1).</summary>
    public double SchR1 { get; init; }

    /// <summary>Loop Schmitt trigger: its own output → non-inverting input (Ω; role sch.r2).</summary>
    public double SchR2 { get; init; }

    /// <summary>Comparator threshold on its inverting input (V).</summary>
    public double Threshold { get; init; }

    /// <summary>Highest output of a section: V+ less its headroom.</summary>
    public double HighLimit(OpAmpSection section) => SupplyPositive - section.HeadroomHigh;

    /// <summary>Lowest output of a section: V− plus its headroom.</summary>
    public double LowLimit(OpAmpSection section) => SupplyNegative + section.HeadroomLow;

    /// <summary>Throws <see cref="ArgumentException"/> naming the first value that cannot be simulated.</summary>
    public void Validate()
    {
        if (!double.IsFinite(SupplyPositive) || !double.IsFinite(SupplyNegative) || SupplyPositive <= SupplyNegative)
            throw new ArgumentException("Supply: V+ must be finite and above V−.", nameof(SupplyPositive));
        if (!double.IsFinite(Reference))
            throw new ArgumentException("Reference must be finite.", nameof(Reference));
        if (!double.IsFinite(Threshold))
            throw new ArgumentException("Threshold must be finite.", nameof(Threshold));
        ValidateSection(Oscillator, nameof(Oscillator));
        ValidateSection(Comparator, nameof(Comparator));
        if (Topology is SimulatedTopology.ThreeStage or SimulatedTopology.RcRamp)
        {
            RequirePart(OscR, nameof(OscR));
            RequirePart(OscC, nameof(OscC));
            RequirePart(OscR1, nameof(OscR1));
            RequirePart(OscR2, nameof(OscR2));
        }
        if (Topology is SimulatedTopology.ThreeStage or SimulatedTopology.Loop)
        {
            ValidateSection(Integrator, nameof(Integrator));
            RequirePart(IntR, nameof(IntR));
            RequirePart(IntC, nameof(IntC));
            if (!(IntRf > 0))
                throw new ArgumentException("IntRf must be positive (or +∞ for no shunt).", nameof(IntRf));
        }
        if (Topology is SimulatedTopology.Loop)
        {
            RequirePart(SchR1, nameof(SchR1));
            RequirePart(SchR2, nameof(SchR2));
        }
        if (!Enum.IsDefined(Topology))
            throw new ArgumentException("Unknown topology.", nameof(Topology));
    }

    private void ValidateSection(OpAmpSection section, string name)
    {
        ArgumentNullException.ThrowIfNull(section, name);
        section.Validate(name);
        if (HighLimit(section) <= LowLimit(section))
            throw new ArgumentException($"{name}: the headrooms leave no output swing between the rails.", name);
    }

    private static void RequirePart(double value, string name)
    {
        if (!(value > 0) || !double.IsFinite(value))
            throw new ArgumentException($"{name} must be a finite positive value.", name);
    }
}
