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
    /// <summary>The prefix of every part number the catalogue makes up: "NEW-R-4K7-1%", "NEW-C-2N2-C0G-5%".</summary>
    public const string PartNumberPrefix = "NEW-";

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
            var quantity = capacitor ? Quantity.Capacitance : Quantity.Resistance;
            var percent = (range.Tolerance * 100).ToString("0.##", CultureInfo.InvariantCulture);
            var partNumber = capacitor
                ? $"{PartNumberPrefix}C-{EngineeringValue.FormatRkm(value, quantity)}-{dielectric}-{percent}%"
                : $"{PartNumberPrefix}R-{EngineeringValue.FormatRkm(value, quantity)}-{percent}%";
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
