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
        var (report, lines) = ProbedSampleReport.Open(Probe, "image-check");

        Assert.Equal(report.Figures.Count + 1, lines.Length);
        foreach (var figure in report.Figures)
        {
            Assert.Contains($"loaded {figure.WidthPx}x{figure.HeightPx} {figure.RelativePath}", lines);
        }
        // The control image proves that the probe can see a failure.
        Assert.Contains("failed 0x0 no-such-figure.png", lines);
    }
}
