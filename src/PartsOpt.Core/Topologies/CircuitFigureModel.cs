using PartsOpt.Analysis;

namespace PartsOpt.Topologies;

/// <summary>
/// A design as an <see cref="IFigureModel"/>: parameters are every role's value (named by role, in role
/// order) followed by the op-amp's "amp.headroomHigh", "amp.headroomLow", "amp.slewRate" and, when the
/// comparator is a separate part, "cmp.headroomHigh", "cmp.headroomLow", "cmp.slewRate"; figures are
/// <see cref="FigureNames.All"/> in that order. Evaluation is closed-form, allocation-free and thread-safe
/// (the model holds only immutable state).
/// </summary>
public sealed class CircuitFigureModel : IFigureModel
{
    /// <summary>Parameter name of the amplifier's output headroom to V+.</summary>
    public const string AmpHeadroomHigh = "amp.headroomHigh";
    /// <summary>Parameter name of the amplifier's output headroom to V−.</summary>
    public const string AmpHeadroomLow = "amp.headroomLow";
    /// <summary>Parameter name of the amplifier's slew rate.</summary>
    public const string AmpSlewRate = "amp.slewRate";
    /// <summary>Parameter name of a separate comparator's output headroom to V+.</summary>
    public const string CmpHeadroomHigh = "cmp.headroomHigh";
    /// <summary>Parameter name of a separate comparator's output headroom to V−.</summary>
    public const string CmpHeadroomLow = "cmp.headroomLow";
    /// <summary>Parameter name of a separate comparator's slew rate.</summary>
    public const string CmpSlewRate = "cmp.slewRate";

    private static readonly FigureSpec[] FigureSpecs =
        FigureNames.All.Select((name, i) => new FigureSpec(name, FigureNames.Units[i])).ToArray();

    private readonly CircuitShape _shape;
    private readonly CircuitValues _template;
    private readonly Slot[] _slots;
    private readonly bool _sharedComparator;

    private CircuitFigureModel(CircuitDesign design)
    {
        _shape = new CircuitShape(design);
        _template = CircuitValues.From(design);
        _sharedComparator = design.Comparator is null;
        var designators = ReferenceDesignators.ForRoles(design.RequiredRoles());
        var parameters = new List<ParameterSpec>();
        var slots = new List<Slot>();
        foreach (var role in design.RequiredRoles())
        {
            var part = design.Roles[role];
            parameters.Add(new ParameterSpec(role, part.Value, part.ToleranceMinus, part.TolerancePlus,
                SpreadDistribution.Uniform, part.Temperature, designators[role]));
            slots.Add(CircuitValues.SlotOf(role));
        }

        Add(AmpHeadroomHigh, design.Amplifier.OutputHeadroomHighV, Slot.AmpHeadroomHigh);
        Add(AmpHeadroomLow, design.Amplifier.OutputHeadroomLowV, Slot.AmpHeadroomLow);
        Add(AmpSlewRate, design.Amplifier.SlewRateVPerS, Slot.AmpSlewRate);
        if (design.Comparator is { } comparator)
        {
            Add(CmpHeadroomHigh, comparator.OutputHeadroomHighV, Slot.CmpHeadroomHigh);
            Add(CmpHeadroomLow, comparator.OutputHeadroomLowV, Slot.CmpHeadroomLow);
            Add(CmpSlewRate, comparator.SlewRateVPerS, Slot.CmpSlewRate);
        }

        Parameters = parameters;
        _slots = [.. slots];

        void Add(string name, double nominal, Slot slot)
        {
            // Op-amp limits carry no tolerance of their own here: data-sheet spreads are the caller's to set.
            parameters.Add(new ParameterSpec(name, nominal, 0, 0));
            slots.Add(slot);
        }
    }

    /// <summary>Builds the model of a design; validates it first.</summary>
    /// <exception cref="DesignValidationException">The design cannot be analysed.</exception>
    public static CircuitFigureModel For(CircuitDesign design)
    {
        ArgumentNullException.ThrowIfNull(design);
        design.Validate();
        return new CircuitFigureModel(design);
    }

    /// <inheritdoc />
    public IReadOnlyList<ParameterSpec> Parameters { get; }

    /// <inheritdoc />
    public IReadOnlyList<FigureSpec> Figures => FigureSpecs;

    /// <summary>The nominal parameter vector, in <see cref="Parameters"/> order.</summary>
    public double[] NominalParameters() => Parameters.Select(p => p.Nominal).ToArray();

    /// <inheritdoc />
    public void Evaluate(ReadOnlySpan<double> parameters, Span<double> figures)
    {
        if (parameters.Length != _slots.Length)
            throw new ArgumentException($"Expected {_slots.Length} parameters, got {parameters.Length}.", nameof(parameters));
        if (figures.Length < FigureSpecs.Length)
            throw new ArgumentException($"Expected room for {FigureSpecs.Length} figures, got {figures.Length}.", nameof(figures));
        var values = _template;
        for (var i = 0; i < _slots.Length; i++)
            values.Set(_slots[i], parameters[i]);
        if (_sharedComparator)
        {
            values.CmpHeadroomHigh = values.AmpHeadroomHigh;
            values.CmpHeadroomLow = values.AmpHeadroomLow;
            values.CmpSlewRate = values.AmpSlewRate;
        }

        Waveform.Compute(in values, _shape, out var wave);
        Write(in wave, figures);
    }

    /// <summary>Writes the figures of a computed waveform in <see cref="FigureNames.All"/> order.</summary>
    internal static void Write(in Waveform w, Span<double> figures)
    {
        var nan = double.NaN;
        var on = w.Oscillates;
        figures[0] = on ? 1 / w.PeriodS : nan;
        figures[1] = on ? w.HighTimeS : nan;
        figures[2] = on ? w.LowTimeS : nan;
        figures[3] = on ? w.RampMaxRel - w.RampMinRel : nan;
        figures[4] = on ? w.ReferenceV + 0.5 * (w.RampMaxRel + w.RampMinRel) : nan;
        figures[5] = on ? w.DutyMin : nan;
        figures[6] = on ? w.DutyMax : nan;
        figures[7] = w.OutputHighV;
        figures[8] = w.OutputLowV;
        figures[9] = w.EdgeTimeS;
        figures[10] = on ? w.SupplyCurrentA : nan;
        figures[11] = on ? w.LinearityErrorPercent : nan;
    }
}
