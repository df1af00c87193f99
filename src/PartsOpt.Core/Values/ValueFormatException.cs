namespace PartsOpt.Values;

/// <summary>
/// Text that does not read as a value of the expected quantity. The message names the text and says
/// what was expected, so it can go to a person unchanged.
/// </summary>
public sealed class ValueFormatException : FormatException
{
    /// <summary>Creates the exception for a text that could not be read as <paramref name="quantity"/>.</summary>
    /// <param name="text">The text as given (null is reported as empty).</param>
    /// <param name="quantity">The quantity that was expected.</param>
    /// <param name="reason">What was wrong with it, in a few words.</param>
    public ValueFormatException(string? text, Quantity quantity, string reason)
        : base(Describe(text, quantity, reason))
    {
        Text = text ?? "";
        Quantity = quantity;
    }

    /// <summary>Creates the exception with a message of the caller's own.</summary>
    public ValueFormatException() : this("", Quantity.Ratio, "no value was given") { }

    /// <summary>Creates the exception with a message of the caller's own.</summary>
    public ValueFormatException(string message) : base(message) => Text = "";

    /// <summary>Creates the exception with a message of the caller's own and the error behind it.</summary>
    public ValueFormatException(string message, Exception innerException) : base(message, innerException) => Text = "";

    /// <summary>The text that could not be read.</summary>
    public string Text { get; }

    /// <summary>The quantity the text was expected to hold.</summary>
    public Quantity Quantity { get; }

    private static string Describe(string? text, Quantity quantity, string reason)
    {
        var unit = QuantityUnit.Of(quantity);
        var example = quantity switch
        {
            Quantity.Resistance => "4.7k, 4.7 kΩ, 4700 or the RKM code 4K7",
            Quantity.Capacitance => "100n, 100 nF, 1e-7 or the RKM code 4n7",
            Quantity.Ratio => "0.5 or 50 %",
            _ => $"1.5 m{unit.Symbol}, 1.5e-3 or 1500 µ{unit.Symbol}",
        };
        return $"'{text}' is not a {unit.Noun} value: {reason}. Expected a number with an optional SI prefix " +
               $"(f p n µ m k M G T){(unit.Symbol.Length > 0 ? $" and unit {unit.Symbol}" : "")}, e.g. {example}.";
    }
}
