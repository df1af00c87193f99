namespace PartsOpt.Topologies;

/// <summary>
/// e^x − 1 and ln(1 + x) without the cancellation of the naive forms near 0, which the integrator needs
/// when its time constant is long against the period (Kahan's tricks: the rounding error of 1 + x or e^x
/// is cancelled by dividing by the same rounded quantity).
/// </summary>
internal static class Accurate
{
    public static double ExpM1(double x)
    {
        var u = Math.Exp(x);
        if (Math.Abs(x) > 0.5)
            return u - 1.0; // no cancellation to speak of this far from 0
        if (u == 1.0)
            return x;
        var um1 = u - 1.0;
        if (um1 == -1.0)
            return -1.0;
        return um1 * x / Math.Log(u);
    }

    public static double Log1P(double x)
    {
        var u = 1.0 + x;
        return u == 1.0 ? x : Math.Log(u) * x / (u - 1.0);
    }
}
