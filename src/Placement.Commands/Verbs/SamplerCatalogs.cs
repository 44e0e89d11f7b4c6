using Placement.Samplers;

namespace Placement.Commands.Verbs;

/// <summary>The sampler catalogue of a run: the built-ins plus every sampler found in the context's plug-in assemblies.</summary>
internal static class SamplerCatalogs
{
    public static SamplerCatalog For(CliContext context)
    {
        var catalog = SamplerCatalog.CreateDefault();
        foreach (var assembly in context.Plugins)
        {
            try
            {
                catalog.RegisterFromAssembly(assembly);
            }
            catch (ArgumentException ex)
            {
                throw new CliException(ExitCodes.Usage, $"plug-in assembly {assembly.GetName().Name}: {ex.Message}");
            }
        }
        return catalog;
    }

    public static IPointSampler Create(CliContext context, string name)
    {
        var catalog = For(context);
        try
        {
            return catalog.Create(name);
        }
        catch (KeyNotFoundException ex)
        {
            throw new CliException(ExitCodes.Usage, ex.Message);
        }
    }
}
