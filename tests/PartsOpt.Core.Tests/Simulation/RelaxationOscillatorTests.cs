using PartsOpt.Simulation;

namespace PartsOpt.Tests.Simulation;

public class RelaxationOscillatorTests
{
    [Fact]
    public void EqualDividerGivesTheTextbookFrequency()
    {
        var figures = TestCircuits.Figures(TransientSimulator.Run(TestCircuits.RcRamp()));

        // f = 1/(2RC·ln 3) = 455.12 Hz for R = 10 kΩ, C = 100 nF: Sedra & Smith, Microelectronic Circuits,
        // chapter on signal generators and waveform-shaping circuits (REFERENCE.md).
        Precision.AlmostEqualRelative(455.12, figures.Frequency, 0.01, "frequency");
        // Same formula unrounded: the event-located switching should match it far more closely than 1 %.
        Precision.AlmostEqualRelative(1 / (2 * 10e3 * 100e-9 * Math.Log(3)), figures.Frequency, 1e-6, "frequency, tight");
        // Symmetric saturation: equal halves (same source).
        Precision.AlmostEqualRelative(figures.HighTime, figures.LowTime, 0.001, "high time vs low time");
        // The capacitor runs between ±β·L = ±6 V (same source).
        Precision.AlmostEqualRelative(12, figures.TrianglePeakToPeak, 0.001, "capacitor swing");
    }

    [Theory]
    [InlineData(22e3, 4.7e3)]
    [InlineData(4.7e3, 22e3)]
    [InlineData(10e3, 1e3)]
    public void PeriodFollowsTheDividerRatio(double r1, double r2)
    {
        var figures = TestCircuits.Figures(TransientSimulator.Run(TestCircuits.RcRamp(r1, r2)));

        // T = 2RC·ln((1+β)/(1−β)), β = r2/(r1+r2): Sedra & Smith, signal generators chapter (REFERENCE.md).
        var beta = r2 / (r1 + r2);
        var period = 2 * 10e3 * 100e-9 * Math.Log((1 + beta) / (1 - beta));
        Precision.AlmostEqualRelative(1 / period, figures.Frequency, 0.01, $"frequency at β = {beta:F3}");
    }

    [Fact]
    public void UnequalSaturationGivesUnequalHalves()
    {
        // ±12 V rails; the output saturates 1.5 V below V+ and 3 V above V−: L+ = 10.5 V, L− = −9 V. β = 0.4.
        var circuit = TestCircuits.RcRamp(r1: 15e3, r2: 10e3) with { Oscillator = new OpAmpSection(1.5, 3.0, double.PositiveInfinity) };
        var figures = TestCircuits.Figures(TransientSimulator.Run(circuit));

        // t_high = RC·ln((L+ − βL−)/((1−β)L+)), t_low = RC·ln((L− − βL+)/((1−β)L−)) (REFERENCE.md, derived).
        double rc = 10e3 * 100e-9, beta = 0.4, high = 10.5, low = -9;
        var expectedHigh = rc * Math.Log((high - beta * low) / ((1 - beta) * high));
        var expectedLow = rc * Math.Log((low - beta * high) / ((1 - beta) * low));
        Precision.AlmostEqualRelative(expectedHigh, figures.HighTime, 0.01, "high time");
        Precision.AlmostEqualRelative(expectedLow, figures.LowTime, 0.01, "low time");
        // The capacitor runs between βL− and βL+ (REFERENCE.md).
        Precision.AlmostEqualRelative(beta * (high - low), figures.TrianglePeakToPeak, 0.001, "capacitor swing");
    }

    [Fact]
    public void SlewingEdgesLengthenThePeriod()
    {
        const double slewRate = 1e6; // 1 V/µs
        var fast = TestCircuits.Figures(TransientSimulator.Run(TestCircuits.RcRamp()));
        var slow = TestCircuits.Figures(TransientSimulator.Run(
            TestCircuits.RcRamp() with { Oscillator = new OpAmpSection(0, 0, slewRate) }));

        var growth = 1 / slow.Frequency - 1 / fast.Frequency;
        // Each slew-limited edge adds about (L+ − L−)/SR to the period (common practice). The rule is an upper
        // estimate: the capacitor keeps moving while the output slews, and a first-order analysis of that gives
        // 2/(1+β) of the rule's 2·(L+ − L−)/SR, i.e. 2/3 of it here. Accept half to all of the rule.
        var rule = 2 * 24 / slewRate;
        Assert.InRange(growth, 0.5 * rule, 1.0 * rule);
        // First-order estimate, derived here (not a published value): growth ≈ 2·(L+ − L−)/SR/(1 + β), within 5 %.
        Precision.AlmostEqualRelative(rule / 1.5, growth, 0.05, "period growth against the first-order estimate");
    }

    [Fact]
    public void SingleSupplyOscillatesAboutTheMidRailReference()
    {
        // 0/12 V supply, mid-rail reference 6 V, 1.5 V headroom both ways: the output swings 1.5…10.5 V,
        // symmetric about the reference, so f = 1/(2RC·ln 3) again (Sedra & Smith, as above, shifted to the reference).
        var circuit = TestCircuits.RcRamp() with
        {
            SupplyPositive = 12,
            SupplyNegative = 0,
            Reference = 6,
            Threshold = 6,
            Oscillator = new OpAmpSection(1.5, 1.5, double.PositiveInfinity),
            Comparator = new OpAmpSection(1.5, 1.5, double.PositiveInfinity),
        };
        var figures = TestCircuits.Figures(TransientSimulator.Run(circuit));

        Precision.AlmostEqualRelative(455.12, figures.Frequency, 0.01, "frequency");
        Precision.AlmostEqualRelative(6, figures.TriangleCentre, 0.001, "capacitor centre at the reference");
        Precision.AlmostEqualRelative(10.5, figures.OutputHigh, 1e-9, "comparator high = V+ − headroom");
        Precision.AlmostEqualRelative(1.5, figures.OutputLow, 1e-9, "comparator low = V− + headroom");
    }
}
