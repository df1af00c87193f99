namespace PartsOpt.Analysis;

/// <summary>
/// Normalised sensitivities S = (x/y)·∂y/∂x of every figure to every parameter (Bode's definition), and
/// each parameter's share of each figure's variance: the list a designer reads to know which part to
/// tighten first.
/// </summary>
/// <remarks>
/// <para>Derivatives come from central differences with a relative step h: the parameter is set to
/// x·(1 ± h) and D = (y₊ − y₋)/(2h) ≈ x·∂y/∂x, the change of the figure per unit relative change of the
/// part. Then S = D/y. The truncation error is of order h² (1e-10 at the default step), the rounding
/// error of order ε/h (1e-11): both far below any tolerance a part is sold with.</para>
/// <para>A part's relative deviation δ has standard deviation σ (uniform spread: half-width/√3; normal
/// spread with the band as ±3σ: half-width/3). To first order the figure moves by D·δ, so its
/// variance is Σ (D_i·σ_i)², in relative terms Σ (S_i·σ_i)². A part's share is its term over the sum.
/// Working with D rather than S keeps the shares defined for a figure whose nominal is 0 V.</para>
/// <para>Nothing here throws on a figure that is zero or undefined: S is reported as absent (null) where
/// y is 0 or NaN, or where a stepped evaluation is NaN (the circuit stops working right at the nominal
/// point); the shares of that figure are then absent too.</para>
/// </remarks>
public static class SensitivityAnalysis
{
    /// <summary>Default relative step of the central differences: 1e-5.</summary>
    public const double DefaultRelativeStep = 1e-5;

    /// <summary>The method, as the result states it.</summary>
    public const string MethodDescription =
        "Normalised sensitivity S = (x/y)·dy/dx by central differences at x·(1 ± h); variance share of a " +
        "part = (S·σ)² over the sum, σ the relative standard deviation of its value (uniform: half-width/√3; " +
        "normal with the band as ±3σ: half-width/3); first order, parts independent.";

    /// <summary>Computes the sensitivity matrix and the ranked variance budget of every figure.</summary>
    /// <param name="model">The circuit reduced to numbers.</param>
    /// <param name="relativeStep">Relative step h of the central differences, in (0, 0.01].</param>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="relativeStep"/> out of range.</exception>
    /// <exception cref="ArgumentException">The model has a malformed parameter.</exception>
    public static SensitivityResult Analyse(IFigureModel model, double relativeStep = DefaultRelativeStep)
    {
        ModelPoint.Validate(model, nameof(model));
        ValidateStep(relativeStep, nameof(relativeStep));

        var nominal = ModelPoint.Nominals(model);
        var y0 = ModelPoint.Evaluate(model, nominal);
        var d = ScaledDerivatives(model, nominal, relativeStep);
        var parameters = model.Parameters;
        var sigmas = parameters.Select(ParameterSpread.RelativeSigma).ToArray();

        var matrix = new List<IReadOnlyList<double?>>(y0.Length);
        var budgets = new List<FigureVarianceBudget>(y0.Length);
        for (var f = 0; f < y0.Length; f++)
        {
            var row = new double?[parameters.Count];
            var terms = new double[parameters.Count];
            var total = 0.0;
            for (var p = 0; p < parameters.Count; p++)
            {
                row[p] = Normalised(d[f, p], y0[f]);
                terms[p] = d[f, p] * sigmas[p] * (d[f, p] * sigmas[p]);
                total += terms[p];
            }
            matrix.Add(row);

            var contributions = new VarianceContribution[parameters.Count];
            for (var p = 0; p < parameters.Count; p++)
            {
                double? share = total > 0 && double.IsFinite(total) ? terms[p] / total : null;
                contributions[p] = new VarianceContribution(parameters[p].Name, parameters[p].ReferenceDesignator,
                    row[p], sigmas[p], share);
            }
            var ranked = contributions
                .Select((c, i) => (c, i))
                .OrderByDescending(t => t.c.Share ?? -1)
                .ThenBy(t => t.i)
                .Select(t => t.c)
                .ToArray();
            var sigma = Math.Sqrt(total);
            budgets.Add(new FigureVarianceBudget(model.Figures[f].Name, model.Figures[f].Unit,
                ModelPoint.Defined(y0[f]), ModelPoint.Defined(sigma),
                y0[f] == 0 ? null : ModelPoint.Defined(sigma / Math.Abs(y0[f])), ranked));
        }

        return new SensitivityResult(parameters.Select(p => p.Name).ToArray(),
            model.Figures.Select(f => f.Name).ToArray(), matrix, budgets, relativeStep, MethodDescription);
    }

    /// <summary>
    /// D[f, p] = x_p·∂y_f/∂x_p by central differences: the change of figure f per unit relative change
    /// of parameter p. NaN where the figure or either stepped evaluation is NaN; 0 for a zero parameter,
    /// which a relative step (and a relative tolerance) cannot move.
    /// </summary>
    internal static double[,] ScaledDerivatives(IFigureModel model, double[] nominal, double relativeStep)
    {
        var figures = model.Figures.Count;
        var d = new double[figures, nominal.Length];
        var x = (double[])nominal.Clone();
        var up = new double[figures];
        var down = new double[figures];
        for (var p = 0; p < nominal.Length; p++)
        {
            x[p] = nominal[p] * (1 + relativeStep);
            model.Evaluate(x, up);
            x[p] = nominal[p] * (1 - relativeStep);
            model.Evaluate(x, down);
            x[p] = nominal[p];
            for (var f = 0; f < figures; f++)
                d[f, p] = nominal[p] == 0 ? 0 : (up[f] - down[f]) / (2 * relativeStep);
        }
        return d;
    }

    /// <summary>S = D/y, or null where y is zero or either is undefined.</summary>
    internal static double? Normalised(double scaledDerivative, double y) =>
        y == 0 ? null : ModelPoint.Defined(scaledDerivative / y);

    internal static void ValidateStep(double relativeStep, string paramName)
    {
        if (!(relativeStep > 0 && relativeStep <= 0.01))
            throw new ArgumentOutOfRangeException(paramName, relativeStep, "The relative step must lie in (0, 0.01].");
    }
}
