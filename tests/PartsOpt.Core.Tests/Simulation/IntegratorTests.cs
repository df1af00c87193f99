using MathNet.Numerics.OdeSolvers;
using PartsOpt.Simulation;

namespace PartsOpt.Tests.Simulation;

public class IntegratorTests
{
    private const double Vs = 12, Ri = 10e3;

    // A shunt time constant Rf·Ci of up to ten periods needs more settling than the default three periods:
    // the start-up offset decays as exp(−t/(Rf·Ci)).
    private static readonly SimulationOptions Settled = new() { SettlePeriods = 80 };

    [Theory]
    [InlineData(5e3)]
    [InlineData(20e3)]
    [InlineData(100e3)]
    public void ShuntedIntegratorFollowsTheTanhLaw(double rf)
    {
        const double ci = 220e-9;
        var figures = TestCircuits.Figures(TransientSimulator.Run(TestCircuits.ThreeStage(rf, ci), Settled));

        // Vpp = 2·(Rf/Ri)·Vs·tanh(T/(4·Rf·Ci)) (REFERENCE.md, derived), T the measured oscillator period.
        var period = 1 / figures.Frequency;
        var expected = 2 * (rf / Ri) * Vs * Math.Tanh(period / (4 * rf * ci));
        Precision.AlmostEqualRelative(expected, figures.TrianglePeakToPeak, 0.01, $"Vpp at Rf = {rf:G3} Ω");
        // A symmetric square has no DC component, so the triangle centres on the reference (REFERENCE.md).
        Precision.AlmostEqualAbsolute(0, figures.TriangleCentre, 0.01 * expected, "triangle centre");
    }

    [Theory]
    [InlineData(1e9)]
    [InlineData(double.PositiveInfinity)]
    public void LargeShuntTendsToTheIdealIntegrator(double rf)
    {
        const double ci = 220e-9;
        var figures = TestCircuits.Figures(TransientSimulator.Run(TestCircuits.ThreeStage(rf, ci)));

        // Ideal Vpp = Vs/(2·f·Ri·Ci) (REFERENCE.md, integrator).
        Precision.AlmostEqualRelative(Vs / (2 * figures.Frequency * Ri * ci), figures.TrianglePeakToPeak, 0.01, "Vpp");
    }

    [Fact]
    public void SaturatedIntegratorRecoversAtOnce()
    {
        // Ci = 56 nF: the ramp slope is 12 V/(Ri·Ci) = 21.4 kV/s. The first half period is short (the capacitor
        // starts at 0 V, not at −βL: RC·ln 2 = 0.69 ms) yet its 14.9 V ramp still runs into the −12 V rail;
        // each later half period (RC·ln 3) ramps 23.5 V, which fits between the rails.
        const double ci = 56e-9;
        var figures = TestCircuits.Figures(TransientSimulator.Run(TestCircuits.ThreeStage(double.PositiveInfinity, ci)));

        // With no shunt nothing restores the centre: the clamp leaves the lower peak at the rail and the ramp
        // rises Vs·(T/2)/(Ri·Ci) above it (derived from the documented model of instantaneous recovery).
        var ramp = Vs * (1 / figures.Frequency / 2) / (Ri * ci);
        Precision.AlmostEqualRelative(ramp, figures.TrianglePeakToPeak, 0.001, "Vpp");
        Precision.AlmostEqualRelative(-12 + ramp / 2, figures.TriangleCentre, 0.001, "centre pinned by the rail");
    }

    [Fact]
    public void ShuntedIntegratorMatchesMathNetRungeKutta()
    {
        const double rf = 20e3, ci = 220e-9;
        var figures = TestCircuits.Figures(TransientSimulator.Run(TestCircuits.ThreeStage(rf, ci), Settled));

        // Reference: MathNet.Numerics' fourth-order Runge–Kutta on dv/dt = −u/(Ri·Ci) − v/(Rf·Ci), one call per
        // half period of the square u = ±Vs (the RC charging between switching events), half period from the
        // simulated frequency, started as the simulator starts (v = 0, u = +Vs first), run for 30 periods.
        var half = 1 / figures.Frequency / 2;
        double v = 0, max = double.NegativeInfinity, min = double.PositiveInfinity;
        for (var n = 0; n < 60; n++)
        {
            var u = n % 2 == 0 ? Vs : -Vs;
            var path = RungeKutta.FourthOrder(v, 0, half, 2001, (_, y) => -u / (Ri * ci) - y / (rf * ci));
            v = path[^1];
            if (n >= 58)
            {
                max = Math.Max(max, path.Max());
                min = Math.Min(min, path.Min());
            }
        }
        Precision.AlmostEqualRelative(max - min, figures.TrianglePeakToPeak, 1e-4, "Vpp against MathNet RK4");
    }

    [Fact]
    public void SlewLimitedShuntedIntegratorMatchesMathNetRungeKutta()
    {
        // Ideal slope Vs/(Ri·Ci) = 5.45 kV/s plus up to about 0.7 kV/s from the shunt: a 5.5 kV/s limit clips the
        // start of every half period and releases it part-way through, a case with no closed form here.
        const double rf = 20e3, ci = 220e-9, slewRate = 5.5e3;
        var circuit = TestCircuits.ThreeStage(rf, ci) with { Integrator = new OpAmpSection(0, 0, slewRate) };
        var figures = TestCircuits.Figures(TransientSimulator.Run(circuit, Settled));

        // Reference: MathNet.Numerics' fourth-order Runge–Kutta on dv/dt = clamp(−u/(Ri·Ci) − v/(Rf·Ci), ±SR),
        // one call per half period of the square u = ±Vs, half period from the simulated frequency.
        var half = 1 / figures.Frequency / 2;
        double v = 0, max = double.NegativeInfinity, min = double.PositiveInfinity;
        for (var n = 0; n < 60; n++)
        {
            var u = n % 2 == 0 ? Vs : -Vs;
            var path = RungeKutta.FourthOrder(v, 0, half, 20001,
                (_, y) => Math.Clamp(-u / (Ri * ci) - y / (rf * ci), -slewRate, slewRate));
            v = path[^1];
            if (n >= 58)
            {
                max = Math.Max(max, path.Max());
                min = Math.Min(min, path.Min());
            }
        }
        Precision.AlmostEqualRelative(max - min, figures.TrianglePeakToPeak, 1e-4, "Vpp against MathNet RK4");
        // The clip must bite: the unlimited tanh law (REFERENCE.md, derived) gives a larger swing.
        var unlimited = 2 * (rf / Ri) * Vs * Math.Tanh(2 * half / (4 * rf * ci));
        Assert.True(figures.TrianglePeakToPeak < unlimited * 0.995, $"Vpp {figures.TrianglePeakToPeak} vs unlimited {unlimited}");
    }
}
