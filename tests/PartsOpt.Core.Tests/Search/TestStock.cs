using PartsOpt.Search;
using PartsOpt.Topologies;
using PartsOpt.Values;

namespace PartsOpt.Tests.Search;

/// <summary>
/// Op-amp limits and stock builders for the search tests. The op-amp figures are typical data-sheet
/// values recalled for common parts (from memory); they are inputs here, never check values.
/// </summary>
internal static class TestStock
{
    /// <summary>A quad JFET-input op-amp of the TL074 kind (from memory: 13 V/µs, 3 MHz, ±1.5 V headroom).</summary>
    public static OpAmpSpec QuadJfet { get; } = new(4, 10, 36, 3e6, 13e6, 1.5, 1.5, 0.5, 3, 3e-3, 10e-3, 1.4e-3);

    /// <summary>A dual bipolar op-amp of the LM358 kind (from memory: 0.3 V/µs, 1 MHz, output to the low rail).</summary>
    public static OpAmpSpec DualBipolar { get; } = new(2, 3, 32, 1e6, 0.3e6, 1.5, 0.05, 1.5, 0, 2e-3, 20e-3, 0.35e-3);

    /// <summary>A dual JFET op-amp of the TL072 kind (from memory).</summary>
    public static OpAmpSpec DualJfet { get; } = new(2, 10, 36, 3e6, 13e6, 1.5, 1.5, 0.5, 3, 3e-3, 10e-3, 1.4e-3);

    /// <summary>A dual open-drain comparator of the LM393 kind (from memory).</summary>
    public static OpAmpSpec DualComparator { get; } = new(2, 2, 36, 1e6, 10e6, 0, 0.2, 1.5, 0, 2e-3, 16e-3, 0.2e-3,
        IsComparator: true, IsOpenDrain: true);

    /// <summary>A fast dual comparator with push-pull output (inputs to the low rail, from memory ~50 V/µs).</summary>
    public static OpAmpSpec FastComparator { get; } = new(2, 4, 36, 10e6, 50e6, 0.5, 0.2, 1.5, 0, 1e-3, 20e-3, 1e-3,
        IsComparator: true);

    public static StockPart Resistor(string partNumber, double ohms, decimal cost, int available = 10_000) =>
        new(partNumber, RoleKind.Resistor, ohms, 0.01, cost, available) { TempcoPpmPerK = 100, PowerRatingW = 0.125 };

    public static StockPart Capacitor(string partNumber, double farads, decimal cost, Dielectric dielectric = Dielectric.C0G,
        int available = 10_000) =>
        new(partNumber, RoleKind.Capacitor, farads, 0.05, cost, available) { Dielectric = dielectric, VoltageRatingV = 50 };

    public static StockPart Pot(string partNumber, double ohms, decimal cost, int available = 10_000) =>
        new(partNumber, RoleKind.Potentiometer, ohms, 0.2, cost, available) { PowerRatingW = 0.25 };

    public static StockOpAmp OpAmp(string partNumber, OpAmpSpec spec, decimal cost, int available = 10_000) =>
        new(partNumber, spec, cost, available);

    /// <summary>The team's question: 20 kHz ±10 %, duty 5–95 % by potentiometer, ±12 V, 100 boards.</summary>
    public static SearchRequirement PwmAt20Kilohertz(params TopologyKind[] topologies) =>
        new(Supply.Symmetric(12), new Band(20e3, 0.10), new DutyRequirement(0.05, 0.95), 100)
        {
            Topologies = topologies.Length > 0 ? topologies : null,
            Costs = new CostModel(0.02m, 5.00m),
        };

    /// <summary>A small stockroom of common values (E6 resistors, C0G timing capacitors, X7R decoupling).</summary>
    public static Stock Stockroom(params StockOpAmp[] opAmps) => new(
    [
        Resistor("R-1K0", 1e3, 0.010m),
        Resistor("R-2K2", 2.2e3, 0.010m),
        Resistor("R-4K7", 4.7e3, 0.010m),
        Resistor("R-10K", 10e3, 0.010m),
        Resistor("R-22K", 22e3, 0.012m),
        Resistor("R-47K", 47e3, 0.012m),
        Resistor("R-100K", 100e3, 0.015m),
        Capacitor("C-1N0", 1e-9, 0.05m),
        Capacitor("C-2N2", 2.2e-9, 0.05m),
        Capacitor("C-4N7", 4.7e-9, 0.06m),
        Capacitor("C-10N", 10e-9, 0.07m),
        Capacitor("C-100N", 100e-9, 0.02m, Dielectric.X7R),
        Pot("RV-10K", 10e3, 0.40m),
        Pot("RV-50K", 50e3, 0.45m),
    ],
    opAmps.Length > 0 ? opAmps : [OpAmp("TL074", QuadJfet, 0.35m), OpAmp("LM358", DualBipolar, 0.12m), OpAmp("CMP-FAST", FastComparator, 0.60m)]);
}
