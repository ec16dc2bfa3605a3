using BcPrep.Report;
using BcPrep.Writing;

namespace BcPrep.Tests.Report;

/// <summary>
/// The sample day's report committed to a temporary folder, opened in headless Chromium with a probe script added
/// to a copy of the page (never to the page BcPrep writes); the probe writes its findings into a <c>&lt;pre&gt;</c>
/// with a known id, which <c>--dump-dom</c> prints and this returns line by line.
/// </summary>
internal static class ProbedSampleReport
{
    public static (DayReportFiles Report, string[] Lines) Open(string probe, string preId, int? windowWidthPx = null)
    {
        var root = Path.Combine(Path.GetTempPath(), "bcprep-report-" + Guid.NewGuid().ToString("N"));
        try
        {
            var report = DayReport.Build(SampleDays.Day);
            var files = new OutputFileSet();
            foreach (var (path, content) in report.Files(DayReport.Folder))
            {
                files.Add(path, content);
            }
            files.Commit(Path.Combine(root, "out"));
            var page = Path.Combine(root, "out", "report", DayReport.PageName);
            var probePage = Path.Combine(root, "out", "report", "probe.html");
            File.WriteAllText(probePage, File.ReadAllText(page).Replace("</body>", probe + "\n</body>", StringComparison.Ordinal));

            var dom = HeadlessBrowser.DumpDom(probePage, Path.Combine(root, "profile"), windowWidthPx);

            var open = $"<pre id=\"{preId}\">";
            var check = dom[(dom.IndexOf(open, StringComparison.Ordinal) + open.Length)..];
            return (report, check[..check.IndexOf("</pre>", StringComparison.Ordinal)].Split('\n'));
        }
        finally
        {
            if (Directory.Exists(root))
            {
                Directory.Delete(root, recursive: true);
            }
        }
    }
}
