using System.Collections.Immutable;

namespace BcPrep.Profiles;

/// <summary>An axial velocity profile scaled to the measured mass flow, with the numbers behind it.</summary>
/// <param name="Profile">u(r), m/s, on the wall-clustered grid.</param>
/// <param name="ModelUsed">Model actually applied (resolved from Auto).</param>
/// <param name="Reynolds">Re_D = 4ṁ/(π D μ).</param>
/// <param name="BulkVelocityMPerS">U_b = ṁ/(ρ A).</param>
/// <param name="DarcyFrictionFactor">f used for n or u_τ (64/Re for laminar, NaN for uniform).</param>
/// <param name="FrictionVelocityMPerS">u_τ = U_b √(f/8) before the mass-flow rescaling (NaN for uniform).</param>
/// <param name="PowerLawExponent">n used (NaN unless power law).</param>
/// <param name="ModelMassFlowRelativeError">
/// ∫ρ u_model 2πr dr (accurate quadrature of the continuous model) / ṁ − 1: zero for the analytically scaled
/// models, the wall laws' own mismatch (no wake) otherwise.
/// </param>
/// <param name="RawDiscretisationRelativeError">Trapezoid integral on the grid / accurate integral − 1 of the continuous model.</param>
/// <param name="ScaleFactor">Factor applied to the model so that the grid's trapezoid integral reproduces ṁ exactly.</param>
/// <param name="Diagnostics">Notes for the report (e.g. transitional Reynolds number).</param>
public sealed record VelocityProfileResult(
    RadialProfile Profile,
    VelocityProfileModel ModelUsed,
    double Reynolds,
    double BulkVelocityMPerS,
    double DarcyFrictionFactor,
    double FrictionVelocityMPerS,
    double PowerLawExponent,
    double ModelMassFlowRelativeError,
    double RawDiscretisationRelativeError,
    double ScaleFactor,
    ImmutableArray<string> Diagnostics);
