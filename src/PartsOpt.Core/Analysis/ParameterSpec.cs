namespace PartsOpt.Analysis;

/// <summary>How a part's value spreads across a batch within its tolerance.</summary>
public enum SpreadDistribution
{
    /// <summary>Equally likely anywhere inside the tolerance band.</summary>
    Uniform,

    /// <summary>Normal, with the tolerance band taken as ±3σ (common practice).</summary>
    Normal,
}

/// <summary>
/// One input of an <see cref="IFigureModel"/>: a part value or an op-amp limit, its nominal value in SI
/// units, and how far it may stray at the factory and with temperature.
/// </summary>
/// <param name="Name">Stable role name, e.g. "oscR" or "opamp.headroomHigh".</param>
/// <param name="Nominal">Nominal value in SI units (Ω, F, V, V/s).</param>
/// <param name="ToleranceMinus">Lower tolerance as a positive fraction (0.05 for −5 %).</param>
/// <param name="TolerancePlus">Upper tolerance as a positive fraction (0.80 for +80 %).</param>
/// <param name="Distribution">How the value spreads inside its band (for Monte Carlo).</param>
/// <param name="Temperature">How the value drifts with temperature; null where it does not.</param>
/// <param name="ReferenceDesignator">Where the part sits on the board (R1, C2…), if it is a part.</param>
public sealed record ParameterSpec(
    string Name,
    double Nominal,
    double ToleranceMinus,
    double TolerancePlus,
    SpreadDistribution Distribution = SpreadDistribution.Uniform,
    TemperatureBehaviour? Temperature = null,
    string? ReferenceDesignator = null)
{
    /// <summary>The lowest value the tolerance allows.</summary>
    public double Min => Nominal * (1 - ToleranceMinus);

    /// <summary>The highest value the tolerance allows.</summary>
    public double Max => Nominal * (1 + TolerancePlus);

    /// <summary>A parameter with the same tolerance on both sides.</summary>
    public static ParameterSpec Symmetric(string name, double nominal, double tolerance,
        TemperatureBehaviour? temperature = null, string? referenceDesignator = null) =>
        new(name, nominal, tolerance, tolerance, SpreadDistribution.Uniform, temperature, referenceDesignator);
}

/// <summary>
/// How a value moves with temperature: a linear coefficient (resistors, C0G, film), or a band that a
/// temperature characteristic guarantees over its rated range (class-2 ceramics, EIA-198).
/// </summary>
/// <param name="CoefficientPpmPerK">Linear coefficient around <see cref="ReferenceCelsius"/>, ±ppm/K as a
/// magnitude (the drift may go either way).</param>
/// <param name="BandMinus">For a banded characteristic: the largest fall, as a positive fraction.</param>
/// <param name="BandPlus">For a banded characteristic: the largest rise, as a positive fraction.</param>
/// <param name="RatedMinCelsius">Lower end of the range over which the band is guaranteed.</param>
/// <param name="RatedMaxCelsius">Upper end of the range over which the band is guaranteed.</param>
/// <param name="Standard">Where the figures come from, e.g. "EIA-198 X7R".</param>
public sealed record TemperatureBehaviour(
    double CoefficientPpmPerK,
    double BandMinus = 0,
    double BandPlus = 0,
    double RatedMinCelsius = -55,
    double RatedMaxCelsius = 125,
    string? Standard = null)
{
    /// <summary>Reference temperature at which nominal values hold.</summary>
    public const double ReferenceCelsius = 25;

    /// <summary>True where the behaviour is a guaranteed band rather than a linear coefficient.</summary>
    public bool IsBanded => BandMinus > 0 || BandPlus > 0;

    /// <summary>
    /// A linear coefficient, ±ppm/K. Data give it with a sign (polypropylene film about −200 ppm/K); the
    /// analyses drift each part both ways by its magnitude, so the sign is dropped here.
    /// </summary>
    public static TemperatureBehaviour Linear(double ppmPerK, string? standard = null) =>
        new(Math.Abs(ppmPerK), Standard: standard);
}
