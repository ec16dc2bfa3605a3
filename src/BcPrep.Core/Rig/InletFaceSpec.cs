using BcPrep.Profiles;

namespace BcPrep.Rig;

/// <summary>
/// Optional sampling of the inlet profile onto the Cartesian points of a solver's inlet face
/// (<c>[inlet_profile.face]</c>): the face centre (m) and axis direction in the solver's frame, and the CSV file of
/// x, y, z points (path as written in the rig file, resolved by the caller; values in <see cref="PointsUnitToM"/>
/// times metres).
/// </summary>
public sealed record InletFaceSpec(Point3 CentreM, Point3 Axis, string PointsFile, double PointsUnitToM, SourceLocation Location);
