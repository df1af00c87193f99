using PartsOpt.Simulation;

namespace PartsOpt.Tests.Simulation;

/// <summary>Odd but valid circuits end with a reported outcome, never a hang or an exception.</summary>
public class SimulatorRobustnessTests
{
    [Fact]
    public void OddCircuitsAlwaysEndWithAnOutcome()
    {
        var random = new Random(20261202);
        var options = new SimulationOptions { MaxSteps = 50_000, OutputPoints = 100 };
        for (var n = 0; n < 40; n++)
        {
            var topology = (SimulatedTopology)(n % 3);
            var circuit = new SimulatedCircuit
            {
                Topology = topology,
                SupplyPositive = 12,
                SupplyNegative = random.NextDouble() < 0.5 ? -12 : 0,
                Reference = random.NextDouble() * 14 - 7,
                Threshold = random.NextDouble() * 30 - 15,
                Oscillator = RandomSection(random),
                Integrator = RandomSection(random),
                Comparator = RandomSection(random),
                OscR = LogUniform(random, 1e3, 1e6),
                OscC = LogUniform(random, 1e-9, 1e-6),
                OscR1 = LogUniform(random, 1e3, 1e6),
                OscR2 = LogUniform(random, 1e3, 1e6),
                IntR = LogUniform(random, 1e3, 1e6),
                IntC = LogUniform(random, 1e-9, 1e-6),
                IntRf = random.NextDouble() < 0.3 ? double.PositiveInfinity : LogUniform(random, 1e3, 1e7),
                SchR1 = LogUniform(random, 1e3, 1e5),
                SchR2 = LogUniform(random, 1e3, 1e5),
            };

            var result = TransientSimulator.Run(circuit, options);

            Assert.True(result.Steps <= options.MaxSteps, $"case {n}: {result.Steps} steps");
            // Exact segments make no case stiff: each one settles, is measured, or is reported as not oscillating.
            Assert.True(result.Outcome != SimulationOutcome.WorkLimitReached, $"case {n}: {result.Reason}");
            Assert.Equal(result.Outcome == SimulationOutcome.Measured, result.Figures is not null);
            Assert.Equal(result.Outcome == SimulationOutcome.Measured, result.Reason is null);
            if (result.Figures is { } figures)
            {
                Assert.True(figures.Frequency > 0, $"case {n}: frequency {figures.Frequency}");
                Assert.InRange(figures.DutyCycle, 0, 1);
                Assert.InRange(figures.HighTime + figures.LowTime, 0.999 / figures.Frequency, 1.001 / figures.Frequency);
            }
        }
    }

    private static OpAmpSection RandomSection(Random random) => new(
        random.NextDouble() * 3,
        random.NextDouble() * 3,
        random.NextDouble() < 0.3 ? double.PositiveInfinity : LogUniform(random, 1e4, 1e8));

    private static double LogUniform(Random random, double low, double high) =>
        low * Math.Pow(high / low, random.NextDouble());
}
