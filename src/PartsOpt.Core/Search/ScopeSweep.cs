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
    public const int MaxAnalyses = 20_000;

    public static IReadOnlyList<(int[] Choice, IReadOnlyList<int> Slots)> Sweep(SearchVariant variant, int[] choice, IReadOnlyList<int> scope)
    {
        if (scope.Count == 0 || scope.Count >= variant.RoleNames.Count || !variant.SweptScopes.Add(string.Join(',', scope)))
            return [];
        var sizes = scope.Select(s => variant.Problem.Slots[s].Options.Count).ToArray();
        if (sizes.Aggregate(1L, (product, n) => product * n) > MaxAnalyses)
            return [];

        var cuts = new List<(int[], IReadOnlyList<int>)>();
        var trial = (int[])choice.Clone();
        var digits = new int[scope.Count];
        var requirement = variant.Context.Requirement;
        while (true)
        {
            for (var i = 0; i < scope.Count; i++)
                trial[scope[i]] = digits[i];
            try
            {
                var judgement = DesignJudge.Judge(requirement, variant.DesignOf(trial));
                if (!judgement.Accepted)
                {
                    var rejection = variant.Rejection(trial, judgement);
                    if (rejection.CutGroup is null && rejection.CutSlots is { } slots && slots.All(scope.Contains))
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
