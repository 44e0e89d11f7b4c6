using System.CommandLine;
using System.Text.Json;
using Spectre.Console;

namespace Placement.Commands.Verbs;

/// <summary><c>placement samplers</c>: lists the samplers (built-in and plug-in) with their parameters.</summary>
internal static class SamplersCommand
{
    public static Command Create(CliContext context)
    {
        var command = new Command("samplers", "List the samplers available (built-in and from plug-ins) with their parameters, defaults and units.");
        command.SetAction(_ =>
        {
            var all = SamplerCatalogs.For(context).DescribeAll();
            if (context.Json)
            {
                var rows = all.Select(d => new
                {
                    name = d.Name,
                    summary = d.Summary,
                    parameters = d.Parameters.Select(p => new { name = p.Name, kind = p.Kind.ToString(), @default = p.DefaultText, unit = p.Unit, help = p.Help, choices = p.Choices }),
                });
                context.Output.WriteLine(JsonSerializer.Serialize(rows, CliJson.Options));
                return ExitCodes.Ok;
            }
            foreach (var d in all)
            {
                context.Console.Write(new Rule($"[bold]{Markup.Escape(d.Name)}[/]").LeftJustified());
                context.Console.WriteLine(d.Summary);
                if (d.Parameters.Count == 0) continue;
                var table = new Table().AddColumns("parameter", "default", "unit", "meaning");
                foreach (var p in d.Parameters)
                    table.AddRow(Markup.Escape(p.Name), Markup.Escape(p.DefaultText), Markup.Escape(p.Unit), Markup.Escape(p.Help + (p.Choices.Count > 0 ? $" ({string.Join(" | ", p.Choices)})" : "")));
                context.Console.Write(table);
            }
            return ExitCodes.Ok;
        });
        return command;
    }
}
