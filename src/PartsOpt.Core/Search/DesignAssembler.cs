using System.Globalization;
using PartsOpt.Topologies;

namespace PartsOpt.Search;

/// <summary>
/// Turns accepted assignments into ranked designs: global order by cost (then frequency error, then margin,
/// then a fixed key), the first K plus the best of any topology not yet listed, each with its BOM, cost
/// and notes on decoupling and unused op-amp sections.
/// </summary>
internal static class DesignAssembler
{
    public static IReadOnlyList<FoundDesign> Rank(IEnumerable<(SearchVariant Variant, AcceptedChoice Choice)> found, int wanted)
    {
        var ordered = found
            .OrderBy(f => f.Choice.Objective)
            .ThenBy(f => f.Choice.Verdict.FrequencyError)
            .ThenByDescending(f => f.Choice.Verdict.Margin)
            .ThenBy(f => Key(f.Variant, f.Choice.Choice), StringComparer.Ordinal)
            .ToList();
        var listed = ordered.Take(wanted).ToList();
        foreach (var best in ordered.GroupBy(f => f.Variant.Topology).Select(g => g.First()))
            if (!listed.Contains(best))
                listed.Add(best);
        var firstOfTopology = ordered.GroupBy(f => f.Variant.Topology).Select(g => g.First()).ToHashSet();
        return listed.Select((f, i) => Assemble(i + 1, f.Variant, f.Choice, firstOfTopology.Contains(f))).ToList();
    }

    /// <summary>A fixed key for the last tie-break: topology, op-amps, then the part numbers role by role.</summary>
    internal static string Key(SearchVariant variant, int[] choice) =>
        string.Join('|', [variant.Topology.ToWireName(), variant.Describe(),
            .. variant.Slots.Select((s, i) => s.Options[choice[i]].Tag switch
            {
                StockChoice c => c.Label,
                int line => variant.Context.Lines[line].PartNumber,
                _ => "",
            })]);

    private static FoundDesign Assemble(int rank, SearchVariant variant, AcceptedChoice accepted, bool bestOfTopology)
    {
        var choice = accepted.Choice;
        var design = variant.DesignOf(choice);
        var evaluation = CircuitAnalysis.Analyse(design);
        var roles = variant.ChoicesOf(choice);
        var problem = variant.Problem;
        var context = variant.Context;
        var quantity = context.Requirement.BuildQuantity;

        var uses = new SortedDictionary<int, (List<string> Uses, int PerBoard)>();
        void Use(int line, string what, int count)
        {
            var entry = uses.TryGetValue(line, out var e) ? e : ([], 0);
            if (!entry.Uses.Contains(what))
                entry.Uses.Add(what);
            uses[line] = (entry.Uses, entry.PerBoard + count);
        }
        foreach (var (role, stockChoice) in roles)
            foreach (var index in stockChoice.PartIndices)
                Use(index, role, 1);
        var sectionFunctions = evaluation.Sections.Where(s => s.PartNumber == design.Amplifier.PartNumber).Select(s => s.Function);
        Use(context.OpAmpLine(variant.AmplifierIndex), string.Join(", ", sectionFunctions), variant.AmplifierPackages);
        if (variant.ComparatorIndex is { } comparator)
            Use(context.OpAmpLine(comparator), "comparator", 1);
        var notes = new List<string>();
        if (problem.Slots.Count > variant.RoleNames.Count)
        {
            var line = (int)problem.Slots[^1].Options[choice[^1]].Tag!;
            Use(line, "decoupling", variant.Packages);
            notes.Add(Say($"Decoupling: one {context.Lines[line].PartNumber} from V+ to V− beside each of the {variant.Packages} op-amp package(s) (common practice)."));
        }
        else
        {
            notes.Add(Say($"Decoupling capacitor missing from stock: buy {variant.Packages * quantity} × 100 nF X7R (one per op-amp package per board, common practice); not in the cost."));
        }
        notes.AddRange(UnusedSections(variant, design));
        notes.AddRange(roles.Where(r => r.Value.Parts.Count > 1).Select(r =>
            Say($"{r.Key} is {r.Value.Label} ({(r.Value.Series ? "series" : "parallel")}, {r.Value.Value:G4} {Unit(r.Key)}).")));

        var bom = uses.Select(kv => new BomLine(context.Lines[kv.Key].PartNumber, kv.Value.Uses, kv.Value.PerBoard,
            context.Lines[kv.Key].UnitCost, kv.Value.PerBoard * quantity, context.Lines[kv.Key].Available)).ToList();
        var parts = roles.ToDictionary(kv => kv.Key, kv => kv.Value.PartNumbers);
        return new FoundDesign(rank, design, evaluation, parts, bom, problem.CostOf(choice),
            accepted.Verdict.FrequencyError, accepted.Verdict.Margin, notes, bestOfTopology);
    }

    /// <summary>
    /// Sections fitted but not used: an op-amp section is wired as a voltage follower with its
    /// non-inverting input at the reference; a comparator section gets its non-inverting input at the
    /// reference and its inverting input at V+, so its output rests low (common practice).
    /// </summary>
    private static IEnumerable<string> UnusedSections(SearchVariant variant, CircuitDesign design)
    {
        var reference = design.Supply.IsSingle ? "the mid-rail reference" : "0 V";
        var perPackage = design.Amplifier.SectionsPerPackage;
        var spare = Enumerable.Range(variant.Functions, variant.AmplifierPackages * perPackage - variant.Functions)
            .Select(i => Designator(i / perPackage + 1, i % perPackage)).ToList();
        if (spare.Count > 0)
            yield return $"Unused section(s) {string.Join(", ", spare)} of {design.Amplifier.PartNumber}: each wired as a voltage follower " +
                $"(output to inverting input) with its non-inverting input at {reference}, so it neither oscillates nor drifts to a rail (common practice).";
        if (design.Comparator is { } comparator && comparator.SectionsPerPackage > 1)
        {
            var package = variant.AmplifierPackages + 1;
            var spareCmp = Enumerable.Range(1, comparator.SectionsPerPackage - 1).Select(s => Designator(package, s));
            yield return comparator.IsComparator
                ? $"Unused section(s) {string.Join(", ", spareCmp)} of {comparator.PartNumber}: non-inverting input at {reference}, inverting input at V+, so the output rests in one state (common practice)."
                : $"Unused section(s) {string.Join(", ", spareCmp)} of {comparator.PartNumber}: each wired as a voltage follower with its non-inverting input at {reference} (common practice).";
        }
    }

    private static string Designator(int package, int section) =>
        string.Create(CultureInfo.InvariantCulture, $"U{package}{(char)('A' + section)}");

    private static string Unit(string role) => Roles.KindOf(role) == RoleKind.Capacitor ? "F" : "Ω";

    private static string Say(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
