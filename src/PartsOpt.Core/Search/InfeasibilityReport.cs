using System.Globalization;
using PartsOpt.Topologies;
using PartsOpt.Values;

namespace PartsOpt.Search;

/// <summary>
/// Explains a topology with no design: what blocked it in a designer's words, the nearest miss (the
/// candidate the engine rejected by the smallest shortfall, or failing that the design nearest the
/// frequency band), and one purchase that would bring the frequency into its band when that is cheap to
/// find: one E24 resistor value for the timing resistor, or else one E12 capacitor value. Stops working
/// out nearest misses and purchases when the search's deadline has passed.
/// </summary>
internal static class InfeasibilityReport
{
    public static TopologyReport For(TopologyPlan plan, IReadOnlyList<FoundDesign> designs, bool complete,
        MissTracker tracker, SearchContext context, DateTime deadlineUtc)
    {
        var topology = plan.Topology;
        if (designs.Any(d => d.Topology == topology))
            return new TopologyReport(topology, true, complete, null, null, null);
        if (plan.Variants.Count == 0)
            return new TopologyReport(topology, false, true,
                plan.SetAside.Count > 0 ? string.Join(" ", plan.SetAside) : "No op-amp assignment can be built.", null, null);

        var timeLeft = DateTime.UtcNow < deadlineUtc;
        var probe = timeLeft ? FrequencyProbe.Nearest(plan.Variants[0], deadlineUtc) : null;
        var misses = tracker.Misses(topology);
        string blocking;
        NearMiss? nearest = null;
        if (tracker.Nearest(topology) is { } near)
        {
            var counted = string.Join(", ", misses.Select(m => $"{Phrase(m.Target)} ({m.Count}×)"));
            blocking = complete
                ? $"Every candidate that met the frequency relaxation and the stock failed the exact analysis; misses: {counted}."
                : $"Every candidate examined before the time limit failed the exact analysis (not proved for the rest); misses: {counted}.";
            nearest = Describe(near.Variant, near.Choice, near.Judgement);
        }
        else if (timeLeft && !StockCoversOneBoardSet(plan.Variants[0], deadlineUtc))
        {
            blocking = $"Not enough stock for {context.Requirement.BuildQuantity} boards: the roles cannot all be filled from what is available, " +
                "counting every role that shares a part number.";
        }
        else if (!complete)
        {
            // Nothing examined and nothing proved: say so rather than claim the band cannot be reached.
            blocking = "The time limit ran out before any candidate of this topology was examined; nothing is proved about it.";
        }
        else
        {
            var band = context.Requirement.Frequency;
            blocking = Say($"No stocked combination of timing parts puts the frequency inside {band.Min:G5} … {band.Max:G5} Hz.");
            if (probe is { } p)
                nearest = Describe(p.Variant, p.Choice, p.Judgement);
        }

        var others = tracker.OtherReasons(topology);
        if (others.Count > 0)
            blocking += " Also: " + string.Join("; ", others);
        if (plan.SetAside.Count > 0)
            blocking += " Set aside: " + string.Join(" ", plan.SetAside);
        var hint = probe is { } q ? PurchaseHint(q.Variant, q.Choice, q.Judgement) : null;
        var note = hint is not null ? null
            : !timeLeft ? "The time limit ran out before a purchase could be worked out."
            : probe is null ? "No stocked design oscillates, so no single value to buy could be worked out."
            : "No single E24 resistor or E12 capacitor value brings the nearest design into the frequency band; left to the designer.";
        return new TopologyReport(topology, false, complete, blocking, nearest, hint, note);
    }

    private static string Phrase(MissedTarget target) => target switch
    {
        MissedTarget.Frequency => "frequency outside its band",
        MissedTarget.TriangleAmplitude => "ramp amplitude outside its band",
        MissedTarget.OutputLevels => "output levels short of the rails asked for",
        MissedTarget.DutyRange => "duty range not reached at the ends of the adjustment",
        MissedTarget.Check => "a failure check of the analysis",
        MissedTarget.Yield => "yield short",
        _ => target.ToString(),
    };

    private static bool StockCoversOneBoardSet(SearchVariant variant, DateTime deadlineUtc)
    {
        var unbounded = new SelectionProblem
        {
            Lines = variant.Problem.Lines,
            Slots = variant.Problem.Slots,
            FixedDraws = variant.Problem.FixedDraws,
            BuildQuantity = variant.Problem.BuildQuantity,
            Costs = variant.Problem.Costs,
        };
        var run = new SelectionSolver(unbounded).Run(_ => new SelectionVerdict(true), 1, null, variant.RoleSlots,
            deadlineUtc, 1, CancellationToken.None);
        return run.Accepted.Count > 0 || !run.Complete;
    }

    private static NearMiss Describe(SearchVariant variant, int[] choice, DesignJudgement judgement) =>
        new(variant.ChoicesOf(choice).ToDictionary(kv => kv.Key, kv => kv.Value.Label),
            judgement.Evaluation.Figures.ToDictionary(f => f.Name, f => f.Value),
            [$"with {variant.Describe()}", .. judgement.Reasons]);

    /// <summary>
    /// One value to buy that puts the nearest design's frequency inside the band (checked by the engine):
    /// the E24 resistor nearest the value that would hit the target, else the E12 capacitor.
    /// </summary>
    private static PurchaseSuggestion? PurchaseHint(SearchVariant variant, int[] choice, DesignJudgement judgement)
    {
        if (judgement.Evaluation.Figure(FigureNames.Frequency) is not { } frequency)
            return null;
        var target = variant.Context.Requirement.Frequency;
        var (rRole, cRole) = FrequencyProbe.TimingRoles(variant.Topology);
        var roles = variant.ChoicesOf(choice).ToDictionary(kv => kv.Key, kv => kv.Value.ToRolePart());
        var scale = frequency / target.Target;
        foreach (var (role, series, quantity) in new[] { (rRole, ESeries.E24, Quantity.Resistance), (cRole, ESeries.E12, Quantity.Capacitance) })
        {
            var value = PreferredValues.Nearest(roles[role].Value * scale, series);
            var trial = variant.Prototype with { Roles = new Dictionary<string, RolePart>(roles) { [role] = roles[role] with { Value = value, PartNumber = null } } };
            double? f;
            try
            {
                f = CircuitAnalysis.Analyse(trial, 2).Figure(FigureNames.Frequency);
            }
            catch (DesignValidationException)
            {
                continue;
            }
            if (f is { } hz && target.Contains(hz))
                return new PurchaseSuggestion(role, Roles.KindOf(role), value, series.ToString(),
                    Say($"Buy one {series} value, {EngineeringValue.Format(value, quantity)} for {role} (with {variant.Describe()}): the nearest design then runs at {hz:G5} Hz, inside the band") +
                    (judgement.Missed.Any(m => m != MissedTarget.Frequency)
                        ? "; its other misses remain: " + string.Join("; ", judgement.Reasons.Where(r => !r.StartsWith("frequency", StringComparison.Ordinal))) + "."
                        : "."));
        }
        return null;
    }

    private static string Say(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
