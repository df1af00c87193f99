namespace PartsOpt.Topologies;

/// <summary>
/// e^x − 1 and ln(1 + x) without the cancellation of the naive forms near 0, which the integrator needs
/// when its time constant is long against the period. Near 0, e^x − 1 is its Taylor series (no
/// cancellation there: the terms fall by at least a factor 4 each); ln(1 + x) is the series of 2·atanh near 0
/// and Kahan's trick beyond (the rounding error of 1 + x is cancelled by dividing by the same rounded
/// quantity).
/// </summary>
internal static class Accurate
{
    // 1/n! for n = 2…15 (exact quotients of integers, rounded once).
    private const double C2 = 1.0 / 2, C3 = 1.0 / 6, C4 = 1.0 / 24, C5 = 1.0 / 120, C6 = 1.0 / 720,
        C7 = 1.0 / 5040, C8 = 1.0 / 40320, C9 = 1.0 / 362880, C10 = 1.0 / 3628800, C11 = 1.0 / 39916800,
        C12 = 1.0 / 479001600, C13 = 1.0 / 6227020800, C14 = 1.0 / 87178291200, C15 = 1.0 / 1307674368000;

    public static double ExpM1(double x)
    {
        if (Math.Abs(x) > 0.5)
            return Math.Exp(x) - 1.0; // no cancellation to speak of this far from 0
        // x + x²·Σ x^(n−2)/n! to n = 15: for |x| ≤ 1/2 the first term left out, x^16/16!, is below 1e-17 of
        // the sum. Estrin's grouping, not Horner's: the products are independent, so the polynomial costs a
        // few multiply-add latencies rather than fourteen in a row (it was a call to tanh, twice as slow,
        // and the figure model makes five of these per evaluation).
        var x2 = x * x;
        var x4 = x2 * x2;
        var x8 = x4 * x4;
        var low = Math.FusedMultiplyAdd(
            Math.FusedMultiplyAdd(C5, x, C4), x2, Math.FusedMultiplyAdd(C3, x, C2));
        var middle = Math.FusedMultiplyAdd(
            Math.FusedMultiplyAdd(C9, x, C8), x2, Math.FusedMultiplyAdd(C7, x, C6));
        var high = Math.FusedMultiplyAdd(
            Math.FusedMultiplyAdd(Math.FusedMultiplyAdd(C15, x, C14), x2, Math.FusedMultiplyAdd(C13, x, C12)),
            x2, Math.FusedMultiplyAdd(C11, x, C10));
        var sum = Math.FusedMultiplyAdd(high, x8, Math.FusedMultiplyAdd(middle, x4, low));
        return Math.FusedMultiplyAdd(x2, sum, x);
    }

    // 1/(2k + 1) for k = 1…6.
    private const double A1 = 1.0 / 3, A2 = 1.0 / 5, A3 = 1.0 / 7, A4 = 1.0 / 9, A5 = 1.0 / 11, A6 = 1.0 / 13;

    public static double Log1P(double x)
    {
        if (Math.Abs(x) <= 0.125)
        {
            // ln(1 + x) = 2·atanh(z) = 2z·(1 + z²/3 + z⁴/5 + …), z = x/(2 + x), |z| ≤ 1/15 here: to z¹³ the
            // first term left out is below 3e-18 of the sum, and no 1 + x is rounded. Most of the figure
            // model's logarithms have small arguments (turning points, linearity extremes, crossings), and
            // one division with a short polynomial is quicker than the library's logarithm plus a division.
            var z = x / (2.0 + x);
            var w = z * z;
            var w2 = w * w;
            var series = Math.FusedMultiplyAdd(
                Math.FusedMultiplyAdd(A6, w, A5), w2 * w2,
                Math.FusedMultiplyAdd(Math.FusedMultiplyAdd(A4, w, A3), w2, Math.FusedMultiplyAdd(A2, w, A1)));
            var twoZ = z + z;
            return Math.FusedMultiplyAdd(twoZ * w, series, twoZ);
        }

        // Kahan's form: the rounding error of 1 + x cancels in x/(u − 1); that quotient does not wait for
        // the logarithm, so the division runs beside it.
        var u = 1.0 + x;
        return Math.Log(u) * (x / (u - 1.0));
    }
}
