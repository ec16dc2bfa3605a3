namespace BcPrep.Tools.SampleDay;

/// <summary>
/// A deliberately simple plant model of the stand, good enough to make realistic logs: ideal-gas air,
/// Blasius friction, Dittus–Boelter wall heat transfer, first-order lags for the flow and the thermal mass.
/// BcPrep itself must not rely on any of these shortcuts; they only shape the invented data.
/// </summary>
internal static class RigPhysics
{
    public const double DiameterM = 0.0525;
    public const double HeatedLengthM = 1.20;
    public const double HeatedStartM = 0.20;
    public const double InletPlaneM = 0.15;
    public const double OutletPlaneM = 1.45;
    public const double HeaterLossFraction = 0.05;
    public const double CpJkgK = 1007.0;
    public const double GasConstant = 287.05;
    public static readonly double[] WallPositionsM = [0.35, 0.65, 0.95, 1.25];

    public static double AreaM2 => Math.PI * DiameterM * DiameterM / 4.0;

    public static double Viscosity(double temperatureK) => 1.458e-6 * Math.Pow(temperatureK, 1.5) / (temperatureK + 110.4);

    public static double Conductivity(double temperatureK) => 0.0241 * Math.Pow(temperatureK / 273.0, 1.5) * (273.0 + 194.0) / (temperatureK + 194.0);

    public static double Density(double pressurePa, double temperatureK) => pressurePa / (GasConstant * temperatureK);

    public static double Reynolds(double massFlowKgS, double temperatureK) => 4.0 * massFlowKgS / (Math.PI * DiameterM * Viscosity(temperatureK));

    /// <summary>Gauge static pressure at the inlet plane: the blower's delivery against the duct and exit restriction.</summary>
    public static double InletGaugePa(double massFlowKgS) => 750_000.0 * massFlowKgS * massFlowKgS;

    public static double FrictionDropPa(double massFlowKgS, double pressurePa, double temperatureK, double lengthM)
    {
        if (massFlowKgS <= 0)
        {
            return 0.0;
        }
        var rho = Density(pressurePa, temperatureK);
        var u = massFlowKgS / (rho * AreaM2);
        var f = 0.3164 * Math.Pow(Reynolds(massFlowKgS, temperatureK), -0.25);
        return f * lengthM / DiameterM * 0.5 * rho * u * u;
    }

    /// <summary>Static-pressure drop of a heated flow that accelerates as its density falls: G²(1/ρ_out − 1/ρ_in).</summary>
    public static double AccelerationDropPa(double massFlowKgS, double pressurePa, double inletK, double outletK)
    {
        var g = massFlowKgS / AreaM2;
        return g * g * ((1 / Density(pressurePa, outletK)) - (1 / Density(pressurePa, inletK)));
    }

    public static double OutletBulkK(double inletK, double massFlowKgS, double heaterPowerW) =>
        massFlowKgS <= 1e-6 ? inletK : inletK + (heaterPowerW * (1 - HeaterLossFraction) / (massFlowKgS * CpJkgK));

    /// <summary>Steady wall temperature at axial position z with uniform heat flux.</summary>
    public static double WallK(double z, double inletK, double outletK, double massFlowKgS, double heaterPowerW)
    {
        if (massFlowKgS <= 1e-6)
        {
            return inletK;
        }
        var fraction = Math.Clamp((z - HeatedStartM) / HeatedLengthM, 0, 1);
        var bulk = inletK + (fraction * (outletK - inletK));
        var q = heaterPowerW * (1 - HeaterLossFraction) / (Math.PI * DiameterM * HeatedLengthM);
        var re = Reynolds(massFlowKgS, bulk);
        var pr = Viscosity(bulk) * CpJkgK / Conductivity(bulk);
        var h = 0.023 * Math.Pow(re, 0.8) * Math.Pow(pr, 0.4) * Conductivity(bulk) / DiameterM;
        return bulk + (q / h);
    }
}
