namespace PartsOpt.Search;

/// <summary>
/// What one design costs: the parts on a board, how many placements and distinct part numbers it takes,
/// and the cost per board under a <see cref="CostModel"/>.
/// </summary>
/// <param name="PartsCost">Sum of unit costs of every part on one board.</param>
/// <param name="Placements">Parts placed on one board (an op-amp package counts once).</param>
/// <param name="LineItems">Distinct part numbers on the board.</param>
/// <param name="BuildQuantity">Boards in the build.</param>
/// <param name="Model">Placement and setup charges.</param>
public sealed record DesignCost(decimal PartsCost, int Placements, int LineItems, int BuildQuantity, CostModel Model)
{
    /// <summary>Cost of the whole build: exact, the quantity the search minimises.</summary>
    public decimal TotalBuildCost =>
        BuildQuantity * (PartsCost + Placements * Model.PlacementCost) + LineItems * Model.LineItemSetupCost;

    /// <summary>Cost per board: parts + placements × placement cost + line items × setup cost / build quantity.</summary>
    public decimal PerBoard => Model.PerBoard(PartsCost, Placements, LineItems, BuildQuantity);
}
