using BcPrep.Pipeline;
using BcPrep.Reading;
using BcPrep.Rig;

namespace BcPrep.Tests.Report;

/// <summary>The bundled sample day processed once per test run, and a variant whose inlet temperature comes from a radial rake.</summary>
internal static class SampleDays
{
    private static readonly Lazy<DayResult> Plain = new(() => Process(File.ReadAllText(RigPath)));
    private static readonly Lazy<DayResult> WithRake = new(() => Process(RakeRig()));

    public static DayResult Day => Plain.Value;

    /// <summary>The sample day with t_in turned into a rake sensor on the axis and a second rake sensor (same column) at 20 mm.</summary>
    public static DayResult RakeDay => WithRake.Value;

    private static string RigPath => Path.Combine(RepoRoot.Path, "tests", "marten-rig-pinned.toml");

    private static string RakeRig()
    {
        var text = File.ReadAllText(RigPath);
        const string Inlet = "id = \"t_in\"\ncolumn = \"TC_IN_MV\"\nmeasures = \"bulk_temperature\"\nplane = \"inlet\"\n";
        Assert.Contains(Inlet, text, StringComparison.Ordinal);
        var rake = text.Replace(Inlet, Inlet + "radius = \"0 mm\"\n", StringComparison.Ordinal);
        return rake + """

            [[channel]]
            id = "t_in_r20"
            column = "TC_IN_MV"
            measures = "bulk_temperature"
            plane = "inlet"
            radius = "20 mm"
            sensor = "thermocouple"
            type = "K"
            raw_unit = "mV"
            cold_junction = "t_cj"
            uncertainty = [ { kind = "class", class = "1", source = "IEC 60584-1 class 1" } ]

            """;
    }

    private static DayResult Process(string rigText) =>
        DayProcessor.Process(RigLoader.Load(rigText, RigPath), Logs(), new ProcessOptions());

    private static List<LogInput> Logs() =>
        Directory.GetFiles(Path.Combine(RepoRoot.Path, "sample-logs"), "*.csv").Order(StringComparer.Ordinal).Select(LogInput.FromPath).ToList();
}
