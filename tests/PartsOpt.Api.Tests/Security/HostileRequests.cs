using System.Text;
using System.Text.Json.Nodes;
using PartsOpt.Api.Tests.Circuits;

namespace PartsOpt.Api.Tests.Security;

/// <summary>One generated request: what it is (for the tally), and whether it writes (and so must be refused).</summary>
internal sealed record HostileRequest(string Kind, HttpMethod Method, string Path, byte[]? Body, string? ContentType, bool MustBeRefused);

/// <summary>
/// A seeded generator of hostile requests against every endpoint: broken and truncated JSON, wrong types,
/// out-of-range and non-finite numbers, empty and oversized bodies, hostile CSV, hostile part numbers in
/// paths and queries. Writes are built so that a correct service refuses each of them (an existing part
/// number, a part that does not exist for movements, dry-run imports, a kind that cannot change), so the
/// stock must be unchanged afterwards. (A movement of "+1" as a string is a valid quantity under the
/// web JSON defaults, so movement bodies go to a part that does not exist: validated, then 404.) The same seed gives the same requests.
/// </summary>
internal sealed class HostileRequests(int seed)
{
    /// <summary>Present in the stock the suite sets up.</summary>
    public const string Existing = "R-HOSTILE-1";
    /// <summary>Present with no stock.</summary>
    public const string Empty = "R-HOSTILE-0";
    /// <summary>Absent: a movement body that passes validation still finds no part (404), so no mutation books anything.</summary>
    public const string Absent = "R-HOSTILE-NONE";

    private readonly Random _random = new(seed);

    public static readonly string[] Strings =
    [
        "../../etc/passwd", "..\\..\\windows\\win.ini", "'; DROP TABLE Parts;--", "\" OR 1=1 --", "R\u200F-1", "\u202Eevil\u202C",
        "😀🔥", "e\u0301\u0301\u0301\u0301", "A\0B", "", " ", "=cmd|' /C calc'!A0", "+1", "-1", "@SUM(1)", "NaN", "Infinity",
        "-Infinity", "1e400", "9999999999999999999999", "%00", "<script>alert(1)</script>", "\uFEFF", "\uD800", new string('x', 5000),
    ];

    /// <summary>Raw JSON put where a value belongs: wrong types, huge, non-finite (bare and quoted), negative, zero.</summary>
    private static readonly string[] Values =
    [
        "\"abc\"", "true", "null", "[]", "{}", "[1,2]", "{\"a\":1}", "1e400", "-1e400", "9999999999999999999999", "NaN", "Infinity",
        "-Infinity", "\"NaN\"", "\"Infinity\"", "\"-Infinity\"", "-1", "0", "-0", "1.5", "2147483648", "-2147483649", "1e-400",
        "\"\"", "0x10", "01", "+1", ".5",
    ];

    private static readonly string[] CsvTypes = ["text/csv", "text/csv; charset=utf-8", "text/plain", "application/json"];
    private static readonly string[] JsonTypes = ["application/json", "text/plain", "application/xml"];
    private static readonly string[] MovementIds = ["1", "-1", "0", "9999999999999999999999", "abc"];

    private T Pick<T>(IReadOnlyList<T> items) => items[_random.Next(items.Count)];

    private static JsonObject PartBody(string partNumber) => new()
    {
        ["partNumber"] = partNumber, ["kind"] = "resistor", ["description"] = "hostile", ["package"] = "0603",
        ["unitCost"] = 0.01, ["currency"] = "EUR", ["reorderLevel"] = 10, ["initialQuantity"] = 5,
        ["resistor"] = new JsonObject
        {
            ["resistanceOhms"] = "4k7", ["toleranceMinus"] = 0.01, ["tolerancePlus"] = 0.01, ["tempcoPpmPerK"] = 100, ["powerRatingW"] = 0.1,
        },
    };

    private static JsonObject CapacitorBody(string partNumber) => new()
    {
        ["partNumber"] = partNumber, ["kind"] = "capacitor",
        ["capacitor"] = new JsonObject
        {
            ["capacitanceF"] = "100n", ["toleranceMinus"] = 0.05, ["tolerancePlus"] = 0.05, ["dielectric"] = "C0G", ["voltageRatingV"] = 50,
        },
    };

    public HostileRequest Next()
    {
        var roll = _random.Next(100);
        return roll switch
        {
            < 14 => Json("parts.create", HttpMethod.Post, "/api/v1/parts", PartBody(Existing), true, protectedField: "partNumber"),
            < 22 => Json("parts.update", HttpMethod.Put, $"/api/v1/parts/{Existing}", CapacitorBody(Existing), true, protectedField: "kind"),
            < 34 => Json("movements.post", HttpMethod.Post, $"/api/v1/parts/{Absent}/movements",
                new JsonObject { ["kind"] = "adjustment", ["quantity"] = -5, ["reason"] = "hostile" }, true, protectedField: "kind"),
            < 44 => Json("circuits.evaluate", HttpMethod.Post, "/api/v1/circuits/evaluate", Evaluate(), false, protectedField: null),
            < 56 => Csv(),
            < 74 => PathAttack(),
            < 86 => QueryAttack(),
            < 89 => Json("keys.create", HttpMethod.Post, "/api/v1/keys",
                new JsonObject { ["name"] = Pick(Strings), ["roles"] = new JsonArray(Pick(Strings)) }, true, protectedField: null),
            // A zero frequency tolerance keeps every mutation refused before the solver runs.
            < 92 => Json("design-searches.create", HttpMethod.Post, "/api/v1/design-searches", DesignSearch(), true,
                protectedField: "frequency.tolerance"),
            // An ftp URL keeps every mutation refused: no subscription is ever made.
            < 94 => Json("webhooks.subscribe", HttpMethod.Post, "/api/v1/webhooks", new JsonObject
            {
                ["url"] = "ftp://receiver.invalid/hook", ["events"] = new JsonArray("stock.low"), ["description"] = "hostile",
            }, true, protectedField: "url"),
            < 96 => IdAttack(),
            < 99 => BrokenBody(),
            _ => Huge(),
        };
    }

    private static JsonObject DesignSearch() => new()
    {
        ["supply"] = new JsonObject { ["positive"] = 12, ["negative"] = -12 },
        ["frequency"] = new JsonObject { ["target"] = 1000, ["tolerance"] = 0 },
        ["duty"] = new JsonObject { ["min"] = 0.1, ["max"] = 0.9 },
        ["buildQuantity"] = 10, ["maxResults"] = 1, ["timeLimitSeconds"] = 1,
    };

    /// <summary>Hostile ids on the routes that take a number: design searches, designs, their BOMs, webhooks.</summary>
    private HostileRequest IdAttack()
    {
        var raw = _random.Next(2) == 0 ? Pick(Strings) : Pick(Values).Trim('"');
        var id = Uri.EscapeDataString(raw.Replace("\0", "", StringComparison.Ordinal));
        if (id.Length == 0 || id.Contains("%00", StringComparison.Ordinal))
            id = "%2E%2E";
        return _random.Next(5) switch
        {
            0 => new HostileRequest("id.design-search", HttpMethod.Get, $"/api/v1/design-searches/{id}", null, null, false),
            1 => new HostileRequest("id.design", HttpMethod.Get, $"/api/v1/designs/{id}", null, null, false),
            2 => new HostileRequest("id.bom", HttpMethod.Get, $"/api/v1/designs/{id}/bom.csv", null, null, false),
            3 => new HostileRequest("id.webhook", HttpMethod.Delete, $"/api/v1/webhooks/{id}", null, null, true),
            _ => new HostileRequest("id.deliveries", HttpMethod.Get, $"/api/v1/webhooks/{id}/deliveries", null, null, false),
        };
    }

    private static JsonObject Evaluate()
    {
        var body = CircuitRequests.ThreeStage();
        body["analysis"] = new JsonObject { ["samples"] = 100, ["seed"] = 1, ["waveformPoints"] = 0 };
        return body;
    }

    /// <summary>A body with one value replaced by hostile JSON, or cut short; the protected field keeps the write refused.</summary>
    private HostileRequest Json(string kind, HttpMethod method, string path, JsonObject body, bool write, string? protectedField)
    {
        var leaves = new List<JsonNode>();
        Collect(body, leaves);
        leaves.RemoveAll(l => protectedField is not null && l.GetPath() == "$." + protectedField);
        const string Marker = "\"__hostile__\"";
        string text;
        if (_random.Next(6) == 0)
        {
            var whole = body.ToJsonString();
            text = whole[.._random.Next(whole.Length)]; // truncated
            kind += "/truncated";
        }
        else
        {
            var leaf = Pick(leaves);
            leaf.ReplaceWith(JsonValue.Create("__hostile__"));
            var value = _random.Next(3) == 0 ? System.Text.Json.JsonSerializer.Serialize(Pick(Strings)) : Pick(Values);
            text = body.ToJsonString().Replace(Marker, value, StringComparison.Ordinal);
            kind += "/value";
        }
        return new HostileRequest(kind, method, path, Encoding.UTF8.GetBytes(text), "application/json", write);
    }

    private static void Collect(JsonNode? node, List<JsonNode> leaves)
    {
        switch (node)
        {
            case JsonObject o:
                foreach (var (_, child) in o)
                    Collect(child, leaves);
                break;
            case JsonArray a:
                foreach (var child in a)
                    Collect(child, leaves);
                break;
            case JsonValue v:
                leaves.Add(v);
                break;
        }
    }

    private HostileRequest Csv()
    {
        const string Header = "part_number,kind,description,package,quantity,unit_cost,currency,reorder_level,location,notes,resistance,tolerance";
        string[] endings = ["\r\n", "\n", "\r"];
        var text = new StringBuilder();
        if (_random.Next(2) == 0)
            text.Append('\uFEFF');
        text.Append(Header).Append(Pick(endings));
        var wrongCount = false;
        for (var line = _random.Next(1, 6); line > 0; line--)
        {
            var cells = new List<string> { Pick(Strings), "resistor", Pick(Strings), "0603", "10", "0.01", "EUR", "5", "A1", Pick(Strings), "4k7", "F" };
            var shape = _random.Next(4);
            if (shape == 0)
            {
                cells.RemoveRange(_random.Next(cells.Count), 1); // a column short
                wrongCount = true;
            }
            else if (shape == 1)
            {
                cells.Add("extra"); // a column too many
                wrongCount = true;
            }
            else if (shape == 2)
            {
                cells[_random.Next(cells.Count)] = "\"unterminated" + Pick(Strings);
            }
            else
            {
                cells[_random.Next(cells.Count)] = "\"a \"\"quoted\"\" cell, with a comma\"";
            }
            text.AppendJoin(',', cells).Append(Pick(endings));
        }
        // A non-dry import must fail as a whole; dry runs may pass, and write nothing.
        var dry = !wrongCount || _random.Next(2) == 0;
        return new HostileRequest(dry ? "csv.import/dry" : "csv.import/bad-columns", HttpMethod.Post,
            "/api/v1/parts/import?dryRun=" + (dry ? "true" : "false"), Encoding.UTF8.GetBytes(text.ToString()),
            Pick(CsvTypes), !dry);
    }

    private HostileRequest PathAttack()
    {
        var raw = Pick(Strings);
        var partNumber = _random.Next(4) switch
        {
            0 => raw, // as typed: HttpClient normalises dot segments, so this probes other routes too
            1 => Uri.EscapeDataString(Uri.EscapeDataString(raw)), // double-encoded
            _ => Uri.EscapeDataString(raw),
        };
        if (partNumber.Length == 0)
            partNumber = "%20";
        // A NUL in a path never reaches the application: Kestrel refuses the request line with 400 and the
        // in-process test host throws. NUL is sent in bodies and queries; in paths it goes double-encoded.
        if (Uri.UnescapeDataString(partNumber).Contains('\0', StringComparison.Ordinal))
            partNumber = Uri.EscapeDataString(Uri.EscapeDataString(raw));
        return _random.Next(6) switch
        {
            0 => new HostileRequest("path.get", HttpMethod.Get, $"/api/v1/parts/{partNumber}", null, null, false),
            1 => new HostileRequest("path.delete", HttpMethod.Delete, $"/api/v1/parts/{partNumber}", null, null, true),
            2 => new HostileRequest("path.movements", HttpMethod.Get, $"/api/v1/parts/{partNumber}/movements", null, null, false),
            3 => new HostileRequest("path.movement", HttpMethod.Get, $"/api/v1/parts/{partNumber}/movements/{Pick(MovementIds)}", null, null, false),
            4 => new HostileRequest("path.book", HttpMethod.Post, $"/api/v1/parts/{partNumber}/movements",
                Encoding.UTF8.GetBytes("{\"kind\":\"receipt\",\"quantity\":5,\"reason\":\"hostile\"}"), "application/json", true),
            _ => new HostileRequest("path.put", HttpMethod.Put, $"/api/v1/parts/{partNumber}",
                Encoding.UTF8.GetBytes(PartBody(raw).ToJsonString()), "application/json", true),
        };
    }

    private HostileRequest QueryAttack()
    {
        string[] names = ["kind", "min", "max", "q", "page", "pageSize"];
        var query = string.Join('&', Enumerable.Range(0, _random.Next(1, 4)).Select(_ =>
            $"{Pick(names)}={Uri.EscapeDataString(_random.Next(2) == 0 ? Pick(Strings) : Pick(Values).Trim('"'))}"));
        if (_random.Next(2) == 0)
            query = "kind=resistor&" + query;
        return _random.Next(3) == 0
            ? new HostileRequest("query.movements", HttpMethod.Get, $"/api/v1/parts/{Existing}/movements?{query}", null, null, false)
            : new HostileRequest("query.parts", HttpMethod.Get, $"/api/v1/parts?{query}", null, null, false);
    }

    private HostileRequest BrokenBody()
    {
        (string Method, string Path)[] targets =
        [
            ("POST", "/api/v1/parts"), ("PUT", $"/api/v1/parts/{Existing}"), ("POST", $"/api/v1/parts/{Empty}/movements"),
            ("POST", "/api/v1/circuits/evaluate"), ("POST", "/api/v1/keys"), ("POST", "/api/v1/design-searches"),
            ("POST", "/api/v1/webhooks"),
        ];
        var (method, path) = Pick(targets);
        var body = _random.Next(5) switch
        {
            0 => [],
            1 => "   \r\n "u8.ToArray(),
            2 => RandomBytes(),
            3 => Encoding.UTF8.GetBytes(new string('[', 100) + new string(']', 100)),
            _ => Encoding.UTF8.GetBytes("{\"a\":" + Pick(Values) + ",}"),
        };
        return new HostileRequest("body.broken", new HttpMethod(method), path, body,
            Pick(JsonTypes), true);
    }

    private byte[] RandomBytes()
    {
        var bytes = new byte[_random.Next(1, 200)];
        _random.NextBytes(bytes);
        return bytes;
    }

    // Ten megabytes of JSON ("[111…1]"): refused by size before it is read. One array, sent many times.
    private static readonly Lazy<byte[]> TenMegabytes = new(() =>
    {
        var body = new byte[10 * 1024 * 1024];
        Array.Fill(body, (byte)'1');
        body[0] = (byte)'[';
        body[^1] = (byte)']';
        return body;
    });

    private HostileRequest Huge()
    {
        var body = TenMegabytes.Value;
        var path = Pick(new[] { "/api/v1/parts", "/api/v1/circuits/evaluate", $"/api/v1/parts/{Empty}/movements", "/api/v1/parts/import" });
        return new HostileRequest("body.10MB", HttpMethod.Post, path, body,
            path.EndsWith("import", StringComparison.Ordinal) ? "text/csv" : "application/json", true);
    }
}
