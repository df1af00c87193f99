namespace PartsOpt.Values;

/// <summary>The SI prefixes the trade writes on parts, as powers of ten.</summary>
internal static class SiPrefix
{
    /// <summary>The micro sign (U+00B5) we write; U+03BC GREEK SMALL LETTER MU and "u" are read too.</summary>
    public const char Micro = '\u00B5';

    /// <summary>
    /// The power of ten a prefix letter stands for, or null. Case matters: "m" is milli and "M" mega.
    /// "K" is read as kilo as well as "k", because IEC 60062 RKM codes write it upper-case (4K7);
    /// no unit we read is the kelvin, so nothing else can be meant.
    /// </summary>
    public static int? Exponent(char letter) => letter switch
    {
        'f' => -15,
        'p' => -12,
        'n' => -9,
        'u' or Micro or '\u03BC' => -6,
        'm' => -3,
        'k' or 'K' => 3,
        'M' => 6,
        'G' => 9,
        'T' => 12,
        _ => null,
    };

    /// <summary>The prefix letter we write for a power of ten that is a multiple of 3 in [−15, 12].</summary>
    public static string Symbol(int exponent) => exponent switch
    {
        -15 => "f",
        -12 => "p",
        -9 => "n",
        -6 => Micro.ToString(),
        -3 => "m",
        0 => "",
        3 => "k",
        6 => "M",
        9 => "G",
        12 => "T",
        _ => throw new ArgumentOutOfRangeException(nameof(exponent), exponent, "No SI prefix for this power of ten."),
    };

    /// <summary>Smallest and largest power of ten that <see cref="Symbol"/> writes.</summary>
    public const int MinExponent = -15, MaxExponent = 12;
}
