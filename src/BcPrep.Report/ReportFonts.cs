using ScottPlot;
using SkiaSharp;

namespace BcPrep.Report;

/// <summary>
/// The report's typeface, DejaVu Sans (regular and bold), carried inside this assembly. ScottPlot draws no text at
/// all when it finds no font file (a bare server has none), so the report brings its own and makes it the default.
/// Embedding (rather than copying files beside the binary) works the same from <c>dotnet run</c>, from tests and
/// from a published binary. Licence: assets/fonts/LICENSE-DejaVu.txt.
/// </summary>
public static class ReportFonts
{
    /// <summary>The family name every figure uses.</summary>
    public const string Family = "DejaVu Sans";

    private static readonly Lock Gate = new();
    private static bool _registered;

    /// <summary>Registers the embedded fonts with ScottPlot once per process and makes them the default; idempotent and thread-safe.</summary>
    public static void Register()
    {
        lock (Gate)
        {
            if (_registered)
            {
                return;
            }
            var resolver = new EmbeddedFontResolver(Family, Load("DejaVuSans.ttf"), Load("DejaVuSans-Bold.ttf"));
            Fonts.FontResolvers.Insert(0, resolver);
            Fonts.Default = Family;
            Fonts.Sans = Family;
            _registered = true;
        }
    }

    private static byte[] Load(string file)
    {
        var name = "BcPrep.Report.Fonts." + file;
        using var stream = typeof(ReportFonts).Assembly.GetManifestResourceStream(name)
                           ?? throw new InvalidOperationException($"font resource {name} is missing from the build");
        using var copy = new MemoryStream();
        stream.CopyTo(copy);
        return copy.ToArray();
    }

    /// <summary>Answers ScottPlot's requests for <see cref="Family"/> from font bytes held in memory.</summary>
    private sealed class EmbeddedFontResolver(string family, byte[] regular, byte[] bold) : IFontResolver
    {
        public SKTypeface? CreateTypeface(string fontName, FontWeight weight, FontSlant slant, FontSpacing spacing) =>
            CreateTypeface(fontName, weight >= FontWeight.SemiBold, slant != FontSlant.Upright);

        // ScottPlot disposes the typefaces it is given, so each request gets a new instance.
        public SKTypeface? CreateTypeface(string fontName, bool isBold, bool italic) =>
            string.Equals(fontName, family, StringComparison.OrdinalIgnoreCase)
                ? SKTypeface.FromData(SKData.CreateCopy(isBold ? bold : regular))
                : null;
    }
}
