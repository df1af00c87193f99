using System.Globalization;

namespace PartsOpt.Values;

public static partial class EngineeringValue
{
    /// <summary>
    /// Writes a value with an SI prefix and the unit symbol, rounded to <paramref name="significantDigits"/>
    /// and without trailing zeros: "4.7 kΩ", "100 nF", "1 MΩ", "455 Hz". The number sits in [1, 1000) before
    /// its prefix; outside f…T it is written with an exponent ("1e-18 F"). A ratio is written bare, without
    /// prefix ("0.5"). A negative value starts with "-". <see cref="Parse"/> reads every result back to the
    /// value rounded to those digits (negative ones only for voltage and current, the signed quantities).
    /// </summary>
    /// <exception cref="ArgumentOutOfRangeException">The value is not finite, or the digits are not 1–17.</exception>
    public static string Format(double value, Quantity quantity, int significantDigits = 3)
    {
        if (!double.IsFinite(value))
            throw new ArgumentOutOfRangeException(nameof(value), value, "Only finite values can be written.");
        ArgumentOutOfRangeException.ThrowIfLessThan(significantDigits, 1);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(significantDigits, 17);
        var symbol = QuantityUnit.Of(quantity).Symbol;
        if (value == 0)
            return Join("0", symbol);

        var (digits, exponent) = DecimalText.Round(value, significantDigits);
        var sign = value < 0 ? "-" : "";
        int power;
        if (quantity == Quantity.Ratio)
            power = exponent is >= -6 and < 15 ? 0 : exponent;
        else
        {
            power = (int)Math.Floor(exponent / 3.0) * 3;
            if (power is < SiPrefix.MinExponent or > SiPrefix.MaxExponent)
                power = exponent;
        }
        var (integer, fraction) = DecimalText.Place(digits, exponent - power + 1);
        var number = sign + (integer.Length == 0 ? "0" : integer) + (fraction.Length == 0 ? "" : "." + fraction);
        if (quantity == Quantity.Ratio)
            return power == 0 ? number : $"{number}e{power.ToString(CultureInfo.InvariantCulture)}";
        return power is < SiPrefix.MinExponent or > SiPrefix.MaxExponent
            ? Join($"{number}e{power.ToString(CultureInfo.InvariantCulture)}", symbol)
            : Join(number, SiPrefix.Symbol(power) + symbol);
    }

    /// <summary>
    /// Writes a value as an IEC 60062 RKM code to three significant digits: the letter stands for the decimal
    /// point and the multiplier, and the code has at least two digits ("4K7", "R47", "2M2", "1R0", "100K",
    /// "4n7", "1µ0", "3V3"). Resistors use R K M G T (below 1 Ω: "R47"); capacitors p n µ m F; inductors
    /// n µ m H; voltage, current and power m, unit letter, k.
    /// </summary>
    /// <exception cref="ArgumentException">The quantity has no one-letter unit (frequency, time, ratio).</exception>
    /// <exception cref="ArgumentOutOfRangeException">The value is negative or not finite.</exception>
    public static string FormatRkm(double value, Quantity quantity)
    {
        var markers = RkmMarkers(quantity);
        if (!double.IsFinite(value) || value < 0)
            throw new ArgumentOutOfRangeException(nameof(value), value, "An RKM code writes a finite value ≥ 0.");
        var unity = markers.Single(m => m.Exponent == 0).Letter;
        if (value == 0)
            return $"0{unity}0";

        var (digits, exponent) = DecimalText.Round(value, 3);
        // The largest letter not above the value; below the smallest letter, the code starts with it ("R47").
        var marker = markers.LastOrDefault(m => m.Exponent <= exponent, markers[0]);
        var (integer, fraction) = DecimalText.Place(digits, exponent - marker.Exponent + 1);
        if (integer.Length + fraction.Length < 2)
            fraction += "0";
        return integer + marker.Letter + fraction;
    }

    /// <summary>The unit symbol written for a quantity: Ω F H V A Hz W s, and "" for a ratio.</summary>
    public static string UnitSymbol(Quantity quantity) => QuantityUnit.Of(quantity).Symbol;

    private static (string Letter, int Exponent)[] RkmMarkers(Quantity quantity) => quantity switch
    {
        Quantity.Resistance => [("R", 0), ("K", 3), ("M", 6), ("G", 9), ("T", 12)],
        Quantity.Capacitance => [("p", -12), ("n", -9), (SiPrefix.Micro.ToString(), -6), ("m", -3), ("F", 0)],
        Quantity.Inductance => [("n", -9), (SiPrefix.Micro.ToString(), -6), ("m", -3), ("H", 0)],
        Quantity.Voltage => [("m", -3), ("V", 0), ("k", 3)],
        Quantity.Current => [(SiPrefix.Micro.ToString(), -6), ("m", -3), ("A", 0)],
        Quantity.Power => [("m", -3), ("W", 0), ("k", 3)],
        _ => throw new ArgumentException($"{quantity} has no one-letter unit to write an RKM code with.", nameof(quantity)),
    };

    private static string Join(string number, string unit) => unit.Length == 0 ? number : $"{number} {unit}";
}
