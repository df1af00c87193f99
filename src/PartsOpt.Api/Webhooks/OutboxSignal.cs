using System.Data.Common;
using Microsoft.EntityFrameworkCore.Diagnostics;

namespace PartsOpt.Api.Webhooks;

/// <summary>
/// Wakes the delivery worker before its next poll when a transaction commits, so events go out at once
/// rather than up to a poll interval later. A missed wake costs only latency: the poll still finds the rows.
/// </summary>
public sealed class OutboxSignal : IDisposable
{
    private readonly SemaphoreSlim _wake = new(0, 1);

    public void Wake()
    {
        try
        {
            _wake.Release();
        }
        catch (SemaphoreFullException)
        {
            // Already woken; one pass reads everything committed so far.
        }
    }

    /// <summary>Waits for a wake or the interval, whichever comes first.</summary>
    public Task WaitAsync(TimeSpan interval, CancellationToken ct) => _wake.WaitAsync(interval, ct);

    public void Dispose() => _wake.Dispose();
}

/// <summary>Calls <see cref="OutboxSignal.Wake"/> after every commit of the service's DbContext.</summary>
internal sealed class OutboxCommitInterceptor(OutboxSignal signal) : DbTransactionInterceptor
{
    public override void TransactionCommitted(DbTransaction transaction, TransactionEndEventData eventData) =>
        signal.Wake();

    public override Task TransactionCommittedAsync(DbTransaction transaction, TransactionEndEventData eventData,
        CancellationToken cancellationToken = default)
    {
        signal.Wake();
        return Task.CompletedTask;
    }
}
