using System.Security.Cryptography;
using System.Text;

namespace PartsOpt.Api.Webhooks;

/// <summary>
/// The headers every delivery carries and its signature: v1 = hex HMAC-SHA256 keyed with the secret's
/// UTF-8 bytes over "{timestamp}.{body}" (docs/webhooks.md has the receiver's recipe).
/// </summary>
public static class WebhookSignature
{
    public const string EventIdHeader = "PartsOpt-Event-Id";
    public const string EventTypeHeader = "PartsOpt-Event-Type";
    public const string TimestampHeader = "PartsOpt-Timestamp";
    public const string SignatureHeader = "PartsOpt-Signature";
    /// <summary>Names the algorithm in the header value, so a receiver sees what to compute.</summary>
    public const string Scheme = "hmac-sha256";

    public static string Sign(string secret, long unixSeconds, byte[] body)
    {
        var prefix = Encoding.UTF8.GetBytes(unixSeconds.ToString(System.Globalization.CultureInfo.InvariantCulture) + ".");
        var message = new byte[prefix.Length + body.Length];
        prefix.CopyTo(message, 0);
        body.CopyTo(message, prefix.Length);
        var mac = HMACSHA256.HashData(Encoding.UTF8.GetBytes(secret), message);
        return $"{Scheme}={Convert.ToHexStringLower(mac)}";
    }

    /// <summary>A new secret: 256 random bits as 64 hex digits.</summary>
    public static string NewSecret() => Convert.ToHexStringLower(RandomNumberGenerator.GetBytes(32));
}
