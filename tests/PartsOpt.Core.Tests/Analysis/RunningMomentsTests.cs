using MathNet.Numerics.Random;
using MathNet.Numerics.Statistics;
using PartsOpt.Analysis;

namespace PartsOpt.Tests.Analysis;

public class RunningMomentsTests
{
    [Theory]
    [InlineData(0.0)]
    [InlineData(1e9)] // a large offset: the naive Σx² − n·mean² would lose every digit of the spread
    public void Merged_chunks_match_MathNet_statistics_over_the_whole_set(double offset)
    {
        var random = new MersenneTwister(17);
        var values = Enumerable.Range(0, 10_007).Select(_ => offset + random.NextDouble()).ToArray();

        // Uneven chunks, merged in order as the Monte Carlo run merges them.
        var total = RunningMoments.Empty;
        foreach (var chunk in values.Chunk(1000).Append([]))
        {
            var part = RunningMoments.Empty;
            foreach (var v in chunk) part.Add(v);
            total = RunningMoments.Merge(total, part);
        }

        // Reference: MathNet's ArrayStatistics (two-pass mean, sample standard deviation).
        Assert.Equal(values.Length, total.Count);
        Precision.AlmostEqualRelative(ArrayStatistics.Mean(values), total.Mean, 1e-14, "mean");
        Precision.AlmostEqualRelative(ArrayStatistics.StandardDeviation(values), total.StandardDeviation, 1e-6, "σ");
        Assert.Equal(values.Min(), total.Min);
        Assert.Equal(values.Max(), total.Max);
    }

    [Fact]
    public void Fewer_than_two_values_have_no_standard_deviation()
    {
        var moments = RunningMoments.Empty;
        moments.Add(3);
        Assert.True(double.IsNaN(moments.StandardDeviation));
    }
}
