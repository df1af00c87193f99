using System.Net;
using System.Net.Http.Json;
using System.Text;
using System.Text.Json;
using PartsOpt.Api.Movements;
using PartsOpt.Api.Parts;

namespace PartsOpt.Api.Tests;

/// <summary>POST /api/v1/parts/import and GET /api/v1/parts/export: all or nothing, dry runs, round trips.</summary>
public sealed class CsvImportTests
{
    private const string Header =
        "part_number,kind,description,package,quantity,unit_cost,currency,reorder_level,location,notes," +
        "resistance,capacitance,tolerance,tempco_ppm_per_k,power_rating,dielectric,voltage_rating,polarised,taper,trimmer," +
        "sections,supply_min,supply_max,gain_bandwidth,slew_rate_v_per_us,output_headroom_low,output_headroom_high," +
        "input_headroom_low,input_headroom_high,input_offset,output_current_max,quiescent_current,comparator,open_drain";

    // Every kind, values written the ways people write them, and text that needs RFC 4180 quoting
    // (section 2, rules 5-7: fields with commas, quotes or line breaks are quoted; quotes are doubled)
    // or that a spreadsheet would run as a formula.
    private static readonly string Sample = string.Join("\r\n",
        Header,
        "R-1K-F,resistor,\"Chip resistor, 1 %\",0603,120,0.011,GBP,50,A1,,1k,,F,50,0.1W,,,,,,,,,,,,,,,,,,,",
        "R-4K99-B,resistor,E96 value,0805,30,0.085,GBP,10,A2,\"=HYPERLINK(\"\"x\"\")\",4.99k,,0.1%,25,125mW,,,,,,,,,,,,,,,,,,,",
        "R-0R47-J,resistor,Low value,1206,5,0.02,GBP,0,A3,-fragile,R47,,J,,0.25W,,,,,,,,,,,,,,,,,,,",
        "C-2P2-C0G,capacitor,Tiny C0G,0603,1000,0.006,GBP,100,C1,\"two\r\nlines\",,2p2,C,,,C0G,50V,no,,,,,,,,,,,,,,,,",
        "C-100N-Y5V,capacitor,Decoupling,0603,2000,0.003,GBP,400,C2,@home,,100n,+80/-20%,,,Y5V,16V,no,,,,,,,,,,,,,,,,",
        "C-1N-PP,capacitor,Film,Radial,50,0.22,GBP,10,C3,'=already quoted,,1nF,2%,-200,,Film,100V,no,,,,,,,,,,,,,,,,",
        "C-47U-EL,capacitor,Electrolytic,Radial,20,0.05,GBP,5,C4,,,47u,M,,,Electrolytic,25V,yes,,,,,,,,,,,,,,,,",
        "RV-10K-LOG,potentiometer,Panel pot,16mm,12,0.65,GBP,2,P1,,10k,,20%,,0.2W,,,,log,no,,,,,,,,,,,,,,",
        "U-DUAL-A,op-amp,Dual op-amp,SOIC-8,40,0.12,GBP,10,U1,,,,,,,,,,,,2,3V,32V,1MHz,0.5,20mV,1.5V,-300mV,2V,2mV,20mA,350uA,no,no",
        "U-CMP-OD,op-amp,Open-drain comparator,SOIC-14,25,0.10,GBP,5,U2,,,,,,,,,,,,4,2V,36V,,50,200mV,0V,-0.3V,1.5V,2mV,16mA,200uA,yes,yes") + "\r\n";

    [Fact]
    public async Task Export_imports_into_an_empty_database_and_exports_byte_identical()
    {
        using var first = new StockFactory();
        var a = first.CreateClient();
        Assert.Equal(HttpStatusCode.OK, (await a.PostCsv("/api/v1/parts/import", Sample)).StatusCode);
        var literal = await a.PostAsJsonAsync("/api/v1/parts", new
        {
            partNumber = "R-LITERAL", kind = "resistor", notes = "'=an apostrophe of its own",
            resistor = new { resistanceOhms = 1e6, toleranceMinus = 0.05, tolerancePlus = 0.05 },
        });
        Assert.Equal(HttpStatusCode.Created, literal.StatusCode);
        var exported = await a.Export();

        using var second = new StockFactory();
        var b = second.CreateClient();
        var reimport = await b.PostAsync("/api/v1/parts/import", new ByteArrayContent(exported)
        {
            Headers = { ContentType = new("text/csv") },
        });
        Assert.Equal(HttpStatusCode.OK, reimport.StatusCode);
        Assert.Equal(exported, await b.Export());

        // And the export carries what was imported, exactly.
        var r = await b.GetPart("R-4K99-B");
        Assert.Equal(4990, r.Resistor!.ResistanceOhms);
        Assert.Equal((0.001, 0.001), (r.Resistor.ToleranceMinus!.Value, r.Resistor.TolerancePlus!.Value)); // IEC 60062: B/0.1 %
        Assert.Equal("=HYPERLINK(\"x\")", r.Notes);
        var tiny = (await b.GetPart("C-2P2-C0G")).Capacitor!;
        Assert.True(tiny.ToleranceAbsolute); // IEC 60062: C below 10 pF is ±0.25 pF
        Assert.Equal(0.25e-12, tiny.ToleranceMinus!.Value, 1e-27);
        var y5v = (await b.GetPart("C-100N-Y5V")).Capacitor!;
        Assert.Equal((0.2, 0.8), (y5v.ToleranceMinus!.Value, y5v.TolerancePlus!.Value));
        Assert.Equal("two\r\nlines", (await b.GetPart("C-2P2-C0G")).Notes);
        Assert.Equal("=already quoted", (await b.GetPart("C-1N-PP")).Notes); // the import took one ' off
        Assert.Equal("'=an apostrophe of its own", (await b.GetPart("R-LITERAL")).Notes);
        var amp = (await b.GetPart("U-DUAL-A")).OpAmp!;
        Assert.Equal((0.5e6, -0.3, 350e-6), (amp.SlewRateVPerS!.Value, amp.InputHeadroomLowV!.Value, amp.QuiescentCurrentPerSectionA!.Value));
        Assert.Equal(40, (await b.GetPart("U-DUAL-A")).QuantityOnHand);
    }

    [Fact]
    public async Task Export_neutralises_formula_cells_and_quotes_as_rfc_4180_says()
    {
        using var factory = new StockFactory();
        var client = factory.CreateClient();
        await client.PostCsv("/api/v1/parts/import", Sample);
        var text = Encoding.UTF8.GetString(await client.Export());

        Assert.StartsWith("\uFEFF" + Header + "\r\n", text, StringComparison.Ordinal);
        // OWASP "CSV injection" advice (common practice): a leading ' keeps = + - @ from running.
        Assert.Contains(",\"'=HYPERLINK(\"\"x\"\")\",", text, StringComparison.Ordinal);
        Assert.Contains(",'-fragile,", text, StringComparison.Ordinal);
        Assert.Contains(",'@home,", text, StringComparison.Ordinal);
        Assert.Contains(",'=already quoted,", text, StringComparison.Ordinal);
        Assert.Contains("\"Chip resistor, 1 %\"", text, StringComparison.Ordinal); // RFC 4180 rule 6
        Assert.Contains("\"two\r\nlines\"", text, StringComparison.Ordinal); // RFC 4180 rule 6
    }

    [Fact]
    public async Task A_file_with_bad_lines_changes_nothing_and_names_every_bad_cell()
    {
        using var factory = new StockFactory();
        var client = factory.CreateClient();
        await client.PostCsv("/api/v1/parts/import", Sample);
        var before = await client.Export();
        var ledgerBefore = await factory.WithDbAsync(db => Task.FromResult(db.Movements.Count()));

        var bad = string.Join("\r\n",
            "part_number,kind,quantity,resistance,capacitance,tolerance,dielectric,voltage_rating,polarised",
            "R-NEW-1,resistor,10,1k,,F,,,",         // line 2: fine
            "C-NEW-1,capacitor,10,,4x7,K,X7R,50V,no", // line 3: capacitance unreadable
            "R-1K-F,resistor,999,1k,,Q,,,",          // line 4: existing part, bad tolerance letter
            "C-NEW-2,capacitor,-5,,1n,K,X9Z,50V,maybe") + "\r\n"; // line 5: three bad cells
        var response = await client.PostCsv("/api/v1/parts/import", bad);
        var problem = await response.AssertProblem(HttpStatusCode.BadRequest);

        Assert.Contains("4x7", problem.ErrorsFor("lines[3].capacitance")[0], StringComparison.Ordinal);
        problem.ErrorsFor("lines[4].tolerance");
        problem.ErrorsFor("lines[5].quantity");
        problem.ErrorsFor("lines[5].dielectric");
        problem.ErrorsFor("lines[5].polarised");
        var lineErrors = problem.GetProperty("lineErrors").EnumerateArray().ToList();
        Assert.Equal(5, lineErrors.Count);
        var first = lineErrors[0];
        Assert.Equal((3, "capacitance", "4x7"),
            (first.GetProperty("line").GetInt32(), first.GetProperty("column").GetString(), first.GetProperty("text").GetString()));

        Assert.Equal(before, await client.Export());
        Assert.Equal(ledgerBefore, await factory.WithDbAsync(db => Task.FromResult(db.Movements.Count())));
        await (await client.GetAsync("/api/v1/parts/R-NEW-1")).AssertProblem(HttpStatusCode.NotFound);
    }

    [Fact]
    public async Task Line_numbers_count_physical_lines_and_bad_quoting_is_reported()
    {
        using var factory = new StockFactory();
        var client = factory.CreateClient();
        var csv = "part_number,kind,notes,resistance,tolerance\r\n" +
                  "R-Q-1,resistor,\"a\r\nb\",1k,F\r\n" +   // lines 2-3: one record over two lines
                  "R-Q-2,resistor,,1q,F\r\n" +              // line 4: bad value
                  "R-Q-3,resistor,bad \"quote,1k,F\r\n";    // line 5: a quote inside an unquoted field (RFC 4180 rule 5)
        var problem = await (await client.PostCsv("/api/v1/parts/import", csv)).AssertProblem(HttpStatusCode.BadRequest);
        problem.ErrorsFor("lines[4].resistance");
        Assert.Contains(problem.GetProperty("lineErrors").EnumerateArray(), e => e.GetProperty("line").GetInt32() == 5);
    }

    [Fact]
    public async Task Dry_run_reports_and_changes_nothing()
    {
        using var factory = new StockFactory();
        var client = factory.CreateClient();
        await client.PostCsv("/api/v1/parts/import", Sample);
        var before = await client.Export();

        var csv = "part_number,kind,resistance,tolerance,quantity\r\nR-1K-F,resistor,1k,F,7\r\nR-DRY-NEW,resistor,2k2,J,5\r\n";
        var response = await client.PostCsv("/api/v1/parts/import?dryRun=true", csv);
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        var report = await response.Content.ReadFromJsonAsync<JsonElement>();
        Assert.True(report.GetProperty("dryRun").GetBoolean());
        Assert.Equal(["R-DRY-NEW"], report.GetProperty("created").EnumerateArray().Select(e => e.GetString()));
        Assert.Equal(["R-1K-F"], report.GetProperty("updated").EnumerateArray().Select(e => e.GetString()));

        Assert.Equal(before, await client.Export());
        await (await client.GetAsync("/api/v1/parts/R-DRY-NEW")).AssertProblem(HttpStatusCode.NotFound);
    }

    [Fact]
    public async Task Import_upserts_books_the_difference_and_a_blank_quantity_keeps_the_stock()
    {
        using var factory = new StockFactory();
        var client = factory.CreateClient();
        await client.PostCsv("/api/v1/parts/import", Sample);

        var csv = "part_number,kind,description,resistance,tolerance,quantity\r\n" +
                  "R-1K-F,resistor,recounted,1k,F,100\r\n" +        // 120 -> 100: adjustment -20
                  "R-0R47-J,resistor,renamed only,R47,J,\r\n";      // blank quantity: stock stays 5
        var report = await (await client.PostCsv("/api/v1/parts/import", csv)).Content.ReadFromJsonAsync<JsonElement>();
        Assert.Equal(1, report.GetProperty("movements").GetInt32());

        var priceOnly = await client.PostCsv("/api/v1/parts/import", "part_number,kind,unit_cost\r\nU-DUAL-A,op-amp,0.13\r\n");
        Assert.Equal(HttpStatusCode.OK, priceOnly.StatusCode);
        var amp = await client.GetPart("U-DUAL-A");
        Assert.Equal((0.13m, 40, 1e6), (amp.UnitCost, amp.QuantityOnHand, amp.OpAmp!.GainBandwidthHz!.Value));

        var recounted = await client.GetPart("R-1K-F");
        Assert.Equal((100, "recounted"), (recounted.QuantityOnHand, recounted.Description));
        // Columns the file leaves out keep their values: unit cost, currency, location, tempco.
        Assert.Equal((0.011m, "GBP", "A1", 50.0), (recounted.UnitCost, recounted.Currency, recounted.Location, recounted.Resistor!.TempcoPpmPerK!.Value));
        Assert.Equal((5, "renamed only"), ((await client.GetPart("R-0R47-J")).QuantityOnHand, (await client.GetPart("R-0R47-J")).Description));
        var ledger = await client.GetFromJsonAsync<PagedList<MovementDto>>("/api/v1/parts/R-1K-F/movements", Api.Json);
        Assert.Equal(("adjustment", -20, "import"), (ledger!.Items[0].Kind, ledger.Items[0].OnHandChange, ledger.Items[0].Reason));
        Assert.Equal(100, await factory.LedgerSumAsync("R-1K-F"));
    }

    [Fact]
    public async Task Import_refuses_a_change_of_kind_a_duplicate_line_an_unknown_column_and_stock_below_reserved()
    {
        using var factory = new StockFactory();
        var client = factory.CreateClient();
        await client.PostCsv("/api/v1/parts/import", Sample);
        await Ledger.ReserveAsync(factory, "R-1K-F", 50);

        var csv = "part_number,kind,capacitance,resistance,tolerance,dielectric,voltage_rating,polarised,quantity\r\n" +
                  "R-0R47-J,capacitor,1n,,K,X7R,50V,no,1\r\n" +  // line 2: was a resistor
                  "R-1K-F,resistor,,1k,F,,,,10\r\n" +             // line 3: 10 < 50 reserved
                  "R-X,resistor,,1k,F,,,,1\r\n" +
                  "r-x,resistor,,1k,F,,,,1\r\n";                   // line 5: same part again
        var problem = await (await client.PostCsv("/api/v1/parts/import", csv)).AssertProblem(HttpStatusCode.BadRequest);
        problem.ErrorsFor("lines[2].kind");
        problem.ErrorsFor("lines[3].quantity");
        problem.ErrorsFor("lines[5].part_number");

        var unknown = await client.PostCsv("/api/v1/parts/import", "part_number,kind,colour\r\nR-Z,resistor,red\r\n");
        (await unknown.AssertProblem(HttpStatusCode.BadRequest)).ErrorsFor("lines[1].colour");
        var foreignColumn = await client.PostCsv("/api/v1/parts/import", "part_number,kind,resistance,tolerance,sections\r\nR-Z,resistor,1k,F,2\r\n");
        (await foreignColumn.AssertProblem(HttpStatusCode.BadRequest)).ErrorsFor("lines[2].sections");
        Assert.Equal(120, (await client.GetPart("R-1K-F")).QuantityOnHand);
    }

    [Fact]
    public async Task Wrong_media_type_is_415_and_an_oversized_file_413()
    {
        using var factory = new StockFactory { Settings = { ["Import:MaxBytes"] = "100" } };
        var client = factory.CreateClient();
        await (await client.PostJson("/api/v1/parts/import", "{}")).AssertProblem(HttpStatusCode.UnsupportedMediaType);
        await (await client.PostCsv("/api/v1/parts/import", Sample)).AssertProblem(HttpStatusCode.RequestEntityTooLarge);
        await (await client.PostCsv("/api/v1/parts/import", "")).AssertProblem(HttpStatusCode.BadRequest);
    }
}
