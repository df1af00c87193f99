using System.Net;
using System.Net.Http.Json;
using System.Text;
using System.Text.Json;
using PartsOpt.Api.Parts;

namespace PartsOpt.Api.Tests;

/// <summary>Small helpers the tests share: JSON bodies of parts, and reading responses.</summary>
internal static class Api
{
    public static readonly JsonSerializerOptions Json = new(JsonSerializerDefaults.Web);

    public static object Resistor(string partNumber, double ohms, double tolerance = 0.01, int? initialQuantity = null) => new
    {
        partNumber,
        kind = "resistor",
        description = "test resistor",
        package = "0603",
        unitCost = 0.01m,
        currency = "EUR",
        reorderLevel = 10,
        initialQuantity,
        resistor = new { resistanceOhms = ohms, toleranceMinus = tolerance, tolerancePlus = tolerance, tempcoPpmPerK = 100.0, powerRatingW = 0.1 },
    };

    public static object Capacitor(string partNumber, double farads, int? initialQuantity = null) => new
    {
        partNumber,
        kind = "capacitor",
        initialQuantity,
        capacitor = new { capacitanceF = farads, toleranceMinus = 0.05, tolerancePlus = 0.05, dielectric = "C0G", voltageRatingV = 50.0, polarised = false },
    };

    public static async Task<HttpResponseMessage> PostJson(this HttpClient client, string url, string json) =>
        await client.PostAsync(url, new StringContent(json, Encoding.UTF8, "application/json"));

    public static async Task<HttpResponseMessage> PostCsv(this HttpClient client, string url, string csv) =>
        await client.PostAsync(url, new StringContent(csv, Encoding.UTF8, "text/csv"));

    public static async Task<PartDto> CreatePart(this HttpClient client, object part)
    {
        var response = await client.PostAsJsonAsync("/api/v1/parts", part);
        Assert.Equal(HttpStatusCode.Created, response.StatusCode);
        return (await response.Content.ReadFromJsonAsync<PartDto>(Json))!;
    }

    public static async Task<PartDto> GetPart(this HttpClient client, string partNumber) =>
        (await client.GetFromJsonAsync<PartDto>($"/api/v1/parts/{partNumber}", Json))!;

    public static async Task<byte[]> Export(this HttpClient client)
    {
        var response = await client.GetAsync("/api/v1/parts/export");
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        return await response.Content.ReadAsByteArrayAsync();
    }

    /// <summary>
    /// Asserts an RFC 9457 problem: media type application/problem+json (RFC 9457 section 3) and the
    /// members "type", "title" and "status" (section 3.1), status equal to the HTTP status. Returns the body.
    /// </summary>
    public static async Task<JsonElement> AssertProblem(this HttpResponseMessage response, HttpStatusCode status)
    {
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(status == response.StatusCode, $"expected {(int)status}, got {(int)response.StatusCode}: {text}");
        Assert.Equal("application/problem+json", response.Content.Headers.ContentType?.MediaType);
        var problem = JsonDocument.Parse(text).RootElement;
        Assert.Equal((int)status, problem.GetProperty("status").GetInt32());
        Assert.False(string.IsNullOrEmpty(problem.GetProperty("title").GetString()));
        Assert.False(string.IsNullOrEmpty(problem.GetProperty("type").GetString()));
        return problem;
    }

    /// <summary>The validation messages for one field, asserting the field is named.</summary>
    public static string[] ErrorsFor(this JsonElement problem, string field)
    {
        var errors = problem.GetProperty("errors");
        Assert.True(errors.TryGetProperty(field, out var messages),
            $"expected an error for '{field}', got: {errors}");
        return messages.EnumerateArray().Select(m => m.GetString()!).ToArray();
    }
}
