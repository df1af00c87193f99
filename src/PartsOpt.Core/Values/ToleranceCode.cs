using System.Globalization;
using System.Text.RegularExpressions;

namespace PartsOpt.Values;

/// <summary>
/// Reads and writes tolerances: the IEC 60062 letters (B C D F G J K M Z) and the ways a person writes a
/// percentage ("5%", "±5 %", "+80/-20%") or a fraction ("0.05").
/// </summary>
public static partial class ToleranceCode
{
    /// <summary>Capacitors below this value take B, C, D and F as absolute tolerances (IEC 60062).</summary>
    public const double AbsoluteBelowF = 10e-12;

    /// <summary>
    /// Reads a tolerance. Letters follow IEC 60062: B ±0.1 %, C ±0.25 %, D ±0.5 %, F ±1 %, G ±2 %, J ±5 %,
    /// K ±10 %, M ±20 %, Z +80/−20 %; for a capacitor under 10 pF (<paramref name="capacitanceF"/>) B, C, D
    /// and F are ±0.1, 0.25, 0.5 and 1 pF. Also read: "5%", "±5 %", "+/-5%", "+80/-20%", "-20/+80 %",
    /// "±0.5 pF" or "0.5 pF" (absolute), and a bare fraction below 1 ("0.05"). A bare number of 1 or more ("5") is refused as
    /// ambiguous, and so is a one-sided "+5%".
    /// </summary>
    /// <exception cref="ToleranceFormatException">The text is not a tolerance; the message says why.</exception>
    public static Tolerance Parse(string text, double? capacitanceF = null) =>
        Read(text, capacitanceF, out var tolerance) is { } reason
            ? throw new ToleranceFormatException(text, reason)
            : tolerance;

    /// <summary>Reads a tolerance; false when the text is not one.</summary>
    public static bool TryParse(string? text, out Tolerance tolerance, double? capacitanceF = null) =>
        Read(text, capacitanceF, out tolerance) is null;

    /// <summary>
    /// The IEC 60062 letter for a tolerance, or null when it has none. An absolute tolerance of
    /// ±0.1/0.25/0.5/1 pF gives B/C/D/F.
    /// </summary>
    public static char? LetterFor(Tolerance tolerance)
    {
        foreach (var (letter, minus, plus) in Letters)
        {
            if (tolerance.IsAbsolute)
            {
                if (AbsoluteLetter(letter) is { } farads && Near(tolerance.Minus, farads) && Near(tolerance.Plus, farads))
                    return letter;
            }
            else if (Near(tolerance.Minus, minus) && Near(tolerance.Plus, plus))
                return letter;
        }
        return null;
    }

    // IEC 60062 tolerance letters, as fractions (minus, plus).
    private static readonly (char Letter, double Minus, double Plus)[] Letters =
    [
        ('B', 0.001, 0.001), ('C', 0.0025, 0.0025), ('D', 0.005, 0.005), ('F', 0.01, 0.01), ('G', 0.02, 0.02),
        ('J', 0.05, 0.05), ('K', 0.10, 0.10), ('M', 0.20, 0.20), ('Z', 0.20, 0.80),
    ];

    // IEC 60062: for capacitors below 10 pF these letters are absolute.
    private static double? AbsoluteLetter(char letter) => letter switch
    {
        'B' => 0.1e-12,
        'C' => 0.25e-12,
        'D' => 0.5e-12,
        'F' => 1e-12,
        _ => null,
    };

    private static bool Near(double a, double b) => Math.Abs(a - b) <= 1e-9 * Math.Abs(b);

    private static string? Read(string? text, double? capacitanceF, out Tolerance tolerance)
    {
        tolerance = default;
        if (string.IsNullOrWhiteSpace(text))
            return "the text is empty";
        var t = text.Trim().Replace('\u2212', '-').Replace("+/-", "±", StringComparison.Ordinal)
            .Replace("+-", "±", StringComparison.Ordinal);
        if (t.Contains(',', StringComparison.Ordinal))
            return "a comma is not read as a decimal separator; write a point (0.5 %)";

        if (t.Length == 1 && char.IsAsciiLetter(t[0]))
        {
            var letter = char.ToUpperInvariant(t[0]);
            if (capacitanceF is { } c && c < AbsoluteBelowF && AbsoluteLetter(letter) is { } farads)
            {
                tolerance = Tolerance.Absolute(farads);
                return null;
            }
            foreach (var (l, minus, plus) in Letters)
            {
                if (l == letter)
                {
                    tolerance = new(minus, plus, false);
                    return null;
                }
            }
            return $"'{t}' is not an IEC 60062 tolerance letter (B C D F G J K M Z)";
        }

        if (t.EndsWith('F') && EngineeringValue.TryParse(t.TrimStart('±'), Quantity.Capacitance, out var f))
        {
            tolerance = Tolerance.Absolute(f);
            return null;
        }

        var asymmetric = AsymmetricPattern().Match(t);
        if (asymmetric.Success)
        {
            if (asymmetric.Groups["s1"].Value == asymmetric.Groups["s2"].Value)
                return "the two sides need opposite signs (+80/-20 %)";
            var first = Percent(asymmetric.Groups["n1"].Value);
            var second = Percent(asymmetric.Groups["n2"].Value);
            var (minus, plus) = asymmetric.Groups["s1"].Value == "-" ? (first, second) : (second, first);
            return Checked(new(minus, plus, false), out tolerance);
        }

        var symmetric = SymmetricPattern().Match(t);
        if (symmetric.Success)
        {
            var sign = symmetric.Groups["sign"].Value;
            var percent = symmetric.Groups["pct"].Success;
            if (sign is "+" or "-")
                return "a one-sided tolerance needs both sides (+5/-0 %)";
            var number = symmetric.Groups["n"].Value;
            if (percent)
                return Checked(Tolerance.Symmetric(Percent(number)), out tolerance);
            var fraction = DecimalText.ToDouble(decimal.Parse(number, CultureInfo.InvariantCulture));
            if (fraction >= 1)
                return "a bare number of 1 or more is ambiguous: write 5 % or 0.05";
            return Checked(Tolerance.Symmetric(fraction), out tolerance);
        }
        return "expected an IEC 60062 letter (J), a percentage (±5 %, +80/-20 %) or a fraction (0.05)";
    }

    private static double Percent(string number) => DecimalText.ToDouble(decimal.Parse(number, CultureInfo.InvariantCulture) / 100);

    private static string? Checked(Tolerance candidate, out Tolerance tolerance)
    {
        tolerance = candidate;
        return candidate.Minus > 1 ? "a part cannot fall by more than 100 %" : null;
    }

    private const string Number = @"[0-9]{1,9}(?:\.[0-9]{1,12})?|\.[0-9]{1,12}";

    [GeneratedRegex(@"^(?<s1>[+-])\s*(?<n1>" + Number + @")\s*%?\s*/\s*(?<s2>[+-])\s*(?<n2>" + Number + @")\s*%$",
        RegexOptions.CultureInvariant)]
    private static partial Regex AsymmetricPattern();

    [GeneratedRegex(@"^(?<sign>[±+-]?)\s*(?<n>" + Number + @")\s*(?<pct>%)?$", RegexOptions.CultureInvariant)]
    private static partial Regex SymmetricPattern();
}

/// <summary>Text that does not read as a tolerance. The message names the text and says what was expected.</summary>
public sealed class ToleranceFormatException : FormatException
{
    /// <summary>Creates the exception for a text that could not be read as a tolerance.</summary>
    public ToleranceFormatException(string? text, string reason)
        : base($"'{text}' is not a tolerance: {reason}. Expected an IEC 60062 letter (B C D F G J K M Z), " +
               "a percentage (5 %, ±5 %, +80/-20 %) or a fraction (0.05).") => Text = text ?? "";

    /// <summary>Creates the exception with a default message.</summary>
    public ToleranceFormatException() : this("", "no tolerance was given") { }

    /// <summary>Creates the exception with a message of the caller's own.</summary>
    public ToleranceFormatException(string message) : base(message) => Text = "";

    /// <summary>Creates the exception with a message of the caller's own and the error behind it.</summary>
    public ToleranceFormatException(string message, Exception innerException) : base(message, innerException) => Text = "";

    /// <summary>The text that could not be read.</summary>
    public string Text { get; }
}
