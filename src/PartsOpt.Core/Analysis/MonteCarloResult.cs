namespace PartsOpt.Analysis;

/// <summary>An acceptance band for one figure; an absent end leaves that side open.</summary>
/// <param name="Name">Figure name, as the model lists it.</param>
/// <param name="Min">Lowest acceptable value in the figure's unit; null (or −∞) for no lower limit.</param>
/// <param name="Max">Highest acceptable value; null (or +∞) for no upper limit.</param>
public sealed record FigureBand(string Name, double? Min, double? Max);

/// <summary>The statistics of a Monte Carlo run.</summary>
/// <param name="Samples">Number of sampled boards.</param>
/// <param name="Seed">Seed of the run: the same seed gives the same numbers, bit for bit.</param>
/// <param name="Method">How the samples were drawn and summarised.</param>
/// <param name="Temperature">The temperature range sampled, if any.</param>
/// <param name="Figures">One entry per figure, in the model's order.</param>
/// <param name="Yield">Yield against the requested bands; null where none were requested.</param>
/// <param name="Warnings">Temperature ranges that leave a part's rated range.</param>
public sealed record MonteCarloResult(
    int Samples,
    int Seed,
    string Method,
    TemperatureRange? Temperature,
    IReadOnlyList<MonteCarloFigure> Figures,
    MonteCarloYield? Yield,
    IReadOnlyList<string> Warnings);

/// <summary>One figure's distribution over the samples, in the figure's unit.</summary>
/// <param name="Figure">Figure name.</param>
/// <param name="Unit">SI unit of the figure.</param>
/// <param name="Nominal">The figure at nominal values; null where undefined.</param>
/// <param name="Mean">Mean over the samples where the figure exists.</param>
/// <param name="StandardDeviation">Sample standard deviation (divisor n − 1).</param>
/// <param name="Min">Lowest sampled value.</param>
/// <param name="Max">Highest sampled value.</param>
/// <param name="DefinedSamples">Samples in which the figure exists.</param>
/// <param name="UndefinedSamples">Samples in which it does not (the circuit stopped working).</param>
public sealed record MonteCarloFigure(
    string Figure,
    string Unit,
    double? Nominal,
    double? Mean,
    double? StandardDeviation,
    double? Min,
    double? Max,
    int DefinedSamples,
    int UndefinedSamples);

/// <summary>Yield: the fraction of sampled boards that meet every requested band.</summary>
/// <param name="Fraction">Samples with every banded figure inside its band, over all samples (0…1).</param>
/// <param name="StandardError">Binomial standard error √(p(1 − p)/n) of the fraction.</param>
/// <param name="Passing">Samples that met every band.</param>
/// <param name="Bands">The yield of each band alone.</param>
public sealed record MonteCarloYield(double Fraction, double StandardError, int Passing, IReadOnlyList<BandYield> Bands);

/// <summary>The yield of one band alone.</summary>
/// <param name="Band">The band as requested.</param>
/// <param name="Fraction">Samples inside the band over all samples (an undefined figure is outside).</param>
/// <param name="Passing">Samples inside the band.</param>
public sealed record BandYield(FigureBand Band, double Fraction, int Passing);
