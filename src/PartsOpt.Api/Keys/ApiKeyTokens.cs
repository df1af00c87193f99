using System.Security.Cryptography;
using System.Text;

namespace PartsOpt.Api.Keys;

/// <summary>
/// Key text: "po_" and 32 random bytes (256 bits) in base64url, recognisable to a secret scanner. A key
/// this random needs no salt or slow hash: SHA-256 of the text is what is stored and looked up.
/// </summary>
public static class ApiKeyTokens
{
    public const string Marker = "po_";
    public const int MaxLength = 100;
    private const int RandomBytes = 32;
    private const int PrefixLength = 10;

    public static string Generate() =>
        Marker + Convert.ToBase64String(RandomNumberGenerator.GetBytes(RandomBytes))
            .TrimEnd('=').Replace('+', '-').Replace('/', '_');

    public static byte[] Hash(string key) => SHA256.HashData(Encoding.UTF8.GetBytes(key));

    /// <summary>What a list shows of a key: enough to tell keys apart, far too little to guess the rest.</summary>
    public static string PrefixOf(string key) => key[..Math.Min(PrefixLength, key.Length)];

    public static bool Matches(byte[] stored, byte[] presented) => CryptographicOperations.FixedTimeEquals(stored, presented);
}
