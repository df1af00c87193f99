namespace PartsOpt.Analysis;

/// <summary>
/// Evaluates a model at the corners of a box of relative deviations (each parameter at
/// nominal·(1 + δ), δ at its lower or upper end) and keeps each figure's extremes. Shared by the
/// worst-case and temperature-drift analyses so both follow the same corner policy.
/// </summary>
internal static class CornerSearch
{
    /// <summary>Default largest number of varying parameters searched exhaustively (2^12 = 4096 corners).</summary>
    public const int DefaultExhaustiveLimit = 12;

    /// <summary>Largest exhaustive limit accepted: 2^20 corners, about a million evaluations.</summary>
    public const int MaxExhaustiveLimit = 20;

    public const string Caveat =
        "Corners can miss the worst case of a figure that is not monotonic in a parameter (an extreme inside " +
        "the band); Monte Carlo samples the inside of the band.";

    internal sealed record Outcome(CornerMethod Method, int Varying, int Evaluated, FigureExtremes[] Figures)
    {
        public string Describe(int exhaustiveLimit) => Method == CornerMethod.AllCorners
            ? $"All 2^n corners: every one of the {Varying} varying parameters at either end of its band " +
              $"together, {Evaluated} evaluations including the nominal point. {Caveat}"
            : $"Sensitivity-directed corners: {Varying} parameters vary, more than the {exhaustiveLimit} searched " +
              "exhaustively, so for each figure every parameter goes to the end that pushes the figure up, then " +
              $"down, by the sign of its sensitivity at nominal; {Evaluated} evaluations including the nominal " +
              $"point. Exact for figures monotonic in every parameter. {Caveat}";
    }

    public static void ValidateLimit(int exhaustiveLimit, string paramName)
    {
        if (exhaustiveLimit is < 0 or > MaxExhaustiveLimit)
            throw new ArgumentOutOfRangeException(paramName, exhaustiveLimit,
                $"The exhaustive corner limit must lie in 0…{MaxExhaustiveLimit}.");
    }

    /// <param name="model">A validated model.</param>
    /// <param name="deltaMinus">Per parameter, the relative deviation at the lower end (≤ 0).</param>
    /// <param name="deltaPlus">Per parameter, the relative deviation at the upper end (≥ 0).</param>
    /// <param name="exhaustiveLimit">Up to this many varying parameters, all corners are evaluated.</param>
    /// <param name="relativeStep">Step of the sensitivities that direct the corners otherwise.</param>
    public static Outcome Run(IFigureModel model, double[] deltaMinus, double[] deltaPlus, int exhaustiveLimit,
        double relativeStep)
    {
        var nominal = ModelPoint.Nominals(model);
        var varying = Enumerable.Range(0, nominal.Length)
            .Where(i => nominal[i] != 0 && deltaMinus[i] != deltaPlus[i])
            .ToArray();
        var tracker = new ExtremeTracker(model.Figures.Count, nominal.Length);
        var ends = new ToleranceEnd[nominal.Length];
        Array.Fill(ends, ToleranceEnd.Nominal);
        var x = new double[nominal.Length];
        var y = new double[model.Figures.Count];

        void Evaluate()
        {
            for (var i = 0; i < x.Length; i++)
                x[i] = nominal[i] * (1 + ends[i] switch
                {
                    ToleranceEnd.Minus => deltaMinus[i],
                    ToleranceEnd.Plus => deltaPlus[i],
                    _ => 0,
                });
            model.Evaluate(x, y);
            tracker.Add(y, ends);
        }

        Evaluate(); // nominal point
        var evaluated = 1;
        CornerMethod method;
        if (varying.Length <= exhaustiveLimit)
        {
            method = CornerMethod.AllCorners;
            for (var mask = 0L; mask < 1L << varying.Length; mask++)
            {
                for (var k = 0; k < varying.Length; k++)
                    ends[varying[k]] = (mask >> k & 1) == 1 ? ToleranceEnd.Plus : ToleranceEnd.Minus;
                Evaluate();
                evaluated++;
            }
        }
        else
        {
            method = CornerMethod.SensitivityDirected;
            var d = SensitivityAnalysis.ScaledDerivatives(model, nominal, relativeStep);
            for (var f = 0; f < y.Length; f++)
            {
                foreach (var direction in (ReadOnlySpan<int>)[1, -1])
                {
                    foreach (var i in varying)
                    {
                        var push = d[f, i] * direction;
                        ends[i] = push > 0 ? ToleranceEnd.Plus : push < 0 ? ToleranceEnd.Minus : ToleranceEnd.Nominal;
                    }
                    Evaluate();
                    evaluated++;
                }
            }
        }

        var y0 = ModelPoint.Evaluate(model, nominal);
        var figures = new FigureExtremes[y.Length];
        for (var f = 0; f < y.Length; f++)
        {
            var spec = model.Figures[f];
            var found = tracker.Min[f] <= tracker.Max[f];
            figures[f] = new FigureExtremes(spec.Name, spec.Unit, ModelPoint.Defined(y0[f]),
                found ? ModelPoint.Defined(tracker.Min[f]) : null, found ? ModelPoint.Defined(tracker.Max[f]) : null,
                found ? ModelPoint.DeviationPercent(tracker.Min[f], y0[f]) : null,
                found ? ModelPoint.DeviationPercent(tracker.Max[f], y0[f]) : null,
                found ? Settings(model, nominal, deltaMinus, deltaPlus, tracker.MinEnds[f]) : null,
                found ? Settings(model, nominal, deltaMinus, deltaPlus, tracker.MaxEnds[f]) : null,
                tracker.Undefined[f]);
        }
        return new Outcome(method, varying.Length, evaluated, figures);
    }

    private static CornerSetting[] Settings(IFigureModel model, double[] nominal, double[] deltaMinus,
        double[] deltaPlus, ToleranceEnd[] ends)
    {
        var settings = new CornerSetting[ends.Length];
        for (var i = 0; i < ends.Length; i++)
        {
            var delta = ends[i] switch { ToleranceEnd.Minus => deltaMinus[i], ToleranceEnd.Plus => deltaPlus[i], _ => 0 };
            settings[i] = new CornerSetting(model.Parameters[i].Name, ends[i], nominal[i] * (1 + delta));
        }
        return settings;
    }

    /// <summary>Each figure's lowest and highest defined value so far and the ends that gave them.</summary>
    private sealed class ExtremeTracker
    {
        public ExtremeTracker(int figures, int parameters)
        {
            Min = Enumerable.Repeat(double.PositiveInfinity, figures).ToArray();
            Max = Enumerable.Repeat(double.NegativeInfinity, figures).ToArray();
            MinEnds = Enumerable.Range(0, figures).Select(_ => new ToleranceEnd[parameters]).ToArray();
            MaxEnds = Enumerable.Range(0, figures).Select(_ => new ToleranceEnd[parameters]).ToArray();
            Undefined = new int[figures];
        }

        public double[] Min { get; }
        public double[] Max { get; }
        public ToleranceEnd[][] MinEnds { get; }
        public ToleranceEnd[][] MaxEnds { get; }
        public int[] Undefined { get; }

        public void Add(double[] y, ToleranceEnd[] ends)
        {
            for (var f = 0; f < y.Length; f++)
            {
                if (double.IsNaN(y[f])) { Undefined[f]++; continue; }
                if (y[f] < Min[f]) { Min[f] = y[f]; ends.CopyTo(MinEnds[f], 0); }
                if (y[f] > Max[f]) { Max[f] = y[f]; ends.CopyTo(MaxEnds[f], 0); }
            }
        }
    }
}
