namespace PartsOpt.Topologies;

/// <summary>The stable figure names of DEVELOPERS.md, in the order the figure model writes them.</summary>
public static class FigureNames
{
    /// <summary>Oscillation frequency, Hz.</summary>
    public const string Frequency = "frequency";
    /// <summary>Time the square-wave generator's output spends high in one period (edges included), s.</summary>
    public const string HighTime = "highTime";
    /// <summary>Time the square-wave generator's output spends low in one period (edges included), s.</summary>
    public const string LowTime = "lowTime";
    /// <summary>Peak-to-peak voltage of the ramp the comparator sees, V.</summary>
    public const string TrianglePeakToPeak = "trianglePeakToPeak";
    /// <summary>Midpoint between the ramp's peaks, absolute, V.</summary>
    public const string TriangleCentre = "triangleCentre";
    /// <summary>Duty cycle at setting 0 (wiper at the <c>cmp.rb</c> end, or the lowest control voltage), fraction.</summary>
    public const string DutyAtSettingMin = "dutyAtSettingMin";
    /// <summary>Duty cycle at setting 1, fraction.</summary>
    public const string DutyAtSettingMax = "dutyAtSettingMax";
    /// <summary>PWM output high level, absolute, V.</summary>
    public const string OutputHigh = "outputHigh";
    /// <summary>PWM output low level, absolute, V.</summary>
    public const string OutputLow = "outputLow";
    /// <summary>Slew-limited edge time of the PWM output (full swing), s.</summary>
    public const string EdgeTime = "edgeTime";
    /// <summary>Mean current drawn from the positive rail, A.</summary>
    public const string SupplyCurrent = "supplyCurrent";
    /// <summary>
    /// Linearity error of the ramp the comparator sees, %: on each rising or falling segment, the largest
    /// vertical distance between the ramp and the straight line through that segment's two end points,
    /// divided by the peak-to-peak; the larger of the two segments. 0 for the loop's straight ramps; about
    /// 100·u/8 for an exponential segment lasting u time constants.
    /// </summary>
    public const string LinearityError = "linearityError";

    /// <summary>Every figure, in model order.</summary>
    public static IReadOnlyList<string> All { get; } =
    [
        Frequency, HighTime, LowTime, TrianglePeakToPeak, TriangleCentre, DutyAtSettingMin, DutyAtSettingMax,
        OutputHigh, OutputLow, EdgeTime, SupplyCurrent, LinearityError,
    ];

    /// <summary>The SI unit of each figure, in model order ("1" for a fraction).</summary>
    public static IReadOnlyList<string> Units { get; } = ["Hz", "s", "s", "V", "V", "1", "1", "V", "V", "s", "A", "%"];
}
