using System.Text.Json;

namespace Placement.Commands;

/// <summary>The JSON settings every command uses for <c>--json</c> output.</summary>
internal static class CliJson
{
    public static JsonSerializerOptions Options { get; } = new()
    {
        WriteIndented = true,
        PropertyNamingPolicy = JsonNamingPolicy.CamelCase,
        NumberHandling = System.Text.Json.Serialization.JsonNumberHandling.AllowNamedFloatingPointLiterals,
    };
}
