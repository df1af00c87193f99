using PartsOpt.Values;

namespace PartsOpt.Tests.Values;

public class EngineeringValueFormatTests
{
    [Theory]
    [InlineData(4700, Quantity.Resistance, 3, "4.7 kΩ")]
    [InlineData(4699.9999999, Quantity.Resistance, 3, "4.7 kΩ")]
    [InlineData(100e-9, Quantity.Capacitance, 3, "100 nF")]
    [InlineData(1e6, Quantity.Resistance, 3, "1 MΩ")]
    [InlineData(455.12, Quantity.Frequency, 3, "455 Hz")] // 1/(2·10 kΩ·100 nF·ln 3), Sedra & Smith
    [InlineData(455.12, Quantity.Frequency, 5, "455.12 Hz")]
    [InlineData(47, Quantity.Resistance, 3, "47 Ω")]
    [InlineData(0.47, Quantity.Resistance, 3, "470 mΩ")]
    [InlineData(999.96, Quantity.Resistance, 3, "1 kΩ")] // rounding carries into the next prefix
    [InlineData(999.4, Quantity.Resistance, 3, "999 Ω")]
    [InlineData(1234567, Quantity.Resistance, 2, "1.2 MΩ")]
    [InlineData(1234567, Quantity.Resistance, 7, "1.234567 MΩ")]
    [InlineData(2.2e-12, Quantity.Capacitance, 3, "2.2 pF")]
    [InlineData(4.7e-6, Quantity.Capacitance, 3, "4.7 µF")]
    [InlineData(1.5e-15, Quantity.Capacitance, 3, "1.5 fF")]
    [InlineData(1e-18, Quantity.Capacitance, 3, "1e-18 F")] // below femto: an exponent
    [InlineData(2e15, Quantity.Resistance, 3, "2e15 Ω")] // above tera
    [InlineData(0, Quantity.Resistance, 3, "0 Ω")]
    [InlineData(-12, Quantity.Voltage, 3, "-12 V")]
    [InlineData(3.3, Quantity.Voltage, 3, "3.3 V")]
    [InlineData(0.25, Quantity.Power, 3, "250 mW")]
    [InlineData(1.5e-3, Quantity.Time, 3, "1.5 ms")]
    [InlineData(10e-6, Quantity.Inductance, 3, "10 µH")]
    [InlineData(2e-3, Quantity.Current, 3, "2 mA")]
    [InlineData(0.5, Quantity.Ratio, 3, "0.5")]
    [InlineData(0.05, Quantity.Ratio, 3, "0.05")]
    [InlineData(12.345, Quantity.Ratio, 3, "12.3")]
    [InlineData(1.5e-7, Quantity.Ratio, 3, "1.5e-7")]
    [InlineData(100, Quantity.Resistance, 1, "100 Ω")]
    [InlineData(150, Quantity.Resistance, 1, "200 Ω")] // 1 digit: 150 rounds half away from zero
    public void Writes_with_prefix_and_unit(double value, Quantity quantity, int digits, string expected) =>
        Assert.Equal(expected, EngineeringValue.Format(value, quantity, digits));

    [Theory]
    [InlineData(double.NaN)]
    [InlineData(double.PositiveInfinity)]
    public void Refuses_non_finite(double value) =>
        Assert.Throws<ArgumentOutOfRangeException>(() => EngineeringValue.Format(value, Quantity.Resistance));

    [Theory]
    [InlineData(0)]
    [InlineData(18)]
    public void Refuses_digits_out_of_range(int digits) =>
        Assert.Throws<ArgumentOutOfRangeException>(() => EngineeringValue.Format(1, Quantity.Resistance, digits));

    [Theory]
    // IEC 60062 RKM code.
    [InlineData(4700, Quantity.Resistance, "4K7")]
    [InlineData(0.47, Quantity.Resistance, "R47")]
    [InlineData(2.2e6, Quantity.Resistance, "2M2")]
    [InlineData(1, Quantity.Resistance, "1R0")]
    [InlineData(100e3, Quantity.Resistance, "100K")]
    [InlineData(10e3, Quantity.Resistance, "10K")]
    [InlineData(1e3, Quantity.Resistance, "1K0")]
    [InlineData(47, Quantity.Resistance, "47R")]
    [InlineData(470, Quantity.Resistance, "470R")]
    [InlineData(0.1, Quantity.Resistance, "R10")]
    [InlineData(0.047, Quantity.Resistance, "R047")]
    [InlineData(49.9, Quantity.Resistance, "49R9")]
    [InlineData(1.02e6, Quantity.Resistance, "1M02")]
    [InlineData(4.7e-9, Quantity.Capacitance, "4n7")]
    [InlineData(2.2e-12, Quantity.Capacitance, "2p2")]
    [InlineData(100e-9, Quantity.Capacitance, "100n")]
    [InlineData(1e-6, Quantity.Capacitance, "1µ0")]
    [InlineData(0.5e-12, Quantity.Capacitance, "p50")]
    [InlineData(3.3, Quantity.Voltage, "3V3")]
    [InlineData(10e-6, Quantity.Inductance, "10µ")]
    [InlineData(0, Quantity.Resistance, "0R0")]
    public void Writes_rkm_codes(double value, Quantity quantity, string expected) =>
        Assert.Equal(expected, EngineeringValue.FormatRkm(value, quantity));

    [Theory]
    [InlineData(Quantity.Frequency)]
    [InlineData(Quantity.Time)]
    [InlineData(Quantity.Ratio)]
    public void Rkm_needs_a_one_letter_unit(Quantity quantity) =>
        Assert.Throws<ArgumentException>(() => EngineeringValue.FormatRkm(1, quantity));

    [Theory]
    [InlineData(-1)]
    [InlineData(double.NaN)]
    public void Rkm_refuses_negative_and_nan(double value) =>
        Assert.Throws<ArgumentOutOfRangeException>(() => EngineeringValue.FormatRkm(value, Quantity.Resistance));

    [Theory]
    [InlineData(Quantity.Resistance, "\u03A9")] // SI: ohm, GREEK CAPITAL OMEGA
    [InlineData(Quantity.Capacitance, "F")]
    [InlineData(Quantity.Inductance, "H")]
    [InlineData(Quantity.Voltage, "V")]
    [InlineData(Quantity.Current, "A")]
    [InlineData(Quantity.Frequency, "Hz")]
    [InlineData(Quantity.Power, "W")]
    [InlineData(Quantity.Time, "s")]
    [InlineData(Quantity.Ratio, "")]
    public void Unit_symbols(Quantity quantity, string symbol) => Assert.Equal(symbol, EngineeringValue.UnitSymbol(quantity));
}
