using PartsOpt.Api.Parts;

namespace PartsOpt.Api.Builds;

/// <summary>What a build request must satisfy, and the wire names of the states.</summary>
public static class BuildRules
{
    public const int MaxQuantity = 100_000;
    public const int ReferenceMaxLength = 100;
    public const int NoteMaxLength = 500;

    public static readonly IReadOnlyList<string> StatusNames = ["reserved", "completed", "cancelled"];

    public static string StatusName(BuildStatus status) => StatusNames[(int)status];

    public static bool TryParseStatus(string? text, out BuildStatus status)
    {
        var index = StatusNames.ToList().FindIndex(n => string.Equals(n, text?.Trim(), StringComparison.OrdinalIgnoreCase));
        status = index < 0 ? default : (BuildStatus)index;
        return index >= 0;
    }

    internal static Dictionary<string, string[]> Validate(BuildInput input)
    {
        var errors = new ErrorList();
        if (input.DesignId is null)
            errors.Add("designId", "Required: the id of a stored design.");
        else if (input.DesignId < 1)
            errors.Add("designId", "Design ids count from 1.");
        errors.AddIf("quantity", QuantityProblem(input.Quantity, required: true));
        if (string.IsNullOrWhiteSpace(input.Reference))
            errors.Add("reference", "Required: the work order or ticket this build is for.");
        else if (input.Reference.Trim().Length > ReferenceMaxLength)
            errors.Add("reference", $"At most {ReferenceMaxLength} characters.");
        else if (input.Reference.Any(char.IsControl))
            errors.Add("reference", "Printable characters only.");
        errors.Text("note", input.Note, NoteMaxLength);
        return errors.ToDictionary();
    }

    /// <summary>Why a board count is refused, or null: whole boards, 1 to <see cref="MaxQuantity"/>.</summary>
    public static string? QuantityProblem(int? quantity, bool required) => quantity switch
    {
        null => required ? "Required: how many boards." : null,
        < 1 => "At least 1 board.",
        > MaxQuantity => $"At most {MaxQuantity} boards in one build.",
        _ => null,
    };
}
