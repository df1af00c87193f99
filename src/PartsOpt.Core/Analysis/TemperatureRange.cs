namespace PartsOpt.Analysis;

/// <summary>An operating temperature range in °C, e.g. −40…+85 °C for industrial parts.</summary>
/// <param name="MinCelsius">Coldest temperature, °C.</param>
/// <param name="MaxCelsius">Hottest temperature, °C.</param>
public sealed record TemperatureRange(double MinCelsius, double MaxCelsius)
{
    /// <summary>The largest distance from the 25 °C reference inside the range, in K.</summary>
    public double LargestExcursionK =>
        Math.Max(Math.Abs(MinCelsius - TemperatureBehaviour.ReferenceCelsius),
            Math.Abs(MaxCelsius - TemperatureBehaviour.ReferenceCelsius));

    /// <summary>True where the range is the reference temperature alone (no drift).</summary>
    public bool IsReferenceOnly =>
        MinCelsius == TemperatureBehaviour.ReferenceCelsius && MaxCelsius == TemperatureBehaviour.ReferenceCelsius;

    /// <summary>Throws unless both ends are finite, above absolute zero and in order.</summary>
    internal static void Validate(TemperatureRange? range, string paramName)
    {
        if (range is null) return;
        if (!double.IsFinite(range.MinCelsius) || !double.IsFinite(range.MaxCelsius)
            || range.MinCelsius < -273.15 || range.MinCelsius > range.MaxCelsius)
            throw new ArgumentOutOfRangeException(paramName, range,
                "The temperature range needs finite ends above −273.15 °C with the minimum not above the maximum.");
    }
}
