using PartsOpt.Values;

namespace PartsOpt.Tests.Values;

public class PreferredValuesTests
{
    // IEC 60063:2015 tables, typed out (from memory of the standard's tables; they agree with the
    // standard's rule for E96 and with the historical E24 values).
    private static readonly double[] E24Table =
    [
        1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0,
        3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1,
    ];

    private static readonly double[] E12Table = [1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2];
    private static readonly double[] E6Table = [1.0, 1.5, 2.2, 3.3, 4.7, 6.8];
    private static readonly double[] E3Table = [1.0, 2.2, 4.7];

    internal static readonly double[] E96Table =
    [
        1.00, 1.02, 1.05, 1.07, 1.10, 1.13, 1.15, 1.18, 1.21, 1.24, 1.27, 1.30,
        1.33, 1.37, 1.40, 1.43, 1.47, 1.50, 1.54, 1.58, 1.62, 1.65, 1.69, 1.74,
        1.78, 1.82, 1.87, 1.91, 1.96, 2.00, 2.05, 2.10, 2.15, 2.21, 2.26, 2.32,
        2.37, 2.43, 2.49, 2.55, 2.61, 2.67, 2.74, 2.80, 2.87, 2.94, 3.01, 3.09,
        3.16, 3.24, 3.32, 3.40, 3.48, 3.57, 3.65, 3.74, 3.83, 3.92, 4.02, 4.12,
        4.22, 4.32, 4.42, 4.53, 4.64, 4.75, 4.87, 4.99, 5.11, 5.23, 5.36, 5.49,
        5.62, 5.76, 5.90, 6.04, 6.19, 6.34, 6.49, 6.65, 6.81, 6.98, 7.15, 7.32,
        7.50, 7.68, 7.87, 8.06, 8.25, 8.45, 8.66, 8.87, 9.09, 9.31, 9.53, 9.76,
    ];

    [Fact]
    public void E24_is_the_standard_table() => Assert.Equal(E24Table, PreferredValues.Decade(ESeries.E24)); // IEC 60063

    [Fact]
    public void E12_is_the_standard_table() => Assert.Equal(E12Table, PreferredValues.Decade(ESeries.E12)); // IEC 60063

    [Fact]
    public void E6_is_the_standard_table() => Assert.Equal(E6Table, PreferredValues.Decade(ESeries.E6)); // IEC 60063

    [Fact]
    public void E3_is_the_standard_table() => Assert.Equal(E3Table, PreferredValues.Decade(ESeries.E3)); // IEC 60063

    [Fact]
    public void E96_is_the_standard_table()
    {
        Assert.Equal(96, E96Table.Length);
        Assert.Equal(E96Table, PreferredValues.Decade(ESeries.E96)); // IEC 60063
    }

    [Fact]
    public void E48_is_every_second_E96_value() => // IEC 60063
        Assert.Equal(E96Table.Where((_, i) => i % 2 == 0), PreferredValues.Decade(ESeries.E48));

    [Fact]
    public void E96_is_every_second_E192_value() => // IEC 60063: the 3-digit series nest
        Assert.Equal(PreferredValues.Decade(ESeries.E96), PreferredValues.Decade(ESeries.E192).Where((_, i) => i % 2 == 0));

    [Theory]
    // IEC 60063 E192, spot checks (from memory), around the one exception 9.20.
    [InlineData(0, 1.00)]
    [InlineData(1, 1.01)]
    [InlineData(3, 1.04)]
    [InlineData(7, 1.09)]
    [InlineData(15, 1.20)]
    [InlineData(183, 8.98)]
    [InlineData(184, 9.09)]
    [InlineData(185, 9.20)] // the standard's exception: the rule gives 9.19
    [InlineData(186, 9.31)]
    [InlineData(187, 9.42)]
    [InlineData(189, 9.65)]
    [InlineData(191, 9.88)]
    public void E192_spot_checks(int index, double expected) =>
        Assert.Equal(expected, PreferredValues.Decade(ESeries.E192)[index]);

    [Fact]
    public void The_E192_exception_is_where_the_rule_gives_9_19() =>
        Assert.Equal(9.19, Math.Round(Math.Pow(10, 185.0 / 192), 2)); // rule of IEC 60063, checked by arithmetic

    [Theory]
    [InlineData(ESeries.E3, 3)]
    [InlineData(ESeries.E6, 6)]
    [InlineData(ESeries.E12, 12)]
    [InlineData(ESeries.E24, 24)]
    [InlineData(ESeries.E48, 48)]
    [InlineData(ESeries.E96, 96)]
    [InlineData(ESeries.E192, 192)]
    public void Each_series_has_its_count_ascending_in_one_decade(ESeries series, int count)
    {
        var decade = PreferredValues.Decade(series);
        Assert.Equal(count, decade.Count);
        Assert.Equal(count, PreferredValues.Count(series));
        Assert.Equal(1.0, decade[0]);
        Assert.True(decade[^1] < 10);
        Assert.True(decade.Zip(decade.Skip(1)).All(p => p.First < p.Second));
    }

    [Fact]
    public void E24_keeps_historical_values_that_differ_from_the_rule()
    {
        // IEC 60063: these E24 values differ from round(10^(i/24), 1).
        double[] historical = [2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 8.2];
        var e24 = PreferredValues.Decade(ESeries.E24);
        var differing = e24.Where((v, i) => v != Math.Round(Math.Pow(10, i / 24.0), 1, MidpointRounding.AwayFromZero));
        Assert.Equal(historical, differing);
    }

    [Fact]
    public void E24_and_E96_share_six_values() => // IEC 60063
        Assert.Equal([1.0, 1.1, 1.3, 1.5, 2.0, 7.5],
            PreferredValues.Decade(ESeries.E24).Intersect(PreferredValues.Decade(ESeries.E96)));

    [Theory]
    [InlineData(9.6, ESeries.E12, 10)] // ln(10/9.6) = 0.041 < ln(9.6/8.2) = 0.158
    [InlineData(9.05, ESeries.E12, 8.2)] // below √(8.2·10) = 9.0554
    [InlineData(9.06, ESeries.E12, 10)] // above it
    [InlineData(0.96, ESeries.E12, 1)] // the same edge one decade down
    [InlineData(96e3, ESeries.E12, 100e3)]
    [InlineData(4600, ESeries.E24, 4700)]
    [InlineData(4495, ESeries.E24, 4300)] // below √(4.3·4.7) = 4.49555 (in kΩ)
    [InlineData(4496, ESeries.E24, 4700)] // above it
    [InlineData(4500, ESeries.E24, 4700)] // 200 Ω from both, nearer 4.7 kΩ by ratio
    [InlineData(4.52, ESeries.E24, 4.7)]
    [InlineData(4990, ESeries.E96, 4990)]
    [InlineData(5000, ESeries.E96, 4990)]
    [InlineData(9.87, ESeries.E96, 9.76)] // below √(9.76·10) = 9.8793
    [InlineData(9.9, ESeries.E96, 10)] // above it: snaps into the next decade
    [InlineData(9.9, ESeries.E192, 9.88)]
    [InlineData(9.95, ESeries.E192, 10)]
    [InlineData(1.01, ESeries.E24, 1)]
    [InlineData(1e-13, ESeries.E6, 1e-13)]
    [InlineData(2.3e-9, ESeries.E3, 2.2e-9)]
    [InlineData(3.3e6, ESeries.E6, 3.3e6)]
    [InlineData(9.183, ESeries.E192, 9.2)] // the exception is a member
    public void Nearest_snaps_in_log_distance(double value, ESeries series, double expected) =>
        Assert.Equal(expected, PreferredValues.Nearest(value, series));

    [Theory]
    [InlineData(0)]
    [InlineData(-1)]
    [InlineData(double.NaN)]
    [InlineData(double.PositiveInfinity)]
    public void Nearest_refuses_non_positive(double value) =>
        Assert.Throws<ArgumentOutOfRangeException>(() => PreferredValues.Nearest(value, ESeries.E24));

    [Fact]
    public void InRange_crosses_decades_with_exact_decimals()
    {
        var values = PreferredValues.InRange(ESeries.E12, 3300, 22e3).ToArray();
        // IEC 60063 E12 members from 3.3 kΩ to 22 kΩ, as the decimals printed on parts.
        Assert.Equal([3300, 3900, 4700, 5600, 6800, 8200, 10e3, 12e3, 15e3, 18e3, 22e3], values);
        Assert.Contains(4.7e3, values);
        Assert.Equal("4700", values[2].ToString(System.Globalization.CultureInfo.InvariantCulture));
    }

    [Fact]
    public void InRange_gives_printed_decimals_in_small_decades()
    {
        var values = PreferredValues.InRange(ESeries.E6, 1e-12, 1e-9).ToArray();
        Assert.Equal([1e-12, 1.5e-12, 2.2e-12, 3.3e-12, 4.7e-12, 6.8e-12, 10e-12, 15e-12, 22e-12, 33e-12, 47e-12,
            68e-12, 100e-12, 150e-12, 220e-12, 330e-12, 470e-12, 680e-12, 1e-9], values);
    }

    [Fact]
    public void InRange_counts_every_member_of_many_decades()
    {
        Assert.Equal(7 * 96 + 1, PreferredValues.InRange(ESeries.E96, 1, 10e6).Count()); // 1 Ω … 10 MΩ
        Assert.Equal(6 * 24, PreferredValues.InRange(ESeries.E24, 1, 999e3).Count());
    }

    [Fact]
    public void InRange_keeps_bounds_computed_in_floating_point()
    {
        var low = 4.7 * 1000; // may differ from 4700 in the last bit
        Assert.Equal([4700, 5600, 6800], PreferredValues.InRange(ESeries.E12, low, 0.68 * 10000));
    }

    [Fact]
    public void InRange_between_members_is_empty() => Assert.Empty(PreferredValues.InRange(ESeries.E12, 4800, 5500));

    [Theory]
    [InlineData(0, 10)]
    [InlineData(10, 1)]
    [InlineData(-1, 10)]
    [InlineData(1, double.PositiveInfinity)]
    public void InRange_refuses_bad_bounds(double min, double max) =>
        Assert.Throws<ArgumentOutOfRangeException>(() => PreferredValues.InRange(ESeries.E12, min, max));

    [Theory]
    [InlineData(4700, ESeries.E3)] // IEC 60063
    [InlineData(2.2e-9, ESeries.E3)]
    [InlineData(10, ESeries.E3)]
    [InlineData(1.5e6, ESeries.E6)]
    [InlineData(6.8e-12, ESeries.E6)]
    [InlineData(8200, ESeries.E12)]
    [InlineData(2.7, ESeries.E12)]
    [InlineData(4300, ESeries.E24)]
    [InlineData(9.1e-9, ESeries.E24)]
    [InlineData(4870, ESeries.E48)]
    [InlineData(4990, ESeries.E96)] // 4.99 is an odd E96 position: not E48
    [InlineData(1.05e3, ESeries.E48)]
    [InlineData(1.02e3, ESeries.E96)]
    [InlineData(49.9, ESeries.E96)]
    [InlineData(9.2, ESeries.E192)] // the exception
    [InlineData(1.01e5, ESeries.E192)]
    public void SmallestSeriesContaining_finds_the_first_series(double value, ESeries expected) =>
        Assert.Equal(expected, PreferredValues.SmallestSeriesContaining(value));

    [Theory]
    [InlineData(4800)]
    [InlineData(9.19)] // the rule's value the standard replaced
    [InlineData(1.234)]
    [InlineData(0)]
    [InlineData(-4700)]
    [InlineData(double.NaN)]
    public void SmallestSeriesContaining_is_null_for_non_members(double value) =>
        Assert.Null(PreferredValues.SmallestSeriesContaining(value));

    [Theory]
    [InlineData(ESeries.E24, 4700, true)]
    [InlineData(ESeries.E96, 4700, false)] // 4.7 is not in E96 (4.64, 4.75)
    [InlineData(ESeries.E48, 4750, false)] // E96 only
    [InlineData(ESeries.E96, 4750, true)]
    [InlineData(ESeries.E12, 4699.9999999, true)] // within 1e-9
    [InlineData(ESeries.E12, 4699.99, false)]
    public void Contains_tests_membership(ESeries series, double value, bool expected) =>
        Assert.Equal(expected, PreferredValues.Contains(series, value));

    [Fact]
    public void Contains_takes_a_tolerance() => Assert.True(PreferredValues.Contains(ESeries.E12, 4699, 1e-3));

    [Theory]
    // IEC 60063 nominal tolerances; E3 is "wider than 20 %" in the standard (from memory), 40 % common practice.
    [InlineData(ESeries.E3, 0.40)]
    [InlineData(ESeries.E6, 0.20)]
    [InlineData(ESeries.E12, 0.10)]
    [InlineData(ESeries.E24, 0.05)]
    [InlineData(ESeries.E48, 0.02)]
    [InlineData(ESeries.E96, 0.01)]
    [InlineData(ESeries.E192, 0.005)]
    public void Nominal_tolerances(ESeries series, double tolerance) =>
        Assert.Equal(tolerance, PreferredValues.NominalTolerance(series));

    [Theory]
    [InlineData("E24", ESeries.E24)]
    [InlineData("e24", ESeries.E24)]
    [InlineData(" E96 ", ESeries.E96)]
    [InlineData("E3", ESeries.E3)]
    [InlineData("e192", ESeries.E192)]
    public void Parses_series_names(string text, ESeries expected) => Assert.Equal(expected, PreferredValues.Parse(text));

    [Theory]
    [InlineData("")]
    [InlineData("E")]
    [InlineData("E5")]
    [InlineData("E024")]
    [InlineData("24")]
    [InlineData("3")] // an enum's number is not a name
    [InlineData("E24x")]
    [InlineData("F24")]
    public void Refuses_unknown_series(string text)
    {
        var error = Assert.Throws<ArgumentException>(() => PreferredValues.Parse(text));
        Assert.Contains($"'{text}'", error.Message, StringComparison.Ordinal);
    }
}
