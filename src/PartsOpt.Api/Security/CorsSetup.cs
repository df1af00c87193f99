namespace PartsOpt.Api.Security;

/// <summary>
/// Cross-origin calls from browsers are closed unless <c>Cors:AllowedOrigins</c> lists origins
/// (e.g. <c>Cors__AllowedOrigins__0=https://plm.example.com</c>). Listed origins may send the key, JSON,
/// CSV and an Idempotency-Key; no cookies are involved (keys travel in the Authorization header).
/// </summary>
public static class CorsSetup
{
    public const string OriginsKey = "Cors:AllowedOrigins";

    public static IServiceCollection AddConfiguredCors(this IServiceCollection services)
    {
        services.AddCors();
        services.AddOptions<Microsoft.AspNetCore.Cors.Infrastructure.CorsOptions>()
            .Configure<IConfiguration>((options, configuration) =>
            {
                var origins = configuration.GetSection(OriginsKey).Get<string[]>() ?? [];
                options.AddDefaultPolicy(policy => policy
                    .WithOrigins(origins.Where(o => o.Length > 0).ToArray())
                    .WithMethods("GET", "POST", "PUT", "DELETE")
                    .WithHeaders("Authorization", "Content-Type", Idempotency.Header)
                    .WithExposedHeaders("Location", "Retry-After", Idempotency.ReplayedHeader));
            });
        return services;
    }
}
