using BcPrep.Physics;

namespace BcPrep.Rig;

/// <summary>
/// The <c>[flow_meter]</c> keys of a meter's own calibration: <c>convergent</c> (a Venturi's ISO 5167-4 form) and
/// <c>discharge_coefficient</c> (a constant, or <c>[[Re_D, C], …]</c>) with <c>discharge_coefficient_uncertainty</c>
/// (the certificate's relative expanded uncertainty, e.g. "0.5 %"), <c>discharge_coefficient_k</c> (default 2) and
/// <c>discharge_coefficient_certificate</c>.
/// </summary>
internal static class FlowCalibrationKeys
{
    private static readonly string[] Convergents = ["machined", "as_cast", "rough_welded"];

    public static VenturiConvergent ReadConvergent(TableReader t, FlowMeterKind kind)
    {
        if (!t.Has("convergent"))
        {
            return VenturiConvergent.Machined;
        }
        if (kind != FlowMeterKind.Venturi)
        {
            t.Report("convergent", "only a Venturi tube has a convergent form (kind = \"venturi\")");
        }
        return t.Choice("convergent", Convergents, "machined") switch
        {
            "as_cast" => VenturiConvergent.AsCast,
            "rough_welded" => VenturiConvergent.RoughWelded,
            _ => VenturiConvergent.Machined,
        };
    }

    public static DischargeCalibration? ReadCalibration(TableReader t)
    {
        var uncertainty = t.Quantity("discharge_coefficient_uncertainty", Dimension.Dimensionless, minSi: 0.0, maxSi: 0.5);
        var k = t.Number("discharge_coefficient_k", min: 1.0, max: 10.0) ?? 2.0;
        var certificate = t.String("discharge_coefficient_certificate") ?? "flow calibration";
        if (!t.Node.TryGet("discharge_coefficient", out var entry))
        {
            foreach (var orphan in new[] { "discharge_coefficient_uncertainty", "discharge_coefficient_k", "discharge_coefficient_certificate" }.Where(t.Has))
            {
                t.Report(orphan, "belongs to a calibrated discharge coefficient: give discharge_coefficient too");
            }
            return null;
        }
        t.Has("discharge_coefficient");
        if (uncertainty is null)
        {
            t.Report("discharge_coefficient", "a calibrated discharge coefficient needs its certificate's uncertainty: discharge_coefficient_uncertainty = \"0.5 %\" (expanded, with discharge_coefficient_k, default 2)");
        }
        var points = new List<(double, double)>();
        switch (entry.Value)
        {
            case double c:
                points.Add((1.0, c));
                break;
            case List<TomlEntry> rows:
                foreach (var row in rows)
                {
                    if (row.Value is List<TomlEntry> { Count: 2 } pair && pair[0].Value is double re && pair[1].Value is double cRow)
                    {
                        points.Add((re, cRow));
                    }
                    else
                    {
                        t.Report("discharge_coefficient", $"each calibration point must be [Re_D, C]; {row.Path} is not");
                        return null;
                    }
                }
                break;
            default:
                t.Report("discharge_coefficient", "expected a number (a constant C) or an array of [Re_D, C] pairs");
                return null;
        }
        try
        {
            return uncertainty is { } u ? new DischargeCalibration(points, u * 100.0, k, certificate) : null;
        }
        catch (BcPrepDataException e)
        {
            t.Report("discharge_coefficient", e.Message);
            return null;
        }
    }
}
