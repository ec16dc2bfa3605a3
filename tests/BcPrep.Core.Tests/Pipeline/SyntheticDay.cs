using System.Globalization;
using System.Text;
using BcPrep.Pipeline;
using BcPrep.Reading;
using BcPrep.Rig;
using BcPrep.Tests.Reading;

namespace BcPrep.Tests.Pipeline;

/// <summary>
/// A small generated test day: a rig file of direct-reading (SI) channels and a 1 Hz log of 600 s whose columns
/// hold a set value plus small seeded Gaussian noise, processed over one pinned window (20–580 s).
/// </summary>
internal sealed class SyntheticDay : IDisposable
{
    public const string Header = """
        [rig]
        name = "synthetic duct"

        [duct]
        inner_diameter = "100 mm"
        wall_roughness = "1.5 um"
        heated_length = "1.0 m"

        [duct.planes]
        meter = "-1 m"
        inlet = "0.1 m"
        outlet = "1.1 m"

        [log]
        time_column = "time"
        time_format = "seconds"
        separator = ","

        [[point]]
        id = "P1"
        start = "20 s"
        end = "580 s"

        """;

    private readonly TempFiles _files = new();
    private readonly List<(string Column, Func<double, double> Value, double Sigma)> _columns = [];
    private readonly StringBuilder _rig = new(Header);

    public string Folder => _files.Root;

    /// <summary>Adds a direct-reading channel in SI units with its own TOML keys (measures, plane, ...).</summary>
    public SyntheticDay Channel(string id, string keys, double value, double sigma, string uncertainty = "") =>
        Channel(id, keys, _ => value, sigma, uncertainty);

    /// <summary>As <see cref="Channel(string, string, double, double, string)"/> with a value that varies with time (s).</summary>
    public SyntheticDay Channel(string id, string keys, Func<double, double> value, double sigma, string uncertainty = "")
    {
        _rig.Append(CultureInfo.InvariantCulture, $"[[channel]]\nid = \"{id}\"\n{keys}\n");
        if (uncertainty.Length > 0)
        {
            _rig.Append(CultureInfo.InvariantCulture, $"uncertainty = [ {uncertainty} ]\n");
        }
        _rig.Append('\n');
        _columns.Add((id, value, sigma));
        return this;
    }

    public SyntheticDay Table(string toml)
    {
        _rig.Append(toml).Append("\n\n");
        return this;
    }

    public RigDescription Rig() => RigLoader.Load(_rig.ToString(), "synthetic.toml");

    public string RigText => _rig.ToString();

    public DayResult Process(bool monteCarlo = false)
    {
        var random = new Random(20261124);
        var log = new StringBuilder("time," + string.Join(',', _columns.Select(c => c.Column)) + "\n");
        for (var t = 0; t < 600; t++)
        {
            log.Append(t.ToString(CultureInfo.InvariantCulture));
            foreach (var (_, value, sigma) in _columns)
            {
                log.Append(',').Append((value(t) + (sigma * Gaussian(random))).ToString("R", CultureInfo.InvariantCulture));
            }
            log.Append('\n');
        }
        var path = _files.Write("day.csv", log.ToString());
        return DayProcessor.Process(Rig(), [LogInput.FromPath(path)], new ProcessOptions(MonteCarlo: monteCarlo));
    }

    public string WriteFile(string name, string text) => _files.Write(name, text);

    public void Dispose() => _files.Dispose();

    private static double Gaussian(Random random) =>
        Math.Sqrt(-2.0 * Math.Log(1.0 - random.NextDouble())) * Math.Cos(2.0 * Math.PI * random.NextDouble());

    /// <summary>Rig keys of a direct-reading channel.</summary>
    public static string Direct(string measures, string unit, string extra = "") =>
        $"measures = \"{measures}\"\nsensor = \"direct\"\nunit = \"{unit}\"\n{extra}";
}
