using System.Collections.Immutable;
using System.Globalization;
using BcPrep.Physics;

namespace BcPrep.Profiles;

/// <summary>What to do with grid radii outside the span of a temperature rake.</summary>
public enum RakeEndPolicy
{
    /// <summary>Throw when the rake does not span the whole grid.</summary>
    Error,

    /// <summary>Hold the nearest rake value constant beyond the rake ends (reported in the diagnostics).</summary>
    ClampConstant,
}

/// <summary>A temperature profile with notes about how it was obtained.</summary>
/// <param name="Profile">T(r), K.</param>
/// <param name="ClampedPointCount">Grid points that received a held end value instead of an interpolated one.</param>
/// <param name="Diagnostics">Notes for the report.</param>
public sealed record TemperatureProfileResult(RadialProfile Profile, int ClampedPointCount, ImmutableArray<string> Diagnostics);

/// <summary>Radial temperature profiles, K.</summary>
public static class TemperatureProfiles
{
    /// <summary>Quantity name used in the returned profile.</summary>
    public const string QuantityName = "temperature";

    /// <summary>T(r) = T on every grid radius; T in (0, 5000] K.</summary>
    public static TemperatureProfileResult Uniform(ImmutableArray<double> radiusM, double temperatureK)
    {
        CheckGrid(radiusM);
        Require.InRange(temperatureK, 1e-9, 5000.0, "temperature", "K", "a temperature profile");
        return new TemperatureProfileResult(RadialProfile.Create(QuantityName, "K", radiusM, radiusM.Select(_ => temperatureK).ToImmutableArray()), 0, []);
    }

    /// <summary>
    /// Linear interpolation of a radial rake (r_i, T_i) onto the grid. Rake radii must be distinct and within
    /// [0, R] (any order; sorted here), at least one point. Grid radii outside [r_min, r_max] of the rake either
    /// throw (<see cref="RakeEndPolicy.Error"/>) or take the nearest end value (<see cref="RakeEndPolicy.ClampConstant"/>);
    /// never extrapolated linearly.
    /// </summary>
    public static TemperatureProfileResult FromRake(
        ImmutableArray<double> radiusM, IReadOnlyList<double> rakeRadiusM, IReadOnlyList<double> rakeTemperatureK, RakeEndPolicy endPolicy)
    {
        CheckGrid(radiusM);
        ArgumentNullException.ThrowIfNull(rakeRadiusM);
        ArgumentNullException.ThrowIfNull(rakeTemperatureK);
        if (rakeRadiusM.Count == 0 || rakeRadiusM.Count != rakeTemperatureK.Count)
        {
            throw new BcPrepDataException("Temperature rake needs at least one point and as many radii as temperatures.");
        }

        var outer = radiusM[^1];
        var pairs = rakeRadiusM.Zip(rakeTemperatureK)
            .Select(p => (R: Require.InRange(p.First, 0.0, outer * (1.0 + 1e-9), "rake radius", "m", "the temperature rake"),
                          T: Require.InRange(p.Second, 1e-9, 5000.0, "rake temperature", "K", "the temperature rake")))
            .OrderBy(p => p.R)
            .ToArray();
        for (var i = 1; i < pairs.Length; i++)
        {
            if (pairs[i].R == pairs[i - 1].R)
            {
                throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture, $"Temperature rake has two points at r = {pairs[i].R:R} m."));
            }
        }

        var xs = pairs.Select(p => p.R).ToImmutableArray();
        var ys = pairs.Select(p => p.T).ToImmutableArray();
        var clamped = 0;
        var values = ImmutableArray.CreateBuilder<double>(radiusM.Length);
        foreach (var r in radiusM)
        {
            if (r < xs[0] || r > xs[^1])
            {
                if (endPolicy == RakeEndPolicy.Error)
                {
                    throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                        $"Grid radius {r:R} m lies outside the rake span [{xs[0]:R}, {xs[^1]:R}] m and extrapolation is not allowed."));
                }

                clamped++;
                values.Add(r < xs[0] ? ys[0] : ys[^1]);
            }
            else
            {
                values.Add(Interpolation.Linear(xs, ys, r));
            }
        }

        ImmutableArray<string> diagnostics = clamped == 0
            ? []
            : [string.Create(CultureInfo.InvariantCulture,
                $"{clamped} of {radiusM.Length} grid points lie outside the rake span [{xs[0]:R}, {xs[^1]:R}] m and hold the nearest rake temperature.")];
        return new TemperatureProfileResult(RadialProfile.Create(QuantityName, "K", radiusM, values.MoveToImmutable()), clamped, diagnostics);
    }

    private static void CheckGrid(ImmutableArray<double> radiusM)
    {
        if (radiusM.IsDefault || radiusM.Length < 2)
        {
            throw new BcPrepDataException("A radial grid needs at least 2 points.");
        }
    }
}
