using PartsOpt.Simulation;

namespace PartsOpt.Tests.Simulation;

public class SimulatorLimitsTests
{
    [Fact]
    public void SingleSupplyWithoutMidRailReferenceIsReportedAsNotOscillating()
    {
        // 0/12 V supply, output limits 1.5…10.5 V, but the ground returns go to 0 V instead of mid-rail: the lower
        // threshold β·1.5 V = 0.75 V lies below the lowest output, so the capacitor never gets there
        // (REFERENCE.md: the capacitor runs between βL− and βL+ about the reference).
        var circuit = TestCircuits.RcRamp() with
        {
            SupplyNegative = 0,
            Reference = 0,
            Oscillator = new OpAmpSection(1.5, 1.5, double.PositiveInfinity),
        };
        var result = TransientSimulator.Run(circuit);

        Assert.Equal(SimulationOutcome.DoesNotOscillate, result.Outcome);
        Assert.False(result.Oscillates);
        Assert.Null(result.Figures);
        Assert.Equal(1.5, result.Oscillator.Value[^1]);
        // It stops once the capacitor has come to rest (≈ 20·RC = 20 ms), before the silence limit of
        // 20 estimated periods (44 ms), and far from the step cap.
        Assert.Contains("came to rest", result.Reason, StringComparison.Ordinal);
        Assert.InRange(result.SimulatedTime, 0.005, 0.044);
    }

    [Fact]
    public void SlowDriftWithoutSwitchingStopsAtTheSilenceLimit()
    {
        // As above, but β = 1/101: the estimated period 2RC·ln((1+β)/(1−β)) ≈ 0.04·RC is far shorter than the
        // capacitor's creep towards rest (tens of RC), so the silence limit of 20 estimated periods ends the run.
        var circuit = TestCircuits.RcRamp(r1: 100e3, r2: 1e3) with
        {
            SupplyNegative = 0,
            Reference = 0,
            Oscillator = new OpAmpSection(1.5, 1.5, double.PositiveInfinity),
        };
        var result = TransientSimulator.Run(circuit);

        Assert.Equal(SimulationOutcome.DoesNotOscillate, result.Outcome);
        Assert.Contains("has not risen", result.Reason, StringComparison.Ordinal);
        var beta = 1.0 / 101;
        var silence = 20 * 2 * 10e3 * 100e-9 * Math.Log((1 + beta) / (1 - beta));
        Precision.AlmostEqualRelative(silence, result.SimulatedTime, 0.01, "run length = silence limit");
    }

    [Fact]
    public void StepCapStopsTheRunWithAFlag()
    {
        var result = TransientSimulator.Run(TestCircuits.Loop(), new SimulationOptions { MaxSteps = 100 });

        Assert.Equal(SimulationOutcome.WorkLimitReached, result.Outcome);
        Assert.Equal(100, result.Steps);
        Assert.Contains("MaxSteps", result.Reason, StringComparison.Ordinal);
        Assert.Null(result.Figures);
    }

    [Fact]
    public void EventCapStopsTheRunWithAFlag()
    {
        var result = TransientSimulator.Run(TestCircuits.Loop(), new SimulationOptions { MaxEvents = 12 });

        Assert.Equal(SimulationOutcome.WorkLimitReached, result.Outcome);
        Assert.Contains("MaxEvents", result.Reason, StringComparison.Ordinal);
        Assert.True(result.Oscillates, "two Schmitt periods (about 4 events each) fit in twelve events");
    }

    [Fact]
    public void WaveformsAreReducedToAtMostTheRequestedPointsWithTheirEndpoints()
    {
        var full = TransientSimulator.Run(TestCircuits.ThreeStage(20e3), new SimulationOptions { OutputPoints = int.MaxValue });
        var reduced = TransientSimulator.Run(TestCircuits.ThreeStage(20e3), new SimulationOptions { OutputPoints = 51 });

        foreach (var (whole, part) in new[]
                 {
                     (full.Oscillator, reduced.Oscillator), (full.Capacitor!, reduced.Capacitor!),
                     (full.IntegratorOutput!, reduced.IntegratorOutput!), (full.ComparatorOutput, reduced.ComparatorOutput),
                 })
        {
            Assert.True(whole.Time.Count > 51, $"{whole.Name}: the full trace should be longer than the request");
            Assert.InRange(part.Time.Count, 2, 51);
            Assert.Equal(part.Time.Count, part.Value.Count);
            Assert.Equal(0, part.Time[0]);
            Assert.Equal(reduced.SimulatedTime, part.Time[^1]);
            Assert.Equal(whole.Value[^1], part.Value[^1]);
            // Min/max buckets keep the extremes of the whole trace.
            Assert.Equal(whole.Value.Max(), part.Value.Max());
            Assert.Equal(whole.Value.Min(), part.Value.Min());
        }
    }

    [Fact]
    public void ReductionKeepsANarrowSpike()
    {
        var time = Enumerable.Range(0, 10_001).Select(i => i * 1e-6).ToList();
        var value = time.Select((_, i) => i == 4321 ? 5.0 : 0.0).ToList();

        var reduced = WaveformReduction.Reduce("spike", time, value, 10);

        Assert.InRange(reduced.Time.Count, 2, 10);
        Assert.Contains(5.0, reduced.Value);
        Assert.Equal(0, reduced.Time[0]);
        Assert.Equal(0.01, reduced.Time[^1], 12);
        Assert.Equal(reduced.Time.Order(), reduced.Time);
    }

    [Fact]
    public void InvalidInputsAreRejectedByName()
    {
        var badPart = Assert.Throws<ArgumentException>(() => TransientSimulator.Run(TestCircuits.RcRamp() with { OscC = -1e-9 }));
        Assert.Equal("OscC", badPart.ParamName);
        var noSwing = Assert.Throws<ArgumentException>(() => TransientSimulator.Run(
            TestCircuits.Loop() with { Comparator = new OpAmpSection(13, 13, 1e6) }));
        Assert.Equal("Comparator", noSwing.ParamName);
        var badOptions = Assert.Throws<ArgumentException>(() => TransientSimulator.Run(
            TestCircuits.Loop(), new SimulationOptions { OutputPoints = 1 }));
        Assert.Equal("OutputPoints", badOptions.ParamName);
    }
}
