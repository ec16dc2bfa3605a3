namespace BcPrep.Profiles;

/// <summary>Shape model of the axial velocity profile in a round pipe.</summary>
public enum VelocityProfileModel
{
    /// <summary>Laminar below Re_D = 2300, power law with n = 1/√f (Colebrook) at and above it.</summary>
    Auto,

    /// <summary>Plug flow u = U_b.</summary>
    Uniform,

    /// <summary>Hagen–Poiseuille u = 2U_b(1 − r²/R²).</summary>
    Laminar,

    /// <summary>u = u_max(1 − r/R)^{1/n}; n given or 1/√f from Colebrook (De Chant 2005).</summary>
    PowerLaw,

    /// <summary>u = u_τ u⁺(y⁺) with Spalding's law, y = R − r, u_τ = U_b √(f/8), f from Colebrook.</summary>
    Spalding,

    /// <summary>As <see cref="Spalding"/> with Reichardt's explicit law.</summary>
    Reichardt,
}
