namespace PartsOpt.Api.Movements;

/// <summary>
/// Who a change is booked to: the NAME of the API key that made the request (the authenticated principal's
/// name). An <c>X-Actor</c> header is ignored: a caller cannot book a change to someone else. "anonymous"
/// only where no key was needed, which no write allows.
/// </summary>
public static class Actor
{
    public const string Anonymous = "anonymous";

    public static string Of(HttpContext context) =>
        context.User.Identity is { IsAuthenticated: true, Name: { Length: > 0 } name } ? name : Anonymous;
}
