using PartsOpt.Search;
using PartsOpt.Topologies;
using PartsOpt.Values;

namespace PartsOpt.Tests.Search;

/// <summary>
/// The brute-force reference the search is checked against: every topology, every op-amp assignment,
/// every stocked part in every role, every decoupling capacitor; stock summed over all roles for the
/// whole build; the cost per board computed here from the definition; candidates judged in cost order by
/// the same engine judge until the first accepted one. Written without any of the search's code beyond
/// <see cref="DesignJudge"/> and the requirement types.
/// </summary>
internal static class ExhaustiveReference
{
    public sealed record Answer(decimal TotalBuildCost, decimal PerBoard, string Description, int Examined);

    public static Answer? Cheapest(SearchRequirement requirement, Stock stock)
    {
        var candidates = new List<(decimal Total, decimal PerBoard, Func<CircuitDesign> Build, string Text)>();
        var supply = requirement.Supply;
        bool Rated(OpAmpSpec s) => supply.SpanV >= s.SupplyMinV && supply.SpanV <= s.SupplyMaxV;
        var decouplers = stock.Parts.Where(p => p.Kind == RoleKind.Capacitor && p.Value >= 100e-9 * (1 - 1e-9) && p.Value <= 1e-6 * (1 + 1e-9)
            && p.Dielectric is null or Dielectric.C0G or Dielectric.X7R or Dielectric.X5R
            && (p.VoltageRatingV is null || p.VoltageRatingV >= supply.SpanV)).Cast<StockPart?>().ToList();
        if (decouplers.Count == 0)
            decouplers.Add(null);
        var available = stock.Parts.Select(p => (p.PartNumber, p.Available))
            .Concat(stock.OpAmps.Select(o => (o.PartNumber, o.Available))).ToDictionary(x => x.PartNumber, x => x.Available);

        foreach (var topology in requirement.TopologiesToSearch())
            foreach (var amp in stock.OpAmps.Where(o => !o.Spec.IsComparator && !o.Spec.IsOpenDrain && Rated(o.Spec)))
                foreach (var cmp in stock.OpAmps.Where(o => o.PartNumber != amp.PartNumber && Rated(o.Spec)).Cast<StockOpAmp?>().Prepend(null))
                    foreach (var buffer in supply.IsSingle ? new[] { false, true } : [false])
                    {
                        var duty = requirement.Duty.ToDutyControl();
                        var roles = CircuitDesign.RequiredRoles(topology, supply, duty, (cmp ?? amp).Spec.IsOpenDrain);
                        var functions = (topology == TopologyKind.RcRamp ? 1 : 2) + (cmp is null ? 1 : 0) + (buffer ? 1 : 0);
                        var ampPackages = (functions + amp.Spec.SectionsPerPackage - 1) / amp.Spec.SectionsPerPackage;
                        var packages = ampPackages + (cmp is null ? 0 : 1);
                        var options = roles.Select(r => stock.Parts.Where(p => p.Kind == Roles.KindOf(r)).ToArray()).ToArray();
                        foreach (var assignment in Odometer(options.Select(o => o.Length).ToArray()))
                            foreach (var decoupler in decouplers)
                            {
                                var parts = roles.Select((r, i) => options[i][assignment[i]]).ToArray();
                                var use = new Dictionary<string, int>();
                                void Use(string partNumber, int count) => use[partNumber] = use.GetValueOrDefault(partNumber) + count;
                                var cost = 0m;
                                foreach (var part in parts) { Use(part.PartNumber, 1); cost += part.UnitCost; }
                                Use(amp.PartNumber, ampPackages);
                                cost += ampPackages * amp.UnitCost;
                                if (cmp is not null) { Use(cmp.PartNumber, 1); cost += cmp.UnitCost; }
                                if (decoupler is not null) { Use(decoupler.PartNumber, packages); cost += packages * decoupler.UnitCost; }
                                if (use.Any(u => (long)u.Value * requirement.BuildQuantity > available[u.Key]))
                                    continue;
                                var placements = use.Values.Sum();
                                var q = requirement.BuildQuantity;
                                var c = requirement.Costs;
                                var perBoard = cost + placements * c.PlacementCost + use.Count * c.LineItemSetupCost / q;
                                var total = q * (cost + placements * c.PlacementCost) + use.Count * c.LineItemSetupCost;
                                var roleParts = roles.Select((r, i) => (r, parts[i])).ToArray();
                                CircuitDesign Build() => new(topology, supply, amp.Spec with { PartNumber = amp.PartNumber },
                                    roleParts.ToDictionary(x => x.r, x => x.Item2.ToRolePart()), duty,
                                    cmp is null ? null : cmp.Spec with { PartNumber = cmp.PartNumber }, buffer);
                                candidates.Add((total, perBoard, Build,
                                    $"{topology} {amp.PartNumber}/{cmp?.PartNumber} {string.Join(",", roleParts.Select(x => x.r + "=" + x.Item2.PartNumber))}"));
                            }
                    }

        var examined = 0;
        foreach (var candidate in candidates.OrderBy(c => c.Total))
        {
            examined++;
            try
            {
                if (DesignJudge.Judge(requirement, candidate.Build()).Accepted)
                    return new Answer(candidate.Total, candidate.PerBoard, candidate.Text, examined);
            }
            catch (DesignValidationException)
            {
            }
        }
        return null;
    }

    private static IEnumerable<int[]> Odometer(int[] sizes)
    {
        if (sizes.Any(s => s == 0))
            yield break;
        var digits = new int[sizes.Length];
        while (true)
        {
            yield return digits;
            var i = digits.Length - 1;
            while (i >= 0 && ++digits[i] == sizes[i])
                digits[i--] = 0;
            if (i < 0)
                yield break;
        }
    }
}
