namespace BcPrep.Profiles;

/// <summary>
/// Scalar inputs that fully determine an inlet velocity profile, SI units. The profile is a pure function of
/// this record, so an uncertainty engine can re-evaluate it under perturbed inputs (change with <c>with</c>).
/// </summary>
/// <param name="MassFlowKgPerS">Measured mass flow ṁ, kg/s (&gt; 0).</param>
/// <param name="DensityKgPerM3">Density ρ, kg/m³, taken uniform over the section.</param>
/// <param name="ViscosityPaS">Dynamic viscosity μ, Pa·s.</param>
/// <param name="DiameterM">Pipe internal diameter D, m.</param>
/// <param name="Model">Profile shape model.</param>
/// <param name="PointCount">Number of radial grid points (2–100 000; at least 20 enforced for wall laws).</param>
/// <param name="RelativeRoughness">ε/D for the Colebrook friction factor (0 = smooth).</param>
/// <param name="PowerLawExponent">n of the power law; null → 1/√f.</param>
/// <param name="Kappa">von Kármán constant of the wall laws.</param>
/// <param name="LogLawIntercept">Intercept B of Spalding's law.</param>
/// <param name="GridStretching">tanh stretching δ of the radial grid.</param>
public sealed record VelocityProfileRequest(
    double MassFlowKgPerS,
    double DensityKgPerM3,
    double ViscosityPaS,
    double DiameterM,
    VelocityProfileModel Model = VelocityProfileModel.Auto,
    int PointCount = 201,
    double RelativeRoughness = 0.0,
    double? PowerLawExponent = null,
    double Kappa = WallLaw.DefaultKappa,
    double LogLawIntercept = WallLaw.DefaultB,
    double GridStretching = RadialGrid.DefaultStretching)
{
    /// <summary>
    /// Model-form factor on the power-law exponent n = 1/√f (1 = the relation as published); the uncertainty stage
    /// perturbs it (Physics/ModelForm). Not applied to an exponent given in <see cref="PowerLawExponent"/>.
    /// </summary>
    public double PowerLawExponentFactor { get; init; } = 1.0;
}
