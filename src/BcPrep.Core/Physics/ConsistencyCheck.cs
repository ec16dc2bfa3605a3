using System.Globalization;

namespace BcPrep.Physics;

/// <summary>Outcome of a plausibility check between two independent estimates of one quantity.</summary>
public enum ConsistencyVerdict
{
    /// <summary>|relative mismatch| ≤ tolerance.</summary>
    Pass,

    /// <summary>|relative mismatch| &gt; tolerance: the numbers disagree more than their stated accuracy allows.</summary>
    Warn,
}

/// <summary>A consistency check with every number that went into its verdict.</summary>
/// <param name="Name">Short name of the check.</param>
/// <param name="Reference">The value used as reference (denominator of the mismatch).</param>
/// <param name="Compared">The independently obtained value.</param>
/// <param name="Unit">Unit of <paramref name="Reference"/> and <paramref name="Compared"/>.</param>
/// <param name="RelativeMismatch">(Compared − Reference)/Reference.</param>
/// <param name="RelativeTolerance">Largest |mismatch| accepted as Pass.</param>
/// <param name="Verdict">Pass or Warn.</param>
/// <param name="Basis">How the two values and the tolerance were obtained, for the report.</param>
public sealed record ConsistencyResult(
    string Name,
    double Reference,
    double Compared,
    string Unit,
    double RelativeMismatch,
    double RelativeTolerance,
    ConsistencyVerdict Verdict,
    string Basis);

/// <summary>Energy-balance and pressure-drop plausibility checks of a heated pipe operating point.</summary>
public static class ConsistencyCheck
{
    /// <summary>
    /// Compares the heat picked up by the air ṁ cp (T_out − T_in) with the heater power delivered to it
    /// P (1 − lossFraction). Mismatch = (ṁ cp ΔT − P(1 − loss))/(P(1 − loss)). The tolerance (relative, same
    /// coverage as the caller wants, e.g. the expanded uncertainty of the balance) is supplied by the caller.
    /// Throws when P(1 − loss) ≤ 0.
    /// </summary>
    public static ConsistencyResult EnergyBalance(
        double heaterPowerW, double lossFraction, double massFlowKgPerS, double specificHeatJPerKgK,
        double inletTemperatureK, double outletTemperatureK, double relativeTolerance)
    {
        Require.InRange(lossFraction, 0.0, 0.999999, "heat-loss fraction", "", "the energy balance");
        var delivered = Require.Positive(heaterPowerW * (1.0 - lossFraction), "heater power delivered to the air", "W");
        Require.NonNegative(massFlowKgPerS, "mass flow", "kg/s");
        Require.Positive(specificHeatJPerKgK, "specific heat", "J/(kg K)");
        Require.Positive(inletTemperatureK, "inlet temperature", "K");
        Require.Positive(outletTemperatureK, "outlet temperature", "K");
        Require.Positive(relativeTolerance, "relative tolerance", "");
        var absorbed = massFlowKgPerS * specificHeatJPerKgK * (outletTemperatureK - inletTemperatureK);
        var basis = string.Create(CultureInfo.InvariantCulture,
            $"reference P(1-loss) = {heaterPowerW:G6} W x (1 - {lossFraction:G4}); compared m cp (Tout - Tin) = {massFlowKgPerS:G6} kg/s x {specificHeatJPerKgK:G6} J/(kg K) x {outletTemperatureK - inletTemperatureK:G6} K");
        return Verdict("energy balance", delivered, absorbed, "W", relativeTolerance, basis);
    }

    /// <summary>
    /// Compares a measured static-pressure drop between two planes L apart with the fully developed prediction
    /// Δp = f (L/D) ½ ρ U² (Darcy f). Tolerance = √(correlationAccuracy² + measuredRelativeUncertainty²), both
    /// relative and at the same coverage; e.g. Colebrook in a smooth pipe is commonly quoted at about ±5 %
    /// (common practice). Only meaningful for fully developed, incompressible flow between the planes.
    /// </summary>
    public static ConsistencyResult PressureDrop(
        double measuredPressureDropPa, double darcyFrictionFactor, double planeDistanceM, double diameterM,
        double densityKgPerM3, double bulkVelocityMPerS, double correlationRelativeAccuracy, double measuredRelativeUncertainty)
    {
        Require.Finite(measuredPressureDropPa, "measured pressure drop", "Pa");
        Require.Positive(darcyFrictionFactor, "Darcy friction factor", "");
        Require.Positive(planeDistanceM, "distance between pressure planes", "m");
        Require.Positive(diameterM, "pipe diameter", "m");
        Require.Positive(densityKgPerM3, "density", "kg/m3");
        Require.Positive(bulkVelocityMPerS, "bulk velocity", "m/s");
        Require.NonNegative(correlationRelativeAccuracy, "correlation accuracy", "");
        Require.NonNegative(measuredRelativeUncertainty, "measured relative uncertainty", "");
        var predicted = darcyFrictionFactor * planeDistanceM / diameterM * 0.5 * densityKgPerM3 * bulkVelocityMPerS * bulkVelocityMPerS;
        var tolerance = Math.Sqrt((correlationRelativeAccuracy * correlationRelativeAccuracy) + (measuredRelativeUncertainty * measuredRelativeUncertainty));
        Require.Positive(tolerance, "combined relative tolerance", "");
        var basis = string.Create(CultureInfo.InvariantCulture,
            $"reference f (L/D) rho U^2/2 with f = {darcyFrictionFactor:G6}, L = {planeDistanceM:G6} m, D = {diameterM:G6} m, rho = {densityKgPerM3:G6} kg/m3, U = {bulkVelocityMPerS:G6} m/s; tolerance = sqrt({correlationRelativeAccuracy:G4}^2 + {measuredRelativeUncertainty:G4}^2)");
        return Verdict("pressure drop", predicted, measuredPressureDropPa, "Pa", tolerance, basis);
    }

    private static ConsistencyResult Verdict(string name, double reference, double compared, string unit, double tolerance, string basis)
    {
        var mismatch = (compared - reference) / reference;
        var verdict = Math.Abs(mismatch) <= tolerance ? ConsistencyVerdict.Pass : ConsistencyVerdict.Warn;
        return new ConsistencyResult(name, reference, compared, unit, mismatch, tolerance, verdict, basis);
    }
}
