using System.Text.Json;
using Microsoft.AspNetCore.Diagnostics;
using Microsoft.AspNetCore.Mvc;
using PartsOpt.Topologies;

namespace PartsOpt.Api.Problems;

/// <summary>
/// The one exception handler: turns what a client can cause into RFC 9457 problem details. Malformed JSON,
/// a wrong type, an empty body (BadHttpRequestException from minimal-API binding), and values the library
/// cannot parse (its ValueFormatException is a FormatException) become 400s naming the field where known.
/// Anything else is a fault of ours, left to the framework's 500.
/// </summary>
internal sealed class ProblemExceptionHandler(IProblemDetailsService problems) : IExceptionHandler
{
    public async ValueTask<bool> TryHandleAsync(HttpContext context, Exception exception, CancellationToken ct)
    {
        var problem = exception switch
        {
            BadHttpRequestException { InnerException: JsonException json } bad => FromJson(bad, json),
            BadHttpRequestException bad => new ProblemDetails
            {
                Status = bad.StatusCode,
                Title = "The request could not be read.",
                // Binding says "Implicit body inferred for parameter ... but no body was provided": say it plainly.
                Detail = bad.Message.Contains("no body was provided", StringComparison.Ordinal)
                    ? "This request needs a JSON body." : bad.Message,
            },
            // The library's own check of a whole design (a role missing, a supply outside the part's range)
            // names the field the way the request spells it.
            DesignValidationException design => new HttpValidationProblemDetails(
                new Dictionary<string, string[]> { [design.Field] = [design.Message] })
            {
                Status = StatusCodes.Status400BadRequest,
                Title = "The design cannot be analysed.",
                Detail = design.Message,
            },
            FormatException format => new ProblemDetails
            {
                Status = StatusCodes.Status400BadRequest,
                Title = "A value could not be read.",
                Detail = format.Message,
            },
            _ => null,
        };
        if (problem is null)
            return false;

        context.Response.StatusCode = problem.Status!.Value;
        return await problems.TryWriteAsync(new ProblemDetailsContext
        {
            HttpContext = context,
            ProblemDetails = problem,
            Exception = exception,
        });
    }

    private static HttpValidationProblemDetails FromJson(BadHttpRequestException bad, JsonException json)
    {
        var where = json.LineNumber is { } line ? $" (line {line + 1}, byte {json.BytePositionInLine + 1})" : "";
        // System.Text.Json says "could not be converted" when the JSON is well formed but a value has the
        // wrong type for its field; anything else is broken JSON, a fault of the whole body ("$").
        var wrongType = json.Message.StartsWith("The JSON value could not be converted", StringComparison.Ordinal);
        var field = wrongType && json.Path is { Length: > 2 } path && path.StartsWith("$.", StringComparison.Ordinal)
            ? path[2..] // "$.resistor.resistanceOhms" -> "resistor.resistanceOhms"
            : "$";
        var message = wrongType
            ? $"The value could not be read as this field's type{where}."
            : $"The body is not valid JSON{where}.";
        return new HttpValidationProblemDetails(new Dictionary<string, string[]> { [field] = [message] })
        {
            Status = bad.StatusCode,
            Title = "The request body could not be read.",
            Detail = message,
        };
    }
}
