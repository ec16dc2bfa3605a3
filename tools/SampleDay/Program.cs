using System.Globalization;
using System.Text;
using BcPrep.Calibration;

namespace BcPrep.Tools.SampleDay;

/// <summary>
/// Writes the bundled sample test day of the invented Marten heated-duct stand into sample-logs/. Deterministic:
/// the same seed gives byte-identical files. Usage: dotnet run --project tools/SampleDay -- [output dir] [seed]
/// [--rate HZ] [--hours H] [--single]. Larger rates and durations make benchmark days.
/// </summary>
internal static class Program
{
    private static readonly string[] Columns =
    [
        "timestamp", "PBARO_V", "PT_IN_V", "PT_OUT_V", "FM_MA", "RTD_CJ_OHM", "TC_IN_MV", "TC_OUT_MV",
        "TC_W1_MV", "TC_W2_MV", "TC_W3_MV", "TC_W4_MV", "HTR_V_SIG", "HTR_I_SIG",
    ];

    private static int Main(string[] args)
    {
        var positional = args.Where(a => !a.StartsWith("--", StringComparison.Ordinal)).ToList();
        var output = positional.Count > 0 ? positional[0] : "sample-logs";
        var seed = positional.Count > 1 ? int.Parse(positional[1], CultureInfo.InvariantCulture) : 20261124;
        var rate = Option(args, "--rate") ?? 2.0;
        var hours = Option(args, "--hours");
        var single = args.Contains("--single");
        var scenario = DayScenario.Default with { SampleRateHz = rate };
        if (hours is { } h)
        {
            scenario = Stretch(scenario, h * 3600);
        }
        Directory.CreateDirectory(output);
        var split = single ? double.PositiveInfinity : 80 * 60.0;
        Generate(scenario, seed, split, Path.Combine(output, "marten-2026-11-24-am.csv"), Path.Combine(output, "marten-2026-11-24-pm.csv"));
        return 0;
    }

    private static double? Option(string[] args, string name)
    {
        var i = Array.IndexOf(args, name);
        return i >= 0 && i + 1 < args.Length ? double.Parse(args[i + 1], CultureInfo.InvariantCulture) : null;
    }

    /// <summary>Repeats the three operating points until the requested duration is filled (for benchmark days).</summary>
    private static DayScenario Stretch(DayScenario scenario, double durationS)
    {
        var cycle = scenario.SetPoints.Skip(1).ToList();
        var points = new List<SetPoint> { scenario.SetPoints[0] };
        var start = cycle[0].StartS;
        var period = scenario.DurationS - start;
        for (var k = 0; start + (k * period) < durationS; k++)
        {
            points.AddRange(cycle.Select(p => p with { StartS = p.StartS + (k * period) }));
        }
        return scenario with { DurationS = durationS, SetPoints = points.Where(p => p.StartS < durationS).ToList() };
    }

    private static void Generate(DayScenario scenario, int seed, double splitS, string firstPath, string secondPath)
    {
        var random = new Random(seed);
        var emfNoise = Enumerable.Range(0, 6).Select(_ => new Ar1Noise(random, 0.0020, 0.8)).ToArray(); // mV
        var pressureNoise = Enumerable.Range(0, 3).Select(_ => new Ar1Noise(random, 0.0015, 0.6)).ToArray(); // V
        var flowNoise = new Ar1Noise(random, 0.015, 0.7); // mA
        var rtdNoise = new Ar1Noise(random, 0.004, 0.5); // ohm
        var heaterNoise = new Ar1Noise(random, 0.002, 0.3); // V signal
        var culture = CultureInfo.InvariantCulture;
        var dt = 1.0 / scenario.SampleRateHz;
        var start = new DateTime(2026, 11, 24, 9, 0, 0, DateTimeKind.Unspecified);

        var massFlow = 0.0;
        var heaterPower = 0.0;
        var outletK = 294.45;
        var wallK = new double[RigPhysics.WallPositionsM.Length];
        Array.Fill(wallK, 294.45);
        TextWriter writer = Open(firstPath);
        var line = new StringBuilder(256);
        var n = (long)Math.Round(scenario.DurationS * scenario.SampleRateHz);
        for (long i = 0; i < n; i++)
        {
            var t = i * dt;
            if (t >= splitS && writer is not null && firstPath != secondPath && i == (long)Math.Round(splitS * scenario.SampleRateHz))
            {
                writer.Dispose();
                writer = Open(secondPath);
            }
            var set = scenario.At(t);
            massFlow += (set.MassFlowKgS - massFlow) * (1 - Math.Exp(-dt / 15.0));
            heaterPower += (set.HeaterPowerW - heaterPower) * (1 - Math.Exp(-dt / 2.0));
            var ambientK = 294.45 + (0.2 * t / 3600.0);
            var baroPa = 98_650.0 - (15.0 * t / 3600.0);
            var coldJunctionK = 297.15 + (0.4 * Math.Sin(2 * Math.PI * t / 5400.0));
            var steadyOutlet = RigPhysics.OutletBulkK(ambientK, massFlow, heaterPower);
            outletK += (steadyOutlet - outletK) * (1 - Math.Exp(-dt / 420.0));
            for (var w = 0; w < wallK.Length; w++)
            {
                var steadyWall = RigPhysics.WallK(RigPhysics.WallPositionsM[w], ambientK, steadyOutlet, massFlow, heaterPower);
                wallK[w] += (steadyWall - wallK[w]) * (1 - Math.Exp(-dt / 480.0));
            }
            var inletGauge = RigPhysics.InletGaugePa(massFlow);
            var outletGauge = inletGauge
                - RigPhysics.FrictionDropPa(massFlow, baroPa + inletGauge, 0.5 * (ambientK + outletK), RigPhysics.OutletPlaneM - RigPhysics.InletPlaneM)
                - RigPhysics.AccelerationDropPa(massFlow, baroPa + inletGauge, ambientK, outletK);
            const double heaterOhm = 24.0;
            var volts = Math.Sqrt(heaterPower * heaterOhm);
            var amps = volts / heaterOhm;

            line.Clear();
            line.Append(start.AddTicks((long)Math.Round(t * TimeSpan.TicksPerSecond)).ToString("yyyy-MM-ddTHH:mm:ss.fff", culture));
            Append(line, ((baroPa / 100.0) - 800.0) / 60.0 + pressureNoise[0].Next(), "F5");
            Append(line, (inletGauge + 4.0) / 500.0 + pressureNoise[1].Next() + Realism.HeaterSwitchingSpikeV(i, scenario.SampleRateHz), "F5");
            Append(line, (outletGauge - 3.0) / 500.0 + pressureNoise[2].Next(), "F5");
            Append(line, 4.0 + (16.0 * massFlow / 0.05) + flowNoise.Next(), "F4");
            Append(line, CallendarVanDusen.ResistanceOhm(RtdNominal.Pt100, coldJunctionK) + rtdNoise.Next(), "F4");
            Append(line, ThermocoupleMv(ambientK, coldJunctionK) + emfNoise[0].Next(), "F4");
            AppendOrDrop(line, ThermocoupleMv(outletK, coldJunctionK) + emfNoise[1].Next(), "F4", Realism.IsDropout(i, scenario.SampleRateHz));
            for (var w = 0; w < wallK.Length; w++)
            {
                Append(line, ThermocoupleMv(wallK[w], coldJunctionK) + emfNoise[2 + w].Next(), "F4");
            }
            Append(line, (volts / 25.0) + heaterNoise.Next(), "F5");
            Append(line, (amps / 2.5) + heaterNoise.Next(), "F5");
            writer!.Write(line);
            writer.Write('\n');
        }
        writer!.Dispose();
    }

    private static double ThermocoupleMv(double hotK, double coldK) =>
        (Its90Thermocouple.EmfV(ThermocoupleType.K, hotK) - Its90Thermocouple.EmfV(ThermocoupleType.K, coldK)) * 1000.0;

    /// <summary>An empty cell where the logger missed the reading, else the value.</summary>
    private static void AppendOrDrop(StringBuilder line, double value, string format, bool dropped)
    {
        if (dropped)
        {
            line.Append(',');
            return;
        }
        Append(line, value, format);
    }

    private static void Append(StringBuilder line, double value, string format) =>
        line.Append(',').Append(value.ToString(format, CultureInfo.InvariantCulture));

    private static StreamWriter Open(string path)
    {
        var writer = new StreamWriter(path, false, new UTF8Encoding(false), 1 << 16) { NewLine = "\n" };
        writer.Write(string.Join(',', Columns));
        writer.Write('\n');
        return writer;
    }
}
