namespace PartsOpt.Analysis;

/// <summary>Which corners an extreme-value search evaluated.</summary>
public enum CornerMethod
{
    /// <summary>All 2^n corners of the n parameters that vary, plus the nominal point.</summary>
    AllCorners,

    /// <summary>Per figure, the two corners the sensitivities at nominal point to, plus the nominal point.</summary>
    SensitivityDirected,
}

/// <summary>Where a parameter sits in its band at a corner.</summary>
public enum ToleranceEnd
{
    /// <summary>At nominal (the parameter does not vary, or does not move the figure).</summary>
    Nominal,

    /// <summary>At nominal·(1 − minus tolerance).</summary>
    Minus,

    /// <summary>At nominal·(1 + plus tolerance).</summary>
    Plus,
}

/// <summary>One parameter's setting at a corner.</summary>
/// <param name="Parameter">Parameter (role) name.</param>
/// <param name="End">Which end of its band.</param>
/// <param name="Value">The value there, in SI units.</param>
public sealed record CornerSetting(string Parameter, ToleranceEnd End, double Value);

/// <summary>One figure's extremes over the evaluated corners, and the corners that produced them.</summary>
/// <param name="Figure">Figure name.</param>
/// <param name="Unit">SI unit of the figure.</param>
/// <param name="Nominal">The figure at nominal values; null where undefined.</param>
/// <param name="Min">Lowest value found; null where no evaluated point gave a value.</param>
/// <param name="Max">Highest value found; null where no evaluated point gave a value.</param>
/// <param name="MinDeviationPercent">(Min − nominal)/|nominal| in %; null where the nominal is zero or undefined.</param>
/// <param name="MaxDeviationPercent">(Max − nominal)/|nominal| in %.</param>
/// <param name="MinCorner">Every parameter's setting at the point that gave <paramref name="Min"/>.</param>
/// <param name="MaxCorner">Every parameter's setting at the point that gave <paramref name="Max"/>.</param>
/// <param name="UndefinedCorners">Evaluated points at which the figure did not exist (the circuit
/// stopped working there): a design that fails at a corner, whatever its min and max say.</param>
public sealed record FigureExtremes(
    string Figure,
    string Unit,
    double? Nominal,
    double? Min,
    double? Max,
    double? MinDeviationPercent,
    double? MaxDeviationPercent,
    IReadOnlyList<CornerSetting>? MinCorner,
    IReadOnlyList<CornerSetting>? MaxCorner,
    int UndefinedCorners);
