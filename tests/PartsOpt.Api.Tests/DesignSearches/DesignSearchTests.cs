using Microsoft.EntityFrameworkCore;
using System.Globalization;
using System.Net;
using System.Net.Http.Json;
using System.Text.Json.Nodes;
using CsvHelper;
using PartsOpt.Api.DesignSearches;
using PartsOpt.Tests;
using PartsOpt.Topologies;

namespace PartsOpt.Api.Tests.DesignSearches;

/// <summary>A search of a small stock: ranking, the bands, the textbook frequency, storage and the BOM.</summary>
[Collection(SharedSearch.Name)]
public sealed class DesignSearchTests(SearchedStockFactory factory)
{
    private readonly HttpClient _client = factory.Client;
    private DesignSearchDto Search => SearchStock.Read(factory.Body);

    [Fact]
    public void The_search_finds_designs_in_rank_order_cheapest_first()
    {
        var search = Search;
        Assert.True(search.Status is "optimal" or "feasible", search.Status);
        Assert.Equal(search.Status == "optimal", search.OptimalityProved);
        Assert.Equal(DesignSearchesEndpoints.PathOf(search.Id), factory.Response.Headers.Location?.OriginalString);
        Assert.NotEmpty(search.Designs);
        Assert.Equal(Enumerable.Range(1, search.Designs.Count), search.Designs.Select(d => d.Rank));
        var costs = search.Designs.Select(d => d.Result.Cost.PerBoard).ToList();
        for (var i = 1; i < costs.Count; i++)
            Assert.True(costs[i - 1] <= costs[i], $"rank {i} costs {costs[i - 1]}, rank {i + 1} costs {costs[i]}");
        Assert.All(search.Designs, d => Assert.False(d.Stale));
        Assert.Equal(Common.Cautions.PowerStage, search.Cautions);
        Assert.All(search.Designs, d => Assert.Equal(Common.Cautions.PowerStage, d.Cautions));
    }

    [Fact]
    public void Every_design_lands_inside_the_requested_bands()
    {
        foreach (var design in Search.Designs)
        {
            var result = design.Result;
            var f = result.Figure(FigureNames.Frequency);
            Assert.InRange(f, 1000 * 0.95, 1000 * 1.05);
            var (d0, d1) = (result.Figure(FigureNames.DutyAtSettingMin), result.Figure(FigureNames.DutyAtSettingMax));
            Assert.True(Math.Min(d0, d1) <= 0.1 && Math.Max(d0, d1) >= 0.9, $"design {design.Rank}: duty {d0} … {d1}");
            Assert.DoesNotContain(result.Checks, c => !c.Passed && c.Severity == "failure");
        }
    }

    [Fact]
    public void The_frequency_of_every_design_is_the_textbook_one()
    {
        foreach (var design in Search.Designs)
        {
            var result = design.Result;
            var expected = design.Topology switch
            {
                // Sedra & Smith, Microelectronic Circuits, astable multivibrator with op-amp saturation at ±L:
                // T = 2τ·ln((1 + β)/(1 − β)), τ = RC, β = R2/(R1 + R2) (ln 3 for equal dividers).
                TopologyNames.ThreeStage or TopologyNames.RcRamp => Relaxation(result),
                // Sedra & Smith, triangle generator (bistable with integrator): thresholds ±L·R1/R2, slope L/(RC),
                // so T = 4RC·R1/R2.
                _ => 1 / (4 * result.RoleValue(Roles.IntR) * result.RoleValue(Roles.IntC)
                    * result.RoleValue(Roles.SchR1) / result.RoleValue(Roles.SchR2)),
            };
            // At 1 kHz the edges of a 13 V/µs part take about 1.6 µs of a 1 ms period (0.2 %): 1 % holds.
            Precision.AlmostEqualRelative(expected, result.Figure(FigureNames.Frequency), 0.01,
                $"design {design.Rank} ({design.Topology}) frequency");
        }
    }

    private static double Relaxation(DesignResult result)
    {
        var beta = result.RoleValue(Roles.OscR2) / (result.RoleValue(Roles.OscR1) + result.RoleValue(Roles.OscR2));
        var tau = result.RoleValue(Roles.OscR) * result.RoleValue(Roles.OscC);
        return 1 / (2 * tau * Math.Log((1 + beta) / (1 - beta)));
    }

    [Fact]
    public void Roles_name_their_designators_parts_and_values()
    {
        foreach (var design in Search.Designs)
        {
            var roles = design.Result.Roles;
            Assert.Equal(roles.Count, roles.Select(r => r.Designator).Distinct().Count());
            Assert.All(roles, r => Assert.Single(r.PartNumbers)); // combinations were not allowed
            // IEC 60062 / SI: the oscillator or integrator parts come from the stock list; their text is the value.
            Assert.All(roles, r => Assert.Equal(r.Value, PartsOpt.Values.EngineeringValue.Parse(r.ValueText,
                Roles.KindOf(r.Role) == RoleKind.Capacitor ? PartsOpt.Values.Quantity.Capacitance : PartsOpt.Values.Quantity.Resistance), 9));
            var bomParts = design.Result.Bom.Select(b => b.PartNumber).ToHashSet();
            Assert.All(roles, r => Assert.Contains(r.PartNumbers[0], bomParts));
        }
    }

    [Fact]
    public async Task The_completed_search_leaves_its_event_in_the_outbox()
    {
        var id = JsonNode.Parse(factory.Body)!["id"]!.GetValue<int>();
        var events = await factory.WithDbAsync(db => db.OutboxEvents.AsNoTracking()
            .Where(e => e.Type == PartsOpt.Api.Webhooks.EventTypes.DesignSearchCompleted).ToListAsync());
        var payload = JsonNode.Parse(Assert.Single(events).Payload)!;
        Assert.Equal(id, payload["searchId"]!.GetValue<int>());
        Assert.Equal(JsonNode.Parse(factory.Body)!["designs"]!.AsArray().Count, payload["designs"]!.AsArray().Count);
    }

    [Fact]
    public async Task The_stored_search_and_its_designs_read_back_identically()
    {
        var posted = JsonNode.Parse(factory.Body)!;
        var id = posted["id"]!.GetValue<int>();
        var read = JsonNode.Parse(await _client.GetStringAsync($"/api/v1/design-searches/{id}"));
        Assert.True(JsonNode.DeepEquals(posted, read), $"posted {posted.ToJsonString()}\nread {read!.ToJsonString()}");

        foreach (var design in posted["designs"]!.AsArray())
        {
            var single = JsonNode.Parse(await _client.GetStringAsync($"/api/v1/designs/{design!["id"]}"));
            Assert.True(JsonNode.DeepEquals(design, single));
        }
        Assert.Equal(10, posted["requirement"]!["buildQuantity"]!.GetValue<int>());
        Assert.Equal(TopologyNames.All, posted["requirement"]!["topologies"]!.AsArray().Select(t => t!.GetValue<string>()));
    }

    [Fact]
    public async Task The_bom_csv_lists_every_line_with_quantities_for_the_build()
    {
        foreach (var design in Search.Designs)
        {
            var response = await _client.GetAsync($"/api/v1/designs/{design.Id}/bom.csv");
            Assert.Equal(HttpStatusCode.OK, response.StatusCode);
            Assert.Equal("text/csv", response.Content.Headers.ContentType?.MediaType);
            using var reader = new StringReader(await response.Content.ReadAsStringAsync());
            using var csv = new CsvReader(reader, CultureInfo.InvariantCulture);
            var rows = csv.GetRecords<dynamic>().Cast<IDictionary<string, object>>().ToList();
            Assert.Equal(DesignBomCsv.Columns, rows[0].Keys.Select(k => k.TrimStart('\uFEFF')));

            var bom = design.Result.Bom;
            Assert.Equal(bom.Select(b => b.PartNumber), rows.Select(r => (string)r[Column(r, "part_number")]));
            foreach (var (line, row) in bom.Zip(rows))
            {
                var perUnit = int.Parse((string)row["quantity_per_unit"], CultureInfo.InvariantCulture);
                var forBuild = int.Parse((string)row["quantity_for_build"], CultureInfo.InvariantCulture);
                Assert.Equal(line.PerUnit, perUnit);
                Assert.Equal(perUnit * 10, forBuild);
                var unitCost = decimal.Parse((string)row["unit_cost"], CultureInfo.InvariantCulture);
                Assert.Equal(unitCost * forBuild, decimal.Parse((string)row["line_cost"], CultureInfo.InvariantCulture));
                Assert.Equal(line.PerUnit, ((string)row["designators"]).Split(' ').Length);
            }
            // The BOM and the cost agree: parts cost per board is Σ unit cost × pieces per board.
            Assert.Equal(design.Result.Cost.PartsCost, bom.Sum(b => b.UnitCost * b.PerUnit));
        }
    }

    private static string Column(IDictionary<string, object> row, string name) => row.Keys.Single(k => k.TrimStart('\uFEFF') == name);

    [Fact]
    public async Task Missing_searches_and_designs_are_404_problems()
    {
        await (await _client.GetAsync("/api/v1/design-searches/999999")).AssertProblem(HttpStatusCode.NotFound);
        await (await _client.GetAsync("/api/v1/designs/999999")).AssertProblem(HttpStatusCode.NotFound);
        await (await _client.GetAsync("/api/v1/designs/999999/bom.csv")).AssertProblem(HttpStatusCode.NotFound);
    }
}
