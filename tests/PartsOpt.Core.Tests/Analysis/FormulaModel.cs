using PartsOpt.Analysis;

namespace PartsOpt.Tests.Analysis;

/// <summary>A figure computed from the parameter vector.</summary>
internal delegate void Formula(ReadOnlySpan<double> x, Span<double> y);

/// <summary>An <see cref="IFigureModel"/> built from a textbook formula, for testing the analyses alone.</summary>
internal sealed class FormulaModel(IReadOnlyList<ParameterSpec> parameters, IReadOnlyList<FigureSpec> figures, Formula formula)
    : IFigureModel
{
    public IReadOnlyList<ParameterSpec> Parameters { get; } = parameters;
    public IReadOnlyList<FigureSpec> Figures { get; } = figures;
    public void Evaluate(ReadOnlySpan<double> parameters, Span<double> figures) => formula(parameters, figures);

    /// <summary>One figure "y" from a scalar formula.</summary>
    public static FormulaModel Scalar(Func<double[], double> f, params ParameterSpec[] parameters) =>
        new(parameters, [new FigureSpec("y", "1")], (x, y) => y[0] = f(x.ToArray()));

    /// <summary>y = a·b/c with the given tolerances (uniform); a = 2, b = 3, c = 4.</summary>
    public static FormulaModel ProductRatio(double ta, double tb, double tc) =>
        new([ParameterSpec.Symmetric("a", 2, ta), ParameterSpec.Symmetric("b", 3, tb), ParameterSpec.Symmetric("c", 4, tc)],
            [new FigureSpec("y", "1")], (x, y) => y[0] = x[0] * x[1] / x[2]);

    /// <summary>y = Π x_i of n parts, each nominal 1 with the same spread.</summary>
    public static FormulaModel Product(int n, double tolerance, SpreadDistribution distribution = SpreadDistribution.Uniform) =>
        new(Enumerable.Range(0, n).Select(i => new ParameterSpec($"x{i}", 1, tolerance, tolerance, distribution)).ToArray(),
            [new FigureSpec("y", "1")],
            (x, y) =>
            {
                var p = 1.0;
                foreach (var v in x) p *= v;
                y[0] = p;
            });

    /// <summary>
    /// Relaxation oscillator: f = 1/(2RC·ln((1+β)/(1−β))), β = r2/(r1+r2) (Sedra & Smith, signal
    /// generators and waveform-shaping circuits). Parameters R, C, r1, r2 in that order.
    /// </summary>
    public static FormulaModel Oscillator(double r, double c, double r1, double r2,
        TemperatureBehaviour? capacitorTemperature = null) =>
        new([ParameterSpec.Symmetric("osc.r", r, 0.01), ParameterSpec.Symmetric("osc.c", c, 0.05, capacitorTemperature),
             ParameterSpec.Symmetric("osc.r1", r1, 0.01), ParameterSpec.Symmetric("osc.r2", r2, 0.01)],
            [new FigureSpec("frequency", "Hz")],
            (x, y) =>
            {
                var beta = x[3] / (x[2] + x[3]);
                y[0] = 1 / (2 * x[0] * x[1] * Math.Log((1 + beta) / (1 - beta)));
            });

    /// <summary>Divider Vout = V·Rb/(Ra + Rb); parameters V, Ra, Rb in that order.</summary>
    public static FormulaModel Divider(ParameterSpec v, ParameterSpec ra, ParameterSpec rb) =>
        new([v, ra, rb], [new FigureSpec("vout", "V")], (x, y) => y[0] = x[0] * x[2] / (x[1] + x[2]));
}
