using System.Numerics;
using System.Runtime.CompilerServices;
using static System.FormattableString;

namespace BcPrep.Calibration;

/// <summary>
/// ITS-90 thermocouple reference functions of NIST Monograph 175 for types K, T, J, E, N (reference junction at
/// 0 °C). Public API in SI: temperature in K, emf in V. Coefficients and ranges: <see cref="Its90Coefficients"/>.
/// NaN inputs return NaN; out-of-range inputs throw <see cref="BcPrepDataException"/> (never extrapolated).
/// </summary>
public static class Its90Thermocouple
{
    /// <summary>T(K) = t90(°C) + 273.15.</summary>
    public const double KelvinOffset = 273.15;

    private const double MillivoltsPerVolt = 1000.0;

    // Slack for the K→°C conversion: 73.15 − 273.15 is not exactly −200 in binary floating point.
    private const double BoundarySlackC = 1e-9;

    private const double NewtonToleranceC = 1e-9;

    private static readonly InverseLimits[] Limits = BuildInverseLimits();

    /// <summary>
    /// Valid temperature range (K) of the direct function E(T): K −270…1372 °C, T −270…400 °C, J −210…1200 °C,
    /// E −270…1000 °C, N −270…1300 °C.
    /// </summary>
    public static CalibrationRange DirectRangeK(ThermocoupleType type)
    {
        var direct = Its90Coefficients.For(type).Direct;
        return new CalibrationRange(direct[0].MinC + KelvinOffset, direct[^1].MaxC + KelvinOffset);
    }

    /// <summary>
    /// Valid emf range (V) of the inverse functions: the emf span of the inverse temperature range (K, T, E, N from
    /// −200 °C; J from −210 °C), taking the wider of the published mV limit and the direct function at the end
    /// temperature (they differ by less than the published 1 µV rounding).
    /// </summary>
    public static CalibrationRange InverseRangeV(ThermocoupleType type)
    {
        var limits = Limits[(int)type];
        return new CalibrationRange(limits.MinV, limits.MaxV);
    }

    /// <summary>
    /// Thermoelectric emf E (V) of a thermocouple at <paramref name="temperatureK"/> with its reference junction at
    /// 0 °C: E = Σ c_i t^i (t in °C, Horner), plus a0·exp(a1(t − a2)²) for type K at t ≥ 0 °C.
    /// Throws <see cref="BcPrepDataException"/> outside <see cref="DirectRangeK"/>.
    /// </summary>
    public static double EmfV(ThermocoupleType type, double temperatureK)
    {
        var table = Its90Coefficients.For(type);
        double t = CheckedCelsius(type, table, temperatureK);
        return DirectMv(table, t) / MillivoltsPerVolt;
    }

    /// <summary>
    /// Seebeck coefficient dE/dT (V/K) at <paramref name="temperatureK"/>: the analytic derivative of the direct
    /// function. Throws <see cref="BcPrepDataException"/> outside <see cref="DirectRangeK"/>.
    /// </summary>
    public static double SeebeckVPerK(ThermocoupleType type, double temperatureK)
    {
        var table = Its90Coefficients.For(type);
        double t = CheckedCelsius(type, table, temperatureK);
        return DirectSlopeMvPerC(table, t) / MillivoltsPerVolt;
    }

    /// <summary>
    /// Temperature (K) of the measuring junction for emf <paramref name="emfV"/> (reference junction at 0 °C), by the
    /// NIST inverse polynomial (default) or the exact inverse of the direct function (<paramref name="method"/>).
    /// Throws <see cref="BcPrepDataException"/> naming the value and range outside <see cref="InverseRangeV"/>.
    /// </summary>
    public static double TemperatureK(
        ThermocoupleType type, double emfV, ThermocoupleInverseMethod method = ThermocoupleInverseMethod.NistPolynomial)
    {
        if (double.IsNaN(emfV))
        {
            return double.NaN;
        }

        var table = Its90Coefficients.For(type);
        var limits = Limits[(int)type];
        if (!(emfV >= limits.MinV && emfV <= limits.MaxV))
        {
            throw InverseRangeV(type).OutOfRange(emfV, Invariant($"Type {type} thermocouple emf (V)"));
        }

        double e = emfV * MillivoltsPerVolt;

        double t = InversePolynomialC(table, e);
        if (method == ThermocoupleInverseMethod.ExactNewton)
        {
            t = ExactInverseC(table, e, t);
        }

        return t + KelvinOffset;
    }

    /// <summary>
    /// <see cref="TemperatureK"/> (NIST inverse polynomial) for a block of emfs, with the same operations in the same
    /// order, so each result equals the single-value one bit for bit. Runs of samples on one polynomial piece are
    /// evaluated a vector at a time, which is what makes a long day's thermocouples cheap to convert.
    /// </summary>
    /// <exception cref="BcPrepDataException">An emf outside <see cref="InverseRangeV"/>, as for the single value.</exception>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static void TemperaturesK(ThermocoupleType type, ReadOnlySpan<double> emfV, Span<double> temperaturesK)
    {
        var table = Its90Coefficients.For(type);
        var limits = Limits[(int)type];
        var width = Vector<double>.Count;
        var i = 0;
        if (Vector.IsHardwareAccelerated)
        {
            // Two vectors on one piece at a time: their Horner chains are independent, so one runs in the other's
            // latency. Each lane still sees the single-value operations in their order.
            var scale = new Vector<double>(MillivoltsPerVolt);
            var kelvin = new Vector<double>(KelvinOffset);
            for (; i <= emfV.Length - (2 * width); i += 2 * width)
            {
                var emf0 = new Vector<double>(emfV.Slice(i, width));
                var emf1 = new Vector<double>(emfV.Slice(i + width, width));
                var piece0 = SharedInversePiece(table, emf0, limits);
                var piece1 = SharedInversePiece(table, emf1, limits);
                if (piece0 is null || !ReferenceEquals(piece0, piece1))
                {
                    OneVector(type, piece0, emfV, temperaturesK, i);
                    OneVector(type, piece1, emfV, temperaturesK, i + width);
                    continue;
                }
                var e0 = emf0 * scale;
                var e1 = emf1 * scale;
                var c = piece0.Coefficients;
                var sum0 = Vector<double>.Zero;
                var sum1 = Vector<double>.Zero;
                for (var k = c.Length - 1; k >= 0; k--)
                {
                    var ck = new Vector<double>(c[k]);
                    sum0 = (sum0 * e0) + ck;
                    sum1 = (sum1 * e1) + ck;
                }
                (sum0 + kelvin).CopyTo(temperaturesK.Slice(i, width));
                (sum1 + kelvin).CopyTo(temperaturesK.Slice(i + width, width));
            }
            for (; i <= emfV.Length - width; i += width)
            {
                OneVector(type, SharedInversePiece(table, new Vector<double>(emfV.Slice(i, width)), limits), emfV, temperaturesK, i);
            }
        }
        for (; i < emfV.Length; i++)
        {
            temperaturesK[i] = TemperatureK(type, emfV[i]);
        }
    }

    /// <summary>One vector of <see cref="TemperaturesK"/>: on <paramref name="piece"/>, or sample by sample when it is null.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void OneVector(ThermocoupleType type, InversePiece? piece, ReadOnlySpan<double> emfV, Span<double> temperaturesK, int i)
    {
        var width = Vector<double>.Count;
        if (piece is null)
        {
            for (var j = i; j < i + width; j++)
            {
                temperaturesK[j] = TemperatureK(type, emfV[j]);
            }
            return;
        }
        var e = new Vector<double>(emfV.Slice(i, width)) * new Vector<double>(MillivoltsPerVolt);
        var c = piece.Coefficients;
        var sum = Vector<double>.Zero;
        for (var k = c.Length - 1; k >= 0; k--)
        {
            sum = (sum * e) + new Vector<double>(c[k]);
        }
        (sum + new Vector<double>(KelvinOffset)).CopyTo(temperaturesK.Slice(i, width));
    }

    /// <summary>The inverse piece every lane falls on, or null when lanes differ, are NaN or are out of range.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static InversePiece? SharedInversePiece(Its90Table table, Vector<double> emfV, InverseLimits limits)
    {
        if (!Vector.GreaterThanOrEqualAll(emfV, new Vector<double>(limits.MinV)) || !Vector.LessThanOrEqualAll(emfV, new Vector<double>(limits.MaxV)))
        {
            return null; // NaN fails both comparisons, so NaN and out-of-range lanes take the single-value path
        }
        var e = emfV * new Vector<double>(MillivoltsPerVolt);
        var pieces = table.Inverse;
        for (int p = 0; p < pieces.Length - 1; p++)
        {
            var bound = new Vector<double>(pieces[p].MaxMv);
            if (Vector.LessThanOrEqualAll(e, bound))
            {
                return pieces[p];
            }
            if (Vector.LessThanOrEqualAny(e, bound))
            {
                return null;
            }
        }

        return pieces[^1];
    }

    internal static double DirectMv(Its90Table table, double t)
    {
        var pieces = table.Direct;
        bool upper = t > pieces[0].MaxC;
        double e = Polynomial.Evaluate((upper ? pieces[1] : pieces[0]).Coefficients, t);

        // The type K exponential term belongs to the 0 … 1372 °C piece only.
        if (upper && table.HasExponentialTerm)
        {
            double d = t - Its90Coefficients.KExpA2;
            e += Its90Coefficients.KExpA0 * Math.Exp(Its90Coefficients.KExpA1 * d * d);
        }

        return e;
    }

    internal static double DirectSlopeMvPerC(Its90Table table, double t)
    {
        var pieces = table.Direct;
        bool upper = t > pieces[0].MaxC;
        double slope = Polynomial.Derivative((upper ? pieces[1] : pieces[0]).Coefficients, t);
        if (upper && table.HasExponentialTerm)
        {
            double d = t - Its90Coefficients.KExpA2;
            slope += Its90Coefficients.KExpA0 * Math.Exp(Its90Coefficients.KExpA1 * d * d) * 2.0 * Its90Coefficients.KExpA1 * d;
        }

        return slope;
    }

    /// <summary>Inverse polynomial piece for E (mV): interior boundaries at the published mV limits, lower piece wins ties.</summary>
    internal static InversePiece InversePieceFor(Its90Table table, double e)
    {
        var pieces = table.Inverse;
        for (int i = 0; i < pieces.Length - 1; i++)
        {
            if (e <= pieces[i].MaxMv)
            {
                return pieces[i];
            }
        }

        return pieces[^1];
    }

    private static double InversePolynomialC(Its90Table table, double e) =>
        Polynomial.Evaluate(InversePieceFor(table, e).Coefficients, e);

    private static double ExactInverseC(Its90Table table, double e, double seedC)
    {
        // One degree of slack either side so that emf inside the published (rounded) limits still brackets a root.
        double lo = table.Inverse[0].MinC - 1.0;
        double hi = table.Inverse[^1].MaxC + 1.0;
        return MonotoneSolver.Solve(new DirectFunction(table), e, lo, hi, seedC, NewtonToleranceC);
    }

    private static double CheckedCelsius(ThermocoupleType type, Its90Table table, double temperatureK)
    {
        double t = temperatureK - KelvinOffset;
        double min = table.Direct[0].MinC;
        double max = table.Direct[^1].MaxC;
        if (!(t >= min - BoundarySlackC && t <= max + BoundarySlackC) && !double.IsNaN(t))
        {
            throw DirectRangeK(type).OutOfRange(temperatureK, Invariant($"Type {type} thermocouple temperature (K)"));
        }

        return Math.Clamp(t, min, max);
    }

    private static InverseLimits[] BuildInverseLimits()
    {
        var types = Enum.GetValues<ThermocoupleType>();
        var limits = new InverseLimits[types.Length];
        foreach (var type in types)
        {
            var table = Its90Coefficients.For(type);
            var first = table.Inverse[0];
            var last = table.Inverse[^1];
            limits[(int)type] = new InverseLimits(
                Math.Min(first.MinMv, DirectMv(table, first.MinC)) / MillivoltsPerVolt,
                Math.Max(last.MaxMv, DirectMv(table, last.MaxC)) / MillivoltsPerVolt);
        }

        return limits;
    }

    private readonly record struct InverseLimits(double MinV, double MaxV);

    private readonly struct DirectFunction(Its90Table table) : IDifferentiableFunction
    {
        public double Value(double x) => DirectMv(table, x);

        public double Slope(double x) => DirectSlopeMvPerC(table, x);
    }
}
