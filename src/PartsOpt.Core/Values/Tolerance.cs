using System.Globalization;

namespace PartsOpt.Values;

/// <summary>
/// How far a part may stray from its nominal value, each side given as a positive amount: fractions of the
/// nominal (0.05 for 5 %), or farads when <see cref="IsAbsolute"/> (IEC 60062 writes small capacitors'
/// tolerances as ±0.1…1 pF).
/// </summary>
/// <param name="Minus">How far below nominal, as a positive fraction (or farads when absolute).</param>
/// <param name="Plus">How far above nominal, as a positive fraction (or farads when absolute).</param>
/// <param name="IsAbsolute">True when the amounts are farads rather than fractions.</param>
public readonly record struct Tolerance(double Minus, double Plus, bool IsAbsolute)
{
    /// <summary>The same fraction on both sides: <c>Symmetric(0.05)</c> is ±5 %.</summary>
    public static Tolerance Symmetric(double fraction) => new(fraction, fraction, false);

    /// <summary>The same number of farads on both sides: <c>Absolute(0.5e-12)</c> is ±0.5 pF.</summary>
    public static Tolerance Absolute(double farads) => new(farads, farads, true);

    /// <summary>True when both sides are the same.</summary>
    public bool IsSymmetric => Minus == Plus;

    /// <summary>
    /// This tolerance as fractions of <paramref name="nominal"/>: an absolute one is divided by it, a
    /// relative one is returned unchanged.
    /// </summary>
    public Tolerance RelativeTo(double nominal)
    {
        if (!IsAbsolute)
            return this;
        if (!(nominal > 0) || !double.IsFinite(nominal))
            throw new ArgumentOutOfRangeException(nameof(nominal), nominal, "An absolute tolerance needs a positive nominal.");
        return new(Minus / nominal, Plus / nominal, false);
    }

    /// <summary>The lowest and highest value the tolerance allows around <paramref name="nominal"/>.</summary>
    public (double Min, double Max) Bounds(double nominal) =>
        IsAbsolute ? (nominal - Minus, nominal + Plus) : (nominal * (1 - Minus), nominal * (1 + Plus));

    /// <summary>Writes the tolerance the way a datasheet does: "±5 %", "+80/−20 %", "±0.5 pF".</summary>
    public override string ToString()
    {
        if (IsAbsolute)
            return IsSymmetric ? $"±{Picofarads(Plus)} pF" : $"+{Picofarads(Plus)}/−{Picofarads(Minus)} pF";
        return IsSymmetric ? $"±{Percent(Plus)} %" : $"+{Percent(Plus)}/−{Percent(Minus)} %";
    }

    // Absolute tolerances belong to capacitors under 10 pF (IEC 60062), so they are written in pF.
    private static string Picofarads(double farads) => Scaled(farads, 1e12m);

    private static string Percent(double fraction) => Scaled(fraction, 100);

    private static string Scaled(double value, decimal factor) =>
        (DecimalText.ToDecimal(value) is { } d ? d * factor : (decimal)value * factor)
        .ToString("0.############", CultureInfo.InvariantCulture);
}
