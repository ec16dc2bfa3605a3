namespace BcPrep.Physics;

/// <summary>
/// ISO 5167-2:2003 orifice plate equations: Reader-Harris/Gallagher discharge coefficient (§5.3.2.1),
/// expansibility factor (2003 form) and the standard's uncertainty statements (§5.3.3, 95 % level).
/// Diameters in m, pressures in Pa.
/// </summary>
public static class OrificePlate
{
    /// <summary>Pipe diameter below which ISO 5167-2 adds the small-pipe term to C and to its uncertainty, m.</summary>
    public const double SmallPipeDiameterM = 0.07112;

    /// <summary>Smallest pressure ratio p2/p1 for which the expansibility equation applies (ISO limit, from memory).</summary>
    public const double MinPressureRatio = 0.75;

    /// <summary>
    /// Reader-Harris/Gallagher discharge coefficient
    /// C = 0.5961 + 0.0261β² − 0.216β⁸ + 0.000521(10⁶β/Re_D)^0.7 + (0.0188 + 0.0063A)β^3.5(10⁶/Re_D)^0.3
    ///   + (0.043 + 0.080e^{−10L1} − 0.123e^{−7L1})(1 − 0.11A)β⁴/(1 − β⁴) − 0.031(M2′ − 0.8M2′^1.1)β^1.3
    ///   [+ 0.011(0.75 − β)(2.8 − D/25.4 mm) when D &lt; 71.12 mm],
    /// A = (19000β/Re_D)^0.8, M2′ = 2L2′/(1 − β). Evaluates the equation for any 0 &lt; β &lt; 1 and Re_D &gt; 0;
    /// the standard's validity limits are checked by <see cref="OrificeMeter"/>, not here.
    /// </summary>
    public static double DischargeCoefficient(double pipeDiameterM, double boreDiameterM, double reynoldsD, OrificeTapping tapping)
    {
        var beta = DiameterRatio(pipeDiameterM, boreDiameterM);
        Require.Positive(reynoldsD, "pipe Reynolds number", "");
        var (l1, l2) = TappingDistances(pipeDiameterM, tapping);
        var a = Math.Pow(19000.0 * beta / reynoldsD, 0.8);
        var m2 = 2.0 * l2 / (1.0 - beta);
        var beta4 = Math.Pow(beta, 4);
        var c = 0.5961 + (0.0261 * beta * beta) - (0.216 * Math.Pow(beta, 8))
            + (0.000521 * Math.Pow(1.0e6 * beta / reynoldsD, 0.7))
            + ((0.0188 + (0.0063 * a)) * Math.Pow(beta, 3.5) * Math.Pow(1.0e6 / reynoldsD, 0.3))
            + ((0.043 + (0.080 * Math.Exp(-10.0 * l1)) - (0.123 * Math.Exp(-7.0 * l1))) * (1.0 - (0.11 * a)) * beta4 / (1.0 - beta4))
            - (0.031 * (m2 - (0.8 * Math.Pow(m2, 1.1))) * Math.Pow(beta, 1.3));
        if (pipeDiameterM < SmallPipeDiameterM)
        {
            c += 0.011 * (0.75 - beta) * (2.8 - (pipeDiameterM * 1000.0 / 25.4));
        }

        return c;
    }

    /// <summary>
    /// Expansibility factor ε = 1 − (0.351 + 0.256β⁴ + 0.93β⁸)[1 − (p2/p1)^{1/κ}] (ISO 5167-2:2003).
    /// Throws when p2/p1 &lt; 0.75 or p2 ≤ 0.
    /// </summary>
    public static double Expansibility(double pipeDiameterM, double boreDiameterM, double upstreamPressurePa, double downstreamPressurePa, double isentropicExponent)
    {
        var beta = DiameterRatio(pipeDiameterM, boreDiameterM);
        var ratio = PressureRatio(upstreamPressurePa, downstreamPressurePa, isentropicExponent);
        var beta4 = Math.Pow(beta, 4);
        return 1.0 - ((0.351 + (0.256 * beta4) + (0.93 * beta4 * beta4)) * (1.0 - Math.Pow(ratio, 1.0 / isentropicExponent)));
    }

    /// <summary>
    /// Expanded (95 %) relative uncertainty of C in percent, ISO 5167-2:2003 §5.3.3: (0.7 − β) for β &lt; 0.2,
    /// 0.5 for 0.2 ≤ β ≤ 0.6, (1.667β − 0.5) for β &gt; 0.6; plus 0.9(0.75 − β)(2.8 − D/25.4 mm) when
    /// D &lt; 71.12 mm; plus 0.5 when β &gt; 0.5 and Re_D &lt; 10 000 (both added arithmetically).
    /// The β &lt; 0.6 wording is from memory. Assumes β, D, Re_D and roughness known without error.
    /// </summary>
    public static double DischargeCoefficientExpandedUncertaintyPercent(double pipeDiameterM, double boreDiameterM, double reynoldsD)
    {
        var beta = DiameterRatio(pipeDiameterM, boreDiameterM);
        Require.Positive(reynoldsD, "pipe Reynolds number", "");
        var u = beta < 0.2 ? 0.7 - beta : beta <= 0.6 ? 0.5 : (1.667 * beta) - 0.5;
        if (pipeDiameterM < SmallPipeDiameterM)
        {
            u += 0.9 * (0.75 - beta) * (2.8 - (pipeDiameterM * 1000.0 / 25.4));
        }

        if (beta > 0.5 && reynoldsD < 10000.0)
        {
            u += 0.5;
        }

        return u;
    }

    /// <summary>Expanded (95 %) relative uncertainty of ε in percent, ISO 5167-2:2003: 3.5 Δp/(κ p1).</summary>
    public static double ExpansibilityExpandedUncertaintyPercent(double differentialPressurePa, double upstreamPressurePa, double isentropicExponent)
    {
        Require.NonNegative(differentialPressurePa, "differential pressure", "Pa");
        Require.Positive(upstreamPressurePa, "upstream pressure", "Pa");
        Require.Positive(isentropicExponent, "isentropic exponent", "");
        return 3.5 * differentialPressurePa / (isentropicExponent * upstreamPressurePa);
    }

    internal static double DiameterRatio(double pipeDiameterM, double boreDiameterM)
    {
        Require.Positive(pipeDiameterM, "pipe diameter", "m");
        Require.Positive(boreDiameterM, "bore diameter", "m");
        return Require.InRange(boreDiameterM / pipeDiameterM, 1e-6, 1.0 - 1e-6, "diameter ratio beta", "", "a differential-pressure meter");
    }

    internal static double PressureRatio(double upstreamPressurePa, double downstreamPressurePa, double isentropicExponent)
    {
        Require.Positive(upstreamPressurePa, "upstream pressure", "Pa");
        Require.Positive(isentropicExponent, "isentropic exponent", "");
        return Require.InRange(downstreamPressurePa / upstreamPressurePa, MinPressureRatio, 1.0, "pressure ratio p2/p1", "", "the ISO 5167 expansibility equations");
    }

    private static (double L1, double L2) TappingDistances(double pipeDiameterM, OrificeTapping tapping) => tapping switch
    {
        OrificeTapping.Corner => (0.0, 0.0),
        OrificeTapping.DAndDOver2 => (1.0, 0.47),
        OrificeTapping.Flange => (25.4 / (pipeDiameterM * 1000.0), 25.4 / (pipeDiameterM * 1000.0)),
        _ => throw new BcPrepDataException($"Unknown orifice tapping '{tapping}'."),
    };
}
