using System.Collections.Immutable;
using BcPrep.Profiles;
using BcPrep.Rig;

namespace BcPrep.Pipeline;

/// <summary>
/// The measured inputs of the inlet and wall profiles: relative humidity, the inlet temperature rake and the axial
/// wall-temperature grid. Each is a function of the input vector, so its uncertainty is propagated like any other.
/// </summary>
public sealed partial class PointModel
{
    private Func<double[], double>? _humidity;
    private List<(double RadiusM, ChannelInputs Inputs)> _rake = [];
    private double _nominalRadiusM;
    private ImmutableArray<double> _wallPositionsM = [];
    private List<List<int>> _wallGroups = [];
    private bool _clampWall;

    /// <summary>Axial positions (m) of the interpolated wall temperatures, in output order.</summary>
    public ImmutableArray<double> WallGridM { get; private set; } = [];

    /// <summary>True when the inlet temperature comes from a radial rake (profile outputs exist).</summary>
    public bool HasTemperatureRake => _rake.Count > 0;

    /// <summary>True when a relative-humidity channel makes the air moist (CIPM-2007 density).</summary>
    public bool IsMoistAir => _humidity is not null;

    private void ResolveProfileInputs(RigDescription rig)
    {
        _humidity = Optional(rig, ChannelRole.RelativeHumidity, null);
        _nominalRadiusM = rig.Duct.InnerDiameterM / 2;
        _rake = rig.WithRole(ChannelRole.BulkTemperature)
            .Where(c => c.Plane == "inlet" && c.RadiusM is not null && _channels.ContainsKey(c.Id))
            .Select(c => (c.RadiusM!.Value, _channels[c.Id]))
            .ToList();
        ResolveWallGrid(rig);
    }

    /// <summary>
    /// Area-weighted mean of the rake profile, ∫T 2πr dr / (πR²) on the radial grid, used as the inlet bulk
    /// temperature when no inlet channel without a radius exists.
    /// </summary>
    private Func<double[], double>? RakeMeanTemperature()
    {
        if (_rake.Count == 0)
        {
            return null;
        }
        return x =>
        {
            var radius = x[_diameter] / 2;
            var grid = RadialGrid.WallClustered(radius, _settings.RadialPoints);
            var profile = TemperatureProfiles.FromRake(grid, RakeRadii(x), RakeTemperatures(x), RakeEndPolicy.ClampConstant).Profile;
            return Interpolation.AreaIntegral(grid, i => profile.Values[i]) / (Math.PI * radius * radius);
        };
    }

    /// <summary>Rake radii keep their fraction of the radius when the diameter input is perturbed.</summary>
    private ImmutableArray<double> RakeRadii(double[] x) =>
        [.. _rake.Select(r => Math.Min(r.RadiusM / _nominalRadiusM, 1.0) * x[_diameter] / 2)];

    private ImmutableArray<double> RakeTemperatures(double[] x) => [.. _rake.Select(r => r.Inputs.ValueAt(x))];

    private PointMeasurements WithProfileInputs(PointMeasurements m, double[] x) => m with
    {
        RelativeHumidity = _humidity?.Invoke(x) ?? double.NaN,
        RakeRadiiM = _rake.Count == 0 ? [] : RakeRadii(x),
        RakeTemperaturesK = _rake.Count == 0 ? [] : RakeTemperatures(x),
        TurbulenceIntensityFactor = _turbulenceFactor < 0 ? 1.0 : x[_turbulenceFactor],
    };

    /// <summary>Wall thermocouples at the same position are averaged; the grid spans inlet to outlet plane.</summary>
    private void ResolveWallGrid(RigDescription rig)
    {
        var groups = _wallChannels.Select((c, i) => (Z: c.AxialPositionM!.Value, Index: i)).GroupBy(p => p.Z).OrderBy(g => g.Key).ToList();
        _wallPositionsM = [.. groups.Select(g => g.Key)];
        _wallGroups = groups.Select(g => g.Select(p => p.Index).ToList()).ToList();
        if (rig.Wall.AxialPoints < 2 || _wallPositionsM.IsEmpty)
        {
            WallGridM = [];
            return;
        }
        var grid = AxialWallProfile.UniformGrid(rig.Duct.PlanePositionsM["inlet"], rig.Duct.PlanePositionsM["outlet"], rig.Wall.AxialPoints);
        WallGridM = AxialWallProfile.GridWithin(grid, _wallPositionsM, rig.Wall.ClampOutside);
        _clampWall = rig.Wall.ClampOutside;
    }

    private IEnumerable<double> WallGridTemperatures(PointMeasurements m)
    {
        if (WallGridM.IsEmpty)
        {
            return [];
        }
        ImmutableArray<double> temperatures = [.. _wallGroups.Select(g => g.Average(i => m.WallTemperaturesK[i]))];
        return WallGridM.Select(z => AxialWallProfile.At(_wallPositionsM, temperatures, z, _clampWall));
    }
}
