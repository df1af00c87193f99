using PartsOpt.Values;

namespace PartsOpt.Tests.Values;

public class RoundTripTests
{
    [Fact]
    public void Format_then_parse_recovers_every_E96_resistor_from_1_ohm_to_10_megohm()
    {
        var values = PreferredValues.InRange(ESeries.E96, 1, 10e6).ToList();
        Assert.Equal(7 * 96 + 1, values.Count);
        foreach (var r in values) // three digits display an E96 value exactly (IEC 60063)
            Assert.Equal(r, EngineeringValue.Parse(EngineeringValue.Format(r, Quantity.Resistance), Quantity.Resistance));
    }

    [Fact]
    public void Format_then_parse_recovers_every_E12_capacitor_from_1_pF_to_10_uF()
    {
        var values = PreferredValues.InRange(ESeries.E12, 1e-12, 10e-6).ToList();
        Assert.Equal(7 * 12 + 1, values.Count);
        foreach (var c in values)
            Assert.Equal(c, EngineeringValue.Parse(EngineeringValue.Format(c, Quantity.Capacitance), Quantity.Capacitance));
    }

    [Fact]
    public void Rkm_then_parse_is_exact_for_E24_resistors_and_capacitors()
    {
        foreach (var r in PreferredValues.InRange(ESeries.E24, 0.1, 100e6))
            Assert.Equal(r, EngineeringValue.Parse(EngineeringValue.FormatRkm(r, Quantity.Resistance), Quantity.Resistance));
        foreach (var c in PreferredValues.InRange(ESeries.E24, 0.1e-12, 10e-3))
            Assert.Equal(c, EngineeringValue.Parse(EngineeringValue.FormatRkm(c, Quantity.Capacitance), Quantity.Capacitance));
    }

    [Fact]
    public void Rkm_then_parse_is_exact_for_E192_resistors()
    {
        foreach (var r in PreferredValues.InRange(ESeries.E192, 0.1, 10e6))
            Assert.Equal(r, EngineeringValue.Parse(EngineeringValue.FormatRkm(r, Quantity.Resistance), Quantity.Resistance));
    }

    [Theory]
    [InlineData(Quantity.Resistance)]
    [InlineData(Quantity.Capacitance)]
    [InlineData(Quantity.Frequency)]
    [InlineData(Quantity.Voltage)]
    [InlineData(Quantity.Time)]
    [InlineData(Quantity.Ratio)]
    public void Format_then_parse_recovers_any_value_to_the_displayed_digits(Quantity quantity)
    {
        var random = new Random(60063);
        for (var i = 0; i < 2000; i++)
        {
            var value = Math.Pow(10, random.NextDouble() * 36 - 20); // 1e-20 … 1e16: beyond the prefixes too
            var digits = 1 + random.Next(15);
            var text = EngineeringValue.Format(value, quantity, digits);
            var back = EngineeringValue.Parse(text, quantity);
            // Rounding to n significant digits moves a value by at most half a unit in the n-th digit.
            Precision.AlmostEqualRelative(value, back, 0.5 * Math.Pow(10, 1 - digits) * (1 + 1e-9), text);
            // And the text is the shortest at that precision: formatting the parsed value again is stable.
            Assert.Equal(text, EngineeringValue.Format(back, quantity, digits));
        }
    }

    [Fact]
    public void Seventeen_digits_round_trip_any_double_exactly()
    {
        var random = new Random(60062);
        for (var i = 0; i < 2000; i++)
        {
            var value = Math.Pow(10, random.NextDouble() * 30 - 15);
            Assert.Equal(value, EngineeringValue.Parse(EngineeringValue.Format(value, Quantity.Capacitance, 17), Quantity.Capacitance));
        }
    }

    [Fact]
    public void Negative_voltages_round_trip()
    {
        foreach (var v in new[] { -12.0, -0.7, -15e-3, -3.3 })
            Assert.Equal(v, EngineeringValue.Parse(EngineeringValue.Format(v, Quantity.Voltage), Quantity.Voltage));
    }
}
