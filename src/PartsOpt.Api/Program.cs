using System.Text.Json;
using System.Text.Json.Serialization;
using PartsOpt.Api.Builds;
using PartsOpt.Api.Circuits;
using PartsOpt.Api.DesignSearches;
using Microsoft.OpenApi;
using PartsOpt.Api.Health;
using PartsOpt.Api.Keys;
using PartsOpt.Api.Parts;
using PartsOpt.Api.Persistence;
using PartsOpt.Api.Planning;
using PartsOpt.Api.Problems;
using PartsOpt.Api.Webhooks;
using PartsOpt.Api.Security;

var builder = WebApplication.CreateBuilder(args);

// Loopback port 5080 unless URLs are given (ASPNETCORE_URLS, --urls); a default in appsettings.json
// would override the environment variable, which the container image sets.
if (string.IsNullOrEmpty(builder.Configuration["urls"]))
    builder.WebHost.UseUrls("http://127.0.0.1:5080");

// Errors are RFC 9457 problem details: binding failures are thrown (not answered with a bare 400) so the
// one exception handler can name the field.
builder.Services.AddProblemDetails();
builder.Services.AddExceptionHandler<ProblemExceptionHandler>();
builder.Services.Configure<RouteHandlerOptions>(options => options.ThrowOnBadRequest = true);
builder.Services.ConfigureHttpJsonOptions(options =>
{
    options.SerializerOptions.DefaultIgnoreCondition = JsonIgnoreCondition.WhenWritingNull;
    // The library's enums (check severity, corner method, search status…) travel as camelCase names.
    options.SerializerOptions.Converters.Add(new JsonStringEnumConverter(JsonNamingPolicy.CamelCase));
    options.SerializerOptions.MaxDepth = 32; // no request of ours nests deeper; deeper is refused as bad JSON
});

// Who may do what (docs/security.md): API keys as bearer tokens, a policy per role; limits per key and on
// the solver; security headers; CORS closed unless configured.
builder.Services.AddKeyAuthorization();
builder.Services.AddPartsOptRateLimits();
builder.Services.AddConfiguredCors();

builder.Services.AddPartsOptDatabase();
builder.Services.AddWebhooks();
builder.Services.AddSingleton(TimeProvider.System);
builder.Services.AddEndpointsApiExplorer();
builder.Services.AddSwaggerGen(options =>
{
    options.SwaggerDoc("v1", new OpenApiInfo
    {
        Title = "PartsOpt",
        Version = "v1",
        Description = "Stock of parts, analysis and design of op-amp PWM generators built from the parts on hand. " +
            "The analysis covers the low-voltage control circuit only; the power stage it drives needs its own safety design.",
    });
    options.IncludeXmlComments(Path.Combine(AppContext.BaseDirectory, "PartsOpt.Api.xml"));
    options.IncludeXmlComments(Path.Combine(AppContext.BaseDirectory, "PartsOpt.Core.xml"));
    options.AddSecurityDefinition("bearer", new OpenApiSecurityScheme
    {
        Type = SecuritySchemeType.Http,
        Scheme = "bearer",
        Description = "An API key (po_…) as 'Authorization: Bearer <key>'. Every endpoint but /health needs one.",
    });
    options.AddSecurityRequirement(document => new OpenApiSecurityRequirement
    {
        [new OpenApiSecuritySchemeReference("bearer", document)] = [],
    });
    options.MapType<PartValue>(() => new OpenApiSchema
    {
        Type = JsonSchemaType.Number | JsonSchemaType.String,
        Description = "A value in SI units as a number, or text such as \"4k7\" or \"100n\".",
    });
});

var app = builder.Build();

app.UseSecurityHeaders();
app.UseExceptionHandler();
app.UseStatusCodePages();
app.UseSwagger();
app.UseSwaggerUI();
app.UseRouting();
app.UseCors();
app.UseAuthentication();
app.UseAuthorization();
app.UseRateLimiter();
app.UseRequestBodyLimit();
app.UseIdempotency();

await app.InitialiseDatabaseAsync();
await app.EnsureAdminKeyAsync();

app.MapHealth();
app.MapKeys();
app.MapParts();
app.MapCircuits();
app.MapDesignSearches();
app.MapBuilds();
app.MapStockAlerts();
app.MapStockingPlans();
app.MapWhatIf();
app.MapWebhooks();

await app.RunAsync();

/// <summary>Visible to the integration tests' WebApplicationFactory.</summary>
public partial class Program;
