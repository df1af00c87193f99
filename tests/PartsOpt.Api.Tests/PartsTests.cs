using System.Net;
using System.Net.Http.Json;
using PartsOpt.Api.Movements;
using PartsOpt.Api.Parts;

namespace PartsOpt.Api.Tests;

/// <summary>Create, read, update and delete of parts; status codes as RFC 9110 section 15 defines them.</summary>
public sealed class PartsTests : IClassFixture<StockFactory>
{
    private readonly StockFactory _factory;
    private readonly HttpClient _client;

    public PartsTests(StockFactory factory)
    {
        _factory = factory;
        _client = factory.CreateClient();
    }

    [Fact]
    public async Task Create_answers_201_with_location_and_books_the_initial_quantity_as_a_receipt()
    {
        var response = await _client.PostAsJsonAsync("/api/v1/parts", Api.Resistor("R-CRT-4K7", 4700, initialQuantity: 250));
        Assert.Equal(HttpStatusCode.Created, response.StatusCode);
        Assert.Equal("/api/v1/parts/R-CRT-4K7", response.Headers.Location?.OriginalString);

        var part = await _client.GetPart("R-CRT-4K7");
        Assert.Equal("resistor", part.Kind);
        Assert.Equal(4700, part.Resistor!.ResistanceOhms);
        Assert.Equal(0.01, part.Resistor.ToleranceMinus);
        Assert.Null(part.Capacitor);
        Assert.Equal(250, part.QuantityOnHand);
        Assert.Equal(0.01m, part.UnitCost);

        var ledger = await _client.GetFromJsonAsync<PagedList<MovementDto>>("/api/v1/parts/R-CRT-4K7/movements", Api.Json);
        var receipt = Assert.Single(ledger!.Items);
        Assert.Equal("receipt", receipt.Kind);
        Assert.Equal(250, receipt.OnHandChange);
    }

    [Fact]
    public async Task Duplicate_part_number_is_409_even_in_another_case()
    {
        await _client.CreatePart(Api.Resistor("R-DUP-1K", 1000));
        var again = await _client.PostAsJsonAsync("/api/v1/parts", Api.Resistor("R-DUP-1K", 2200));
        await again.AssertProblem(HttpStatusCode.Conflict);
        var otherCase = await _client.PostAsJsonAsync("/api/v1/parts", Api.Resistor("r-dup-1k", 2200));
        await otherCase.AssertProblem(HttpStatusCode.Conflict);
        Assert.Equal(1000, (await _client.GetPart("R-DUP-1K")).Resistor!.ResistanceOhms);
    }

    [Fact]
    public async Task Unknown_part_number_is_404_problem_for_every_verb()
    {
        var problem = await (await _client.GetAsync("/api/v1/parts/NO-SUCH")).AssertProblem(HttpStatusCode.NotFound);
        Assert.Contains("NO-SUCH", problem.GetProperty("detail").GetString(), StringComparison.Ordinal);
        await (await _client.PutAsJsonAsync("/api/v1/parts/NO-SUCH", Api.Resistor("NO-SUCH", 1)))
            .AssertProblem(HttpStatusCode.NotFound);
        await (await _client.DeleteAsync("/api/v1/parts/NO-SUCH")).AssertProblem(HttpStatusCode.NotFound);
        await (await _client.GetAsync("/api/v1/parts/NO-SUCH/movements")).AssertProblem(HttpStatusCode.NotFound);
    }

    [Fact]
    public async Task Update_changes_fields_but_never_quantity()
    {
        await _client.CreatePart(Api.Resistor("R-UPD-10K", 10_000, initialQuantity: 40));
        // A client that sends back what it read, quantity included, with a new value and tolerance.
        var body = new
        {
            partNumber = "R-UPD-10K",
            kind = "resistor",
            description = "re-measured",
            quantityOnHand = 9999,
            resistor = new { resistanceOhms = 10_200.0, toleranceMinus = 0.001, tolerancePlus = 0.001 },
        };
        var response = await _client.PutAsJsonAsync("/api/v1/parts/R-UPD-10K", body);
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);

        var part = await _client.GetPart("R-UPD-10K");
        Assert.Equal(10_200, part.Resistor!.ResistanceOhms);
        Assert.Equal("re-measured", part.Description);
        Assert.Equal(40, part.QuantityOnHand);
        Assert.Equal(40, await _factory.LedgerSumAsync("R-UPD-10K"));
    }

    [Fact]
    public async Task Update_refuses_a_change_of_kind_and_an_initial_quantity()
    {
        await _client.CreatePart(Api.Resistor("R-KIND-1", 100));
        var asCapacitor = await _client.PutAsJsonAsync("/api/v1/parts/R-KIND-1", Api.Capacitor("R-KIND-1", 1e-9));
        (await asCapacitor.AssertProblem(HttpStatusCode.BadRequest)).ErrorsFor("kind");
        var withQuantity = await _client.PutAsJsonAsync("/api/v1/parts/R-KIND-1", Api.Resistor("R-KIND-1", 100, initialQuantity: 5));
        (await withQuantity.AssertProblem(HttpStatusCode.BadRequest)).ErrorsFor("initialQuantity");
        Assert.Equal("resistor", (await _client.GetPart("R-KIND-1")).Kind);
    }

    [Fact]
    public async Task Delete_removes_the_part_and_its_ledger()
    {
        await _client.CreatePart(Api.Resistor("R-DEL-1", 100, initialQuantity: 7));
        Assert.Equal(HttpStatusCode.NoContent, (await _client.DeleteAsync("/api/v1/parts/R-DEL-1")).StatusCode);
        await (await _client.GetAsync("/api/v1/parts/R-DEL-1")).AssertProblem(HttpStatusCode.NotFound);
        Assert.Equal(0, await _factory.LedgerSumAsync("R-DEL-1"));
        // The number is free again.
        await _client.CreatePart(Api.Resistor("R-DEL-1", 220));
    }

    [Fact]
    public async Task Delete_is_409_while_anything_is_reserved()
    {
        await _client.CreatePart(Api.Resistor("R-RES-1", 100, initialQuantity: 20));
        await Ledger.ReserveAsync(_factory, "R-RES-1", 5);

        var part = await _client.GetPart("R-RES-1");
        Assert.Equal(5, part.Reserved);
        Assert.Equal(15, part.Available);
        await (await _client.DeleteAsync("/api/v1/parts/R-RES-1")).AssertProblem(HttpStatusCode.Conflict);
        Assert.Equal(20, (await _client.GetPart("R-RES-1")).QuantityOnHand);

        await Ledger.ReleaseAsync(_factory, "R-RES-1", 5);
        Assert.Equal(HttpStatusCode.NoContent, (await _client.DeleteAsync("/api/v1/parts/R-RES-1")).StatusCode);
    }

    [Fact]
    public async Task Every_kind_round_trips_through_json()
    {
        var pot = new
        {
            partNumber = "RV-JSON-10K", kind = "potentiometer",
            potentiometer = new { resistanceOhms = 10e3, toleranceMinus = 0.2, tolerancePlus = 0.2, taper = "log", trimmer = false, powerRatingW = 0.2 },
        };
        var amp = new
        {
            partNumber = "U-JSON-1", kind = "op-amp",
            opAmp = new
            {
                sections = 2, supplyMinV = 3.0, supplyMaxV = 32.0, gainBandwidthHz = 1e6, slewRateVPerS = 0.5e6,
                outputHeadroomLowV = 0.02, outputHeadroomHighV = 1.5, inputHeadroomLowV = -0.3, inputHeadroomHighV = 2.0,
                inputOffsetV = 2e-3, outputCurrentMaxA = 0.02, quiescentCurrentPerSectionA = 350e-6, comparator = false, openDrain = false,
            },
        };
        await _client.CreatePart(pot);
        await _client.CreatePart(amp);
        await _client.CreatePart(Api.Capacitor("C-JSON-1N", 1e-9));

        var p = (await _client.GetPart("RV-JSON-10K")).Potentiometer!;
        Assert.Equal(("log", false, 10e3), (p.Taper, p.Trimmer!.Value, p.ResistanceOhms!.Value));
        var o = (await _client.GetPart("U-JSON-1")).OpAmp!;
        Assert.Equal((2, 0.5e6, -0.3), (o.Sections!.Value, o.SlewRateVPerS!.Value, o.InputHeadroomLowV!.Value));
        var c = (await _client.GetPart("C-JSON-1N")).Capacitor!;
        Assert.Equal(("C0G", 1e-9), (c.Dielectric, c.CapacitanceF!.Value));
    }

    [Fact]
    public async Task Value_fields_accept_the_text_people_type()
    {
        var response = await _client.PostJson("/api/v1/parts", """
            {"partNumber": "R-TEXT-4K7", "kind": "resistor",
             "resistor": {"resistanceOhms": "4k7", "toleranceMinus": 0.05, "tolerancePlus": 0.05, "powerRatingW": "250 mW"}}
            """);
        Assert.Equal(HttpStatusCode.Created, response.StatusCode);
        var r = (await _client.GetPart("R-TEXT-4K7")).Resistor!;
        Assert.Equal((4700, 0.25), (r.ResistanceOhms!.Value, r.PowerRatingW!.Value)); // IEC 60062 RKM: 4K7 = 4.7 kΩ

        var cap = await _client.PostJson("/api/v1/parts", """
            {"partNumber": "C-TEXT-100N", "kind": "capacitor",
             "capacitor": {"capacitanceF": "100nF", "toleranceMinus": 0.1, "tolerancePlus": 0.1,
                           "dielectric": "X7R", "voltageRatingV": "50V", "polarised": false}}
            """);
        Assert.Equal(HttpStatusCode.Created, cap.StatusCode);
        Assert.Equal(100e-9, (await _client.GetPart("C-TEXT-100N")).Capacitor!.CapacitanceF!.Value);

        var wrongUnit = await _client.PostJson("/api/v1/parts", """
            {"partNumber": "R-TEXT-BAD", "kind": "resistor",
             "resistor": {"resistanceOhms": "4.7 nF", "toleranceMinus": 0.05, "tolerancePlus": 0.05}}
            """);
        (await wrongUnit.AssertProblem(HttpStatusCode.BadRequest)).ErrorsFor("resistor.resistanceOhms");
    }
}
