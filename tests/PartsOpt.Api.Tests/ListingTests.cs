using System.Net.Http.Json;
using PartsOpt.Api.Parts;

namespace PartsOpt.Api.Tests;

/// <summary>Filters, text search and paging of GET /api/v1/parts, over a stock of known content.</summary>
public sealed class ListingTests : IClassFixture<ListingTests.KnownStock>
{
    /// <summary>Seven resistors (E12 values, IEC 60063), two capacitors and a potentiometer.</summary>
    public sealed class KnownStock : StockFactory, IAsyncLifetime
    {
        public async Task InitializeAsync()
        {
            var client = CreateClient();
            foreach (var (number, ohms) in new[] { ("R-L-100R", 100.0), ("R-L-1K", 1e3), ("R-L-2K2", 2.2e3),
                         ("R-L-4K7", 4.7e3), ("R-L-10K", 10e3), ("R-L-47K", 47e3), ("R-L-1M", 1e6) })
                await client.CreatePart(Api.Resistor(number, ohms));
            await client.CreatePart(Api.Capacitor("C-L-100N", 100e-9));
            await client.CreatePart(Api.Capacitor("C-L-4N7", 4.7e-9));
            await client.CreatePart(new
            {
                partNumber = "RV-L-10K", kind = "potentiometer", description = "Panel pot, 10k",
                potentiometer = new { resistanceOhms = 10e3, toleranceMinus = 0.2, tolerancePlus = 0.2, taper = "linear", trimmer = false },
            });
        }

        Task IAsyncLifetime.DisposeAsync() => Task.CompletedTask;
    }

    private readonly HttpClient _client;

    public ListingTests(KnownStock factory) => _client = factory.CreateClient();

    private async Task<PagedList<PartDto>> List(string query) =>
        (await _client.GetFromJsonAsync<PagedList<PartDto>>("/api/v1/parts" + query, Api.Json))!;

    [Fact]
    public async Task Value_range_with_prefixes_and_rkm_codes_is_inclusive()
    {
        var page = await List("?kind=resistor&min=1k&max=10k");
        Assert.Equal(["R-L-10K", "R-L-1K", "R-L-2K2", "R-L-4K7"], page.Items.Select(p => p.PartNumber));
        Assert.Equal(4, page.Total);
        Assert.Equal(["R-L-2K2", "R-L-4K7"], (await List("?kind=resistor&min=2k2&max=4700")).Items.Select(p => p.PartNumber));
        Assert.Equal(["C-L-4N7"], (await List("?kind=capacitor&max=10n")).Items.Select(p => p.PartNumber));
    }

    [Fact]
    public async Task Kind_filter_keeps_pots_apart_from_resistors()
    {
        Assert.Equal(["RV-L-10K"], (await List("?kind=potentiometer&min=10k&max=10k")).Items.Select(p => p.PartNumber));
        Assert.Equal(7, (await List("?kind=resistor")).Total);
    }

    [Fact]
    public async Task Text_search_covers_part_number_and_description_case_insensitively()
    {
        Assert.Equal(["C-L-100N", "C-L-4N7"], (await List("?q=c-l-")).Items.Select(p => p.PartNumber));
        Assert.Equal(["RV-L-10K"], (await List("?q=PANEL")).Items.Select(p => p.PartNumber));
        Assert.Empty((await List("?q=%25")).Items); // a literal '%' matches nothing, not everything
    }

    [Fact]
    public async Task Pages_are_stable_in_part_number_order()
    {
        var all = await List("?pageSize=200");
        Assert.Equal(10, all.Total);
        var ordered = all.Items.Select(p => p.PartNumber).Order(StringComparer.OrdinalIgnoreCase).ToList();
        Assert.Equal(ordered, all.Items.Select(p => p.PartNumber));

        var pages = new List<string>();
        for (var page = 1; page <= 4; page++)
        {
            var items = await List($"?page={page}&pageSize=3");
            Assert.Equal((page, 3, 10), (items.Page, items.PageSize, items.Total));
            pages.AddRange(items.Items.Select(p => p.PartNumber));
        }
        Assert.Equal(ordered, pages);
        Assert.Equal(50, (await List("")).PageSize); // the default page size
    }
}
