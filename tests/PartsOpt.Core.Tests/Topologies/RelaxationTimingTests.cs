using PartsOpt.Simulation;
using PartsOpt.Topologies;

namespace PartsOpt.Tests.Topologies;

/// <summary>
/// The slewing relaxation oscillator's exact half periods and the period bracket the search's relaxation
/// uses. Derived (RelaxationTiming); the exact form is checked against the time-domain simulator (itself
/// cross-checked against MathNet RK4), the bracket over many random designs.
/// </summary>
public class RelaxationTimingTests
{
    [Fact]
    public void Instant_edges_give_the_textbook_half_periods()
    {
        // Sedra & Smith: symmetric ±L, β = 1/2: each half RC·ln 3; 10 kΩ · 100 nF → 455.12 Hz.
        var (high, low) = RelaxationTiming.HalfPeriods(1e-3, 0.5, 12, -12, double.PositiveInfinity);
        Precision.AlmostEqualRelative(1e-3 * Math.Log(3), high, 1e-14, "high");
        Precision.AlmostEqualRelative(1e-3 * Math.Log(3), low, 1e-14, "low");
        Precision.AlmostEqualRelative(455.12, 1 / (high + low), 1e-5, "frequency");
    }

    [Theory]
    [InlineData(1e-3, 0.5, 10.5, -10.5, 0.5e6)]
    [InlineData(47e-6, 0.5, 10.8, -11.2, 13e6)]
    [InlineData(2e-4, 0.2, 6, -14, 2e6)]
    [InlineData(1e-4, 0.8, 13, -4, 1e6)]
    public void Half_periods_match_the_time_domain_simulator(double rc, double beta, double high, double low, double slew)
    {
        // Derived; checked against the time-domain simulator (exact piecewise solution, cross-checked with
        // MathNet RK4): levels set by the headroom on a ±15 V supply, r1 = 10 kΩ, r2 from β.
        var r2 = 10e3 * beta / (1 - beta);
        var circuit = new SimulatedCircuit
        {
            Topology = SimulatedTopology.RcRamp,
            SupplyPositive = 15,
            SupplyNegative = -15,
            Oscillator = new OpAmpSection(15 - high, 15 + low, slew),
            OscR = rc / 10e-9, OscC = 10e-9, OscR1 = 10e3, OscR2 = r2,
        };
        var run = TransientSimulator.Run(circuit, new SimulationOptions { SettlePeriods = 3, MeasurePeriods = 4, StepsPerPeriod = 2000 });
        var (th, tl) = RelaxationTiming.HalfPeriods(rc, beta, high, low, slew);
        Precision.AlmostEqualRelative(th, run.Figures!.HighTime, 1e-4, "high time");
        Precision.AlmostEqualRelative(tl, run.Figures!.LowTime, 1e-4, "low time");
    }

    [Fact]
    public void An_edge_that_cannot_complete_is_not_covered()
    {
        // Derived: with t_e far longer than RC the capacitor reaches the other threshold before the output
        // saturates (D ≤ (1 − β)|L−|); the closed form does not cover that regime.
        var (high, low) = RelaxationTiming.HalfPeriods(1e-6, 0.5, 10, -10, 1e5);
        Assert.True(double.IsNaN(high) && double.IsNaN(low));
    }

    [Fact]
    public void The_period_lies_inside_its_bracket_for_random_designs()
    {
        // Derived bracket R·C·k + a·2t_e ≤ T ≤ R·C·k + b·2t_e, checked on 200 000 random designs: levels
        // 0.3…30 V each side, β 0.001…0.999, t_e/RC from 10⁻⁶ to 30 (wherever the edge completes).
        var random = new Random(20261202);
        var inside = 0;
        double lowestA = double.PositiveInfinity, highestB = double.NegativeInfinity;
        for (var i = 0; i < 200_000; i++)
        {
            var high = 0.3 + 29.7 * random.NextDouble();
            var low = -(0.3 + 29.7 * random.NextDouble());
            var beta = i % 3 == 0 ? Math.Pow(10, -3 * random.NextDouble()) * 0.999 : 0.001 + 0.998 * random.NextDouble();
            var rc = Math.Pow(10, -6 + 5 * random.NextDouble());
            var edge = rc * Math.Pow(10, -6 + 7.5 * random.NextDouble());
            var slew = (high - low) / edge;
            var (th, tl) = RelaxationTiming.HalfPeriods(rc, beta, high, low, slew);
            if (double.IsNaN(th))
                continue;
            var (min, max) = RelaxationTiming.PeriodBracket(rc, beta, high, low, slew);
            var period = th + tl;
            var slack = 1e-12 * period;
            Assert.True(period >= min - slack && period <= max + slack,
                $"T = {period} outside [{min}, {max}] for L+ {high}, L− {low}, β {beta}, RC {rc}, t_e {edge}");
            // How close the bracket comes: the tightest multipliers seen against a and b.
            var (a, b) = RelaxationTiming.EdgeMultipliers(beta, high, low);
            var instant = min - a * 2 * edge;
            var multiplier = (period - instant) / (2 * edge);
            lowestA = Math.Min(lowestA, multiplier - a);
            highestB = Math.Max(highestB, multiplier - b);
            inside++;
        }

        Assert.True(inside > 150_000, $"only {inside} designs in the covered regime");
        Assert.True(lowestA > -1e-9 && highestB < 1e-9);
    }

    [Fact]
    public void Symmetric_levels_at_half_ratio_have_the_stated_multipliers()
    {
        // Derived: β = 1/2, ±L: a = (3 − β)/4 = 0.625, b = 1; short edges tend to t_e/(1 + β) = 2/3 each.
        var (a, b) = RelaxationTiming.EdgeMultipliers(0.5, 10, -10);
        Assert.Equal(0.625, a, 12);
        Assert.Equal(1.0, b, 12);
        const double rc = 1e-3, edge = 1e-9;
        var (th, tl) = RelaxationTiming.HalfPeriods(rc, 0.5, 10, -10, 20 / edge);
        Precision.AlmostEqualRelative(2.0 / 3, (th + tl - 2 * rc * Math.Log(3)) / (2 * edge), 1e-5, "multiplier");
    }

    [Fact]
    public void The_capacitor_driven_through_the_derived_times_returns_to_its_thresholds()
    {
        // Derived twice: the half periods by the logarithm after the edge, the capacitor by propagating the
        // exact ramp and exponential pieces. Driven through those times from βL+ it must reach βL− just as
        // the output starts its rising edge and βL+ again after a whole period; the periodic solution (no
        // start given) must be the same wave.
        var lowChecked = 0;
        foreach (var (high, low, beta, rc, edge) in RandomOscillators(seed: 7, count: 2000))
        {
            var (th, tl) = RelaxationTiming.HalfPeriods(rc, beta, high, low, (high - low) / edge);
            if (double.IsNaN(th))
                continue;
            var wave = RampPieces.Driven(1, rc, high, low, edge, tl - edge, th - edge, beta * high);
            var periodic = RampPieces.Driven(1, rc, high, low, edge, tl - edge, th - edge);
            var scale = high - low;
            var last = wave[wave.Count - 1];
            Precision.AlmostEqualAbsolute(beta * high, last.EndV, 1e-11 * scale, "back at βL+");
            var elapsed = 0.0;
            for (var k = 0; k < wave.Count && elapsed < tl * (1 - 1e-12); k++)
            {
                elapsed += wave[k].DurationS;
                if (Math.Abs(elapsed - tl) <= 1e-12 * tl)
                {
                    Precision.AlmostEqualAbsolute(beta * low, wave[k].EndV, 1e-11 * scale, "at βL− when the rising edge starts");
                    lowChecked++;
                }
            }

            Precision.AlmostEqualAbsolute(wave.MaxV, periodic.MaxV, 1e-9 * scale, "periodic maximum");
            Precision.AlmostEqualAbsolute(wave.MinV, periodic.MinV, 1e-9 * scale, "periodic minimum");
        }

        Assert.True(lowChecked > 1500, $"βL− checked on {lowChecked} designs only");
    }

    [Fact]
    public void The_capacitor_pinned_to_its_trip_points_is_the_driven_capacitor()
    {
        // The figure model builds the capacitor with its held phases ending exactly at βL− and βL+ and the
        // edges' factors taken from the half periods. Checked against the ramp propagated through every
        // phase from βL+ (Driven, itself checked above to return to the trip points): same pieces, same
        // extremes, to rounding.
        var compared = 0;
        foreach (var (high, low, beta, rc, edge) in RandomOscillators(seed: 11, count: 2000))
        {
            var (th, tl) = RelaxationTiming.HalfPeriods(rc, beta, high, low, (high - low) / edge, out var x, out var excess);
            if (double.IsNaN(th))
                continue;
            var driven = RampPieces.Driven(1, rc, high, low, edge, tl - edge, th - edge, beta * high);
            var pinned = default(RampPieces);
            pinned.FillRelaxation(rc, high, low, edge, tl - edge, th - edge, beta * high, beta * low, x, excess);
            var scale = high - low;
            Assert.Equal(driven.Count, pinned.Count);
            for (var k = 0; k < driven.Count; k++)
            {
                Precision.AlmostEqualRelative(driven[k].DurationS, pinned[k].DurationS, 1e-12, "piece duration");
                Precision.AlmostEqualAbsolute(driven[k].StartV, pinned[k].StartV, 1e-11 * scale, "piece start");
                Precision.AlmostEqualAbsolute(driven[k].EndV, pinned[k].EndV, 1e-11 * scale, "piece end");
            }

            Precision.AlmostEqualAbsolute(driven.MaxV, pinned.MaxV, 1e-11 * scale, "maximum");
            Precision.AlmostEqualAbsolute(driven.MinV, pinned.MinV, 1e-11 * scale, "minimum");
            // The extremes alone (the three-stage generator's capacitor swing) are the pinned ramp's, exactly.
            var (max, min) = RampPieces.RelaxationExtremes(rc, high, low, edge, beta * high, beta * low, x, excess);
            Assert.Equal(pinned.MaxV, max);
            Assert.Equal(pinned.MinV, min);
            compared++;
        }

        Assert.True(compared > 1500, $"compared on {compared} designs only");
    }

    /// <summary>Seeded random oscillators: levels 1 … 15 V either side, β 0.05 … 0.95, RC 0.1 ms, edges 1e-4 … 1 of RC.</summary>
    private static IEnumerable<(double High, double Low, double Beta, double Rc, double Edge)> RandomOscillators(int seed, int count)
    {
        var random = new Random(seed);
        for (var i = 0; i < count; i++)
        {
            var high = 1 + 14 * random.NextDouble();
            var low = -(1 + 14 * random.NextDouble());
            var beta = 0.05 + 0.9 * random.NextDouble();
            const double rc = 1e-4;
            yield return (high, low, beta, rc, rc * Math.Pow(10, -4 + 4 * random.NextDouble()));
        }
    }
}
