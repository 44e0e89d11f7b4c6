using System.Globalization;
using System.Text.Json;
using System.Text.Json.Nodes;
using Placement.IO;
using Spectre.Console;

namespace Placement.Commands.Reports;

/// <summary>Prints the body section as terminal tables and writes it into the JSON report.</summary>
internal static class BodyTables
{
    private static readonly CultureInfo C = CultureInfo.InvariantCulture;

    public static void Write(IAnsiConsole console, BodyReport report)
    {
        if (report.Thermodynamics is { } t)
        {
            var table = new Table().Title(Markup.Escape($"thermodynamics: gamma = {t.Gamma:G6}, u from {t.EnergySource}, matched {t.Match}, point density {t.PointDensity}"))
                .AddColumns("quantity", "rms deviation", "max deviation", "meaning");
            table.AddRow("pressure", Percent(t.PressureDeviation.Rms), Percent(t.PressureDeviation.Max), Markup.Escape("(γ-1) ρ_pt u against P(r)"));
            table.AddRow("entropy", Percent(t.EntropyDeviation.Rms), Percent(t.EntropyDeviation.Max), Markup.Escape("(γ-1) u ρ_pt^(1-γ) against K = P/ρ^γ"));
            table.AddRow("density", Percent(t.DensityDeviation.Rms), Percent(t.DensityDeviation.Max), Markup.Escape("point estimate ρ_pt against ρ(r)"));
            console.Write(table);
            console.WriteLine("columns: " + string.Join(", ", t.Columns.Select(c => $"{c.Key} [{c.Value}]"))
                + (t.UndefinedPoints > 0 ? $"; {t.UndefinedPoints} points at the surface have u = 0" : ""));
        }
        if (report.Resolution is { } r)
        {
            var table = new Table().Title(Markup.Escape($"cells per pressure scale height (spacing from {r.Spacing})"))
                .AddColumns(Markup.Escape($"r [{r.LengthUnit}]"), Markup.Escape($"H_P [{r.LengthUnit}]"), Markup.Escape($"spacing [{r.LengthUnit}]"), "cells/H_P", "N needed");
            int step = Math.Max(1, r.Radius.Length / 10);
            for (int i = step - 1; i < r.Radius.Length; i += step)
                table.AddRow(r.Radius[i].ToString("G5", C), r.ScaleHeight[i].ToString("G4", C), r.SpacingLength[i].ToString("G4", C),
                    r.CellsPerScaleHeight[i].ToString("F2", C), double.IsNaN(r.PointsNeededPerBin[i]) ? "-" : r.PointsNeededPerBin[i].ToString("G3", C));
            console.Write(table);
            console.WriteLine(string.Create(C, $"fewest cells per H_P: {r.MinimumCellsPerScaleHeight:F2} at r = {r.LimitingRadius:G4} {r.LengthUnit} (window r >= {r.InnerRadius:G4}, inside {r.MassFraction:P1} of the mass)")
                + (double.IsNaN(r.Threshold) ? "; no threshold set (--resolution-threshold)" : string.Create(C, $"; points needed for {r.Threshold:G3} cells per H_P: {r.PointsNeeded:G3}")));
        }
        if (report.Energy is { } e)
        {
            var table = new Table().Title(Markup.Escape($"energy budget [{e.EnergyUnit}], gravity by {(e.OpeningAngle == 0 ? "pairwise sum" : $"octree, theta = {e.OpeningAngle:G3}")}"))
                .AddColumns("energy", "points", "profile", "points/profile - 1");
            table.AddRow("gravitational W", E(e.Points.Gravitational), E(e.Profile.Gravitational), Percent((e.Points.Gravitational) / e.Profile.Gravitational - 1));
            if (e.Profile.CorePotential != 0)
                table.AddRow("in the core's field W_c", E(e.Points.CorePotential), E(e.Profile.CorePotential), Percent(e.Points.CorePotential / e.Profile.CorePotential - 1));
            table.AddRow("thermal U", E(e.Points.Thermal), E(e.Profile.Thermal), Percent(e.ThermalDeviation));
            table.AddRow("kinetic K / rotational T", E(e.Points.Kinetic), E(e.Profile.Kinetic), Percent(e.KineticDeviation));
            table.AddRow("total", E(e.Points.Total), E(e.Profile.Total), "");
            table.AddRow(Markup.Escape("virial (2K+3(γ-1)U)/(-W)"), F(e.Points.VirialRatio), F(e.Profile.VirialRatio), "");
            console.Write(table);
        }
    }

    /// <summary>The JSON report: the quality report (when checked) with a top-level "body" property added, or only the body section.</summary>
    public static string ReportJson(string? qualityJson, BodyReport body, int pointCount)
    {
        var root = qualityJson is null ? new JsonObject { ["pointCount"] = pointCount } : JsonNode.Parse(qualityJson)!.AsObject();
        root["body"] = JsonSerializer.SerializeToNode(body, CliJson.Options);
        return root.ToJsonString(CliJson.Options);
    }

    /// <summary>Writes the body-only JSON report atomically.</summary>
    public static void WriteReport(CliContext context, string path, BodyReport body, int pointCount, bool overwrite)
    {
        string json = ReportJson(null, body, pointCount);
        AtomicFile.Write(path, overwrite, stream =>
        {
            using var writer = new StreamWriter(stream, leaveOpen: true);
            writer.Write(json);
        });
        context.Info($"wrote body report {path}");
    }

    private static string Percent(double v) => double.IsNaN(v) ? "-" : v.ToString("P3", C);

    private static string E(double v) => double.IsNaN(v) ? "-" : v.ToString("G6", C);

    private static string F(double v) => double.IsNaN(v) ? "-" : v.ToString("F4", C);
}
