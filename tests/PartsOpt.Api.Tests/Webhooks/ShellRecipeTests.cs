using System.Diagnostics;

namespace PartsOpt.Api.Tests.Webhooks;

/// <summary>
/// The openssl recipe in docs/webhooks.md, run as written (the ```sh block is read from the file) against a
/// delivery the service really made. Needs bash and openssl on the PATH, as CI's image has.
/// </summary>
public sealed class ShellRecipeTests
{
    [Fact]
    public async Task The_documented_openssl_recipe_accepts_a_real_delivery_and_rejects_a_tampered_one()
    {
        var doc = await File.ReadAllTextAsync(Path.Combine(Repository.Root, "docs", "webhooks.md"));
        var start = doc.IndexOf("```sh\n", StringComparison.Ordinal) + "```sh\n".Length;
        var script = doc[start..doc.IndexOf("```", start, StringComparison.Ordinal)];

        await using var receiver = await Receiver.StartAsync();
        using var factory = Webhook.Factory();
        var client = factory.CreateClient();
        var subscription = await client.Subscribe(receiver.Url, "stock.imported");
        receiver.Secret = subscription.Secret;
        await client.Import("R-SH-1,resistor,4k7,J,5,0");
        await Webhook.Eventually(() => !receiver.Raw.IsEmpty, "a delivery");
        receiver.Raw.TryPeek(out var delivery);

        Assert.Equal("verified", await RunAsync(script, subscription.Secret, delivery.Timestamp, delivery.Signature, delivery.Body));
        var tampered = delivery.Body.ToArray();
        tampered[^2] ^= 1;
        Assert.Equal("REJECT", await RunAsync(script, subscription.Secret, delivery.Timestamp, delivery.Signature, tampered));
        // A different first character (the secret itself may start with "0").
        var wrongSecret = (subscription.Secret[0] == '0' ? "1" : "0") + subscription.Secret[1..];
        Assert.Equal("REJECT", await RunAsync(script, wrongSecret, delivery.Timestamp, delivery.Signature, delivery.Body));
        var stale = (long.Parse(delivery.Timestamp, System.Globalization.CultureInfo.InvariantCulture) - 600)
            .ToString(System.Globalization.CultureInfo.InvariantCulture);
        Assert.Equal("REJECT", await RunAsync(script, subscription.Secret, stale, delivery.Signature, delivery.Body));
    }

    private static async Task<string> RunAsync(string script, string secret, string timestamp, string signature, byte[] body)
    {
        var folder = Directory.CreateTempSubdirectory("partsopt-recipe-");
        try
        {
            await File.WriteAllBytesAsync(Path.Combine(folder.FullName, "body.json"), body);
            var start = new ProcessStartInfo("bash", ["-c", script])
            {
                WorkingDirectory = folder.FullName,
                RedirectStandardOutput = true,
                RedirectStandardError = true,
                Environment = { ["SECRET"] = secret, ["TS"] = timestamp, ["SIG"] = signature },
            };
            using var process = Process.Start(start)!;
            var output = await process.StandardOutput.ReadToEndAsync();
            await process.WaitForExitAsync();
            return output.Trim();
        }
        finally
        {
            folder.Delete(recursive: true);
        }
    }
}
