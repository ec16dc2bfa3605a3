using System.Collections.Immutable;
using System.Globalization;
using BcPrep.Physics;
using MathNet.Numerics.Integration;

namespace BcPrep.Profiles;

/// <summary>
/// Builds axial velocity profiles u(r) of fully developed pipe flow and scales them to a measured mass flow.
/// Every model is first given its physical scale (U_b for uniform and laminar, u_max = U_b/[2n²/((n+1)(2n+1))]
/// for the power law, u_τ = U_b√(f/8) for the wall laws), then multiplied by the factor that makes the
/// trapezoid integral ∫ρ u 2πr dr on the grid equal ṁ exactly. Both the model's own mass-flow error and the
/// grid's raw discretisation error are reported. Density is uniform over the section.
/// </summary>
public static class VelocityProfiles
{
    /// <summary>Below this Re_D the Auto model is laminar (common practice).</summary>
    public const double LaminarReynoldsLimit = FrictionFactor.LaminarLimitReynolds;

    /// <summary>Below this Re_D (and ≥ 2300) the flow is transitional and the Auto profile gets a diagnostic.</summary>
    public const double FullyTurbulentReynolds = 4000.0;

    /// <summary>Quantity name used in the returned profile.</summary>
    public const string QuantityName = "axial velocity";

    private const int MinWallLawPointCount = 20;

    /// <summary>Evaluates the request; throws <see cref="BcPrepDataException"/> on invalid or unsupported input.</summary>
    public static VelocityProfileResult Build(VelocityProfileRequest request)
    {
        ArgumentNullException.ThrowIfNull(request);
        var massFlow = Require.Positive(request.MassFlowKgPerS, "mass flow", "kg/s");
        var rho = Require.Positive(request.DensityKgPerM3, "density", "kg/m3");
        var mu = Require.Positive(request.ViscosityPaS, "viscosity", "Pa s");
        var radius = Require.Positive(request.DiameterM, "pipe diameter", "m") / 2.0;
        var bulk = PipeFlow.BulkVelocity(massFlow, rho, request.DiameterM);
        var reynolds = PipeFlow.ReynoldsFromMassFlow(massFlow, request.DiameterM, mu);
        var diagnostics = ImmutableArray.CreateBuilder<string>();
        var model = Resolve(request.Model, reynolds, diagnostics);
        if (model is VelocityProfileModel.Spalding or VelocityProfileModel.Reichardt && request.PointCount < MinWallLawPointCount)
        {
            throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                $"Wall-law profiles need at least {MinWallLawPointCount} radial points; {request.PointCount} requested."));
        }

        var grid = RadialGrid.WallClustered(radius, request.PointCount, request.GridStretching);
        var shape = Shape(model, request, radius, bulk, reynolds, mu / rho);

        var exactModelFlow = shape.AnalyticMassFlowMatches ? massFlow : rho * AccurateAreaIntegral(shape.Velocity, radius, shape.ViscousLengthM);
        var modelValues = grid.Select(shape.Velocity).ToImmutableArray();
        var discreteFlow = rho * Interpolation.AreaIntegral(grid, i => modelValues[i]);
        var scale = massFlow / discreteFlow;
        var values = modelValues.Select(u => u * scale).ToImmutableArray();

        return new VelocityProfileResult(
            RadialProfile.Create(QuantityName, "m/s", grid, values),
            model, reynolds, bulk, shape.FrictionFactor, shape.FrictionVelocity, shape.Exponent,
            (exactModelFlow / massFlow) - 1.0, (discreteFlow / exactModelFlow) - 1.0, scale, diagnostics.ToImmutable());
    }

    /// <summary>Ratio U_b/u_max = 2n²/[(n + 1)(2n + 1)] of the power-law profile (n &gt; 0).</summary>
    public static double PowerLawBulkToCentrelineRatio(double exponent)
    {
        Require.Positive(exponent, "power-law exponent", "");
        return 2.0 * exponent * exponent / ((exponent + 1.0) * ((2.0 * exponent) + 1.0));
    }

    /// <summary>Power-law exponent n = 1/√f with f from Colebrook (De Chant 2005, from memory); Re &gt; 2300.</summary>
    public static double PowerLawExponentFromReynolds(double reynolds, double relativeRoughness = 0.0) =>
        1.0 / Math.Sqrt(FrictionFactor.Colebrook(reynolds, relativeRoughness));

    private static VelocityProfileModel Resolve(VelocityProfileModel requested, double reynolds, ImmutableArray<string>.Builder diagnostics)
    {
        if (requested == VelocityProfileModel.Laminar && reynolds >= LaminarReynoldsLimit)
        {
            diagnostics.Add(string.Create(CultureInfo.InvariantCulture, $"Laminar profile requested at Re_D = {reynolds:F0} (>= {LaminarReynoldsLimit:F0})."));
        }

        if (requested != VelocityProfileModel.Auto)
        {
            return requested;
        }

        if (reynolds < LaminarReynoldsLimit)
        {
            return VelocityProfileModel.Laminar;
        }

        if (reynolds < FullyTurbulentReynolds)
        {
            diagnostics.Add(string.Create(CultureInfo.InvariantCulture,
                $"Re_D = {reynolds:F0} is transitional (2300..4000): the turbulent power-law profile is an assumption."));
        }

        return VelocityProfileModel.PowerLaw;
    }

    private sealed record ModelShape(
        Func<double, double> Velocity, double FrictionFactor, double FrictionVelocity, double Exponent,
        bool AnalyticMassFlowMatches, double ViscousLengthM);

    private static ModelShape Shape(VelocityProfileModel model, VelocityProfileRequest request, double radius, double bulk, double reynolds, double kinematicViscosity)
    {
        switch (model)
        {
            case VelocityProfileModel.Uniform:
                return new ModelShape(_ => bulk, double.NaN, double.NaN, double.NaN, true, radius);
            case VelocityProfileModel.Laminar:
                {
                    var f = 64.0 / reynolds;
                    return new ModelShape(r => 2.0 * bulk * (1.0 - (r * r / (radius * radius))), f, PipeFlow.FrictionVelocity(bulk, f), double.NaN, true, radius);
                }

            case VelocityProfileModel.PowerLaw:
                {
                    // With a given n the friction factor is only reported, so it is left NaN in laminar flow.
                    var f = request.PowerLawExponent is null || reynolds > LaminarReynoldsLimit
                        ? FrictionFactor.Colebrook(reynolds, request.RelativeRoughness)
                        : double.NaN;
                    var n = request.PowerLawExponent is { } given
                        ? Require.InRange(given, 1.0, 20.0, "power-law exponent", "", "the power-law profile")
                        : Require.Positive(request.PowerLawExponentFactor, "power-law exponent factor", "") / Math.Sqrt(f);
                    var uMax = bulk / PowerLawBulkToCentrelineRatio(n);
                    var uTau = double.IsNaN(f) ? double.NaN : PipeFlow.FrictionVelocity(bulk, f);
                    return new ModelShape(r => uMax * Math.Pow(Math.Max(1.0 - (r / radius), 0.0), 1.0 / n), f, uTau, n, true, radius);
                }

            case VelocityProfileModel.Spalding:
            case VelocityProfileModel.Reichardt:
                {
                    var f = FrictionFactor.Colebrook(reynolds, request.RelativeRoughness);
                    var uTau = PipeFlow.FrictionVelocity(bulk, f);
                    var viscousLength = kinematicViscosity / uTau;
                    double kappa = request.Kappa, b = request.LogLawIntercept;
                    Func<double, double> uPlus = model == VelocityProfileModel.Spalding
                        ? yPlus => WallLaw.Spalding(yPlus, kappa, b)
                        : yPlus => WallLaw.Reichardt(yPlus, kappa);
                    return new ModelShape(r => uTau * uPlus(Math.Max(radius - r, 0.0) / viscousLength), f, uTau, double.NaN, false, viscousLength);
                }

            default:
                throw new BcPrepDataException($"Unknown velocity profile model '{model}'.");
        }
    }

    /// <summary>
    /// ∫ u 2πr dr over [0, R] by 16-point Gauss–Legendre on sub-intervals of the wall distance y = R − r that grow
    /// geometrically (factor 1.5) from one viscous length at the wall, so the near-wall layer is resolved.
    /// </summary>
    private static double AccurateAreaIntegral(Func<double, double> velocity, double radius, double viscousLengthM)
    {
        var sum = 0.0;
        var start = 0.0;
        var end = Math.Min(viscousLengthM, radius);
        while (start < radius)
        {
            var a = start;
            var b = end;
            sum += GaussLegendreRule.Integrate(y => velocity(radius - y) * (radius - y), a, b, 16);
            start = end;
            end = Math.Min(radius, end * 1.5);
        }

        return 2.0 * Math.PI * sum;
    }
}
