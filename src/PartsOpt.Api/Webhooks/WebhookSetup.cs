namespace PartsOpt.Api.Webhooks;

/// <summary>Registers the delivery worker, its settings ("Webhooks") and its HTTP client.</summary>
public static class WebhookSetup
{
    public static IServiceCollection AddWebhooks(this IServiceCollection services)
    {
        services.AddOptions<WebhookOptions>().BindConfiguration(WebhookOptions.Section);
        services.AddSingleton<OutboxSignal>();
        services.AddSingleton<Microsoft.EntityFrameworkCore.Diagnostics.IInterceptor, OutboxCommitInterceptor>();
        // No redirects: a receiver's URL is the one that was subscribed, a 3xx is a failure to look into.
        services.AddHttpClient(DeliveryWorker.ClientName)
            .ConfigurePrimaryHttpMessageHandler(() => new SocketsHttpHandler { AllowAutoRedirect = false })
            .ConfigureHttpClient(client => client.Timeout = Timeout.InfiniteTimeSpan); // the worker's own limit applies
        services.AddHostedService<DeliveryWorker>();
        return services;
    }
}
