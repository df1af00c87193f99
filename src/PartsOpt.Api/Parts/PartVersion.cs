using System.Globalization;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Diagnostics;
using Microsoft.Net.Http.Headers;

namespace PartsOpt.Api.Parts;

/// <summary>
/// Optimistic concurrency on a part's fields. <see cref="Part.Version"/> is a concurrency token that every
/// saved change of a part's row raises (PUT, CSV import); the ETag is the row's id and version, so a part
/// deleted and created again under the same number does not match an old tag. Stock figures are not part of
/// it: they move through the ledger, and a PUT never touches them, so a receipt does not make an edit stale.
/// </summary>
public static class PartVersion
{
    /// <summary>The strong ETag of a part's current fields, e.g. <c>"12-3"</c>.</summary>
    public static string ETagOf(Part part) =>
        string.Create(CultureInfo.InvariantCulture, $"\"{part.Id}-{part.Version}\"");

    /// <summary>
    /// Whether an If-Match header allows a change of <paramref name="part"/>: true when absent (a PUT without
    /// it replaces the fields, last writer wins), for <c>*</c>, or when one of its tags is the part's ETag by
    /// strong comparison (RFC 9110 §13.1.1: a weak tag never matches); null when the header cannot be read.
    /// </summary>
    public static bool? Allows(HttpRequest request, Part part)
    {
        var header = request.Headers.IfMatch;
        if (header.Count == 0)
            return true;
        if (!EntityTagHeaderValue.TryParseList(header, out var tags) || tags.Count == 0)
            return null;
        var current = new EntityTagHeaderValue(ETagOf(part));
        return tags.Any(tag => tag.Equals(EntityTagHeaderValue.Any) || tag.Compare(current, useStrongComparison: true));
    }
}

/// <summary>Raises <see cref="Part.Version"/> on every part row a SaveChanges updates.</summary>
internal sealed class PartVersionInterceptor : SaveChangesInterceptor
{
    public override InterceptionResult<int> SavingChanges(DbContextEventData eventData, InterceptionResult<int> result)
    {
        Stamp(eventData.Context);
        return result;
    }

    public override ValueTask<InterceptionResult<int>> SavingChangesAsync(DbContextEventData eventData,
        InterceptionResult<int> result, CancellationToken cancellationToken = default)
    {
        Stamp(eventData.Context);
        return ValueTask.FromResult(result);
    }

    private static void Stamp(DbContext? context)
    {
        if (context is null)
            return;
        context.ChangeTracker.DetectChanges();
        foreach (var entry in context.ChangeTracker.Entries<Part>().Where(e => e.State == EntityState.Modified))
            entry.Property(p => p.Version).CurrentValue = entry.Property(p => p.Version).OriginalValue + 1;
    }
}
