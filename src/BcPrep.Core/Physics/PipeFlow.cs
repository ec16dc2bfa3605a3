namespace BcPrep.Physics;

/// <summary>Bulk quantities of flow in a round pipe, SI units.</summary>
public static class PipeFlow
{
    /// <summary>
    /// Mach number above which density changes exceed roughly 5 % and the incompressible treatment of the inlet
    /// is questionable (common practice, no single source).
    /// </summary>
    public const double CompressibilityWarningMach = 0.3;

    /// <summary>Cross-section area π D²/4, m²; D must be finite and &gt; 0.</summary>
    public static double Area(double diameterM) =>
        Math.PI / 4.0 * Require.Positive(diameterM, "pipe diameter", "m") * diameterM;

    /// <summary>Bulk velocity U = ṁ/(ρ A), m/s; ṁ ≥ 0, ρ and D &gt; 0.</summary>
    public static double BulkVelocity(double massFlowKgPerS, double densityKgPerM3, double diameterM)
    {
        Require.NonNegative(massFlowKgPerS, "mass flow", "kg/s");
        Require.Positive(densityKgPerM3, "density", "kg/m3");
        return massFlowKgPerS / (densityKgPerM3 * Area(diameterM));
    }

    /// <summary>Reynolds number ρ U D/μ; all inputs finite, ρ, D, μ &gt; 0, U ≥ 0.</summary>
    public static double Reynolds(double densityKgPerM3, double velocityMPerS, double diameterM, double viscosityPaS)
    {
        Require.Positive(densityKgPerM3, "density", "kg/m3");
        Require.NonNegative(velocityMPerS, "velocity", "m/s");
        Require.Positive(diameterM, "pipe diameter", "m");
        Require.Positive(viscosityPaS, "viscosity", "Pa s");
        return densityKgPerM3 * velocityMPerS * diameterM / viscosityPaS;
    }

    /// <summary>Reynolds number from mass flow, 4 ṁ/(π D μ) (density-free).</summary>
    public static double ReynoldsFromMassFlow(double massFlowKgPerS, double diameterM, double viscosityPaS)
    {
        Require.NonNegative(massFlowKgPerS, "mass flow", "kg/s");
        Require.Positive(diameterM, "pipe diameter", "m");
        Require.Positive(viscosityPaS, "viscosity", "Pa s");
        return 4.0 * massFlowKgPerS / (Math.PI * diameterM * viscosityPaS);
    }

    /// <summary>Mach number U/c; U ≥ 0, c &gt; 0.</summary>
    public static double Mach(double velocityMPerS, double speedOfSoundMPerS) =>
        Require.NonNegative(velocityMPerS, "velocity", "m/s") / Require.Positive(speedOfSoundMPerS, "speed of sound", "m/s");

    /// <summary>True when Ma &gt; <see cref="CompressibilityWarningMach"/>.</summary>
    public static bool IsCompressibilityWarning(double mach) => mach > CompressibilityWarningMach;

    /// <summary>Wall shear stress τ_w = (f/8) ρ U², Pa, from a Darcy friction factor.</summary>
    public static double WallShearStress(double darcyFrictionFactor, double densityKgPerM3, double bulkVelocityMPerS) =>
        Require.Positive(darcyFrictionFactor, "Darcy friction factor", "") / 8.0 * Require.Positive(densityKgPerM3, "density", "kg/m3")
        * Require.NonNegative(bulkVelocityMPerS, "bulk velocity", "m/s") * bulkVelocityMPerS;

    /// <summary>Friction velocity u_τ = U √(f/8), m/s, from a Darcy friction factor.</summary>
    public static double FrictionVelocity(double bulkVelocityMPerS, double darcyFrictionFactor) =>
        Require.NonNegative(bulkVelocityMPerS, "bulk velocity", "m/s") * Math.Sqrt(Require.Positive(darcyFrictionFactor, "Darcy friction factor", "") / 8.0);

    /// <summary>Fully developed pressure gradient magnitude dp/dx = (f/D) ½ ρ U², Pa/m (Darcy–Weisbach).</summary>
    public static double PressureGradient(double darcyFrictionFactor, double diameterM, double densityKgPerM3, double bulkVelocityMPerS) =>
        Require.Positive(darcyFrictionFactor, "Darcy friction factor", "") / Require.Positive(diameterM, "pipe diameter", "m")
        * 0.5 * Require.Positive(densityKgPerM3, "density", "kg/m3") * Require.NonNegative(bulkVelocityMPerS, "bulk velocity", "m/s") * bulkVelocityMPerS;
}
