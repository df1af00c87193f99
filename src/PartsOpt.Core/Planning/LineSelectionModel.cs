using System.Globalization;
using Google.OrTools.Sat;

namespace PartsOpt.Planning;

/// <summary>What one solve of the line-selection model gave.</summary>
/// <param name="Status">CP-SAT's status.</param>
/// <param name="Chosen">Per requirement, the chosen column (null for a requirement without columns).</param>
/// <param name="Lines">Line indices the plan holds, ascending.</param>
/// <param name="Scale">Integer objective units per unit of currency.</param>
/// <param name="Rounded">True when some yearly cost had more decimals than the scale keeps (rounded in the model).</param>
internal sealed record LineSelection(CpSolverStatus Status, IReadOnlyList<DesignColumn?> Chosen, IReadOnlyList<int> Lines, long Scale, bool Rounded)
{
    /// <summary>True when a plan was found (optimal or not).</summary>
    public bool Found => Status is CpSolverStatus.Optimal or CpSolverStatus.Feasible;
}

/// <summary>
/// The master model of the stocking plan (docs/stocking-plans.md): a bool per line (held), a bool per
/// column (this design meets that requirement), exactly one column per requirement that has any, a column
/// needs its lines, today's lines held when they must be kept; minimise Σ unitsPerYear × cost per board of
/// the chosen columns + holding cost × lines held.
/// </summary>
internal static class LineSelectionModel
{
    /// <summary>Largest scale tried for an exact integer objective; past it costs are rounded to 1e-6.</summary>
    public const long MaxScale = 1_000_000;

    public static LineSelection Solve(
        IReadOnlyList<IReadOnlyList<DesignColumn>> columns,
        IReadOnlyList<int> unitsPerYear,
        PlanLines lines,
        decimal holdingCostPerLine,
        bool keepExisting,
        TimeSpan timeLimit,
        int seed,
        CancellationToken cancellation)
    {
        var yearly = columns.Select((list, r) => list.Select(c => unitsPerYear[r] * c.PerBoard).ToList()).ToList();
        var (scale, rounded) = ScaleFor(yearly.SelectMany(y => y).Append(holdingCostPerLine));

        var model = new CpModel();
        var held = Enumerable.Range(0, lines.Count).Select(l => model.NewBoolVar($"held_{l}")).ToArray();
        var objective = LinearExpr.NewBuilder();
        var holding = Scaled(holdingCostPerLine, scale);
        for (var l = 0; l < lines.Count; l++)
        {
            if (keepExisting && lines.Existing[l])
                model.Add(held[l] == 1);
            objective.AddTerm(held[l], holding);
        }
        var pick = new BoolVar[columns.Count][];
        for (var r = 0; r < columns.Count; r++)
        {
            pick[r] = columns[r].Select((_, j) => model.NewBoolVar($"design_{r}_{j}")).ToArray();
            if (pick[r].Length == 0)
                continue;
            model.AddExactlyOne(pick[r]);
            for (var j = 0; j < pick[r].Length; j++)
            {
                foreach (var line in columns[r][j].Lines)
                    model.AddImplication(pick[r][j], held[line]);
                objective.AddTerm(pick[r][j], Scaled(yearly[r][j], scale));
            }
        }
        model.Minimize(objective);

        var solver = new CpSolver
        {
            StringParameters = string.Create(CultureInfo.InvariantCulture,
                $"max_time_in_seconds:{Math.Max(timeLimit.TotalSeconds, 0.001):0.###}, num_workers:2, random_seed:{seed}"),
        };
        CpSolverStatus status;
        using (cancellation.Register(solver.StopSearch))
            status = solver.Solve(model);
        if (status is not (CpSolverStatus.Optimal or CpSolverStatus.Feasible))
            return new LineSelection(status, columns.Select(_ => (DesignColumn?)null).ToList(), [], scale, rounded);

        var chosen = columns.Select((list, r) => list.Count == 0 ? null
            : list[Array.FindIndex(pick[r], v => solver.BooleanValue(v))]).ToList();
        // A line no chosen design needs is held only when it must be kept: with no holding cost the solver
        // may leave one on at no charge, and the plan does not list it.
        var needed = chosen.Where(c => c is not null).SelectMany(c => c!.Lines)
            .Concat(keepExisting ? lines.ExistingLines : []).ToHashSet();
        var planLines = Enumerable.Range(0, lines.Count).Where(l => solver.BooleanValue(held[l]) && needed.Contains(l)).ToList();
        return new LineSelection(status, chosen, planLines, scale, rounded);
    }

    /// <summary>The smallest power of ten (up to <see cref="MaxScale"/>) that makes every amount whole.</summary>
    internal static (long Scale, bool Rounded) ScaleFor(IEnumerable<decimal> amounts)
    {
        var scale = 1L;
        foreach (var amount in amounts)
            while (amount * scale != decimal.Truncate(amount * scale))
            {
                if (scale == MaxScale)
                    return (MaxScale, true);
                scale *= 10;
            }
        return (scale, false);
    }

    internal static long Scaled(decimal amount, long scale) => checked((long)decimal.Round(amount * scale, MidpointRounding.AwayFromZero));
}
