using System.Text.Json;
using System.Text.Json.Serialization;

namespace Placement.Quality;

/// <summary>JSON form of a <see cref="QualityReport"/> (System.Text.Json, source-generated; NaN written as "NaN").</summary>
public static class QualityJson
{
    /// <summary>The report as indented JSON (camelCase names).</summary>
    /// <exception cref="ArgumentNullException"><paramref name="report"/> is null.</exception>
    public static string Serialize(QualityReport report)
    {
        ArgumentNullException.ThrowIfNull(report);
        return JsonSerializer.Serialize(report, QualityJsonContext.Default.QualityReport);
    }

    /// <summary>Reads a report written by <see cref="Serialize"/>.</summary>
    /// <exception cref="JsonException">The text is not a quality report.</exception>
    public static QualityReport Deserialize(string json)
    {
        ArgumentNullException.ThrowIfNull(json);
        return JsonSerializer.Deserialize(json, QualityJsonContext.Default.QualityReport)
            ?? throw new JsonException("The JSON text holds no quality report.");
    }
}

/// <summary>Source-generated serialiser metadata for the quality report types.</summary>
[JsonSourceGenerationOptions(WriteIndented = true, PropertyNamingPolicy = JsonKnownNamingPolicy.CamelCase,
    NumberHandling = JsonNumberHandling.AllowNamedFloatingPointLiterals)]
[JsonSerializable(typeof(QualityReport))]
internal sealed partial class QualityJsonContext : JsonSerializerContext;
