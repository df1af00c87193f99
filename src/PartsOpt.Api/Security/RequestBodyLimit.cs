using Microsoft.AspNetCore.Http.Features;
using Microsoft.AspNetCore.Http.Metadata;
using Microsoft.AspNetCore.Mvc;

namespace PartsOpt.Api.Security;

/// <summary>
/// The largest request body, <c>Limits:MaxBodyBytes</c> (default 1 MiB). An endpoint states its own with
/// <see cref="WithBodyLimit{TBuilder}"/> (null: none here, the endpoint bounds its reading itself, as the CSV
/// import does with <c>Import:MaxBytes</c>). A declared length over the limit is refused with 413 before
/// anything is read; on Kestrel the server's limit is set too, so a chunked body is cut off at the same size.
/// </summary>
public static class RequestBodyLimit
{
    public const string MaxBytesKey = "Limits:MaxBodyBytes";
    public const long DefaultMaxBytes = 1024 * 1024;

    private sealed record Limit(long? MaxRequestBodySize) : IRequestSizeLimitMetadata;

    public static TBuilder WithBodyLimit<TBuilder>(this TBuilder builder, long? maxBytes) where TBuilder : IEndpointConventionBuilder
    {
        builder.Add(endpoint => endpoint.Metadata.Add(new Limit(maxBytes)));
        return builder;
    }

    public static IApplicationBuilder UseRequestBodyLimit(this IApplicationBuilder app) =>
        app.Use(async (context, next) =>
        {
            var declared = context.GetEndpoint()?.Metadata.GetMetadata<IRequestSizeLimitMetadata>();
            var limit = declared is null
                ? context.RequestServices.GetRequiredService<IConfiguration>().GetValue(MaxBytesKey, DefaultMaxBytes)
                : declared.MaxRequestBodySize;
            if (context.Features.Get<IHttpMaxRequestBodySizeFeature>() is { IsReadOnly: false } feature)
                feature.MaxRequestBodySize = limit;
            if (limit is { } max && context.Request.ContentLength > max)
            {
                context.Response.StatusCode = StatusCodes.Status413PayloadTooLarge;
                await context.RequestServices.GetRequiredService<IProblemDetailsService>().WriteAsync(new ProblemDetailsContext
                {
                    HttpContext = context,
                    ProblemDetails = new ProblemDetails
                    {
                        Status = StatusCodes.Status413PayloadTooLarge,
                        Type = "https://www.rfc-editor.org/rfc/rfc9110#section-15.5.14",
                        Title = "The request body is too large.",
                        Detail = $"This endpoint takes at most {max} bytes.",
                    },
                });
                return;
            }
            await next(context);
        });
}
