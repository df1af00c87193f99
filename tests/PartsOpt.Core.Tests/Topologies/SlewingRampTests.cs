using MathNet.Numerics.OdeSolvers;
using PartsOpt.Topologies;

namespace PartsOpt.Tests.Topologies;

/// <summary>
/// The three-stage integrator driven by the slewing oscillator's trapezoid, against MathNet's fourth-order
/// Runge–Kutta on the same equation v′ = (−(Rf/Ri)·w(t) − v)/(Rf·Ci) (derived closed form; the trapezoid's
/// times come from the engine, which ClosedFormAgreementTests check against the time-domain simulator).
/// </summary>
public class SlewingRampTests
{
    [Fact]
    public void Triangle_extremes_and_linearity_match_runge_kutta()
    {
        // 0.5 V/µs, L+ = 10.8 V, L− = −11.2 V: edges of 44 µs against a period of about 2.2 ms.
        const double ri = 10e3, ci = 100e-9, rf = 10e3, slew = 0.5e6, lp = 10.8, lm = -11.2;
        var amp = TestCircuits.Ideal(slewRate: slew, headroomHigh: 1.2, headroomLow: 0.8);
        var e = CircuitAnalysis.Analyse(TestCircuits.ThreeStage(ri: ri, ci: ci, rf: rf, amp: amp));
        var period = 1 / e.Value(FigureNames.Frequency);
        var low = e.Value(FigureNames.LowTime);
        var edge = (lp - lm) / slew;

        // The trapezoid from the falling trip: down, held low, up, held high.
        double Input(double t)
        {
            t %= period;
            if (t < edge) return lp - slew * t;
            if (t < low) return lm;
            if (t < low + edge) return lm + slew * (t - low);
            return lp;
        }

        // Ten periods (ten shunt time constants and more) to settle, then one sampled densely.
        const int perPeriod = 40_000, periods = 11;
        var path = RungeKutta.FourthOrder(0, 0, periods * period, periods * perPeriod + 1,
            (t, v) => (-(rf / ri) * Input(t) - v) / (rf * ci));
        var last = path.AsSpan((periods - 1) * perPeriod, perPeriod + 1).ToArray();
        double max = last.Max(), min = last.Min();
        Precision.AlmostEqualRelative(max - min, e.Value(FigureNames.TrianglePeakToPeak), 1e-6, "peak-to-peak");
        Precision.AlmostEqualAbsolute(0.5 * (max + min), e.Value(FigureNames.TriangleCentre), 1e-6 * (max - min), "centre");

        // Largest gap to the chords through the turning points (falling run, then rising run, cyclically).
        int iMax = Array.IndexOf(last, max), iMin = Array.IndexOf(last, min);
        double Gap(int from, int to)
        {
            var n = (to - from + perPeriod) % perPeriod;
            var worst = 0.0;
            for (var k = 0; k <= n; k++)
            {
                var v = last[(from + k) % perPeriod];
                worst = Math.Max(worst, Math.Abs(v - (last[from] + (last[to] - last[from]) * k / n)));
            }

            return worst;
        }

        var linearity = 100 * Math.Max(Gap(iMax, iMin), Gap(iMin, iMax)) / (max - min);
        Precision.AlmostEqualRelative(linearity, e.Value(FigureNames.LinearityError), 1e-3, "linearity error %");
    }
}
