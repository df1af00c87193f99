using System.Globalization;
using PartsOpt.Search;
using PartsOpt.Topologies;
using PartsOpt.Values;

namespace PartsOpt.Planning;

/// <summary>
/// A range of preferred values that could be bought: every member of an IEC 60063 series between two
/// values, at one tolerance and one unit price.
/// </summary>
/// <param name="Kind">Resistor or capacitor.</param>
/// <param name="Series">The IEC 60063 series the values come from.</param>
/// <param name="MinValue">Smallest value, Ω or F.</param>
/// <param name="MaxValue">Largest value, Ω or F.</param>
/// <param name="Tolerance">Tolerance of the parts bought, fraction.</param>
/// <param name="UnitCost">Price of one piece.</param>
public sealed record SeriesCandidates(RoleKind Kind, ESeries Series, double MinValue, double MaxValue, double Tolerance, decimal UnitCost)
{
    /// <summary>Dielectric of the capacitors bought (C0G when null).</summary>
    public Dielectric? Dielectric { get; init; }

    /// <summary>Temperature coefficient of the resistors bought, ±ppm/K (100 when null, thick film, common practice).</summary>
    public double? TempcoPpmPerK { get; init; }

    /// <summary>Rated power of the resistors bought, W; null when not stated.</summary>
    public double? PowerRatingW { get; init; }

    /// <summary>Rated voltage of the capacitors bought, V; null when not stated.</summary>
    public double? VoltageRatingV { get; init; }
}

/// <summary>Turns ranges of preferred values into candidate stock lines with part numbers of their own.</summary>
public static class CandidateCatalogue
{
    /// <summary>The prefix of every part number the catalogue makes up: "NEW-R-4K7-F", "NEW-C-2n2-C0G-J".</summary>
    public const string PartNumberPrefix = "NEW-";

    /// <summary>
    /// A part number for a value to buy, in the characters a stock part number may hold (letters, digits, '.',
    /// '_', '-'): prefix, R or C, the IEC 60062 RKM code (µ written u), the dielectric of a capacitor, and the
    /// IEC 60062 tolerance letter ("T" and the percentage where the tolerance has no letter):
    /// "NEW-R-4K7-F" is 4.7 kΩ ±1 %, "NEW-C-1u0-X7R-K" is 1 µF X7R ±10 %.
    /// </summary>
    public static string PartNumberFor(RoleKind kind, double value, double tolerance, Dielectric? dielectric)
    {
        var capacitor = kind == RoleKind.Capacitor;
        var code = EngineeringValue.FormatRkm(value, capacitor ? Quantity.Capacitance : Quantity.Resistance).Replace('µ', 'u');
        var letter = ToleranceCode.LetterFor(Values.Tolerance.Symmetric(tolerance)) is { } l
            ? l.ToString()
            : "T" + (tolerance * 100).ToString("0.##", CultureInfo.InvariantCulture);
        return capacitor
            ? $"{PartNumberPrefix}C-{code}-{dielectric ?? Values.Dielectric.C0G}-{letter}"
            : $"{PartNumberPrefix}R-{code}-{letter}";
    }

    /// <summary>
    /// Every member of <paramref name="range"/>'s series in its range, as a stock line, leaving out a value
    /// today's stock already holds as a line of the same kind, value, tolerance (or better) and dielectric:
    /// keeping that line covers the need.
    /// </summary>
    /// <exception cref="ArgumentException">Not a resistor or capacitor range, or a range that is not positive and ordered.</exception>
    public static IReadOnlyList<StockPart> FromSeries(SeriesCandidates range, Stock existing)
    {
        ArgumentNullException.ThrowIfNull(range);
        ArgumentNullException.ThrowIfNull(existing);
        if (range.Kind is not (RoleKind.Resistor or RoleKind.Capacitor))
            throw new ArgumentException("Candidates come as resistor or capacitor ranges.", nameof(range));
        if (!(range.Tolerance >= 0 && range.Tolerance < 1))
            throw new ArgumentException("The tolerance is a fraction in [0, 1).", nameof(range));
        if (range.UnitCost < 0)
            throw new ArgumentException("The unit cost may not be negative.", nameof(range));
        var capacitor = range.Kind == RoleKind.Capacitor;
        var dielectric = range.Dielectric ?? Values.Dielectric.C0G;
        var parts = new List<StockPart>();
        foreach (var value in PreferredValues.InRange(range.Series, range.MinValue, range.MaxValue))
        {
            var held = existing.Parts.Any(p => p.Kind == range.Kind && Math.Abs(p.Value - value) <= 1e-9 * value
                && p.Tolerance <= range.Tolerance && (!capacitor || p.Dielectric == dielectric));
            if (held)
                continue;
            var partNumber = PartNumberFor(range.Kind, value, range.Tolerance, dielectric);
            parts.Add(new StockPart(partNumber, range.Kind, value, range.Tolerance, range.UnitCost, 0)
            {
                Dielectric = capacitor ? dielectric : null,
                TempcoPpmPerK = capacitor ? null : range.TempcoPpmPerK ?? 100,
                PowerRatingW = capacitor ? null : range.PowerRatingW,
                VoltageRatingV = capacitor ? range.VoltageRatingV : null,
            });
        }
        return parts;
    }
}
