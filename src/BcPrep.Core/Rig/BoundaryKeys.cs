using System.Globalization;
using BcPrep.Physics;
using BcPrep.Profiles;

namespace BcPrep.Rig;

/// <summary>
/// Reads the rig-file tables of the boundary-condition physics that go beyond the duct itself: the
/// differential-pressure flow meter (<c>[flow_meter]</c>), the axial wall grid (<c>[wall]</c>) and the inlet-face
/// sampling (<c>[inlet_profile.face]</c>), and checks that the channels they name exist.
/// </summary>
internal static class BoundaryKeys
{
    private static readonly string[] MeterKinds = ["orifice", "venturi"];
    private static readonly string[] Tappings = ["corner", "d_and_d_over_2", "flange"];

    public static FlowMeterSpec? ReadFlowMeter(TableReader? t)
    {
        if (t is null)
        {
            return null;
        }
        var kindText = t.TryChoice("kind", MeterKinds, "orifice");
        if (!t.Has("kind"))
        {
            t.Report("kind", "required key 'kind' is missing: \"orifice\" (ISO 5167-2) or \"venturi\" (ISO 5167-4)");
        }
        var kind = kindText == "venturi" ? FlowMeterKind.Venturi : FlowMeterKind.Orifice;
        var pipe = t.Quantity("pipe_diameter", Dimension.Length, required: true, minSi: 1e-3, maxSi: 10);
        var pipeStd = t.Quantity("pipe_diameter_uncertainty", Dimension.Length, minSi: 0) ?? 0.0;
        var throatKey = kind == FlowMeterKind.Venturi ? "throat_diameter" : "bore_diameter";
        var throat = t.Quantity(throatKey, Dimension.Length, required: true, minSi: 1e-4, maxSi: 10);
        var throatStd = t.Quantity(throatKey + "_uncertainty", Dimension.Length, minSi: 0) ?? 0.0;
        var tapping = OrificeTapping.Corner;
        if (kind == FlowMeterKind.Orifice)
        {
            if (!t.Has("tapping"))
            {
                t.Report("tapping", "an orifice plate needs its tapping arrangement: tapping = \"corner\", \"d_and_d_over_2\" or \"flange\"");
            }
            tapping = t.Choice("tapping", Tappings, "corner") switch
            {
                "flange" => OrificeTapping.Flange,
                "d_and_d_over_2" => OrificeTapping.DAndDOver2,
                _ => OrificeTapping.Corner,
            };
        }
        var dp = t.String("differential_pressure");
        var upstream = t.String("upstream_pressure", required: true);
        var temperature = t.String("upstream_temperature");
        var kappa = t.Number("isentropic_exponent", min: 1.0 + 1e-6, max: 2.0) ?? DryAir.HeatCapacityRatio;
        var convergent = FlowCalibrationKeys.ReadConvergent(t, kind);
        var calibration = FlowCalibrationKeys.ReadCalibration(t);
        if (pipe is { } d && throat is { } dt && dt >= d)
        {
            t.Report(throatKey, "the throat (bore) must be smaller than the pipe diameter");
        }
        t.RejectUnknownKeys();
        return pipe is null || throat is null || upstream is null || kindText is null
            ? null
            : new FlowMeterSpec(kind, pipe.Value, pipeStd, throat.Value, throatStd, tapping, dp, upstream, temperature, kappa, t.Location)
            {
                Convergent = convergent,
                Calibration = calibration,
            };
    }

    public static WallSettings ReadWall(TableReader? t)
    {
        if (t is null)
        {
            return WallSettings.Default;
        }
        var points = t.Number("axial_points", min: 0, max: RigLoader.MaxRadialPoints) ?? WallSettings.Default.AxialPoints;
        if (points is > 0 and < 2 || points != Math.Floor(points))
        {
            t.Report("axial_points", "axial_points is a whole number: 0 (thermocouple positions only) or at least 2");
        }
        var outside = t.Choice("outside_thermocouples", ["omit", "clamp"], "omit");
        t.RejectUnknownKeys();
        return new WallSettings((int)points, outside == "clamp");
    }

    public static InletFaceSpec? ReadFace(TableReader? t)
    {
        if (t is null)
        {
            return null;
        }
        var centre = Vector(t, "centre", Dimension.Length);
        var axis = Vector(t, "axis", Dimension.Dimensionless);
        var file = t.String("points_file", required: true);
        var unitText = t.String("points_unit") ?? "m";
        double? unit = null;
        if (UnitText.TryToSi("1 " + unitText, Dimension.Length, out var scale, out _))
        {
            unit = scale;
        }
        else
        {
            t.Report("points_unit", $"'{unitText}' is not a unit of length (e.g. \"mm\")");
        }
        if (axis is { } a && a.X == 0 && a.Y == 0 && a.Z == 0)
        {
            t.Report("axis", "the axis direction must not be the zero vector");
            axis = null;
        }
        t.RejectUnknownKeys();
        return centre is null || axis is null || file is null || unit is null ? null : new InletFaceSpec(centre.Value, axis.Value, file, unit.Value, t.Location);
    }

    /// <summary>Flow-meter channel references, and rake radii within the duct radius and distinct on each plane.</summary>
    public static void Check(IReadOnlyList<ChannelSpec> channels, DuctGeometry? duct, FlowMeterSpec? meter, List<Problem> problems)
    {
        // Two sensors of one rake at the same radius would give the profile two values there.
        foreach (var same in channels.Where(c => c.RadiusM is not null && c.Plane is not null).GroupBy(c => (c.Plane, c.RadiusM)).Where(g => g.Count() > 1))
        {
            var first = same.First();
            foreach (var channel in same.Skip(1))
            {
                problems.Add(new Problem(channel.Location with { Key = $"channel '{channel.Id}'.radius" }, string.Create(CultureInfo.InvariantCulture,
                    $"rake sensors '{first.Id}' and '{channel.Id}' both sit at radius {MeasurementText.Number((channel.RadiusM ?? double.NaN) * 1000, 6)} mm of the {channel.Plane} plane: give each rake sensor its own radius")));
            }
        }
        if (duct is not null)
        {
            foreach (var channel in channels.Where(c => c.RadiusM > duct.InnerDiameterM / 2 * (1 + 1e-9)))
            {
                problems.Add(new Problem(channel.Location with { Key = $"channel '{channel.Id}'.radius" }, string.Create(CultureInfo.InvariantCulture,
                    $"rake radius {MeasurementText.Number(channel.RadiusM ?? double.NaN, 6)} m lies outside the duct (inner radius {MeasurementText.Number(duct.InnerDiameterM / 2, 6)} m)")));
            }
        }
        if (meter is null)
        {
            return;
        }
        var ids = channels.Select(c => c.Id).ToList();
        Reference(channels, meter.UpstreamPressureChannel, "upstream_pressure", Dimension.Pressure, meter, ids, problems);
        Reference(channels, meter.UpstreamTemperatureChannel, "upstream_temperature", Dimension.Temperature, meter, ids, problems);
        Reference(channels, meter.DifferentialPressureChannel, "differential_pressure", Dimension.Pressure, meter, ids, problems);
        if (meter.DifferentialPressureChannel is null && !channels.Any(c => c.Role == ChannelRole.DifferentialPressure))
        {
            problems.Add(new Problem(meter.Location with { Key = "flow_meter.differential_pressure" },
                "no channel measures differential_pressure: name the meter's Δp channel with differential_pressure = \"<channel id>\""));
        }
    }

    private static void Reference(IReadOnlyList<ChannelSpec> channels, string? id, string key, Dimension dimension, FlowMeterSpec meter, List<string> ids, List<Problem> problems)
    {
        if (id is null)
        {
            return;
        }
        var channel = channels.FirstOrDefault(c => c.Id == id);
        if (channel is null)
        {
            problems.Add(new Problem(meter.Location with { Key = "flow_meter." + key }, $"no channel with id '{id}'{TableReader.Suggest(id, ids)}"));
        }
        else if (channel.Dimension != dimension)
        {
            problems.Add(new Problem(meter.Location with { Key = "flow_meter." + key }, $"channel '{id}' measures {channel.Dimension.ToString().ToLowerInvariant()}, not {dimension.ToString().ToLowerInvariant()}"));
        }
    }

    private static Point3? Vector(TableReader t, string key, Dimension dimension)
    {
        var items = t.Array(key, required: true);
        if (items is null)
        {
            return null;
        }
        if (items.Count != 3)
        {
            t.Report(key, $"'{key}' needs three components [x, y, z]");
            return null;
        }
        var values = new double[3];
        for (var i = 0; i < 3; i++)
        {
            var ok = items[i].Value switch
            {
                double bare when dimension == Dimension.Dimensionless => Assign(bare, out values[i]),
                string text => UnitText.TryToSi(text, dimension, out values[i], out _),
                _ => false,
            };
            if (!ok || !double.IsFinite(values[i]))
            {
                t.Report(key, dimension == Dimension.Dimensionless
                    ? $"component {i + 1} of '{key}' is not a number"
                    : $"component {i + 1} of '{key}' is not a length with its unit in quotes (e.g. \"0.15 m\")");
                return null;
            }
        }
        return new Point3(values[0], values[1], values[2]);
    }

    private static bool Assign(double value, out double target)
    {
        target = value;
        return true;
    }
}
