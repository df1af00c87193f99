using PartsOpt.Topologies;

namespace PartsOpt.Search;

/// <summary>
/// The post-check the search runs on every design that meets the bands nominally when the requirement asks
/// for a yield: the tolerance machinery (worst case or Monte Carlo over the parts' spreads and temperature)
/// plugs in here. A design whose yield falls short is cut like any other rejected design.
/// </summary>
public interface IYieldCheck
{
    /// <summary>Estimates the yield of <paramref name="design"/> against the bands of <paramref name="requirement"/>.</summary>
    YieldResult Estimate(SearchRequirement requirement, CircuitDesign design);
}

/// <summary>What a yield check found.</summary>
/// <param name="Yield">Estimated fraction of boards inside every band (1 for a worst case that holds).</param>
/// <param name="Detail">How it was estimated and what limited it, in plain words.</param>
/// <param name="FailedFigures">When known for certain: figures whose band alone fails the target, each
/// decided by its own parts only (a worst case). The search then cuts only the roles those figures depend
/// on; null when the shortfall cannot be pinned on single figures.</param>
public sealed record YieldResult(double Yield, string Detail, IReadOnlyList<string>? FailedFigures = null);
