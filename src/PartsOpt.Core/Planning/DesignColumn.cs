using PartsOpt.Search;

namespace PartsOpt.Planning;

/// <summary>
/// One way to meet one requirement, as the line-selection model sees it: the lines it needs and its cost
/// per board. A circuit found by the search becomes one column per decoupling capacitor the plan could
/// hold, because the search picks the cheapest decoupler in whatever stock it is given.
/// </summary>
/// <param name="Requirement">Index of the requirement in the question.</param>
/// <param name="Source">The design the search found (its decoupler may differ from <paramref name="Decoupler"/>).</param>
/// <param name="Lines">Line indices the design needs, ascending.</param>
/// <param name="PerBoard">Cost per board with <paramref name="Decoupler"/>, as <see cref="CostModel.PerBoard"/> defines it.</param>
/// <param name="Decoupler">Line index of the decoupling capacitor; null when no line could decouple it.</param>
internal sealed record DesignColumn(int Requirement, FoundDesign Source, IReadOnlyList<int> Lines, decimal PerBoard, int? Decoupler)
{
    /// <summary>What tells two columns apart for the model: the lines and the cost.</summary>
    public string Key => $"{Requirement}|{string.Join(',', Lines)}|{PerBoard}";

    /// <summary>
    /// The columns of a found design: its circuit and op-amps, with each line able to decouple it. The
    /// decoupling pieces (one per op-amp package) are taken off the BOM line that carries them and put on
    /// each decoupler in turn; the cost is recomputed from its definition. When no line of the plan can
    /// decouple the supply, the design stands as found (without decoupling, as the search costs it).
    /// </summary>
    public static IEnumerable<DesignColumn> Of(int requirement, FoundDesign design, SearchRequirement searched, PlanLines lines)
    {
        var packages = design.Bom.Where(b => lines.OpAmp[lines.Index[b.PartNumber]] is not null).Sum(b => b.PerBoard);
        var core = new Dictionary<int, (int Pieces, decimal UnitCost)>();
        foreach (var line in design.Bom)
        {
            var pieces = line.PerBoard - (line.Uses.Contains(SearchVariant.DecouplingSlot) ? packages : 0);
            if (pieces > 0)
                core[lines.Index[line.PartNumber]] = (pieces, line.UnitCost);
        }
        var decouplers = lines.Decouplers(searched.Supply);
        if (decouplers.Count == 0)
        {
            yield return Column(null);
            yield break;
        }
        foreach (var decoupler in decouplers)
            yield return Column(decoupler);

        DesignColumn Column(int? decoupler)
        {
            var use = new Dictionary<int, (int Pieces, decimal UnitCost)>(core);
            if (decoupler is { } d)
                use[d] = (use.GetValueOrDefault(d).Pieces + packages, lines.Passive[d]!.UnitCost);
            var partsCost = use.Values.Sum(u => u.Pieces * u.UnitCost);
            var placements = use.Values.Sum(u => u.Pieces);
            var perBoard = searched.Costs.PerBoard(partsCost, placements, use.Count, searched.BuildQuantity);
            return new DesignColumn(requirement, design, use.Keys.Order().ToList(), perBoard, decoupler);
        }
    }
}
