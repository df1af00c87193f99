using System.Globalization;
using System.Text.Json;
using System.Text.Json.Serialization;
using PartsOpt.Values;

namespace PartsOpt.Api.Circuits;

/// <summary>
/// A part value as the client wrote it: a JSON number in SI units, or text ("4k7", "100n", "4.7 kΩ") that is
/// read once the role, and so the quantity, is known: "100n" is 100 nF in a capacitor role.
/// </summary>
[JsonConverter(typeof(PartValueJson))]
public readonly record struct PartValue(double? Number, string? Text)
{
    /// <summary>The value in SI units for <paramref name="quantity"/>, or null where the text does not read.</summary>
    public double? Read(Quantity quantity) =>
        Number ?? (EngineeringValue.TryParse(Text, quantity, out var value) ? value : null);

    /// <summary>As written, for messages.</summary>
    public override string ToString() => Text ?? Number?.ToString("R", CultureInfo.InvariantCulture) ?? "";
}

/// <summary>Reads a number or a string; writes a number where there is one.</summary>
public sealed class PartValueJson : JsonConverter<PartValue>
{
    public override PartValue Read(ref Utf8JsonReader reader, Type typeToConvert, JsonSerializerOptions options) =>
        reader.TokenType switch
        {
            JsonTokenType.Number when reader.TryGetDouble(out var number) && double.IsFinite(number) => new PartValue(number, null),
            JsonTokenType.String => new PartValue(null, reader.GetString()),
            _ => throw new JsonException("A part value is a number in SI units or text such as \"4k7\" or \"100n\"."),
        };

    public override void Write(Utf8JsonWriter writer, PartValue value, JsonSerializerOptions options)
    {
        if (value.Number is { } number)
            writer.WriteNumberValue(number);
        else
            writer.WriteStringValue(value.Text);
    }
}
