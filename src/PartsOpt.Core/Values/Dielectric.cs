using PartsOpt.Analysis;

namespace PartsOpt.Values;

/// <summary>Capacitor dielectrics a stockroom holds, by their temperature characteristic.</summary>
public enum Dielectric
{
    /// <summary>Class-1 ceramic, EIA-198 C0G (also called NP0): 0 ± 30 ppm/K.</summary>
    C0G,
    /// <summary>Class-2 ceramic, EIA-198 X7R: ±15 % over −55…+125 °C.</summary>
    X7R,
    /// <summary>Class-2 ceramic, EIA-198 X5R: ±15 % over −55…+85 °C.</summary>
    X5R,
    /// <summary>Class-2 ceramic, EIA-198 Y5V: +22/−82 % over −30…+85 °C.</summary>
    Y5V,
    /// <summary>Class-2 ceramic, EIA-198 Z5U: +22/−56 % over +10…+85 °C.</summary>
    Z5U,
    /// <summary>Polypropylene or polyester film; a linear coefficient is stored with the part.</summary>
    Film,
    /// <summary>Aluminium or tantalum electrolytic: polarised, loose, unsuited to timing.</summary>
    Electrolytic,
}

/// <summary>Temperature behaviour of each dielectric, from EIA-198 where the standard defines it.</summary>
public static class DielectricCharacteristics
{
    /// <summary>
    /// The temperature behaviour of a dielectric. Film and electrolytic parts take a linear coefficient
    /// from their data (<paramref name="filmPpmPerK"/>): polypropylene is about −200 ppm/K and polyester
    /// about +400 ppm/K (common practice, from memory).
    /// </summary>
    public static TemperatureBehaviour For(Dielectric dielectric, double filmPpmPerK = 200) => dielectric switch
    {
        Dielectric.C0G => TemperatureBehaviour.Linear(30, "EIA-198 C0G (0 ± 30 ppm/K)"),
        Dielectric.X7R => new(0, 0.15, 0.15, -55, 125, "EIA-198 X7R (±15 %, −55…+125 °C)"),
        Dielectric.X5R => new(0, 0.15, 0.15, -55, 85, "EIA-198 X5R (±15 %, −55…+85 °C)"),
        Dielectric.Y5V => new(0, 0.82, 0.22, -30, 85, "EIA-198 Y5V (+22/−82 %, −30…+85 °C)"),
        Dielectric.Z5U => new(0, 0.56, 0.22, 10, 85, "EIA-198 Z5U (+22/−56 %, +10…+85 °C)"),
        Dielectric.Film => TemperatureBehaviour.Linear(filmPpmPerK, "film (coefficient from the part's data)"),
        Dielectric.Electrolytic => new(0, 0.20, 0.20, -40, 85, "electrolytic (typical, common practice)"),
        _ => throw new ArgumentOutOfRangeException(nameof(dielectric), dielectric, "Unknown dielectric."),
    };

    /// <summary>True for dielectrics that hold their value well enough for timing (C0G and film).</summary>
    public static bool SuitsTiming(Dielectric dielectric) => dielectric is Dielectric.C0G or Dielectric.Film;

    /// <summary>True for polarised dielectrics, which a timing capacitor seeing both polarities must not use.</summary>
    public static bool IsPolarised(Dielectric dielectric) => dielectric is Dielectric.Electrolytic;
}
