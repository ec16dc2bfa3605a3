namespace BcPrep.Rig;

/// <summary>
/// The axial grid on which wall temperatures are interpolated between the inlet and outlet planes
/// (<c>[wall]</c> table). <see cref="AxialPoints"/> = 0 writes the thermocouple positions only. Grid points beyond
/// the outermost thermocouples are omitted, or hold the nearest thermocouple's value when
/// <see cref="ClampOutside"/> is set; they are never extrapolated.
/// </summary>
public sealed record WallSettings(int AxialPoints, bool ClampOutside)
{
    /// <summary>21 points between the planes, points outside the thermocouples omitted.</summary>
    public static readonly WallSettings Default = new(21, false);
}
