using BcPrep.Report;
using ScottPlot;

namespace BcPrep.Tests.Report;

/// <summary>
/// The figures use the fonts embedded in BcPrep.Report, not whatever the machine has: a CI runner or a server often
/// has no font files at all, and ScottPlot then draws no text without a word of warning.
/// </summary>
public sealed class ReportFontsTests
{
    [Fact]
    public void Registration_makes_the_embedded_DejaVu_Sans_the_default_and_answers_first()
    {
        ReportFonts.Register();
        ReportFonts.Register();

        Assert.Equal("DejaVu Sans", Fonts.Default);
        var first = Fonts.FontResolvers.First();
        Assert.Equal("EmbeddedFontResolver", first.GetType().Name);
        Assert.Single(Fonts.FontResolvers, r => r.GetType() == first.GetType());
        using var regular = first.CreateTypeface("DejaVu Sans", false, false);
        using var bold = first.CreateTypeface("DejaVu Sans", true, false);
        Assert.NotNull(regular);
        Assert.NotNull(bold);
        Assert.Equal("DejaVu Sans", regular.FamilyName);
        Assert.Equal(400, regular.FontWeight);
        Assert.Equal(700, bold.FontWeight);
        // Another family is left to the other resolvers.
        Assert.Null(first.CreateTypeface("Some Other Family", false, false));
    }
}
