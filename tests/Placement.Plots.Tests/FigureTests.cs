using System.Xml.Linq;
using Placement.IO;
using ScottPlot;
using SkiaSharp;

namespace Placement.Plots.Tests;

public class FigureTests
{
    public static TheoryData<string> Kinds => new() { "density", "mass-error", "histogram", "slice" };

    private static Plot Build(string kind) => kind switch
    {
        "density" => DensityProfileFigure.Create(FigureSamples.Density()),
        "mass-error" => EnclosedMassErrorFigure.Create(FigureSamples.MassError()),
        "histogram" => CellVolumeHistogramFigure.Create(FigureSamples.Histogram()),
        _ => SliceScatterFigure.Create(FigureSamples.Slice()),
    };

    /// <summary>Labels each figure must show (axis labels with units, pretty-printed).</summary>
    private static string[] Labels(string kind) => kind switch
    {
        "density" => ["Radius r [R☉]", "Density ρ [M☉/R☉³]", "Density profile", "target ρ(r)", "10⁻¹"],
        "mass-error" => ["Radius r [R☉]", "Enclosed-mass error ΔM/M [%]", "±1 % tolerance"],
        "histogram" => ["ln(V ρ / m)", "Probability density", "Poisson baseline (σ = "],
        _ => ["x [R☉]", "y [R☉]", "Cell-volume error ln(V ρ / m)", "Slice |z| < 0.1 R☉ ("],
    };

    [Theory]
    [MemberData(nameof(Kinds))]
    public void Png_HasValidSignatureRightSizeAndIsNotBlank(string kind)
    {
        using var dir = new TempDir();
        string path = dir.File(kind + ".png");
        FigureFile.Save(Build(kind), path);

        byte[] bytes = File.ReadAllBytes(path);
        // PNG signature (PNG specification, ISO/IEC 15948, section 5.2).
        Assert.Equal(new byte[] { 0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A }, bytes[..8]);
        using var bitmap = SKBitmap.Decode(bytes);
        Assert.Equal(1600, bitmap.Width);
        Assert.Equal(1200, bitmap.Height);
        var (variance, inked) = Ink(bitmap, new SKRectI(0, 0, bitmap.Width, bitmap.Height));
        // A blank or single-colour image has zero variance; a real figure (text, axes, data) has far more
        // than 1 % of its pixels away from white. Both thresholds are loose on purpose.
        Assert.True(variance > 100, $"luminance variance {variance} too small: image looks blank");
        Assert.True(inked > 0.01, $"only {inked:P2} of pixels are not white");
        Assert.Equal([Path.GetFileName(path)], Directory.GetFiles(dir.Path).Select(Path.GetFileName));
    }

    [Theory]
    [MemberData(nameof(Kinds))]
    public void Svg_IsXml_WithTextElementsCarryingTheLabelsInTheBundledFont(string kind)
    {
        using var dir = new TempDir();
        string path = dir.File(kind + ".svg");
        FigureFile.Save(Build(kind), path);

        var doc = XDocument.Load(path);
        XNamespace svg = "http://www.w3.org/2000/svg";
        var texts = doc.Descendants(svg + "text").ToArray();
        Assert.NotEmpty(texts);
        var strings = texts.Select(t => t.Value.Trim()).ToArray();
        foreach (string label in Labels(kind))
            Assert.Contains(strings, s => s.StartsWith(label, StringComparison.Ordinal));
        Assert.All(texts, t => Assert.Equal(PlotFont.FamilyName, (string?)t.Attribute("font-family")));
    }

    [Fact]
    public void EmbeddedFont_IsDejaVuSans_AndHasEveryGlyphTheFiguresUse()
    {
        var typeface = PlotFont.Typeface;
        Assert.Equal("DejaVu Sans", typeface.FamilyName);
        using var font = new SKFont(typeface, 16);
        const string used = "Radius rρ[]()☉⁰¹²³⁴⁵⁶⁷⁸⁹⁻−±ΔMσ%|<>=/ln0123456789.,Probabilitydensity";
        ushort[] glyphs = font.GetGlyphs(used);
        // Glyph id 0 is the "missing glyph" (.notdef) in TrueType fonts (OpenType specification, 'cmap').
        Assert.DoesNotContain((ushort)0, glyphs);
    }

    [Fact]
    public void ScottPlot_ResolvesTheFamilyToTheEmbeddedTypeface()
    {
        PlotFont.Register();
        PlotFont.Register(); // idempotent
        Assert.Same(PlotFont.Typeface, Fonts.GetTypeface(PlotFont.FamilyName, bold: false, italic: false));
        Assert.Same(PlotFont.Typeface, Fonts.GetTypeface(PlotFont.FamilyName, bold: true, italic: false));
    }

    [Fact]
    public void Title_IsDrawnWithGlyphs()
    {
        // Two plots without axes, grid or data, differing only in the title: all ink must come from the title's glyphs.
        static (double Variance, double Inked) TitleStrip(string title)
        {
            var plot = FigureStyle.NewPlot(title, "", "");
            plot.HideAxesAndGrid();
            plot.Axes.Title.IsVisible = true;
            using var bitmap = SKBitmap.Decode(FigureFile.Png(plot, 400, 300, 1));
            return Ink(bitmap, new SKRectI(0, 0, bitmap.Width, bitmap.Height));
        }
        var with = TitleStrip("Placement ρ☉ r³");
        var without = TitleStrip(" ");
        Assert.True(without.Inked < 1e-9, $"plot without title has ink {without.Inked:P3}");
        // The blank twin has exactly zero ink; a line of 20-px text on 400 × 300 inks a few tenths of a percent.
        Assert.True(with.Variance > 10 && with.Inked > 0.002, $"title did not render (variance {with.Variance}, inked {with.Inked:P3})");
    }

    [Fact]
    public void Save_RefusesToOverwrite_LeavesExistingFile_AndRejectsUnknownExtensions()
    {
        using var dir = new TempDir();
        string path = dir.File("a.png");
        File.WriteAllText(path, "precious");
        var plot = Build("density");
        var e = Assert.Throws<OutputFileExistsException>(() => FigureFile.Save(plot, path));
        Assert.Contains(path, e.Message, StringComparison.Ordinal);
        Assert.Equal("precious", File.ReadAllText(path));
        FigureFile.Save(plot, path, overwrite: true);
        Assert.NotEqual("precious", File.ReadAllText(path));
        Assert.Throws<ArgumentException>(() => FigureFile.Save(plot, dir.File("a.jpg")));
        Assert.Equal(["a.png"], Directory.GetFiles(dir.Path).Select(Path.GetFileName));
    }

    [Fact]
    public void Figures_RejectMismatchedOrEmptyInput_WithClearMessages()
    {
        var d = FigureSamples.Density();
        var e = Assert.Throws<ArgumentException>(() => DensityProfileFigure.Create(d with { MeasuredDensity = new double[3] }));
        Assert.Contains("MeasuredRadius has 25 values but MeasuredDensity has 3", e.Message, StringComparison.Ordinal);
        var s = FigureSamples.Slice(50);
        Assert.Contains("No point lies in the slab", Assert.Throws<ArgumentException>(() =>
            SliceScatterFigure.Create(s with { Z = Enumerable.Repeat(5.0, 50).ToArray() })).Message, StringComparison.Ordinal);
        Assert.Throws<ArgumentException>(() => SliceScatterFigure.Create(s with { SlabHalfWidth = 0 }));
        Assert.Throws<ArgumentException>(() => EnclosedMassErrorFigure.Create(FigureSamples.MassError() with { Tolerance = -1 }));
        Assert.Throws<ArgumentException>(() => CellVolumeHistogramFigure.Create(new CellVolumeHistogramData([double.NaN], [])));
    }

    [Fact]
    public void HistogramDensity_IntegratesToOne_WhenAllValuesFallInTheBins()
    {
        var values = Enumerable.Range(0, 1000).Select(i => i / 1000.0).ToArray();
        double width = 1.0 / 20;
        var density = CellVolumeHistogramFigure.Density(values, 0, width, 20);
        // Sum of density × width is the fraction of values inside the range (here all of them), to rounding.
        Assert.Equal(1.0, density.Sum() * width, 12);
        var (x, y) = CellVolumeHistogramFigure.Outline(density, 0, width);
        Assert.Equal(42, x.Length);
        Assert.Equal(0.0, y[0]);
        Assert.Equal(0.0, y[^1]);
    }

    [Theory]
    [InlineData("M_sun/R_sun^3", "M☉/R☉³")]
    [InlineData("cm^-3", "cm⁻³")]
    [InlineData("g/(cm s^2)", "g/(cm s²)")]
    [InlineData("R_sun^12", "R☉¹²")]
    [InlineData("a^b", "a^b")]
    public void UnitLabel_Pretty_UsesSuperscriptsAndTheSolarSymbol(string unit, string expected) =>
        Assert.Equal(expected, UnitLabel.Pretty(unit));

    [Fact]
    public void LinearAxisFormat_UsesTrueMinusAndDropsFloatingNoise()
    {
        Assert.Equal("−0.3", LinearAxis.Format(-0.30000000000000004));
        Assert.Equal("0", LinearAxis.Format(0));
        Assert.Equal("1.5", LinearAxis.Format(1.5));
    }

    /// <summary>Luminance variance and fraction of non-white pixels in a rectangle.</summary>
    private static (double Variance, double Inked) Ink(SKBitmap bitmap, SKRectI rect)
    {
        double sum = 0, sum2 = 0;
        long count = 0, inked = 0;
        for (int y = rect.Top; y < rect.Bottom; y++)
            for (int x = rect.Left; x < rect.Right; x++)
            {
                var c = bitmap.GetPixel(x, y);
                double l = 0.2126 * c.Red + 0.7152 * c.Green + 0.0722 * c.Blue;
                sum += l;
                sum2 += l * l;
                count++;
                if (l < 240) inked++;
            }
        double mean = sum / count;
        return (sum2 / count - mean * mean, (double)inked / count);
    }
}

internal sealed class TempDir : IDisposable
{
    public TempDir()
    {
        Path = System.IO.Path.Combine(System.IO.Path.GetTempPath(), "placement-plot-tests-" + Guid.NewGuid().ToString("N")[..10]);
        Directory.CreateDirectory(Path);
    }

    public string Path { get; }

    public string File(string name) => System.IO.Path.Combine(Path, name);

    public void Dispose()
    {
        try { Directory.Delete(Path, recursive: true); } catch (IOException) { }
    }
}
