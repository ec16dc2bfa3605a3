using BcPrep.Report;
using BcPrep.Writing;

namespace BcPrep.Tests.Report;

/// <summary>The committed report opens in a real browser (headless Chromium) and every figure loads.</summary>
public sealed class BrowserPageTests
{
    // Added to a copy of the page only, never to the page BcPrep writes: after the load event it lists every image
    // with its decoded size (naturalWidth is 0 for an image that failed to load) in a <pre> that --dump-dom prints.
    private const string Probe = """
        <img src="no-such-figure.png" alt="control: must fail">
        <script>
        window.addEventListener('load', function () {
          var lines = [];
          document.querySelectorAll('img').forEach(function (img) {
            lines.push((img.complete && img.naturalWidth > 0 ? 'loaded ' : 'failed ') + img.naturalWidth + 'x' + img.naturalHeight + ' ' + img.getAttribute('src'));
          });
          var pre = document.createElement('pre');
          pre.id = 'image-check';
          pre.textContent = lines.join('\n');
          document.body.appendChild(pre);
        });
        </script>
        """;

    [SkippableFact]
    public void Every_figure_of_the_committed_report_loads_in_headless_chromium()
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
            File.WriteAllText(probePage, File.ReadAllText(page).Replace("</body>", Probe + "\n</body>", StringComparison.Ordinal));

            var dom = HeadlessBrowser.DumpDom(probePage, Path.Combine(root, "profile"));

            var check = dom[(dom.IndexOf("<pre id=\"image-check\">", StringComparison.Ordinal) + 22)..];
            var lines = check[..check.IndexOf("</pre>", StringComparison.Ordinal)].Split('\n');
            Assert.Equal(report.Figures.Count + 1, lines.Length);
            foreach (var figure in report.Figures)
            {
                Assert.Contains($"loaded {figure.WidthPx}x{figure.HeightPx} {figure.RelativePath}", lines);
            }
            // The control image proves that the probe can see a failure.
            Assert.Contains("failed 0x0 no-such-figure.png", lines);
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
