using System.Text.Json;
using System.Text.Json.Serialization;
using PartsOpt.Values;

namespace PartsOpt.Api.Parts;

/// <summary>
/// Value fields take a JSON number in SI units (4700) or the text a person types ("4k7", "4.7 kΩ", "100n"),
/// read by <see cref="EngineeringValue"/> for the field's quantity. Always written as a number. Text that
/// does not read (including "NaN" and "Infinity") fails binding, and the problem names the field.
/// </summary>
public abstract class ValueJsonConverter(Quantity quantity) : JsonConverter<double?>
{
    public override bool HandleNull => true;

    public override double? Read(ref Utf8JsonReader reader, Type typeToConvert, JsonSerializerOptions options)
    {
        switch (reader.TokenType)
        {
            case JsonTokenType.Null:
                return null;
            case JsonTokenType.Number when reader.TryGetDouble(out var number) && double.IsFinite(number):
                return number;
            case JsonTokenType.String when EngineeringValue.TryParse(reader.GetString(), quantity, out var value):
                return value;
            default:
                // The wording the exception handler recognises as "wrong value for this field".
                throw new JsonException($"The JSON value could not be converted to a {quantity.ToString().ToLowerInvariant()} value.");
        }
    }

    public override void Write(Utf8JsonWriter writer, double? value, JsonSerializerOptions options)
    {
        if (value is { } v)
            writer.WriteNumberValue(v);
        else
            writer.WriteNullValue();
    }
}

public sealed class OhmsJson() : ValueJsonConverter(Quantity.Resistance);
public sealed class FaradsJson() : ValueJsonConverter(Quantity.Capacitance);
public sealed class VoltsJson() : ValueJsonConverter(Quantity.Voltage);
public sealed class AmpsJson() : ValueJsonConverter(Quantity.Current);
public sealed class HertzJson() : ValueJsonConverter(Quantity.Frequency);
public sealed class WattsJson() : ValueJsonConverter(Quantity.Power);
