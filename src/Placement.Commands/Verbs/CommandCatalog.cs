using System.CommandLine;

namespace Placement.Commands.Verbs;

/// <summary>The list of sub-commands of the tool, in the order <c>--help</c> shows them.</summary>
internal static class CommandCatalog
{
    public static IEnumerable<Command> Create(CliContext context)
    {
        yield return DemoCommand.Create(context);
        yield return PlaceCommand.Create(context);
        yield return CheckCommand.Create(context);
        yield return CompareCommand.Create(context);
        yield return InspectCommand.Create(context);
        yield return SamplersCommand.Create(context);
        yield return KernelsCommand.Create(context);
    }
}
