using System.Collections.Concurrent;
using Microsoft.Extensions.Logging;

namespace PartsOpt.Api.Tests.Security;

/// <summary>Every log line the service writes, formatted, for tests that check what the log does not hold.</summary>
internal sealed class CapturedLog : ILoggerProvider
{
    private readonly ConcurrentQueue<string> _lines = new();

    public IReadOnlyCollection<string> Lines => _lines;

    public ILogger CreateLogger(string categoryName) => new Writer(this, categoryName);

    public void Dispose()
    {
    }

    private sealed class Writer(CapturedLog log, string category) : ILogger
    {
        public IDisposable? BeginScope<TState>(TState state) where TState : notnull => null;

        public bool IsEnabled(LogLevel logLevel) => true;

        public void Log<TState>(LogLevel logLevel, EventId eventId, TState state, Exception? exception,
            Func<TState, Exception?, string> formatter) =>
            log._lines.Enqueue($"{category}: {formatter(state, exception)} {exception}");
    }
}
