namespace PartsOpt.Analysis;

/// <summary>Sensitivities of every figure to every parameter, and each figure's ranked variance budget.</summary>
/// <param name="ParameterNames">Parameter names: the columns of <paramref name="Matrix"/>.</param>
/// <param name="FigureNames">Figure names: the rows of <paramref name="Matrix"/>.</param>
/// <param name="Matrix">Normalised sensitivity S = (x/y)·∂y/∂x, [figure][parameter], dimensionless;
/// null where it is undefined (y = 0 or NaN at or next to the nominal point).</param>
/// <param name="Figures">Per figure, the parts ranked by their share of its variance.</param>
/// <param name="RelativeStep">Relative step h of the central differences.</param>
/// <param name="Method">How the numbers were obtained.</param>
public sealed record SensitivityResult(
    IReadOnlyList<string> ParameterNames,
    IReadOnlyList<string> FigureNames,
    IReadOnlyList<IReadOnlyList<double?>> Matrix,
    IReadOnlyList<FigureVarianceBudget> Figures,
    double RelativeStep,
    string Method)
{
    /// <summary>S of one figure to one parameter, by name; null where undefined.</summary>
    /// <exception cref="ArgumentException">No figure or parameter of that name.</exception>
    public double? Sensitivity(string figure, string parameter)
    {
        var f = IndexOf(FigureNames, figure, nameof(figure));
        var p = IndexOf(ParameterNames, parameter, nameof(parameter));
        return Matrix[f][p];
    }

    private static int IndexOf(IReadOnlyList<string> names, string name, string paramName)
    {
        for (var i = 0; i < names.Count; i++)
            if (names[i] == name) return i;
        throw new ArgumentException($"No entry named '{name}'.", paramName);
    }
}

/// <summary>One figure's variance, split between the parts that cause it.</summary>
/// <param name="Figure">Figure name.</param>
/// <param name="Unit">SI unit of the figure.</param>
/// <param name="Nominal">The figure at nominal values; null where it is undefined.</param>
/// <param name="Sigma">First-order standard deviation of the figure, in its unit.</param>
/// <param name="RelativeSigma">Sigma over |nominal|; null where the nominal is zero.</param>
/// <param name="Ranked">Contributions, largest share first.</param>
public sealed record FigureVarianceBudget(
    string Figure,
    string Unit,
    double? Nominal,
    double? Sigma,
    double? RelativeSigma,
    IReadOnlyList<VarianceContribution> Ranked);

/// <summary>One part's contribution to one figure's variance.</summary>
/// <param name="Parameter">Parameter (role) name.</param>
/// <param name="ReferenceDesignator">Where the part sits on the board, if it is a part.</param>
/// <param name="Sensitivity">Normalised sensitivity S; null where undefined.</param>
/// <param name="RelativeSigma">Relative standard deviation of the part's value from its tolerance.</param>
/// <param name="Share">(D·σ)² over the sum for the figure, 0…1; null where the sum is zero or undefined.</param>
public sealed record VarianceContribution(
    string Parameter,
    string? ReferenceDesignator,
    double? Sensitivity,
    double RelativeSigma,
    double? Share);
