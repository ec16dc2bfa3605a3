using System.Collections.Immutable;
using System.Globalization;

namespace BcPrep.Physics;

/// <summary>
/// Mass flow through an ISO 5167-2 orifice plate: q_m = C/√(1 − β⁴) · ε · (π/4) d² · √(2 Δp ρ1), with C from
/// Reader-Harris/Gallagher iterated on Re_D = 4 q_m/(π D μ) until the relative change of q_m is ≤ 1e-10.
/// Geometry outside the standard (D outside 50–1000 mm, β outside 0.1–0.75, d &lt; 12.5 mm) and p2/p1 &lt; 0.75
/// throw <see cref="BcPrepDataException"/>, because the equation itself is then unsupported.
/// Re_D below the standard's minimum (corner, D–D/2: 5000 for β ≤ 0.56, 16000β² above; flange: 5000 and
/// 170 000 β² D[m]) only adds a warning, since a low-flow operating point is real data whose flow is still
/// estimated — but the quoted uncertainty of C does not cover it. Pipe-roughness limits are not checked.
/// </summary>
public static class OrificeMeter
{
    private const double ConvergenceTolerance = 1e-10;
    private const int MaxIterations = 100;

    /// <summary>
    /// Computes the mass flow and the standard's uncertainty statements for one operating point. The standard's
    /// geometry range (50 mm ≤ D ≤ 1 m, d ≥ 12.5 mm, 0.1 ≤ β ≤ 0.75) is checked when <paramref name="checkGeometry"/>
    /// is true: a caller judges it once at the meter's declared geometry, and re-evaluations at perturbed diameters
    /// (numerical derivatives, Monte Carlo draws) skip it, so that a meter built at the edge of the range keeps its
    /// uncertainty.
    /// </summary>
    public static DifferentialPressureFlowResult MassFlow(DifferentialPressureFlowInput input, OrificeTapping tapping, bool checkGeometry = true)
    {
        ArgumentNullException.ThrowIfNull(input);
        const string method = "ISO 5167-2 orifice plates";
        if (checkGeometry)
        {
            const double slack = VenturiTube.RangeSlack; // an orifice exactly at an end of the range is inside it
            Require.InRange(input.PipeDiameterM, 0.050 * (1 - slack), 1.000 * (1 + slack), "pipe diameter", "m", method);
            Require.InRange(input.ThroatDiameterM, 0.0125 * (1 - slack), input.PipeDiameterM, "orifice bore", "m", method);
            Require.InRange(input.ThroatDiameterM / input.PipeDiameterM, 0.1 * (1 - slack), 0.75 * (1 + slack), "diameter ratio beta", "", method);
        }
        var beta = OrificePlate.DiameterRatio(input.PipeDiameterM, input.ThroatDiameterM);
        Require.Positive(input.DifferentialPressurePa, "differential pressure", "Pa");
        Require.Positive(input.UpstreamDensityKgPerM3, "upstream density", "kg/m3");
        Require.Positive(input.ViscosityPaS, "viscosity", "Pa s");
        var downstreamPa = input.UpstreamPressurePa - input.DifferentialPressurePa;
        var epsilon = OrificePlate.Expansibility(input.PipeDiameterM, input.ThroatDiameterM, input.UpstreamPressurePa, downstreamPa, input.IsentropicExponent);
        var e = 1.0 / Math.Sqrt(1.0 - Math.Pow(beta, 4));
        var flowPerC = e * epsilon * Math.PI / 4.0 * input.ThroatDiameterM * input.ThroatDiameterM
            * Math.Sqrt(2.0 * input.DifferentialPressurePa * input.UpstreamDensityKgPerM3);

        var massFlow = 0.6 * flowPerC;
        double c = 0.6, reynolds = 0.0;
        for (var i = 1; i <= MaxIterations; i++)
        {
            reynolds = PipeFlow.ReynoldsFromMassFlow(massFlow, input.PipeDiameterM, input.ViscosityPaS);
            c = OrificePlate.DischargeCoefficient(input.PipeDiameterM, input.ThroatDiameterM, reynolds, tapping);
            var next = c * flowPerC;
            var converged = Math.Abs(next - massFlow) <= ConvergenceTolerance * next;
            massFlow = next;
            if (converged)
            {
                reynolds = PipeFlow.ReynoldsFromMassFlow(massFlow, input.PipeDiameterM, input.ViscosityPaS);
                return new DifferentialPressureFlowResult(
                    massFlow, c, epsilon, e, beta, reynolds, i,
                    OrificePlate.DischargeCoefficientExpandedUncertaintyPercent(input.PipeDiameterM, input.ThroatDiameterM, reynolds),
                    OrificePlate.ExpansibilityExpandedUncertaintyPercent(input.DifferentialPressurePa, input.UpstreamPressurePa, input.IsentropicExponent),
                    ReynoldsWarnings(reynolds, beta, input.PipeDiameterM, tapping));
            }
        }

        throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
            $"Orifice flow iteration did not converge in {MaxIterations} steps (last C = {c:R}, Re_D = {reynolds:R})."));
    }

    /// <summary>Smallest Re_D for which ISO 5167-2 states the uncertainty of C, for the given geometry and tapping.</summary>
    public static double MinimumReynolds(double beta, double pipeDiameterM, OrificeTapping tapping) => tapping == OrificeTapping.Flange
        ? Math.Max(5000.0, 170000.0 * beta * beta * pipeDiameterM)
        : beta <= 0.56 ? 5000.0 : Math.Max(5000.0, 16000.0 * beta * beta);

    private static ImmutableArray<string> ReynoldsWarnings(double reynolds, double beta, double pipeDiameterM, OrificeTapping tapping)
    {
        var minimum = MinimumReynolds(beta, pipeDiameterM, tapping);
        return reynolds >= minimum
            ? []
            : [string.Create(CultureInfo.InvariantCulture,
                $"Re_D = {reynolds:F0} is below the ISO 5167-2 minimum {minimum:F0} for beta = {beta:F4}, {tapping} tappings: C is extrapolated and its stated uncertainty does not apply.")];
    }
}
