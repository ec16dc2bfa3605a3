using System.Numerics;
using System.Runtime.CompilerServices;
using static System.FormattableString;

namespace BcPrep.Calibration;

/// <summary>
/// Platinum RTD resistance–temperature relation of IEC 60751 (Callendar–Van Dusen, α = 0.00385):
/// R(t) = R0(1 + A t + B t²) for 0 … 850 °C and R(t) = R0[1 + A t + B t² + C (t − 100) t³] for −200 … 0 °C,
/// A = 3.9083E-3 °C⁻¹, B = −5.775E-7 °C⁻², C = −4.183E-12 °C⁻⁴, or a calibrated sensor's own A, B, C carried by its
/// <see cref="RtdNominal"/>. Temperatures in K, resistance in Ω.
/// NaN inputs return NaN; values outside −200 … 850 °C (or the matching resistance span) throw
/// <see cref="BcPrepDataException"/>.
/// </summary>
public static class CallendarVanDusen
{
    public const double A = 3.9083E-3;
    public const double B = -5.775E-7;
    public const double C = -4.183E-12;

    private const double MinC = -200.0;
    private const double MaxC = 850.0;
    private const double BoundarySlackC = 1e-9;
    private const double NewtonToleranceC = 1e-10;

    /// <summary>Valid temperature range: −200 … 850 °C, in K.</summary>
    public static CalibrationRange RangeK { get; } =
        new(MinC + Its90Thermocouple.KelvinOffset, MaxC + Its90Thermocouple.KelvinOffset);

    /// <summary>Valid resistance range (Ω) of a sensor with nominal <paramref name="nominal"/>: [R(−200 °C), R(850 °C)].</summary>
    public static CalibrationRange ResistanceRangeOhm(RtdNominal nominal)
    {
        double r0 = CheckedR0(nominal);
        return new CalibrationRange(r0 * Ratio(nominal, MinC), r0 * Ratio(nominal, MaxC));
    }

    /// <summary>Resistance R (Ω) at <paramref name="temperatureK"/> by the CVD equation.</summary>
    public static double ResistanceOhm(RtdNominal nominal, double temperatureK) =>
        CheckedR0(nominal) * Ratio(nominal, CheckedCelsius(temperatureK));

    /// <summary>Slope dR/dT (Ω/K) at <paramref name="temperatureK"/>: the analytic derivative of the CVD equation.</summary>
    public static double SlopeOhmPerK(RtdNominal nominal, double temperatureK) =>
        CheckedR0(nominal) * RatioSlope(nominal, CheckedCelsius(temperatureK));

    /// <summary>
    /// Temperature (K) for a measured resistance (Ω): closed-form root of the quadratic for R ≥ R0, safeguarded
    /// Newton on the quartic (seeded by the quadratic root, to 1e-10 °C) for R &lt; R0.
    /// </summary>
    public static double TemperatureK(RtdNominal nominal, double resistanceOhm)
    {
        double r0 = CheckedR0(nominal);
        if (double.IsNaN(resistanceOhm))
        {
            return double.NaN;
        }

        double ratio = resistanceOhm / r0;
        if (!(ratio >= Ratio(nominal, MinC) && ratio <= Ratio(nominal, MaxC)))
        {
            throw ResistanceRangeOhm(nominal).OutOfRange(resistanceOhm, Invariant($"RTD (R0 = {r0:R} ohm) resistance (ohm)"));
        }

        double t = QuadraticRootC(nominal, ratio);
        if (ratio < 1.0)
        {
            t = MonotoneSolver.Solve(new LowRangeRatio(nominal), ratio, MinC, 0.0, t, NewtonToleranceC);
        }

        return t + Its90Thermocouple.KelvinOffset;
    }

    /// <summary>
    /// <see cref="TemperatureK"/> for a block of resistances, with the same operations in the same order, so each result
    /// equals the single-value one bit for bit. Runs of samples at or above 0 °C (the closed-form root) go a vector at a
    /// time; a vector with a sample below 0 °C (Newton on the quartic), NaN or out of range takes the single-value path
    /// sample by sample. <paramref name="temperaturesK"/> may be <paramref name="resistanceOhm"/> itself.
    /// </summary>
    /// <exception cref="BcPrepDataException">A resistance outside <see cref="ResistanceRangeOhm"/>, as for the single value.</exception>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static void TemperaturesK(RtdNominal nominal, ReadOnlySpan<double> resistanceOhm, Span<double> temperaturesK)
    {
        double r0 = CheckedR0(nominal);
        var width = Vector<double>.Count;
        var i = 0;
        if (Vector.IsHardwareAccelerated)
        {
            var r0v = new Vector<double>(r0);
            var maxRatio = new Vector<double>(Ratio(nominal, MaxC));
            var a = new Vector<double>(nominal.A);
            var aa = new Vector<double>(nominal.A * nominal.A);
            var fourB = new Vector<double>(4.0 * nominal.B);
            for (; i <= resistanceOhm.Length - width; i += width)
            {
                var ratio = new Vector<double>(resistanceOhm.Slice(i, width)) / r0v;
                // NaN fails both comparisons, so NaN lanes take the single-value path too.
                if (!Vector.GreaterThanOrEqualAll(ratio, Vector<double>.One) || !Vector.LessThanOrEqualAll(ratio, maxRatio))
                {
                    for (var j = i; j < i + width; j++)
                    {
                        temperaturesK[j] = TemperatureK(nominal, resistanceOhm[j]);
                    }
                    continue;
                }
                // QuadraticRootC: 2x / (A + √(A·A + 4B·x)) with x = ratio − 1, then + 273.15.
                var x = ratio - Vector<double>.One;
                var t = (new Vector<double>(2.0) * x) / (a + Vector.SquareRoot(aa + (fourB * x)));
                (t + new Vector<double>(Its90Thermocouple.KelvinOffset)).CopyTo(temperaturesK.Slice(i, width));
            }
        }
        for (; i < resistanceOhm.Length; i++)
        {
            temperaturesK[i] = TemperatureK(nominal, resistanceOhm[i]);
        }
    }

    private static double QuadraticRootC(RtdNominal k, double ratio)
    {
        // Rationalised root of B t² + A t − (ratio − 1) = 0: no cancellation near ratio = 1.
        double x = ratio - 1.0;
        return 2.0 * x / (k.A + Math.Sqrt((k.A * k.A) + (4.0 * k.B * x)));
    }

    private static double Ratio(RtdNominal k, double t) => t >= 0.0
        ? 1.0 + (t * (k.A + (t * k.B)))
        : 1.0 + (t * (k.A + (t * (k.B + (t * (t - 100.0) * k.C)))));

    private static double RatioSlope(RtdNominal k, double t) => t >= 0.0
        ? k.A + (2.0 * k.B * t)
        : k.A + (t * ((2.0 * k.B) + (t * ((4.0 * k.C * t) - (300.0 * k.C)))));

    private static double CheckedCelsius(double temperatureK)
    {
        double t = temperatureK - Its90Thermocouple.KelvinOffset;
        if (!(t >= MinC - BoundarySlackC && t <= MaxC + BoundarySlackC) && !double.IsNaN(t))
        {
            throw RangeK.OutOfRange(temperatureK, "RTD temperature (K)");
        }

        return Math.Clamp(t, MinC, MaxC);
    }

    private static double CheckedR0(RtdNominal nominal) => nominal.R0Ohm > 0.0
        ? nominal.R0Ohm
        : throw new BcPrepDataException("RTD nominal resistance R0 is not set (must be positive).");

    private readonly struct LowRangeRatio(RtdNominal k) : IDifferentiableFunction
    {
        public double Value(double x) => Ratio(k, x);

        public double Slope(double x) => RatioSlope(k, x);
    }
}
