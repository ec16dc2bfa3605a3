using BcPrep.Calibration;

namespace BcPrep.Tests.Calibration;

public class Its90ThermocoupleTests
{
    private const double Kelvin = 273.15;

    // Half of the 1 µV table resolution, in mV.
    private const double TableHalfDigitMv = 0.0005;

    /// <summary>
    /// NIST Monograph 175 table values (reference junction 0 °C), E in mV, as listed in domain-reference §1.3.
    /// Confirmed against NIST tables / ITS-90 test vectors: K −270/−200/100/200/300/400/800/1200,
    /// T −270/−200/−100/−50/400, J −200/400/800/1200, E −200/400/800, N −200/400/800/1200.
    /// The rest are the direct function rounded to 1 µV (how the NIST tables are generated).
    /// </summary>
    public static TheoryData<ThermocoupleType, double, double> NistTable => new()
    {
        { ThermocoupleType.K, -270, -6.458 }, { ThermocoupleType.K, -200, -5.891 }, { ThermocoupleType.K, -100, -3.554 },
        { ThermocoupleType.K, -50, -1.889 }, { ThermocoupleType.K, 0, 0.000 }, { ThermocoupleType.K, 25, 1.000 },
        { ThermocoupleType.K, 100, 4.096 }, { ThermocoupleType.K, 200, 8.138 }, { ThermocoupleType.K, 300, 12.209 },
        { ThermocoupleType.K, 400, 16.397 }, { ThermocoupleType.K, 500, 20.644 }, { ThermocoupleType.K, 600, 24.905 },
        { ThermocoupleType.K, 800, 33.275 }, { ThermocoupleType.K, 1000, 41.276 }, { ThermocoupleType.K, 1200, 48.838 },
        { ThermocoupleType.K, 1372, 54.886 },
        { ThermocoupleType.T, -270, -6.258 }, { ThermocoupleType.T, -200, -5.603 }, { ThermocoupleType.T, -100, -3.379 },
        { ThermocoupleType.T, -50, -1.819 }, { ThermocoupleType.T, 0, 0.000 }, { ThermocoupleType.T, 25, 0.992 },
        { ThermocoupleType.T, 100, 4.279 }, { ThermocoupleType.T, 200, 9.288 }, { ThermocoupleType.T, 300, 14.862 },
        { ThermocoupleType.T, 400, 20.872 },
        { ThermocoupleType.J, -200, -7.890 }, { ThermocoupleType.J, -100, -4.633 }, { ThermocoupleType.J, 0, 0.000 },
        { ThermocoupleType.J, 25, 1.277 }, { ThermocoupleType.J, 100, 5.269 }, { ThermocoupleType.J, 200, 10.779 },
        { ThermocoupleType.J, 300, 16.327 }, { ThermocoupleType.J, 400, 21.848 }, { ThermocoupleType.J, 500, 27.393 },
        { ThermocoupleType.J, 600, 33.102 }, { ThermocoupleType.J, 760, 42.919 }, { ThermocoupleType.J, 800, 45.494 },
        { ThermocoupleType.J, 1000, 57.953 }, { ThermocoupleType.J, 1200, 69.553 },
        { ThermocoupleType.E, -270, -9.835 }, { ThermocoupleType.E, -200, -8.825 }, { ThermocoupleType.E, -100, -5.237 },
        { ThermocoupleType.E, 0, 0.000 }, { ThermocoupleType.E, 25, 1.495 }, { ThermocoupleType.E, 100, 6.319 },
        { ThermocoupleType.E, 200, 13.421 }, { ThermocoupleType.E, 300, 21.036 }, { ThermocoupleType.E, 400, 28.946 },
        { ThermocoupleType.E, 500, 37.005 }, { ThermocoupleType.E, 600, 45.093 }, { ThermocoupleType.E, 800, 61.017 },
        { ThermocoupleType.E, 1000, 76.373 },
        { ThermocoupleType.N, -270, -4.345 }, { ThermocoupleType.N, -200, -3.990 }, { ThermocoupleType.N, -100, -2.407 },
        { ThermocoupleType.N, 0, 0.000 }, { ThermocoupleType.N, 25, 0.659 }, { ThermocoupleType.N, 100, 2.774 },
        { ThermocoupleType.N, 200, 5.913 }, { ThermocoupleType.N, 300, 9.341 }, { ThermocoupleType.N, 400, 12.974 },
        { ThermocoupleType.N, 500, 16.748 }, { ThermocoupleType.N, 600, 20.613 }, { ThermocoupleType.N, 800, 28.455 },
        { ThermocoupleType.N, 1000, 36.256 }, { ThermocoupleType.N, 1200, 43.846 }, { ThermocoupleType.N, 1300, 47.513 },
    };

    public static TheoryData<ThermocoupleType> AllTypes => new(Enum.GetValues<ThermocoupleType>());

    [Theory]
    [MemberData(nameof(NistTable))]
    public void Direct_function_reproduces_NIST_Monograph_175_table_to_half_a_microvolt(ThermocoupleType type, double tC, double tableMv)
    {
        double emfMv = Its90Thermocouple.EmfV(type, tC + Kelvin) * 1000.0;
        Assert.InRange(emfMv, tableMv - TableHalfDigitMv, tableMv + TableHalfDigitMv);
    }

    [Theory]
    [MemberData(nameof(NistTable))]
    public void Inverse_polynomial_reproduces_NIST_table_within_stated_error_band(ThermocoupleType type, double tC, double tableMv)
    {
        if (tC < InverseMinC(type))
        {
            // NIST publishes no inverse below −200 °C (−210 °C for J): must refuse, not extrapolate.
            Assert.Throws<BcPrepDataException>(() => Its90Thermocouple.TemperatureK(type, tableMv / 1000.0));
            return;
        }

        // Tolerance: NIST inverse error band + 0.005 °C + the table's 0.0005 mV rounding seen through dE/dt.
        var (low, high) = ErrorBandC(type, tC);
        double roundingC = TableHalfDigitMv / (Its90Thermocouple.SeebeckVPerK(type, tC + Kelvin) * 1000.0);
        double tInverse = Its90Thermocouple.TemperatureK(type, tableMv / 1000.0) - Kelvin;
        Assert.InRange(tInverse - tC, low - 0.005 - roundingC, high + 0.005 + roundingC);
    }

    [Theory]
    [MemberData(nameof(AllTypes))]
    public void Round_trip_at_every_integer_degree_stays_within_NIST_inverse_error_band(ThermocoupleType type)
    {
        // NIST Monograph 175 inverse error ranges (allcoeff.tab), +0.005 °C margin (domain-reference §1.2).
        for (int tC = (int)InverseMinC(type); tC <= (int)InverseMaxC(type); tC++)
        {
            double emfV = Its90Thermocouple.EmfV(type, tC + Kelvin);
            double error = Its90Thermocouple.TemperatureK(type, emfV) - Kelvin - tC;
            var (low, high) = ErrorBandC(type, tC);
            Assert.True(error >= low - 0.005 && error <= high + 0.005, $"type {type} at {tC} °C: error {error} °C outside [{low}, {high}]");
        }
    }

    [Theory]
    [MemberData(nameof(AllTypes))]
    public void Exact_inverse_round_trips_to_a_nanokelvin_level(ThermocoupleType type)
    {
        // Definition of the exact inverse: E(T(E)) = E; checked every 0.5 °C over the inverse range.
        for (double tC = InverseMinC(type); tC <= InverseMaxC(type); tC += 0.5)
        {
            double emfV = Its90Thermocouple.EmfV(type, tC + Kelvin);
            double back = Its90Thermocouple.TemperatureK(type, emfV, ThermocoupleInverseMethod.ExactNewton) - Kelvin;
            Assert.True(Math.Abs(back - tC) < 1e-6, $"type {type} at {tC} °C: got {back}");
        }
    }

    [Fact]
    public void J_inverse_switches_pieces_at_42_919_mV_not_42_914()
    {
        // NIST Monograph 175: the 0 … 760 °C inverse piece is valid up to 42.919 mV (some code copies switch at
        // 42.914 mV). At 42.916 mV that piece gives 759.99594 °C; the 760 … 1200 °C piece would give 759.92852 °C
        // (both evaluated from the NIST coefficients).
        double t = Its90Thermocouple.TemperatureK(ThermocoupleType.J, 42.916e-3) - Kelvin;
        Assert.Equal(759.99594, t, 4);
        var piece = Its90Thermocouple.InversePieceFor(Its90Coefficients.For(ThermocoupleType.J), 42.919);
        Assert.Equal(760.0, piece.MaxC);
    }

    [Theory]
    [InlineData(25.0, 0.04052)]
    [InlineData(100.0, 0.04137)]
    [InlineData(300.0, 0.04145)]
    public void Type_K_Seebeck_coefficient_matches_reference_values(double tC, double expectedMvPerC)
    {
        // domain-reference §1.4 [CC from NIST coefficients], printed to 0.00001 mV/°C.
        double slope = Its90Thermocouple.SeebeckVPerK(ThermocoupleType.K, tC + Kelvin) * 1000.0;
        Assert.InRange(slope, expectedMvPerC - 0.000005, expectedMvPerC + 0.000005);
    }

    [Theory]
    [MemberData(nameof(AllTypes))]
    public void Seebeck_coefficient_is_the_derivative_of_the_direct_function(ThermocoupleType type)
    {
        // Central difference of the direct function (h = 1e-3 K); analytic and numeric agree to 1e-9 V/K.
        var range = Its90Thermocouple.DirectRangeK(type);
        for (double tK = range.Min + 1.0; tK < range.Max - 1.0; tK += 7.3)
        {
            double numeric = (Its90Thermocouple.EmfV(type, tK + 1e-3) - Its90Thermocouple.EmfV(type, tK - 1e-3)) / 2e-3;
            Assert.Equal(numeric, Its90Thermocouple.SeebeckVPerK(type, tK), 9);
        }
    }

    [Theory]
    [InlineData(ThermocoupleType.K, -271.0)]
    [InlineData(ThermocoupleType.K, 1373.0)]
    [InlineData(ThermocoupleType.T, 401.0)]
    [InlineData(ThermocoupleType.J, -211.0)]
    [InlineData(ThermocoupleType.J, 1201.0)]
    [InlineData(ThermocoupleType.E, 1001.0)]
    [InlineData(ThermocoupleType.N, 1301.0)]
    public void Direct_function_outside_its_range_throws(ThermocoupleType type, double tC)
    {
        var ex = Assert.Throws<BcPrepDataException>(() => Its90Thermocouple.EmfV(type, tC + Kelvin));
        Assert.Contains("outside the valid range", ex.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(ThermocoupleType.K, 54.9)]
    [InlineData(ThermocoupleType.K, -5.95)]
    [InlineData(ThermocoupleType.T, 20.9)]
    [InlineData(ThermocoupleType.J, 69.6)]
    [InlineData(ThermocoupleType.J, -8.2)]
    [InlineData(ThermocoupleType.E, 76.4)]
    [InlineData(ThermocoupleType.N, 47.6)]
    [InlineData(ThermocoupleType.N, -4.0)]
    public void Inverse_outside_NIST_inverse_range_throws_naming_value(ThermocoupleType type, double emfMv)
    {
        foreach (var method in Enum.GetValues<ThermocoupleInverseMethod>())
        {
            var ex = Assert.Throws<BcPrepDataException>(() => Its90Thermocouple.TemperatureK(type, emfMv / 1000.0, method));
            Assert.Contains((emfMv / 1000.0).ToString("R", System.Globalization.CultureInfo.InvariantCulture), ex.Message, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void NaN_in_gives_NaN_out()
    {
        Assert.True(double.IsNaN(Its90Thermocouple.EmfV(ThermocoupleType.K, double.NaN)));
        Assert.True(double.IsNaN(Its90Thermocouple.TemperatureK(ThermocoupleType.K, double.NaN)));
    }

    internal static double InverseMinC(ThermocoupleType type) => Its90Coefficients.For(type).Inverse[0].MinC;

    internal static double InverseMaxC(ThermocoupleType type) => Its90Coefficients.For(type).Inverse[^1].MaxC;

    /// <summary>Published error band of the inverse piece(s) covering tC (union of both at a piece boundary).</summary>
    private static (double Low, double High) ErrorBandC(ThermocoupleType type, double tC)
    {
        double low = double.PositiveInfinity;
        double high = double.NegativeInfinity;
        foreach (var piece in Its90Coefficients.For(type).Inverse)
        {
            if (tC >= piece.MinC && tC <= piece.MaxC)
            {
                low = Math.Min(low, piece.ErrorLowC);
                high = Math.Max(high, piece.ErrorHighC);
            }
        }

        return (low, high);
    }
}
