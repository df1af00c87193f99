namespace PartsOpt.Analysis;

/// <summary>
/// A circuit reduced to numbers: a vector of parameters (part values, op-amp limits) in, a vector of
/// figures (frequency, amplitude, duty…) out. Tolerance, temperature and sensitivity analyses work on
/// this shape alone, so they know nothing of topologies.
/// </summary>
/// <remarks>
/// <see cref="Evaluate"/> must be allocation-free and safe to call from several threads at once:
/// Monte Carlo calls it millions of times in parallel.
/// </remarks>
public interface IFigureModel
{
    /// <summary>The parameters, in the order <see cref="Evaluate"/> reads them.</summary>
    IReadOnlyList<ParameterSpec> Parameters { get; }

    /// <summary>The figures, in the order <see cref="Evaluate"/> writes them.</summary>
    IReadOnlyList<FigureSpec> Figures { get; }

    /// <summary>
    /// Computes every figure from one parameter vector. A figure that does not exist for these values
    /// (an oscillator that cannot switch) is written as <see cref="double.NaN"/>.
    /// </summary>
    void Evaluate(ReadOnlySpan<double> parameters, Span<double> figures);
}

/// <summary>A figure the model computes, with its SI unit ("Hz", "V", "s", "1" for ratios).</summary>
public sealed record FigureSpec(string Name, string Unit);
