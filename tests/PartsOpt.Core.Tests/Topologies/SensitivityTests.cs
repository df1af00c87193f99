using PartsOpt.Topologies;

namespace PartsOpt.Tests.Topologies;

public class SensitivityTests
{
    [Fact]
    public void Relaxation_oscillator_at_beta_one_half()
    {
        var s = FrequencySensitivity.Analytic(TestCircuits.ThreeStage(r1: 10e3, r2: 10e3));

        // REFERENCE.md: −1 to R and C; S(R2) = −S(R1) = −2β/((1+β)·Lg), ±0.6068 at β = 1/2.
        Precision.AlmostEqualRelative(-1, s[Roles.OscR], 1e-12);
        Precision.AlmostEqualRelative(-1, s[Roles.OscC], 1e-12);
        Precision.AlmostEqualRelative(-2 * 0.5 / (1.5 * Math.Log(3)), s[Roles.OscR2], 1e-12);
        Precision.AlmostEqualAbsolute(-0.6068, s[Roles.OscR2], 5e-5);
        Precision.AlmostEqualAbsolute(0.6068, s[Roles.OscR1], 5e-5);
        // REFERENCE.md: the sensitivities to all resistors sum to −1 (f depends on resistance ratios and one R).
        Precision.AlmostEqualAbsolute(-1, s[Roles.OscR] + s[Roles.OscR1] + s[Roles.OscR2], 1e-12);
    }

    [Fact]
    public void Loop_sensitivities_are_plus_one_and_minus_one()
    {
        var s = FrequencySensitivity.Analytic(TestCircuits.Loop());

        // REFERENCE.md, Schmitt-and-integrator loop: +1 to R2, −1 to R1, Ri, Ci.
        Precision.AlmostEqualRelative(1, s[Roles.SchR2], 1e-12);
        Precision.AlmostEqualRelative(-1, s[Roles.SchR1], 1e-12);
        Precision.AlmostEqualRelative(-1, s[Roles.IntR], 1e-12);
        Precision.AlmostEqualRelative(-1, s[Roles.IntC], 1e-12);
    }

    public static TheoryData<string> RealDesigns => new() { "three-stage", "rc-ramp", "loop" };

    [Theory]
    [MemberData(nameof(RealDesigns))]
    public void Analytic_sensitivities_agree_with_central_differences(string topology)
    {
        // Unequal headroom and a finite slew rate, so the general (not the textbook) forms are exercised.
        var amp = TestCircuits.Ideal(slewRate: 0.5e6, headroomHigh: 1.2, headroomLow: 2.9);
        var design = TopologyNames.Parse(topology) switch
        {
            TopologyKind.ThreeStage => TestCircuits.ThreeStage(r1: 10e3, r2: 6.8e3, amp: amp),
            TopologyKind.RcRamp => TestCircuits.RcRamp(r1: 4.7e3, r2: 10e3, amp: amp),
            _ => TestCircuits.Loop(r1: 8.2e3, r2: 15e3, amp: amp),
        };
        var analytic = FrequencySensitivity.Analytic(design);
        var model = CircuitFigureModel.For(design);
        var nominal = model.NominalParameters();
        var figures = new double[model.Figures.Count];
        model.Evaluate(nominal, figures);
        var f0 = figures[0];

        Assert.NotEmpty(analytic);
        foreach (var (name, expected) in analytic)
        {
            // Central difference, S ≈ (x/f)·(f(x+h) − f(x−h))/(2h), relative step 1e-6 (Bode's normalised form).
            var index = model.Parameters.Select(p => p.Name).ToList().IndexOf(name);
            var x = (double[])nominal.Clone();
            const double h = 1e-6;
            x[index] = nominal[index] * (1 + h);
            model.Evaluate(x, figures);
            var up = figures[0];
            x[index] = nominal[index] * (1 - h);
            model.Evaluate(x, figures);
            var down = figures[0];
            var numeric = (up - down) / (2 * h * f0);
            Precision.AlmostEqualAbsolute(expected, numeric, 1e-6, $"S({name})");
        }
    }
}
