using System.Net;
using System.Net.Http.Json;
using PartsOpt.Api.Movements;
using PartsOpt.Api.Parts;

namespace PartsOpt.Api.Tests;

/// <summary>The stock ledger: receipts and adjustments, their limits, and on hand = Σ ledger.</summary>
public sealed class MovementsTests : IClassFixture<StockFactory>
{
    private readonly StockFactory _factory;
    private readonly HttpClient _client;

    public MovementsTests(StockFactory factory)
    {
        _factory = factory;
        _client = factory.CreateClient();
    }

    private Task<HttpResponseMessage> Book(string partNumber, string kind, int quantity, string reason = "count") =>
        _client.PostAsJsonAsync($"/api/v1/parts/{partNumber}/movements", new { kind, quantity, reason });

    [Fact]
    public async Task Receipts_and_adjustments_move_the_quantity_and_are_listed_newest_first()
    {
        await _client.CreatePart(Api.Resistor("R-MOV-1", 100));
        var receipt = await Book("R-MOV-1", "receipt", 100, "goods in");
        Assert.Equal(HttpStatusCode.Created, receipt.StatusCode);
        var booked = await receipt.Content.ReadFromJsonAsync<MovementDto>(Api.Json);
        Assert.Equal($"/api/v1/parts/R-MOV-1/movements/{booked!.Id}", receipt.Headers.Location?.OriginalString);
        Assert.Equal(HttpStatusCode.Created, (await Book("R-MOV-1", "adjustment", -30, "stocktake")).StatusCode);

        Assert.Equal(70, (await _client.GetPart("R-MOV-1")).QuantityOnHand);
        var ledger = await _client.GetFromJsonAsync<PagedList<MovementDto>>("/api/v1/parts/R-MOV-1/movements", Api.Json);
        Assert.Equal(["adjustment", "receipt"], ledger!.Items.Select(m => m.Kind));
        Assert.Equal("stocktake", ledger.Items[0].Reason);
        Assert.Equal(DateTimeKind.Utc, ledger.Items[0].AtUtc.Kind);
        var single = await _client.GetFromJsonAsync<MovementDto>($"/api/v1/parts/R-MOV-1/movements/{booked.Id}", Api.Json);
        Assert.Equal(100, single!.OnHandChange);
    }

    [Fact]
    public async Task The_actor_is_the_name_of_the_key_and_an_X_Actor_header_cannot_change_it()
    {
        await _client.CreatePart(Api.Resistor("R-ACT-1", 100));
        var stores = _factory.ClientWithKey(await _factory.CreateKeyAsync("stores-jo", "stockkeeper"));
        using var request = new HttpRequestMessage(HttpMethod.Post, "/api/v1/parts/R-ACT-1/movements")
        {
            Content = JsonContent.Create(new { kind = "receipt", quantity = 5, reason = "goods in" }),
        };
        request.Headers.Add("X-Actor", "somebody-else");
        Assert.Equal(HttpStatusCode.Created, (await stores.SendAsync(request)).StatusCode);
        await Book("R-ACT-1", "receipt", 1); // with the first start's admin key

        var ledger = await _client.GetFromJsonAsync<PagedList<MovementDto>>("/api/v1/parts/R-ACT-1/movements", Api.Json);
        Assert.Equal(["admin", "stores-jo"], ledger!.Items.Select(m => m.Actor));
    }

    [Fact]
    public async Task Stock_cannot_go_below_zero_nor_below_what_is_reserved()
    {
        await _client.CreatePart(Api.Resistor("R-LIM-1", 100, initialQuantity: 10));
        await (await Book("R-LIM-1", "adjustment", -11)).AssertProblem(HttpStatusCode.Conflict);

        await Ledger.ReserveAsync(_factory, "R-LIM-1", 4);
        await (await Book("R-LIM-1", "adjustment", -7)).AssertProblem(HttpStatusCode.Conflict);
        Assert.Equal(HttpStatusCode.Created, (await Book("R-LIM-1", "adjustment", -6)).StatusCode);
        var part = await _client.GetPart("R-LIM-1");
        Assert.Equal((4, 4, 0), (part.QuantityOnHand, part.Reserved, part.Available));
    }

    [Theory]
    [InlineData("receipt", -5, "quantity")]
    [InlineData("receipt", 0, "quantity")]
    [InlineData("adjustment", 0, "quantity")]
    [InlineData("reservation", 5, "kind")] // booked by builds, not posted
    [InlineData("consumption", 5, "kind")]
    [InlineData("gift", 5, "kind")]
    public async Task Bad_movements_are_400_naming_the_field(string kind, int quantity, string field)
    {
        await _client.PostAsJsonAsync("/api/v1/parts", Api.Resistor("R-BADMOV", 100));
        var response = await Book("R-BADMOV", kind, quantity);
        (await response.AssertProblem(HttpStatusCode.BadRequest)).ErrorsFor(field);
    }

    [Fact]
    public async Task A_movement_needs_a_reason()
    {
        await _client.PostAsJsonAsync("/api/v1/parts", Api.Resistor("R-REASON", 100));
        var response = await Book("R-REASON", "receipt", 5, " ");
        (await response.AssertProblem(HttpStatusCode.BadRequest)).ErrorsFor("reason");
    }

    [Fact]
    public async Task On_hand_equals_the_ledger_sum_after_many_operations()
    {
        await _client.CreatePart(Api.Resistor("R-SUM-1", 100, initialQuantity: 50));
        var expected = 50;
        var random = new Random(20261202);
        for (var i = 0; i < 40; i++)
        {
            var kind = random.Next(3) == 0 ? "adjustment" : "receipt";
            var quantity = kind == "receipt" ? random.Next(1, 20) : random.Next(-15, 15);
            var response = await Book("R-SUM-1", kind, quantity);
            if (response.StatusCode == HttpStatusCode.Created)
                expected += quantity;
            else
                Assert.True(quantity == 0 || expected + quantity < 0, $"refused {kind} {quantity} at {expected}");
        }
        // An import sets the count; the ledger books the difference.
        var import = await _client.PostCsv("/api/v1/parts/import",
            "part_number,kind,resistance,tolerance,quantity\r\nR-SUM-1,resistor,100R,F,333\r\n");
        Assert.Equal(HttpStatusCode.OK, import.StatusCode);
        expected = 333;
        Assert.Equal(HttpStatusCode.Created, (await Book("R-SUM-1", "adjustment", -3)).StatusCode);
        expected -= 3;

        Assert.Equal(expected, (await _client.GetPart("R-SUM-1")).QuantityOnHand);
        Assert.Equal(expected, await _factory.LedgerSumAsync("R-SUM-1"));
        var listed = await _client.GetFromJsonAsync<PagedList<PartDto>>("/api/v1/parts?q=R-SUM-1", Api.Json);
        Assert.Equal(expected, Assert.Single(listed!.Items).QuantityOnHand);
    }

    [Fact]
    public async Task Ledger_pages()
    {
        await _client.CreatePart(Api.Resistor("R-PAGE-M", 100));
        for (var i = 1; i <= 5; i++)
            await Book("R-PAGE-M", "receipt", i);
        var second = await _client.GetFromJsonAsync<PagedList<MovementDto>>("/api/v1/parts/R-PAGE-M/movements?page=2&pageSize=2", Api.Json);
        Assert.Equal(5, second!.Total);
        Assert.Equal([3, 2], second.Items.Select(m => m.OnHandChange)); // newest first: 5 4 | 3 2 | 1
    }

    [Fact]
    public async Task Concurrent_adjustments_cannot_together_take_stock_below_zero()
    {
        await _client.CreatePart(Api.Resistor("R-RACE-1", 100, initialQuantity: 10));
        // Twelve clients each take 2 of 10 at once: the check and the booking are one transaction, so
        // exactly five succeed and the rest are refused, whatever the interleaving.
        var responses = await Task.WhenAll(Enumerable.Range(0, 12).Select(_ =>
            _factory.CreateClient().PostAsJsonAsync("/api/v1/parts/R-RACE-1/movements",
                new { kind = "adjustment", quantity = -2, reason = "race" })));

        Assert.Equal(5, responses.Count(r => r.StatusCode == HttpStatusCode.Created));
        Assert.Equal(7, responses.Count(r => r.StatusCode == HttpStatusCode.Conflict));
        Assert.Equal(0, (await _client.GetPart("R-RACE-1")).QuantityOnHand);
        Assert.Equal(0, await _factory.LedgerSumAsync("R-RACE-1"));
    }
}
