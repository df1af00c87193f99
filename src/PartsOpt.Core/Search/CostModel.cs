namespace PartsOpt.Search;

/// <summary>
/// What a board costs beyond its parts: a charge per placed part and a setup charge per distinct part
/// number, spread over the build.
/// </summary>
/// <param name="PlacementCost">Cost of placing one part (one resistor, capacitor, potentiometer or op-amp
/// package) on one board. Default 0.02, a typical pick-and-place figure per joint group (common practice).</param>
/// <param name="LineItemSetupCost">Cost of setting up one distinct part number for the whole build (feeder,
/// kitting). Default 5.00 (common practice).</param>
public sealed record CostModel(decimal PlacementCost = 0.02m, decimal LineItemSetupCost = 5.00m)
{
    /// <summary>The documented defaults.</summary>
    public static CostModel Default { get; } = new();

    /// <summary>
    /// Cost per board: parts + placements × placement cost + line items × setup cost / build quantity.
    /// Exact decimal arithmetic, so two designs of equal cost compare equal.
    /// </summary>
    public decimal PerBoard(decimal partsCost, int placements, int lineItems, int buildQuantity)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(buildQuantity, 1);
        return partsCost + placements * PlacementCost + lineItems * LineItemSetupCost / buildQuantity;
    }
}
