using System.Globalization;
using System.Text.RegularExpressions;
using PartsOpt.Values;

namespace PartsOpt.Api.Parts.Csv;

/// <summary>
/// How single cells are written and read. Every writer here is checked against its reader: a value is
/// written in the shortest form that reads back to exactly the same double, so export → import → export
/// gives the same bytes.
/// </summary>
public static partial class CsvCells
{
    private const string DecimalFormat = "0.############################";

    // Spreadsheets run cells that start with = + - @ as formulas (CSV injection). On export such a cell,
    // or one that is only apostrophes away from being one, gets one more leading apostrophe; on import
    // exactly one is removed from a cell of that shape. Every text survives the round trip.
    [GeneratedRegex("^'*[=+\\-@]")]
    private static partial Regex FormulaLike();

    public static string Neutralise(string cell) => FormulaLike().IsMatch(cell) ? "'" + cell : cell;

    public static string Restore(string cell) =>
        cell.StartsWith('\'') && FormulaLike().IsMatch(cell[1..]) ? cell[1..] : cell;

    /// <summary>"4.7 kΩ", "100 nF": the fewest significant digits that read back exactly.</summary>
    public static string Value(double value, Quantity quantity)
    {
        for (var digits = 1; digits < 17; digits++)
        {
            var text = EngineeringValue.Format(value, quantity, digits);
            if (EngineeringValue.TryParse(text, quantity, out var back) && back.Equals(value))
                return text;
        }
        return EngineeringValue.Format(value, quantity, 17);
    }

    /// <summary>The IEC 60062 letter when it reads back exactly, else percentages or ±pF.</summary>
    public static string Tolerance(Tolerance tolerance, double? capacitanceF)
    {
        if (ToleranceCode.LetterFor(tolerance) is { } letter)
        {
            var text = letter.ToString();
            if (ToleranceCode.TryParse(text, out var back, capacitanceF) && back == tolerance)
                return text;
        }
        return tolerance.ToString(); // "±5 %", "+80/−20 %", "±0.5 pF", all read by ToleranceCode.Parse
    }

    public static string Number(double value) => value.ToString("R", CultureInfo.InvariantCulture);

    public static string Number(decimal value) => value.ToString(DecimalFormat, CultureInfo.InvariantCulture);

    public static string WholeNumber(int value) => value.ToString(CultureInfo.InvariantCulture);

    public static string YesNo(bool value) => value ? "yes" : "no";

    /// <summary>V/s as V/µs, by exact decimal arithmetic so the round trip holds.</summary>
    public static string SlewRate(double voltsPerSecond) =>
        Number(decimal.Parse(Number(voltsPerSecond), NumberStyles.Float, CultureInfo.InvariantCulture) / 1_000_000m);

    public static bool TryReadSlewRate(string text, out double voltsPerSecond)
    {
        voltsPerSecond = 0;
        if (!decimal.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out var perMicrosecond))
            return false;
        try
        {
            voltsPerSecond = double.Parse(Number(perMicrosecond * 1_000_000m), CultureInfo.InvariantCulture);
            return true;
        }
        catch (OverflowException)
        {
            return false;
        }
    }

    public static bool TryReadBool(string text, out bool value)
    {
        switch (text.Trim().ToUpperInvariant())
        {
            case "YES" or "Y" or "TRUE" or "1":
                value = true;
                return true;
            case "NO" or "N" or "FALSE" or "0":
                value = false;
                return true;
            default:
                value = false;
                return false;
        }
    }
}
