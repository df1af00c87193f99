namespace PartsOpt.Api.Webhooks;

/// <summary>What a subscription request must satisfy; each problem names its field.</summary>
public static class WebhookRules
{
    public const int UrlMaxLength = 2000;
    public const int DescriptionMaxLength = 200;

    public static Dictionary<string, string[]> Validate(SubscriptionInput input)
    {
        var errors = new Dictionary<string, string[]>();
        if (UrlProblem(input.Url) is { } url)
            errors["url"] = [url];
        if (EventsProblem(input.Events) is { } events)
            errors["events"] = [events];
        if (input.Description is { Length: > DescriptionMaxLength })
            errors["description"] = [$"At most {DescriptionMaxLength} characters."];
        return errors;
    }

    private static string? UrlProblem(string? text)
    {
        if (string.IsNullOrWhiteSpace(text))
            return "A URL to deliver to is required.";
        if (text.Length > UrlMaxLength)
            return $"At most {UrlMaxLength} characters.";
        if (!Uri.TryCreate(text.Trim(), UriKind.Absolute, out var uri) || uri.Scheme is not ("http" or "https"))
            return "An absolute http or https URL is required.";
        // Credentials in a URL end up in logs and listings; the signature is how a receiver trusts us.
        if (uri.UserInfo.Length > 0)
            return "The URL may not carry a user name or password.";
        return null;
    }

    private static string? EventsProblem(IReadOnlyList<string>? events)
    {
        if (events is null || events.Count == 0)
            return $"Name at least one event type ({string.Join(", ", EventTypes.All)}) or [\"*\"] for all.";
        if (events.Contains(EventTypes.Wildcard))
            return events.Count == 1 ? null : "\"*\" already means every type; send it alone.";
        var unknown = events.Where(e => !EventTypes.IsKnown(e)).ToList();
        return unknown.Count == 0 ? null
            : $"Unknown event type(s): {string.Join(", ", unknown)}. Known: {string.Join(", ", EventTypes.All)}.";
    }

    /// <summary>The stored form: "*" or the distinct types in the order of <see cref="EventTypes.All"/>.</summary>
    public static string EventsColumn(IReadOnlyList<string> events) =>
        events.Contains(EventTypes.Wildcard)
            ? EventTypes.Wildcard
            : string.Join(' ', EventTypes.All.Where(events.Contains));
}
