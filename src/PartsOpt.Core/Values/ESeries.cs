namespace PartsOpt.Values;

/// <summary>
/// The IEC 60063 preferred-number series, named by how many values each holds per decade. E3…E24 carry two
/// significant digits, E48…E192 three.
/// </summary>
public enum ESeries
{
    /// <summary>3 values per decade (tolerances wider than 20 %).</summary>
    E3,
    /// <summary>6 values per decade (±20 %).</summary>
    E6,
    /// <summary>12 values per decade (±10 %).</summary>
    E12,
    /// <summary>24 values per decade (±5 %).</summary>
    E24,
    /// <summary>48 values per decade (±2 %).</summary>
    E48,
    /// <summary>96 values per decade (±1 %).</summary>
    E96,
    /// <summary>192 values per decade (±0.5 % and tighter).</summary>
    E192,
}
