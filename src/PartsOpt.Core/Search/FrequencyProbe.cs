using PartsOpt.Topologies;

namespace PartsOpt.Search;

/// <summary>
/// The stocked design nearest the target frequency, found by sweeping the timing resistor and capacitor
/// over the stock with the other roles set to plain choices (divider near β = ½, Schmitt ratio near ½,
/// widest threshold span, balanced reference). A heuristic for the report, never for the search.
/// </summary>
internal static class FrequencyProbe
{
    /// <summary>Largest sweep made, in engine analyses.</summary>
    public const int MaxTrials = 4000;

    public static (string Resistor, string Capacitor) TimingRoles(TopologyKind topology) =>
        topology == TopologyKind.Loop ? (Roles.IntR, Roles.IntC) : (Roles.OscR, Roles.OscC);

    /// <summary>
    /// Plain choices for every role but the timing pair (left at their first option): divider near β = ½,
    /// Schmitt ratio near ½, balanced reference, largest integrator shunt, widest threshold span.
    /// </summary>
    public static int[] PlainChoice(SearchVariant variant)
    {
        var slots = variant.Problem.Slots;
        double Value(int slot, int option) => ((StockChoice)slots[slot].Options[option].Tag!).Value;
        var choice = new int[slots.Count];
        void Pair(string first, string second, double ratio)
        {
            int a = variant.SlotOf(first), b = variant.SlotOf(second);
            if (a < 0 || b < 0)
                return;
            var best = double.PositiveInfinity;
            for (var i = 0; i < slots[a].Options.Count; i++)
                for (var j = 0; j < slots[b].Options.Count; j++)
                {
                    var distance = Math.Abs(Math.Log(Value(a, i) / Value(b, j) / ratio));
                    if (distance < best)
                        (best, choice[a], choice[b]) = (distance, i, j);
                }
        }
        void Extreme(string role, bool largest)
        {
            var s = variant.SlotOf(role);
            if (s < 0)
                return;
            var options = Enumerable.Range(0, slots[s].Options.Count);
            choice[s] = largest ? options.MaxBy(o => Value(s, o)) : options.MinBy(o => Value(s, o));
        }
        Pair(Roles.OscR1, Roles.OscR2, 1);
        Pair(Roles.SchR1, Roles.SchR2, 0.5);
        Pair(Roles.RefRtop, Roles.RefRbottom, 1);
        Extreme(Roles.IntRf, largest: true);
        Extreme(Roles.CmpRa, largest: false);
        Extreme(Roles.CmpRb, largest: false);
        Extreme(Roles.CmpPot, largest: true);
        return choice;
    }

    public static (SearchVariant Variant, int[] Choice, DesignJudgement Judgement)? Nearest(SearchVariant variant, DateTime deadlineUtc)
    {
        var slots = variant.Problem.Slots;
        var choice = PlainChoice(variant);
        var (rRole, cRole) = TimingRoles(variant.Topology);
        int rSlot = variant.SlotOf(rRole), cSlot = variant.SlotOf(cRole);
        var target = variant.Context.Requirement.Frequency.Target;
        (int[] Choice, DesignJudgement Judgement)? best = null;
        var bestDistance = double.PositiveInfinity;
        var trials = 0;
        for (var r = 0; r < slots[rSlot].Options.Count && trials < MaxTrials; r++)
            for (var c = 0; c < slots[cSlot].Options.Count && trials < MaxTrials && (trials % 64 != 0 || DateTime.UtcNow < deadlineUtc); c++, trials++)
            {
                choice[rSlot] = r;
                choice[cSlot] = c;
                DesignJudgement judgement;
                try
                {
                    judgement = DesignJudge.Judge(variant.Context.Requirement, variant.DesignOf(choice));
                }
                catch (DesignValidationException)
                {
                    continue;
                }
                if (judgement.Evaluation.Figure(FigureNames.Frequency) is not { } f)
                    continue;
                var distance = Math.Abs(Math.Log(f / target));
                if (distance < bestDistance)
                    (bestDistance, best) = (distance, ((int[])choice.Clone(), judgement));
            }
        return best is { } found ? (variant, found.Choice, found.Judgement) : null;
    }
}
