using MathNet.Numerics.Distributions;
using MathNet.Numerics.Random;

namespace PartsOpt.Analysis;

/// <summary>
/// Draws one chunk of Monte Carlo samples with its own random stream and summarises it. Everything a
/// sample needs is prepared once per run (the arrays below) and allocated once per chunk; a sample
/// itself allocates nothing.
/// </summary>
internal sealed class MonteCarloSampler
{
    private readonly IFigureModel _model;
    private readonly double[] _nominal;
    private readonly double[] _low;      // δ at the lower end of the band (−minus)
    private readonly double[] _width;    // plus + minus
    private readonly double[] _centre;   // (plus − minus)/2
    private readonly double[] _sigma;    // half-width/3, for normal parts
    private readonly bool[] _normal;
    private readonly TemperatureRange? _temperature;
    private readonly double[] _ppm;      // linear coefficient, 1e-6/K
    private readonly double[] _bandLow;  // banded characteristic: −BandMinus
    private readonly double[] _bandWidth;
    private readonly bool[] _banded;
    private readonly int[] _bandFigure;
    private readonly double[] _bandMin;
    private readonly double[] _bandMax;

    public MonteCarloSampler(IFigureModel model, TemperatureRange? temperature, int[] bandFigure, double[] bandMin,
        double[] bandMax)
    {
        _model = model;
        var parameters = model.Parameters;
        var n = parameters.Count;
        _nominal = ModelPoint.Nominals(model);
        _low = parameters.Select(p => -p.ToleranceMinus).ToArray();
        _width = parameters.Select(p => p.ToleranceMinus + p.TolerancePlus).ToArray();
        _centre = parameters.Select(ParameterSpread.RelativeMeanOffset).ToArray();
        _sigma = parameters.Select(p => ParameterSpread.RelativeHalfWidth(p) / 3).ToArray();
        _normal = parameters.Select(p => p.Distribution == SpreadDistribution.Normal).ToArray();
        _temperature = temperature;
        _ppm = new double[n];
        _bandLow = new double[n];
        _bandWidth = new double[n];
        _banded = new bool[n];
        if (temperature is not null)
        {
            for (var i = 0; i < n; i++)
            {
                if (parameters[i].Temperature is not { } t) continue;
                _banded[i] = t.IsBanded && !temperature.IsReferenceOnly;
                _bandLow[i] = -t.BandMinus;
                _bandWidth[i] = t.BandMinus + t.BandPlus;
                _ppm[i] = t.IsBanded ? 0 : t.CoefficientPpmPerK * 1e-6;
            }
        }
        _bandFigure = bandFigure;
        _bandMin = bandMin;
        _bandMax = bandMax;
    }

    /// <summary>Draws <paramref name="count"/> boards from the stream seeded with <paramref name="chunkSeed"/>.</summary>
    public ChunkSummary Run(int chunkSeed, int count)
    {
        var random = new Xoshiro256StarStar(chunkSeed, threadSafe: false);
        var parameters = _nominal.Length;
        var figures = _model.Figures.Count;
        Span<double> x = parameters <= 256 ? stackalloc double[parameters] : new double[parameters];
        Span<double> y = figures <= 256 ? stackalloc double[figures] : new double[figures];
        var summary = new ChunkSummary(figures, _bandFigure.Length);

        for (var s = 0; s < count; s++)
        {
            Draw(random, x);
            _model.Evaluate(x, y);
            summary.Add(y, _bandFigure, _bandMin, _bandMax);
        }
        return summary;
    }

    private void Draw(Random random, Span<double> x)
    {
        for (var i = 0; i < x.Length; i++)
        {
            double delta;
            if (_width[i] == 0) delta = _low[i];
            else if (!_normal[i]) delta = _low[i] + _width[i] * random.NextDouble();
            else
            {
                // Truncated at ±3σ: a part outside its band is redrawn, as incoming inspection would reject it.
                do delta = Normal.Sample(random, _centre[i], _sigma[i]);
                while (delta < _low[i] || delta > _low[i] + _width[i]);
            }
            x[i] = _nominal[i] * (1 + delta);
        }

        if (_temperature is null) return;
        var kelvinFromReference = _temperature.MinCelsius - TemperatureBehaviour.ReferenceCelsius
            + (_temperature.MaxCelsius - _temperature.MinCelsius) * random.NextDouble();
        for (var i = 0; i < x.Length; i++)
        {
            if (_banded[i]) x[i] *= 1 + _bandLow[i] + _bandWidth[i] * random.NextDouble();
            else if (_ppm[i] != 0) x[i] *= 1 + (2 * random.NextDouble() - 1) * _ppm[i] * kelvinFromReference;
        }
    }
}

/// <summary>What one chunk of samples leaves behind: per-figure moments and band counts.</summary>
internal sealed class ChunkSummary
{
    public ChunkSummary(int figures, int bands)
    {
        Moments = new RunningMoments[figures];
        Array.Fill(Moments, RunningMoments.Empty);
        Undefined = new int[figures];
        BandPassing = new int[bands];
    }

    public RunningMoments[] Moments { get; }
    public int[] Undefined { get; }
    public int[] BandPassing { get; }
    public int AllPassing { get; private set; }

    public void Add(ReadOnlySpan<double> y, int[] bandFigure, double[] bandMin, double[] bandMax)
    {
        for (var f = 0; f < y.Length; f++)
        {
            if (!double.IsFinite(y[f])) Undefined[f]++;
            else Moments[f].Add(y[f]);
        }
        var all = true;
        for (var b = 0; b < bandFigure.Length; b++)
        {
            var v = y[bandFigure[b]];
            // NaN fails both comparisons: an undefined figure is outside every band.
            if (v >= bandMin[b] && v <= bandMax[b]) BandPassing[b]++;
            else all = false;
        }
        if (all && bandFigure.Length > 0) AllPassing++;
    }
}
