using Placement.IO;
using ScottPlot;

namespace Placement.Plots;

/// <summary>Saves a figure as PNG or SVG (chosen by extension), atomically and without silently overwriting.</summary>
public static class FigureFile
{
    /// <summary>Default figure width in logical pixels (SVG size; PNG is <see cref="DefaultPngScale"/> × larger).</summary>
    public const int DefaultWidth = 800;

    /// <summary>Default figure height in logical pixels.</summary>
    public const int DefaultHeight = 600;

    /// <summary>Default PNG resolution multiplier (2 → 1600 × 1200 pixels, crisp on a projector).</summary>
    public const double DefaultPngScale = 2.0;

    /// <summary>Renders <paramref name="plot"/> to <paramref name="path"/> (<c>.png</c> or <c>.svg</c>).</summary>
    /// <param name="plot">A figure from one of the figure classes (or any ScottPlot plot).</param>
    /// <param name="path">Output path; the extension chooses the format.</param>
    /// <param name="overwrite">Replace an existing file.</param>
    /// <param name="width">Width in logical pixels, ≥ 100.</param>
    /// <param name="height">Height in logical pixels, ≥ 100.</param>
    /// <param name="pngScale">PNG pixels per logical pixel, in [0.5, 8].</param>
    /// <exception cref="ArgumentException">The extension is not .png or .svg.</exception>
    /// <exception cref="ArgumentOutOfRangeException">Size or scale out of range.</exception>
    /// <exception cref="OutputFileExistsException">The file exists and <paramref name="overwrite"/> is false.</exception>
    /// <exception cref="DirectoryNotFoundException">The target directory does not exist.</exception>
    public static void Save(Plot plot, string path, bool overwrite = false, int width = DefaultWidth, int height = DefaultHeight, double pngScale = DefaultPngScale)
    {
        ArgumentNullException.ThrowIfNull(plot);
        ArgumentNullException.ThrowIfNull(path);
        ArgumentOutOfRangeException.ThrowIfLessThan(width, 100);
        ArgumentOutOfRangeException.ThrowIfLessThan(height, 100);
        if (!(pngScale >= 0.5 && pngScale <= 8)) throw new ArgumentOutOfRangeException(nameof(pngScale), pngScale, "Expected a PNG scale in [0.5, 8].");
        byte[] content = Path.GetExtension(path).ToLowerInvariant() switch
        {
            ".png" => Png(plot, width, height, pngScale),
            ".svg" => Svg(plot, width, height),
            var other => throw new ArgumentException($"Cannot tell the image format of '{path}' from '{other}'; expected .png or .svg.", nameof(path)),
        };
        AtomicFile.Write(path, overwrite, stream => stream.Write(content));
    }

    /// <summary>PNG bytes of the figure at <paramref name="scale"/> × the logical size.</summary>
    public static byte[] Png(Plot plot, int width = DefaultWidth, int height = DefaultHeight, double scale = DefaultPngScale)
    {
        ArgumentNullException.ThrowIfNull(plot);
        plot.ScaleFactor = scale;
        try
        {
            return plot.GetImageBytes((int)Math.Round(width * scale), (int)Math.Round(height * scale), ImageFormat.Png);
        }
        finally
        {
            plot.ScaleFactor = 1;
        }
    }

    /// <summary>SVG document (UTF-8 bytes) of the figure at its logical size.</summary>
    public static byte[] Svg(Plot plot, int width = DefaultWidth, int height = DefaultHeight)
    {
        ArgumentNullException.ThrowIfNull(plot);
        plot.ScaleFactor = 1;
        return System.Text.Encoding.UTF8.GetBytes(plot.GetSvgXml(width, height));
    }
}
