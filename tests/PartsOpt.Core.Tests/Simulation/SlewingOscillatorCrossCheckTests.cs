using MathNet.Numerics.OdeSolvers;
using PartsOpt.Simulation;

namespace PartsOpt.Tests.Simulation;

/// <summary>
/// The slewing relaxation oscillator has no closed form, so the reference here is a general-purpose ODE
/// solver: MathNet.Numerics' fourth-order Runge–Kutta on a fine fixed grid, with the switching instant found
/// by linear interpolation on that grid. It shares nothing with the simulator but the circuit equations.
/// </summary>
public class SlewingOscillatorCrossCheckTests
{
    private const double L = 12, RC = 10e3 * 100e-9, Beta = 0.5;

    [Theory]
    [InlineData(1e6)]
    [InlineData(0.2e6)]
    public void PeriodMatchesMathNetRungeKutta(double slewRate)
    {
        var figures = TestCircuits.Figures(TransientSimulator.Run(
            TestCircuits.RcRamp() with { Oscillator = new OpAmpSection(0, 0, slewRate) }));

        var half = HalfPeriodFromMathNet(slewRate);
        Precision.AlmostEqualRelative(1 / (2 * half), figures.Frequency, 1e-4, "frequency against MathNet RK4");
    }

    /// <summary>
    /// One falling half period in steady state: at t = 0 the capacitor sits at the upper threshold β·L and the
    /// output starts slewing from +L down to −L; the half period ends when the capacitor falls to the
    /// (moving) threshold β·vo(t). By symmetry the rising half is equally long.
    /// </summary>
    private static double HalfPeriodFromMathNet(double slewRate)
    {
        double Output(double t) => Math.Max(-L, L - slewRate * t);
        const int points = 200_001;
        var span = 2 * RC * Math.Log(3) + 4 * L / slewRate;
        var dt = span / (points - 1);
        var path = RungeKutta.FourthOrder(Beta * L, 0, span, points, (t, v) => (Output(t) - v) / RC);
        for (var i = 1; i < points; i++)
        {
            double t0 = (i - 1) * dt, t1 = i * dt;
            double g0 = path[i - 1] - Beta * Output(t0), g1 = path[i] - Beta * Output(t1);
            if (g0 > 0 && g1 <= 0)
                return t0 + g0 / (g0 - g1) * dt;
        }
        throw new InvalidOperationException("The reference solution never reached the threshold.");
    }
}
