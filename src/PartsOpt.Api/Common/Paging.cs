using PartsOpt.Api.Parts;

namespace PartsOpt.Api.Common;

/// <summary>The one paging rule of every list endpoint: 1-based pages of 1 to <see cref="MaxSize"/> items.</summary>
internal static class Paging
{
    public const int DefaultSize = 50;
    public const int MaxSize = 200;

    /// <summary>Names <c>page</c> and <c>pageSize</c> in <paramref name="errors"/> when they are out of range.</summary>
    public static void Check(ErrorList errors, int? page, int? pageSize)
    {
        if (page is < 1)
            errors.Add("page", "Pages count from 1.");
        if (pageSize is < 1 or > MaxSize)
            errors.Add("pageSize", $"Between 1 and {MaxSize}.");
    }

    /// <summary>The problem for out-of-range paging, or null when it is fine.</summary>
    public static Dictionary<string, string[]>? Problems(int? page, int? pageSize)
    {
        var errors = new ErrorList();
        Check(errors, page, pageSize);
        return errors.Count > 0 ? errors.ToDictionary() : null;
    }
}
