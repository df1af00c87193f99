using System.Globalization;
using PartsOpt.Topologies;

namespace PartsOpt.Search;

/// <summary>The variants of one topology worth a model, and why the others were set aside.</summary>
/// <param name="Topology">The topology.</param>
/// <param name="Variants">Topology × op-amp assignment (× reference buffer) to search, in a fixed order.</param>
/// <param name="SetAside">Why op-amps or assignments were not tried, in a designer's words.</param>
internal sealed record TopologyPlan(TopologyKind Topology, IReadOnlyList<SearchVariant> Variants, IReadOnlyList<string> SetAside);

/// <summary>
/// Enumerates op-amp assignments outside the model (there are few): every stocked op-amp fit to run the
/// analog sections, with the comparator as one of its own sections or as any other stocked part, and with
/// a single supply with and without a spare section buffering the reference.
/// </summary>
internal static class VariantPlanner
{
    public static TopologyPlan Plan(SearchContext context, TopologyKind topology)
    {
        var stock = context.Stock;
        var requirement = context.Requirement;
        var supply = requirement.Supply;
        var setAside = new List<string>();
        var variants = new List<SearchVariant>();

        bool Rated(StockOpAmp part)
        {
            if (supply.SpanV >= part.Spec.SupplyMinV && supply.SpanV <= part.Spec.SupplyMaxV)
                return true;
            setAside.Add(Say($"{part.PartNumber} is rated for {part.Spec.SupplyMinV:G3} … {part.Spec.SupplyMaxV:G3} V across its rails; the supply spans {supply.SpanV:G3} V."));
            return false;
        }

        var rated = Enumerable.Range(0, stock.OpAmps.Count).Where(i => Rated(stock.OpAmps[i])).ToList();
        var amplifiers = rated.Where(i => !stock.OpAmps[i].Spec.IsComparator && !stock.OpAmps[i].Spec.IsOpenDrain).ToList();
        if (stock.OpAmps.Count == 0)
            setAside.Add("There is no op-amp in stock.");
        else if (amplifiers.Count == 0)
            setAside.Add("No stocked op-amp can run the oscillator and integrator (comparators and open-drain parts cannot).");

        foreach (var amplifier in amplifiers)
        {
            var comparators = new List<int?> { null };
            comparators.AddRange(rated
                .Where(j => j != amplifier && stock.OpAmps[j].PartNumber != stock.OpAmps[amplifier].PartNumber)
                .Select(j => (int?)j));
            foreach (var comparator in comparators)
                foreach (var buffer in supply.IsSingle ? new[] { false, true } : [false])
                {
                    var variant = new SearchVariant(context, topology, amplifier, comparator, buffer);
                    if (Blocked(variant) is { } why)
                        setAside.Add(why);
                    else
                        variants.Add(variant);
                }
        }

        return new TopologyPlan(topology, variants, setAside.Distinct().ToList());
    }

    /// <summary>Why a variant cannot be built at all, before any model: no part for a role, too few op-amp packages.</summary>
    private static string? Blocked(SearchVariant variant)
    {
        foreach (var slot in variant.Slots.Take(variant.RoleNames.Count))
            if (slot.Options.Count == 0)
                return $"There is no {Roles.KindOf(slot.Name).ToString().ToLowerInvariant()} in stock for role {slot.Name}.";
        var quantity = variant.Context.Requirement.BuildQuantity;
        foreach (var draw in variant.FixedDraws)
        {
            var line = variant.Context.Lines[draw.Line];
            if ((long)draw.PerBoard * quantity > line.Available)
                return Say($"{variant.Describe()} needs {draw.PerBoard * (long)quantity} packages of {line.PartNumber} for {quantity} boards; {line.Available} are available.");
        }
        return null;
    }

    private static string Say(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
