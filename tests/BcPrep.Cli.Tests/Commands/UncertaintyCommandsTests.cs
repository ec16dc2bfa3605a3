using System.Globalization;
using BcPrep.Cli;

namespace BcPrep.Tests.Cli.Commands;

/// <summary>budget, covariance and ensemble run in-process on the bundled sample day.</summary>
public class UncertaintyCommandsTests
{
    private static readonly string Rig = Path.Combine(RepoRoot.Path, "tests", "marten-rig-pinned.toml");

    private static readonly string[] Logs = Directory.GetFiles(Path.Combine(RepoRoot.Path, "sample-logs"), "*.csv").Order(StringComparer.Ordinal).ToArray();

    [Fact]
    public void Budget_of_one_quantity_lists_its_inputs_whose_shares_add_up_to_one()
    {
        var (code, output, error) = Run(["budget", Rig, .. Logs, "--point", "OP1", "--quantity", "inlet.temperature"]);

        Assert.True(code == 0, error);
        var rows = DataRows(output);
        Assert.Equal("point,quantity,unit,input,type,input_estimate,input_standard_uncertainty,input_degrees_of_freedom,sensitivity,contribution,variance_share,source", Lines(output)[0]);
        Assert.All(rows, r => Assert.Equal(["OP1", "inlet.temperature"], r.Take(2)));
        Assert.Contains(rows, r => r[3] == "t_in: IEC 60584-1 class 1");
        Assert.Contains(rows, r => r[3] == "t_cj: IEC 60751 class A");
        Assert.Equal(1.0, rows.Sum(r => Number(r[10])), 1e-9); // independent inputs: shares sum to 1
        Assert.Equal("", error);
    }

    [Fact]
    public void Welch_Satterthwaite_degrees_of_freedom_are_reproduced_from_budget_and_scalars_files()
    {
        // JCGM 100 7.2.7 asks for each input's degrees of freedom so that the effective ν can be recomputed:
        // ν_eff = u_c⁴ / Σ (cᵢ·u(xᵢ))⁴ / νᵢ (JCGM 100 G.4.1, eq. G.2b), truncated down (G.6.4). Empty ν = infinite.
        // The point model's inputs are independent (README), so the plain G.2b formula applies.
        using var temp = new Support.TempFolder();
        var outDir = temp.File("out");
        Assert.Equal(0, Support.CliRunner.Run(Support.SampleDay.ProcessArgs(outDir)).ExitCode);
        var checkedCount = 0;
        foreach (var point in new[] { "OP1", "OP2", "OP3" })
        {
            var folder = Path.Combine(outDir, "points", point);
            var budgetText = File.ReadAllText(Path.Combine(folder, "budget.csv"));
            var header = Lines(budgetText).First(l => !l.StartsWith('#')).Split(',');
            var quantityColumn = Array.IndexOf(header, "quantity");
            var nuColumn = Array.IndexOf(header, "input_degrees_of_freedom");
            var contributionColumn = Array.IndexOf(header, "contribution");
            var budget = DataRows(budgetText);
            foreach (var scalar in DataRows(File.ReadAllText(Path.Combine(folder, "scalars.csv"))))
            {
                var (name, uc, written) = (scalar[0], Number(scalar[3]), scalar[6]);
                var denominator = budget.Where(r => r[quantityColumn] == name && r[nuColumn] != "")
                    .Sum(r => Math.Pow(Number(r[contributionColumn]), 4) / Number(r[nuColumn]));
                if (written == "")
                {
                    Assert.True(denominator == 0.0, $"{point} {name}: infinite ν written, but finite-ν inputs contribute");
                    continue;
                }

                var nuEff = Math.Pow(uc, 4) / denominator;
                var nu = Number(written);
                Assert.True(nu <= nuEff * (1 + 1e-9) && nuEff < (nu + 1) * (1 + 1e-9), $"{point} {name}: written ν {nu}, recomputed ν_eff {nuEff}");
                checkedCount++;
            }
        }

        Assert.True(checkedCount >= 30, $"only {checkedCount} finite-ν scalars checked");
    }

    [Fact]
    public void Budget_for_an_unknown_point_or_quantity_is_a_usage_error_that_names_what_exists()
    {
        var (code, output, error) = Run(["budget", Rig, .. Logs, "--point", "OP9"]);
        Assert.Equal(ExitCodes.UsageOrRigFile, code);
        Assert.Equal("", output);
        Assert.Contains("OP1, OP2, OP3", error, StringComparison.Ordinal);

        (code, output, error) = Run(["budget", Rig, .. Logs, "--quantity", "inlet.temprature"]);
        Assert.Equal(ExitCodes.UsageOrRigFile, code);
        Assert.Contains("inlet.temperature", error, StringComparison.Ordinal);
    }

    [Fact]
    public void Covariance_long_and_matrix_layouts_agree_and_are_symmetric()
    {
        var (code, longText, error) = Run(["covariance", Rig, .. Logs, "--point", "OP2"]);
        Assert.True(code == 0, error);
        var pairs = DataRows(longText).ToDictionary(r => (r[1], r[2]), r => (Covariance: Number(r[4]), Correlation: r[5]));
        var names = pairs.Keys.Select(k => k.Item1).Distinct().ToList();
        Assert.Equal(names.Count * names.Count, pairs.Count);
        Assert.DoesNotContain(names, n => n.StartsWith("inlet.velocity.", StringComparison.Ordinal));
        foreach (var ((a, b), value) in pairs)
        {
            Assert.Equal(value.Covariance, pairs[(b, a)].Covariance);
        }

        Assert.True(Number(pairs[("inlet.static_pressure", "outlet.static_pressure")].Correlation) > 0.7);
        Assert.Equal("Pa*K", DataRows(longText).First(r => r[1] == "inlet.static_pressure" && r[2] == "inlet.temperature")[3]);

        (code, var matrixText, error) = Run(["covariance", Rig, .. Logs, "--point", "OP2", "--square", "--correlation"]);
        Assert.True(code == 0, error);
        var header = Lines(matrixText).First(l => !l.StartsWith('#')).Split(',');
        var matrix = DataRows(matrixText);
        Assert.Equal(names.Count, matrix.Count);
        for (var i = 0; i < matrix.Count; i++)
        {
            Assert.Equal("1", matrix[i][3 + i]);
            for (var j = 0; j < matrix.Count; j++)
            {
                Assert.Equal(pairs[(matrix[i][1], matrix[j][1])].Correlation, matrix[i][3 + j]);
            }
        }

        Assert.Equal("inlet.static_pressure [Pa]", header[3]);
    }

    [Fact]
    public void Ensemble_with_a_seed_is_byte_identical_and_every_member_profile_carries_its_own_mass_flow()
    {
        var first = TempFolder();
        var second = TempFolder();
        try
        {
            string[] args = ["ensemble", Rig, .. Logs, "--point", "OP3", "--samples", "4", "--seed", "17"];
            var (code, output, error) = Run([.. args, "--out", first]);
            Assert.True(code == 0, error);
            Assert.Equal("", output);
            (code, _, error) = Run([.. args, "--out", second]);
            Assert.True(code == 0, error);

            var files = Directory.GetFiles(first, "*", SearchOption.AllDirectories).Select(f => Path.GetRelativePath(first, f)).Order(StringComparer.Ordinal).ToList();
            Assert.Equal(files, Directory.GetFiles(second, "*", SearchOption.AllDirectories).Select(f => Path.GetRelativePath(second, f)).Order(StringComparer.Ordinal));
            Assert.Equal(3 + (4 * 4), files.Count); // index, inputs, ensemble.json + four tables per member
            foreach (var file in files)
            {
                Assert.Equal(File.ReadAllBytes(Path.Combine(first, file)), File.ReadAllBytes(Path.Combine(second, file)));
            }

            var index = DataRows(File.ReadAllText(Path.Combine(first, "index.csv")));
            Assert.Equal(4, index.Count);
            var indexHeader = Lines(File.ReadAllText(Path.Combine(first, "index.csv"))).First(l => !l.StartsWith('#')).Split(',');
            var flowColumn = Array.IndexOf(indexHeader, "mass_flow [kg/s]");
            var densityColumn = Array.IndexOf(indexHeader, "inlet.density [kg/m3]");
            Assert.Equal(4, index.Select(r => r[flowColumn]).Distinct().Count());
            foreach (var row in index)
            {
                var profile = DataRows(File.ReadAllText(Path.Combine(first, row[1], "inlet-profile.csv")));
                var radius = profile.Select(r => Number(r[0])).ToArray();
                var velocity = profile.Select(r => Number(r[1])).ToArray();
                Assert.All(profile, r => Assert.Equal("", r[2])); // a member carries no uncertainty of its own
                var massFlow = Number(row[flowColumn]);
                Assert.Equal(massFlow, Number(row[densityColumn]) * Trapezoid(radius, velocity), massFlow * 1e-3);

                var scalars = DataRows(File.ReadAllText(Path.Combine(first, row[1], "scalars.csv")));
                Assert.Equal(row[flowColumn], scalars.Single(r => r[0] == "mass_flow")[2]);
            }
        }
        finally
        {
            Delete(first);
            Delete(second);
        }
    }

    [Fact]
    public void Ensemble_latin_hypercube_replaces_an_earlier_ensemble_but_refuses_a_foreign_folder_and_a_size_beyond_the_bound()
    {
        var folder = TempFolder();
        try
        {
            var (code, _, error) = Run(["ensemble", Rig, .. Logs, "--point", "OP1", "--samples", "3", "--out", folder]);
            Assert.True(code == 0, error);
            (code, _, error) = Run(["ensemble", Rig, .. Logs, "--point", "OP1", "--samples", "2", "--latin-hypercube", "--out", folder]);
            Assert.True(code == 0, error);
            Assert.Equal(["0001", "0002"], Directory.GetDirectories(Path.Combine(folder, "members")).Select(Path.GetFileName).Order(StringComparer.Ordinal));
            var index = DataRows(File.ReadAllText(Path.Combine(folder, "index.csv")));
            Assert.All(index, r => Assert.Equal("", r[2]));
            Assert.Contains("\"sampling\": \"latin_hypercube\"", File.ReadAllText(Path.Combine(folder, "ensemble.json")), StringComparison.Ordinal);

            var foreign = TempFolder();
            Directory.CreateDirectory(foreign);
            File.WriteAllText(Path.Combine(foreign, "notes.txt"), "keep me");
            (code, _, error) = Run(["ensemble", Rig, .. Logs, "--point", "OP1", "--samples", "2", "--out", foreign]);
            Assert.Equal(ExitCodes.OutputFailure, code);
            Assert.Equal("keep me", File.ReadAllText(Path.Combine(foreign, "notes.txt")));
            Assert.Single(Directory.GetFileSystemEntries(foreign));
            Delete(foreign);

            (code, _, error) = Run(["ensemble", Rig, .. Logs, "--point", "OP1", "--samples", "100001", "--out", folder]);
            Assert.Equal(ExitCodes.UsageOrRigFile, code);
            Assert.Contains("100000", error, StringComparison.Ordinal);
        }
        finally
        {
            Delete(folder);
        }
    }

    private static (int Code, string Output, string Error) Run(string[] args)
    {
        var output = new StringWriter { NewLine = "\n" };
        var error = new StringWriter { NewLine = "\n" };
        var context = new CliContext(output, error, () => Stream.Null, false, RepoRoot.Path);
        var code = BcPrepApp.Run(args, context);
        return (code, output.ToString(), error.ToString());
    }

    private static string[] Lines(string text) => text.Split('\n', StringSplitOptions.RemoveEmptyEntries);

    /// <summary>Rows after the header, split on commas outside quotes.</summary>
    private static List<string[]> DataRows(string text) => Lines(text).Where(l => !l.StartsWith('#')).Skip(1).Select(Split).ToList();

    private static string[] Split(string line)
    {
        var cells = new List<string>();
        var cell = new System.Text.StringBuilder();
        var quoted = false;
        foreach (var c in line)
        {
            if (c == '"')
            {
                quoted = !quoted;
            }
            else if (c == ',' && !quoted)
            {
                cells.Add(cell.ToString());
                cell.Clear();
            }
            else
            {
                cell.Append(c);
            }
        }

        cells.Add(cell.ToString());
        return [.. cells];
    }

    private static double Number(string text) => double.Parse(text, CultureInfo.InvariantCulture);

    private static double Trapezoid(double[] radiusM, double[] velocity)
    {
        var sum = 0.0;
        for (var i = 1; i < radiusM.Length; i++)
        {
            sum += 0.5 * ((velocity[i] * radiusM[i]) + (velocity[i - 1] * radiusM[i - 1])) * (radiusM[i] - radiusM[i - 1]);
        }

        return 2 * Math.PI * Math.Abs(sum);
    }

    private static string TempFolder() => Path.Combine(Path.GetTempPath(), "bcprep-ens-" + Guid.NewGuid().ToString("N"));

    private static void Delete(string folder)
    {
        if (Directory.Exists(folder))
        {
            Directory.Delete(folder, recursive: true);
        }
    }
}
