using System.Net;
using System.Text.RegularExpressions;
using BcPrep.Pipeline;
using BcPrep.Report;
using BcPrep.Writing;

namespace BcPrep.Tests.Report;

/// <summary>
/// The report names, units and values of its quantities come from the one quantity table (<see cref="PointOutputs"/>)
/// and the point's GUM result, never from strings of its own (no external source: a consistency property).
/// </summary>
public sealed partial class ReportQuantitiesTests
{
    private static readonly Lazy<DayReportFiles> Report = new(() => DayReport.Build(SampleDays.Day));

    [GeneratedRegex("<h2>Operating points</h2>\n<table[^>]*>\n<thead><tr>(.*?)</tr></thead>\n<tbody>\n(.*?)</tbody>", RegexOptions.Singleline)]
    private static partial Regex PointsTable();

    [GeneratedRegex("<t[hd]>(.*?)</t[hd]>", RegexOptions.Singleline)]
    private static partial Regex Cell();

    [GeneratedRegex("<tr>(.*?)</tr>", RegexOptions.Singleline)]
    private static partial Regex Row();

    [Fact]
    public void Every_quantity_of_the_report_is_an_entry_of_the_table_whose_unit_the_point_model_carries()
    {
        foreach (var quantity in ReportPage.SummaryQuantities.Concat(BudgetFigure.Quantities))
        {
            Assert.Contains(PointOutputs.Scalars, s => ReferenceEquals(s, quantity));
            foreach (var point in SampleDays.Day.Points)
            {
                var definition = Assert.Single(point.Model.Outputs, o => o.Name == quantity.Name);
                Assert.Equal(quantity.Unit, definition.Unit);
                Assert.Equal(QuantityKind.Scalar, definition.Kind);
            }
        }
    }

    [Fact]
    public void Points_table_heads_each_quantity_with_its_table_name_and_unit_and_shows_that_output_of_each_point()
    {
        var match = PointsTable().Match(Report.Value.Html);
        Assert.True(match.Success, "the page has no operating-points table");
        var header = Cells(match.Groups[1].Value);
        var rows = Row().Matches(match.Groups[2].Value).Select(r => Cells(r.Groups[1].Value)).ToList();
        // Columns: point, window, origin, one per quantity the day's points define, checks.
        var present = ReportPage.SummaryQuantities.Where(q => SampleDays.Day.Points.Any(p => p.Output(q) is not null)).ToList();
        Assert.Equal(ReportPage.SummaryQuantities.Count, present.Count);
        Assert.Equal(present.Select(q => $"{q.Name} [{q.Unit}]"), header.Skip(3).Take(present.Count));
        Assert.Equal(SampleDays.Day.Points.Count, rows.Count);
        foreach (var (point, row) in SampleDays.Day.Points.Zip(rows))
        {
            Assert.Equal(point.Id, row[0]);
            for (var j = 0; j < present.Count; j++)
            {
                var output = point.Output(present[j])!;
                // The cell is the output's value ± U through the one shared formatter (JCGM 100 7.2.6).
                Assert.Equal(MeasurementText.WithUncertainty(output.Estimate, output.ExpandedUncertainty).Replace(" ± ", " ±\u00A0", StringComparison.Ordinal), row[3 + j]);
            }
        }
    }

    [Fact]
    public void Each_budget_figure_is_named_and_captioned_by_its_table_entry()
    {
        foreach (var point in SampleDays.Day.Points)
        {
            foreach (var quantity in BudgetFigure.Quantities)
            {
                var output = point.Output(quantity)!;
                var path = $"{DayOutputs.SafeName(point.Id)}/budget-{DayOutputs.SafeName(quantity.Name)}.png";
                var figure = Assert.Single(Report.Value.Figures, f => f.RelativePath == path);
                Assert.StartsWith($"{point.Id}: {quantity.Name}, y ± u_c = {MeasurementText.WithUncertainty(output.Estimate, output.StandardUncertainty)};", figure.Caption, StringComparison.Ordinal);
            }
        }
    }

    /// <summary>The text of each cell: the break hints of long names removed, entities decoded.</summary>
    private static List<string> Cells(string rowHtml) =>
        Cell().Matches(rowHtml).Select(c => WebUtility.HtmlDecode(c.Groups[1].Value.Replace("<wbr>", "", StringComparison.Ordinal))).ToList();
}
