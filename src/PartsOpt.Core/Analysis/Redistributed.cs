namespace PartsOpt.Analysis;

/// <summary>Variations of a figure model that change how its parts spread, not what it computes.</summary>
public static class FigureModelSpread
{
    /// <summary>
    /// The same model with every parameter spreading by <paramref name="distribution"/> inside its own
    /// tolerance band: how a designer asks "what if my parts are normal rather than uniform".
    /// </summary>
    public static IFigureModel WithDistribution(this IFigureModel model, SpreadDistribution distribution)
    {
        ArgumentNullException.ThrowIfNull(model);
        return new Redistributed(model, distribution);
    }

    private sealed class Redistributed(IFigureModel inner, SpreadDistribution distribution) : IFigureModel
    {
        public IReadOnlyList<ParameterSpec> Parameters { get; } =
            inner.Parameters.Select(p => p with { Distribution = distribution }).ToArray();

        public IReadOnlyList<FigureSpec> Figures => inner.Figures;

        public void Evaluate(ReadOnlySpan<double> parameters, Span<double> figures) => inner.Evaluate(parameters, figures);
    }
}
