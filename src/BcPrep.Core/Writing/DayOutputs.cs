using BcPrep.Pipeline;

namespace BcPrep.Writing;

/// <summary>Lays out every file of a processed day (paths relative to the output folder).</summary>
public static class DayOutputs
{
    public const string ManifestName = "manifest.json";

    /// <summary>
    /// Every output file; <c>facePointsM</c> are the inlet-face points (m) the caller read from the file of
    /// <c>[inlet_profile.face]</c> (null: no face file). <c>extraFiles</c> (e.g. the report's figures and page, built
    /// outside Core) join the same commit, so the manifest lists and hashes them like every other output.
    /// </summary>
    public static OutputFileSet Build(DayResult day, RunProvenance provenance, IReadOnlyList<Profiles.Point3>? facePointsM = null,
        IEnumerable<(string RelativePath, byte[] Content)>? extraFiles = null)
    {
        var files = new OutputFileSet();
        files.Add("summary.csv", BoundaryTables.Summary(day).ToString());
        foreach (var point in day.Points)
        {
            var folder = "points/" + SafeName(point.Id) + "/";
            files.Add(folder + "inlet-profile.csv", BoundaryTables.InletProfile(point).ToString());
            files.Add(folder + "outlet-plane.csv", BoundaryTables.OutletPlane(point).ToString());
            files.Add(folder + "wall.csv", BoundaryTables.Wall(point, day).ToString());
            files.Add(folder + "scalars.csv", BoundaryTables.Scalars(point).ToString());
            files.Add(folder + "budget.csv", BoundaryTables.Budget(point).ToString());
            if (BoundaryTables.Rakes(point) is { } rakes)
            {
                files.Add(folder + "rakes.csv", rakes.ToString());
            }
            if (day.Rig.InletFace is { } face && facePointsM is not null)
            {
                files.Add(folder + "inlet-face.csv", InletFaceTable.Build(point, face, facePointsM).ToString());
            }
        }
        foreach (var (path, content) in extraFiles ?? [])
        {
            files.Add(path, content);
        }
        var names = files.Files.Select(f => f.RelativePath).Append(ManifestName).ToList();
        files.Add(ManifestName, ManifestWriter.WriteUtf8(day, provenance, names, files.Hashes()));
        return files;
    }

    /// <summary>Point ids become folder names: anything but letters, digits, '-', '_' and '.' becomes '_'.</summary>
    public static string SafeName(string id)
    {
        var chars = id.Select(c => char.IsAsciiLetterOrDigit(c) || c is '-' or '_' or '.' ? c : '_').ToArray();
        var name = new string(chars);
        return name is "." or ".." || name.Length == 0 ? "_" + name : name;
    }
}
