using System.Globalization;
using System.Text;
using System.Text.RegularExpressions;

namespace BcPrep.Tests.Cli.Commands;

/// <summary>A scratch folder with variants of the sample rig file and synthetic logs for detection tests.</summary>
internal sealed class DetectionScratch : IDisposable
{
    public DetectionScratch()
    {
        Root = Path.Combine(Path.GetTempPath(), "bcprep-cli-tests-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(Root);
    }

    public string Root { get; }

    public static string SampleRig => Path.Combine(RepoRoot.Path, "sample-logs", "marten-rig.toml");

    public static string[] SampleLogs =>
        [.. Directory.GetFiles(Path.Combine(RepoRoot.Path, "sample-logs"), "*.csv").Order(StringComparer.Ordinal)];

    /// <summary>The sample rig with its [[point]] tables removed, then those given here appended.</summary>
    public string RigWithPoints(params (string Id, string Start, string End)[] points)
    {
        var text = Regex.Replace(File.ReadAllText(SampleRig), @"\[\[point\]\]\s*\nid = ""[^""]*""\s*\nstart = ""[^""]*""\s*\nend = ""[^""]*""\s*\n", "");
        var extra = new StringBuilder();
        foreach (var (id, start, end) in points)
        {
            extra.Append(CultureInfo.InvariantCulture, $"\n[[point]]\nid = \"{id}\"\nstart = \"{start}\"\nend = \"{end}\"\n");
        }
        var path = Path.Combine(Root, "rig.toml");
        File.WriteAllText(path, text + extra);
        return path;
    }

    /// <summary>
    /// A 40 min log at 1 Hz in the sample rig's columns where everything is steady (flow 0.025 kg/s) except the
    /// outlet thermocouple, whose emf rises 0.02 mV per minute (about 0.5 K/min for type K near 320 K): a day that
    /// only drifts.
    /// </summary>
    public string DriftingLog()
    {
        var rng = new Random(42);
        var text = new StringBuilder("timestamp,PBARO_V,PT_IN_V,PT_OUT_V,FM_MA,RTD_CJ_OHM,TC_IN_MV,TC_OUT_MV,TC_W1_MV,TC_W2_MV,TC_W3_MV,TC_W4_MV,HTR_V_SIG,HTR_I_SIG\n");
        var start = new DateTime(2026, 11, 24, 9, 0, 0, DateTimeKind.Unspecified);
        for (var i = 0; i < 2400; i++)
        {
            double Noise(double sd) => sd * (rng.NextDouble() - 0.5) * 3.46; // uniform, standard deviation sd
            text.Append(start.AddSeconds(i).ToString("yyyy-MM-ddTHH:mm:ss.fff", CultureInfo.InvariantCulture));
            foreach (var value in new[]
            {
                3.1 + Noise(0.001), 0.9 + Noise(0.001), 0.8 + Noise(0.001), 12.0 + Noise(0.01), 109.35 + Noise(0.004),
                -0.1 + Noise(0.002), 1.0 + (0.02 * i / 60.0) + Noise(0.002), 3.0 + Noise(0.002), 3.1 + Noise(0.002),
                3.2 + Noise(0.002), 3.3 + Noise(0.002), 0.9 + Noise(0.001), 0.8 + Noise(0.001),
            })
            {
                text.Append(',').Append(value.ToString("F5", CultureInfo.InvariantCulture));
            }
            text.Append('\n');
        }
        var path = Path.Combine(Root, "drifting.csv");
        File.WriteAllText(path, text.ToString());
        return path;
    }

    public void Dispose()
    {
        try
        {
            Directory.Delete(Root, recursive: true);
        }
        catch (IOException)
        {
        }
    }
}
