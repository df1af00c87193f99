namespace PartsOpt.Api.Parts;

/// <summary>Collects validation messages by field, in the shape ValidationProblem wants.</summary>
internal sealed class ErrorList
{
    private readonly Dictionary<string, List<string>> _errors = [];

    /// <summary>How many fields have a message.</summary>
    public int Count => _errors.Count;

    public void Add(string field, string message)
    {
        if (!_errors.TryGetValue(field, out var list))
            _errors[field] = list = [];
        list.Add(message);
    }

    public void AddIf(string field, string? message)
    {
        if (message is not null)
            Add(field, message);
    }

    public void Text(string field, string? text, int maxLength)
    {
        if (text?.Length > maxLength)
            Add(field, $"At most {maxLength} characters.");
    }

    public void Required<T>(string field, T? value) where T : struct
    {
        if (value is null)
            Add(field, "Required.");
    }

    /// <summary>NaN and ±∞ are never a measurement; missing is an error only when required.</summary>
    public bool Finite(string field, double? value, bool required = false)
    {
        if (value is null)
        {
            if (required)
                Add(field, "Required.");
            return false;
        }
        if (!double.IsFinite(value.Value))
        {
            Add(field, "Must be a finite number (not NaN or infinity).");
            return false;
        }
        return true;
    }

    public void Positive(string field, double? value, bool required)
    {
        if (Finite(field, value, required) && value <= 0)
            Add(field, "Must be greater than zero.");
    }

    public void NonNegative(string field, double? value, bool required)
    {
        if (Finite(field, value, required) && value < 0)
            Add(field, "May not be negative.");
    }

    /// <summary>Fractions in [0, 1) below and [0, 10] above (a +80/−20 % part has plus 0.8); or farads.</summary>
    public void Tolerance(string prefix, double? minus, double? plus, bool absolute)
    {
        foreach (var (name, value, limit) in new[] { ("toleranceMinus", minus, 1.0), ("tolerancePlus", plus, 10.0) })
        {
            var field = $"{prefix}.{name}";
            if (!Finite(field, value, required: true))
                continue;
            if (value < 0)
                Add(field, "May not be negative; give the size of the deviation.");
            else if (!absolute && value >= limit)
                Add(field, $"A fraction (0.05 for 5 %) below {limit}.");
        }
    }

    public Dictionary<string, string[]> ToDictionary() => _errors.ToDictionary(e => e.Key, e => e.Value.ToArray());
}
