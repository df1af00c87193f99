using PartsOpt.Simulation;

namespace PartsOpt.Tests.Simulation;

public class LoopTests
{
    [Fact]
    public void TextbookLoopGivesFiveKilohertzAndSixVoltPeaks()
    {
        var result = TransientSimulator.Run(TestCircuits.Loop());
        var figures = TestCircuits.Figures(result);

        // ±12 V, R1 = 10 kΩ, R2 = 20 kΩ, Ri = 10 kΩ, Ci = 10 nF → f = R2/(4·R1·Ri·Ci) = 5.000 kHz and
        // triangle ±L·R1/R2 = ±6 V: Sedra & Smith, general scheme for triangular and square waveforms (REFERENCE.md).
        Precision.AlmostEqualRelative(5000, figures.Frequency, 0.01, "frequency");
        Precision.AlmostEqualRelative(12, figures.TrianglePeakToPeak, 0.01, "triangle peak-to-peak");
        Precision.AlmostEqualAbsolute(0, figures.TriangleCentre, 0.01 * 6, "triangle centre");
        // The loop is all straight lines, so the simulation should be essentially exact.
        Precision.AlmostEqualRelative(5000, figures.Frequency, 1e-6, "frequency, tight");
        Assert.True(result.Oscillates);
        Assert.Null(result.Capacitor);
        Assert.Equal("schmitt", result.Oscillator.Name);
    }

    [Fact]
    public void SwitchingInstantsDoNotDependOnTheStep()
    {
        // A step of a seventh of the period: every switch still lands on its exact instant, because the
        // crossing is located inside the step rather than taken at the step's end. Sedra & Smith, as above.
        var figures = TestCircuits.Figures(TransientSimulator.Run(TestCircuits.Loop(threshold: 2),
            new SimulationOptions { MaxStep = 200e-6 / 7 }));

        Precision.AlmostEqualRelative(5000, figures.Frequency, 1e-6, "frequency");
        // D = (Vp − Vth)/(2·Vp) (REFERENCE.md, comparator and duty).
        Precision.AlmostEqualAbsolute((6 - 2) / 12.0, figures.DutyCycle, 1e-6, "duty");
    }

    [Fact]
    public void SlewLimitedIntegratorSlowsTheRamp()
    {
        // The ideal ramp slope is L/(Ri·Ci) = 12 V / 100 µs = 120 kV/s; limit the integrator to 60 kV/s.
        var circuit = TestCircuits.Loop() with { Integrator = new OpAmpSection(0, 0, 60e3) };
        var figures = TestCircuits.Figures(TransientSimulator.Run(circuit));

        // The thresholds stay at ±L·R1/R2 = ±6 V (Sedra & Smith, as above); each 12 V ramp now runs at the slew
        // rate, so T = 2·12 V / SR and f = 2.5 kHz (derived from the slew-limited model).
        Precision.AlmostEqualRelative(12, figures.TrianglePeakToPeak, 0.01, "triangle peak-to-peak");
        Precision.AlmostEqualRelative(60e3 / (2 * 12), figures.Frequency, 0.01, "frequency");
    }

    [Fact]
    public void LoopWithR1NotBelowR2IsReportedAsNotOscillating()
    {
        // Peak would be L·R1/R2 = 18 V, beyond the 12 V the integrator can reach (REFERENCE.md: needs R1 < R2).
        var result = TransientSimulator.Run(TestCircuits.Loop(schR1: 30e3, schR2: 20e3));

        Assert.Equal(SimulationOutcome.DoesNotOscillate, result.Outcome);
        Assert.False(result.Oscillates);
        Assert.Null(result.Figures);
        // Once the integrator is clamped nothing can move again: the run stops at once rather than waiting out
        // the silence limit of 20 estimated periods (4·R1·Ri·Ci/R2 = 0.6 ms each).
        Assert.Contains("came to rest", result.Reason, StringComparison.Ordinal);
        Assert.True(result.SimulatedTime < 0.6e-3, $"ran {result.SimulatedTime} s");
        // The integrator sits clamped at its low limit: the run shows why it stopped.
        Assert.Equal(-12, result.IntegratorOutput!.Value[^1]);
    }
}
