using System.Globalization;

namespace PartsOpt.Values;

/// <summary>
/// Exact decimal arithmetic for the values printed on parts. A value such as 4.7 kΩ is carried as the
/// digits "47" and a power of ten, and becomes a double only at the end, through the runtime's correctly
/// rounded parser: the result is the double nearest the printed decimal (4700, never 4699.999…).
/// </summary>
internal static class DecimalText
{
    /// <summary>The double nearest to digits × 10^exponent; digits are ASCII 0–9.</summary>
    public static double ToDouble(string digits, int exponent) =>
        double.Parse($"{(digits.Length == 0 ? "0" : digits)}E{exponent}", NumberStyles.Float, CultureInfo.InvariantCulture);

    /// <summary>The double nearest to a decimal.</summary>
    public static double ToDouble(decimal value) =>
        double.Parse(value.ToString(CultureInfo.InvariantCulture), NumberStyles.Float, CultureInfo.InvariantCulture);

    /// <summary>
    /// The shortest decimal that reads back as <paramref name="value"/> (what "R" formatting prints), or
    /// null when it is beyond decimal's range.
    /// </summary>
    public static decimal? ToDecimal(double value)
    {
        var text = value.ToString("R", CultureInfo.InvariantCulture);
        return decimal.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out var result) ? result : null;
    }

    /// <summary>
    /// |value| rounded to <paramref name="significantDigits"/> digits, as the digit string and the power of
    /// ten of its first digit: 4699.9999 at 3 digits gives ("470", 3). Zero gives ("0…0", 0).
    /// </summary>
    public static (string Digits, int Exponent) Round(double value, int significantDigits)
    {
        // "E" formatting is correctly rounded on .NET Core 3.0 and later.
        var text = Math.Abs(value).ToString("E" + (significantDigits - 1).ToString(CultureInfo.InvariantCulture),
            CultureInfo.InvariantCulture);
        var e = text.IndexOf('E', StringComparison.Ordinal);
        var digits = text[..e].Replace(".", "", StringComparison.Ordinal);
        var exponent = int.Parse(text[(e + 1)..], NumberStyles.AllowLeadingSign, CultureInfo.InvariantCulture);
        return (digits, exponent);
    }

    /// <summary>
    /// Writes digits whose first digit has weight 10^(<paramref name="integerLength"/> − 1) as a decimal
    /// number, trimming trailing fractional zeros: ("470", 1) gives "4.7", ("470", 3) "470", ("5", −1) "0.05".
    /// </summary>
    public static (string Integer, string Fraction) Place(string digits, int integerLength)
    {
        string integer, fraction;
        if (integerLength <= 0)
        {
            integer = "";
            fraction = new string('0', -integerLength) + digits;
        }
        else if (integerLength >= digits.Length)
        {
            integer = digits + new string('0', integerLength - digits.Length);
            fraction = "";
        }
        else
        {
            integer = digits[..integerLength];
            fraction = digits[integerLength..];
        }
        return (integer, fraction.TrimEnd('0'));
    }
}
