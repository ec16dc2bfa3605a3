using System.Collections.Immutable;
using System.Globalization;
using BcPrep.Physics;

namespace BcPrep.Profiles;

/// <summary>
/// Wall temperature along the duct axis from thermocouples at discrete positions: piecewise-linear between
/// neighbouring thermocouples, never extrapolated. Beyond the outermost thermocouples a grid point is either left
/// out (<see cref="GridWithin"/>) or holds the nearest thermocouple's value (clamp).
/// </summary>
public static class AxialWallProfile
{
    /// <summary>Positions closer than this to the outermost thermocouples count as on them (rounding of the grid), m.</summary>
    public const double PositionToleranceM = 1e-9;

    /// <summary>
    /// <paramref name="count"/> equally spaced positions from <paramref name="startM"/> to <paramref name="endM"/>
    /// inclusive; count ≥ 2 and end &gt; start, otherwise <see cref="BcPrepDataException"/>.
    /// </summary>
    public static ImmutableArray<double> UniformGrid(double startM, double endM, int count)
    {
        Require.InRange(count, 2, RadialGrid.MaxPointCount, "axial point count", "", "the axial wall grid");
        if (!(endM > startM))
        {
            throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture, $"Axial grid end {endM:R} m is not beyond its start {startM:R} m."));
        }
        var grid = ImmutableArray.CreateBuilder<double>(count);
        for (var i = 0; i < count; i++)
        {
            grid.Add(i == count - 1 ? endM : startM + ((endM - startM) * i / (count - 1)));
        }
        return grid.MoveToImmutable();
    }

    /// <summary>
    /// The grid positions that receive a value: all of them when <paramref name="clampOutside"/>, otherwise those
    /// within [min, max] of the thermocouple positions (empty when there are none).
    /// </summary>
    public static ImmutableArray<double> GridWithin(ImmutableArray<double> gridM, IReadOnlyCollection<double> thermocoupleM, bool clampOutside)
    {
        if (thermocoupleM.Count == 0)
        {
            return [];
        }
        if (clampOutside)
        {
            return gridM;
        }
        var (low, high) = (thermocoupleM.Min(), thermocoupleM.Max());
        return gridM.Where(z => z >= low - PositionToleranceM && z <= high + PositionToleranceM).ToImmutableArray();
    }

    /// <summary>
    /// T(z) by linear interpolation of (z_i, T_i), z_i strictly increasing (at least one point). Outside
    /// [z_0, z_last] (beyond <see cref="PositionToleranceM"/>) the end value is held when <paramref name="clampOutside"/>;
    /// otherwise <see cref="BcPrepDataException"/>. NaN temperatures propagate.
    /// </summary>
    public static double At(ImmutableArray<double> thermocoupleM, ImmutableArray<double> temperatureK, double zM, bool clampOutside)
    {
        if (thermocoupleM.IsDefaultOrEmpty || thermocoupleM.Length != temperatureK.Length)
        {
            throw new BcPrepDataException("Wall interpolation needs at least one thermocouple and one temperature per position.");
        }
        for (var i = 1; i < thermocoupleM.Length; i++)
        {
            if (!(thermocoupleM[i] > thermocoupleM[i - 1]))
            {
                throw new BcPrepDataException("Wall thermocouple positions must be strictly increasing (average sensors at the same position first).");
            }
        }
        if (zM < thermocoupleM[0] || zM > thermocoupleM[^1])
        {
            var onEnd = zM >= thermocoupleM[0] - PositionToleranceM && zM <= thermocoupleM[^1] + PositionToleranceM;
            if (!clampOutside && !onEnd)
            {
                throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                    $"z = {zM:R} m lies outside the wall thermocouples [{thermocoupleM[0]:R}, {thermocoupleM[^1]:R}] m and extrapolation is not allowed."));
            }
            return zM < thermocoupleM[0] ? temperatureK[0] : temperatureK[^1];
        }
        return Interpolation.Linear(thermocoupleM, temperatureK, zM);
    }
}
