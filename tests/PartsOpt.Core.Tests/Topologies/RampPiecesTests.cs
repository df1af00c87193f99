using PartsOpt.Topologies;

namespace PartsOpt.Tests.Topologies;

public class RampPiecesTests
{
    [Fact]
    public void Filling_in_place_over_another_ramp_gives_the_fresh_ramp()
    {
        // The in-place fill must forget the ramp that was there (its count and its extremes): the
        // figure model refills one struct per evaluation. Checked against a freshly built ramp.
        const double tau = 1e-3, high = 10.5, low = -10.8, edge = 1.6e-6;
        var reused = RampPieces.Driven(-10, tau, high, low, edge, 30e-6, 20e-6);
        var fresh = RampPieces.Driven(1, 2.2e-5, high, low, edge, 25e-6 - edge, 25e-6 - edge, 5.0);
        Assert.True(reused.MaxV > fresh.MaxV || reused.MinV < fresh.MinV, "the old ramp must reach outside the new one");
        reused.FillDriven(1, 2.2e-5, high, low, edge, 25e-6 - edge, 25e-6 - edge, 5.0);

        Assert.Equal(fresh.Count, reused.Count);
        Assert.Equal(fresh.MaxV, reused.MaxV);
        Assert.Equal(fresh.MinV, reused.MinV);
        for (var i = 0; i < fresh.Count; i++)
            Assert.Equal(fresh[i], reused[i]);
    }

    [Fact]
    public void Linearity_error_is_the_largest_gap_to_the_chords_by_dense_sampling()
    {
        // Reference: the definition itself, sampled. The ramp is sampled 2000 times per piece (each piece by
        // its own exact solution), the chords run from the maximum to the minimum and back (both at piece
        // ends, where the pieces are split), and the largest gap is read off the samples. Sampling misses
        // the true peak by about (1/2000)² of the bow, hence 1e-6. Random stages, gains, time constants
        // from a fifth of the period to two hundred periods, and edges from 0.02 % to 10 % of it: the
        // closed form must not skip a piece whose gap is the largest.
        var random = new Random(5);
        for (var trial = 0; trial < 300; trial++)
        {
            var gain = random.Next(2) == 0 ? 1 : -(0.5 + 20 * random.NextDouble());
            var high = 2 + 12 * random.NextDouble();
            var low = -(2 + 12 * random.NextDouble());
            var period = 50e-6;
            var tau = period * Math.Pow(10, -0.7 + 3 * random.NextDouble());
            var edge = period * Math.Pow(10, -3.7 + 2.7 * random.NextDouble());
            var share = 0.2 + 0.6 * random.NextDouble();
            var ramp = RampPieces.Driven(gain, tau, high, low, edge, share * period - edge, (1 - share) * period - edge);

            var samples = new List<double>();
            var times = new List<double>();
            var start = 0.0;
            for (var k = 0; k < ramp.Count; k++)
            {
                for (var j = 0; j < 2000; j++)
                {
                    samples.Add(ramp[k].ValueAt(ramp[k].DurationS * j / 2000));
                    times.Add(start + ramp[k].DurationS * j / 2000);
                }

                start += ramp[k].DurationS;
            }

            var n = samples.Count;
            var top = samples.IndexOf(samples.Max());
            var bottom = samples.IndexOf(samples.Min());
            double Gap(int from, int to)
            {
                // Time runs on past the period's end (cyclically) from one extreme to the other.
                double TimeOf(int j) => j >= from ? times[j] : times[j] + start;
                var slope = (samples[to] - samples[from]) / (TimeOf(to) - TimeOf(from));
                var worst = 0.0;
                for (var j = from; j != to; j = (j + 1) % n)
                    worst = Math.Max(worst, Math.Abs(samples[j] - (samples[from] + slope * (TimeOf(j) - TimeOf(from)))));
                return worst;
            }

            var expected = Math.Max(Gap(top, bottom), Gap(bottom, top)) / (samples[top] - samples[bottom]);
            Precision.AlmostEqualRelative(expected, ramp.LinearityError(), 1e-6, $"linearity error, trial {trial}");
        }
    }

    [Fact]
    public void Time_above_a_threshold_matches_crossings_found_by_a_root_finder()
    {
        // Reference: each piece's crossing of the threshold found by MathNet's Brent root finder on the
        // piece's exact solution (v(t) = V on the monotonic piece), summed as time above. The engine sums
        // the crossings of a threshold inside one log1p; it must agree to rounding (1e-11 of the period;
        // the root finder is asked for 1e-15 of each piece). Random driven ramps (long and short time
        // constants, gains of both signs) and eleven thresholds across each.
        var random = new Random(9);
        for (var trial = 0; trial < 200; trial++)
        {
            var gain = random.Next(2) == 0 ? 1 : -(0.5 + 20 * random.NextDouble());
            var period = 50e-6;
            var tau = period * Math.Pow(10, -0.7 + 3 * random.NextDouble());
            var edge = period * Math.Pow(10, -3.7 + 2.7 * random.NextDouble());
            var share = 0.2 + 0.6 * random.NextDouble();
            var ramp = RampPieces.Driven(gain, tau, 2 + 12 * random.NextDouble(), -(2 + 12 * random.NextDouble()),
                edge, share * period - edge, (1 - share) * period - edge);
            for (var k = 1; k < 12; k++)
            {
                var threshold = ramp.MinV + (ramp.MaxV - ramp.MinV) * k / 12;
                var expected = 0.0;
                for (var i = 0; i < ramp.Count; i++)
                {
                    var piece = ramp[i];
                    var rising = piece.EndV > piece.StartV;
                    if (threshold >= Math.Max(piece.StartV, piece.EndV))
                        continue;
                    if (threshold <= Math.Min(piece.StartV, piece.EndV))
                    {
                        expected += piece.DurationS;
                        continue;
                    }

                    var crossing = MathNet.Numerics.RootFinding.Brent.FindRoot(
                        t => piece.ValueAt(t) - threshold, 0, piece.DurationS, 1e-15 * piece.DurationS, 200);
                    expected += rising ? piece.DurationS - crossing : crossing;
                }

                Precision.AlmostEqualAbsolute(expected, ramp.TimeAbove(threshold), 1e-11 * period,
                    $"time above, trial {trial}, threshold {k}/12");
            }
        }
    }
}
