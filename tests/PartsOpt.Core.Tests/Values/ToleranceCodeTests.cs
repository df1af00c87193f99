using PartsOpt.Values;

namespace PartsOpt.Tests.Values;

public class ToleranceCodeTests
{
    [Theory]
    // IEC 60062 tolerance letters.
    [InlineData("B", 0.001, 0.001)]
    [InlineData("C", 0.0025, 0.0025)]
    [InlineData("D", 0.005, 0.005)]
    [InlineData("F", 0.01, 0.01)]
    [InlineData("G", 0.02, 0.02)]
    [InlineData("J", 0.05, 0.05)]
    [InlineData("K", 0.10, 0.10)]
    [InlineData("M", 0.20, 0.20)]
    [InlineData("Z", 0.20, 0.80)] // +80/−20 %
    [InlineData("j", 0.05, 0.05)]
    [InlineData(" K ", 0.10, 0.10)]
    // Percentages and fractions as people write them.
    [InlineData("5%", 0.05, 0.05)]
    [InlineData("5 %", 0.05, 0.05)]
    [InlineData("±5 %", 0.05, 0.05)]
    [InlineData("± 5%", 0.05, 0.05)]
    [InlineData("+/-5%", 0.05, 0.05)]
    [InlineData("+-1%", 0.01, 0.01)]
    [InlineData("0.1%", 0.001, 0.001)]
    [InlineData("0.25 %", 0.0025, 0.0025)]
    [InlineData("0.05", 0.05, 0.05)]
    [InlineData("±0.01", 0.01, 0.01)]
    [InlineData("+80/-20%", 0.20, 0.80)]
    [InlineData("+80 % / -20 %", 0.20, 0.80)]
    [InlineData("-20/+80%", 0.20, 0.80)]
    [InlineData("+80/\u221220 %", 0.20, 0.80)] // U+2212 MINUS SIGN
    [InlineData("+50/-10%", 0.10, 0.50)]
    [InlineData("+0/-20%", 0.20, 0)]
    [InlineData("0%", 0, 0)]
    public void Reads_relative_tolerances(string text, double minus, double plus)
    {
        var tolerance = ToleranceCode.Parse(text);
        Assert.Equal(new Tolerance(minus, plus, false), tolerance);
    }

    [Theory]
    // IEC 60062: under 10 pF, B C D F are absolute.
    [InlineData("B", 0.1e-12)]
    [InlineData("C", 0.25e-12)]
    [InlineData("D", 0.5e-12)]
    [InlineData("F", 1e-12)]
    public void Small_capacitors_take_absolute_letters(string letter, double farads) =>
        Assert.Equal(Tolerance.Absolute(farads), ToleranceCode.Parse(letter, capacitanceF: 4.7e-12));

    [Theory]
    [InlineData("F", 10e-12, 0.01)] // 10 pF is not under 10 pF: relative
    [InlineData("F", 100e-9, 0.01)]
    [InlineData("J", 2.2e-12, 0.05)] // J is always relative
    [InlineData("K", 1e-12, 0.10)]
    public void Other_capacitors_and_letters_stay_relative(string letter, double capacitanceF, double fraction) =>
        Assert.Equal(Tolerance.Symmetric(fraction), ToleranceCode.Parse(letter, capacitanceF));

    [Theory]
    [InlineData("±0.5 pF", 0.5e-12)]
    [InlineData("0.25pF", 0.25e-12)]
    [InlineData("± 1 pF", 1e-12)]
    public void Reads_absolute_picofarads(string text, double farads) =>
        Assert.Equal(Tolerance.Absolute(farads), ToleranceCode.Parse(text));

    [Theory]
    [InlineData("")]
    [InlineData("  ")]
    [InlineData("X")] // not an IEC 60062 tolerance letter
    [InlineData("JJ")]
    [InlineData("5")] // ambiguous: 5 % or 500 %?
    [InlineData("1.5")]
    [InlineData("+5%")] // one-sided
    [InlineData("-5%")]
    [InlineData("+80/+20%")]
    [InlineData("0,5%")]
    [InlineData("5%%")]
    [InlineData("abc")]
    [InlineData("±150%")] // cannot fall by more than 100 %
    [InlineData("NaN")]
    [InlineData("-0.5 pF")]
    [InlineData("±5 nH")]
    public void Refuses_what_is_not_a_tolerance(string text)
    {
        var error = Assert.Throws<ToleranceFormatException>(() => ToleranceCode.Parse(text));
        Assert.Equal(text, error.Text);
        Assert.Contains($"'{text}'", error.Message, StringComparison.Ordinal);
        Assert.IsAssignableFrom<FormatException>(error);
        Assert.False(ToleranceCode.TryParse(text, out _));
    }

    [Theory]
    [InlineData(0.001, 0.001, 'B')] // IEC 60062
    [InlineData(0.0025, 0.0025, 'C')]
    [InlineData(0.005, 0.005, 'D')]
    [InlineData(0.01, 0.01, 'F')]
    [InlineData(0.02, 0.02, 'G')]
    [InlineData(0.05, 0.05, 'J')]
    [InlineData(0.10, 0.10, 'K')]
    [InlineData(0.20, 0.20, 'M')]
    [InlineData(0.20, 0.80, 'Z')]
    public void Letter_for_a_relative_tolerance(double minus, double plus, char letter) =>
        Assert.Equal(letter, ToleranceCode.LetterFor(new Tolerance(minus, plus, false)));

    [Theory]
    [InlineData(0.1e-12, 'B')] // IEC 60062, capacitors under 10 pF
    [InlineData(0.25e-12, 'C')]
    [InlineData(0.5e-12, 'D')]
    [InlineData(1e-12, 'F')]
    public void Letter_for_an_absolute_tolerance(double farads, char letter) =>
        Assert.Equal(letter, ToleranceCode.LetterFor(Tolerance.Absolute(farads)));

    [Fact]
    public void No_letter_for_other_tolerances()
    {
        Assert.Null(ToleranceCode.LetterFor(Tolerance.Symmetric(0.03)));
        Assert.Null(ToleranceCode.LetterFor(new Tolerance(0.80, 0.20, false))); // Z turned upside down
        Assert.Null(ToleranceCode.LetterFor(Tolerance.Absolute(2e-12)));
        Assert.Null(ToleranceCode.LetterFor(new Tolerance(0.001, 0.001, true))); // 1 mF absolute is not B
    }

    [Theory]
    [InlineData("B")]
    [InlineData("C")]
    [InlineData("D")]
    [InlineData("F")]
    [InlineData("G")]
    [InlineData("J")]
    [InlineData("K")]
    [InlineData("M")]
    [InlineData("Z")]
    public void Letters_round_trip(string letter) =>
        Assert.Equal(letter[0], ToleranceCode.LetterFor(ToleranceCode.Parse(letter)));

    [Fact]
    public void Symmetry_and_bounds()
    {
        Assert.True(Tolerance.Symmetric(0.05).IsSymmetric);
        Assert.False(ToleranceCode.Parse("Z").IsSymmetric);
        var (min, max) = ToleranceCode.Parse("Z").Bounds(100e-9);
        Precision.AlmostEqualRelative(80e-9, min, 1e-12, "Z lower bound"); // −20 %
        Precision.AlmostEqualRelative(180e-9, max, 1e-12, "Z upper bound"); // +80 %
        var (aMin, aMax) = Tolerance.Absolute(0.5e-12).Bounds(4.7e-12);
        Precision.AlmostEqualRelative(4.2e-12, aMin, 1e-12, "D lower bound at 4.7 pF");
        Precision.AlmostEqualRelative(5.2e-12, aMax, 1e-12, "D upper bound at 4.7 pF");
    }

    [Fact]
    public void Absolute_tolerance_relative_to_its_nominal()
    {
        var relative = Tolerance.Absolute(0.5e-12).RelativeTo(5e-12);
        Assert.False(relative.IsAbsolute);
        Precision.AlmostEqualRelative(0.1, relative.Minus, 1e-12, "±0.5 pF at 5 pF");
        Assert.Equal(Tolerance.Symmetric(0.05), Tolerance.Symmetric(0.05).RelativeTo(1));
        Assert.Throws<ArgumentOutOfRangeException>(() => Tolerance.Absolute(1e-12).RelativeTo(0));
    }

    [Theory]
    [InlineData("J", "±5 %")]
    [InlineData("Z", "+80/−20 %")]
    [InlineData("0.25%", "±0.25 %")]
    [InlineData("±0.5 pF", "±0.5 pF")]
    [InlineData("C", "±0.25 pF", 1e-12)]
    public void Writes_tolerances(string text, string expected, double? capacitanceF = null) =>
        Assert.Equal(expected, ToleranceCode.Parse(text, capacitanceF).ToString());
}
