// Compiled into every project built with Placement.Sdk (switch off with PlacementGenerateEntryPoint=false).
// It hosts the full placement command set and registers the samplers and writers this project defines.

namespace Placement.Sdk.Generated;

internal static class PlacementHostEntryPoint
{
    public static int Main(string[] args) =>
        global::Placement.Commands.CliApp.Run(
            args, global::System.Console.Out, global::System.Console.Error,
            plugins: [typeof(PlacementHostEntryPoint).Assembly]);
}
