using System.Globalization;

namespace PartsOpt.Analysis;

/// <summary>
/// Monte Carlo tolerance analysis: many boards built from parts drawn from their distributions, the
/// figures' statistics over them, and the yield against acceptance bands.
/// </summary>
/// <remarks>
/// <para>Reproducible: the samples are split into chunks of <see cref="ChunkSize"/>, each drawn from its
/// own Xoshiro256** stream (MathNet) seeded from the run's seed and the chunk's index, and the chunk
/// summaries are merged in chunk order (Chan's parallel update). The same seed therefore gives the same
/// numbers bit for bit whatever the thread count or scheduling.</para>
/// <para>Distributions: a uniform part lies anywhere in its band; a normal part has its band as ±3σ around
/// the band's centre (common practice), truncated to the band (a value outside is redrawn, as incoming
/// inspection would reject the part). Asymmetric bands are honoured as they stand.</para>
/// <para>Temperature, where a range is given: each board gets one temperature drawn uniformly in the
/// range; a part with a linear coefficient c drifts by u·c·(T − 25 °C), u uniform in [−1, 1] per part
/// (the sign of c is not known); a banded part (EIA-198) lands anywhere in its guaranteed band, since the
/// standard gives the band and not a curve.</para>
/// </remarks>
public static class MonteCarlo
{
    /// <summary>Samples per chunk: the unit of parallel work and of random streams.</summary>
    public const int ChunkSize = 1024;

    /// <summary>Largest number of samples a run accepts.</summary>
    public const int MaxSamples = 1_000_000;

    /// <summary>Runs the analysis.</summary>
    /// <param name="model">The circuit reduced to numbers; its Evaluate is called from several threads.</param>
    /// <param name="samples">Number of boards, 1…1,000,000.</param>
    /// <param name="seed">Seed of the run.</param>
    /// <param name="bands">Acceptance bands for the yield; null or empty for none.</param>
    /// <param name="temperature">Operating range to sample; null for tolerance alone.</param>
    /// <param name="parallelOptions">Degree of parallelism and cancellation; null for the defaults.</param>
    /// <exception cref="ArgumentOutOfRangeException">An argument out of range; the message names it.</exception>
    /// <exception cref="ArgumentException">A malformed model parameter or band.</exception>
    /// <exception cref="OperationCanceledException">The token in <paramref name="parallelOptions"/> was cancelled.</exception>
    public static MonteCarloResult Analyse(IFigureModel model, int samples, int seed,
        IReadOnlyList<FigureBand>? bands = null, TemperatureRange? temperature = null,
        ParallelOptions? parallelOptions = null)
    {
        ModelPoint.Validate(model, nameof(model));
        if (samples is < 1 or > MaxSamples)
            throw new ArgumentOutOfRangeException(nameof(samples), samples, $"The sample count must lie in 1…{MaxSamples:N0}.");
        TemperatureRange.Validate(temperature, nameof(temperature));
        bands ??= [];
        var (bandFigure, bandMin, bandMax) = ResolveBands(model, bands, nameof(bands));

        var sampler = new MonteCarloSampler(model, temperature, bandFigure, bandMin, bandMax);
        var chunks = (samples + ChunkSize - 1) / ChunkSize;
        var summaries = new ChunkSummary[chunks];
        var baseSeed = SplitMix64((ulong)(uint)seed);
        Parallel.For(0, chunks, parallelOptions ?? new ParallelOptions(), c =>
        {
            var count = Math.Min(ChunkSize, samples - c * ChunkSize);
            // Distinct seeds for every chunk of a run; MathNet expands each through SplitMix64.
            summaries[c] = sampler.Run(unchecked((int)(uint)(baseSeed + (ulong)c)), count);
        });

        var total = new ChunkSummary(model.Figures.Count, bandFigure.Length);
        var allPassing = 0;
        foreach (var chunk in summaries)
        {
            for (var f = 0; f < total.Moments.Length; f++)
            {
                total.Moments[f] = RunningMoments.Merge(total.Moments[f], chunk.Moments[f]);
                total.Undefined[f] += chunk.Undefined[f];
            }
            for (var b = 0; b < bandFigure.Length; b++) total.BandPassing[b] += chunk.BandPassing[b];
            allPassing += chunk.AllPassing;
        }

        var y0 = ModelPoint.Evaluate(model, ModelPoint.Nominals(model));
        var figures = new MonteCarloFigure[y0.Length];
        for (var f = 0; f < y0.Length; f++)
        {
            var m = total.Moments[f];
            var any = m.Count > 0;
            figures[f] = new MonteCarloFigure(model.Figures[f].Name, model.Figures[f].Unit, ModelPoint.Defined(y0[f]),
                any ? ModelPoint.Defined(m.Mean) : null, ModelPoint.Defined(m.StandardDeviation),
                any ? ModelPoint.Defined(m.Min) : null, any ? ModelPoint.Defined(m.Max) : null,
                (int)m.Count, total.Undefined[f]);
        }

        MonteCarloYield? yield = null;
        if (bands.Count > 0)
        {
            var fraction = (double)allPassing / samples;
            yield = new MonteCarloYield(fraction, Math.Sqrt(fraction * (1 - fraction) / samples), allPassing,
                bands.Select((band, b) => new BandYield(band, (double)total.BandPassing[b] / samples, total.BandPassing[b]))
                    .ToArray());
        }

        var warnings = temperature is null
            ? []
            : model.Parameters.Select(p => ParameterDrift.Of(p, temperature).Warning).OfType<string>().ToArray();
        return new MonteCarloResult(samples, seed, Describe(samples, seed, temperature), temperature, figures, yield, warnings);
    }

    private static (int[] Figure, double[] Min, double[] Max) ResolveBands(IFigureModel model,
        IReadOnlyList<FigureBand> bands, string paramName)
    {
        var figure = new int[bands.Count];
        var min = new double[bands.Count];
        var max = new double[bands.Count];
        for (var b = 0; b < bands.Count; b++)
        {
            var band = bands[b] ?? throw new ArgumentException("A band is null.", paramName);
            figure[b] = -1;
            for (var f = 0; f < model.Figures.Count; f++)
                if (model.Figures[f].Name == band.Name) figure[b] = f;
            if (figure[b] < 0)
                throw new ArgumentException($"Band for '{band.Name}': the model computes no figure of that name.", paramName);
            min[b] = band.Min ?? double.NegativeInfinity;
            max[b] = band.Max ?? double.PositiveInfinity;
            if (double.IsNaN(min[b]) || double.IsNaN(max[b]) || min[b] > max[b])
                throw new ArgumentException($"Band for '{band.Name}': the minimum must be a number not above the maximum.", paramName);
        }
        return (figure, min, max);
    }

    private static string Describe(int samples, int seed, TemperatureRange? temperature) =>
        string.Create(CultureInfo.InvariantCulture,
            $"Monte Carlo: {samples} boards, seed {seed}, in chunks of {ChunkSize} each with its own Xoshiro256** stream seeded from (seed, chunk index): the same seed gives the same numbers whatever the thread count. Uniform parts anywhere in their band; normal parts with the band as ±3σ, truncated to the band; asymmetric bands as they stand. Standard deviation with divisor n − 1; yield = boards with every banded figure inside its band (an undefined figure fails) over all boards.")
        + (temperature is null
            ? ""
            : string.Create(CultureInfo.InvariantCulture,
                $" Temperature uniform in {temperature.MinCelsius:0.#}…{temperature.MaxCelsius:0.#} °C per board; linear coefficients as u·c·(T − 25 °C), u uniform in [−1, 1] per part; banded characteristics (EIA-198) anywhere in their guaranteed band."));

    /// <summary>SplitMix64 (Steele, Lea and Flood): scatters a small seed over all 64 bits.</summary>
    private static ulong SplitMix64(ulong z)
    {
        z += 0x9E3779B97F4A7C15UL;
        z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL;
        z = (z ^ (z >> 27)) * 0x94D049BB133111EBUL;
        return z ^ (z >> 31);
    }
}
