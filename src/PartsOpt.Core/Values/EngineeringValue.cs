using System.Globalization;
using System.Text.RegularExpressions;

namespace PartsOpt.Values;

/// <summary>
/// Reads and writes part values the way the trade writes them: numbers with SI prefixes and units
/// ("4.7 kΩ", "100nF"), plain and scientific numbers ("4700", "4.7e3") and IEC 60062 RKM codes ("4K7",
/// "R47", "4n7"). Values are SI units in <see cref="double"/>, and a parsed value is always the double
/// nearest the decimal that was written.
/// </summary>
/// <remarks>
/// Reading rules:
/// <list type="bullet">
/// <item>Surrounding whitespace is ignored; whitespace (also the no-break spaces of typeset text) may
/// separate the number from prefix and unit, but not the prefix from the unit.</item>
/// <item>Prefixes f p n u/µ m k M G T. "m" is milli and "M" mega; "K" is read as kilo too (RKM writes 4K7).</item>
/// <item>Units by symbol (Ω F H V A Hz W s; case as SI writes them, plus "v" and "w") or by word,
/// any case ("ohm", "kohm", "farad", "volts", "hz"). After a prefix, "f" and "h" are farad and henry ("100uf").
/// A ratio takes no unit but may end in "%".</item>
/// <item>RKM (IEC 60062): digits with one letter standing for the decimal point and the multiplier: a prefix
/// letter, R for ohms, or the quantity's own one-letter unit (F, H, V, A, W: "3V3" = 3.3 V). An RKM code
/// takes no unit after it.</item>
/// <item>A comma is never taken for a decimal separator (nor for thousands): "1,5k" is an error.</item>
/// <item>Voltage and current may be negative; every other quantity is an error when negative, since a part
/// value or a frequency never is.</item>
/// <item>NaN, infinity and values beyond double's range (or so small they underflow to zero) are errors.</item>
/// </list>
/// </remarks>
public static partial class EngineeringValue
{
    /// <summary>Reads <paramref name="text"/> as a value of <paramref name="quantity"/> in SI units.</summary>
    /// <exception cref="ValueFormatException">The text is not such a value; the message says why.</exception>
    public static double Parse(string text, Quantity quantity) =>
        Read(text, quantity, out var value) is { } reason ? throw new ValueFormatException(text, quantity, reason) : value;

    /// <summary>Reads <paramref name="text"/> as a value of <paramref name="quantity"/>; false when it is not one.</summary>
    public static bool TryParse(string? text, Quantity quantity, out double value) => Read(text, quantity, out value) is null;

    /// <summary>Reads a value; returns null on success or the reason it failed.</summary>
    private static string? Read(string? text, Quantity quantity, out double value)
    {
        value = 0;
        var unit = QuantityUnit.Of(quantity);
        if (string.IsNullOrWhiteSpace(text))
            return "the text is empty";
        var t = text.Trim();
        if (t.Contains(',', StringComparison.Ordinal))
            return "a comma is not read as a decimal separator; write a point (1.5k)";

        var negative = false;
        if (t[0] is '-' or '\u2212' or '+')
        {
            negative = t[0] != '+';
            if (negative && !unit.MayBeNegative)
                return $"a {unit.Noun} value is never negative";
            t = t[1..];
        }

        string integer, fraction;
        long exponent;
        var rkm = RkmPattern().Match(t);
        // A ratio has no RKM code: its letters would be prefixes, which a ratio does not take.
        if (rkm.Success && unit.Symbol.Length > 0 && RkmMarker(rkm.Groups["mark"].Value[0], unit) is { } markExponent)
        {
            integer = rkm.Groups["int"].Value;
            fraction = rkm.Groups["frac"].Value;
            exponent = markExponent;
            if (integer.Length + fraction.Length == 0)
                return "an RKM code needs digits around its letter";
        }
        else
        {
            var number = NumberPattern().Match(t);
            if (!number.Success)
                return "it does not start with a number";
            integer = number.Groups["int"].Value;
            fraction = number.Groups["frac"].Value;
            exponent = 0;
            if (number.Groups["exp"].Success)
            {
                var exp = number.Groups["exp"].Value;
                // More than six exponent digits is far outside any double, and would overflow a long.
                if (exp.TrimStart('+', '-').TrimStart('0').Length > 6)
                    return "the exponent is out of range";
                exponent = long.Parse(exp, NumberStyles.AllowLeadingSign, CultureInfo.InvariantCulture);
            }
            if (Suffix(number.Groups["suffix"].Value, unit) is not { } suffixExponent)
                return $"'{number.Groups["suffix"].Value}' is not an SI prefix and unit of {unit.Noun}";
            exponent += suffixExponent;
        }

        var digits = (integer + fraction).TrimStart('0');
        if (digits.Length == 0)
            return null; // zero: a 0 Ω link is a real part
        exponent -= fraction.Length;
        if (exponent + digits.Length > 400)
            return "it is too large";
        if (exponent + digits.Length < -400)
            return "it is too small to be told from zero";
        var magnitude = DecimalText.ToDouble(digits, (int)exponent);
        if (double.IsInfinity(magnitude))
            return "it is too large";
        if (magnitude == 0)
            return "it is too small to be told from zero";
        value = negative ? -magnitude : magnitude;
        return null;
    }

    /// <summary>The power of ten an RKM letter stands for with this quantity, or null.</summary>
    private static int? RkmMarker(char letter, QuantityUnit unit) =>
        unit.RkmUnityMarkers.Contains(letter) ? 0 : SiPrefix.Exponent(letter);

    /// <summary>The power of ten of what follows the number ("k", "kΩ", "kohm", "Ω", "%", ""), or null.</summary>
    private static int? Suffix(string suffix, QuantityUnit unit)
    {
        if (suffix.Length == 0 || unit.IsUnit(suffix))
            return 0;
        if (unit.Symbol.Length == 0)
            return suffix == "%" ? -2 : null; // a ratio: no prefixes, percent allowed
        if (SiPrefix.Exponent(suffix[0]) is not { } prefix)
            return null;
        var rest = suffix[1..];
        return rest.Length == 0 || unit.IsUnitAfterPrefix(rest) ? prefix : null;
    }

    [GeneratedRegex(@"^(?<int>[0-9]*)(?<mark>[A-Za-z\u00B5\u03BC])(?<frac>[0-9]*)$", RegexOptions.CultureInvariant)]
    private static partial Regex RkmPattern();

    [GeneratedRegex(@"^(?=\.?[0-9])(?<int>[0-9]*)(?:\.(?<frac>[0-9]*))?(?:[eE](?<exp>[+-]?[0-9]+))?\s*(?<suffix>.*)$",
        RegexOptions.CultureInvariant | RegexOptions.Singleline)]
    private static partial Regex NumberPattern();
}
