using PartsOpt.Api.Parts;
using PartsOpt.Values;

namespace PartsOpt.Api.Tests;

/// <summary>The one mapping from stocked rows to the engine's parts.</summary>
public sealed class PartEngineeringTests
{
    [Fact]
    public void An_absolute_capacitor_tolerance_becomes_a_fraction_of_the_value()
    {
        // IEC 60062: letter C on a capacitor under 10 pF is ±0.25 pF; on 2.2 pF that is ±0.25/2.2 = ±11.36 %.
        var part = new Part
        {
            PartNumber = "T-2P2", Kind = PartKind.Capacitor, CapacitanceF = 2.2e-12,
            ToleranceMinus = 0.25e-12, TolerancePlus = 0.25e-12, ToleranceIsAbsolute = true, Dielectric = Dielectric.C0G,
        };
        var role = PartEngineering.ToRolePart(part);
        Assert.Equal(0.25 / 2.2, role.ToleranceMinus, 12);
        Assert.Equal(0.25 / 2.2, role.TolerancePlus, 12);
    }

    [Fact]
    public void A_comparator_without_a_stated_bandwidth_still_makes_a_valid_part()
    {
        // Comparator data seldom state a gain-bandwidth product (common practice); the engine needs a positive one.
        var part = new Part
        {
            PartNumber = "T-CMP", Kind = PartKind.OpAmp, Sections = 4, SupplyMinV = 2, SupplyMaxV = 36,
            GainBandwidthHz = null, SlewRateVPerS = 50e6, OutputHeadroomHighV = 0, OutputHeadroomLowV = 0.2,
            InputHeadroomHighV = 1.5, InputHeadroomLowV = -0.3, InputOffsetV = 2e-3, OutputCurrentMaxA = 16e-3,
            QuiescentCurrentPerSectionA = 0.2e-3, Comparator = true, OpenDrain = true,
        };
        var spec = PartEngineering.ToOpAmpSpec(part);
        spec.Validate("comparator");
        Assert.Equal(PartEngineering.UnstatedGainBandwidthHz, spec.GainBandwidthHz);
        Assert.True(spec.IsOpenDrain);
    }

    [Fact]
    public void A_negative_film_coefficient_is_kept_as_a_magnitude()
    {
        // Polypropylene film is about −200 ppm/K (common practice, from memory); drift is applied both ways.
        var part = new Part
        {
            PartNumber = "T-PP", Kind = PartKind.Capacitor, CapacitanceF = 10e-9, ToleranceMinus = 0.02,
            TolerancePlus = 0.02, Dielectric = Dielectric.Film, TempcoPpmPerK = -200,
        };
        Assert.Equal(200, PartEngineering.ToRolePart(part).Temperature!.CoefficientPpmPerK);
    }
}
