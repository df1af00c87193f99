using System.Text.Json.Nodes;

namespace PartsOpt.Api.Tests.Circuits;

/// <summary>Evaluate-request bodies the circuit tests post, as JSON nodes a test can change before sending.</summary>
internal static class CircuitRequests
{
    /// <summary>
    /// An op-amp with the textbook assumptions: outputs reach the rails (no headroom) and slew so fast the
    /// edges vanish. Inputs may go a volt beyond the rails.
    /// </summary>
    public static JsonObject IdealOpAmp() => new()
    {
        ["limits"] = new JsonObject
        {
            ["sections"] = 4, ["supplyMinV"] = 3, ["supplyMaxV"] = 44, ["gainBandwidthHz"] = 1e9,
            ["slewRateVPerS"] = 1e12, ["outputHeadroomHighV"] = 0, ["outputHeadroomLowV"] = 0,
            ["inputHeadroomHighV"] = -1, ["inputHeadroomLowV"] = -1, ["inputOffsetV"] = 0,
            ["outputCurrentMaxA"] = 0.05, ["quiescentCurrentPerSectionA"] = 1e-3, ["comparator"] = false, ["openDrain"] = false,
        },
    };

    public static JsonObject Part(object value, double tolerance = 0.01) => new()
    {
        ["value"] = JsonValue.Create(value), ["tolerance"] = tolerance,
    };

    /// <summary>
    /// Relaxation oscillator with R = 10 kΩ, C = 100 nF and equal divider resistors on ±12 V: the textbook
    /// example of f = 1/(2RC·ln 3) = 455.12 Hz (Sedra & Smith, Microelectronic Circuits, chapter on signal
    /// generators and waveform-shaping circuits). Integrator 100 kΩ / 100 nF with a 1 MΩ shunt; a 10 kΩ pot
    /// between two 10 kΩ resistors sets the threshold.
    /// </summary>
    public static JsonObject ThreeStage() => new()
    {
        ["topology"] = "three-stage",
        ["supply"] = new JsonObject { ["positive"] = 12, ["negative"] = -12 },
        ["opAmp"] = IdealOpAmp(),
        ["roles"] = new JsonObject
        {
            ["osc.r"] = Part("10k"), ["osc.c"] = Part("100n", 0.05), ["osc.r1"] = Part(10e3), ["osc.r2"] = Part("10k"),
            ["int.r"] = Part("100k"), ["int.c"] = Part("100n", 0.05), ["int.rf"] = Part("1M"),
            ["cmp.ra"] = Part("10k"), ["cmp.pot"] = Part("10k", 0.2), ["cmp.rb"] = Part("10k"),
        },
        ["analysis"] = new JsonObject { ["samples"] = 500, ["seed"] = 42, ["waveformPoints"] = 200 },
    };

    /// <summary>
    /// Schmitt-and-integrator loop on ±12 V with R1 = 10 kΩ, R2 = 20 kΩ, Ri = 10 kΩ, Ci = 10 nF:
    /// f = R2/(4·R1·Ri·Ci) = 5.000 kHz, triangle ±12·R1/R2 = ±6 V (Sedra & Smith, general scheme for
    /// triangular and square waveforms).
    /// </summary>
    public static JsonObject Loop() => new()
    {
        ["topology"] = "loop",
        ["supply"] = new JsonObject { ["positive"] = 12, ["negative"] = -12 },
        ["opAmp"] = IdealOpAmp(),
        ["roles"] = new JsonObject
        {
            ["sch.r1"] = Part("10k"), ["sch.r2"] = Part("20k"), ["int.r"] = Part("10k"), ["int.c"] = Part("10n", 0.05),
            ["cmp.ra"] = Part("10k"), ["cmp.pot"] = Part("10k", 0.2), ["cmp.rb"] = Part("10k"),
        },
        ["analysis"] = new JsonObject { ["samples"] = 500, ["waveformPoints"] = 200 },
    };
}
