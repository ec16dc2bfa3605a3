using System.Collections.Immutable;
using System.Globalization;

namespace BcPrep.Physics;

/// <summary>
/// ISO 5167-4 classical Venturi tube with a machined convergent section. C = 0.995 with a 95 % relative
/// uncertainty of 1 % (values from memory of ISO 5167-4:2003 §5.5.4 — confidence medium; verify against the
/// standard before relying on them). Expansibility is the isentropic expression
/// ε = √[(κ τ^{2/κ}/(κ−1)) (1−β⁴)/(1−β⁴τ^{2/κ}) (1−τ^{(κ−1)/κ})/(1−τ)], τ = p2/p1, with its uncertainty
/// (4 + 100β⁸) Δp/p1 % (from memory). C does not depend on Re here, so no iteration is needed.
/// Geometry and p2/p1 &lt; 0.75 outside the standard throw; Re_D outside 2e5–1e6 (the range for which C = 0.995
/// is stated, from memory) is a warning. Accepted geometry: 50 mm ≤ D ≤ 250 mm, 0.4 ≤ β ≤ 0.75.
/// </summary>
public static class VenturiTube
{
    /// <summary>Discharge coefficient of the machined-convergent classical Venturi tube.</summary>
    public const double MachinedConvergentDischargeCoefficient = 0.995;

    /// <summary>Relative slack on the ends of the geometry range, far below any machining tolerance, so that rounding in unit conversions and ratios does not move a meter at an end outside.</summary>
    internal const double RangeSlack = 1e-9;

    /// <summary>Its 95 % relative uncertainty, %.</summary>
    public const double MachinedConvergentExpandedUncertaintyPercent = 1.0;

    /// <summary>Isentropic expansibility factor ε(β, τ = p2/p1, κ); equals 1 at τ = 1. Throws for τ &lt; 0.75.</summary>
    public static double Expansibility(double pipeDiameterM, double throatDiameterM, double upstreamPressurePa, double downstreamPressurePa, double isentropicExponent)
    {
        var beta = OrificePlate.DiameterRatio(pipeDiameterM, throatDiameterM);
        var tau = OrificePlate.PressureRatio(upstreamPressurePa, downstreamPressurePa, isentropicExponent);
        if (tau == 1.0)
        {
            return 1.0;
        }

        var kappa = isentropicExponent;
        var beta4 = Math.Pow(beta, 4);
        var tau2k = Math.Pow(tau, 2.0 / kappa);
        var value = kappa * tau2k / (kappa - 1.0)
            * (1.0 - beta4) / (1.0 - (beta4 * tau2k))
            * (1.0 - Math.Pow(tau, (kappa - 1.0) / kappa)) / (1.0 - tau);
        return Math.Sqrt(value);
    }

    /// <summary>95 % relative uncertainty of ε, %: (4 + 100β⁸) Δp/p1 (from memory of ISO 5167-4).</summary>
    public static double ExpansibilityExpandedUncertaintyPercent(double beta, double differentialPressurePa, double upstreamPressurePa)
    {
        Require.InRange(beta, 0.0, 1.0, "diameter ratio beta", "", "the Venturi expansibility uncertainty");
        Require.NonNegative(differentialPressurePa, "differential pressure", "Pa");
        Require.Positive(upstreamPressurePa, "upstream pressure", "Pa");
        return (4.0 + (100.0 * Math.Pow(beta, 8))) * differentialPressurePa / upstreamPressurePa;
    }

    /// <summary>Mass flow q_m = C ε/√(1 − β⁴) (π/4) d² √(2 Δp ρ1), kg/s, with the standard's uncertainty statements (machined convergent).</summary>
    public static DifferentialPressureFlowResult MassFlow(DifferentialPressureFlowInput input) => MassFlow(input, VenturiConvergent.Machined);

    /// <summary>
    /// As <see cref="MassFlow(DifferentialPressureFlowInput)"/> for the given convergent form (ISO 5167-4): its C and
    /// uncertainty, its pipe-diameter and β range (outside them: an error), its Re_D range (outside: a warning). The
    /// geometry range is checked when <paramref name="checkGeometry"/> is true: a caller judges it once at the meter's
    /// declared geometry, and re-evaluations at perturbed diameters (numerical derivatives, Monte Carlo draws) skip
    /// it, so that a meter built at the edge of the range keeps its uncertainty.
    /// </summary>
    public static DifferentialPressureFlowResult MassFlow(DifferentialPressureFlowInput input, VenturiConvergent convergent, bool checkGeometry = true)
    {
        ArgumentNullException.ThrowIfNull(input);
        var form = VenturiForm.Of(convergent);
        var method = "ISO 5167-4 classical Venturi tubes (" + form.Name + ")";
        if (checkGeometry)
        {
            // A meter built exactly at an end of the range is inside it: 20 mm / 50 mm is 0.39999999999999997 in binary.
            Require.InRange(input.PipeDiameterM, form.MinPipeDiameterM * (1 - RangeSlack), form.MaxPipeDiameterM * (1 + RangeSlack), "pipe diameter", "m", method);
            Require.InRange(input.ThroatDiameterM / input.PipeDiameterM, form.MinBeta * (1 - RangeSlack), form.MaxBeta * (1 + RangeSlack), "diameter ratio beta", "", method);
        }
        var beta = OrificePlate.DiameterRatio(input.PipeDiameterM, input.ThroatDiameterM);
        Require.Positive(input.DifferentialPressurePa, "differential pressure", "Pa");
        Require.Positive(input.UpstreamDensityKgPerM3, "upstream density", "kg/m3");
        Require.Positive(input.ViscosityPaS, "viscosity", "Pa s");
        var epsilon = Expansibility(input.PipeDiameterM, input.ThroatDiameterM, input.UpstreamPressurePa,
            input.UpstreamPressurePa - input.DifferentialPressurePa, input.IsentropicExponent);
        var e = 1.0 / Math.Sqrt(1.0 - Math.Pow(beta, 4));
        var c = form.DischargeCoefficient;
        var massFlow = c * e * epsilon * Math.PI / 4.0 * input.ThroatDiameterM * input.ThroatDiameterM
            * Math.Sqrt(2.0 * input.DifferentialPressurePa * input.UpstreamDensityKgPerM3);
        var reynolds = PipeFlow.ReynoldsFromMassFlow(massFlow, input.PipeDiameterM, input.ViscosityPaS);
        ImmutableArray<string> warnings = reynolds >= form.MinReynolds && reynolds <= form.MaxReynolds
            ? []
            : [string.Create(CultureInfo.InvariantCulture,
                $"Re_D = {reynolds:F0} is outside {form.MinReynolds:0e0}..{form.MaxReynolds:0e0} where C = {c:R} is stated for {form.Name} Venturi tubes: its stated uncertainty does not apply.")];
        return new DifferentialPressureFlowResult(
            massFlow, c, epsilon, e, beta, reynolds, 0, form.ExpandedUncertaintyPercent,
            ExpansibilityExpandedUncertaintyPercent(beta, input.DifferentialPressurePa, input.UpstreamPressurePa), warnings);
    }
}
