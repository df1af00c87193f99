using Microsoft.EntityFrameworkCore;
using PartsOpt.Api.Parts;
using PartsOpt.Api.Persistence;
using PartsOpt.Search;
using PartsOpt.Topologies;

namespace PartsOpt.Api.DesignSearches;

/// <summary>A stocked part with its ledger figures at the moment the stock was read.</summary>
public sealed record StockedPart(Part Part, int OnHand, int Available);

/// <summary>
/// The stock a search runs on: every part with something available (on hand less reserved, both sums over
/// the ledger), turned into the library's <see cref="Stock"/> through <see cref="PartEngineering"/>.
/// </summary>
public sealed class Stockroom
{
    private Stockroom(Stock stock, IReadOnlyDictionary<string, StockedPart> parts, IReadOnlyList<string> notes)
    {
        Stock = stock;
        Parts = parts;
        Notes = notes;
    }

    public Stock Stock { get; }

    /// <summary>The parts read, by part number (case-insensitive, as the Parts table compares them).</summary>
    public IReadOnlyDictionary<string, StockedPart> Parts { get; }

    /// <summary>Parts left out of the search and why.</summary>
    public IReadOnlyList<string> Notes { get; }

    public static async Task<Stockroom> ReadAsync(PartsOptDbContext db, CancellationToken ct)
    {
        var rows = await db.Parts.AsNoTracking()
            .Select(p => new
            {
                Part = p,
                OnHand = p.Movements.Sum(m => m.OnHandChange),
                Reserved = p.Movements.Sum(m => m.ReservedChange),
            })
            .Where(r => r.OnHand - r.Reserved > 0)
            .OrderBy(r => r.Part.PartNumber)
            .ToListAsync(ct);

        return From(rows.Select(r => new StockedPart(r.Part, r.OnHand, r.OnHand - r.Reserved)));
    }

    /// <summary>
    /// The stock of parts already read with their ledger figures (no database): what the search sees. Parts
    /// with nothing available are skipped; op-amps whose limits cannot be analysed are left out with a note.
    /// </summary>
    public static Stockroom From(IEnumerable<StockedPart> stocked)
    {
        ArgumentNullException.ThrowIfNull(stocked);
        var parts = new Dictionary<string, StockedPart>(StringComparer.OrdinalIgnoreCase);
        var passives = new List<StockPart>();
        var opAmps = new List<StockOpAmp>();
        var notes = new List<string>();
        foreach (var row in stocked)
        {
            if (row.Available <= 0)
                continue;
            var part = row.Part;
            var available = row.Available;
            parts[part.PartNumber] = row;
            if (part.Kind == PartKind.OpAmp)
            {
                var spec = PartEngineering.ToOpAmpSpec(part);
                try
                {
                    spec.Validate("opAmp");
                    opAmps.Add(new StockOpAmp(part.PartNumber, spec, part.UnitCost, available));
                }
                catch (DesignValidationException missing)
                {
                    // A row imported without, say, its slew rate cannot be analysed; say so rather than guess.
                    notes.Add($"{part.PartNumber} left out of the search: {missing.Message}");
                }
                continue;
            }
            var role = PartEngineering.ToRolePart(part);
            passives.Add(new StockPart(part.PartNumber, KindOf(part.Kind), role.Value,
                Math.Max(role.ToleranceMinus, role.TolerancePlus), part.UnitCost, available)
            {
                TempcoPpmPerK = part.Kind == PartKind.Capacitor ? null : part.TempcoPpmPerK ?? PartEngineering.DefaultResistorPpmPerK,
                Dielectric = part.Dielectric,
                PowerRatingW = part.PowerRatingW,
                VoltageRatingV = part.VoltageRatingV,
            });
        }
        var currencies = parts.Values.Select(p => p.Part.Currency).Distinct(StringComparer.Ordinal).Order(StringComparer.Ordinal).ToList();
        if (currencies.Count > 1)
            notes.Add($"The stock is priced in {string.Join(", ", currencies)}: costs add unit costs as they stand, without conversion.");
        return new Stockroom(new Stock(passives, opAmps), parts, notes);
    }

    private static RoleKind KindOf(PartKind kind) => kind switch
    {
        PartKind.Capacitor => RoleKind.Capacitor,
        PartKind.Potentiometer => RoleKind.Potentiometer,
        _ => RoleKind.Resistor,
    };
}
