namespace BcPrep.Physics;

/// <summary>
/// How far the property and correlation models BcPrep uses may stand from the truth, each with its source, so that
/// the budget carries the model form and not only the measurement chain.
/// </summary>
public static class ModelForm
{
    /// <summary>
    /// Rectangular half-width (relative) of Sutherland's viscosity (S = 110.4 K) at <paramref name="temperatureK"/>.
    /// Against the reference correlation of Lemmon &amp; Jacobsen (2004) Sutherland sits −0.3 % at 250 K, −0.4 % at
    /// 300 K, −0.9 % at 400 K and −1.4 % at 500 K (reference sheet §11, [CC]); the ±0.7 % kept so far holds only
    /// below about 380 K. Above, the bound follows the deviation plus 0.1 %: 1.0 % at 400 K, 1.5 % at 500 K,
    /// extrapolated linearly beyond (our choice).
    /// </summary>
    public static double ViscosityHalfWidth(double temperatureK) => temperatureK switch
    {
        <= 380.0 => 0.007,
        <= 400.0 => 0.007 + ((temperatureK - 380.0) * (0.010 - 0.007) / 20.0),
        _ => 0.010 + ((temperatureK - 400.0) * (0.015 - 0.010) / 100.0),
    };

    /// <summary>
    /// The ideal-gas cp of dry air (γR/(γ − 1) = 1004.7 J/(kg K)) is biased low against 1-atm tables: Incropera
    /// Table A.4 gives 1006, 1007, 1009 and 1014 J/(kg K) at 250, 300, 350 and 400 K (reference sheet §7, from
    /// memory; Çengel Table A-15 [CS] agrees within 1 J/(kg K)). The factor corrects that one-sided bias at
    /// <paramref name="temperatureK"/> (linear between the table's points, held below 250 K and extrapolated above
    /// 400 K), and <see cref="CpHalfWidth"/> covers the spread between the tables.
    /// </summary>
    public static double CpCorrection(double temperatureK)
    {
        double[] t = [250.0, 300.0, 350.0, 400.0];
        double[] cp = [1006.0, 1007.0, 1009.0, 1014.0];
        const double idealGas = 1004.7;
        var tk = Math.Max(temperatureK, t[0]);
        var i = tk <= t[1] ? 0 : tk <= t[2] ? 1 : 2;
        var value = cp[i] + ((cp[i + 1] - cp[i]) * (tk - t[i]) / (t[i + 1] - t[i]));
        return value / idealGas;
    }

    /// <summary>Rectangular half-width (relative) of the corrected cp: 0.15 %, the two tables' spread plus rounding (our choice).</summary>
    public const double CpHalfWidth = 0.0015;

    /// <summary>
    /// Rectangular half-width (relative) of the inlet turbulence intensity from the core-flow estimate
    /// I = 0.16 Re^(−1/8): area-averaged pipe-flow fits (Russo &amp; Basse 2016: 0.227 Re^(−0.100)) and centreline
    /// values differ from it by about a factor of 2 at Re_D ≈ 3·10⁴ (reference sheet §11, from memory). ±50 % of I
    /// covers that spread; k ∝ I², so u(k)/k is about 58 %. Not applied when the rig file gives the intensity.
    /// </summary>
    public const double TurbulenceIntensityHalfWidth = 0.5;

    /// <summary>
    /// Rectangular half-width (relative) of the power-law exponent n = 1/√f (f from Colebrook) at Reynolds number
    /// <paramref name="reynolds"/>. Against the exponents fitted to Nikuradse's smooth-pipe profiles (Schlichting,
    /// Boundary-Layer Theory: n = 6 at Re 4·10³, 6.6 at 2.3·10⁴, 7 at 1.1·10⁵, 8.8 at 1.1·10⁶, 10 at 2·10⁶ and
    /// 3.2·10⁶; reference sheet §8.1 confirms 6, 7 and 10, the others from memory) 1/√f is 17 % low at 4·10³, 4 % low
    /// at 2.3·10⁴, 8 % and 6 % high at 1.1·10⁵ and 1.1·10⁶, and within 2 % at 2–3.2·10⁶: the error changes sign, so
    /// the estimate stays 1 and the bound follows the largest deviation plus about 1 %: 18 % up to Re 4·10³, falling
    /// linearly in log Re to 9 % at 2.3·10⁴, 9 % above (our choice).
    /// </summary>
    public static double PowerLawExponentHalfWidth(double reynolds)
    {
        const double lowRe = 4.0e3, highRe = 2.3e4, low = 0.18, high = 0.09;
        if (!(reynolds > lowRe))
        {
            return low;
        }
        if (reynolds >= highRe)
        {
            return high;
        }
        return low + ((high - low) * Math.Log(reynolds / lowRe) / Math.Log(highRe / lowRe));
    }

    /// <summary>
    /// Accuracy (relative, 95 %) of the Colebrook / Moody friction factor used in the pressure-drop check: ±15 %,
    /// the accuracy usually quoted for the Moody chart (White, Fluid Mechanics; from memory, reference sheet §11).
    /// </summary>
    public const double FrictionCorrelationAccuracy = 0.15;
}
