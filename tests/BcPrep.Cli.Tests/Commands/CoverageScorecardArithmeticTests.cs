using BcPrep.Tests.Cli.Support;
using BcPrep.Tools.Scorecard;
using BcPrep.Tools.Scorecard.Coverage;

namespace BcPrep.Tests.Cli.Commands;

/// <summary>
/// The coverage scorecard's own arithmetic (tools/DetectionScorecard/Coverage, BENCHMARKS.md "Coverage scorecard"):
/// counting, a known-distribution check, the calibration errors' spreads, and putting an error on a raw signal and
/// reading it back. Small and fast: no `process` run.
/// </summary>
public class CoverageScorecardArithmeticTests
{
    [Fact]
    public void Tally_counts_covered_trials_per_quantity_and_overall_with_the_boundary_covered()
    {
        var tally = new CoverageTally();
        tally.Add(new CoverageTrial("a", 10.0, 1.0, 10.5, 0.5)); // 0.5 U: covered
        tally.Add(new CoverageTrial("a", 10.0, 1.0, 11.0, 0.5)); // exactly U: covered (|v − t| ≤ U)
        tally.Add(new CoverageTrial("a", 10.0, 1.0, 8.9, 0.5));  // 1.1 U: missed
        tally.Add(new CoverageTrial("b", 0.0, 2.0, 3.0, 1.0));   // 1.5 U: missed

        Assert.Equal((2, 3), tally.Count("a"));
        Assert.Equal((0, 1), tally.Count("b"));
        Assert.Equal((2, 4), tally.Overall);
        Assert.Equal(0.5, CoverageTally.Fraction(tally.Overall), 12);
        // (v − t)/u for "a": −1, −2, +2.2 → mean −0.8/3, rms √((1 + 4 + 4.84)/3).
        var (mean, rms) = tally.NormalisedErrors("a");
        Assert.Equal(-0.8 / 3.0, mean, 12);
        Assert.Equal(Math.Sqrt(9.84 / 3.0), rms, 12);
    }

    [Fact]
    public void Binomial_standard_error_at_95_percent_and_300_trials_is_1_26_percent()
    {
        // √(0.95 · 0.05 / 300) = 0.012583 (binomial proportion, common practice).
        Assert.Equal(0.012583, CoverageTally.StandardError(0.95, 300), 6);
        Assert.True(double.IsNaN(CoverageTally.StandardError(0.95, 0)));
    }

    [Theory]
    // Normal errors: U = 1.95996 u covers 95 %, U = 1 u covers 68.27 % (JCGM 100 G.1.3, Table G.1).
    [InlineData(false, 1.959964, 0.95)]
    [InlineData(false, 1.0, 0.6827)]
    // Rectangular errors of half-width a = √3 u: U = 1.65 u covers 1.65/√3 = 95.3 % (JCGM 100 G.2.3), and the GUM's
    // U = 1.96 u covers all of them (a < U), the over-coverage of rectangular-dominated budgets (JCGM 101 9.2.4).
    [InlineData(true, 1.65, 0.9526)]
    [InlineData(true, 1.959964, 1.0)]
    public void Coverage_of_a_generated_day_with_known_error_distribution_is_the_distributions_own(bool rectangular, double k, double expected)
    {
        var random = new Random(20);
        var tally = new CoverageTally();
        const int trials = 20_000;
        for (var i = 0; i < trials; i++)
        {
            var error = rectangular ? Math.Sqrt(3.0) * ((2.0 * random.NextDouble()) - 1.0) : CalibrationErrors.Gaussian(random);
            tally.Add(new CoverageTrial("q", 100.0 + error, k, 100.0, 1.0));
        }
        var coverage = CoverageTally.Fraction(tally.Overall);
        // Four binomial standard errors (0.6 % at 95 %); exactly 1 where every error lies inside U.
        Assert.InRange(coverage, expected - (4 * CoverageTally.StandardError(expected, trials)) - 1e-12, Math.Min(1.0, expected + (4 * CoverageTally.StandardError(expected, trials)) + 1e-12));
        Assert.Equal(1.0, tally.NormalisedErrors("q").Rms, 0.03);
    }

    [Fact]
    public void Calibration_errors_have_the_standard_deviations_the_rig_file_states()
    {
        // The budget's Type B u of each term: rectangular a/√3 (JCGM 100 4.3.7), certificate U/k (JCGM 100 4.3.3).
        var random = new Random(7);
        var draws = Enumerable.Range(0, 20_000).Select(_ => CalibrationErrors.Draw(random)).ToList();
        static double Sd(IEnumerable<double> v)
        {
            var a = v.ToArray();
            var m = a.Average();
            return Math.Sqrt(a.Sum(x => (x - m) * (x - m)) / (a.Length - 1));
        }
        Assert.Equal(30.0 / 2.0, Sd(draws.Select(d => d.BarometerPa)), 0.3);                // 0.30 hPa, k = 2
        Assert.Equal(12.5 / Math.Sqrt(3), Sd(draws.Select(d => d.InletPressurePa)), 0.15);   // 0.25 % of 5 kPa
        Assert.Equal(0.01 / Math.Sqrt(3), Sd(draws.Select(d => d.FlowGain)), 1.2e-4);        // 1.0 % of reading
        Assert.Equal(1.0 / Math.Sqrt(3), Sd(draws.Select(d => d.ThermocoupleFractions[3])), 0.012); // class 1, in half-widths
        Assert.Equal(0.05e-3, Sd(draws.Select(d => d.DiameterErrorM)), 1e-6);               // 0.05 mm standard uncertainty
        Assert.Equal(0.02, Sd(draws.Select(d => d.LossFractionError)), 4e-4);                // u = 2 % (rectangular in the model)
        Assert.All(draws, d => Assert.InRange(d.LossFractionError, -0.0347, 0.0347));
    }

    [Fact]
    public void An_error_put_on_the_raw_signals_reads_back_as_that_error()
    {
        // A thermocouple deviation enters as the emf E(T + e) − E(T) at its own hot junction (emfs add, NIST
        // Monograph 175), so it reads back as e up to the inverse polynomial's error (type K, < 0.06 K) changing
        // over 1.5 K: 1e-3 K here. Offsets and gains read back through the rig's linear calibrations exactly.
        var clean = new double[RawSignals.Count];
        var state = new State(0.03, 900.0, 296.0, 330.0, [380.0, 385.0, 390.0, 395.0]);
        LogWriter.Raw(state, 600.0, clean);
        var errors = CalibrationErrors.None with
        {
            InletPressurePa = 9.0, BarometerPa = -20.0, FlowGain = 0.008, FlowZeroKgS = 2e-5,
            ThermocoupleFractions = [0, 0, 1.0, 0, 0, -0.5], HeaterVoltageGain = 0.004, ColdJunctionFraction = 1.0,
        };
        var perturbed = (double[])clean.Clone();
        RawSignals.Apply(errors, perturbed);
        var before = RawSignals.Readings(clean);
        var after = RawSignals.Readings(perturbed);

        Assert.Equal(9.0, after[RawSignals.InletPressure] - before[RawSignals.InletPressure], 9);
        Assert.Equal(-20.0, after[RawSignals.Barometer] - before[RawSignals.Barometer], 6);
        Assert.Equal((0.03 * 1.008) + 2e-5, after[RawSignals.Flow], 9);
        Assert.Equal(900.0 * 1.004, after[RawSignals.HeaterVoltage] * after[RawSignals.HeaterCurrent], 6);
        // RTD class A at 24 °C: 0.15 + 0.002 · 24 = 0.198 K (IEC 60751); it also shifts every thermocouple by about
        // S(T_cj)/S(T_hot) of that (emf addition).
        var junctionShift = after[RawSignals.ColdJunction] - before[RawSignals.ColdJunction];
        Assert.InRange(junctionShift, 0.19, 0.21);
        // t_w1 (index 2 of the thermocouples) +1.5 K (class 1 half-width below 375 °C, IEC 60584-1); t_w4 −0.75 K.
        Assert.Equal(1.5 + junctionShift, after[RawSignals.FirstThermocouple + 2] - before[RawSignals.FirstThermocouple + 2], 0.01);
        Assert.Equal(-0.75 + junctionShift, after[RawSignals.FirstThermocouple + 5] - before[RawSignals.FirstThermocouple + 5], 0.01);
        Assert.Equal(junctionShift, after[RawSignals.FirstThermocouple] - before[RawSignals.FirstThermocouple], 0.01);
    }

    [Fact]
    public void A_points_scalars_and_window_means_are_read_and_scored_against_the_truth()
    {
        // The layouts of points/ID/scalars.csv and budget.csv (README "Outputs"); a quoted input name with a comma
        // must not shift the columns, and each channel's window mean is taken once however many quantities list it.
        using var temp = new TempFolder();
        File.WriteAllText(temp.File("scalars.csv"), """
            # BcPrep scalars; point OP1
            quantity,unit,value,standard_uncertainty,expanded_uncertainty,coverage_factor,degrees_of_freedom,description
            mass_flow,kg/s,0.0201,0.0001,0.000196,1.96,100,mass flow through the duct
            inlet.temperature,K,296.0,0.87,1.7,1.96,1000,"bulk temperature, inlet"
            inlet.turbulence_intensity,1,0.04,0.01,0.02,1.96,100,turbulence intensity
            """);
        File.WriteAllText(temp.File("budget.csv"), """
            point,quantity,unit,input,type,input_estimate,input_standard_uncertainty,input_degrees_of_freedom,sensitivity,contribution,variance_share,source
            OP1,mass_flow,kg/s,mdot window mean,A,0.0201,3E-06,16.9,1,3E-06,0.001,"window mean, autocorrelation-corrected (Type A)"
            OP1,mass_flow,kg/s,"mdot: certificate FM-2291, 95 % limits",B,0,0.0001,,1,0.0001,0.999,certificate
            OP1,reynolds,1,mdot window mean,A,0.0201,3E-06,16.9,1.3E6,4,0.001,"window mean, autocorrelation-corrected (Type A)"
            OP1,inlet.temperature,K,t_in window mean,A,295.99,0.004,20,1,0.004,0.001,"window mean, autocorrelation-corrected (Type A)"
            """);
        var written = WrittenPoint.Read(temp.Path);
        var truth = new CoverageTruth(
            new Dictionary<string, double> { ["mass_flow"] = 0.0200, ["inlet.temperature"] = 297.0 },
            new Dictionary<string, double> { ["mdot"] = 0.020101, ["t_in"] = 296.0 });

        var trials = CoverageProgram.Trials(written, truth).ToDictionary(t => t.Quantity);
        var typeA = CoverageProgram.TypeATrials(written, truth).ToDictionary(t => t.Quantity);

        Assert.Equal(["inlet.temperature", "mass_flow"], trials.Keys.Order());
        Assert.True(trials["mass_flow"].Covered);         // 0.0001 off, U = 0.000196
        Assert.True(trials["inlet.temperature"].Covered); // 1.0 K off, U = 1.7 K
        Assert.Equal(["mdot", "t_in"], typeA.Keys.Order());
        Assert.Equal(2 * 3e-6, typeA["mdot"].HalfWidth, 15);
        Assert.True(typeA["mdot"].Covered);   // 1e-6 off, 2u_A = 6e-6
        Assert.False(typeA["t_in"].Covered);  // 0.01 K off, 2u_A = 0.008 K
    }
}
