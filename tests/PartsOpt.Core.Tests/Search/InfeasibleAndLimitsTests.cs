using PartsOpt.Search;
using PartsOpt.Topologies;
using PartsOpt.Values;
using static PartsOpt.Tests.Search.TestStock;

namespace PartsOpt.Tests.Search;

/// <summary>Requirements nothing in stock meets, the time limit, cancellation and bad input.</summary>
public class InfeasibleAndLimitsTests
{
    private static readonly SearchOptions Generous = new(TimeSpan.FromSeconds(600));

    /// <summary>
    /// rc-ramp at 20 kHz ±10 % from 4.7 kΩ / 10 kΩ and 1 nF / 10 nF. With β = ½ the period is
    /// 2·R·C·ln 3 (Sedra &amp; Smith, relaxation oscillator) plus two slewing edges of about 1.6 µs: 10 kΩ ·
    /// 1 nF gives about 40 kHz, 4.7 kΩ · 10 nF about 9 kHz, and the other dividers (β = 0.32, 0.68) land
    /// near 15 kHz and 27 kHz: nothing in the band. Scaling the nearest timing resistor by 40/20 asks for
    /// about 20 kΩ, an E24 value (IEC 60063), which gives about 21 kHz.
    /// </summary>
    private static (SearchRequirement, Stock) MissingTwentyKilohm() =>
        (new SearchRequirement(Supply.Symmetric(12), new Band(20e3, 0.10), new DutyRequirement(0.20, 0.80), 10)
        {
            Topologies = [TopologyKind.RcRamp],
        },
        new Stock(
        [
            Resistor("R-4K7", 4.7e3, 0.010m),
            Resistor("R-10K", 10e3, 0.010m),
            Capacitor("C-1N0", 1e-9, 0.05m),
            Capacitor("C-10N", 10e-9, 0.05m),
            Capacitor("C-100N", 100e-9, 0.02m, Dielectric.X7R),
            Pot("RV-10K", 10e3, 0.40m),
        ],
        [OpAmp("TL074", QuadJfet, 0.35m), OpAmp("CMP-FAST", FastComparator, 0.60m)]));

    [Fact]
    public void InfeasibleRequirementIsExplainedWithNearestMissAndAPurchase()
    {
        var (requirement, stock) = MissingTwentyKilohm();
        var outcome = DesignSearch.Run(requirement, stock, Generous);

        Assert.Equal(SearchStatus.Infeasible, outcome.Status);
        Assert.Empty(outcome.Designs);
        Assert.Null(ExhaustiveReference.Cheapest(requirement, stock));
        var report = Assert.Single(outcome.Topologies);
        Assert.False(report.Feasible);
        Assert.True(report.Proved);
        Assert.Contains("frequency", report.Blocking, StringComparison.Ordinal);
        var nearest = Assert.IsType<NearMiss>(report.Nearest);
        var frequency = Assert.IsType<double>(nearest.Figures[FigureNames.Frequency]);
        Assert.False(requirement.Frequency.Contains(frequency));
        Assert.Contains(nearest.Misses, m => m.StartsWith("frequency", StringComparison.Ordinal));

        var purchase = Assert.IsType<PurchaseSuggestion>(report.Purchase);
        Assert.Equal(Roles.OscR, purchase.Role);
        Assert.Equal(RoleKind.Resistor, purchase.Kind);
        Assert.Equal("E24", purchase.Series);
        Precision.AlmostEqualRelative(20e3, purchase.Value, 1e-12, "E24 value to buy");

        // Buying it makes the requirement feasible, and the new part times the oscillator.
        var restocked = stock with { Parts = [.. stock.Parts, Resistor("R-20K", purchase.Value, 0.010m)] };
        var after = DesignSearch.Run(requirement, restocked, Generous);
        Assert.Equal(SearchStatus.Optimal, after.Status);
        Assert.Equal(["R-20K"], after.Designs[0].RoleParts[Roles.OscR]);
    }

    [Fact]
    public void NoOpAmpRatedForTheSupplyIsTheBlockingReason()
    {
        var (requirement, stock) = MissingTwentyKilohm();
        var lowVoltage = stock with { OpAmps = [OpAmp("LV", QuadJfet with { SupplyMinV = 2, SupplyMaxV = 5.5 }, 0.30m)] };
        var outcome = DesignSearch.Run(requirement, lowVoltage, Generous);

        Assert.Equal(SearchStatus.Infeasible, outcome.Status);
        var report = Assert.Single(outcome.Topologies);
        Assert.Contains("LV is rated for 2 … 5.5 V", report.Blocking, StringComparison.Ordinal);
    }

    [Fact]
    public void StockTooShortForTheBuildIsTheBlockingReason()
    {
        var (requirement, stock) = MissingTwentyKilohm();
        var scarce = stock with { Parts = stock.Parts.Select(p => p.Kind == RoleKind.Potentiometer ? p with { Available = 9 } : p).ToList() };
        var outcome = DesignSearch.Run(requirement, scarce, Generous);

        Assert.Equal(SearchStatus.Infeasible, outcome.Status);
        Assert.Contains("Not enough stock for 10 boards", Assert.Single(outcome.Topologies).Blocking, StringComparison.Ordinal);
    }

    /// <summary>A large stockroom: E24 resistors over two decades and E6 capacitors over three (IEC 60063).</summary>
    private static Stock LargeStockroom()
    {
        double[] e24 = [1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1];
        double[] e6 = [1.0, 1.5, 2.2, 3.3, 4.7, 6.8];
        var parts = new List<StockPart>();
        foreach (var decade in new[] { 1e3, 1e4 })
            foreach (var m in e24)
                parts.Add(Resistor($"R{m * decade:0}", m * decade, 0.010m + (decimal)(m / 1000)));
        foreach (var decade in new[] { 1e-10, 1e-9, 1e-8 })
            foreach (var m in e6)
                parts.Add(Capacitor($"C{m * decade:E1}", m * decade, 0.05m));
        parts.Add(Capacitor("C-100N", 100e-9, 0.02m, Dielectric.X7R));
        parts.Add(Pot("RV-10K", 10e3, 0.40m));
        parts.Add(Pot("RV-50K", 50e3, 0.45m));
        return new Stock(parts, [OpAmp("TL074", QuadJfet, 0.35m), OpAmp("TL072", DualJfet, 0.25m), OpAmp("CMP-FAST", FastComparator, 0.60m)]);
    }

    [Fact]
    public void TimeLimitIsHonoured()
    {
        // Generous slack: the limit is checked between solves and inside each (CP-SAT max_time_in_seconds).
        var limit = TimeSpan.FromSeconds(2);
        var outcome = DesignSearch.Run(PwmAt20Kilohertz(), LargeStockroom(), new SearchOptions(limit));

        Assert.True(outcome.Elapsed < limit + TimeSpan.FromSeconds(45), $"took {outcome.Elapsed}");
        if (outcome.Status is SearchStatus.Feasible or SearchStatus.Unknown)
            Assert.Contains(outcome.Notes, n => n.Contains("time limit", StringComparison.Ordinal));
    }

    [Fact]
    public void A_search_cut_short_claims_nothing_it_did_not_prove()
    {
        // So short a limit that no topology is finished: a report may say what was seen, never that the band
        // cannot be reached (this stock reaches 20 kHz; see the 20 kHz tests).
        var outcome = DesignSearch.Run(PwmAt20Kilohertz(), LargeStockroom(), new SearchOptions(TimeSpan.FromMilliseconds(1)));

        Assert.All(outcome.Topologies.Where(t => !t.Feasible && !t.Proved), t =>
            Assert.DoesNotContain("No stocked combination", t.Blocking ?? "", StringComparison.Ordinal));
    }

    [Fact]
    public void CancelledSearchReturnsWithoutClaimingAnything()
    {
        using var cancelled = new CancellationTokenSource();
        cancelled.Cancel();
        var outcome = DesignSearch.Run(PwmAt20Kilohertz(), Stockroom(), Generous, cancelled.Token);

        Assert.Equal(SearchStatus.Unknown, outcome.Status);
        Assert.Equal(0, outcome.Solves);
        Assert.Contains(outcome.Notes, n => n.Contains("cancelled", StringComparison.Ordinal));
        Assert.All(outcome.Topologies, t => Assert.False(t.Proved));
    }

    [Fact]
    public void CancellationStopsARunningSearch()
    {
        using var soon = new CancellationTokenSource(TimeSpan.FromMilliseconds(300));
        var outcome = DesignSearch.Run(PwmAt20Kilohertz(), LargeStockroom(), new SearchOptions(TimeSpan.FromMinutes(10)), soon.Token);

        Assert.True(outcome.Elapsed < TimeSpan.FromSeconds(60), $"took {outcome.Elapsed}");
        if (outcome.Status is not (SearchStatus.Optimal or SearchStatus.Infeasible))
            Assert.Contains(outcome.Notes, n => n.Contains("cancelled", StringComparison.Ordinal));
    }

    [Theory]
    [InlineData(0, 0.1, 0.05, 0.95, 10, "frequency")]
    [InlineData(20e3, 1.5, 0.05, 0.95, 10, "frequency")]
    [InlineData(20e3, 0.1, 0.95, 0.05, 10, "duty")]
    [InlineData(20e3, 0.1, 0.05, 0.95, 0, "buildQuantity")]
    public void MeaninglessRequirementIsRefusedNamingTheField(double hz, double tolerance, double dutyMin, double dutyMax, int quantity, string field)
    {
        var requirement = new SearchRequirement(Supply.Symmetric(12), new Band(hz, tolerance), new DutyRequirement(dutyMin, dutyMax), quantity);
        var error = Assert.Throws<ArgumentException>(() => DesignSearch.Run(requirement, Stockroom()));
        Assert.Equal(field, error.ParamName);
    }
}
