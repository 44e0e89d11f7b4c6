using ScottPlot;
using SkiaSharp;

namespace Placement.Plots;

/// <summary>
/// The bundled DejaVu Sans typeface (embedded resource) and its registration with ScottPlot, so that text
/// renders identically on every machine, including headless ones with no fonts installed.
/// </summary>
/// <remarks>
/// DejaVu Sans is distributed under the Bitstream Vera licence (with public-domain DejaVu changes); the
/// licence text ships as Fonts/DejaVu-LICENSE.txt. <see cref="Register"/> puts a resolver at the front of
/// ScottPlot's process-wide <c>Fonts.FontResolvers</c> list that answers the family name
/// <see cref="FamilyName"/> with the embedded typeface (for every weight and slant, since only the regular
/// face is bundled). It is idempotent and thread-safe; every figure calls it.
/// </remarks>
public static class PlotFont
{
    /// <summary>Family name figures ask ScottPlot for.</summary>
    public const string FamilyName = "DejaVu Sans";

    private const string ResourceName = "Placement.Plots.Fonts.DejaVuSans.ttf";
    private static readonly Lazy<SKTypeface> s_typeface = new(Load, LazyThreadSafetyMode.ExecutionAndPublication);
    private static readonly object s_gate = new();
    private static bool s_registered;

    /// <summary>The embedded typeface (loaded once from the assembly's resources).</summary>
    /// <exception cref="InvalidOperationException">The resource is missing or is not a font (a broken build).</exception>
    public static SKTypeface Typeface => s_typeface.Value;

    /// <summary>Registers the embedded font with ScottPlot (once per process).</summary>
    public static void Register()
    {
        lock (s_gate)
        {
            if (s_registered) return;
            Fonts.FontResolvers.Insert(0, new EmbeddedFontResolver());
            s_registered = true;
        }
    }

    private static SKTypeface Load()
    {
        using var stream = typeof(PlotFont).Assembly.GetManifestResourceStream(ResourceName)
            ?? throw new InvalidOperationException($"Embedded font resource '{ResourceName}' is missing from {typeof(PlotFont).Assembly.GetName().Name}.");
        using var data = SKData.Create(stream);
        return SKTypeface.FromData(data)
            ?? throw new InvalidOperationException($"Embedded resource '{ResourceName}' is not a readable font.");
    }

    /// <summary>Answers <see cref="FamilyName"/> with the embedded typeface; other names fall through to ScottPlot's other resolvers.</summary>
    private sealed class EmbeddedFontResolver : IFontResolver
    {
        public SKTypeface? CreateTypeface(string fontName, FontWeight weight, FontSlant slant, FontSpacing spacing) =>
            string.Equals(fontName, FamilyName, StringComparison.OrdinalIgnoreCase) ? Typeface : null;

        public SKTypeface? CreateTypeface(string fontName, bool bold, bool italic) =>
            string.Equals(fontName, FamilyName, StringComparison.OrdinalIgnoreCase) ? Typeface : null;
    }
}
