using System.Globalization;
using BcPrep.Pipeline;
using BcPrep.Profiles;
using BcPrep.Rig;
using BcPrep.Uncertainty;

namespace BcPrep.Writing;

/// <summary>
/// The CSV tables of a processed day, in BcPrep's own layout: a summary with one row per operating point, and per
/// point the inlet profile, the outlet plane, the wall, every scalar with its uncertainty, and the budgets.
/// </summary>
public static class BoundaryTables
{
    /// <summary>Quantities repeated in the summary, in this order: entries of the one quantity table, which gives each its name and unit.</summary>
    public static readonly IReadOnlyList<ScalarOutput> SummaryQuantities =
    [
        PointOutputs.MassFlow, PointOutputs.InletBulkVelocity, PointOutputs.Reynolds, PointOutputs.InletTemperature, PointOutputs.OutletTemperature,
        PointOutputs.InletStaticPressure, PointOutputs.OutletStaticPressure, PointOutputs.HeaterPower, PointOutputs.WallHeatFlux,
        PointOutputs.EnergyBalanceMismatch,
    ];

    /// <summary>Quantities that join the summary, after the outlet temperature, only when a point of the day has them (a rake's mixing-cup temperatures).</summary>
    public static readonly IReadOnlyList<ScalarOutput> OptionalSummaryQuantities = [PointOutputs.InletMixingCupTemperature, PointOutputs.OutletMixingCupTemperature];

    /// <summary>The summary's quantities for this day: <see cref="SummaryQuantities"/>, with the optional ones some point defines.</summary>
    public static IReadOnlyList<ScalarOutput> SummaryQuantitiesOf(DayResult day)
    {
        var quantities = SummaryQuantities.ToList();
        var present = OptionalSummaryQuantities.Where(q => day.Points.Any(p => p.Output(q) is not null)).ToList();
        quantities.InsertRange(quantities.IndexOf(PointOutputs.OutletTemperature) + 1, present);
        return quantities;
    }

    public static CsvTable Summary(DayResult day)
    {
        var header = new List<string> { "point", "origin", "start [s]", "end [s]", "duration [s]" };
        var quantities = SummaryQuantitiesOf(day);
        foreach (var quantity in quantities)
        {
            var (name, unit) = (quantity.Name, quantity.Unit);
            header.AddRange([$"{name} [{unit}]", $"u({name}) [{unit}]", $"U({name}) [{unit}]", $"k({name})"]);
        }
        header.AddRange(["checks", "warnings", "conditioning"]);
        var table = new CsvTable(header)
            .Comment($"BcPrep summary; rig '{day.Rig.Name}'; times in s since the first sample of the day; u = standard uncertainty, U = expanded uncertainty at p = {day.Rig.CoverageProbability.ToString(CultureInfo.InvariantCulture)} with coverage factor k");
        foreach (var point in day.Points)
        {
            var row = new List<object?>
            {
                point.Id, point.Origin == WindowOrigin.RigFile ? "rig file" : "detected",
                day.Start.Since(point.Window.Start).Value, day.Start.Since(point.Window.End).Value, point.Window.DurationS,
            };
            foreach (var quantity in quantities)
            {
                var output = point.Output(quantity);
                row.AddRange([output?.Estimate ?? double.NaN, output?.StandardUncertainty ?? double.NaN, output?.ExpandedUncertainty ?? double.NaN, output?.CoverageFactor ?? double.NaN]);
            }
            row.Add(string.Join("; ", point.Checks.Select(c => $"{c.Name}: {(c.Passed ? "pass" : "warn")}")));
            row.Add(point.Warnings.Count);
            row.Add(ConditioningManifest.SummaryCell(point));
            table.Add([.. row]);
        }
        return table;
    }

    public static CsvTable InletProfile(PointResult point)
    {
        var velocity = point.Nominal.Velocity;
        var temperature = point.Output(PointOutputs.InletTemperature);
        var rake = point.Nominal.TemperatureProfile;
        var table = new CsvTable([
            "r [m]", "axial_velocity [m/s]", "u(axial_velocity) [m/s]", "temperature [K]", "u(temperature) [K]",
            "k [m2/s2]", "u(k) [m2/s2]", "epsilon [m2/s3]", "u(epsilon) [m2/s3]", "omega [1/s]", "u(omega) [1/s]",
        ])
            .Comment($"BcPrep inlet profile; point {point.Id}; velocity model {ChoiceSpelling.Name(velocity.ModelUsed)}; profile integrates to the measured mass flow (raw grid error {velocity.RawDiscretisationRelativeError.ToString("E2", CultureInfo.InvariantCulture)})")
            .Comment(rake is null
                ? "temperature uniform: the inlet bulk temperature"
                : "temperature interpolated linearly from the radial rake, nearest rake value held beyond its ends" + (rake.ClampedPointCount > 0 ? $" ({rake.ClampedPointCount} points)" : ""))
            .Comment(InletTurbulence.ConventionDescription)
            .Comment("u(...) is the standard uncertainty propagated from the measurements and the model-form terms of the budget: the power-law exponent (when the power law is used), the turbulence-intensity correlation (when no intensity is given) and the property models");
        var k = point.Output(PointOutputs.TurbulentKineticEnergy);
        var eps = point.Output(PointOutputs.DissipationRate);
        var omega = point.Output(PointOutputs.SpecificDissipationRate);
        for (var i = 0; i < velocity.Profile.RadiusM.Length; i++)
        {
            var u = point.Output(ProfileOutputs.Velocity(i));
            var t = rake is null ? temperature : point.Output(ProfileOutputs.Temperature(i));
            table.Add(velocity.Profile.RadiusM[i], u?.Estimate ?? velocity.Profile.Values[i], u?.StandardUncertainty ?? double.NaN,
                t?.Estimate, t?.StandardUncertainty,
                k?.Estimate ?? double.NaN, k?.StandardUncertainty ?? double.NaN, eps?.Estimate ?? double.NaN, eps?.StandardUncertainty ?? double.NaN,
                omega?.Estimate ?? double.NaN, omega?.StandardUncertainty ?? double.NaN);
        }
        return table;
    }

    public static CsvTable OutletPlane(PointResult point) =>
        Scalars(point, [PointOutputs.OutletStaticPressure, PointOutputs.OutletTemperature, PointOutputs.OutletMixingCupTemperature],
            $"BcPrep outlet plane; point {point.Id}; absolute static pressure" + (point.Output(PointOutputs.OutletMixingCupTemperature) is null ? ""
                : point.Model.HasPlainOutletTemperature ? "; outlet.temperature from the outlet channel, the rake's mixing-cup temperature beside it"
                : "; outlet.temperature is the rake's mixing-cup temperature"));

    /// <summary>
    /// The temperature rakes of planes other than the inlet (the inlet's is in the inlet profile): per plane and radius
    /// the temperature with its uncertainty and the mass flux ρu that weights it; null when the point has none.
    /// </summary>
    public static CsvTable? Rakes(PointResult point)
    {
        if (point.Model.RakePlanes.Count == 0)
        {
            return null;
        }
        var table = new CsvTable(["plane", "r [m]", "temperature [K]", "u(temperature) [K]", "U(temperature) [K]", "mass_flux [kg/(m2 s)]"])
            .Comment($"BcPrep temperature rakes; point {point.Id}; temperature interpolated linearly between the rake sensors, nearest value held beyond the rake's ends")
            .Comment("mass_flux = rho u of the velocity model at the plane's Reynolds number (viscosity at the rake's area mean), scaled to the measured mass flow; mixing-cup temperature = integral of rho u cp T dA over integral of rho u cp dA (trapezoid rule on this grid)");
        foreach (var rake in point.Nominal.Rakes.Where(r => point.Model.RakePlanes.Contains(r.Plane)))
        {
            var cup = point.Output(PointOutputs.MixingCupTemperature(rake.Plane));
            var exponent = double.IsNaN(rake.Velocity.PowerLawExponent) ? "" : string.Create(CultureInfo.InvariantCulture, $", n = {rake.Velocity.PowerLawExponent:R}");
            var clamped = rake.Temperature.ClampedPointCount > 0 ? $"; {rake.Temperature.ClampedPointCount} points hold the nearest rake value" : "";
            table.Comment(string.Create(CultureInfo.InvariantCulture,
                $"{rake.Plane}: mixing-cup temperature {cup?.Estimate ?? rake.MixingCupK:R} K, u {cup?.StandardUncertainty ?? double.NaN:R} K, U {cup?.ExpandedUncertainty ?? double.NaN:R} K; area mean {rake.AreaMeanK:R} K; velocity model {ChoiceSpelling.Name(rake.Velocity.ModelUsed)}{exponent}{clamped}"));
            var radii = rake.Temperature.Profile.RadiusM;
            for (var i = 0; i < radii.Length; i++)
            {
                var t = point.Output(ProfileOutputs.PlaneTemperature(rake.Plane, i));
                table.Add(rake.Plane, radii[i], t?.Estimate ?? rake.Temperature.Profile.Values[i], t?.StandardUncertainty ?? double.NaN, t?.ExpandedUncertainty ?? double.NaN,
                    rake.MassFluxKgPerM2S.Values[i]);
            }
        }
        return table;
    }

    public static CsvTable Wall(PointResult point, DayResult day)
    {
        var table = new CsvTable(["z [m]", "channel", "temperature [K]", "u(temperature) [K]", "U(temperature) [K]", "heat_flux [W/m2]", "u(heat_flux) [W/m2]"])
            .Comment($"BcPrep wall; point {point.Id}; uniform heat flux over the heated length {day.Rig.Duct.HeatedLengthM.ToString("R", CultureInfo.InvariantCulture)} m; wall temperatures at the thermocouple positions, then (channel 'interpolated') linearly between them on the axial grid of [wall], " +
                       (day.Rig.Wall.ClampOutside ? "holding the nearest thermocouple's value beyond the outermost ones" : "omitted beyond the outermost thermocouples"));
        var flux = point.Output(PointOutputs.WallHeatFlux);
        foreach (var channel in day.Rig.Channels.Where(c => c.Role == ChannelRole.WallTemperature).OrderBy(c => c.AxialPositionM))
        {
            var t = point.Output(ProfileOutputs.WallPoint(channel.Id));
            table.Add(channel.AxialPositionM ?? double.NaN, channel.Id, t?.Estimate ?? double.NaN, t?.StandardUncertainty ?? double.NaN, t?.ExpandedUncertainty ?? double.NaN,
                flux?.Estimate ?? double.NaN, flux?.StandardUncertainty ?? double.NaN);
        }
        for (var i = 0; i < point.Model.WallGridM.Length; i++)
        {
            var t = point.Output(ProfileOutputs.WallGrid(i));
            table.Add(point.Model.WallGridM[i], "interpolated", t?.Estimate ?? double.NaN, t?.StandardUncertainty ?? double.NaN, t?.ExpandedUncertainty ?? double.NaN,
                flux?.Estimate ?? double.NaN, flux?.StandardUncertainty ?? double.NaN);
        }
        return table;
    }

    /// <summary>Every scalar output of a point (profile points excluded) with value and uncertainty.</summary>
    public static CsvTable Scalars(PointResult point, IReadOnlyCollection<ScalarOutput>? only = null, string? comment = null)
    {
        var table = new CsvTable(["quantity", "unit", "value", "standard_uncertainty", "expanded_uncertainty", "coverage_factor", "degrees_of_freedom", "description"])
            .Comment(comment ?? $"BcPrep scalars; point {point.Id}");
        for (var i = 0; i < point.Model.Outputs.Count; i++)
        {
            var definition = point.Model.Outputs[i];
            if (definition.Kind == QuantityKind.ProfilePoint || (only is not null && !only.Any(o => o.Name == definition.Name)))
            {
                continue;
            }
            var g = point.Gum.Outputs[i];
            table.Add(definition.Name, definition.Unit, g.Estimate, g.StandardUncertainty, g.ExpandedUncertainty, g.CoverageFactor, Dof(g.DegreesOfFreedom), definition.Description);
        }
        return table;
    }

    /// <summary>
    /// The uncertainty budget: every input's contribution to every scalar output (or to those <paramref name="quantity"/> accepts).
    /// Each input carries its degrees of freedom (JCGM 100 7.2.7; empty = infinite, an exactly known u), so that a reader
    /// can recompute ν_eff = u_c⁴ / Σ (c·u)⁴/ν (Welch–Satterthwaite, G.2b) from this table and the scalars' u_c.
    /// </summary>
    public static CsvTable Budget(PointResult point, bool includeProfile = false, Func<string, bool>? quantity = null)
    {
        var table = new CsvTable(["point", "quantity", "unit", "input", "type", "input_estimate", "input_standard_uncertainty", "input_degrees_of_freedom", "sensitivity", "contribution", "variance_share", "source"]);
        for (var i = 0; i < point.Model.Outputs.Count; i++)
        {
            var definition = point.Model.Outputs[i];
            if ((!includeProfile && definition.Kind == QuantityKind.ProfilePoint) || (quantity is not null && !quantity(definition.Name)))
            {
                continue;
            }
            foreach (var line in point.Gum.Outputs[i].Budget.Where(b => b.SensitivityCoefficient != 0 && b.StandardUncertainty > 0))
            {
                table.Add(point.Id, definition.Name, definition.Unit, line.InputName, line.Evaluation == EvaluationType.TypeA ? "A" : "B",
                    line.Estimate, line.StandardUncertainty, Dof(line.DegreesOfFreedom), line.SensitivityCoefficient, line.Contribution, line.VarianceShare, line.Source);
            }
        }
        return table;
    }

    private static double Dof(double nu) => double.IsPositiveInfinity(nu) ? double.NaN : nu;
}
