using System.Text.Json;
using BcPrep.Pipeline;
using BcPrep.Rig;

namespace BcPrep.Writing;

/// <summary>
/// The "boundary" object of a point in the manifest: how the boundary conditions were formed — fluid model, where
/// the mass flow came from (with the flow meter's ISO 5167 working values), which velocity model the Reynolds number
/// selected and how well its profile integrates to the mass flow, the inlet temperature source, and the wall grid.
/// </summary>
internal static class ManifestBoundary
{
    public static void Write(Utf8JsonWriter json, PointResult point)
    {
        var model = point.Model;
        json.WriteStartObject("boundary");
        json.WriteString("fluid", model.IsMoistAir ? "moist air (CIPM-2007 density, mass-weighted cp; dry-air viscosity)" : "dry air");
        JsonFields.Number(json, "vapour_mole_fraction", point.Nominal.VapourMoleFraction);
        json.WriteString("mass_flow_source", model.FlowMeter?.Kind switch
        {
            FlowMeterKind.Orifice => "orifice plate, ISO 5167-2",
            FlowMeterKind.Venturi => "classical Venturi tube, ISO 5167-4",
            _ => "mass_flow channel",
        });
        WriteFlowMeter(json, model.FlowMeter);
        WriteVelocity(json, point);
        WriteTemperature(json, point);
        WriteRakes(json, point);
        json.WriteStartObject("wall");
        json.WriteNumber("axial_points", model.WallGridM.Length);
        json.WriteStartArray("axial_grid_m");
        foreach (var z in model.WallGridM)
        {
            json.WriteNumberValue(z);
        }
        json.WriteEndArray();
        json.WriteEndObject();
        json.WriteEndObject();
    }

    private static void WriteFlowMeter(Utf8JsonWriter json, FlowMeterNominal? meter)
    {
        if (meter is null)
        {
            json.WriteNull("flow_meter");
            return;
        }
        var r = meter.Result;
        json.WriteStartObject("flow_meter");
        json.WriteString("kind", meter.Kind == FlowMeterKind.Orifice ? "orifice" : "venturi");
        if (meter.Tapping is { } tapping)
        {
            json.WriteString("tapping", tapping.ToString());
        }
        JsonFields.Number(json, "mass_flow", r.MassFlowKgPerS);
        JsonFields.Number(json, "diameter_ratio", r.DiameterRatio);
        JsonFields.Number(json, "discharge_coefficient", r.DischargeCoefficient);
        json.WriteString("discharge_coefficient_source", meter.DischargeCoefficientSource);
        JsonFields.Number(json, "expansibility", r.Expansibility);
        JsonFields.Number(json, "velocity_of_approach_factor", r.VelocityOfApproachFactor);
        JsonFields.Number(json, "pipe_reynolds", r.PipeReynolds);
        json.WriteNumber("iterations", r.Iterations);
        JsonFields.Number(json, "discharge_coefficient_expanded_uncertainty_percent", r.DischargeCoefficientExpandedUncertaintyPercent);
        JsonFields.Number(json, "expansibility_expanded_uncertainty_percent", r.ExpansibilityExpandedUncertaintyPercent);
        JsonFields.Number(json, "upstream_pressure", meter.UpstreamPressurePa);
        JsonFields.Number(json, "upstream_temperature", meter.UpstreamTemperatureK);
        JsonFields.Number(json, "upstream_density", meter.UpstreamDensityKgPerM3);
        JsonFields.Strings(json, "warnings", r.Warnings);
        json.WriteEndObject();
    }

    private static void WriteVelocity(Utf8JsonWriter json, PointResult point)
    {
        var v = point.Nominal.Velocity;
        json.WriteStartObject("inlet_velocity_profile");
        json.WriteString("model_requested", ChoiceSpelling.Name(point.Model.Settings.VelocityModel));
        json.WriteString("model_used", ChoiceSpelling.Name(v.ModelUsed));
        json.WriteString("selection", "auto: laminar below Re_D 2300, power law above (transitional 2300-4000 flagged); a named model is used as given");
        json.WriteNumber("points", v.Profile.RadiusM.Length);
        JsonFields.Number(json, "reynolds", v.Reynolds);
        JsonFields.Number(json, "bulk_velocity", v.BulkVelocityMPerS);
        JsonFields.Number(json, "darcy_friction_factor", v.DarcyFrictionFactor);
        JsonFields.Number(json, "friction_velocity", v.FrictionVelocityMPerS);
        JsonFields.Number(json, "power_law_exponent", v.PowerLawExponent);
        JsonFields.Number(json, "model_mass_flow_relative_error", v.ModelMassFlowRelativeError);
        JsonFields.Number(json, "raw_discretisation_relative_error", v.RawDiscretisationRelativeError);
        JsonFields.Number(json, "scale_factor", v.ScaleFactor);
        JsonFields.Strings(json, "diagnostics", v.Diagnostics);
        json.WriteEndObject();
    }

    /// <summary>Every plane's temperature rake with its mixing-cup temperature (K) and how the weighting was formed.</summary>
    private static void WriteRakes(Utf8JsonWriter json, PointResult point)
    {
        json.WriteStartArray("temperature_rakes");
        foreach (var rake in point.Nominal.Rakes)
        {
            var cup = point.Output(PointOutputs.MixingCupTemperature(rake.Plane));
            json.WriteStartObject();
            json.WriteString("plane", rake.Plane);
            json.WriteString("unit", "K");
            JsonFields.Number(json, "mixing_cup_temperature", cup?.Estimate ?? rake.MixingCupK);
            JsonFields.Number(json, "mixing_cup_standard_uncertainty", cup?.StandardUncertainty ?? double.NaN);
            JsonFields.Number(json, "mixing_cup_expanded_uncertainty", cup?.ExpandedUncertainty ?? double.NaN);
            JsonFields.Number(json, "area_mean_temperature", rake.AreaMeanK);
            json.WriteString("definition", "integral of rho u cp T dA over integral of rho u cp dA, trapezoid rule on the radial grid; T interpolated linearly between the rake sensors, nearest value held beyond the rake's ends");
            json.WriteString("weighting", rake.Plane == "inlet"
                ? "the inlet velocity profile"
                : "the velocity model at this plane's Reynolds number (viscosity at the rake's area mean), scaled to the measured mass flow");
            json.WriteString("velocity_model", ChoiceSpelling.Name(rake.Velocity.ModelUsed));
            JsonFields.Number(json, "power_law_exponent", rake.Velocity.PowerLawExponent);
            json.WriteBoolean("is_plane_bulk_temperature", rake.Plane == "outlet" && !point.Model.HasPlainOutletTemperature);
            json.WriteNumber("clamped_points", rake.Temperature.ClampedPointCount);
            json.WriteEndObject();
        }
        json.WriteEndArray();
    }

    private static void WriteTemperature(Utf8JsonWriter json, PointResult point)
    {
        var rake = point.Nominal.TemperatureProfile;
        json.WriteStartObject("inlet_temperature_profile");
        json.WriteString("source", rake is null ? "uniform" : "rake");
        json.WriteNumber("clamped_points", rake?.ClampedPointCount ?? 0);
        JsonFields.Strings(json, "diagnostics", rake?.Diagnostics ?? []);
        json.WriteEndObject();
    }
}
