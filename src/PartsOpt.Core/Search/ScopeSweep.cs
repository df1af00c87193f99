using PartsOpt.Topologies;

namespace PartsOpt.Search;

/// <summary>
/// When a design fails for a reason confined to a few roles (frequency, ramp), every other choice of
/// those roles is judged at once, holding the rest of the design, and each one that fails for a reason
/// confined to the same roles becomes a no-good cut. One sweep per scope per variant replaces many
/// solver round trips; every cut is still justified by an exact analysis.
/// </summary>
internal static class ScopeSweep
{
    /// <summary>Largest sweep, in analyses; past it the scope is left to the lazy loop.</summary>
    public const int MaxAnalyses = 8_000;

    public static IReadOnlyList<(int[] Choice, IReadOnlyList<int> Slots)> Sweep(SearchVariant variant, int[] choice, IReadOnlyList<int> scope)
    {
        if (scope.Count == 0 || scope.Count >= variant.RoleNames.Count)
            return [];
        // Sweep the whole scope if it is small enough, else the largest part of it that is (smallest
        // slots first), holding the rest of the scope at the failed design's choices.
        var swept = new List<int>();
        var product = 1L;
        foreach (var slot in scope.OrderBy(s => variant.Problem.Slots[s].Options.Count).ThenBy(s => s))
        {
            var size = variant.Problem.Slots[slot].Options.Count;
            if (product * size > MaxAnalyses)
                break;
            product *= size;
            swept.Add(slot);
        }
        var held = scope.Except(swept).Select(s => $"{s}={choice[s]}");
        if (swept.Count == 0 || !variant.SweptScopes.Add(string.Join(',', scope) + "|" + string.Join(',', held)))
            return [];
        var sizes = swept.Select(s => variant.Problem.Slots[s].Options.Count).ToArray();

        var cuts = new List<(int[], IReadOnlyList<int>)>();
        var trial = (int[])choice.Clone();
        var digits = new int[swept.Count];
        var requirement = variant.Context.Requirement;
        while (true)
        {
            for (var i = 0; i < swept.Count; i++)
                trial[swept[i]] = digits[i];
            try
            {
                var judgement = DesignJudge.Judge(requirement, variant.DesignOf(trial));
                if (!judgement.Accepted)
                {
                    var rejection = variant.Rejection(trial, judgement);
                    // A cut with an escape depends on slots outside its own: not a plain no-good on the scope.
                    if (rejection is { CutGroup: null, CutEscapeOptions: null, CutSlots: { } slots } && slots.All(scope.Contains))
                        cuts.Add(((int[])trial.Clone(), slots));
                }
            }
            catch (DesignValidationException)
            {
                // Left to the lazy loop, which cuts the whole design.
            }

            var d = digits.Length - 1;
            while (d >= 0 && ++digits[d] == sizes[d])
                digits[d--] = 0;
            if (d < 0)
                break;
        }
        return cuts;
    }
}
