using PartsOpt.Simulation;

namespace PartsOpt.Tests.Simulation;

public class ComparatorTests
{
    [Theory]
    [InlineData(-4.5)]
    [InlineData(-3.0)]
    [InlineData(0.0)]
    [InlineData(2.0)]
    [InlineData(5.0)]
    public void DutyIsLinearInTheThresholdOnASymmetricTriangle(double threshold)
    {
        var figures = TestCircuits.Figures(TransientSimulator.Run(TestCircuits.Loop(threshold: threshold)));

        // Triangle ±Vp = ±6 V on the non-inverting input, Vth on the inverting one: D = (Vp − Vth)/(2·Vp)
        // (REFERENCE.md, comparator and duty).
        var expected = (6 - threshold) / 12;
        Precision.AlmostEqualAbsolute(expected, figures.DutyCycle, 0.01, $"duty at Vth = {threshold} V");
        Precision.AlmostEqualRelative(expected, figures.DutyCycle, 0.01, $"duty at Vth = {threshold} V");
    }

    [Theory]
    [InlineData(6.5, 0.0)]
    [InlineData(-6.5, 1.0)]
    public void DutyClampsOutsideTheTriangle(double threshold, double expected)
    {
        var result = TransientSimulator.Run(TestCircuits.Loop(threshold: threshold));
        var figures = TestCircuits.Figures(result);

        // D = (Vp − Vth)/(2·Vp) clamped to [0, 1] (REFERENCE.md): the comparator never switches.
        Assert.Equal(expected, figures.DutyCycle);
        Assert.Equal(figures.OutputHigh, figures.OutputLow);
        Assert.True(double.IsNaN(figures.EdgeTime));
        // The oscillator still runs and is still measured (Sedra & Smith loop, 5 kHz).
        Precision.AlmostEqualRelative(5000, figures.Frequency, 0.01, "frequency");
    }

    [Fact]
    public void SlewingComparatorHasLinearEdgesBetweenItsLimits()
    {
        // 13 V/µs, saturating 1.5 V below V+ and 1 V above V− on ±12 V: levels 10.5 V and −11 V.
        const double slewRate = 13e6;
        var circuit = TestCircuits.Loop(threshold: 1.5) with { Comparator = new OpAmpSection(1.5, 1.0, slewRate) };
        var figures = TestCircuits.Figures(TransientSimulator.Run(circuit));

        Precision.AlmostEqualRelative(10.5, figures.OutputHigh, 1e-9, "output high = V+ − headroom");
        Precision.AlmostEqualRelative(-11, figures.OutputLow, 1e-9, "output low = V− + headroom");
        // A constant-rate edge crosses 10 % to 90 % of its swing in 0.8·swing/SR (definition of the 10–90 % time).
        Precision.AlmostEqualRelative(0.8 * 21.5 / slewRate, figures.EdgeTime, 0.01, "10–90 % edge time");
        // Rising and falling edges take equally long to reach mid-swing, so the duty is unchanged:
        // D = (Vp − Vth)/(2·Vp) (REFERENCE.md).
        Precision.AlmostEqualAbsolute((6 - 1.5) / 12, figures.DutyCycle, 0.01, "duty");
    }

    [Fact]
    public void ExponentialRampGivesADutyThatIsNotLinearInTheThreshold()
    {
        // Relaxation oscillator with unequal saturation, L+ = 10.5 V, L− = −9 V, β = 1/2; comparator on its capacitor.
        double high = 10.5, low = -9, beta = 0.5, rc = 10e3 * 100e-9;
        foreach (var threshold in new[] { -3.5, 0.0, 2.0, 4.5 })
        {
            var circuit = TestCircuits.RcRamp(threshold: threshold) with { Oscillator = new OpAmpSection(1.5, 3.0, double.PositiveInfinity) };
            var figures = TestCircuits.Figures(TransientSimulator.Run(circuit));

            // Time above Vth on each exponential segment (REFERENCE.md, "integrate the time above the threshold on
            // each segment"): rising from βL− towards L+ until βL+, above Vth for RC·ln((L+ − Vth)/(L+ − βL+));
            // falling from βL+ towards L− until βL−, above Vth for RC·ln((βL+ − L−)/(Vth − L−)). Period from the
            // unequal-saturation t_high + t_low (REFERENCE.md, derived).
            var above = rc * Math.Log((high - threshold) / (high - beta * high))
                + rc * Math.Log((beta * high - low) / (threshold - low));
            var period = rc * Math.Log((high - beta * low) / ((1 - beta) * high))
                + rc * Math.Log((low - beta * high) / ((1 - beta) * low));
            Precision.AlmostEqualAbsolute(above / period, figures.DutyCycle, 0.002, $"duty at Vth = {threshold} V");
        }
    }

    [Fact]
    public void ExponentialRampDutyDepartsFromTheTriangleLaw()
    {
        var figures = TestCircuits.Figures(TransientSimulator.Run(TestCircuits.RcRamp(threshold: 3)));

        // Symmetric ±12 V, β = 1/2, capacitor between ±6 V, Vth = 3 V: the segment integral gives
        // D = (ln((12 − 3)/6) + ln(18/(12 + 3)))/(2·ln 3) = 0.2675 (derived as above), not the triangle's 0.25.
        var expected = (Math.Log(9.0 / 6) + Math.Log(18.0 / 15)) / (2 * Math.Log(3));
        Precision.AlmostEqualAbsolute(expected, figures.DutyCycle, 0.001, "duty on the exponential ramp");
        Assert.True(Math.Abs(figures.DutyCycle - 0.25) > 0.01, "the exponential ramp's duty must differ from the triangle's");
    }
}
