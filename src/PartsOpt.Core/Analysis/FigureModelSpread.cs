namespace PartsOpt.Analysis;

/// <summary>Variations of a figure model that change how its parts spread, not what it computes.</summary>
public static class FigureModelSpread
{
    /// <summary>
    /// The same model with every parameter spreading by <paramref name="distribution"/> inside its own
    /// tolerance band: how a designer asks "what if my parts are normal rather than uniform".
    /// </summary>
    public static IFigureModel WithDistribution(this IFigureModel model, SpreadDistribution distribution) =>
        model.Respread(p => p with { Distribution = distribution });

    /// <summary>
    /// The same model with some parameters given a tolerance band of ±<paramref name="tolerance"/>: for limits
    /// a data sheet states only as typical (an op-amp's output headroom), so that tolerance analyses spread them.
    /// </summary>
    public static IFigureModel WithTolerance(this IFigureModel model, Func<string, bool> applies, double tolerance)
    {
        ArgumentNullException.ThrowIfNull(applies);
        if (!double.IsFinite(tolerance) || tolerance is < 0 or >= 1)
            throw new ArgumentOutOfRangeException(nameof(tolerance), tolerance, "A fraction from 0 up to 1.");
        return model.Respread(p => applies(p.Name) ? p with { ToleranceMinus = tolerance, TolerancePlus = tolerance } : p);
    }

    private static RespreadModel Respread(this IFigureModel model, Func<ParameterSpec, ParameterSpec> change)
    {
        ArgumentNullException.ThrowIfNull(model);
        return new RespreadModel(model, model.Parameters.Select(change).ToArray());
    }

    private sealed class RespreadModel(IFigureModel inner, IReadOnlyList<ParameterSpec> parameters) : IFigureModel
    {
        public IReadOnlyList<ParameterSpec> Parameters => parameters;

        public IReadOnlyList<FigureSpec> Figures => inner.Figures;

        public void Evaluate(ReadOnlySpan<double> parameters, Span<double> figures) => inner.Evaluate(parameters, figures);
    }
}
