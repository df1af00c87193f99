using PartsOpt.Simulation;

namespace PartsOpt.Tests.Simulation;

/// <summary>The whole three-stage chain: oscillator, shunted integrator, comparator.</summary>
public class ThreeStageChainTests
{
    [Theory]
    [InlineData(0.0)]
    [InlineData(1.5)]
    [InlineData(-2.5)]
    public void DutyFollowsTheTimeAboveThresholdOnTheShuntedIntegratorsSegments(double threshold)
    {
        const double vs = 12, ri = 10e3, rf = 20e3, ci = 220e-9;
        var circuit = TestCircuits.ThreeStage(rf, ci) with { Threshold = threshold };
        var figures = TestCircuits.Figures(TransientSimulator.Run(circuit, new SimulationOptions { SettlePeriods = 40 }));

        // Each half period the integrator output is an exponential with τ = Rf·Ci towards ∓(Rf/Ri)·Vs = ∓A, between
        // the peaks ±Vp, Vp = A·tanh(T/(4τ)) (REFERENCE.md, integrator, derived). Time above Vth (derived here):
        // falling half, from +Vp towards −A: τ·ln((Vp + A)/(Vth + A)); rising half, from −Vp towards +A, above Vth
        // from τ·ln((A + Vp)/(A − Vth)) to T/2. T is the measured period.
        double period = 1 / figures.Frequency, tau = rf * ci, a = rf / ri * vs;
        var vp = a * Math.Tanh(period / (4 * tau));
        var above = tau * Math.Log((vp + a) / (threshold + a)) + period / 2 - tau * Math.Log((a + vp) / (a - threshold));
        Precision.AlmostEqualAbsolute(above / period, figures.DutyCycle, 0.002, $"duty at Vth = {threshold} V");
        Precision.AlmostEqualRelative(2 * vp, figures.TrianglePeakToPeak, 0.01, "Vpp");
    }
}
