namespace PartsOpt.Api.Security;

/// <summary>
/// Headers on every response: no MIME sniffing, no framing, no referrer, a Content-Security-Policy that
/// allows nothing for the API (it serves JSON and CSV, never pages) and what the Swagger UI page needs
/// (its own scripts; its own and inline styles, as the UI sets styles from script; data: images), and no caching of API answers.
/// </summary>
public static class SecurityHeaders
{
    public const string ApiPolicy = "default-src 'none'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'";
    public const string UiPolicy = "default-src 'self'; script-src 'self'; style-src 'self' 'unsafe-inline'; " +
        "img-src 'self' data:; connect-src 'self'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'";
    private const string UiPath = "/swagger";

    public static IApplicationBuilder UseSecurityHeaders(this IApplicationBuilder app) =>
        app.Use(async (context, next) =>
        {
            context.Response.OnStarting(() =>
            {
                var headers = context.Response.Headers;
                var ui = context.Request.Path.StartsWithSegments(UiPath, StringComparison.OrdinalIgnoreCase);
                headers.XContentTypeOptions = "nosniff";
                headers.XFrameOptions = "DENY";
                headers["Referrer-Policy"] = "no-referrer";
                headers.ContentSecurityPolicy = ui ? UiPolicy : ApiPolicy;
                if (!ui)
                    headers.CacheControl = "no-store";
                return Task.CompletedTask;
            });
            await next(context);
        });
}
