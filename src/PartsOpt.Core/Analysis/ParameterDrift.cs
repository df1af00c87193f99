using System.Globalization;

namespace PartsOpt.Analysis;

/// <summary>How far one parameter may drift over a temperature range, and on what grounds.</summary>
/// <param name="Parameter">Parameter (role) name.</param>
/// <param name="ReferenceDesignator">Where the part sits on the board, if it is a part.</param>
/// <param name="DriftMinus">Largest fall as a positive fraction (0.0018 for −0.18 %).</param>
/// <param name="DriftPlus">Largest rise as a positive fraction.</param>
/// <param name="Basis">How the drift follows from the behaviour, in words.</param>
/// <param name="Standard">The standard or source of the behaviour, as the part carries it.</param>
/// <param name="Warning">Set where the range leaves the behaviour's rated range.</param>
public sealed record ParameterDrift(
    string Parameter,
    string? ReferenceDesignator,
    double DriftMinus,
    double DriftPlus,
    string Basis,
    string? Standard,
    string? Warning)
{
    /// <summary>
    /// The drift of a parameter over a range, relative to 25 °C. A linear coefficient c gives
    /// ±c·1e-6·|T − 25| at the end of the range furthest from 25 °C (the sign of c is not known, so both
    /// ways). A banded characteristic (class-2 ceramic, EIA-198) gives its whole guaranteed band as soon
    /// as the range leaves 25 °C: the standard guarantees the band, not a curve inside it.
    /// </summary>
    public static ParameterDrift Of(ParameterSpec parameter, TemperatureRange range)
    {
        ArgumentNullException.ThrowIfNull(parameter);
        ArgumentNullException.ThrowIfNull(range);
        var t = parameter.Temperature;
        if (t is null)
            return new(parameter.Name, parameter.ReferenceDesignator, 0, 0, "no temperature behaviour given", null, null);

        var warning = range.MinCelsius < t.RatedMinCelsius || range.MaxCelsius > t.RatedMaxCelsius
            ? string.Create(CultureInfo.InvariantCulture,
                $"{parameter.Name}: the range {range.MinCelsius:0.#}…{range.MaxCelsius:0.#} °C leaves the rated range {t.RatedMinCelsius:0.#}…{t.RatedMaxCelsius:0.#} °C of {t.Standard ?? "its temperature behaviour"}; the drift beyond it is not guaranteed.")
            : null;

        if (t.IsBanded)
        {
            var inBand = !range.IsReferenceOnly;
            return new(parameter.Name, parameter.ReferenceDesignator, inBand ? t.BandMinus : 0, inBand ? t.BandPlus : 0,
                string.Create(CultureInfo.InvariantCulture,
                    $"guaranteed band −{t.BandMinus * 100:0.##} %/+{t.BandPlus * 100:0.##} % over the rated range, taken whole"),
                t.Standard, warning);
        }

        var excursion = range.LargestExcursionK;
        var drift = t.CoefficientPpmPerK * 1e-6 * excursion;
        return new(parameter.Name, parameter.ReferenceDesignator, drift, drift,
            string.Create(CultureInfo.InvariantCulture,
                $"±{t.CoefficientPpmPerK:0.##} ppm/K × {excursion:0.##} K from 25 °C"),
            t.Standard, warning);
    }
}
