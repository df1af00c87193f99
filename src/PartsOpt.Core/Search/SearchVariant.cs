using PartsOpt.Topologies;

namespace PartsOpt.Search;

/// <summary>
/// One topology with one op-amp assignment (the amplifier for the analog sections, an optional separate
/// comparator part, and with a single supply whether a spare section buffers the reference): its roles
/// as slots over the stock choices, its op-amp packages as fixed draws, the decoupling capacitors as one
/// more slot, and the log-space bounds of <see cref="FrequencyRelaxation"/>.
/// </summary>
internal sealed class SearchVariant
{
    /// <summary>Name of the slot holding the decoupling capacitors (one per op-amp package).</summary>
    public const string DecouplingSlot = "decoupling";

    public SearchVariant(SearchContext context, TopologyKind topology, int amplifier, int? comparator, bool bufferReference)
    {
        Context = context;
        Topology = topology;
        AmplifierIndex = amplifier;
        ComparatorIndex = comparator;
        BufferReference = bufferReference;
        var requirement = context.Requirement;
        var amp = context.Stock.OpAmps[amplifier];
        var cmp = comparator is { } c ? context.Stock.OpAmps[c] : null;
        Prototype = new CircuitDesign(topology, requirement.Supply, amp.Spec with { PartNumber = amp.PartNumber },
            new Dictionary<string, RolePart>(), requirement.Duty.ToDutyControl(),
            cmp is null ? null : cmp.Spec with { PartNumber = cmp.PartNumber }, bufferReference);
        RoleNames = Prototype.RequiredRoles();

        Functions = (topology == TopologyKind.RcRamp ? 1 : 2) + (cmp is null ? 1 : 0) + (bufferReference ? 1 : 0);
        AmplifierPackages = (Functions + amp.Spec.SectionsPerPackage - 1) / amp.Spec.SectionsPerPackage;
        var fixedDraws = new List<PartDraw> { new(context.OpAmpLine(amplifier), AmplifierPackages) };
        if (comparator is { } cl)
            fixedDraws.Add(new PartDraw(context.OpAmpLine(cl), 1));
        Packages = AmplifierPackages + (cmp is null ? 0 : 1);

        var slots = RoleNames
            .Select(role => new SelectionSlot(role, context.SlotOptionsFor(Roles.KindOf(role))))
            .ToList();
        DecouplingChoices = context.DecouplingCapacitors;
        if (DecouplingChoices.Count > 0)
            slots.Add(new SelectionSlot(DecouplingSlot, DecouplingChoices
                .Select(i => new SlotOption([new PartDraw(i, Packages)], 0, i)).ToList()));
        Slots = slots;
        FixedDraws = fixedDraws;

        // The bounds and the divider group take most of a variant's making; a variant whose lower bound
        // passes the cutoff never needs them.
        built = new Lazy<(SelectionProblem, ThresholdDivider?, int?)>(() =>
        {
            var relaxation = FrequencyRelaxation.For(this, slots);
            var groups = new List<TupleGroup>();
            ThresholdDivider? thresholds = null;
            int? group = null;
            if (ThresholdDivider.For(this, slots) is { } divider)
            {
                (thresholds, group) = (divider, groups.Count);
                groups.Add(divider.Group);
            }
            var problem = new SelectionProblem
            {
                Lines = context.Lines,
                Slots = slots,
                FixedDraws = fixedDraws,
                Groups = groups,
                Buckets = relaxation.Buckets,
                Bounds = relaxation.Bounds,
                BuildQuantity = requirement.BuildQuantity,
                Costs = requirement.Costs,
            };
            return (problem, thresholds, group);
        });
    }

    private readonly Lazy<(SelectionProblem Problem, ThresholdDivider? Thresholds, int? Group)> built;

    /// <summary>
    /// A lower bound on the total build cost of any design of this variant: its op-amp packages, the cheapest
    /// option of every slot, and one line item per kind of part its roles take (the decoupling capacitors
    /// may share the capacitor line). A variant whose bound passes the list's cutoff cannot enter the list.
    /// </summary>
    public decimal LowerBound
    {
        get
        {
            var quantity = Context.Requirement.BuildQuantity;
            var costs = Context.Requirement.Costs;
            decimal Draws(IEnumerable<PartDraw> draws) =>
                draws.Sum(d => d.PerBoard * quantity * (Context.Lines[d.Line].UnitCost + costs.PlacementCost));
            var kinds = RoleNames.Select(Roles.KindOf).Distinct().Count();
            var lines = FixedDraws.Select(d => d.Line).Distinct().Count() + kinds;
            return Draws(FixedDraws)
                + Slots.Sum(slot => slot.Options.Count == 0 ? 0 : slot.Options.Min(o => Draws(o.Draws)))
                + lines * costs.LineItemSetupCost;
        }
    }

    public SearchContext Context { get; }
    public TopologyKind Topology { get; }
    public int AmplifierIndex { get; }
    public int? ComparatorIndex { get; }
    public bool BufferReference { get; }

    /// <summary>The design without its role parts: topology, supply, op-amps, duty control.</summary>
    public CircuitDesign Prototype { get; }

    /// <summary>The roles to fill, in role order; slot i is role i, the decoupling slot (if any) comes last.</summary>
    public IReadOnlyList<string> RoleNames { get; }

    /// <summary>Op-amp functions on the amplifier part (oscillator or Schmitt, integrator, comparator, buffer).</summary>
    public int Functions { get; }

    public int AmplifierPackages { get; }
    public int Packages { get; }

    /// <summary>Stock line indices of the capacitors fit for decoupling, cheapest first.</summary>
    public IReadOnlyList<int> DecouplingChoices { get; }

    /// <summary>The selection problem: slots, stock, op-amp draws, and the log-space bounds (made on first use).</summary>
    public SelectionProblem Problem => built.Value.Problem;

    /// <summary>The slots (roles, then decoupling), without building the bounds.</summary>
    public IReadOnlyList<SelectionSlot> Slots { get; }

    /// <summary>The op-amp packages every design of the variant draws.</summary>
    public IReadOnlyList<PartDraw> FixedDraws { get; }

    /// <summary>Integer objective units per unit of currency (see <see cref="SelectionSolver.ScaleFor(SelectionProblem)"/>).</summary>
    public long CostScale => SelectionSolver.ScaleFor(Context.Lines, Context.Requirement.Costs);

    /// <summary>Scopes already swept by <see cref="ScopeSweep"/> in this variant.</summary>
    public HashSet<string> SweptScopes { get; } = [];

    /// <summary>The threshold divider's (cmp.ra, cmp.pot, cmp.rb) tuples and their threshold range, if built.</summary>
    public ThresholdDivider? Thresholds => built.Value.Thresholds;

    /// <summary>Index of the threshold divider's group in <see cref="Problem"/>, if built.</summary>
    public int? ThresholdGroup => built.Value.Group;

    /// <summary>A short name for reports: "three-stage with OPA-GP-QUAD-A and comparator CMP-OD-QUAD-E".</summary>
    public string Describe() =>
        $"{Topology.ToWireName()} with {Context.Stock.OpAmps[AmplifierIndex].PartNumber}" +
        (ComparatorIndex is { } c ? $" and comparator {Context.Stock.OpAmps[c].PartNumber}" : "") +
        (BufferReference ? ", buffered reference" : "");

    /// <summary>The slot index of a role, or −1 when the variant has no such role.</summary>
    public int SlotOf(string role)
    {
        for (var i = 0; i < RoleNames.Count; i++)
            if (RoleNames[i] == role)
                return i;
        return -1;
    }

    /// <summary>The role slots (decoupling excluded): what makes two designs different circuits.</summary>
    public IReadOnlyList<int> RoleSlots => Enumerable.Range(0, RoleNames.Count).ToList();

    /// <summary>The stock choice in each role for an assignment.</summary>
    public IReadOnlyDictionary<string, StockChoice> ChoicesOf(IReadOnlyList<int> choice) =>
        RoleNames.Select((role, s) => (role, option: (StockChoice)Slots[s].Options[choice[s]].Tag!))
            .ToDictionary(x => x.role, x => x.option);

    /// <summary>The circuit of an assignment.</summary>
    public CircuitDesign DesignOf(IReadOnlyList<int> choice) =>
        Prototype with
        {
            Roles = ChoicesOf(choice).ToDictionary(kv => kv.Key, kv => kv.Value.ToRolePart()),
        };

    /// <summary>
    /// The slots a missed target depends on, from the engine's model: frequency on the square-wave
    /// generator's own parts and the reference divider; ramp amplitude also on the integrator; output
    /// levels only on the comparator's pull-up; the duty range and the checks on every role.
    /// </summary>
    public IReadOnlyList<int> ScopeOf(MissedTarget missed) => missed switch
    {
        MissedTarget.Frequency => SlotsOf(FrequencyRoles()),
        MissedTarget.TriangleAmplitude => SlotsOf(RampRoles()),
        MissedTarget.OutputLevels => SlotsOf([Roles.CmpPullup]),
        _ => RoleSlots,
    };

    /// <summary>
    /// The smallest slots a yield shortfall may be cut on: the roles of the one failed figure that depends on
    /// the fewest (frequency on the frequency roles, ramp amplitude on the ramp roles); every role otherwise.
    /// </summary>
    public IReadOnlyList<int> ScopeOfFigures(IReadOnlyList<string>? figures) =>
        (figures ?? []).Select(f => f switch
        {
            FigureNames.Frequency => ScopeOf(MissedTarget.Frequency),
            FigureNames.TrianglePeakToPeak => ScopeOf(MissedTarget.TriangleAmplitude),
            _ => RoleSlots,
        }).Append(RoleSlots).MinBy(s => s.Count)!;

    /// <summary>
    /// The slots a failed check of the engine depends on (a superset, read from its formulas): the
    /// switching and edge checks on the frequency roles, the integrator and input-range checks of the
    /// analog sections on the ramp roles, a polarity check on its own role; anything else on every role.
    /// </summary>
    public IReadOnlyList<int> ScopeOfCheck(string check, DesignJudgement judgement) => check switch
    {
        "input common-mode range (comparator)" when RampOutsideComparatorRange(judgement) => SlotsOf(RampRoles()),
        // The ramp well inside: the pot's thresholds are outside, and they divide the supply rails alone.
        "input common-mode range (comparator)" when ThresholdsLeaveComparatorRange(judgement) => SlotsOf([Roles.CmpRa, Roles.CmpPot, Roles.CmpRb]),
        "oscillator can switch" or "output edges short against the period" => SlotsOf(FrequencyRoles()),
        "integrator slope below slew rate" or "triangle inside integrator swing"
            or "input common-mode range (oscillator)" or "input common-mode range (schmitt)"
            or "input common-mode range (integrator)" or "input common-mode range (reference buffer)"
            or "output current (oscillator)" or "output current (schmitt)" or "output current (integrator)"
            => SlotsOf(RampRoles()),
        _ when check.StartsWith("non-polarised (", StringComparison.Ordinal) && SlotOf(check[15..^1]) is >= 0 and var s => [s],
        _ when check.StartsWith("timing dielectric (", StringComparison.Ordinal) && SlotOf(check[19..^1]) is >= 0 and var s => [s],
        "output current (comparator)" when SlotOf(Roles.CmpPullup) is >= 0 and var pullup => [pullup],
        _ when check.StartsWith("power (", StringComparison.Ordinal) => ScopeOfRating(check[7..^1]),
        _ when check.StartsWith("voltage (", StringComparison.Ordinal) => ScopeOfRating(check[9..^1]),
        _ => RoleSlots,
    };

    /// <summary>
    /// The slots a part's power or voltage rating check depends on: the part itself and what sets the
    /// voltage across it. The square-wave generator's parts see its own waveform, the integrator's the
    /// ramp, the threshold divider only the supply, the pull-up only the comparator's output.
    /// </summary>
    private IReadOnlyList<int> ScopeOfRating(string role)
    {
        string[] divider = [Roles.CmpRa, Roles.CmpPot, Roles.CmpRb];
        if (SlotOf(role) < 0)
            return RoleSlots;
        if (FrequencyRoles().Contains(role))
            return SlotsOf(FrequencyRoles());
        if (RampRoles().Contains(role))
            return SlotsOf(RampRoles());
        if (role == Roles.CmpPullup)
            return [SlotOf(role)];
        return divider.Contains(role) ? SlotsOf(divider) : RoleSlots;
    }

    /// <summary>
    /// The strongest valid no-good cut for a rejected design: the smallest scope among its misses; for a
    /// duty range missed alone, the ramp roles plus an escape through the threshold divider's tuples that
    /// reach further (duty falls monotonically as the threshold rises).
    /// </summary>
    public SelectionVerdict Rejection(int[] choice, DesignJudgement judgement)
    {
        var best = PlainScope(judgement);
        var verdict = new SelectionVerdict(false, best, judgement.FrequencyError, judgement.Margin,
            string.Join("; ", judgement.Reasons), judgement);
        if (best.Count > 2 && MonotoneCut(choice, judgement) is { } monotone)
            return verdict with { CutSlots = monotone.Scope, CutEscapeSlot = monotone.Slot, CutEscape = monotone.Better };
        if (!judgement.Missed.Contains(MissedTarget.DutyRange) || best.Count < RoleSlots.Count)
            return verdict;
        var ramp = SlotsOf(RampRoles());
        if (Prototype.DutyControl is ControlVoltageDuty)
            return verdict with { CutSlots = ramp };
        if (Thresholds is null || ThresholdGroup is null)
            return DividerEscape(choice, judgement) is { } options ? verdict with { CutSlots = ramp, CutEscapeOptions = options } : verdict;
        var escape = Thresholds.Escape(choice, judgement.MissesLowDuty, judgement.MissesHighDuty);
        return verdict with { CutSlots = ramp, CutGroup = ThresholdGroup, CutEscape = escape };
    }

    /// <summary>
    /// The fewest slots that decide one of a rejected design's failures on their own (the duty range
    /// aside, which also depends on the threshold divider): every design sharing their choices fails too.
    /// All role slots when no failure is confined.
    /// </summary>
    public IReadOnlyList<int> PlainScope(DesignJudgement judgement) =>
        judgement.Missed.Where(m => m is not (MissedTarget.DutyRange or MissedTarget.Check)).Select(ScopeOf)
            .Concat(judgement.FailedChecks.Select(c => ScopeOfCheck(c, judgement)))
            .Append(RoleSlots)
            .MinBy(scope => scope.Count)!;

    /// <summary>
    /// A cut for a failed check that falls as one resistor grows, everything else in its scope held: the
    /// power in the timing or integrator input resistor (the voltage across it does not depend on it) and
    /// the oscillator output's current (through osc.r). Larger values of that resistor escape the cut.
    /// </summary>
    private (IReadOnlyList<int> Scope, int Slot, IReadOnlyList<int> Better)? MonotoneCut(int[] choice, DesignJudgement judgement)
    {
        foreach (var check in judgement.FailedChecks)
        {
            var (role, roles) = check switch
            {
                "power (osc.r)" => (Roles.OscR, FrequencyRoles()),
                "power (int.r)" => (Roles.IntR, RampRoles()),
                "output current (oscillator)" when Topology != TopologyKind.Loop => (Roles.OscR, RampRoles()),
                _ => (null, []),
            };
            var slot = role is null ? -1 : SlotOf(role);
            if (slot < 0)
                continue;
            var options = Problem.Slots[slot].Options;
            var current = ((StockChoice)options[choice[slot]].Tag!).Value;
            var better = Enumerable.Range(0, options.Count).Where(o => ((StockChoice)options[o].Tag!).Value > current).ToList();
            return (SlotsOf(roles), slot, better);
        }
        return null;
    }

    /// <summary>
    /// Without a divider group: the divider options that reach further than the failed one, value by value.
    /// The top threshold (rb + pot)/Σ rises with rb and pot and falls with ra; the bottom rb/Σ rises with rb
    /// and falls with ra and pot. A missed low duty needs a higher top (smaller ra, larger pot or rb), a
    /// missed high duty a lower bottom (larger ra or pot, smaller rb); a divider offering neither reaches no
    /// further and fails the same way with the same ramp. Null without a potentiometer divider.
    /// </summary>
    private List<(int Slot, int Option)>? DividerEscape(int[] choice, DesignJudgement judgement)
    {
        int ra = SlotOf(Roles.CmpRa), pot = SlotOf(Roles.CmpPot), rb = SlotOf(Roles.CmpRb);
        if (ra < 0 || pot < 0 || rb < 0 || Prototype.DutyControl is ControlVoltageDuty)
            return null;
        var escape = new List<(int Slot, int Option)>();
        void Add(int slot, bool larger)
        {
            var options = Problem.Slots[slot].Options;
            var current = ((StockChoice)options[choice[slot]].Tag!).Value;
            for (var o = 0; o < options.Count; o++)
            {
                var value = ((StockChoice)options[o].Tag!).Value;
                if (larger ? value > current : value < current)
                    escape.Add((slot, o));
            }
        }
        if (judgement.MissesLowDuty)
        {
            Add(ra, larger: false);
            Add(pot, larger: true);
            Add(rb, larger: true);
        }
        if (judgement.MissesHighDuty)
        {
            Add(ra, larger: true);
            Add(pot, larger: true);
            Add(rb, larger: false);
        }
        return escape.Distinct().ToList();
    }

    /// <summary>
    /// True when the judgement failed the comparator's input range on the pot's thresholds alone (the ramp
    /// well inside): every divider whose thresholds span as much or more fails it too, whatever the ramp.
    /// </summary>
    public bool ThresholdsLeaveComparatorRange(DesignJudgement judgement) =>
        Prototype.DutyControl is not ControlVoltageDuty
        && judgement.FailedChecks.Contains("input common-mode range (comparator)")
        && RampInsideComparatorRange(judgement);

    /// <summary>True when the ramp alone leaves the comparator's input range (so any threshold fails too).</summary>
    private bool RampOutsideComparatorRange(DesignJudgement judgement) =>
        RampMarginInComparatorRange(judgement) < -1e-9;

    /// <summary>
    /// True when the ramp lies inside the comparator's input range with room to spare, so that a failed range
    /// check is the thresholds' alone (the 1 nV keeps rounding of the ramp's extremes on the safe side).
    /// </summary>
    private bool RampInsideComparatorRange(DesignJudgement judgement) =>
        RampMarginInComparatorRange(judgement) > 1e-9;

    /// <summary>How far inside the comparator's input range the ramp lies, V (negative: outside; NaN: no ramp).</summary>
    private double RampMarginInComparatorRange(DesignJudgement judgement)
    {
        var evaluation = judgement.Evaluation;
        if (evaluation.Figure(FigureNames.TriangleCentre) is not { } centre
            || evaluation.Figure(FigureNames.TrianglePeakToPeak) is not { } peakToPeak)
            return double.NaN;
        var (floor, ceiling) = ComparatorInputRange();
        return Math.Min(centre - peakToPeak / 2 - floor, ceiling - (centre + peakToPeak / 2));
    }

    /// <summary>
    /// Which of a pot's two thresholds, given as fractions of the supply span from the negative rail, lie
    /// outside the comparator's input range (by more than 1 nV).
    /// </summary>
    public (bool TopAbove, bool BottomBelow) ThresholdsOutsideComparatorRange(double top, double bottom)
    {
        var supply = Prototype.Supply;
        var (floor, ceiling) = ComparatorInputRange();
        return (supply.NegativeV + supply.SpanV * top > ceiling + 1e-9, supply.NegativeV + supply.SpanV * bottom < floor - 1e-9);
    }

    /// <summary>The comparator's input range, V: the rails less the part's input headroom (the engine's range check).</summary>
    private (double Floor, double Ceiling) ComparatorInputRange()
    {
        var part = Prototype.ComparatorPart;
        var supply = Prototype.Supply;
        return (supply.NegativeV + part.InputHeadroomLowV, supply.PositiveV - part.InputHeadroomHighV);
    }

    /// <summary>Roles the frequency depends on: the square-wave generator's and the reference divider.</summary>
    private string[] FrequencyRoles() => Topology == TopologyKind.Loop
        ? [Roles.IntR, Roles.IntC, Roles.SchR1, Roles.SchR2, Roles.RefRtop, Roles.RefRbottom]
        : [Roles.OscR, Roles.OscC, Roles.OscR1, Roles.OscR2, Roles.RefRtop, Roles.RefRbottom];

    /// <summary>Roles the ramp the comparator sees depends on (frequency roles plus the three-stage integrator).</summary>
    private string[] RampRoles() => Topology == TopologyKind.ThreeStage
        ? [.. FrequencyRoles(), Roles.IntR, Roles.IntC, Roles.IntRf]
        : FrequencyRoles();

    private List<int> SlotsOf(IEnumerable<string> roles) => roles.Select(SlotOf).Where(s => s >= 0).ToList();
}
