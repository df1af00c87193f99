using PartsOpt.Values;

namespace PartsOpt.Tests.Values;

public class MarkingCodeTests
{
    [Theory]
    // IEC 60062 three-digit capacitor codes, in pF.
    [InlineData("104", 100e-9)]
    [InlineData("222", 2.2e-9)]
    [InlineData("100", 10e-12)]
    [InlineData("101", 100e-12)]
    [InlineData("472", 4.7e-9)]
    [InlineData("105", 1e-6)]
    [InlineData("106", 10e-6)]
    [InlineData("229", 2.2e-12)] // multiplier 9: ×0.1
    [InlineData("478", 0.47e-12)] // multiplier 8: ×0.01
    [InlineData(" 104 ", 100e-9)]
    public void Reads_capacitor_codes(string code, double farads) =>
        Assert.Equal(farads, MarkingCode.ParseDigits(code, Quantity.Capacitance));

    [Theory]
    // IEC 60062 three- and four-digit resistor codes, in ohms.
    [InlineData("472", 4700)]
    [InlineData("4701", 4700)]
    [InlineData("4702", 47000)]
    [InlineData("103", 10e3)]
    [InlineData("100", 10)]
    [InlineData("220", 22)]
    [InlineData("1000", 100)]
    [InlineData("1002", 10e3)]
    [InlineData("4990", 499)]
    [InlineData("225", 2.2e6)]
    [InlineData("000", 0)] // 0 Ω link
    public void Reads_resistor_codes(string code, double ohms) =>
        Assert.Equal(ohms, MarkingCode.ParseDigits(code, Quantity.Resistance));

    [Theory]
    [InlineData("104", Quantity.Voltage)] // digit codes mark resistors and capacitors only
    [InlineData("104", Quantity.Frequency)]
    [InlineData("1047", Quantity.Capacitance)] // capacitors: three digits
    [InlineData("10", Quantity.Resistance)]
    [InlineData("47012", Quantity.Resistance)]
    [InlineData("", Quantity.Resistance)]
    [InlineData("4K7", Quantity.Resistance)] // RKM, not a digit code
    [InlineData("47a", Quantity.Resistance)]
    [InlineData("107", Quantity.Capacitance)] // 7 is no capacitor multiplier
    [InlineData("1\u06F72", Quantity.Resistance)] // non-ASCII digit
    public void Refuses_bad_digit_codes(string code, Quantity quantity)
    {
        var error = Assert.Throws<ValueFormatException>(() => MarkingCode.ParseDigits(code, quantity));
        Assert.Equal(code, error.Text);
        Assert.Contains($"'{code}'", error.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(100e-9, Quantity.Capacitance, "104")]
    [InlineData(2.2e-9, Quantity.Capacitance, "222")]
    [InlineData(10e-12, Quantity.Capacitance, "100")]
    [InlineData(2.2e-12, Quantity.Capacitance, "229")]
    [InlineData(0.47e-12, Quantity.Capacitance, "478")]
    [InlineData(1e-6, Quantity.Capacitance, "105")]
    [InlineData(4700, Quantity.Resistance, "472")]
    [InlineData(4750, Quantity.Resistance, "4751")]
    [InlineData(10, Quantity.Resistance, "100")]
    [InlineData(0, Quantity.Resistance, "000")]
    public void Writes_digit_codes(double value, Quantity quantity, string expected) =>
        Assert.Equal(expected, MarkingCode.FormatDigits(value, quantity));

    [Theory]
    [InlineData(4.7, Quantity.Resistance)] // below 10 Ω needs R
    [InlineData(49.9, Quantity.Resistance)] // needs RKM (49R9)
    [InlineData(1234, Quantity.Resistance)] // four significant digits
    [InlineData(4.75e-12, Quantity.Capacitance)] // three significant digits
    [InlineData(1, Quantity.Capacitance)] // 1 F: beyond multiplier 6
    [InlineData(1e-30, Quantity.Resistance)]
    [InlineData(-4700, Quantity.Resistance)]
    [InlineData(double.NaN, Quantity.Resistance)]
    [InlineData(4700, Quantity.Voltage)]
    public void FormatDigits_refuses_what_no_code_marks(double value, Quantity quantity) =>
        Assert.Throws<ArgumentException>(() => MarkingCode.FormatDigits(value, quantity));

    [Fact]
    public void Digit_codes_round_trip_for_E24_capacitors_and_resistors()
    {
        foreach (var c in PreferredValues.InRange(ESeries.E24, 0.1e-12, 99e-6))
            Assert.Equal(c, MarkingCode.ParseDigits(MarkingCode.FormatDigits(c, Quantity.Capacitance), Quantity.Capacitance));
        foreach (var r in PreferredValues.InRange(ESeries.E96, 100, 10e6))
            Assert.Equal(r, MarkingCode.ParseDigits(MarkingCode.FormatDigits(r, Quantity.Resistance), Quantity.Resistance));
    }

    [Theory]
    // EIA-96 (IEC 60062:2016).
    [InlineData("01A", 100)]
    [InlineData("01C", 10e3)]
    [InlineData("68X", 49.9)]
    [InlineData("68S", 49.9)]
    [InlineData("96F", 97.6e6)]
    [InlineData("01Z", 0.1)]
    [InlineData("01Y", 1)]
    [InlineData("01R", 1)]
    [InlineData("30B", 2000)]
    [InlineData("30H", 2000)]
    [InlineData("66D", 475e3)]
    [InlineData("44E", 2.8e6)]
    [InlineData("01a", 100)]
    public void Reads_eia96_codes(string code, double ohms) => Assert.Equal(ohms, MarkingCode.ParseEia96(code));

    [Theory]
    [InlineData("00A")]
    [InlineData("97A")]
    [InlineData("01G")]
    [InlineData("1A")]
    [InlineData("01AA")]
    [InlineData("472")]
    [InlineData("")]
    public void Refuses_bad_eia96_codes(string code)
    {
        var error = Assert.Throws<ValueFormatException>(() => MarkingCode.ParseEia96(code));
        Assert.Contains($"'{code}'", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Eia96_positions_follow_the_E96_table()
    {
        for (var i = 0; i < 96; i++)
        {
            var code = $"{i + 1:00}A";
            Precision.AlmostEqualRelative(PreferredValuesTests.E96Table[i] * 100, MarkingCode.ParseEia96(code), 1e-15, code);
        }
    }

    [Fact]
    public void Eia96_codes_round_trip()
    {
        foreach (var r in PreferredValues.InRange(ESeries.E96, 0.1, 97.6e6))
            Assert.Equal(r, MarkingCode.ParseEia96(MarkingCode.FormatEia96(r)));
        Assert.Equal("68X", MarkingCode.FormatEia96(49.9));
        Assert.Equal("01C", MarkingCode.FormatEia96(10e3));
    }

    [Theory]
    [InlineData(4700)] // E24, not E96
    [InlineData(100e6)] // beyond F
    [InlineData(0)]
    public void FormatEia96_refuses_non_members(double value) =>
        Assert.Throws<ArgumentException>(() => MarkingCode.FormatEia96(value));
}
