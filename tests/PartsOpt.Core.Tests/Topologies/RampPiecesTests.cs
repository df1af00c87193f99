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
}
