using PartsOpt.Topologies;

namespace PartsOpt.Search;

/// <summary>
/// The nominal frequency of a design from its square-wave generator's part values alone, by the engine's
/// own period functions (<see cref="RelaxationTiming.HalfPeriods(double, double, double, double, double)"/>
/// and the loop's half periods), about a millionth of the cost of judging the design. The search uses it to
/// skip designs tied on cost whose frequency error already ranks them out of the list; it never accepts
/// a design on it, and it checks itself against every judgement it sees.
/// </summary>
internal sealed class FrequencyForecast
{
    private readonly TopologyKind topology;
    private readonly int first, second, ratioTop, ratioBottom, referenceTop, referenceBottom;
    private readonly double positiveV, headroomHigh, headroomLow, slewRate, negativeV;
    private readonly bool single;

    private FrequencyForecast(SearchVariant variant)
    {
        topology = variant.Topology;
        var loop = topology == TopologyKind.Loop;
        first = variant.SlotOf(loop ? Roles.IntR : Roles.OscR);
        second = variant.SlotOf(loop ? Roles.IntC : Roles.OscC);
        ratioTop = variant.SlotOf(loop ? Roles.SchR1 : Roles.OscR1);
        ratioBottom = variant.SlotOf(loop ? Roles.SchR2 : Roles.OscR2);
        referenceTop = variant.SlotOf(Roles.RefRtop);
        referenceBottom = variant.SlotOf(Roles.RefRbottom);
        var supply = variant.Prototype.Supply;
        var amp = variant.Prototype.Amplifier;
        (positiveV, negativeV, single) = (supply.PositiveV, supply.NegativeV, supply.IsSingle);
        (headroomHigh, headroomLow, slewRate) = (amp.OutputHeadroomHighV, amp.OutputHeadroomLowV, amp.SlewRateVPerS);
    }

    /// <summary>The forecast of a variant, or null when a slot it needs is missing.</summary>
    public static FrequencyForecast? For(SearchVariant variant)
    {
        var forecast = new FrequencyForecast(variant);
        var needed = new[] { forecast.first, forecast.second, forecast.ratioTop, forecast.ratioBottom };
        if (needed.Any(s => s < 0) || (forecast.single && (forecast.referenceTop < 0 || forecast.referenceBottom < 0)))
            return null;
        return forecast;
    }

    /// <summary>The nominal frequency, given each slot's option values and the option chosen in each; NaN when no period comes out.</summary>
    public double Frequency(double[][] values, int[] choice)
    {
        double Value(int slot) => values[slot][choice[slot]];
        // As the engine's waveform: levels about the reference, the amplifier's edge over the whole swing.
        var reference = single ? positiveV * Value(referenceBottom) / (Value(referenceTop) + Value(referenceBottom)) : 0;
        var lp = positiveV - headroomHigh - reference;
        var lm = negativeV + headroomLow - reference;
        if (!(lp > 0 && lm < 0))
            return double.NaN;
        double high, low;
        if (topology == TopologyKind.Loop)
            (high, low) = Waveform.LoopHalfPeriods(Value(first) * Value(second), Value(ratioTop) / Value(ratioBottom), lp, lm, (lp - lm) / slewRate);
        else
            (high, low) = RelaxationTiming.HalfPeriods(Value(first) * Value(second), Value(ratioBottom) / (Value(ratioTop) + Value(ratioBottom)), lp, lm, slewRate);
        var period = high + low;
        return double.IsFinite(period) && period > 0 ? 1 / period : double.NaN;
    }

    /// <summary>The slots the forecast reads.</summary>
    public IEnumerable<int> Slots => new[] { first, second, ratioTop, ratioBottom, referenceTop, referenceBottom }.Where(s => s >= 0);
}
