namespace PartsOpt.Api.Webhooks;

/// <summary>The event types a subscription may ask for. Names are ours: "subject.what-happened".</summary>
public static class EventTypes
{
    /// <summary>A part's available quantity (on hand − reserved) went from at/above its reorder level to below it.</summary>
    public const string StockLow = "stock.low";

    /// <summary>A CSV import was committed (never a dry run, never a rejected file).</summary>
    public const string StockImported = "stock.imported";

    /// <summary>Stock was reserved for a build (published by the builds feature).</summary>
    public const string BuildReserved = "build.reserved";

    /// <summary>A build consumed its reserved stock (published by the builds feature).</summary>
    public const string BuildCompleted = "build.completed";

    /// <summary>A build was cancelled and its reservation released (published by the builds feature).</summary>
    public const string BuildCancelled = "build.cancelled";

    /// <summary>A design search finished (published by the design search feature).</summary>
    public const string DesignSearchCompleted = "design-search.completed";

    /// <summary>Subscribes to every type, including types added later.</summary>
    public const string Wildcard = "*";

    public static IReadOnlyList<string> All { get; } =
        [StockLow, StockImported, BuildReserved, BuildCompleted, BuildCancelled, DesignSearchCompleted];

    public static bool IsKnown(string type) => All.Contains(type, StringComparer.Ordinal);
}
