using PartsOpt.Api.Common;
using PartsOpt.Api.Parts;
using PartsOpt.Values;

namespace PartsOpt.Api.Planning;

/// <summary>
/// One preferred-value range of candidate lines (a series, a value range, a tolerance and a unit price), as
/// stocking plans and what-if both take it: every bad field named, and how many lines it gives.
/// </summary>
internal static class SeriesRangeRules
{
    /// <summary>Checks the range; returns how many lines it gives (at most <paramref name="countUpTo"/> + 1), 0 when invalid.</summary>
    /// <param name="errors">Where each bad field is named.</param>
    /// <param name="prefix">Field prefix of the range, tolerance and price ("candidates.resistor").</param>
    /// <param name="seriesField">Field name of the series ("candidates.resistorSeries").</param>
    /// <param name="seriesName">The series ("E24"), or null when this kind is not asked for.</param>
    /// <param name="range">Least and greatest value, SI units.</param>
    /// <param name="tolerance">Tolerance of the candidate parts, a fraction.</param>
    /// <param name="unitCost">Price of one piece.</param>
    /// <param name="countUpTo">Counting stops one past this many lines.</param>
    public static int Count(ErrorList errors, string prefix, string seriesField, string? seriesName, RangeInput? range,
        double? tolerance, decimal? unitCost, int countUpTo)
    {
        ArgumentNullException.ThrowIfNull(errors);
        if (seriesName is null)
        {
            if (range is not null)
                errors.Add(seriesField, "A range needs its series (\"E24\").");
            return 0;
        }
        ESeries? series = null;
        try
        {
            series = PreferredValues.Parse(seriesName);
        }
        catch (ArgumentException unknown)
        {
            errors.Add(seriesField, unknown.Message);
        }
        var ok = true;
        if (range is null)
        {
            errors.Add($"{prefix}Range", "Required with a series: {min, max}.");
            ok = false;
        }
        else
        {
            errors.Positive($"{prefix}Range.min", range.Min, required: true);
            errors.Positive($"{prefix}Range.max", range.Max, required: true);
            ok = range.Min is > 0 and { } min && double.IsFinite(min) && range.Max is > 0 and { } max && double.IsFinite(max);
            if (ok && range.Min > range.Max)
            {
                errors.Add($"{prefix}Range.min", "The range needs min at or below max.");
                ok = false;
            }
        }
        if (errors.Finite($"{prefix}Tolerance", tolerance) && tolerance is < 0 or >= 1)
            errors.Add($"{prefix}Tolerance", "A fraction from 0 to below 1 (0.01 for 1 %).");
        if (unitCost is null)
            errors.Add($"{prefix}UnitCost", "Required with a series: the price of one piece.");
        else if (unitCost < 0)
            errors.Add($"{prefix}UnitCost", "May not be negative.");
        return ok && series is { } s ? PreferredValues.InRange(s, range!.Min!.Value, range.Max!.Value).Take(countUpTo + 1).Count() : 0;
    }
}
