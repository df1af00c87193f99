using System.Globalization;

namespace PartsOpt.Values;

/// <summary>
/// The numeric codes printed on small parts (IEC 60062): three- and four-digit codes (significant digits
/// and a power of ten) and the EIA-96 code of 1 % resistors.
/// </summary>
public static class MarkingCode
{
    /// <summary>
    /// Reads a digit code. Capacitors: three digits, two significant and a multiplier, in pF ("104" = 100 nF,
    /// "222" = 2.2 nF, "100" = 10 pF); multiplier 0–6 is a power of ten, 8 is ×0.01 and 9 ×0.1, 7 is
    /// unused. Resistors: three digits (two significant) or four (three significant) and a power of ten, in
    /// ohms ("472" = 4.7 kΩ, "4701" = 4.70 kΩ, "000" = a 0 Ω link).
    /// </summary>
    /// <exception cref="ValueFormatException">The code is not a digit code, or the quantity is neither
    /// resistance nor capacitance.</exception>
    public static double ParseDigits(string code, Quantity quantity)
    {
        var t = code?.Trim() ?? "";
        if (quantity is not (Quantity.Resistance or Quantity.Capacitance))
            throw new ValueFormatException(code, quantity, "digit codes mark only resistors and capacitors");
        if (!t.All(char.IsAsciiDigit))
            throw new ValueFormatException(code, quantity, "a digit code holds only the digits 0–9");
        var lengthOk = quantity == Quantity.Resistance ? t.Length is 3 or 4 : t.Length == 3;
        if (!lengthOk)
            throw new ValueFormatException(code, quantity, quantity == Quantity.Resistance
                ? "a resistor digit code has 3 or 4 digits" : "a capacitor digit code has 3 digits");

        var significant = t[..^1];
        var multiplier = t[^1] - '0';
        int power;
        if (quantity == Quantity.Resistance)
            power = multiplier;
        else
            power = multiplier switch
            {
                <= 6 => multiplier - 12, // pF
                8 => -2 - 12,
                9 => -1 - 12,
                _ => throw new ValueFormatException(code, quantity, "7 is not a capacitor code multiplier"),
            };
        return DecimalText.ToDouble(significant, power);
    }

    /// <summary>
    /// Writes the digit code of a value where one marks it exactly: capacitors in three digits (in pF),
    /// resistors in three digits where two significant digits suffice, else four. The first digit is never
    /// 0 except for 0 Ω ("000").
    /// </summary>
    /// <exception cref="ArgumentException">No digit code marks this value exactly (4.7 Ω, 4.75 pF,
    /// 1.234 kΩ), or the quantity has no digit code.</exception>
    public static string FormatDigits(double value, Quantity quantity)
    {
        if (quantity is not (Quantity.Resistance or Quantity.Capacitance))
            throw new ArgumentException($"Digit codes mark only resistors and capacitors, not {quantity}.", nameof(quantity));
        // Beyond 1 MF or 1e-20 nothing has a code, and decimal could overflow or flush to zero.
        if (DecimalText.ToDecimal(value) is not { } exact || exact < 0 || (value != 0 && (exact < 1e-20m || value > 1e12)))
            throw new ArgumentException($"{value} is not a value a digit code can mark.", nameof(value));
        if (quantity == Quantity.Resistance)
        {
            if (exact == 0)
                return "000";
            return Code(exact, 2, [.. Enumerable.Range(0, 10).Select(p => (p, (char)('0' + p)))])
                ?? Code(exact, 3, [.. Enumerable.Range(0, 10).Select(p => (p, (char)('0' + p)))])
                ?? throw new ArgumentException(
                    $"{EngineeringValue.Format(value, quantity, 17)} has no exact 3- or 4-digit resistor code.", nameof(value));
        }
        var picofarads = exact * 1_000_000_000_000m;
        (int, char)[] multipliers = [(0, '0'), (1, '1'), (2, '2'), (3, '3'), (4, '4'), (5, '5'), (6, '6'), (-2, '8'), (-1, '9')];
        return Code(picofarads, 2, multipliers)
            ?? throw new ArgumentException(
                $"{EngineeringValue.Format(value, quantity, 17)} has no exact 3-digit capacitor code.", nameof(value));
    }

    /// <summary>
    /// Reads an EIA-96 code (IEC 60062): two digits give the position in E96 (01 = 1.00 … 96 = 9.76, read as
    /// 100 … 976 Ω), a letter the multiplier: Z ×0.001, Y or R ×0.01, X or S ×0.1, A ×1, B or H ×10, C ×100,
    /// D ×1k, E ×10k, F ×100k. "01A" = 100 Ω, "01C" = 10 kΩ, "68X" = 49.9 Ω.
    /// </summary>
    /// <exception cref="ValueFormatException">The code is not an EIA-96 code.</exception>
    public static double ParseEia96(string code)
    {
        var t = code?.Trim() ?? "";
        if (t.Length != 3 || !char.IsAsciiDigit(t[0]) || !char.IsAsciiDigit(t[1]))
            throw new ValueFormatException(code, Quantity.Resistance, "an EIA-96 code is two digits and a letter (01A)");
        var position = int.Parse(t[..2], CultureInfo.InvariantCulture);
        if (position is < 1 or > 96)
            throw new ValueFormatException(code, Quantity.Resistance, "an EIA-96 position runs from 01 to 96");
        if (Eia96Multiplier(char.ToUpperInvariant(t[2])) is not { } power)
            throw new ValueFormatException(code, Quantity.Resistance,
                $"'{t[2]}' is not an EIA-96 multiplier letter (Z Y R X S A B H C D E F)");
        var mantissa = PreferredValues.DecadeExact(ESeries.E96)[position - 1] * 100; // 1.00 → 100
        return DecimalText.ToDouble(decimal.Truncate(mantissa).ToString(CultureInfo.InvariantCulture), power);
    }

    /// <summary>
    /// Writes the EIA-96 code of a value, using the first letter of each multiplier (Z Y X A B C D E F).
    /// </summary>
    /// <exception cref="ArgumentException">The value is not an E96 member from 0.1 Ω to 97.6 MΩ.</exception>
    public static string FormatEia96(double value)
    {
        if (DecimalText.ToDecimal(value) is { } exact && exact > 0)
        {
            var mantissas = PreferredValues.DecadeExact(ESeries.E96);
            foreach (var (letter, power) in Eia96Letters)
            {
                var hundreds = exact / Pow10(power);
                var position = Enumerable.Range(0, 96).FirstOrDefault(i => mantissas[i] * 100 == hundreds, -1);
                if (position >= 0)
                    return $"{position + 1:00}{letter}";
            }
        }
        throw new ArgumentException($"{value} is not an E96 value with an EIA-96 code.", nameof(value));
    }

    private static readonly (char Letter, int Power)[] Eia96Letters =
        [('Z', -3), ('Y', -2), ('X', -1), ('A', 0), ('B', 1), ('C', 2), ('D', 3), ('E', 4), ('F', 5)];

    private static int? Eia96Multiplier(char letter) => letter switch
    {
        'Z' => -3,
        'Y' or 'R' => -2,
        'X' or 'S' => -1,
        'A' => 0,
        'B' or 'H' => 1,
        'C' => 2,
        'D' => 3,
        'E' => 4,
        'F' => 5,
        _ => null,
    };

    /// <summary>The code with <paramref name="digits"/> significant digits and one of the multipliers, or null.</summary>
    private static string? Code(decimal value, int digits, (int Power, char Digit)[] multipliers)
    {
        foreach (var (power, digit) in multipliers)
        {
            var significant = value / Pow10(power);
            if (significant == decimal.Truncate(significant) && significant >= Pow10(digits - 1) && significant < Pow10(digits))
                return decimal.Truncate(significant).ToString(CultureInfo.InvariantCulture) + digit;
        }
        return null;
    }

    private static decimal Pow10(int power)
    {
        var result = 1m;
        for (var i = 0; i < Math.Abs(power); i++)
            result *= 10;
        return power >= 0 ? result : 1 / result;
    }
}
