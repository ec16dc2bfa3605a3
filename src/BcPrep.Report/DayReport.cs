using BcPrep.Pipeline;
using BcPrep.Writing;

namespace BcPrep.Report;

/// <summary>All files of the report: figures and the page, paths relative to the report folder.</summary>
public sealed record DayReportFiles(IReadOnlyList<ReportFigure> Figures, string Html)
{
    /// <summary>Every file with its path under <paramref name="folder"/> (e.g. "report/"), the page last.</summary>
    public IEnumerable<(string RelativePath, byte[] Content)> Files(string folder) =>
        Figures.Select(f => (folder + f.RelativePath, f.Png))
            .Append((folder + DayReport.PageName, new System.Text.UTF8Encoding(false).GetBytes(Html)));
}

/// <summary>
/// The test-day report, a writing-side stage: a pure function from a processed day to PNG figures and one offline
/// HTML page. Nothing here touches the file system; the caller commits the files with the other outputs.
/// </summary>
public static class DayReport
{
    /// <summary>Folder of the report inside the output folder.</summary>
    public const string Folder = "report/";

    /// <summary>The page's file name inside <see cref="Folder"/>.</summary>
    public const string PageName = "index.html";

    /// <summary>Builds every figure and the page. Figure paths: day-CHANNEL.png, then per point ID/inlet-velocity.png, ID/inlet-temperature.png (with a rake) and ID/budget-QUANTITY.png.</summary>
    public static DayReportFiles Build(DayResult day)
    {
        var dayFigures = DayChannelFigure.Channels(day)
            .Select(c => DayChannelFigure.Render(day, c, $"day-{DayOutputs.SafeName(c)}.png"))
            .ToList();
        var pointFigures = new Dictionary<string, IReadOnlyList<ReportFigure>>(StringComparer.Ordinal);
        foreach (var point in day.Points)
        {
            var folder = DayOutputs.SafeName(point.Id) + "/";
            var figures = new List<ReportFigure> { InletProfileFigures.Velocity(day, point, folder + "inlet-velocity.png") };
            if (InletProfileFigures.Temperature(day, point, folder + "inlet-temperature.png") is { } temperature)
            {
                figures.Add(temperature);
            }
            figures.AddRange(BudgetFigure.Quantities
                .Select(q => BudgetFigure.Render(point, q, folder + "budget-" + DayOutputs.SafeName(q.Name) + ".png"))
                .OfType<ReportFigure>());
            pointFigures[point.Id] = figures;
        }
        var all = dayFigures.Concat(pointFigures.Values.SelectMany(f => f)).ToList();
        return new DayReportFiles(all, ReportPage.Build(day, dayFigures, pointFigures));
    }
}
