using PartsOpt.Simulation;

namespace PartsOpt.Tests.Simulation;

/// <summary>Circuits the simulation tests share. Part values are the textbook examples named in each test.</summary>
internal static class TestCircuits
{
    /// <summary>Relaxation oscillator on ±12 V ideal rails: R = 10 kΩ, C = 100 nF, equal divider resistors.</summary>
    public static SimulatedCircuit RcRamp(double r1 = 10e3, double r2 = 10e3, double threshold = 0) => new()
    {
        Topology = SimulatedTopology.RcRamp,
        SupplyPositive = 12,
        SupplyNegative = -12,
        OscR = 10e3,
        OscC = 100e-9,
        OscR1 = r1,
        OscR2 = r2,
        Threshold = threshold,
    };

    /// <summary>The same oscillator driving an integrator Ri = 10 kΩ, Ci = 220 nF with shunt <paramref name="rf"/>.</summary>
    public static SimulatedCircuit ThreeStage(double rf, double ci = 220e-9) => RcRamp() with
    {
        Topology = SimulatedTopology.ThreeStage,
        IntR = 10e3,
        IntC = ci,
        IntRf = rf,
    };

    /// <summary>Sedra &amp; Smith's Schmitt-and-integrator loop: ±12 V, R1 = 10 kΩ, R2 = 20 kΩ, Ri = 10 kΩ, Ci = 10 nF.</summary>
    public static SimulatedCircuit Loop(double schR1 = 10e3, double schR2 = 20e3, double threshold = 0) => new()
    {
        Topology = SimulatedTopology.Loop,
        SupplyPositive = 12,
        SupplyNegative = -12,
        SchR1 = schR1,
        SchR2 = schR2,
        IntR = 10e3,
        IntC = 10e-9,
        Threshold = threshold,
    };

    /// <summary>A result's figures, failing the test with the run's reason when there are none.</summary>
    public static SteadyStateFigures Figures(SimulationResult result)
    {
        Assert.True(result.Outcome == SimulationOutcome.Measured, $"{result.Outcome}: {result.Reason}");
        return result.Figures!;
    }
}
