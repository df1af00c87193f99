using PartsOpt.Topologies;
using PartsOpt.Values;

namespace PartsOpt.Benchmarks;

/// <summary>Designs the benchmarks evaluate: realistic values and limits, invented for the purpose.</summary>
internal static class BenchmarkDesigns
{
    private static readonly OpAmpSpec Amp = new(4, 7, 36, 3e6, 13e6, 1.5, 1.2, 1.5, 1.5, 2e-3, 0.02, 1.4e-3);

    private static RolePart R(double ohms) => RolePart.Resistor(ohms, 0.01, 100, 0.125);

    private static RolePart C(double farads) => RolePart.Capacitor(farads, 0.05, Dielectric.C0G, 50);

    /// <summary>
    /// A 20 kHz three-stage generator on ±12 V with a potentiometer threshold. The 100 kΩ resistors around
    /// the 10 kΩ pot put both threshold ends (±0.57 V) inside the ±1.27 V triangle, as a working design has
    /// them, so every evaluation finds both duty crossings.
    /// </summary>
    public static CircuitDesign ThreeStage() => new(
        TopologyKind.ThreeStage,
        Supply.Symmetric(12),
        Amp,
        new Dictionary<string, RolePart>
        {
            [Roles.OscR] = R(2.2e3), [Roles.OscC] = C(10e-9), [Roles.OscR1] = R(10e3), [Roles.OscR2] = R(10e3),
            [Roles.IntR] = R(100e3), [Roles.IntC] = C(1e-9), [Roles.IntRf] = R(1e6),
            [Roles.CmpRa] = R(100e3), [Roles.CmpPot] = R(10e3), [Roles.CmpRb] = R(100e3),
        },
        DutyControl.Potentiometer);
}
