namespace PartsOpt.Search;

/// <summary>Rejects requirements that mean nothing, naming the field as the API spells it.</summary>
internal static class RequirementRules
{
    public static void Validate(SearchRequirement requirement)
    {
        ArgumentNullException.ThrowIfNull(requirement.Supply);
        ArgumentNullException.ThrowIfNull(requirement.Frequency);
        ArgumentNullException.ThrowIfNull(requirement.Duty);
        Require(double.IsFinite(requirement.Supply.PositiveV) && requirement.Supply.PositiveV > 0
            && double.IsFinite(requirement.Supply.NegativeV) && requirement.Supply.NegativeV <= 0,
            "supply", "The positive rail must be above 0 V and the negative rail at or below 0 V.");
        Band(requirement.Frequency, "frequency");
        if (requirement.TrianglePeakToPeak is { } amplitude)
            Band(amplitude, "trianglePeakToPeak");
        var duty = requirement.Duty;
        Require(duty.Min >= 0 && duty.Max <= 1 && duty.Min <= duty.Max, "duty",
            "The duty range must satisfy 0 ≤ min ≤ max ≤ 1.");
        if (duty.Adjust == DutyAdjust.ControlVoltage)
            Require(double.IsFinite(duty.ControlMinV) && double.IsFinite(duty.ControlMaxV) && duty.ControlMinV < duty.ControlMaxV,
                "duty.control", "The control range needs min < max, both finite.");
        if (duty.Adjust == DutyAdjust.ControlVoltage)
            Require(duty.ControlMinV >= requirement.Supply.NegativeV && duty.ControlMaxV <= requirement.Supply.PositiveV,
                "duty.control", "The control range must lie between the rails.");
        Require(requirement.BuildQuantity >= 1, "buildQuantity", "Build at least one board.");
        Require(requirement.MaxResults >= 1, "maxResults", "Ask for at least one design.");
        Require(requirement.Costs.PlacementCost >= 0 && requirement.Costs.LineItemSetupCost >= 0, "costModel",
            "Placement and setup costs cannot be negative.");
        if (requirement.Yield is { } yield)
            Require(yield.Target is > 0 and <= 1 && yield.Samples >= 1, "yield", "The yield target must lie in (0, 1].");
    }

    private static void Band(Band band, string field) =>
        Require(double.IsFinite(band.Target) && band.Target > 0 && double.IsFinite(band.Tolerance) && band.Tolerance is >= 0 and < 1,
            field, "The target must be above 0 and the tolerance a fraction in [0, 1).");

    private static void Require(bool ok, string field, string message)
    {
        if (!ok)
            throw new ArgumentException($"{field}: {message}", field);
    }
}
