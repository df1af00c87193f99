using PartsOpt.Analysis;
using PartsOpt.Values;

namespace PartsOpt.Topologies;

/// <summary>
/// The part filling one role of a circuit: its nominal value, tolerance and the ratings the checks use.
/// </summary>
/// <param name="Value">Nominal value in SI units: Ω for resistors and potentiometers, F for capacitors.</param>
/// <param name="ToleranceMinus">Lower tolerance as a positive fraction (0.05 for −5 %).</param>
/// <param name="TolerancePlus">Upper tolerance as a positive fraction (0.80 for +80 %).</param>
/// <param name="Temperature">How the value drifts with temperature; null where unknown or negligible.</param>
/// <param name="PartNumber">The stock part number, if the part comes from stock.</param>
/// <param name="PowerRatingW">Rated power of a resistor or potentiometer, W; null when not known.</param>
/// <param name="VoltageRatingV">Rated voltage of a capacitor, V; null when not known.</param>
/// <param name="Dielectric">Dielectric of a capacitor; null for resistors or when not known.</param>
/// <param name="IsPolarised">True for a polarised capacitor (electrolytic, tantalum).</param>
public sealed record RolePart(
    double Value,
    double ToleranceMinus,
    double TolerancePlus,
    TemperatureBehaviour? Temperature = null,
    string? PartNumber = null,
    double? PowerRatingW = null,
    double? VoltageRatingV = null,
    Dielectric? Dielectric = null,
    bool IsPolarised = false)
{
    /// <summary>A resistor with a symmetric tolerance and a linear temperature coefficient.</summary>
    public static RolePart Resistor(double ohms, double tolerance, double ppmPerK = 100, double? powerRatingW = null,
        string? partNumber = null) =>
        new(ohms, tolerance, tolerance, TemperatureBehaviour.Linear(ppmPerK), partNumber, powerRatingW);

    /// <summary>
    /// A capacitor with a symmetric tolerance; its temperature behaviour and polarity come from the
    /// dielectric (<see cref="DielectricCharacteristics"/>).
    /// </summary>
    public static RolePart Capacitor(double farads, double tolerance, Dielectric dielectric, double? voltageRatingV = null,
        string? partNumber = null) =>
        new(farads, tolerance, tolerance, DielectricCharacteristics.For(dielectric), partNumber, null, voltageRatingV,
            dielectric, DielectricCharacteristics.IsPolarised(dielectric));
}
