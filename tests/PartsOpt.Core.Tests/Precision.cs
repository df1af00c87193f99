namespace PartsOpt.Tests;

/// <summary>
/// The one place tests compare floating-point figures. Every check states its tolerance; the
/// message says what was expected, what came out and how far apart they are.
/// </summary>
internal static class Precision
{
    /// <summary>Asserts |actual − expected| ≤ relative·|expected| (or ≤ relative when expected is 0).</summary>
    public static void AlmostEqualRelative(double expected, double actual, double relative, string? what = null)
    {
        var scale = expected == 0 ? 1 : Math.Abs(expected);
        var error = Math.Abs(actual - expected) / scale;
        Assert.True(error <= relative,
            $"{what ?? "value"}: expected {expected:R}, got {actual:R} (relative error {error:E3} > {relative:E3})");
    }

    /// <summary>Asserts |actual − expected| ≤ absolute.</summary>
    public static void AlmostEqualAbsolute(double expected, double actual, double absolute, string? what = null)
    {
        var error = Math.Abs(actual - expected);
        Assert.True(error <= absolute,
            $"{what ?? "value"}: expected {expected:R}, got {actual:R} (error {error:E3} > {absolute:E3})");
    }
}
