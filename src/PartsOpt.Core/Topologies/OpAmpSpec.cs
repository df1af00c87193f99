namespace PartsOpt.Topologies;

/// <summary>
/// The limits of an op-amp or comparator part that the closed-form analysis uses.
/// </summary>
/// <param name="SectionsPerPackage">Sections (amplifiers) in one package: 1, 2 or 4.</param>
/// <param name="SupplyMinV">Lowest total supply V+ − V− the part is rated for, V.</param>
/// <param name="SupplyMaxV">Highest total supply V+ − V− the part is rated for, V.</param>
/// <param name="GainBandwidthHz">Gain-bandwidth product, Hz.</param>
/// <param name="SlewRateVPerS">Slew rate, V/s (0.5 V/µs is 5e5).</param>
/// <param name="OutputHeadroomHighV">The output swings up to V+ − this, V.</param>
/// <param name="OutputHeadroomLowV">The output swings down to V− + this, V.</param>
/// <param name="InputHeadroomHighV">The input common-mode range reaches V+ − this, V (negative: beyond the rail).</param>
/// <param name="InputHeadroomLowV">The input common-mode range reaches V− + this, V (negative: beyond the rail).</param>
/// <param name="InputOffsetV">Input offset voltage (magnitude), V.</param>
/// <param name="MaxOutputCurrentA">Output current the part delivers while holding its swing, A.</param>
/// <param name="QuiescentCurrentPerSectionA">Supply current of one section with no load, A.</param>
/// <param name="IsComparator">True for a comparator part (no frequency compensation; not for linear stages).</param>
/// <param name="IsOpenDrain">True when the output only pulls low (open drain or open collector): needs <c>cmp.pullup</c>.</param>
/// <param name="PartNumber">The manufacturer's part number, if known.</param>
public sealed record OpAmpSpec(
    int SectionsPerPackage,
    double SupplyMinV,
    double SupplyMaxV,
    double GainBandwidthHz,
    double SlewRateVPerS,
    double OutputHeadroomHighV,
    double OutputHeadroomLowV,
    double InputHeadroomHighV,
    double InputHeadroomLowV,
    double InputOffsetV,
    double MaxOutputCurrentA,
    double QuiescentCurrentPerSectionA,
    bool IsComparator = false,
    bool IsOpenDrain = false,
    string? PartNumber = null)
{
    /// <summary>
    /// Throws a <see cref="DesignValidationException"/> naming <paramref name="field"/>.<i>property</i>
    /// for a limit that is not a sensible finite number.
    /// </summary>
    /// <param name="field">The field prefix the API uses for this part, "amplifier" or "comparator".</param>
    public void Validate(string field)
    {
        if (SectionsPerPackage is < 1 or > 8)
            throw new DesignValidationException($"{field}.sectionsPerPackage", $"Sections per package must be 1…8 (got {SectionsPerPackage}).");
        Positive(SupplyMinV, "supplyMinV");
        Positive(SupplyMaxV, "supplyMaxV");
        if (SupplyMaxV < SupplyMinV)
            throw new DesignValidationException($"{field}.supplyMaxV", "The maximum supply is below the minimum supply.");
        Positive(GainBandwidthHz, "gainBandwidthHz");
        Positive(SlewRateVPerS, "slewRateVPerS");
        NonNegative(OutputHeadroomHighV, "outputHeadroomHighV");
        NonNegative(OutputHeadroomLowV, "outputHeadroomLowV");
        Finite(InputHeadroomHighV, "inputHeadroomHighV");
        Finite(InputHeadroomLowV, "inputHeadroomLowV");
        NonNegative(InputOffsetV, "inputOffsetV");
        Positive(MaxOutputCurrentA, "maxOutputCurrentA");
        NonNegative(QuiescentCurrentPerSectionA, "quiescentCurrentPerSectionA");

        void Finite(double value, string name)
        {
            if (!double.IsFinite(value))
                throw new DesignValidationException($"{field}.{name}", $"{name} must be a finite number (got {value}).");
        }

        void Positive(double value, string name)
        {
            if (!double.IsFinite(value) || value <= 0)
                throw new DesignValidationException($"{field}.{name}", $"{name} must be a finite number above 0 (got {value}).");
        }

        void NonNegative(double value, string name)
        {
            if (!double.IsFinite(value) || value < 0)
                throw new DesignValidationException($"{field}.{name}", $"{name} must be a finite number at or above 0 (got {value}).");
        }
    }
}
