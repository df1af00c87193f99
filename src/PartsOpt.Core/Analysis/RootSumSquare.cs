namespace PartsOpt.Analysis;

/// <summary>
/// Root-sum-square tolerance analysis: the figure's spread from its sensitivities and the parts'
/// standard deviations, assuming independent parts and sensitivities that stay constant across the band.
/// </summary>
/// <remarks>
/// <para>σ_y = √Σ (D_i·σ_i)², with D_i = x_i·∂y/∂x_i (so σ_y/|y| = √Σ (S_i·σ_i)²) and σ_i the relative
/// standard deviation of part i (uniform: half-width/√3; normal with the band as ±3σ: half-width/3).
/// The band reported is centre ± k·σ_y, k = 3 by default for a ±3σ band (common practice).</para>
/// <para>Asymmetric tolerances: the band of a +80/−20 % part is centred 30 % above nominal, and both
/// distributions are centred on the band. The figure's centre is therefore moved by the first-order mean
/// offset, centre = y + Σ D_i·μ_i with μ_i = (plus_i − minus_i)/2, and σ_i uses the half-width.</para>
/// </remarks>
public static class RootSumSquare
{
    /// <summary>Default coverage factor k: ±3σ (common practice).</summary>
    public const double DefaultCoverageFactor = 3;

    /// <summary>Computes each figure's root-sum-square band.</summary>
    /// <param name="model">The circuit reduced to numbers.</param>
    /// <param name="coverageFactor">k in centre ± k·σ, in (0, 10].</param>
    /// <param name="relativeStep">Relative step of the central differences (see <see cref="SensitivityAnalysis"/>).</param>
    /// <exception cref="ArgumentOutOfRangeException">An argument out of range; the message names it.</exception>
    /// <exception cref="ArgumentException">The model has a malformed parameter.</exception>
    public static RootSumSquareResult Analyse(IFigureModel model, double coverageFactor = DefaultCoverageFactor,
        double relativeStep = SensitivityAnalysis.DefaultRelativeStep)
    {
        ModelPoint.Validate(model, nameof(model));
        if (!(coverageFactor > 0 && coverageFactor <= 10))
            throw new ArgumentOutOfRangeException(nameof(coverageFactor), coverageFactor, "The coverage factor must lie in (0, 10].");
        SensitivityAnalysis.ValidateStep(relativeStep, nameof(relativeStep));

        var parameters = model.Parameters;
        var nominal = ModelPoint.Nominals(model);
        var y0 = ModelPoint.Evaluate(model, nominal);
        var d = SensitivityAnalysis.ScaledDerivatives(model, nominal, relativeStep);

        var figures = new RootSumSquareFigure[y0.Length];
        for (var f = 0; f < y0.Length; f++)
        {
            var variance = 0.0;
            var offset = 0.0;
            for (var p = 0; p < parameters.Count; p++)
            {
                var term = d[f, p] * ParameterSpread.RelativeSigma(parameters[p]);
                variance += term * term;
                offset += d[f, p] * ParameterSpread.RelativeMeanOffset(parameters[p]);
            }
            var sigma = Math.Sqrt(variance);
            var centre = y0[f] + offset;
            figures[f] = new RootSumSquareFigure(model.Figures[f].Name, model.Figures[f].Unit,
                ModelPoint.Defined(y0[f]), ModelPoint.Defined(centre), ModelPoint.Defined(sigma),
                y0[f] == 0 ? null : ModelPoint.Defined(sigma / Math.Abs(y0[f])),
                ModelPoint.Defined(centre - coverageFactor * sigma), ModelPoint.Defined(centre + coverageFactor * sigma));
        }

        var method = $"Root-sum-square: σ = √Σ(S·σ_part)²·|y| to first order, parts independent, sensitivities " +
            $"constant across the band; band = centre ± {coverageFactor:0.###}·σ; centre moved by the mean offset " +
            "of asymmetric tolerances, Σ S·(plus − minus)/2·y.";
        return new RootSumSquareResult(coverageFactor, figures, method);
    }
}

/// <summary>Root-sum-square bands of every figure.</summary>
/// <param name="CoverageFactor">k in centre ± k·σ.</param>
/// <param name="Figures">One entry per figure, in the model's order.</param>
/// <param name="Method">How the numbers were obtained.</param>
public sealed record RootSumSquareResult(double CoverageFactor, IReadOnlyList<RootSumSquareFigure> Figures, string Method);

/// <summary>One figure's root-sum-square band; every value in the figure's unit except the relative sigma.</summary>
/// <param name="Figure">Figure name.</param>
/// <param name="Unit">SI unit of the figure.</param>
/// <param name="Nominal">The figure at nominal values; null where undefined.</param>
/// <param name="Centre">Nominal moved by the mean offset of asymmetric tolerances.</param>
/// <param name="Sigma">Standard deviation.</param>
/// <param name="RelativeSigma">Sigma over |nominal|, dimensionless; null where the nominal is zero.</param>
/// <param name="Min">Centre − k·σ.</param>
/// <param name="Max">Centre + k·σ.</param>
public sealed record RootSumSquareFigure(
    string Figure,
    string Unit,
    double? Nominal,
    double? Centre,
    double? Sigma,
    double? RelativeSigma,
    double? Min,
    double? Max);
