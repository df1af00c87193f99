namespace PartsOpt.Search;

// Phase 2: square-wave generators collected in cost bands and completed in rank order; the quick start.
internal sealed partial class SelectionEnumerator
{
    /// <summary>
    /// Judges one whole design given by its roles (the extra slots taken cheapest, as at a leaf) and lists it
    /// if the engine accepts it.
    /// </summary>
    private void Whole(int[] design)
    {
        var filled = 0;
        var fits = true;
        for (; filled < order.Length && fits; filled++)
            fits = Assign(order[filled], design[order[filled]]);
        if (fits)
        {
            Array.Fill(needTopAbove, double.NegativeInfinity);
            Array.Fill(needBottomBelow, double.PositiveInfinity);
            var saved = limit;
            limit = null; // a design outside any cutoff is still a design
            Leaf();
            limit = saved ?? cutoff();
        }
        for (var d = filled - 1; d >= 0; d--)
            Unassign(order[d], design[order[d]]);
    }

    private static DateTime Min(DateTime a, DateTime b) => a < b ? a : b;

    /// <summary>
    /// Try a quick starting design when phase 1's first look finds none (set by the search while the
    /// variant's topology has no design yet: once it has one, its other variants soon start with a cutoff).
    /// </summary>
    public bool QuickStart { get; init; } = true;

    /// <summary>Longest the quick starting design may take: past it, phase 1 finds the first design anyway.</summary>
    public static readonly TimeSpan QuickStartBudget = TimeSpan.FromMilliseconds(50);

    /// <summary>How long phase 1 walks before the quick starting design is tried (most variants find a design sooner).</summary>
    public static readonly TimeSpan FirstLookBudget = TimeSpan.FromMilliseconds(15);

    /// <summary>A square-wave generator found in phase 2: its options in branching order, cheapest completion, forecast error.</summary>
    private readonly record struct Generator(int Offset, long Least, double Error);

    /// <summary>
    /// Phase 2 (<see cref="Run"/>): collects every square-wave generator the bounds and the cutoff leave, sorts
    /// them by cheapest completion then forecast frequency error, and completes each in turn; once one ranks
    /// after the cutoff on those two, every later one does too, and the tree is done.
    /// </summary>
    private void ByGenerator()
    {
        // In bands of one line item's setup cost above the cheapest completion of the root: a band is
        // collected under its own ceiling (a cheap walk, the bound prunes hard), so the walk never runs under
        // a loose early cutoff; the designs each band completes tighten the cutoff for the next.
        var floor = long.MinValue;
        var ceiling = partialObjective + LowerBoundOfRest(0).Bound;
        while (limit is { } start && floor < start.Cost)
        {
            ceiling = Math.Min(ceiling, start.Cost);
            generators.Clear();
            generatorOptions.Clear();
            limit = new SearchCutoff(ceiling, double.PositiveInfinity);
            (collecting, collectAbove) = (true, floor);
            Descend(0);
            collecting = false;
            limit = cutoff();
            if (stopped)
                return;
            Complete();
            if (stopped)
                return;
            // Without a setup cost there are no line-item steps to band by: one band up to the cutoff.
            floor = ceiling;
            ceiling = setup > 0 ? ceiling + setup : long.MaxValue / 4;
        }
    }

    /// <summary>Completes the collected square-wave generators in rank order until one ranks after the cutoff.</summary>
    private void Complete()
    {
        var sorted = generators.ToArray();
        Array.Sort(sorted, (a, b) => a.Least != b.Least ? a.Least.CompareTo(b.Least)
            : a.Error != b.Error ? a.Error.CompareTo(b.Error) : a.Offset.CompareTo(b.Offset));
        var width = frequencyDepth + 1;
        foreach (var generator in sorted)
        {
            if (limit is { } bound && (generator.Least > bound.Cost
                || (forecastTrusted && generator.Least == bound.Cost && generator.Error > bound.FrequencyError * (1 + 1e-9) + 1e-15)))
                break;
            if (cancellation.IsCancellationRequested || DateTime.UtcNow >= deadline)
            {
                stopped = true;
                return;
            }
            var filled = 0;
            var fits = true;
            for (; filled < width && fits; filled++)
                fits = Assign(order[filled], generatorOptions[generator.Offset + filled]);
            var least = partialObjective + LowerBoundOfRest(width).Bound;
            errorAtFrequencyDepth = double.NaN;
            integratorInputFloor = double.NegativeInfinity;
            for (var d = 0; d < width; d++)
                (needTopAbove[d], needBottomBelow[d]) = (double.NegativeInfinity, double.PositiveInfinity);
            if (dutyFrame < width)
            {
                tops.Clear();
                bottoms.Clear();
            }
            if (fits && Admits(least, frequencyDepth))
            {
                var before = exhausted;
                exhausted = Exhausted(width);
                if (PartialCheck(frequencyDepth) > frequencyDepth)
                    Descend(width);
                exhausted = before;
            }
            for (var d = filled - 1; d >= 0; d--)
                Unassign(order[d], generatorOptions[generator.Offset + d]);
            if (stopped)
                return;
        }
    }

    private void Collect(long least)
    {
        if (least <= collectAbove)
            return; // completed in an earlier band
        var offset = generatorOptions.Count;
        for (var d = 0; d <= frequencyDepth; d++)
            generatorOptions.Add(choice[order[d]]);
        generators.Add(new Generator(offset, least, forecastTrusted ? ForecastError() : 0));
    }
}
