using BcPrep.Physics;

namespace BcPrep.Profiles;

/// <summary>Inlet turbulence quantities, SI units.</summary>
/// <param name="Intensity">I = u′/U (fraction, not percent).</param>
/// <param name="KineticEnergyM2PerS2">k = 1.5 (U I)², m²/s².</param>
/// <param name="LengthScaleM">ℓ, m.</param>
/// <param name="DissipationRateM2PerS3">ε = C_μ^{3/4} k^{3/2}/ℓ, m²/s³.</param>
/// <param name="SpecificDissipationRatePerS">ω = k^{1/2}/(C_μ^{1/4} ℓ) = ε/(C_μ k), 1/s.</param>
/// <param name="ViscosityRatio">ν_t/ν with ν_t = C_μ k²/ε.</param>
/// <param name="Convention">Text stating the definitions above, for a boundary-condition file header.</param>
public sealed record InletTurbulenceState(
    double Intensity,
    double KineticEnergyM2PerS2,
    double LengthScaleM,
    double DissipationRateM2PerS3,
    double SpecificDissipationRatePerS,
    double ViscosityRatio,
    string Convention);

/// <summary>
/// Inlet turbulence by common CFD practice for fully developed pipe flow: I = 0.16 Re_D^{−1/8} (empirical pipe
/// correlation), k = 1.5 (U_b I)², ℓ = 0.07 D, and the length scale defined through ε = C_μ^{3/4} k^{3/2}/ℓ
/// (C_μ = 0.09). Note the other convention in circulation, ε = C_μ k^{3/2}/ℓ, gives ε smaller by C_μ^{1/4} ≈ 0.548.
/// </summary>
public static class InletTurbulence
{
    /// <summary>Model constant C_μ of the k–ε family.</summary>
    public const double CMu = 0.09;

    /// <summary>Ratio ℓ/D for fully developed pipe flow (common practice).</summary>
    public const double LengthScaleToDiameter = 0.07;

    /// <summary>Statement of the convention, for file headers.</summary>
    public const string ConventionDescription =
        "turbulence (common practice, fully developed pipe): I = 0.16 Re_D^(-1/8); k = 1.5 (U_b I)^2; l = 0.07 D; " +
        "epsilon = Cmu^(3/4) k^(3/2) / l; omega = k^(1/2) / (Cmu^(1/4) l) = epsilon / (Cmu k); nu_t = Cmu k^2 / epsilon; Cmu = 0.09";

    /// <summary>Pipe-flow correlation I = 0.16 Re^{−1/8}; Re in [2300, 1e8] (turbulent pipe flow).</summary>
    public static double PipeIntensity(double reynolds) =>
        0.16 * Math.Pow(Require.InRange(reynolds, FrictionFactor.LaminarLimitReynolds, 1.0e8, "Reynolds number", "", "the pipe turbulence-intensity correlation"), -0.125);

    /// <summary>Quantities from bulk velocity U_b, diameter D and kinematic viscosity ν, using the pipe correlations.</summary>
    public static InletTurbulenceState ForFullyDevelopedPipe(double bulkVelocityMPerS, double diameterM, double kinematicViscosityM2PerS)
    {
        Require.Positive(bulkVelocityMPerS, "bulk velocity", "m/s");
        Require.Positive(diameterM, "pipe diameter", "m");
        Require.Positive(kinematicViscosityM2PerS, "kinematic viscosity", "m2/s");
        var reynolds = bulkVelocityMPerS * diameterM / kinematicViscosityM2PerS;
        return FromIntensityAndLengthScale(bulkVelocityMPerS, PipeIntensity(reynolds), LengthScaleToDiameter * diameterM, kinematicViscosityM2PerS);
    }

    /// <summary>Quantities from a given intensity I (fraction, (0, 1]) and length scale ℓ &gt; 0.</summary>
    public static InletTurbulenceState FromIntensityAndLengthScale(double velocityMPerS, double intensity, double lengthScaleM, double kinematicViscosityM2PerS)
    {
        Require.Positive(velocityMPerS, "velocity", "m/s");
        Require.InRange(intensity, 1e-6, 1.0, "turbulence intensity", "(fraction)", "the inlet turbulence quantities");
        Require.Positive(lengthScaleM, "turbulence length scale", "m");
        Require.Positive(kinematicViscosityM2PerS, "kinematic viscosity", "m2/s");
        var uPrime = velocityMPerS * intensity;
        var k = 1.5 * uPrime * uPrime;
        var epsilon = Math.Pow(CMu, 0.75) * Math.Pow(k, 1.5) / lengthScaleM;
        var omega = Math.Sqrt(k) / (Math.Pow(CMu, 0.25) * lengthScaleM);
        var nuT = CMu * k * k / epsilon;
        return new InletTurbulenceState(intensity, k, lengthScaleM, epsilon, omega, nuT / kinematicViscosityM2PerS, ConventionDescription);
    }
}
