using System.CommandLine;
using System.Globalization;
using System.Text.Json;
using Placement.Sph;
using Spectre.Console;

namespace Placement.Commands.Verbs;

/// <summary><c>placement kernels</c>: lists the SPH kernels the density check can use.</summary>
internal static class KernelsCommand
{
    public static Command Create(CliContext context)
    {
        var command = new Command("kernels", "List the SPH smoothing kernels available to the density check (Dehnen & Aly 2012 forms).");
        command.SetAction(_ =>
        {
            if (context.Json)
            {
                var rows = SphKernel.All.Select(k => new { name = k.Name, normalisation = k.Normalisation, supportOverSmoothingLength = k.SupportOverSmoothingLength });
                context.Output.WriteLine(JsonSerializer.Serialize(rows, CliJson.Options));
                return ExitCodes.Ok;
            }
            var table = new Table().AddColumns("kernel", "C (3-D)", "H/h");
            foreach (var k in SphKernel.All)
                table.AddRow(k.Name, k.Normalisation.ToString("F6", CultureInfo.InvariantCulture), k.SupportOverSmoothingLength.ToString("F6", CultureInfo.InvariantCulture));
            context.Console.Write(table);
            return ExitCodes.Ok;
        });
        return command;
    }
}
