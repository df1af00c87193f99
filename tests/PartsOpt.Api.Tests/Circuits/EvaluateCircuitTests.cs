using System.Net;
using System.Net.Http.Json;
using System.Text.Json;
using System.Text.Json.Nodes;

namespace PartsOpt.Api.Tests.Circuits;

/// <summary>POST /api/v1/circuits/evaluate against textbook circuits, stocked parts and bad input.</summary>
public sealed class EvaluateCircuitTests(StockFactory factory) : IClassFixture<StockFactory>
{
    private readonly HttpClient _client = factory.CreateClient();

    private async Task<JsonElement> Evaluate(JsonObject body)
    {
        var response = await _client.PostJson("/api/v1/circuits/evaluate", body.ToJsonString());
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.OK, text);
        return JsonDocument.Parse(text).RootElement;
    }

    private static double Figure(JsonElement answer, string name) =>
        answer.GetProperty("figures").EnumerateArray().Single(f => f.GetProperty("name").GetString() == name)
            .GetProperty("value").GetDouble();

    private static void Near(double expected, double actual, double relative, string what) =>
        Assert.True(Math.Abs(actual - expected) <= relative * Math.Abs(expected),
            $"{what}: expected {expected} ± {relative:P2}, got {actual}");

    [Fact]
    public async Task Three_stage_textbook_oscillator_answers_with_every_analysis()
    {
        var answer = await Evaluate(CircuitRequests.ThreeStage());

        // f = 1/(2RC·ln 3) = 455.12 Hz (Sedra & Smith); the ideal op-amp makes the closed form exact.
        Near(1 / (2 * 10e3 * 100e-9 * Math.Log(3)), Figure(answer, "frequency"), 1e-6, "frequency");
        Assert.True(answer.GetProperty("works").GetBoolean());
        // Normalised sensitivity of f to R and C is −1 (from f ∝ 1/RC).
        var analytic = answer.GetProperty("sensitivity").GetProperty("analyticFrequency");
        Near(-1, analytic.GetProperty("osc.r").GetDouble(), 1e-6, "S(osc.r)");
        // ±0.6068 to the divider resistors at β = 1/2 (derived from T = 2RC·ln((1+β)/(1−β)); shared/REFERENCE).
        Near(-0.6068, analytic.GetProperty("osc.r2").GetDouble(), 1e-3, "S(osc.r2)");
        // Lossy integrator: DC gain −Rf/Ri = −10 and corner 1/(2π·Rf·Ci) (Sedra & Smith, from memory).
        var integrator = answer.GetProperty("integrator");
        Near(-10, integrator.GetProperty("dcGain").GetDouble(), 1e-9, "DC gain");
        Near(1 / (2 * Math.PI * 1e6 * 100e-9), integrator.GetProperty("cornerHz").GetDouble(), 1e-9, "corner");

        Assert.Equal("measured", answer.GetProperty("simulation").GetProperty("outcome").GetString());
        var measured = answer.GetProperty("simulation").GetProperty("measured").GetProperty("frequency").GetDouble();
        Near(Figure(answer, "frequency"), measured, 0.01, "simulated frequency");
        Assert.All(answer.GetProperty("simulation").GetProperty("waveforms").EnumerateArray(),
            w => Assert.InRange(w.GetProperty("time").GetArrayLength(), 2, 200));

        foreach (var section in new[] { "worstCase", "rootSumSquare", "monteCarlo" })
            Assert.Equal(JsonValueKind.Object, answer.GetProperty(section).ValueKind);
        Assert.NotEmpty(answer.GetProperty("cautions").EnumerateArray());
        Assert.Equal("R1", answer.GetProperty("roles").EnumerateArray().First().GetProperty("designator").GetString());
    }

    [Fact]
    public async Task Worst_case_frequency_brackets_the_hand_computed_corners()
    {
        var body = CircuitRequests.ThreeStage();
        body["analysis"] = new JsonObject { ["methods"] = new JsonArray("worstCase"), ["waveformPoints"] = 0 };
        var answer = await Evaluate(body);
        var frequency = answer.GetProperty("worstCase").GetProperty("figures").EnumerateArray()
            .Single(f => f.GetProperty("figure").GetString() == "frequency");
        // f = 1/(2RC·ln((1+β)/(1−β))): lowest with R +1 %, C +5 % and β highest (r2 +1 %, r1 −1 %);
        // highest at the opposite corner. Computed here from the textbook formula (the ideal op-amp's
        // picosecond edges leave a residue near 1e-8).
        static double F(double r, double c, double r1, double r2)
        {
            var beta = r2 / (r1 + r2);
            return 1 / (2 * r * c * Math.Log((1 + beta) / (1 - beta)));
        }

        Near(F(10.1e3, 105e-9, 9.9e3, 10.1e3), frequency.GetProperty("min").GetDouble(), 1e-6, "worst-case min");
        Near(F(9.9e3, 95e-9, 10.1e3, 9.9e3), frequency.GetProperty("max").GetDouble(), 1e-6, "worst-case max");
        Assert.False(answer.TryGetProperty("monteCarlo", out _), "Monte Carlo was not asked for");
    }

    [Fact]
    public async Task A_headroom_spread_widens_the_loop_triangle_by_the_same_fraction()
    {
        // Loop triangle peak-to-peak = 2·L·R1/R2 with L the output swing (Sedra & Smith): with every part exact
        // and the swing 12 − 1.5 V ± 20 % of the 1.5 V headroom, the worst case is 2·(10.5 ∓ 0.3)·10/20.
        var body = CircuitRequests.Loop();
        foreach (var role in new[] { "sch.r1", "sch.r2", "int.r", "int.c", "cmp.ra", "cmp.pot", "cmp.rb" })
            body["roles"]![role]!["tolerance"] = 0.0;
        body["opAmp"]!["limits"]!["outputHeadroomHighV"] = 1.5;
        body["opAmp"]!["limits"]!["outputHeadroomLowV"] = 1.5;
        body["analysis"] = new JsonObject
        {
            ["methods"] = new JsonArray("worstCase"), ["headroomSpread"] = 0.2, ["waveformPoints"] = 0,
        };
        var answer = await Evaluate(body);
        var pp = answer.GetProperty("worstCase").GetProperty("figures").EnumerateArray()
            .Single(f => f.GetProperty("figure").GetString() == "trianglePeakToPeak");
        Near(2 * 10.2 * 0.5, pp.GetProperty("min").GetDouble(), 1e-6, "min peak-to-peak");
        Near(2 * 10.8 * 0.5, pp.GetProperty("max").GetDouble(), 1e-6, "max peak-to-peak");
    }

    [Fact]
    public async Task Loop_textbook_generator()
    {
        var answer = await Evaluate(CircuitRequests.Loop());
        // f = R2/(4·R1·Ri·Ci) = 5.000 kHz; triangle ±12·R1/R2 = ±6 V (Sedra & Smith).
        Near(20e3 / (4 * 10e3 * 10e3 * 10e-9), Figure(answer, "frequency"), 1e-6, "frequency");
        Near(12, Figure(answer, "trianglePeakToPeak"), 1e-6, "peak-to-peak");
        // Equal threshold resistors around the pot between ±12 V: the pot spans −4 V … +4 V, so the duty
        // D = (Vp − Vth)/(2Vp) runs from (6 + 4)/12 to (6 − 4)/12 (shared/REFERENCE, comparator and duty).
        Near(10.0 / 12, Figure(answer, "dutyAtSettingMin"), 1e-6, "duty at setting 0");
        Near(2.0 / 12, Figure(answer, "dutyAtSettingMax"), 1e-6, "duty at setting 1");
    }

    [Fact]
    public async Task The_same_seed_gives_the_same_monte_carlo_figures()
    {
        var first = await Evaluate(CircuitRequests.ThreeStage());
        var second = await Evaluate(CircuitRequests.ThreeStage());
        Assert.Equal(first.GetProperty("monteCarlo").GetRawText(), second.GetProperty("monteCarlo").GetRawText());
    }

    [Fact]
    public async Task A_loop_that_cannot_switch_is_a_failed_check_not_an_error()
    {
        // R1 > R2: the triangle would have to exceed the Schmitt's own swing to trip it (peak = L·R1/R2 > L).
        var body = CircuitRequests.Loop();
        body["roles"]!["sch.r1"] = CircuitRequests.Part("30k");
        var answer = await Evaluate(body);
        Assert.False(answer.GetProperty("works").GetBoolean());
        Assert.Contains(answer.GetProperty("checks").EnumerateArray(),
            c => !c.GetProperty("passed").GetBoolean() && c.GetProperty("severity").GetString() == "failure");
        Assert.Equal("doesNotOscillate", answer.GetProperty("simulation").GetProperty("outcome").GetString());
    }

    [Fact]
    public async Task Stocked_parts_are_looked_up_by_part_number()
    {
        await _client.CreatePart(Api.Resistor("EVAL-R-10K", 10e3, 0.01, 100));
        await _client.CreatePart(Api.Capacitor("EVAL-C-100N", 100e-9, 100));
        var opAmp = new
        {
            partNumber = "EVAL-U-QUAD", kind = "op-amp", initialQuantity = 10,
            opAmp = new
            {
                sections = 4, supplyMinV = 3.0, supplyMaxV = 44.0, gainBandwidthHz = 1e9, slewRateVPerS = 1e12,
                outputHeadroomLowV = 0.0, outputHeadroomHighV = 0.0, inputHeadroomLowV = -1.0, inputHeadroomHighV = -1.0,
                inputOffsetV = 0.0, outputCurrentMaxA = 0.05, quiescentCurrentPerSectionA = 1e-3, comparator = false, openDrain = false,
            },
        };
        Assert.Equal(HttpStatusCode.Created, (await _client.PostAsJsonAsync("/api/v1/parts", opAmp)).StatusCode);

        var body = CircuitRequests.ThreeStage();
        body["opAmp"] = new JsonObject { ["partNumber"] = "EVAL-U-QUAD" };
        body["roles"]!["osc.r"] = new JsonObject { ["partNumber"] = "EVAL-R-10K" };
        body["roles"]!["osc.c"] = new JsonObject { ["partNumber"] = "EVAL-C-100N" };
        var answer = await Evaluate(body);

        Near(1 / (2 * 10e3 * 100e-9 * Math.Log(3)), Figure(answer, "frequency"), 1e-6, "frequency (Sedra & Smith)");
        var oscC = answer.GetProperty("roles").EnumerateArray().Single(r => r.GetProperty("role").GetString() == "osc.c");
        Assert.Equal("EVAL-C-100N", oscC.GetProperty("partNumber").GetString());
        Assert.Equal("100 nF", oscC.GetProperty("written").GetString());
    }

    public static TheoryData<string, string> BadBodies => new()
    {
        { """{"topology":"spiral"}""", "topology" },
        { """{"roles":{"osc.q":{"value":"1k","tolerance":0.01}}}""", "roles.osc.q" },
        { """{"roles":{"osc.r":{"value":"-1k","tolerance":0.01}}}""", "roles.osc.r.value" },
        { """{"roles":{"osc.r":{"value":"4k7k","tolerance":0.01}}}""", "roles.osc.r.value" },
        { """{"roles":{"osc.r":{"value":"10k","toleranceCode":"Q"}}}""", "roles.osc.r.toleranceCode" },
        { """{"roles":{"osc.r":{"value":"10k","tolerance":1.5}}}""", "roles.osc.r.tolerance" },
        { """{"roles":{"osc.r":{"partNumber":"NO-SUCH-PART"}}}""", "roles.osc.r.partNumber" },
        { """{"opAmp":{"partNumber":"NO-SUCH-PART"}}""", "opAmp.partNumber" },
        { """{"opAmp":{"limits":{"sections":2}}}""", "opAmp.limits.slewRateVPerS" },
        { """{"opAmp":{"partNumber":"X","limits":{"sections":2}}}""", "opAmp" },
        { """{"analysis":{"samples":5}}""", "analysis.samples" },
        { """{"analysis":{"headroomSpread":1.5}}""", "analysis.headroomSpread" },
        { """{"analysis":{"methods":["guess"]}}""", "analysis.methods" },
        { """{"analysis":{"bands":[{"figure":"colour","min":1}]}}""", "analysis.bands[0].figure" },
        { """{"duty":{"adjust":"knob"}}""", "duty.adjust" },
    };

    [Theory]
    [MemberData(nameof(BadBodies))]
    public async Task Bad_input_is_a_400_naming_the_field(string patch, string field)
    {
        var body = CircuitRequests.ThreeStage();
        foreach (var (key, value) in JsonNode.Parse(patch)!.AsObject())
        {
            if (key == "roles")
            {
                foreach (var (role, part) in value!.AsObject())
                    body["roles"]![role] = part?.DeepClone();
            }
            else
            {
                body[key] = value?.DeepClone();
            }
        }

        var response = await _client.PostJson("/api/v1/circuits/evaluate", body.ToJsonString());
        (await response.AssertProblem(HttpStatusCode.BadRequest)).ErrorsFor(field);
    }

    [Fact]
    public async Task A_missing_role_is_named()
    {
        var body = CircuitRequests.ThreeStage();
        body["roles"]!.AsObject().Remove("int.rf");
        var response = await _client.PostJson("/api/v1/circuits/evaluate", body.ToJsonString());
        (await response.AssertProblem(HttpStatusCode.BadRequest)).ErrorsFor("roles.int.rf");
    }

    [Fact]
    public async Task A_supply_outside_the_op_amps_range_is_named()
    {
        var body = CircuitRequests.ThreeStage();
        body["supply"] = new JsonObject { ["positive"] = 30, ["negative"] = -30 }; // 60 V across a 44 V part
        var response = await _client.PostJson("/api/v1/circuits/evaluate", body.ToJsonString());
        (await response.AssertProblem(HttpStatusCode.BadRequest)).ErrorsFor("supply.positive");
    }

    [Theory]
    [InlineData("")]
    [InlineData("{\"topology\": ")]
    [InlineData("[1,2,3]")]
    [InlineData("{\"roles\": {\"osc.r\": {\"value\": true}}}")]
    public async Task Malformed_bodies_are_400_problems(string body)
    {
        var response = await _client.PostJson("/api/v1/circuits/evaluate", body);
        await response.AssertProblem(HttpStatusCode.BadRequest);
    }
}
