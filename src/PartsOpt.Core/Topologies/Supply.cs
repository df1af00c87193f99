namespace PartsOpt.Topologies;

/// <summary>
/// The supply rails. A negative rail of 0 V is a single supply: the stages then return to a mid-rail
/// reference (roles <c>ref.rtop</c>, <c>ref.rbottom</c>, <c>ref.c</c>) instead of ground.
/// </summary>
/// <param name="PositiveV">The positive rail, V (above 0).</param>
/// <param name="NegativeV">The negative rail, V (0 for a single supply, below 0 for a split one).</param>
public sealed record Supply(double PositiveV, double NegativeV)
{
    /// <summary>True for a single supply (negative rail at 0 V).</summary>
    public bool IsSingle => NegativeV == 0;

    /// <summary>The total supply, V+ − V−, V.</summary>
    public double SpanV => PositiveV - NegativeV;

    /// <summary>A symmetric split supply ±<paramref name="volts"/>.</summary>
    public static Supply Symmetric(double volts) => new(volts, -volts);

    /// <summary>A single supply from 0 V to <paramref name="volts"/>.</summary>
    public static Supply SingleRail(double volts) => new(volts, 0);

    /// <summary>Throws a <see cref="DesignValidationException"/> for rails that are not finite or in the wrong order.</summary>
    public void Validate()
    {
        if (!double.IsFinite(PositiveV) || PositiveV <= 0)
            throw new DesignValidationException("supply.positive", $"The positive rail must be a finite voltage above 0 V (got {PositiveV}).");
        if (!double.IsFinite(NegativeV) || NegativeV > 0)
            throw new DesignValidationException("supply.negative", $"The negative rail must be a finite voltage at or below 0 V (got {NegativeV}).");
    }
}
