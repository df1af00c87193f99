namespace PartsOpt.Api.Movements;

/// <summary>
/// Who a ledger row is booked to. Until API keys exist this is the <c>X-Actor</c> header, else "anonymous";
/// this is the one place that decides, so the keys issue changes only this file.
/// </summary>
public static class Actor
{
    public const string Header = "X-Actor";
    public const string Anonymous = "anonymous";
    private const int MaxLength = 100;

    public static string Of(HttpContext context)
    {
        var name = context.Request.Headers[Header].ToString().Trim();
        if (name.Length == 0)
            return Anonymous;
        return name.Length <= MaxLength ? name : name[..MaxLength];
    }
}
