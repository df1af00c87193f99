namespace PartsOpt.Analysis;

/// <summary>
/// Count, mean, sum of squared deviations, min and max of a stream of values, updated one value at a time
/// (Welford's method) and merged pairwise (Chan, Golub and LeVeque's parallel update). Both avoid the
/// cancellation of the textbook Σx² − n·mean² formula, which loses every digit for a 1 kHz figure with a
/// spread of a few hertz.
/// </summary>
internal struct RunningMoments
{
    public long Count;
    public double Mean;
    public double SumSquaredDeviations;
    public double Min;
    public double Max;

    public static RunningMoments Empty => new() { Min = double.PositiveInfinity, Max = double.NegativeInfinity };

    public void Add(double value)
    {
        Count++;
        var delta = value - Mean;
        Mean += delta / Count;
        SumSquaredDeviations += delta * (value - Mean);
        if (value < Min) Min = value;
        if (value > Max) Max = value;
    }

    /// <summary>The moments of the union of two disjoint sets of values.</summary>
    public static RunningMoments Merge(in RunningMoments a, in RunningMoments b)
    {
        if (a.Count == 0) return b;
        if (b.Count == 0) return a;
        var count = a.Count + b.Count;
        var delta = b.Mean - a.Mean;
        return new RunningMoments
        {
            Count = count,
            Mean = a.Mean + delta * b.Count / count,
            SumSquaredDeviations = a.SumSquaredDeviations + b.SumSquaredDeviations + delta * delta * a.Count * b.Count / count,
            Min = Math.Min(a.Min, b.Min),
            Max = Math.Max(a.Max, b.Max),
        };
    }

    /// <summary>Sample standard deviation (divisor n − 1); NaN below two values.</summary>
    public readonly double StandardDeviation => Count < 2 ? double.NaN : Math.Sqrt(SumSquaredDeviations / (Count - 1));
}
