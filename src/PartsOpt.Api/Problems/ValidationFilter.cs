namespace PartsOpt.Api.Problems;

/// <summary>Runs a validator over an endpoint's body and answers 400 ValidationProblem before the handler.</summary>
public static class ValidationFilter
{
    /// <summary>Validates the endpoint's <typeparamref name="T"/> argument with <paramref name="validate"/>.</summary>
    public static RouteHandlerBuilder Validate<T>(this RouteHandlerBuilder builder,
        Func<T, Dictionary<string, string[]>> validate) where T : class =>
        builder.AddEndpointFilter(async (context, next) =>
        {
            var argument = context.Arguments.OfType<T>().FirstOrDefault();
            if (argument is not null && validate(argument) is { Count: > 0 } errors)
                return TypedResults.ValidationProblem(errors);
            return await next(context);
        })
        .ProducesValidationProblem();
}
