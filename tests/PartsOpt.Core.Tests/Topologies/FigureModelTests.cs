using PartsOpt.Topologies;

namespace PartsOpt.Tests.Topologies;

public class FigureModelTests
{
    [Fact]
    public void Parameters_are_roles_then_op_amp_limits_with_tolerances_and_designators()
    {
        var design = TestCircuits.Loop() with { Comparator = TestCircuits.Ideal() with { IsComparator = true } };
        var model = CircuitFigureModel.For(design);

        Assert.Equal(
            ["int.r", "int.c", "sch.r1", "sch.r2", "cmp.ra", "cmp.pot", "cmp.rb",
             "amp.headroomHigh", "amp.headroomLow", "amp.slewRate", "cmp.headroomHigh", "cmp.headroomLow", "cmp.slewRate"],
            model.Parameters.Select(p => p.Name));
        var capacitor = model.Parameters[1];
        Assert.Equal("C1", capacitor.ReferenceDesignator);
        Assert.Equal(0.05, capacitor.ToleranceMinus);
        Assert.Equal(design.Roles[Roles.IntC].Temperature, capacitor.Temperature);
        Assert.Equal(FigureNames.All, model.Figures.Select(f => f.Name));
    }

    [Fact]
    public void Evaluate_agrees_with_the_analysis()
    {
        var design = TestCircuits.ThreeStage(r2: 6.8e3, amp: TestCircuits.Real());
        var model = CircuitFigureModel.For(design);
        var figures = new double[model.Figures.Count];
        model.Evaluate(model.NominalParameters(), figures);
        var e = CircuitAnalysis.Analyse(design);

        for (var i = 0; i < figures.Length; i++)
            Assert.Equal(e.Figures[i].Value!.Value, figures[i]);
    }

    [Fact]
    public void Evaluate_reads_the_parameters_it_is_given()
    {
        var model = CircuitFigureModel.For(TestCircuits.ThreeStage(r: 10e3));
        var x = model.NominalParameters();
        var figures = new double[model.Figures.Count];
        x[0] = 20e3; // osc.r doubled: half the frequency (f ∝ 1/RC, Sedra & Smith)
        model.Evaluate(x, figures);
        Precision.AlmostEqualRelative(455.12 / 2, figures[0], 1e-5);
    }

    [Fact]
    public void A_loop_that_cannot_switch_writes_NaN()
    {
        var model = CircuitFigureModel.For(TestCircuits.Loop(r1: 30e3, r2: 20e3));
        var figures = new double[model.Figures.Count];
        model.Evaluate(model.NominalParameters(), figures);
        Assert.True(double.IsNaN(figures[0]));
        Assert.Equal(12, figures[7]); // the output level still exists
    }

    [Fact]
    public void Evaluate_does_not_allocate_and_is_safe_in_parallel()
    {
        var model = CircuitFigureModel.For(CheckTests.SingleSupply(TestCircuits.ThreeStage(amp: TestCircuits.Real()), 24, 10e3, 10e3));
        var x = model.Parameters.Select(p => p.Nominal).ToArray();
        var figures = new double[model.Figures.Count];
        model.Evaluate(x, figures);
        var expected = (double[])figures.Clone();

        var before = GC.GetAllocatedBytesForCurrentThread();
        for (var i = 0; i < 1000; i++)
            model.Evaluate(x, figures);
        Assert.Equal(0, GC.GetAllocatedBytesForCurrentThread() - before);

        var mismatches = 0;
        Parallel.For(0, 64, _ =>
        {
            var local = new double[expected.Length];
            for (var i = 0; i < 500; i++)
            {
                model.Evaluate(x, local);
                if (!local.SequenceEqual(expected))
                    Interlocked.Increment(ref mismatches);
            }
        });
        Assert.Equal(0, mismatches);
    }
}

public class AccurateTests
{
    [Theory]
    [InlineData(1e-300)]
    [InlineData(-1e-12)]
    [InlineData(3e-9)]
    [InlineData(-1e-4)]
    [InlineData(0.3)]
    [InlineData(-0.49)]
    [InlineData(0.7)]
    [InlineData(-20)]
    public void ExpM1_keeps_full_precision_near_zero(double x)
    {
        // Reference: the Taylor series e^x − 1 = Σ x^n/n!, summed to convergence (standard analysis); it has
        // no cancellation for |x| ≤ 1, and beyond that e^x − 1 itself has none. Bound: a few ulps (1e-15).
        double reference;
        if (Math.Abs(x) <= 1)
        {
            double term = x, sum = 0;
            for (var n = 1; n < 40; n++)
            {
                sum += term;
                term *= x / (n + 1);
            }
            reference = sum;
        }
        else
        {
            reference = Math.Exp(x) - 1;
        }

        Precision.AlmostEqualRelative(reference, PartsOpt.Topologies.Accurate.ExpM1(x), 1e-15, $"expm1({x})");
    }

    [Theory]
    [InlineData(1e-300)]
    [InlineData(-1e-12)]
    [InlineData(3e-9)]
    [InlineData(-1e-4)]
    [InlineData(0.1)]
    [InlineData(0.125)]
    [InlineData(-0.125)]
    [InlineData(0.13)]
    [InlineData(-0.3)]
    [InlineData(2)]
    [InlineData(1e6)]
    public void Log1P_keeps_full_precision_near_zero(double x)
    {
        // Reference: the Taylor series ln(1 + x) = Σ (−1)^(n+1)·x^n/n, summed to convergence (standard
        // analysis), for |x| ≤ 1/2 where 100 terms leave less than 1e-32; beyond, ln(1 + x) itself has no
        // cancellation and the library's logarithm of 1 + x (exact for these x) is the reference. Bound: a
        // few ulps (1e-15), as for e^x − 1.
        double reference;
        if (Math.Abs(x) <= 0.5)
        {
            double power = x, sum = 0;
            for (var n = 1; n < 100; n++)
            {
                sum += (n % 2 == 1 ? power : -power) / n;
                power *= x;
            }

            reference = sum;
        }
        else
        {
            reference = Math.Log(1 + x);
        }

        Precision.AlmostEqualRelative(reference, PartsOpt.Topologies.Accurate.Log1P(x), 1e-15, $"log1p({x})");
    }
}
