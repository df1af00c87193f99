namespace PartsOpt.Simulation;

/// <summary>
/// Every sample the run produces (each step end, and both sides of each switching event), with the
/// oscillator's mid-level crossings found as the samples arrive. Outputs of saturating sections are
/// piecewise linear between samples (slewing or held), so crossings interpolated on them are exact.
/// </summary>
internal sealed class Trace
{
    private readonly double oscMid;

    public Trace(double oscMid) => this.oscMid = oscMid;

    public List<double> Time { get; } = [];
    public List<double> Osc { get; } = [];
    public List<double> Cap { get; } = [];
    public List<double> Int { get; } = [];
    public List<double> Cmp { get; } = [];

    /// <summary>Times the oscillator output rose through the middle of its limits.</summary>
    public List<double> RisingEdges { get; } = [];

    /// <summary>Times the oscillator output fell through the middle of its limits.</summary>
    public List<double> FallingEdges { get; } = [];

    public void Add(double t, ReadOnlySpan<double> x)
    {
        var n = Time.Count;
        if (n > 0)
        {
            double t0 = Time[n - 1], v0 = Osc[n - 1], v1 = x[CircuitDynamics.Osc];
            if (v0 < oscMid && v1 >= oscMid) RisingEdges.Add(Crossing(t0, v0, t, v1, oscMid));
            else if (v0 >= oscMid && v1 < oscMid) FallingEdges.Add(Crossing(t0, v0, t, v1, oscMid));
        }
        Time.Add(t);
        Osc.Add(x[CircuitDynamics.Osc]);
        Cap.Add(x[CircuitDynamics.Cap]);
        Int.Add(x[CircuitDynamics.Int]);
        Cmp.Add(x[CircuitDynamics.Cmp]);
    }

    /// <summary>Time at which the straight line through (t0, v0) and (t1, v1) passes <paramref name="level"/>.</summary>
    public static double Crossing(double t0, double v0, double t1, double v1, double level) =>
        t1 == t0 || v1 == v0 ? t1 : t0 + (level - v0) / (v1 - v0) * (t1 - t0);
}
