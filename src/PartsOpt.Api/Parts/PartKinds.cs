using PartsOpt.Values;

namespace PartsOpt.Api.Parts;

/// <summary>The names the API and the CSV format use for kinds, tapers and dielectrics.</summary>
public static class PartKinds
{
    private static readonly Dictionary<string, PartKind> ByName = new(StringComparer.OrdinalIgnoreCase)
    {
        ["resistor"] = PartKind.Resistor,
        ["capacitor"] = PartKind.Capacitor,
        ["potentiometer"] = PartKind.Potentiometer,
        ["op-amp"] = PartKind.OpAmp,
    };

    public static string Expected { get; } = string.Join(", ", ByName.Keys);

    public static string Name(PartKind kind) => kind switch
    {
        PartKind.Resistor => "resistor",
        PartKind.Capacitor => "capacitor",
        PartKind.Potentiometer => "potentiometer",
        PartKind.OpAmp => "op-amp",
        _ => throw new ArgumentOutOfRangeException(nameof(kind), kind, null),
    };

    /// <summary>The kind a validated input names.</summary>
    public static PartKind Parse(string? text) =>
        TryParse(text, out var kind) ? kind : throw new ArgumentException($"Unknown kind '{text}'.", nameof(text));

    public static bool TryParse(string? text, out PartKind kind) => ByName.TryGetValue(text?.Trim() ?? "", out kind);

    public static string TaperName(Taper taper) => taper == Taper.Linear ? "linear" : "log";

    public static bool TryParseTaper(string? text, out Taper taper)
    {
        switch (text?.Trim().ToUpperInvariant())
        {
            case "LINEAR" or "LIN":
                taper = Taper.Linear;
                return true;
            case "LOG":
                taper = Taper.Log;
                return true;
            default:
                taper = default;
                return false;
        }
    }

    /// <summary>Dielectric names as EIA-198 spells them (C0G, X7R, …) plus Film and Electrolytic.</summary>
    public static bool TryParseDielectric(string? text, out Dielectric dielectric)
    {
        var t = text?.Trim() ?? "";
        // NP0 is the older name of C0G (EIA-198 class 1); people still write it, often with a zero.
        if (t.Equals("NP0", StringComparison.OrdinalIgnoreCase) || t.Equals("NPO", StringComparison.OrdinalIgnoreCase))
        {
            dielectric = Dielectric.C0G;
            return true;
        }
        return Enum.TryParse(t, ignoreCase: true, out dielectric) && Enum.IsDefined(dielectric) && !int.TryParse(t, out _);
    }

    public static string DielectricExpected { get; } = string.Join(", ", Enum.GetNames<Dielectric>());
}
