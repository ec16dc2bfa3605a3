using System.Collections.Immutable;

namespace BcPrep.Physics;

/// <summary>Inputs of an ISO 5167 differential-pressure flow computation, SI units.</summary>
/// <param name="PipeDiameterM">Upstream pipe internal diameter D at operating conditions, m.</param>
/// <param name="ThroatDiameterM">Orifice bore / Venturi throat diameter d at operating conditions, m.</param>
/// <param name="DifferentialPressurePa">Measured Δp = p1 − p2, Pa (&gt; 0).</param>
/// <param name="UpstreamPressurePa">Absolute upstream tapping pressure p1, Pa.</param>
/// <param name="UpstreamDensityKgPerM3">Fluid density at the upstream tapping ρ1, kg/m³.</param>
/// <param name="ViscosityPaS">Dynamic viscosity μ, Pa·s.</param>
/// <param name="IsentropicExponent">Isentropic exponent κ (1.4 for air near ambient).</param>
public sealed record DifferentialPressureFlowInput(
    double PipeDiameterM,
    double ThroatDiameterM,
    double DifferentialPressurePa,
    double UpstreamPressurePa,
    double UpstreamDensityKgPerM3,
    double ViscosityPaS,
    double IsentropicExponent);

/// <summary>Result of an ISO 5167 mass-flow computation.</summary>
/// <param name="MassFlowKgPerS">Mass flow rate q_m, kg/s.</param>
/// <param name="DischargeCoefficient">C at the converged Reynolds number.</param>
/// <param name="Expansibility">Expansibility factor ε.</param>
/// <param name="VelocityOfApproachFactor">E = 1/√(1 − β⁴).</param>
/// <param name="DiameterRatio">β = d/D.</param>
/// <param name="PipeReynolds">Re_D = 4 q_m/(π D μ).</param>
/// <param name="Iterations">Number of fixed-point iterations used (0 when C does not depend on Re).</param>
/// <param name="DischargeCoefficientExpandedUncertaintyPercent">Standard's 95 % relative uncertainty of C, %.</param>
/// <param name="ExpansibilityExpandedUncertaintyPercent">Standard's 95 % relative uncertainty of ε, %.</param>
/// <param name="Warnings">Conditions outside the standard's Reynolds-number range: the value is computed, but its stated uncertainty does not apply.</param>
public sealed record DifferentialPressureFlowResult(
    double MassFlowKgPerS,
    double DischargeCoefficient,
    double Expansibility,
    double VelocityOfApproachFactor,
    double DiameterRatio,
    double PipeReynolds,
    int Iterations,
    double DischargeCoefficientExpandedUncertaintyPercent,
    double ExpansibilityExpandedUncertaintyPercent,
    ImmutableArray<string> Warnings);
