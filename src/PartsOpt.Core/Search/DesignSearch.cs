using System.Collections.Concurrent;
using System.Diagnostics;
using PartsOpt.Topologies;

namespace PartsOpt.Search;

/// <summary>
/// Finds the cheapest designs the stockroom can build that meet a requirement, across every topology and
/// op-amp assignment: one CP-SAT selection model per topology × assignment, each run in the lazy
/// verification loop of <see cref="SelectionSolver"/> (see docs/search-model.md).
/// </summary>
public static class DesignSearch
{
    /// <summary>
    /// Searches <paramref name="stock"/> for designs meeting <paramref name="requirement"/>, cheapest per
    /// board first; the best design of every feasible topology is always in the list. Deterministic for the
    /// same stock and requirement when the search completes within the time limit.
    /// </summary>
    /// <param name="requirement">What to build.</param>
    /// <param name="stock">What the stockroom holds.</param>
    /// <param name="options">Time limit, seed and yield check; defaults when null.</param>
    /// <param name="cancellation">Stops the search; the outcome then holds what was found so far.</param>
    /// <exception cref="ArgumentException">The requirement is not meaningful (names the field).</exception>
    public static SearchOutcome Run(SearchRequirement requirement, Stock stock, SearchOptions? options = null,
        CancellationToken cancellation = default)
    {
        ArgumentNullException.ThrowIfNull(requirement);
        ArgumentNullException.ThrowIfNull(stock);
        RequirementRules.Validate(requirement);
        options ??= new SearchOptions();
        var clock = Stopwatch.StartNew();
        var deadline = DateTime.UtcNow + options.EffectiveTimeLimit;
        var context = new SearchContext(requirement, stock);
        var notes = new List<string>();
        var yieldCheck = requirement.Yield is null ? null : options.YieldCheck ?? new ToleranceYieldCheck();
        if (context.DecouplingCapacitors.Count == 0)
            notes.Add("No stocked capacitor fits supply decoupling (ceramic, 100 nF … 1 µF, rated for the supply): " +
                "buy one 100 nF X7R per op-amp package per board.");

        var topologies = requirement.TopologiesToSearch();
        var plans = topologies.Select(t => VariantPlanner.Plan(context, t)).ToList();
        var found = new List<(SearchVariant Variant, AcceptedChoice Choice)>();
        var tracker = new MissTracker();
        var complete = plans.ToDictionary(p => p.Topology, _ => true);
        var solves = options.Method == SearchMethod.BranchAndBound
            ? Enumerate(plans, found, complete, yieldCheck, tracker, deadline, cancellation)
            : Model(plans, found, complete, yieldCheck, tracker, deadline, options.Seed, cancellation);

        var designs = DesignAssembler.Rank(found, requirement.MaxResults);
        var reports = plans.Select(p => InfeasibilityReport.For(p, designs, complete[p.Topology], tracker, context, deadline)).ToList();
        var proved = complete.Values.All(c => c);
        if (!proved)
            notes.Add(cancellation.IsCancellationRequested
                ? "The search was cancelled before it finished: the list may miss cheaper designs."
                : "The time limit ran out before the search finished: the list may miss cheaper designs.");
        var status = (designs.Count > 0, proved) switch
        {
            (true, true) => SearchStatus.Optimal,
            (true, false) => SearchStatus.Feasible,
            (false, true) => SearchStatus.Infeasible,
            _ => SearchStatus.Unknown,
        };
        return new SearchOutcome(status, designs, reports, solves, clock.Elapsed, notes);
    }

    /// <summary>
    /// Branch and bound (<see cref="SelectionEnumerator"/>) over each variant in turn, cheapest lower bound
    /// first, every tree bounded by the list's cutoff as it stands. Returns the designs judged.
    /// </summary>
    private static int Enumerate(List<TopologyPlan> plans, List<(SearchVariant Variant, AcceptedChoice Choice)> found,
        Dictionary<TopologyKind, bool> complete, IYieldCheck? yieldCheck, MissTracker tracker, DateTime deadline,
        CancellationToken cancellation)
    {
        var wanted = plans.SelectMany(p => p.Variants).FirstOrDefault()?.Context.Requirement.MaxResults ?? 1;
        var list = new CutoffList(wanted);
        var judged = 0L;
        var variants = plans.SelectMany(p => p.Variants)
            .OrderBy(v => v.LowerBound).ThenBy(v => v.Topology).ToList();
        var gate = new object();
        // Variants run side by side, one per core, taken cheapest bound first; they share the list and its
        // cutoff. Each is exact under any cutoff it reads, so the outcome does not depend on the interleaving.
        Parallel.ForEach(
            Partitioner.Create(variants, EnumerablePartitionerOptions.NoBuffering),
            new ParallelOptions { MaxDegreeOfParallelism = Math.Max(1, Environment.ProcessorCount) },
            variant =>
        {
            var remaining = deadline - DateTime.UtcNow;
            if (cancellation.IsCancellationRequested || remaining <= TimeSpan.Zero)
            {
                lock (gate)
                    complete[variant.Topology] = false;
                return;
            }
            if (list.Cutoff(variant.Topology) is { } limit && variant.LowerBound * variant.CostScale > limit.Cost)
                return; // proved: nothing this variant builds can enter the list
            var enumerator = new SelectionEnumerator(variant) { QuickStart = !list.HasDesign(variant.Topology) };
            var run = enumerator.Run(
                choice => Verify(variant, choice, yieldCheck, tracker, forModel: false),
                choice => JudgeOnly(variant, choice, tracker),
                () => list.Cutoff(variant.Topology),
                accepted =>
                {
                    var rank = new SearchCutoff(accepted.Objective, accepted.Verdict.FrequencyError,
                        accepted.Verdict.Margin, new DesignKey(variant, accepted.Choice));
                    lock (gate)
                        found.Add((variant, accepted));
                    list.Add(variant.Topology, rank);
                },
                deadline,
                cancellation);
            Interlocked.Add(ref judged, run.Solves);
            if (!run.Complete)
                lock (gate)
                    complete[variant.Topology] = false;
        });
        return (int)Math.Min(judged, int.MaxValue);
    }

    /// <summary>
    /// The CP-SAT selection models with the lazy verification loop (<see cref="SelectionSolver"/>), one per
    /// variant, in two phases. Returns the solves.
    /// </summary>
    private static int Model(List<TopologyPlan> plans, List<(SearchVariant Variant, AcceptedChoice Choice)> found,
        Dictionary<TopologyKind, bool> complete, IYieldCheck? yieldCheck, MissTracker tracker, DateTime deadline,
        int seed, CancellationToken cancellation)
    {
        var requirement = plans.SelectMany(p => p.Variants).FirstOrDefault()?.Context.Requirement;
        if (requirement is null)
            return 0;
        var solves = 0;

        // Phase 1: the best design (and its ties) of every variant, each with an even share of the time left.
        // Phase 2: the full list, cheapest variants first, so the K-th design found early bounds the others.
        // Cheapest bound first within each topology, so the designs found early let dearer variants be
        // dropped without a model (their bound passes the cutoff).
        var variants = plans.SelectMany(p => p.Variants.OrderBy(v => v.LowerBound)).ToList();
        var best = new Dictionary<TopologyKind, long>();
        var finished = new Dictionary<SearchVariant, bool>();
        var firstCost = new Dictionary<SearchVariant, long>();
        var solvers = new Dictionary<SearchVariant, (SelectionSolver Solver, List<AcceptedChoice> Accepted)>();
        var starts = new Dictionary<SearchVariant, List<AcceptedChoice>>();
        bool RunVariant(SearchVariant variant, int wanted, int left)
        {
            var remaining = deadline - DateTime.UtcNow;
            if (cancellation.IsCancellationRequested || remaining <= TimeSpan.Zero)
                return false;
            var cutoff = Cutoff(found, requirement.MaxResults, best.TryGetValue(variant.Topology, out var topologyBest) ? topologyBest : null);
            if (cutoff is { } limit && variant.LowerBound * SelectionSolver.ScaleFor(variant.Problem) > limit)
            {
                return true; // proved: nothing this variant builds can enter the list
            }
            // Phase 2 continues phase 1's model: its cuts stay, the designs already accepted are forbidden in it.
            if (!solvers.TryGetValue(variant, out var state))
            {
                solvers[variant] = state = (new SelectionSolver(variant.Problem), []);
                // Until its topology has a design, a variant first tries a quick starting design: accepted by
                // the engine, it lists at once and sets the cutoff that prunes the models.
                if (!best.ContainsKey(variant.Topology)
                    && StartingDesign.Find(variant, DateTime.UtcNow + Min(remaining / Math.Max(left, 1), StartingDesignBudget)) is { } start
                    && Verify(variant, start, yieldCheck, tracker) is { Accepted: true } verdict)
                {
                    // Kept apart from the model's list: it need not be the cheapest, so it must not count
                    // towards the designs the model is asked for.
                    starts[variant] = [new AcceptedChoice(start, state.Solver.ObjectiveOf(start), verdict)];
                    state.Solver.Exclude(start, variant.RoleSlots);
                    var deadlineOfNeighbours = DateTime.UtcNow + Min(remaining / Math.Max(left, 1), StartingDesignBudget);
                    foreach (var neighbour in StartingDesign.Neighbours(variant, start, requirement.MaxResults - 1, deadlineOfNeighbours))
                        if (Verify(variant, neighbour, yieldCheck, tracker) is { Accepted: true } accepted)
                        {
                            starts[variant].Add(new AcceptedChoice(neighbour, state.Solver.ObjectiveOf(neighbour), accepted));
                            state.Solver.Exclude(neighbour, variant.RoleSlots);
                        }
                    Record(variant, state.Accepted);
                    cutoff = Cutoff(found, requirement.MaxResults, best[variant.Topology]);
                }
            }
            var run = state.Solver.Run(
                choice => Verify(variant, choice, yieldCheck, tracker),
                Math.Max(wanted - state.Accepted.Count, 1),
                cutoff,
                variant.RoleSlots,
                DateTime.UtcNow + remaining / Math.Max(left, 1),
                seed,
                cancellation);
            solves += run.Solves;
            state.Accepted.AddRange(run.Accepted);
            Record(variant, state.Accepted);
            return run.Complete;
        }

        void Record(SearchVariant variant, List<AcceptedChoice> listed)
        {
            var accepted = starts.TryGetValue(variant, out var early) ? [.. listed, .. early] : listed;
            found.RemoveAll(f => f.Variant == variant);
            found.AddRange(accepted.Select(a => (variant, a)));
            if (accepted.Count > 0)
            {
                var cheapest = accepted.Min(a => a.Objective);
                best[variant.Topology] = Math.Min(best.GetValueOrDefault(variant.Topology, long.MaxValue), cheapest);
                firstCost[variant] = cheapest;
            }
        }

        for (var i = 0; i < variants.Count; i++)
            finished[variants[i]] = RunVariant(variants[i], 1, variants.Count - i);
        var second = variants.Where(firstCost.ContainsKey).OrderBy(v => firstCost[v]).ToList();
        if (requirement.MaxResults > 1)
            for (var i = 0; i < second.Count; i++)
                if (solvers[second[i]].Accepted.Count < requirement.MaxResults)
                    finished[second[i]] = RunVariant(second[i], requirement.MaxResults, second.Count - i);
        foreach (var (variant, done) in finished)
            if (!done)
                complete[variant.Topology] = false;
        return solves;
    }

    /// <summary>Longest a variant spends on its starting design.</summary>
    public static readonly TimeSpan StartingDesignBudget = TimeSpan.FromMilliseconds(400);

    private static TimeSpan Min(TimeSpan a, TimeSpan b) => a < b ? a : b;

    /// <summary>
    /// Designs dearer than both the current K-th design overall and this topology's best so far cannot
    /// enter the list: the model may drop them.
    /// </summary>
    private static long? Cutoff(List<(SearchVariant Variant, AcceptedChoice Choice)> found, int wanted, long? topologyBest)
    {
        if (topologyBest is null || found.Count < wanted)
            return null;
        var kth = found.Select(f => f.Choice.Objective).Order().ElementAt(wanted - 1);
        return Math.Max(kth, topologyBest.Value);
    }

    /// <summary>The engine's judgement of an assignment (no yield check), recorded for the reports; null when invalid.</summary>
    private static DesignJudgement? JudgeOnly(SearchVariant variant, int[] choice, MissTracker tracker)
    {
        try
        {
            var judgement = DesignJudge.Judge(variant.Context.Requirement, variant.DesignOf(choice));
            if (!judgement.Accepted)
                tracker.Rejected(variant, choice, judgement);
            return judgement;
        }
        catch (DesignValidationException invalid)
        {
            tracker.Invalid(variant, invalid.Message);
            return null;
        }
    }

    /// <summary>
    /// The engine's verdict on an assignment, then the yield check. For the CP-SAT loop (forModel) a
    /// rejection carries its cut (scope, escapes, swept cuts); the branch and bound reads the judgement itself.
    /// </summary>
    internal static SelectionVerdict Verify(SearchVariant variant, int[] choice, IYieldCheck? yieldCheck, MissTracker tracker, bool forModel = true)
    {
        var requirement = variant.Context.Requirement;
        var design = variant.DesignOf(choice);
        DesignJudgement judgement;
        try
        {
            judgement = DesignJudge.Judge(requirement, design);
        }
        catch (DesignValidationException invalid)
        {
            tracker.Invalid(variant, invalid.Message);
            return new SelectionVerdict(false, variant.RoleSlots, Reason: invalid.Message);
        }

        if (!judgement.Accepted)
        {
            tracker.Rejected(variant, choice, judgement);
            if (!forModel)
                return new SelectionVerdict(false, null, judgement.FrequencyError, judgement.Margin, null, judgement);
            var rejection = variant.Rejection(choice, judgement);
            return rejection is { CutGroup: null, CutEscapeOptions: null, CutSlots: { } scope }
                ? rejection with { MoreCuts = ScopeSweep.Sweep(variant, choice, scope) }
                : rejection;
        }

        if (requirement.Yield is { } yield && yieldCheck is not null)
        {
            var result = yieldCheck.Estimate(requirement, design);
            if (result.Yield < yield.Target)
            {
                tracker.YieldShort(variant, result.Detail);
                return new SelectionVerdict(false, variant.ScopeOfFigures(result.FailedFigures), judgement.FrequencyError,
                    judgement.Margin, result.Detail, judgement);
            }
        }

        return new SelectionVerdict(true, null, judgement.FrequencyError, judgement.Margin, null, judgement);
    }

    /// <summary>
    /// The list's cutoff kept up to date as designs are accepted, in rank order (cost, frequency error,
    /// margin, key): the K-th best so far (a max-heap of the K best) and each topology's best. Read at every
    /// node of the tree, so O(1).
    /// </summary>
    private sealed class CutoffList(int wanted)
    {
        private static readonly Comparer<SearchCutoff> Descending =
            Comparer<SearchCutoff>.Create((a, b) => b.CompareTo(a));
        private readonly PriorityQueue<SearchCutoff, SearchCutoff> kept = new(Descending);
        private readonly Dictionary<TopologyKind, SearchCutoff> best = [];

        private readonly Lock gate = new();

        public void Add(TopologyKind topology, SearchCutoff rank)
        {
            lock (gate)
            {
                if (!best.TryGetValue(topology, out var own) || rank.CompareTo(own) < 0)
                    best[topology] = rank;
                if (kept.Count < wanted)
                    kept.Enqueue(rank, rank);
                else if (rank.CompareTo(kept.Peek()) < 0)
                    kept.EnqueueDequeue(rank, rank);
            }
        }

        /// <summary>True once a design of the topology has been listed.</summary>
        public bool HasDesign(TopologyKind topology)
        {
            lock (gate)
                return best.ContainsKey(topology);
        }

        /// <summary>Designs ranked after both the K-th so far and this topology's best cannot enter the list.</summary>
        public SearchCutoff? Cutoff(TopologyKind topology)
        {
            lock (gate)
            {
                if (kept.Count < wanted || !best.TryGetValue(topology, out var own))
                    return null;
                var kth = kept.Peek();
                return kth.CompareTo(own) >= 0 ? kth : own;
            }
        }
    }
}

/// <summary>
/// A design's place in the ranking (DesignAssembler.Rank): total build cost (the scaled objective), then the
/// smaller nominal frequency error, the larger margin, the smaller key. As a cutoff: a design ranked after
/// it cannot enter the list.
/// </summary>
internal readonly record struct SearchCutoff(long Cost, double FrequencyError, double Margin = double.NegativeInfinity, DesignKey? Key = null)
    : IComparable<SearchCutoff>
{
    public int CompareTo(SearchCutoff other) =>
        Cost != other.Cost ? Cost.CompareTo(other.Cost)
        : FrequencyError != other.FrequencyError ? FrequencyError.CompareTo(other.FrequencyError)
        : Margin != other.Margin ? other.Margin.CompareTo(Margin)
        : string.CompareOrdinal(Key?.Value, other.Key?.Value);
}

/// <summary>
/// A design's key (<see cref="DesignAssembler.Key"/>), the last tie-break of its rank, written the first time
/// a tie asks for it: most designs listed never tie on cost, frequency error and margin.
/// </summary>
/// <param name="variant">The design's variant.</param>
/// <param name="choice">Its option per slot; not changed afterwards.</param>
internal sealed class DesignKey(SearchVariant variant, int[] choice)
{
    private string? value;

    public string Value => value ??= DesignAssembler.Key(variant, choice);
}
