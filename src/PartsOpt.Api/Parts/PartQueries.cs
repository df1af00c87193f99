using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.EntityFrameworkCore;
using PartsOpt.Api.Common;
using PartsOpt.Api.Persistence;
using PartsOpt.Values;

namespace PartsOpt.Api.Parts;

/// <summary>GET /api/v1/parts: filter, order by part number, page; stock figures summed from the ledger.</summary>
public static class PartQueries
{
    /// <param name="kind">resistor, capacitor, potentiometer or op-amp.</param>
    /// <param name="min">Lowest main value, SI or with a prefix/RKM code ("1k", "4k7", "100n"); needs a kind.</param>
    /// <param name="max">Highest main value, as <paramref name="min"/>.</param>
    /// <param name="q">Text contained in the part number or description (case-insensitive).</param>
    /// <param name="page">1-based page number.</param>
    /// <param name="pageSize">Items per page, 1 to 200 (default 50).</param>
    /// <param name="db">The database.</param>
    /// <param name="ct">Cancellation.</param>
    public static async Task<Results<Ok<PagedList<PartDto>>, ValidationProblem>> List(
        string? kind, string? min, string? max, string? q, int? page, int? pageSize,
        PartsOptDbContext db, CancellationToken ct)
    {
        var errors = new ErrorList();
        PartKind? kindFilter = null;
        if (kind is not null)
        {
            if (PartKinds.TryParse(kind, out var k))
                kindFilter = k;
            else
                errors.Add("kind", $"Unknown kind '{kind}': expected one of {PartKinds.Expected}.");
        }
        var minValue = RangeEnd("min", min, kindFilter, errors);
        var maxValue = RangeEnd("max", max, kindFilter, errors);
        Paging.Check(errors, page, pageSize);
        if (errors.ToDictionary() is { Count: > 0 } problems)
            return TypedResults.ValidationProblem(problems);

        var query = db.Parts.AsNoTracking();
        if (kindFilter is { } kf)
        {
            query = query.Where(p => p.Kind == kf);
            query = kf switch
            {
                PartKind.Capacitor => query
                    .Where(p => minValue == null || p.CapacitanceF >= minValue)
                    .Where(p => maxValue == null || p.CapacitanceF <= maxValue),
                PartKind.OpAmp => query
                    .Where(p => minValue == null || p.GainBandwidthHz >= minValue)
                    .Where(p => maxValue == null || p.GainBandwidthHz <= maxValue),
                _ => query
                    .Where(p => minValue == null || p.ResistanceOhms >= minValue)
                    .Where(p => maxValue == null || p.ResistanceOhms <= maxValue),
            };
        }
        if (!string.IsNullOrWhiteSpace(q))
        {
            // LIKE is case-insensitive for ASCII in SQLite; escape its wildcards in the user's text.
            var pattern = "%" + q.Trim().Replace("\\", "\\\\", StringComparison.Ordinal)
                .Replace("%", "\\%", StringComparison.Ordinal).Replace("_", "\\_", StringComparison.Ordinal) + "%";
            query = query.Where(p => EF.Functions.Like(p.PartNumber, pattern, "\\")
                || EF.Functions.Like(p.Description, pattern, "\\"));
        }

        var size = pageSize ?? Paging.DefaultSize;
        var number = page ?? 1;
        var total = await query.CountAsync(ct);
        var rows = await query.OrderBy(p => p.PartNumber)
            .Skip((number - 1) * size).Take(size)
            .Select(p => new
            {
                Part = p,
                OnHand = p.Movements.Sum(m => m.OnHandChange),
                Reserved = p.Movements.Sum(m => m.ReservedChange),
            })
            .ToListAsync(ct);
        var items = rows.Select(r => r.Part.ToDto(r.OnHand, r.Reserved)).ToList();
        return TypedResults.Ok(new PagedList<PartDto>(items, number, size, total));
    }

    /// <summary>The quantity a kind's main value is: resistance, capacitance, or an op-amp's gain-bandwidth.</summary>
    public static Quantity MainQuantity(PartKind kind) => kind switch
    {
        PartKind.Capacitor => Quantity.Capacitance,
        PartKind.OpAmp => Quantity.Frequency,
        _ => Quantity.Resistance,
    };

    private static double? RangeEnd(string name, string? text, PartKind? kind, ErrorList errors)
    {
        if (string.IsNullOrWhiteSpace(text))
            return null;
        if (kind is null)
        {
            errors.Add(name, "A value range needs a kind (the unit depends on it).");
            return null;
        }
        if (EngineeringValue.TryParse(text, MainQuantity(kind.Value), out var value) && double.IsFinite(value))
            return value;
        errors.Add(name, $"'{text}' is not a {MainQuantity(kind.Value).ToString().ToLowerInvariant()} value.");
        return null;
    }
}
