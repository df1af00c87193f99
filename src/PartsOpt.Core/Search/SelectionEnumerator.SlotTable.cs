namespace PartsOpt.Search;

// The per-option-list tables, shared by every slot and variant of a search.
internal sealed partial class SelectionEnumerator
{
    /// <summary>What the search needs of one option list, worked out once per search (see the constructor).</summary>
    internal sealed class SlotTable
    {
        public SlotTable(IReadOnlyList<SlotOption> options, Func<PartDraw, long> drawObjective, int lineCount)
        {
            Objective = options.Select(o => o.Draws.Sum(drawObjective)).ToArray();
            LinesOf = options.Select(o => o.Draws.Select(d => d.Line).Distinct().ToArray()).ToArray();
            DrawsOf = options.Select(o => o.Draws.ToArray()).ToArray();
            var costs = Objective;
            ByCost = Enumerable.Range(0, costs.Length).OrderBy(o => costs[o]).ThenBy(o => o).ToArray();
            MinObjective = costs.Length == 0 ? 0 : costs.Min();
            Logs = options.Select(o => o.LogValue).ToArray();
            Values = options.Select(o => o.Tag is StockChoice c ? c.Value : double.NaN).ToArray();
            var logs = Logs;
            ByLog = Enumerable.Range(0, logs.Length).OrderBy(o => logs[o]).ThenBy(o => o).ToArray();
            SortedLogs = ByLog.Select(o => logs[o]).ToArray();
            Range = SelectionEnumerator.Range(logs.Where(double.IsFinite));
            // Every option by the lines it draws: one line (a part, or a part twice in a combination) or two.
            var single = new List<int>?[lineCount];
            var pairs = new Dictionary<(int, int), List<int>>();
            foreach (var o in ByCost)
            {
                var lines = LinesOf[o];
                if (lines.Length == 1)
                    (single[lines[0]] ??= []).Add(o);
                else if (lines.Length == 2)
                {
                    var key = (Math.Min(lines[0], lines[1]), Math.Max(lines[0], lines[1]));
                    if (!pairs.TryGetValue(key, out var list))
                        pairs[key] = list = [];
                    list.Add(o);
                }
            }
            SingleOption = single.Select(l => l?.ToArray() ?? []).ToArray();
            PairOptions = pairs.ToDictionary(kv => kv.Key, kv => kv.Value.ToArray());
        }

        public long[] Objective { get; }
        public int[][] LinesOf { get; }
        public PartDraw[][] DrawsOf { get; }
        public int[] ByCost { get; }
        public long MinObjective { get; }
        public double[] Logs { get; }
        public double[] Values { get; }
        public int[] ByLog { get; }
        public double[] SortedLogs { get; }
        public (double Min, double Max) Range { get; }
        public int[][] SingleOption { get; }
        public Dictionary<(int, int), int[]> PairOptions { get; }
    }
}
