namespace PartsOpt.Analysis;

/// <summary>
/// Checks a model before an analysis trusts it, and evaluates it at the nominal point. Every analysis
/// starts here, so a malformed parameter fails the same way everywhere: an <see cref="ArgumentException"/>
/// naming the argument and the parameter.
/// </summary>
internal static class ModelPoint
{
    /// <summary>Throws unless every parameter has a finite nominal and finite, non-negative tolerances.</summary>
    public static void Validate(IFigureModel model, string paramName)
    {
        ArgumentNullException.ThrowIfNull(model, paramName);
        if (model.Parameters is null || model.Figures is null)
            throw new ArgumentException("The model lists no parameters or no figures.", paramName);
        if (model.Figures.Count == 0)
            throw new ArgumentException("The model computes no figures.", paramName);
        foreach (var p in model.Parameters)
        {
            if (p is null)
                throw new ArgumentException("The model lists a null parameter.", paramName);
            if (!double.IsFinite(p.Nominal))
                throw new ArgumentException($"Parameter '{p.Name}' has a nominal that is not a finite number.", paramName);
            if (!(p.ToleranceMinus >= 0 && p.TolerancePlus >= 0) || !double.IsFinite(p.ToleranceMinus) || !double.IsFinite(p.TolerancePlus))
                throw new ArgumentException($"Parameter '{p.Name}' needs finite, non-negative tolerances.", paramName);
            if (p.Temperature is { } t && !(t.CoefficientPpmPerK >= 0 && t.BandMinus >= 0 && t.BandPlus >= 0
                && double.IsFinite(t.CoefficientPpmPerK) && double.IsFinite(t.BandMinus) && double.IsFinite(t.BandPlus)))
                throw new ArgumentException($"Parameter '{p.Name}' needs a finite, non-negative temperature coefficient and band.", paramName);
        }
    }

    /// <summary>The nominal parameter vector, in the model's order.</summary>
    public static double[] Nominals(IFigureModel model)
    {
        var values = new double[model.Parameters.Count];
        for (var i = 0; i < values.Length; i++) values[i] = model.Parameters[i].Nominal;
        return values;
    }

    /// <summary>The figures at the given parameter vector.</summary>
    public static double[] Evaluate(IFigureModel model, double[] parameters)
    {
        var figures = new double[model.Figures.Count];
        model.Evaluate(parameters, figures);
        return figures;
    }

    /// <summary>A finite value, or null where the value is undefined (NaN) or infinite: JSON carries neither.</summary>
    public static double? Defined(double value) => double.IsFinite(value) ? value : null;

    /// <summary>(value − nominal)/|nominal| in per cent, or null where the nominal is zero or undefined.</summary>
    public static double? DeviationPercent(double value, double nominal) =>
        nominal == 0 ? null : Defined((value - nominal) / Math.Abs(nominal) * 100);
}
