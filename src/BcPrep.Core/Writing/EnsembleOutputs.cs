using System.Globalization;
using System.Text;
using System.Text.Json;
using BcPrep.Pipeline;
using BcPrep.Uncertainty;

namespace BcPrep.Writing;

/// <summary>
/// Writes an ensemble of one operating point: members/NNNN/ folders holding the same four tables as a point folder
/// (inlet-profile.csv, outlet-plane.csv, wall.csv, scalars.csv, same columns), index.csv (one row per member with
/// its draw seed and every scalar), inputs.csv (the drawn input vector of every member) and ensemble.json
/// (provenance and sampling), committed as one folder through <see cref="StagedDirectory"/>.
/// In member tables the uncertainty columns are present but empty: a member is one realisation of the inputs, and
/// the spread across members is its uncertainty. Keeping the columns lets a reader of point folders read members.
/// </summary>
public static class EnsembleOutputs
{
    public const string ManifestName = "ensemble.json";
    public const string IndexName = "index.csv";
    public const string InputsName = "inputs.csv";

    /// <summary>The settings an ensemble was drawn with.</summary>
    public sealed record Request(string PointId, int Count, int Seed, EnsembleSampling Sampling);

    /// <summary>Draws and writes the ensemble into <paramref name="outputDirectory"/>; returns the number of members written.</summary>
    public static int Write(DayResult day, PointResult point, Request request, RunProvenance provenance, string outputDirectory)
    {
        ArgumentNullException.ThrowIfNull(day);
        ArgumentNullException.ThrowIfNull(point);
        ArgumentNullException.ThrowIfNull(request);
        var scalars = Enumerable.Range(0, point.Model.Outputs.Count).Where(i => point.Model.Outputs[i].Kind != QuantityKind.ProfilePoint).ToArray();
        var index = IndexTable(point, request, scalars);
        var inputs = InputsTable(point);
        var written = 0;
        using var staged = StagedDirectory.Begin(outputDirectory, ManifestName);
        foreach (var member in PointEnsemble.Draw(point.Model, request.Count, request.Seed, request.Sampling))
        {
            var folder = MemberFolder(member.Number, request.Count);
            staged.Write(MemberFiles(day, point, member, folder));
            var row = new List<object?> { member.Number, folder.TrimEnd('/'), member.DrawSeed };
            row.AddRange(scalars.Select(i => (object?)member.Outputs[i]));
            index.Add([.. row]);
            inputs.Add([member.Number, .. member.Inputs.Select(v => (object?)v)]);
            written++;
        }

        var files = new OutputFileSet();
        files.Add(IndexName, index.ToString());
        files.Add(InputsName, inputs.ToString());
        files.Add(ManifestName, Manifest(day, point, request, provenance));
        staged.Write(files);
        staged.Complete();
        return written;
    }

    /// <summary>"members/0001/": numbers padded to at least four digits, enough for <paramref name="count"/>.</summary>
    public static string MemberFolder(int number, int count)
    {
        var width = Math.Max(4, count.ToString(CultureInfo.InvariantCulture).Length);
        return "members/" + number.ToString("D" + width.ToString(CultureInfo.InvariantCulture), CultureInfo.InvariantCulture) + "/";
    }

    /// <summary>The four boundary-condition tables of one member, under <paramref name="folder"/>.</summary>
    public static OutputFileSet MemberFiles(DayResult day, PointResult point, EnsembleMember member, string folder)
    {
        ArgumentNullException.ThrowIfNull(member);
        var realisation = AsPoint(point, member);
        var note = string.Create(CultureInfo.InvariantCulture,
            $"ensemble member {member.Number} of point {point.Id}: one draw of every input through the same physics; uncertainty columns are empty (the spread across members is the uncertainty)");
        var files = new OutputFileSet();
        files.Add(folder + "inlet-profile.csv", BoundaryTables.InletProfile(realisation).Comment(note).ToString());
        files.Add(folder + "outlet-plane.csv", BoundaryTables.OutletPlane(realisation).Comment(note).ToString());
        files.Add(folder + "wall.csv", BoundaryTables.Wall(realisation, day).Comment(note).ToString());
        files.Add(folder + "scalars.csv", BoundaryTables.Scalars(realisation).Comment(note).ToString());
        return files;
    }

    /// <summary>
    /// The member dressed as a point result, so that the point tables lay it out: every output's estimate is the
    /// member's value and every uncertainty NaN (written as an empty cell).
    /// </summary>
    private static PointResult AsPoint(PointResult point, EnsembleMember member)
    {
        var p = point.Gum.Outputs.Count > 0 ? point.Gum.Outputs[0].CoverageProbability : double.NaN;
        var outputs = point.Model.Outputs.Select((d, i) => new GumOutput(d.Name, member.Outputs[i], double.NaN, [], 0.0, 0.0,
            double.NaN, double.NaN, DegreesOfFreedomRule.Infinite, p, double.NaN, double.NaN)).ToList();
        var gum = new GumResult(point.Gum.Inputs, point.Gum.InputCorrelation, outputs, new double[0, 0], new double[0, 0], new double[0, 0]);
        return point with
        {
            Id = point.Id + " member " + member.Number.ToString(CultureInfo.InvariantCulture),
            Gum = gum,
            Nominal = member.Quantities,
            MonteCarlo = null,
            Validation = null,
        };
    }

    private static CsvTable IndexTable(PointResult point, Request request, int[] scalars)
    {
        var header = new List<string> { "member", "folder", "draw_seed" };
        header.AddRange(scalars.Select(i => $"{point.Model.Outputs[i].Name} [{point.Model.Outputs[i].Unit}]"));
        return new CsvTable(header)
            .Comment(string.Create(CultureInfo.InvariantCulture,
                $"BcPrep ensemble of point {request.PointId}: {request.Count} members, seed {request.Seed}, {SamplingText(request.Sampling)}"))
            .Comment(request.Sampling == EnsembleSampling.Random
                ? "draw_seed: each member's inputs come from a stream of its own seed, so a member is reproducible alone and the first members stay the same when more are drawn"
                : "draw_seed is empty: a Latin hypercube draws all members jointly from the seed");
    }

    private static CsvTable InputsTable(PointResult point)
    {
        var header = new List<string> { "member" };
        header.AddRange(point.Model.Inputs.Select(i => i.Name));
        return new CsvTable(header).Comment("BcPrep ensemble inputs: the drawn value of every input of the point model, in SI (the input's estimate and u are in the point's budget)");
    }

    private static string SamplingText(EnsembleSampling sampling) => sampling == EnsembleSampling.LatinHypercube
        ? "Latin hypercube over every input's distribution"
        : "independent random draws from every input's distribution";

    private static string Manifest(DayResult day, PointResult point, Request request, RunProvenance provenance)
    {
        using var stream = new MemoryStream();
        using (var json = new Utf8JsonWriter(stream, new JsonWriterOptions { Indented = true, Encoder = System.Text.Encodings.Web.JavaScriptEncoder.UnsafeRelaxedJsonEscaping }))
        {
            json.WriteStartObject();
            json.WriteString("format", "bcprep-ensemble");
            json.WriteNumber("format_version", 1);
            json.WriteString("tool_version", provenance.ToolVersion);
            json.WriteString("run_key", provenance.Key);
            json.WriteString("rig", day.Rig.Name);
            json.WriteString("rig_sha256", provenance.Rig.Sha256);
            json.WriteStartArray("log_sha256");
            foreach (var log in provenance.Logs)
            {
                json.WriteStringValue(log.Sha256);
            }

            json.WriteEndArray();
            json.WriteString("point", point.Id);
            json.WriteNumber("members", request.Count);
            json.WriteNumber("seed", request.Seed);
            json.WriteString("sampling", request.Sampling == EnsembleSampling.LatinHypercube ? "latin_hypercube" : "random");
            json.WriteString("method", SamplingText(request.Sampling) + "; the inputs of the point model are independent, correlations between outputs arise from shared inputs; every member goes through the same physics as the GUM propagation");
            json.WriteString("member_folders", MemberFolder(1, request.Count) + " … " + MemberFolder(request.Count, request.Count));
            json.WriteString("member_files", "inlet-profile.csv, outlet-plane.csv, wall.csv, scalars.csv (point-folder layout, uncertainty columns empty)");
            json.WriteStartArray("cautions");
            foreach (var caution in Cautions.All)
            {
                json.WriteStringValue(caution);
            }

            json.WriteEndArray();
            json.WriteEndObject();
        }

        return Encoding.UTF8.GetString(stream.ToArray()) + "\n";
    }
}
