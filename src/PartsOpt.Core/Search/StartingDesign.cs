using PartsOpt.Topologies;

namespace PartsOpt.Search;

/// <summary>
/// A quick first design for a variant, before any model: plain choices for the dividers, the timing
/// resistor scaled to the target frequency for each stocked capacitor, then passes of one role at a time
/// towards the engine's acceptance (smallest shortfall) and, once accepted, towards a lower cost. A
/// heuristic: what it returns is judged by the exact engine like any candidate, and only gives the search
/// an early design and cutoff; the models still decide what is cheapest.
/// </summary>
internal static class StartingDesign
{
    /// <summary>Passes over the roles while looking for an accepted design.</summary>
    public const int RepairPasses = 3;

    public static int[]? Find(SearchVariant variant, DateTime deadlineUtc)
    {
        var slots = variant.Problem.Slots;
        var requirement = variant.Context.Requirement;
        var roleSlots = variant.RoleNames.Count;
        double Value(int slot, int option) => ((StockChoice)slots[slot].Options[option].Tag!).Value;
        DesignJudgement? Judge(int[] choice)
        {
            try
            {
                return DesignJudge.Judge(requirement, variant.DesignOf(choice));
            }
            catch (DesignValidationException)
            {
                return null;
            }
        }
        bool TimeLeft() => DateTime.UtcNow < deadlineUtc;

        var choice = PlainChoice(variant);
        if (choice is null)
            return null;

        // Timing pair: for each capacitor, the resistor that the first analysis's frequency scales to.
        var (rRole, cRole) = FrequencyProbe.TimingRoles(variant.Topology);
        int rSlot = variant.SlotOf(rRole), cSlot = variant.SlotOf(cRole);
        var first = Judge(choice);
        if (first?.Evaluation.Figure(FigureNames.Frequency) is not { } f0 || !double.IsFinite(f0) || f0 <= 0)
            return null;
        var rc0 = Value(rSlot, choice[rSlot]) * Value(cSlot, choice[cSlot]);
        var byValue = Enumerable.Range(0, slots[rSlot].Options.Count).OrderBy(o => Value(rSlot, o)).ToArray();
        var values = byValue.Select(o => Value(rSlot, o)).ToArray();
        var best = (Choice: (int[])choice.Clone(), Judgement: first);
        for (var c = 0; c < slots[cSlot].Options.Count && TimeLeft(); c++)
        {
            var wanted = rc0 * f0 / requirement.Frequency.Target / Value(cSlot, c);
            var at = Array.BinarySearch(values, wanted);
            at = at >= 0 ? at : ~at;
            foreach (var index in new[] { at - 1, at })
            {
                if (index < 0 || index >= values.Length)
                    continue;
                var trial = (int[])best.Choice.Clone();
                (trial[rSlot], trial[cSlot]) = (byValue[index], c);
                if (Judge(trial) is { } judgement && Better(judgement, best.Judgement))
                    best = (trial, judgement);
            }
        }

        // Repair: one role at a time, the option with the smallest shortfall (then the lowest cost).
        for (var pass = 0; pass < RepairPasses && !best.Judgement.Accepted && TimeLeft(); pass++)
            for (var slot = 0; slot < roleSlots && !best.Judgement.Accepted && TimeLeft(); slot++)
                for (var option = 0; option < slots[slot].Options.Count && TimeLeft(); option++)
                {
                    if (option == best.Choice[slot])
                        continue;
                    var trial = (int[])best.Choice.Clone();
                    trial[slot] = option;
                    if (Judge(trial) is { } judgement && Better(judgement, best.Judgement))
                        best = (trial, judgement);
                }
        if (!best.Judgement.Accepted || !variant.Problem.StockSuffices(best.Choice))
            return null;

        // Cheapen: one role at a time, a cheaper option (often a value already on the board) that still passes.
        for (var slot = 0; slot < slots.Count && TimeLeft(); slot++)
            foreach (var option in Enumerable.Range(0, slots[slot].Options.Count)
                .OrderBy(o => Cost(variant, best.Choice, slot, o)))
            {
                if (Cost(variant, best.Choice, slot, option) >= variant.Problem.CostOf(best.Choice).TotalBuildCost)
                    break;
                var trial = (int[])best.Choice.Clone();
                trial[slot] = option;
                if (!variant.Problem.StockSuffices(trial))
                    continue;
                if (slot >= roleSlots || Judge(trial) is { Accepted: true })
                {
                    best = (trial, best.Judgement);
                    break;
                }
            }
        return best.Choice;
    }

    /// <summary>
    /// Further accepted designs one role away from <paramref name="start"/>, cheapest changes first, up to
    /// <paramref name="wanted"/> distinct circuits in all (the start not counted): early designs fill the list
    /// sooner, and a full list is what lets the cutoff drop whole variants.
    /// </summary>
    public static IReadOnlyList<int[]> Neighbours(SearchVariant variant, int[] start, int wanted, DateTime deadlineUtc)
    {
        var slots = variant.Problem.Slots;
        var requirement = variant.Context.Requirement;
        var found = new List<int[]>();
        var seen = new HashSet<string> { Key(variant, start) };
        var judged = 0;
        var moves = Enumerable.Range(0, variant.RoleNames.Count)
            .SelectMany(slot => Enumerable.Range(0, slots[slot].Options.Count).Where(o => o != start[slot]).Select(o => (slot, o)))
            .OrderBy(m => Cost(variant, start, m.slot, m.o))
            .ThenBy(m => m.slot)
            .ThenBy(m => m.o);
        foreach (var (slot, option) in moves)
        {
            if (found.Count >= wanted || (++judged % 32 == 0 && DateTime.UtcNow >= deadlineUtc))
                break;
            var trial = (int[])start.Clone();
            trial[slot] = option;
            if (!variant.Problem.StockSuffices(trial) || !seen.Add(Key(variant, trial)))
                continue;
            try
            {
                if (DesignJudge.Judge(requirement, variant.DesignOf(trial)).Accepted)
                    found.Add(trial);
            }
            catch (DesignValidationException)
            {
                // Not a design: skip it.
            }
        }
        return found;
    }

    private static string Key(SearchVariant variant, int[] choice) => string.Join(',', choice.Take(variant.RoleNames.Count));

    private static decimal Cost(SearchVariant variant, int[] choice, int slot, int option)
    {
        var trial = (int[])choice.Clone();
        trial[slot] = option;
        return variant.Problem.CostOf(trial).TotalBuildCost;
    }

    private static bool Better(DesignJudgement judgement, DesignJudgement incumbent) =>
        judgement.Shortfall < incumbent.Shortfall;

    /// <summary>Plain choices: dividers near their usual ratios, widest threshold span, largest integrator shunt.</summary>
    private static int[]? PlainChoice(SearchVariant variant)
    {
        var slots = variant.Problem.Slots;
        if (slots.Any(s => s.Options.Count == 0))
            return null;
        return FrequencyProbe.PlainChoice(variant);
    }
}
