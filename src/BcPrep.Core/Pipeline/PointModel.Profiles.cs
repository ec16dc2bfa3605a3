using System.Collections.Immutable;
using System.Globalization;
using BcPrep.Physics;
using BcPrep.Profiles;
using BcPrep.Rig;
using BcPrep.Uncertainty;

namespace BcPrep.Pipeline;

/// <summary>
/// The measured inputs of the inlet and wall profiles: relative humidity, the inlet temperature rake and the axial
/// wall-temperature grid. Each is a function of the input vector, so its uncertainty is propagated like any other.
/// </summary>
public sealed partial class PointModel
{
    private Func<double[], double>? _humidity;
    private List<(double RadiusM, ChannelInputs Inputs)> _rake = [];
    private List<(string Plane, List<(double RadiusM, ChannelInputs Inputs)> Sensors)> _planeRakes = [];
    private int _shapeFactor = -1;
    private double _nominalRadiusM;
    private ImmutableArray<double> _wallPositionsM = [];
    private List<List<int>> _wallGroups = [];
    private bool _clampWall;

    /// <summary>Axial positions (m) of the interpolated wall temperatures, in output order.</summary>
    public ImmutableArray<double> WallGridM { get; private set; } = [];

    /// <summary>True when the inlet temperature comes from a radial rake (profile outputs exist).</summary>
    public bool HasTemperatureRake => _rake.Count > 0;

    /// <summary>Planes other than the inlet that carry a temperature rake, in the rig file's order.</summary>
    public IReadOnlyList<string> RakePlanes => [.. _planeRakes.Select(p => p.Plane)];

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
        _planeRakes = rig.WithRole(ChannelRole.BulkTemperature)
            .Where(c => c.Plane is not null and not "inlet" && c.RadiusM is not null && _channels.ContainsKey(c.Id))
            .GroupBy(c => c.Plane!, StringComparer.Ordinal)
            .Select(g => (g.Key, g.Select(c => (c.RadiusM!.Value, _channels[c.Id])).ToList()))
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

    /// <summary>
    /// The outlet's mixing-cup temperature from its rake, ∫ρ u cp T dA / ∫ρ u cp dA (<see cref="RakePlanePhysics"/>),
    /// used as the outlet bulk temperature when no outlet channel without a radius exists.
    /// </summary>
    private Func<double[], double>? OutletMixingCupTemperature()
    {
        var index = _planeRakes.FindIndex(p => p.Plane == "outlet");
        if (index < 0)
        {
            return null;
        }
        return x => RakePlanePhysics.AtPlane(PlaneRakeAt(index, x), _massFlow(x), x[_diameter], x[_viscosityFactor], ShapeFactorAt(x), VapourMoleFractionAt(x), _settings).MixingCupK;
    }

    private PlaneRake PlaneRakeAt(int index, double[] x) => new(_planeRakes[index].Plane, RakeRadii(_planeRakes[index].Sensors, x), RakeTemperatures(_planeRakes[index].Sensors, x));

    private double ShapeFactorAt(double[] x) => _shapeFactor < 0 ? 1.0 : x[_shapeFactor];

    private double VapourMoleFractionAt(double[] x) =>
        _humidity is null ? 0.0 : PointPhysics.VapourMoleFraction(_inletPressure(x), _inletTemperature(x), _humidity(x));

    /// <summary>
    /// The power-law exponent's model form (<see cref="ModelForm.PowerLawExponentHalfWidth"/>) as a factor on n, judged
    /// at the point's Reynolds number; only where the power law can be used (auto above Re 2300, or power_law).
    /// </summary>
    private void AddProfileShapeInput()
    {
        if (_settings.VelocityModel is not (VelocityProfileModel.Auto or VelocityProfileModel.PowerLaw))
        {
            return;
        }
        var m = MeasurementsAt(Estimates());
        var reynolds = PipeFlow.ReynoldsFromMassFlow(m.MassFlowKgS, m.DiameterM, DryAir.Viscosity(m.InletTemperatureK) * m.ViscosityFactor);
        if (!double.IsFinite(reynolds) || (_settings.VelocityModel == VelocityProfileModel.Auto && reynolds < VelocityProfiles.LaminarReynoldsLimit))
        {
            return;
        }
        var halfWidth = ModelForm.PowerLawExponentHalfWidth(reynolds);
        _shapeFactor = Add(new UncertaintyInput(ProfileShapeInputName, 1.0, TypeB.FromRectangularHalfWidth(halfWidth), double.PositiveInfinity,
            DistributionKind.Rectangular, EvaluationType.TypeB, string.Create(CultureInfo.InvariantCulture,
                $"power-law exponent 1/sqrt(f) against the exponents of Nikuradse's smooth-pipe profiles (Schlichting): ±{halfWidth * 100:0.#} % at Re {reynolds:0}")));
    }

    /// <summary>Name of the profile-shape model-form input in budgets.</summary>
    public const string ProfileShapeInputName = "velocity profile shape model (power law n = 1/sqrt(f))";

    /// <summary>Rake radii keep their fraction of the radius when the diameter input is perturbed.</summary>
    private ImmutableArray<double> RakeRadii(List<(double RadiusM, ChannelInputs Inputs)> sensors, double[] x) =>
        [.. sensors.Select(r => Math.Min(r.RadiusM / _nominalRadiusM, 1.0) * x[_diameter] / 2)];

    private static ImmutableArray<double> RakeTemperatures(List<(double RadiusM, ChannelInputs Inputs)> sensors, double[] x) => [.. sensors.Select(r => r.Inputs.ValueAt(x))];

    private ImmutableArray<double> RakeRadii(double[] x) => RakeRadii(_rake, x);

    private ImmutableArray<double> RakeTemperatures(double[] x) => RakeTemperatures(_rake, x);

    private PointMeasurements WithProfileInputs(PointMeasurements m, double[] x) => m with
    {
        RelativeHumidity = _humidity?.Invoke(x) ?? double.NaN,
        RakeRadiiM = _rake.Count == 0 ? [] : RakeRadii(x),
        RakeTemperaturesK = _rake.Count == 0 ? [] : RakeTemperatures(x),
        TurbulenceIntensityFactor = _turbulenceFactor < 0 ? 1.0 : x[_turbulenceFactor],
        PowerLawExponentFactor = ShapeFactorAt(x),
        PlaneRakes = [.. _planeRakes.Select((_, i) => PlaneRakeAt(i, x))],
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
