using System.Globalization;
using PartsOpt.Topologies;

namespace PartsOpt.Search;

/// <summary>
/// One way to fill a role from stock: a single part, or two in series or parallel. Knows the value it
/// gives, the stock it draws and the part the engine sees.
/// </summary>
internal sealed record StockChoice(IReadOnlyList<int> PartIndices, IReadOnlyList<StockPart> Parts, bool Series)
{
    /// <summary>Nominal value of the choice: the part's, or the series or parallel value of the pair.</summary>
    public double Value => Parts.Count == 1
        ? Parts[0].Value
        : AddsUp ? Parts[0].Value + Parts[1].Value : Parts[0].Value * Parts[1].Value / (Parts[0].Value + Parts[1].Value);

    // Resistors add in series, capacitors in parallel.
    private bool AddsUp => Series == (Parts[0].Kind != RoleKind.Capacitor);

    /// <summary>Part numbers as the BOM lists them against the role.</summary>
    public IReadOnlyList<string> PartNumbers => Parts.Select(p => p.PartNumber).ToList();

    /// <summary>How a person reads the choice: "R-10K" or "R-10K + R-4K7" (series) or "C-10N ∥ C-4N7".</summary>
    public string Label => Parts.Count == 1
        ? Parts[0].PartNumber
        : string.Join(Series ? " + " : " ∥ ", PartNumbers);

    /// <summary>The part the engine sees: the combination's value, the looser tolerance, the weaker rating.</summary>
    public RolePart ToRolePart()
    {
        if (Parts.Count == 1)
            return Parts[0].ToRolePart();
        var first = Parts[0].ToRolePart();
        var second = Parts[1].ToRolePart();
        return first with
        {
            Value = Value,
            ToleranceMinus = Math.Max(first.ToleranceMinus, second.ToleranceMinus),
            TolerancePlus = Math.Max(first.TolerancePlus, second.TolerancePlus),
            PartNumber = Label,
            PowerRatingW = Min(first.PowerRatingW, second.PowerRatingW),
            VoltageRatingV = Min(first.VoltageRatingV, second.VoltageRatingV),
        };
    }

    private static double? Min(double? a, double? b) => a is { } x && b is { } y ? Math.Min(x, y) : a ?? b;
}

/// <summary>
/// The stock choices for each kind of role, built once per search: every stocked part of the kind in
/// part-number order, then (when combinations are allowed) every pair in series and in parallel.
/// Capacitor pairs must share a dielectric; potentiometers are never combined.
/// </summary>
internal sealed class RoleOptions
{
    private readonly Dictionary<RoleKind, List<StockChoice>> byKind = [];

    public RoleOptions(IReadOnlyList<StockPart> parts, bool allowCombinations)
    {
        foreach (var kind in Enum.GetValues<RoleKind>())
        {
            var indices = Enumerable.Range(0, parts.Count)
                .Where(i => parts[i].Kind == kind && parts[i].Value > 0 && double.IsFinite(parts[i].Value))
                .OrderBy(i => parts[i].PartNumber, StringComparer.Ordinal)
                .ThenBy(i => i)
                .ToList();
            var choices = indices.Select(i => new StockChoice([i], [parts[i]], false)).ToList();
            if (allowCombinations && kind != RoleKind.Potentiometer)
            {
                foreach (var series in new[] { true, false })
                    for (var a = 0; a < indices.Count; a++)
                        for (var b = a; b < indices.Count; b++)
                        {
                            var (i, j) = (indices[a], indices[b]);
                            if (kind == RoleKind.Capacitor && parts[i].Dielectric != parts[j].Dielectric)
                                continue;
                            choices.Add(new StockChoice([i, j], [parts[i], parts[j]], series));
                        }
            }
            byKind[kind] = choices;
        }
    }

    /// <summary>The choices for a role.</summary>
    public IReadOnlyList<StockChoice> For(string role) => byKind[Roles.KindOf(role)];

    /// <summary>The choices for every role of a kind.</summary>
    public IReadOnlyList<StockChoice> For(RoleKind kind) => byKind[kind];

    /// <summary>The slot option of a choice: its draws on the stock lines (one line per part index).</summary>
    public static SlotOption ToOption(StockChoice choice) =>
        new(choice.PartIndices.GroupBy(i => i).Select(g => new PartDraw(g.Key, g.Count())).ToList(),
            Math.Log(choice.Value), choice);

    /// <summary>A value as a person writes it, for reasons and hints.</summary>
    public static string Format(double value, string unit) =>
        string.Create(CultureInfo.InvariantCulture, $"{value:G3} {unit}");
}
