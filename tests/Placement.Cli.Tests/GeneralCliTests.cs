using System.Text.Json;
using Placement.Commands;

namespace Placement.Commands.Tests;

public class GeneralCliTests
{
    [Fact]
    public void UnknownOption_GivesUsageExitCode_AndNamesTheOption()
    {
        var (code, _, error) = CliRunner.Run("kernels", "--no-such-option");
        Assert.Equal(ExitCodes.Usage, code);
        Assert.Contains("--no-such-option", error);
    }

    [Fact]
    public void Help_ListsExitCodes()
    {
        var (code, output, _) = CliRunner.Run("--help");
        Assert.Equal(ExitCodes.Ok, code);
        Assert.Contains("Exit codes", output);
    }

    [Fact]
    public void Kernels_Json_IsParseableAndListsAllKernels()
    {
        var (code, output, _) = CliRunner.Run("kernels", "--json");
        Assert.Equal(ExitCodes.Ok, code);
        using var doc = JsonDocument.Parse(output);
        Assert.Equal(4, doc.RootElement.GetArrayLength());
        Assert.Equal("cubic-spline", doc.RootElement[0].GetProperty("name").GetString());
    }
}
