namespace PartsOpt.Topologies;

/// <summary>
/// A circuit design that cannot be analysed at all: a missing or unknown role, a value that is not a
/// positive finite number, a supply outside the op-amp's rated range. A design that can be analysed but
/// does not work (an oscillator that cannot switch) is not an exception: it comes back as a failed
/// <see cref="CircuitCheck"/>.
/// </summary>
public sealed class DesignValidationException : Exception
{
    /// <summary>Creates the exception for one offending field.</summary>
    /// <param name="field">The input field at fault, as the API names it: "roles.osc.r", "supply.positive".</param>
    /// <param name="message">What is wrong, in plain words.</param>
    public DesignValidationException(string field, string message) : base(message) => Field = field;

    /// <summary>Creates the exception without a field (prefer the field-naming constructor).</summary>
    public DesignValidationException() : this("design", "The circuit design is invalid.") { }

    /// <summary>Creates the exception without a field (prefer the field-naming constructor).</summary>
    public DesignValidationException(string message) : this("design", message) { }

    /// <summary>Creates the exception without a field (prefer the field-naming constructor).</summary>
    public DesignValidationException(string message, Exception innerException) : base(message, innerException) =>
        Field = "design";

    /// <summary>The input field at fault, e.g. "roles.osc.r", "supply.positive", "amplifier.slewRateVPerS".</summary>
    public string Field { get; }
}
