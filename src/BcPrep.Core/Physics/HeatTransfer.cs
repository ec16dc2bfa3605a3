namespace BcPrep.Physics;

/// <summary>Heater power, wall heat flux and fully developed Nusselt correlations for round tubes, SI units.</summary>
public static class HeatTransfer
{
    /// <summary>Electrical heater power P = V·I, W (DC or true-RMS resistive load); inputs finite.</summary>
    public static double HeaterPower(double voltageV, double currentA) =>
        Require.Finite(voltageV, "heater voltage", "V") * Require.Finite(currentA, "heater current", "A");

    /// <summary>
    /// Mean wall heat flux q = P (1 − lossFraction)/(π D L_heated), W/m². lossFraction in [0, 1), D and L &gt; 0.
    /// </summary>
    public static double WallHeatFlux(double heaterPowerW, double lossFraction, double diameterM, double heatedLengthM)
    {
        Require.Finite(heaterPowerW, "heater power", "W");
        Require.InRange(lossFraction, 0.0, 0.999999, "heat-loss fraction", "", "the wall heat flux");
        Require.Positive(diameterM, "pipe diameter", "m");
        Require.Positive(heatedLengthM, "heated length", "m");
        return heaterPowerW * (1.0 - lossFraction) / (Math.PI * diameterM * heatedLengthM);
    }

    /// <summary>
    /// Dittus–Boelter Nu = 0.023 Re^0.8 Pr^n, n = 0.4 when the fluid is heated (T_wall &gt; T_bulk), 0.3 when cooled.
    /// Valid Re ≥ 1e4, 0.6 ≤ Pr ≤ 160, L/D ≥ 10, properties at the bulk temperature; errors up to ~25 %.
    /// Throws outside the Re and Pr ranges (upper Re limit taken as 5e6).
    /// </summary>
    public static double DittusBoelter(double reynolds, double prandtl, bool fluidHeated)
    {
        Require.InRange(reynolds, 1.0e4, 5.0e6, "Reynolds number", "", "the Dittus-Boelter correlation");
        Require.InRange(prandtl, 0.6, 160.0, "Prandtl number", "", "the Dittus-Boelter correlation");
        return 0.023 * Math.Pow(reynolds, 0.8) * Math.Pow(prandtl, fluidHeated ? 0.4 : 0.3);
    }

    /// <summary>
    /// Gnielinski (1976) Nu = (f/8)(Re − 1000)Pr / [1 + 12.7 √(f/8)(Pr^{2/3} − 1)] with the Darcy f given.
    /// Valid 3000 ≤ Re ≤ 5e6, 0.5 ≤ Pr ≤ 2000; typically within ~10 %. Throws outside these ranges or for f ≤ 0.
    /// </summary>
    public static double Gnielinski(double reynolds, double prandtl, double darcyFrictionFactor)
    {
        Require.InRange(reynolds, 3000.0, 5.0e6, "Reynolds number", "", "the Gnielinski correlation");
        Require.InRange(prandtl, 0.5, 2000.0, "Prandtl number", "", "the Gnielinski correlation");
        Require.Positive(darcyFrictionFactor, "Darcy friction factor", "");
        var f8 = darcyFrictionFactor / 8.0;
        return f8 * (reynolds - 1000.0) * prandtl / (1.0 + (12.7 * Math.Sqrt(f8) * (Math.Pow(prandtl, 2.0 / 3.0) - 1.0)));
    }

    /// <summary>Gnielinski with the smooth-tube Petukhov friction factor (its usual pairing).</summary>
    public static double GnielinskiSmooth(double reynolds, double prandtl) =>
        Gnielinski(reynolds, prandtl, FrictionFactor.Petukhov(reynolds));

    /// <summary>Heat-transfer coefficient h = Nu k/D, W/(m²·K).</summary>
    public static double HeatTransferCoefficient(double nusselt, double conductivityWPerMK, double diameterM) =>
        Require.Positive(nusselt, "Nusselt number", "") * Require.Positive(conductivityWPerMK, "thermal conductivity", "W/(m K)")
        / Require.Positive(diameterM, "pipe diameter", "m");
}
