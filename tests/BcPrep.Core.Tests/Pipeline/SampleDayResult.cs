using BcPrep.Pipeline;
using BcPrep.Reading;
using BcPrep.Rig;

namespace BcPrep.Tests.Pipeline;

/// <summary>The bundled sample day (sample-logs/), processed once per test run and shared by the pipeline-level tests.</summary>
internal static class SampleDayResult
{
    private static readonly Lazy<DayResult> Day = new(() => Process(new ProcessOptions()));

    public static DayResult Gum => Day.Value;

    public static RigDescription Rig() => RigLoader.Load(File.ReadAllText(RigPath), RigPath);

    public static DayResult Process(ProcessOptions options) =>
        DayProcessor.Process(Rig(), Logs(), options);

    public static PointResult Point(string id) => Gum.Points.Single(p => p.Id == id);

    private static string RigPath => Path.Combine(RepoRoot.Path, "tests", "marten-rig-pinned.toml");

    private static List<LogInput> Logs() =>
        Directory.GetFiles(Path.Combine(RepoRoot.Path, "sample-logs"), "*.csv").Order(StringComparer.Ordinal).Select(LogInput.FromPath).ToList();
}
