namespace PartsOpt.Topologies;

/// <summary>
/// e^x − 1 and ln(1 + x) without the cancellation of the naive forms near 0, which the integrator needs
/// when its time constant is long against the period (Kahan's tricks: the rounding error of 1 + x or e^x
/// is cancelled by dividing by the same rounded quantity; for e^x − 1, the half-angle tanh identity).
/// </summary>
internal static class Accurate
{
    public static double ExpM1(double x)
    {
        if (Math.Abs(x) > 0.5)
            return Math.Exp(x) - 1.0; // no cancellation to speak of this far from 0
        // e^x − 1 = 2·tanh(x/2)/(1 − tanh(x/2)): exact in form and free of cancellation, since tanh is
        // computed accurately near 0; one transcendental call where Kahan's form needs an exp and a log.
        var t = Math.Tanh(0.5 * x);
        return 2.0 * t / (1.0 - t);
    }

    public static double Log1P(double x)
    {
        var u = 1.0 + x;
        return u == 1.0 ? x : Math.Log(u) * x / (u - 1.0);
    }
}
