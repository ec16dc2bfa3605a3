using BcPrep.Profiles;
using BcPrep.Reading;
using BcPrep.Rig;

namespace BcPrep.Cli.Commands;

/// <summary>Reads the points file of <c>[inlet_profile.face]</c>; a relative path is taken from the rig file's folder.</summary>
public static class FacePoints
{
    public static IReadOnlyList<Point3>? Read(RigDescription rig, string rigPath)
    {
        if (rig.InletFace is not { } face)
        {
            return null;
        }
        var path = Path.IsPathRooted(face.PointsFile) ? face.PointsFile : Path.Combine(Path.GetDirectoryName(Path.GetFullPath(rigPath)) ?? ".", face.PointsFile);
        var text = SmallTextFile.Read(path, "face points file", FailureKind.Configuration, face.Location with { Key = "inlet_profile.face.points_file" });
        using var reader = new StringReader(text);
        return FacePointsReader.Read(reader, face.PointsUnitToM, face.PointsFile);
    }
}
