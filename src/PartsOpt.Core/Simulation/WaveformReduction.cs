namespace PartsOpt.Simulation;

/// <summary>
/// Reduces a waveform to at most a given number of points while keeping its extremes: the time span is cut
/// into equal buckets and each bucket keeps its lowest and highest sample, in time order, so peaks, edges
/// and narrow pulses survive at any zoom. The first and last samples are always kept. Kept points are real
/// samples, not interpolated values.
/// </summary>
internal static class WaveformReduction
{
    public static Waveform Reduce(string name, List<double> time, List<double> value, int maxPoints)
    {
        var n = time.Count;
        if (n <= maxPoints)
            return new Waveform(name, time.ToArray(), value.ToArray());

        var buckets = (maxPoints - 2) / 2;
        var keptTime = new List<double>(maxPoints) { time[0] };
        var keptValue = new List<double>(maxPoints) { value[0] };
        double start = time[0], span = time[n - 1] - time[0];
        var i = 1;
        for (var b = 0; b < buckets && i <= n - 2; b++)
        {
            var end = start + span * (b + 1) / buckets;
            var last = b == buckets - 1;
            int lowest = -1, highest = -1;
            for (; i <= n - 2 && (last || time[i] < end); i++)
            {
                if (lowest < 0 || value[i] < value[lowest]) lowest = i;
                if (highest < 0 || value[i] > value[highest]) highest = i;
            }
            if (lowest < 0) continue;
            Keep(Math.Min(lowest, highest));
            if (highest != lowest) Keep(Math.Max(lowest, highest));
        }
        keptTime.Add(time[n - 1]);
        keptValue.Add(value[n - 1]);
        return new Waveform(name, keptTime.ToArray(), keptValue.ToArray());

        void Keep(int k)
        {
            keptTime.Add(time[k]);
            keptValue.Add(value[k]);
        }
    }
}
