namespace PartsOpt.Values;

/// <summary>The physical quantities a part value or a circuit figure is written in.</summary>
public enum Quantity
{
    /// <summary>Resistance, in ohms (Ω).</summary>
    Resistance,
    /// <summary>Capacitance, in farads (F).</summary>
    Capacitance,
    /// <summary>Inductance, in henries (H).</summary>
    Inductance,
    /// <summary>Voltage, in volts (V). May be negative (a V− rail).</summary>
    Voltage,
    /// <summary>Current, in amperes (A). May be negative (flowing out of a node).</summary>
    Current,
    /// <summary>Frequency, in hertz (Hz).</summary>
    Frequency,
    /// <summary>Power, in watts (W).</summary>
    Power,
    /// <summary>Time, in seconds (s).</summary>
    Time,
    /// <summary>A dimensionless ratio (duty cycle, divider ratio); written bare or with %.</summary>
    Ratio,
}

/// <summary>How each quantity is written: its unit symbol and the spellings a person types.</summary>
internal sealed record QuantityUnit(
    string Symbol,
    string Noun,
    IReadOnlyList<string> Symbols,
    IReadOnlyList<string> AfterPrefixOnly,
    IReadOnlyList<string> Words,
    IReadOnlyList<char> RkmUnityMarkers,
    bool MayBeNegative)
{
    private static readonly char[] None = [];

    public static QuantityUnit Of(Quantity quantity) => quantity switch
    {
        // U+03A9 GREEK CAPITAL OMEGA is the written symbol; U+2126 OHM SIGN is accepted as typed.
        Quantity.Resistance => new("Ω", "resistance", ["Ω", "\u2126"], [], ["ohm", "ohms"], ['R', 'r'], false),
        // Lower-case "f" after a prefix ("100uf") is read as farad: two prefixes in a row mean nothing.
        Quantity.Capacitance => new("F", "capacitance", ["F"], ["f"], ["farad", "farads"], ['F'], false),
        Quantity.Inductance => new("H", "inductance", ["H"], ["h"], ["henry", "henries", "henrys"], ['H'], false),
        Quantity.Voltage => new("V", "voltage", ["V", "v"], [], ["volt", "volts"], ['V', 'v'], true),
        Quantity.Current => new("A", "current", ["A"], [], ["amp", "amps", "ampere", "amperes"], ['A'], true),
        Quantity.Frequency => new("Hz", "frequency", ["Hz"], [], ["hz", "hertz"], None, false),
        Quantity.Power => new("W", "power", ["W", "w"], [], ["watt", "watts"], ['W', 'w'], false),
        Quantity.Time => new("s", "time", ["s"], [], ["sec", "second", "seconds"], None, false),
        Quantity.Ratio => new("", "ratio", [], [], [], None, false),
        _ => throw new ArgumentOutOfRangeException(nameof(quantity), quantity, "Unknown quantity."),
    };

    /// <summary>True when <paramref name="text"/> names this unit, alone (not after a prefix).</summary>
    public bool IsUnit(string text) =>
        Symbols.Contains(text, StringComparer.Ordinal) || Words.Contains(text, StringComparer.OrdinalIgnoreCase);

    /// <summary>True when <paramref name="text"/> names this unit right after an SI prefix.</summary>
    public bool IsUnitAfterPrefix(string text) =>
        IsUnit(text) || AfterPrefixOnly.Contains(text, StringComparer.Ordinal);
}
