using PartsOpt.Values;

namespace PartsOpt.Tests.Values;

public class EngineeringValueParseTests
{
    // Exact equality throughout: a parsed value must be the double nearest the decimal written (4700, not
    // 4699.999…), which is what a literal in C# also is.

    [Theory]
    // Plain and scientific numbers.
    [InlineData("4700", Quantity.Resistance, 4700)]
    [InlineData("4.7e3", Quantity.Resistance, 4700)]
    [InlineData("4.7E3", Quantity.Resistance, 4700)]
    [InlineData("4.7e+3", Quantity.Resistance, 4700)]
    [InlineData("1e-7", Quantity.Capacitance, 1e-7)]
    [InlineData(".47", Quantity.Resistance, 0.47)]
    [InlineData("5.", Quantity.Voltage, 5)]
    [InlineData("0", Quantity.Resistance, 0)] // a 0 Ω link is a real part
    [InlineData("  4700\t", Quantity.Resistance, 4700)]
    [InlineData("4.7\u00A0kΩ", Quantity.Resistance, 4700)] // NO-BREAK SPACE
    [InlineData("4.7\u202FkΩ", Quantity.Resistance, 4700)] // NARROW NO-BREAK SPACE, as SI typesetting uses
    // SI prefixes and units.
    [InlineData("4.7kΩ", Quantity.Resistance, 4700)]
    [InlineData("4.7 kΩ", Quantity.Resistance, 4700)]
    [InlineData("4.7 k\u2126", Quantity.Resistance, 4700)] // U+2126 OHM SIGN, as some keyboards type it
    [InlineData("4.7 kohm", Quantity.Resistance, 4700)]
    [InlineData("4.7 KOhms", Quantity.Resistance, 4700)]
    [InlineData("4.7k", Quantity.Resistance, 4700)]
    [InlineData("4.7 k", Quantity.Resistance, 4700)]
    [InlineData("1 MΩ", Quantity.Resistance, 1e6)]
    [InlineData("1 mΩ", Quantity.Resistance, 1e-3)] // SI: m is milli, M is mega
    [InlineData("47 Ω", Quantity.Resistance, 47)]
    [InlineData("2.2 GΩ", Quantity.Resistance, 2.2e9)]
    [InlineData("1 TΩ", Quantity.Resistance, 1e12)]
    [InlineData("100nF", Quantity.Capacitance, 100e-9)]
    [InlineData("100 nF", Quantity.Capacitance, 100e-9)]
    [InlineData("100uf", Quantity.Capacitance, 100e-6)] // lower-case f after a prefix: farad
    [InlineData("100 µF", Quantity.Capacitance, 100e-6)] // U+00B5 MICRO SIGN
    [InlineData("100 \u03BCF", Quantity.Capacitance, 100e-6)] // U+03BC GREEK SMALL LETTER MU
    [InlineData("2.2 pF", Quantity.Capacitance, 2.2e-12)]
    [InlineData("500 fF", Quantity.Capacitance, 500e-15)]
    [InlineData("1 F", Quantity.Capacitance, 1)]
    [InlineData("10 farads", Quantity.Capacitance, 10)]
    [InlineData("10 µH", Quantity.Inductance, 10e-6)]
    [InlineData("10uh", Quantity.Inductance, 10e-6)]
    [InlineData("10 V", Quantity.Voltage, 10)]
    [InlineData("10v", Quantity.Voltage, 10)]
    [InlineData("-12 V", Quantity.Voltage, -12)] // voltages may be negative: a V− rail
    [InlineData("\u221212 V", Quantity.Voltage, -12)] // U+2212 MINUS SIGN
    [InlineData("+15 V", Quantity.Voltage, 15)]
    [InlineData("250 mV", Quantity.Voltage, 0.25)]
    [InlineData("-2 mA", Quantity.Current, -2e-3)]
    [InlineData("20 amps", Quantity.Current, 20)]
    [InlineData("455 Hz", Quantity.Frequency, 455)]
    [InlineData("455Hz", Quantity.Frequency, 455)]
    [InlineData("4.5 kHz", Quantity.Frequency, 4500)]
    [InlineData("10 MHz", Quantity.Frequency, 10e6)]
    [InlineData("10 mHz", Quantity.Frequency, 10e-3)]
    [InlineData("5 khz", Quantity.Frequency, 5000)]
    [InlineData("0.25 W", Quantity.Power, 0.25)]
    [InlineData("250 mW", Quantity.Power, 0.25)]
    [InlineData("1.5 ms", Quantity.Time, 1.5e-3)]
    [InlineData("20 µs", Quantity.Time, 20e-6)]
    [InlineData("0.5", Quantity.Ratio, 0.5)]
    [InlineData("50%", Quantity.Ratio, 0.5)]
    [InlineData("12.5 %", Quantity.Ratio, 0.125)]
    public void Reads_numbers_with_prefixes_and_units(string text, Quantity quantity, double expected) =>
        Assert.Equal(expected, EngineeringValue.Parse(text, quantity));

    [Theory]
    // IEC 60062 RKM code: the letter is the decimal point and the multiplier.
    [InlineData("4K7", Quantity.Resistance, 4700)]
    [InlineData("4k7", Quantity.Resistance, 4700)]
    [InlineData("R47", Quantity.Resistance, 0.47)]
    [InlineData("2M2", Quantity.Resistance, 2.2e6)]
    [InlineData("1R0", Quantity.Resistance, 1)]
    [InlineData("0R1", Quantity.Resistance, 0.1)]
    [InlineData("47R", Quantity.Resistance, 47)]
    [InlineData("100K", Quantity.Resistance, 100e3)]
    [InlineData("1G0", Quantity.Resistance, 1e9)]
    [InlineData("0R", Quantity.Resistance, 0)]
    [InlineData("4m7", Quantity.Resistance, 4.7e-3)] // current-sense shunt
    [InlineData("4n7", Quantity.Capacitance, 4.7e-9)]
    [InlineData("2p2", Quantity.Capacitance, 2.2e-12)]
    [InlineData("4u7", Quantity.Capacitance, 4.7e-6)]
    [InlineData("4µ7", Quantity.Capacitance, 4.7e-6)]
    [InlineData("p47", Quantity.Capacitance, 0.47e-12)]
    [InlineData("1F5", Quantity.Capacitance, 1.5)]
    [InlineData("3V3", Quantity.Voltage, 3.3)]
    [InlineData("4k7", Quantity.Frequency, 4700)]
    [InlineData("1u5", Quantity.Inductance, 1.5e-6)]
    public void Reads_rkm_codes(string text, Quantity quantity, double expected) =>
        Assert.Equal(expected, EngineeringValue.Parse(text, quantity));

    [Theory]
    [InlineData("", Quantity.Resistance)]
    [InlineData("  ", Quantity.Resistance)]
    [InlineData("4k7k", Quantity.Resistance)]
    [InlineData("4.7.1", Quantity.Resistance)]
    [InlineData("abc", Quantity.Resistance)]
    [InlineData("1,5k", Quantity.Resistance)] // a comma is never guessed as a decimal separator
    [InlineData("4,700", Quantity.Resistance)] // nor as a thousands separator
    [InlineData("4K7F", Quantity.Resistance)] // farad is not a unit of resistance
    [InlineData("4.7 kF", Quantity.Resistance)]
    [InlineData("100 nF", Quantity.Voltage)]
    [InlineData("10 mS", Quantity.Time)] // S is siemens, not seconds
    [InlineData("-4k7", Quantity.Resistance)] // a part value is never negative
    [InlineData("-4.7 kΩ", Quantity.Resistance)]
    [InlineData("-100n", Quantity.Capacitance)]
    [InlineData("-455 Hz", Quantity.Frequency)]
    [InlineData("-0.5", Quantity.Ratio)]
    [InlineData("NaN", Quantity.Resistance)]
    [InlineData("Infinity", Quantity.Resistance)]
    [InlineData("-Infinity", Quantity.Voltage)]
    [InlineData("∞", Quantity.Resistance)]
    [InlineData("1e400", Quantity.Resistance)] // beyond double: an error, not Infinity
    [InlineData("1e308k", Quantity.Resistance)]
    [InlineData("1e99999999999999", Quantity.Resistance)]
    [InlineData("1e-400", Quantity.Capacitance)] // underflows to zero: an error, not 0
    [InlineData("4 7", Quantity.Resistance)]
    [InlineData("4.7 k Ω", Quantity.Resistance)]
    [InlineData("4.7kk", Quantity.Resistance)]
    [InlineData("4.7 nF", Quantity.Inductance)]
    [InlineData("R", Quantity.Resistance)]
    [InlineData("K", Quantity.Resistance)]
    [InlineData("1e", Quantity.Resistance)]
    [InlineData("e3", Quantity.Resistance)]
    [InlineData(".", Quantity.Resistance)]
    [InlineData("4R7R", Quantity.Resistance)]
    [InlineData("47R", Quantity.Capacitance)] // R marks ohms only
    [InlineData("4.7 kΩ", Quantity.Ratio)]
    [InlineData("5 k%", Quantity.Ratio)]
    [InlineData("4k7", Quantity.Ratio)] // a ratio takes no prefix, so no RKM code
    [InlineData("500m", Quantity.Ratio)]
    [InlineData("4R7", Quantity.Inductance)] // R marks ohms only, never µH
    [InlineData("5%", Quantity.Resistance)]
    [InlineData("1 Hz", Quantity.Time)]
    [InlineData("4\u06F7", Quantity.Resistance)] // Extended Arabic-Indic digit: ASCII digits only
    public void Refuses_what_is_not_a_value(string text, Quantity quantity)
    {
        var error = Assert.Throws<ValueFormatException>(() => EngineeringValue.Parse(text, quantity));
        Assert.Equal(text, error.Text);
        Assert.Equal(quantity, error.Quantity);
        Assert.Contains($"'{text}'", error.Message, StringComparison.Ordinal);
        Assert.False(EngineeringValue.TryParse(text, quantity, out _));
    }

    [Fact]
    public void TryParse_refuses_null() => Assert.False(EngineeringValue.TryParse(null, Quantity.Resistance, out _));

    [Fact]
    public void TryParse_returns_the_value() =>
        Assert.True(EngineeringValue.TryParse("4K7", Quantity.Resistance, out var v) && v == 4700);

    [Theory]
    [InlineData("-4k7", Quantity.Resistance, "never negative")]
    [InlineData("1,5k", Quantity.Resistance, "comma")]
    [InlineData("1e400", Quantity.Resistance, "too large")]
    [InlineData("1e-400", Quantity.Capacitance, "too small")]
    [InlineData("", Quantity.Capacitance, "empty")]
    [InlineData("4.7 kF", Quantity.Resistance, "resistance")]
    public void Error_message_says_why(string text, Quantity quantity, string reason)
    {
        var error = Assert.Throws<ValueFormatException>(() => EngineeringValue.Parse(text, quantity));
        Assert.Contains(reason, error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Error_message_says_what_was_expected()
    {
        var error = Assert.Throws<ValueFormatException>(() => EngineeringValue.Parse("abc", Quantity.Capacitance));
        Assert.Contains("capacitance", error.Message, StringComparison.Ordinal);
        Assert.Contains("F", error.Message, StringComparison.Ordinal);
        Assert.IsAssignableFrom<FormatException>(error);
    }

    [Theory]
    // Values with many digits are still the nearest double to what was written.
    [InlineData("0.1", 0.1)]
    [InlineData("1.0000000000000002", 1.0000000000000002)]
    [InlineData("3.3e-9", 3.3e-9)]
    [InlineData("33e-10", 3.3e-9)]
    [InlineData("0.0000000033", 3.3e-9)]
    [InlineData("1.7976931348623157e308", double.MaxValue)]
    public void Parsed_values_are_the_nearest_double(string text, double expected) =>
        Assert.Equal(expected, EngineeringValue.Parse(text, Quantity.Capacitance));
}
