using System.Net;
using System.Net.Http.Json;
using System.Text.Json;
using Microsoft.EntityFrameworkCore;
using PartsOpt.Api.Builds;
using PartsOpt.Api.Webhooks;

namespace PartsOpt.Api.Tests.Builds;

/// <summary>POST /api/v1/builds: the whole BOM reserved in one transaction, or nothing and a list of what is short.</summary>
[Collection(SharedDesign.Name)]
public sealed class BuildReservationTests(DesignedStock stock)
{
    [Fact]
    public async Task A_build_reserves_every_BOM_line_per_board_times_quantity()
    {
        using var factory = stock.NewService();
        var client = factory.CreateClient();
        // The BOM must carry the op-amp package and the decoupling capacitors, or the check below says little.
        Assert.Contains(stock.Bom, b => b.PartNumber == stock.Design.Result.Amplifier);
        Assert.Contains(stock.Bom, b => b.Uses.Contains("decoupling"));

        var build = await client.Reserve(stock.DesignId, 3, "WO-4711");

        Assert.Equal("reserved", build.Status);
        Assert.Equal("WO-4711", build.Reference);
        Assert.Equal(stock.DesignId, build.DesignId);
        Assert.Equal(stock.Bom.Select(b => b.PartNumber).Order(StringComparer.Ordinal), build.Lines.Select(l => l.PartNumber));
        foreach (var line in stock.Bom)
        {
            var built = build.Lines.Single(l => l.PartNumber == line.PartNumber);
            Assert.Equal((line.PerUnit, 3 * line.PerUnit, 0), (built.PerUnit, built.Reserved, built.Consumed));
            var part = await client.GetPart(line.PartNumber);
            Assert.Equal((DesignedStock.Stock, 3 * line.PerUnit), (part.QuantityOnHand, part.Reserved));
            Assert.Equal(3 * line.PerUnit, await factory.ReservedSum(line.PartNumber));
        }
        var rows = await factory.WithDbAsync(db => db.Movements.Where(m => m.Reason == $"build {build.Id}: WO-4711").ToListAsync());
        Assert.Equal(stock.Bom.Count, rows.Count);
        Assert.All(rows, m => Assert.Equal(Movements.MovementKind.Reservation, m.Kind));

        var fetched = await client.GetFromJsonAsync<BuildDto>($"/api/v1/builds/{build.Id}", Api.Json);
        Assert.Equivalent(build, fetched);

        var reserved = await factory.WithDbAsync(db => db.OutboxEvents.SingleAsync(e => e.Type == EventTypes.BuildReserved));
        var data = JsonDocument.Parse(reserved.Payload).RootElement;
        Assert.Equal(build.Id, data.GetProperty("buildId").GetInt32());
        Assert.Equal(stock.Bom.Count, data.GetProperty("parts").GetArrayLength());
    }

    [Fact]
    public async Task One_short_line_reserves_nothing_and_leaves_the_ledger_as_it_was()
    {
        using var factory = stock.NewService();
        var client = factory.CreateClient();
        var opAmp = stock.OpAmpLine;
        await client.SetAvailable(opAmp.PartNumber, 4 * opAmp.PerUnit - 1);
        var rowsBefore = await factory.LedgerRows();

        var response = await client.PostBuild(stock.DesignId, 4);

        var problem = await response.AssertProblem(HttpStatusCode.Conflict);
        var shortage = Assert.Single(problem.GetProperty("shortages").EnumerateArray());
        Assert.Equal(opAmp.PartNumber, shortage.GetProperty("partNumber").GetString());
        Assert.Equal(4 * opAmp.PerUnit, shortage.GetProperty("needed").GetInt32());
        Assert.Equal(4 * opAmp.PerUnit - 1, shortage.GetProperty("available").GetInt32());
        Assert.Equal(rowsBefore, await factory.LedgerRows());
        foreach (var line in stock.Bom)
            Assert.Equal(0, await factory.ReservedSum(line.PartNumber));
        Assert.Equal(0, await factory.WithDbAsync(db => db.Builds.CountAsync()));
        Assert.Equal(0, await factory.Events(EventTypes.BuildReserved));
    }

    [Fact]
    public async Task The_conflict_lists_every_short_part_with_what_is_needed_and_available()
    {
        using var factory = stock.NewService();
        var client = factory.CreateClient();
        var shortLines = stock.Bom.Where(b => b.PartNumber != stock.OpAmpLine.PartNumber).Take(2).ToList();
        await client.SetAvailable(shortLines[0].PartNumber, 0);
        await client.SetAvailable(shortLines[1].PartNumber, 5 * shortLines[1].PerUnit - 2);

        var problem = await (await client.PostBuild(stock.DesignId, 5)).AssertProblem(HttpStatusCode.Conflict);

        var listed = problem.GetProperty("shortages").EnumerateArray()
            .Select(s => (s.GetProperty("partNumber").GetString(), s.GetProperty("needed").GetInt32(), s.GetProperty("available").GetInt32()))
            .ToList();
        var expected = new[]
        {
            (shortLines[0].PartNumber, 5 * shortLines[0].PerUnit, 0),
            (shortLines[1].PartNumber, 5 * shortLines[1].PerUnit, 5 * shortLines[1].PerUnit - 2),
        }.OrderBy(s => s.PartNumber, StringComparer.Ordinal).Select(s => ((string?)s.PartNumber, s.Item2, s.Item3));
        Assert.Equal(expected, listed);
    }

    [Fact]
    public async Task A_reservation_that_fits_exactly_succeeds_and_leaves_nothing_available()
    {
        using var factory = stock.NewService();
        var client = factory.CreateClient();
        var opAmp = stock.OpAmpLine;
        await client.SetAvailable(opAmp.PartNumber, 2 * opAmp.PerUnit);

        await client.Reserve(stock.DesignId, 2);

        Assert.Equal(0, (await client.GetPart(opAmp.PartNumber)).Available);
        await (await client.PostBuild(stock.DesignId, 1)).AssertProblem(HttpStatusCode.Conflict);
    }

    [Fact]
    public async Task A_retry_with_the_same_IdempotencyKey_reserves_once()
    {
        using var factory = stock.NewService();
        var client = factory.CreateClient();
        HttpRequestMessage Request()
        {
            var request = new HttpRequestMessage(HttpMethod.Post, "/api/v1/builds")
            {
                Content = JsonContent.Create(new { designId = stock.DesignId, quantity = 2, reference = "WO-RETRY" }),
            };
            request.Headers.Add(PartsOpt.Api.Security.Idempotency.Header, "3f0c1c2e-build-retry");
            return request;
        }

        var first = await client.SendAsync(Request());
        Assert.Equal(HttpStatusCode.Created, first.StatusCode);
        var rows = await factory.LedgerRows();
        var second = await client.SendAsync(Request());

        Assert.Equal(HttpStatusCode.Created, second.StatusCode);
        Assert.Equal("true", second.Headers.GetValues(PartsOpt.Api.Security.Idempotency.ReplayedHeader).Single());
        Assert.Equal(await first.Content.ReadAsStringAsync(), await second.Content.ReadAsStringAsync());
        Assert.Equal(rows, await factory.LedgerRows());
        Assert.Equal(1, await factory.WithDbAsync(db => db.Builds.CountAsync()));
        Assert.Equal(2 * stock.OpAmpLine.PerUnit, await factory.ReservedSum(stock.OpAmpLine.PartNumber));
    }

    [Fact]
    public async Task An_unknown_design_is_404()
    {
        using var factory = stock.NewService();
        var problem = await (await factory.CreateClient().PostBuild(99_999, 1)).AssertProblem(HttpStatusCode.NotFound);
        Assert.Contains("99999", problem.GetProperty("detail").GetString(), StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("""{"designId":1,"quantity":0,"reference":"WO"}""", "quantity")]
    [InlineData("""{"designId":1,"quantity":-3,"reference":"WO"}""", "quantity")]
    [InlineData("""{"designId":1,"quantity":100001,"reference":"WO"}""", "quantity")]
    [InlineData("""{"designId":1,"reference":"WO"}""", "quantity")]
    [InlineData("""{"quantity":1,"reference":"WO"}""", "designId")]
    [InlineData("""{"designId":0,"quantity":1,"reference":"WO"}""", "designId")]
    [InlineData("""{"designId":1,"quantity":1}""", "reference")]
    [InlineData("""{"designId":1,"quantity":1,"reference":"   "}""", "reference")]
    [InlineData("""{"designId":1,"quantity":1,"reference":"WO\u0007"}""", "reference")]
    [InlineData("""{"designId":1,"quantity":"two","reference":"WO"}""", "quantity")]
    [InlineData("""{"designId":1,"quantity":1.5,"reference":"WO"}""", "quantity")]
    [InlineData("""{"designId":1,"quantity":1,"reference":"WO",""", "$")]
    [InlineData("""[1,2]""", "$")]
    [InlineData("""{"designId":1,"quantity":2147483648,"reference":"WO"}""", "quantity")]
    [InlineData("""{"designId":1,"quantity":1e400,"reference":"WO"}""", "quantity")]
    [InlineData("""{"designId":null,"quantity":1,"reference":"WO"}""", "designId")]
    [InlineData("""{"designId":"1; DROP TABLE Builds","quantity":1,"reference":"WO"}""", "designId")]
    [InlineData("""{"designId":1,"quantity":1,"reference":123}""", "reference")]
    [InlineData("""{"designId":1,"quantity":1,"reference":"WO","note":{"deep":[[[]]]}}""", "note")]
    public async Task A_bad_request_is_400_naming_the_field(string body, string field)
    {
        using var factory = stock.NewService();
        var client = factory.CreateClient();
        var rowsBefore = await factory.LedgerRows();
        var problem = await (await client.PostJson("/api/v1/builds", body)).AssertProblem(HttpStatusCode.BadRequest);
        Assert.NotEmpty(problem.ErrorsFor(field));
        Assert.Equal(rowsBefore, await factory.LedgerRows());
    }

    [Fact]
    public async Task Reference_and_note_lengths_are_limited()
    {
        using var factory = stock.NewService();
        var client = factory.CreateClient();
        var longReference = await client.PostAsJsonAsync("/api/v1/builds",
            new { designId = stock.DesignId, quantity = 1, reference = new string('R', BuildRules.ReferenceMaxLength + 1) });
        Assert.NotEmpty((await longReference.AssertProblem(HttpStatusCode.BadRequest)).ErrorsFor("reference"));
        var longNote = await client.PostAsJsonAsync("/api/v1/builds",
            new { designId = stock.DesignId, quantity = 1, reference = "WO", note = new string('N', BuildRules.NoteMaxLength + 1) });
        Assert.NotEmpty((await longNote.AssertProblem(HttpStatusCode.BadRequest)).ErrorsFor("note"));
        // At the limits it is accepted.
        var atLimits = await client.PostAsJsonAsync("/api/v1/builds", new
        {
            designId = stock.DesignId, quantity = 1,
            reference = new string('R', BuildRules.ReferenceMaxLength), note = new string('N', BuildRules.NoteMaxLength),
        });
        Assert.Equal(HttpStatusCode.Created, atLimits.StatusCode);
    }
}
