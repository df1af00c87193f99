using System.Collections.ObjectModel;
using System.Globalization;

namespace PartsOpt.Values;

/// <summary>
/// The IEC 60063:2015 preferred values: each series' mantissas in a decade, its members across decades as
/// the exact decimals printed on parts (4700, never 4699.999…), snapping to the nearest member and telling
/// which series a value belongs to.
/// </summary>
public static class PreferredValues
{
    // IEC 60063: E24 and below keep their historical values, which are not the rounded geometric series
    // (2.7 3.0 3.3 3.6 3.9 4.3 4.7 8.2 differ from round(10^(i/24), 1)).
    private static readonly decimal[] E24 =
    [
        1.0m, 1.1m, 1.2m, 1.3m, 1.5m, 1.6m, 1.8m, 2.0m, 2.2m, 2.4m, 2.7m, 3.0m,
        3.3m, 3.6m, 3.9m, 4.3m, 4.7m, 5.1m, 5.6m, 6.2m, 6.8m, 7.5m, 8.2m, 9.1m,
    ];

    private static readonly ReadOnlyCollection<decimal>[] Mantissas =
        Enum.GetValues<ESeries>().Select(s => Array.AsReadOnly(Build(s))).ToArray();

    private static readonly ReadOnlyCollection<double>[] MantissaDoubles =
        Mantissas.Select(m => Array.AsReadOnly(m.Select(DecimalText.ToDouble).ToArray())).ToArray();

    /// <summary>How many values the series holds per decade (3 for E3 … 192 for E192).</summary>
    public static int Count(ESeries series) => series switch
    {
        ESeries.E3 => 3,
        ESeries.E6 => 6,
        ESeries.E12 => 12,
        ESeries.E24 => 24,
        ESeries.E48 => 48,
        ESeries.E96 => 96,
        ESeries.E192 => 192,
        _ => throw new ArgumentOutOfRangeException(nameof(series), series, "Unknown series."),
    };

    /// <summary>The series' mantissas in [1, 10), ascending: E24 gives 1.0, 1.1, 1.2 … 9.1.</summary>
    public static IReadOnlyList<double> Decade(ESeries series) => MantissaDoubles[Index(series)];

    /// <summary>The series' mantissas in [1, 10) as exact decimals.</summary>
    public static IReadOnlyList<decimal> DecadeExact(ESeries series) => Mantissas[Index(series)];

    /// <summary>
    /// Every member of the series in [<paramref name="min"/>, <paramref name="max"/>], ascending, across
    /// decades, each the double nearest its printed decimal (4.7 kΩ is exactly 4700). A member within a
    /// relative 1e-12 of a bound counts as inside, so bounds computed in floating point do not drop it.
    /// </summary>
    /// <exception cref="ArgumentOutOfRangeException">A bound is not positive and finite, or min &gt; max.</exception>
    public static IEnumerable<double> InRange(ESeries series, double min, double max)
    {
        RequirePositive(min, nameof(min));
        RequirePositive(max, nameof(max));
        if (min > max)
            throw new ArgumentOutOfRangeException(nameof(max), max, $"The range is empty: max is below min ({min}).");
        var mantissas = DecadeExact(series);
        return Iterate();

        IEnumerable<double> Iterate()
        {
            var low = min * (1 - 1e-12);
            var high = max * (1 + 1e-12);
            for (var decade = Decade(min) - 1; decade <= Decade(max); decade++)
            {
                foreach (var mantissa in mantissas)
                {
                    var value = Member(mantissa, decade);
                    if (value > high)
                        yield break;
                    if (value >= low)
                        yield return value;
                }
            }
        }
    }

    /// <summary>
    /// The member of the series nearest to <paramref name="value"/> in log distance (the ratio, not the
    /// difference: 9.6 snaps to 10 in E12 rather than 8.2; 4.5 kΩ to 4.7 kΩ in E24 though it is 200 Ω
    /// from 4.3 kΩ too).
    /// </summary>
    /// <exception cref="ArgumentOutOfRangeException">The value is not positive and finite.</exception>
    public static double Nearest(double value, ESeries series)
    {
        RequirePositive(value, nameof(value));
        var mantissas = DecadeExact(series);
        var decade = Decade(value);
        var best = Member(1m, decade + 1);
        var bestDistance = Math.Abs(Math.Log(best / value));
        // Candidates: every member of this decade, and 10^(decade+1) as the first of the next.
        for (var i = mantissas.Count - 1; i >= 0; i--)
        {
            var candidate = Member(mantissas[i], decade);
            var distance = Math.Abs(Math.Log(candidate / value));
            if (distance < bestDistance)
                (best, bestDistance) = (candidate, distance);
        }
        return best;
    }

    /// <summary>
    /// True when <paramref name="value"/> is a member of the series within a relative
    /// <paramref name="relativeTolerance"/> (in any decade).
    /// </summary>
    public static bool Contains(ESeries series, double value, double relativeTolerance = 1e-9)
    {
        if (!(value > 0) || !double.IsFinite(value))
            return false;
        var nearest = Nearest(value, series);
        return Math.Abs(nearest - value) <= relativeTolerance * nearest;
    }

    /// <summary>
    /// The first series, in the order E3, E6, E12, E24, E48, E96, E192, that holds <paramref name="value"/>,
    /// or null when none does. E24 is not inside E48: 4.7 kΩ gives E6, 4.99 kΩ gives E48, 4.3 kΩ E24.
    /// </summary>
    public static ESeries? SmallestSeriesContaining(double value, double relativeTolerance = 1e-9)
    {
        foreach (var series in Enum.GetValues<ESeries>())
        {
            if (Contains(series, value, relativeTolerance))
                return series;
        }
        return null;
    }

    /// <summary>
    /// The tolerance each series is meant for (IEC 60063): E6 0.20, E12 0.10, E24 0.05, E48 0.02, E96 0.01,
    /// E192 0.005. IEC 60063 gives E3 only as "wider than 20 %" (from memory); 0.40 is returned for it,
    /// which is common practice and about where E3's neighbours' bands meet (step 10^(1/3) ≈ 2.15).
    /// </summary>
    public static double NominalTolerance(ESeries series) => series switch
    {
        ESeries.E3 => 0.40,
        ESeries.E6 => 0.20,
        ESeries.E12 => 0.10,
        ESeries.E24 => 0.05,
        ESeries.E48 => 0.02,
        ESeries.E96 => 0.01,
        ESeries.E192 => 0.005,
        _ => throw new ArgumentOutOfRangeException(nameof(series), series, "Unknown series."),
    };

    /// <summary>Reads a series name: "E24", "e24", " E96 ".</summary>
    /// <exception cref="ArgumentException">The text names no series; the message names the text.</exception>
    public static ESeries Parse(string name)
    {
        var t = name?.Trim() ?? "";
        if (t.Length > 1 && t[0] is 'E' or 'e' && t[1..].All(char.IsAsciiDigit)
            && Enum.TryParse<ESeries>("E" + t[1..], ignoreCase: false, out var series) && Enum.IsDefined(series))
            return series;
        throw new ArgumentException(
            $"'{name}' is not an IEC 60063 series: expected E3, E6, E12, E24, E48, E96 or E192.", nameof(name));
    }

    /// <summary>The member with this mantissa in decade 10^<paramref name="decade"/>, as the nearest double.</summary>
    private static double Member(decimal mantissa, int decade)
    {
        var text = mantissa.ToString(CultureInfo.InvariantCulture);
        return double.Parse($"{text}E{decade}", NumberStyles.Float, CultureInfo.InvariantCulture);
    }

    /// <summary>The power of ten of the decade holding <paramref name="value"/>, robust to log10 rounding.</summary>
    private static int Decade(double value)
    {
        var decade = (int)Math.Floor(Math.Log10(value));
        if (Member(1m, decade) > value)
            decade--;
        else if (Member(1m, decade + 1) <= value)
            decade++;
        return decade;
    }

    private static void RequirePositive(double value, string name)
    {
        if (!(value > 0) || !double.IsFinite(value))
            throw new ArgumentOutOfRangeException(name, value, "A preferred value is positive and finite.");
    }

    private static int Index(ESeries series) =>
        Enum.IsDefined(series) ? (int)series : throw new ArgumentOutOfRangeException(nameof(series), series, "Unknown series.");

    private static decimal[] Build(ESeries series)
    {
        var n = Count(series);
        if (n <= 24)
            return E24.Where((_, i) => i % (24 / n) == 0).ToArray(); // E12 every second E24 value, E6 every fourth, E3 every eighth
        // IEC 60063: E48, E96 and E192 are 10^(i/N) rounded to three significant digits, except that E192
        // keeps 9.20 where the rule gives 9.19 (10^(185/192) = 9.1948…). No member lies near a rounding
        // midpoint (the closest is 0.0012 of a unit in the last place away), so double is exact enough.
        var values = new decimal[n];
        for (var i = 0; i < n; i++)
            values[i] = (decimal)Math.Round(Math.Pow(10, (double)i / n) * 100, MidpointRounding.AwayFromZero) / 100;
        if (series == ESeries.E192)
            values[185] = 9.20m;
        return values;
    }
}
