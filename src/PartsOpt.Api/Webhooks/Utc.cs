using Microsoft.EntityFrameworkCore.Storage.ValueConversion;

namespace PartsOpt.Api.Webhooks;

/// <summary>SQLite keeps no time zone: every time written is UTC, so every time read is marked UTC.</summary>
internal static class Utc
{
    public static readonly ValueConverter<DateTime, DateTime> Converter =
        new(v => v, v => DateTime.SpecifyKind(v, DateTimeKind.Utc));
}
