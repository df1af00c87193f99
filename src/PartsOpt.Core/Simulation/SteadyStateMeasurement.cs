namespace PartsOpt.Simulation;

/// <summary>
/// Measures the settled figures on the full-resolution trace, over the window from the oscillator's
/// rising edge number settle+1 to rising edge number settle+measure+1 (whole periods only).
/// </summary>
internal static class SteadyStateMeasurement
{
    public static SteadyStateFigures Measure(Trace trace, CircuitDynamics dynamics, int settlePeriods, int measurePeriods)
    {
        var rising = trace.RisingEdges;
        double start = rising[settlePeriods], end = rising[settlePeriods + measurePeriods];
        var ramp = dynamics.HasIntegrator ? trace.Int : trace.Cap;

        double highSum = 0, lowSum = 0, spanSum = 0, centreSum = 0;
        for (var p = 0; p < measurePeriods; p++)
        {
            double riseAt = rising[settlePeriods + p], nextRise = rising[settlePeriods + p + 1];
            var fall = trace.FallingEdges.Find(f => f > riseAt && f < nextRise);
            highSum += fall - riseAt;
            lowSum += nextRise - fall;
            var (min, max) = Extremes(trace.Time, ramp, riseAt, nextRise);
            spanSum += max - min;
            centreSum += (max + min) / 2;
        }

        var (outputLow, outputHigh) = Extremes(trace.Time, trace.Cmp, start, end);
        var mid = (dynamics.CmpHigh + dynamics.CmpLow) / 2;
        var duty = TimeAbove(trace.Time, trace.Cmp, mid, start, end) / (end - start);
        return new SteadyStateFigures(
            Frequency: measurePeriods / (end - start),
            HighTime: highSum / measurePeriods,
            LowTime: lowSum / measurePeriods,
            TrianglePeakToPeak: spanSum / measurePeriods,
            TriangleCentre: centreSum / measurePeriods,
            DutyCycle: duty,
            OutputHigh: outputHigh,
            OutputLow: outputLow,
            EdgeTime: EdgeTime(trace.Time, trace.Cmp, outputLow, outputHigh, start, end),
            MeasuredPeriods: measurePeriods);
    }

    private static (double Min, double Max) Extremes(List<double> time, List<double> value, double from, double to)
    {
        double min = double.PositiveInfinity, max = double.NegativeInfinity;
        for (var i = 0; i < time.Count && time[i] <= to; i++)
        {
            if (time[i] < from) continue;
            min = Math.Min(min, value[i]);
            max = Math.Max(max, value[i]);
        }
        return (min, max);
    }

    /// <summary>Time the piecewise-linear trace spends above <paramref name="level"/> inside [from, to].</summary>
    private static double TimeAbove(List<double> time, List<double> value, double level, double from, double to)
    {
        double above = 0;
        for (var i = 1; i < time.Count && time[i - 1] < to; i++)
        {
            double t0 = time[i - 1], t1 = time[i], v0 = value[i - 1], v1 = value[i];
            if (t1 <= from || t1 == t0) continue;
            // Clip the segment to the window, interpolating the values at the cut.
            if (t0 < from) { v0 += (v1 - v0) * (from - t0) / (t1 - t0); t0 = from; }
            if (t1 > to) { v1 = v0 + (v1 - v0) * (to - t0) / (t1 - t0); t1 = to; }
            if (v0 >= level && v1 >= level) above += t1 - t0;
            else if (v0 >= level || v1 >= level)
            {
                var cross = Trace.Crossing(t0, v0, t1, v1, level);
                above += v0 >= level ? cross - t0 : t1 - cross;
            }
        }
        return above;
    }

    /// <summary>Average 10–90 % time over the rising and falling edges that lie wholly inside the window.</summary>
    private static double EdgeTime(List<double> time, List<double> value, double low, double high, double from, double to)
    {
        if (!(high - low > 1e-9 * Math.Max(1, Math.Abs(high))))
            return double.NaN;
        double lower = low + 0.1 * (high - low), upper = low + 0.9 * (high - low);
        double sum = 0;
        var count = 0;
        double? risingStart = null, fallingStart = null;
        for (var i = 1; i < time.Count && time[i - 1] <= to; i++)
        {
            double t0 = time[i - 1], t1 = time[i], v0 = value[i - 1], v1 = value[i];
            if (t0 < from) continue;
            if (v0 < lower && v1 >= lower) risingStart = Trace.Crossing(t0, v0, t1, v1, lower);
            if (v0 < upper && v1 >= upper && risingStart is { } rs)
            {
                sum += Trace.Crossing(t0, v0, t1, v1, upper) - rs;
                count++;
                risingStart = null;
            }
            if (v0 > upper && v1 <= upper) fallingStart = Trace.Crossing(t0, v0, t1, v1, upper);
            if (v0 > lower && v1 <= lower && fallingStart is { } fs)
            {
                sum += Trace.Crossing(t0, v0, t1, v1, lower) - fs;
                count++;
                fallingStart = null;
            }
        }
        return count > 0 ? sum / count : double.NaN;
    }
}
