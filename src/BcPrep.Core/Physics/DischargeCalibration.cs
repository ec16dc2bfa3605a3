using System.Collections.Immutable;
using System.Globalization;

namespace BcPrep.Physics;

/// <summary>
/// A flow meter's discharge coefficient from its own flow calibration: a constant, or a table of C against the pipe
/// Reynolds number Re_D (interpolated linearly in Re_D, the end value held outside the table, with a warning), and
/// the certificate's expanded uncertainty of C (relative, %) with its coverage factor.
/// </summary>
public sealed record DischargeCalibration
{
    public DischargeCalibration(IReadOnlyList<(double Reynolds, double C)> points, double expandedUncertaintyPercent, double coverageFactor, string certificate)
    {
        ArgumentNullException.ThrowIfNull(points);
        if (points.Count == 0 || points.Any(p => !(p.C > 0.0 && p.C < 2.0) || !(p.Reynolds > 0.0) || !double.IsFinite(p.Reynolds)))
        {
            throw new BcPrepDataException("A discharge-coefficient calibration needs at least one point with 0 < C < 2 and Re_D > 0.");
        }

        var ordered = points.OrderBy(p => p.Reynolds).ToImmutableArray();
        for (var i = 1; i < ordered.Length; i++)
        {
            if (ordered[i].Reynolds == ordered[i - 1].Reynolds)
            {
                throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture, $"The discharge-coefficient table gives Re_D = {ordered[i].Reynolds:R} twice."));
            }
        }

        Points = ordered;
        ExpandedUncertaintyPercent = expandedUncertaintyPercent;
        CoverageFactor = coverageFactor;
        Certificate = certificate;
    }

    /// <summary>(Re_D, C) in increasing Re_D; one point = a constant C.</summary>
    public ImmutableArray<(double Reynolds, double C)> Points { get; }

    public double ExpandedUncertaintyPercent { get; }

    public double CoverageFactor { get; }

    /// <summary>Where C comes from (the certificate reference, or "flow calibration").</summary>
    public string Certificate { get; }

    public bool IsConstant => Points.Length == 1;

    /// <summary>For the manifest: "C = 0.985" or "C(Re_D) from 4 points".</summary>
    public string Describe() => IsConstant
        ? string.Create(CultureInfo.InvariantCulture, $"C = {Points[0].C:R}")
        : string.Create(CultureInfo.InvariantCulture, $"C(Re_D) from {Points.Length} points, {Points[0].Reynolds:R}..{Points[^1].Reynolds:R}");

    /// <summary>C at <paramref name="reynolds"/>, and whether Re_D lies outside the calibrated span (end value held).</summary>
    public (double C, bool Outside) At(double reynolds)
    {
        if (IsConstant)
        {
            return (Points[0].C, false);
        }

        if (reynolds <= Points[0].Reynolds)
        {
            return (Points[0].C, reynolds < Points[0].Reynolds);
        }

        if (reynolds >= Points[^1].Reynolds)
        {
            return (Points[^1].C, reynolds > Points[^1].Reynolds);
        }

        var i = 1;
        while (Points[i].Reynolds < reynolds)
        {
            i++;
        }

        var (r0, c0) = Points[i - 1];
        var (r1, c1) = Points[i];
        return (c0 + ((c1 - c0) * (reynolds - r0) / (r1 - r0)), false);
    }
}

/// <summary>
/// Mass flow of a differential-pressure meter whose C comes from its own flow calibration:
/// q_m = C(Re_D) · ε / √(1 − β⁴) · (π/4) d² √(2 Δp ρ1) (ISO 5167-1 eq. 1), iterated on Re_D. ε keeps the
/// standard's expression of the device (orifice ISO 5167-2, Venturi isentropic ISO 5167-4) and its uncertainty;
/// C and its uncertainty are the certificate's. The standard's geometry limits do not apply to a calibrated meter.
/// </summary>
public static class CalibratedMeter
{
    private const double ConvergenceTolerance = 1e-12;
    private const int MaxIterations = 100;

    public static DifferentialPressureFlowResult MassFlow(DifferentialPressureFlowInput input, DischargeCalibration calibration, bool venturi)
    {
        ArgumentNullException.ThrowIfNull(input);
        ArgumentNullException.ThrowIfNull(calibration);
        var beta = Require.InRange(input.ThroatDiameterM / input.PipeDiameterM, 0.0, 0.95, "diameter ratio beta", "", "a calibrated flow meter");
        Require.Positive(input.DifferentialPressurePa, "differential pressure", "Pa");
        Require.Positive(input.UpstreamDensityKgPerM3, "upstream density", "kg/m3");
        Require.Positive(input.ViscosityPaS, "viscosity", "Pa s");
        var downstreamPa = input.UpstreamPressurePa - input.DifferentialPressurePa;
        var epsilon = venturi
            ? VenturiTube.Expansibility(input.PipeDiameterM, input.ThroatDiameterM, input.UpstreamPressurePa, downstreamPa, input.IsentropicExponent)
            : OrificePlate.Expansibility(input.PipeDiameterM, input.ThroatDiameterM, input.UpstreamPressurePa, downstreamPa, input.IsentropicExponent);
        var epsilonPercent = venturi
            ? VenturiTube.ExpansibilityExpandedUncertaintyPercent(beta, input.DifferentialPressurePa, input.UpstreamPressurePa)
            : OrificePlate.ExpansibilityExpandedUncertaintyPercent(input.DifferentialPressurePa, input.UpstreamPressurePa, input.IsentropicExponent);
        var e = 1.0 / Math.Sqrt(1.0 - Math.Pow(beta, 4));
        var flowPerC = e * epsilon * Math.PI / 4.0 * input.ThroatDiameterM * input.ThroatDiameterM
            * Math.Sqrt(2.0 * input.DifferentialPressurePa * input.UpstreamDensityKgPerM3);

        var (c, outside) = calibration.At(calibration.Points[0].Reynolds);
        var massFlow = c * flowPerC;
        var reynolds = PipeFlow.ReynoldsFromMassFlow(massFlow, input.PipeDiameterM, input.ViscosityPaS);
        var iterations = 0;
        while (!calibration.IsConstant)
        {
            iterations++;
            (c, outside) = calibration.At(reynolds);
            var next = c * flowPerC;
            var converged = Math.Abs(next - massFlow) <= ConvergenceTolerance * next;
            massFlow = next;
            reynolds = PipeFlow.ReynoldsFromMassFlow(massFlow, input.PipeDiameterM, input.ViscosityPaS);
            if (converged)
            {
                break;
            }

            if (iterations == MaxIterations)
            {
                throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                    $"Calibrated flow-meter iteration did not converge in {MaxIterations} steps (last C = {c:R}, Re_D = {reynolds:R})."));
            }
        }

        ImmutableArray<string> warnings = outside
            ? [string.Create(CultureInfo.InvariantCulture,
                $"Re_D = {reynolds:F0} lies outside the calibrated span {calibration.Points[0].Reynolds:R}..{calibration.Points[^1].Reynolds:R} of the discharge coefficient ({calibration.Certificate}): the end value C = {c:R} is held, and the certificate's uncertainty does not cover it.")]
            : [];
        return new DifferentialPressureFlowResult(massFlow, c, epsilon, e, beta, reynolds, iterations,
            calibration.ExpandedUncertaintyPercent, epsilonPercent, warnings);
    }
}
