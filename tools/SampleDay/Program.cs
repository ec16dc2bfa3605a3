using System.Globalization;
using System.Text;
using BcPrep.Calibration;

namespace BcPrep.Tools.SampleDay;

/// <summary>
/// Writes the bundled sample test day of the invented Marten heated-duct stand into sample-logs/. Deterministic:
/// the same seed gives byte-identical files. Usage: dotnet run --project tools/SampleDay -- [output dir] [seed]
/// [--rate HZ] [--hours H] [--single] [--pace P] [--wide]. Larger rates and durations make benchmark days.
/// --pace P brings the day's set points P times sooner and shortens its thermal time constants 1.5·P times (two operating points in an hour at
/// P = 2). --wide makes the filter benchmark's shape: three more thermocouples (nine in all, 17 columns), 50 Hz mains
/// hum on every voltage and emf, and scattered single-cell dropouts on every channel.
/// </summary>
internal static class Program
{
    private static readonly string[] Columns =
    [
        "timestamp", "PBARO_V", "PT_IN_V", "PT_OUT_V", "FM_MA", "RTD_CJ_OHM", "TC_IN_MV", "TC_OUT_MV",
        "TC_W1_MV", "TC_W2_MV", "TC_W3_MV", "TC_W4_MV", "HTR_V_SIG", "HTR_I_SIG",
    ];

    /// <summary>The wide shape's extra thermocouples: lagging-surface temperatures near ambient.</summary>
    private static readonly string[] WideColumns = ["TC_L1_MV", "TC_L2_MV", "TC_L3_MV"];

    private static int Main(string[] args)
    {
        var positional = args.Where(a => !a.StartsWith("--", StringComparison.Ordinal)).ToList();
        var output = positional.Count > 0 ? positional[0] : "sample-logs";
        var seed = positional.Count > 1 ? int.Parse(positional[1], CultureInfo.InvariantCulture) : 20261124;
        var rate = Option(args, "--rate") ?? 2.0;
        var hours = Option(args, "--hours");
        var single = args.Contains("--single");
        var wide = args.Contains("--wide");
        var pace = Option(args, "--pace") ?? 1.0;
        var scenario = Paced(DayScenario.Default, pace) with { SampleRateHz = rate };
        if (hours is { } h)
        {
            scenario = Stretch(scenario, h * 3600);
        }
        Directory.CreateDirectory(output);
        var split = single ? double.PositiveInfinity : 80 * 60.0;
        Generate(scenario, seed, split, pace, wide, Path.Combine(output, "marten-2026-11-24-am.csv"), Path.Combine(output, "marten-2026-11-24-pm.csv"));
        return 0;
    }

    private static double? Option(string[] args, string name)
    {
        var i = Array.IndexOf(args, name);
        return i >= 0 && i + 1 < args.Length ? double.Parse(args[i + 1], CultureInfo.InvariantCulture) : null;
    }

    /// <summary>The same day run <paramref name="pace"/> times faster: set points come sooner (the time constants follow in Generate).</summary>
    private static DayScenario Paced(DayScenario scenario, double pace) => scenario with
    {
        DurationS = scenario.DurationS / pace,
        SetPoints = scenario.SetPoints.Select(p => p with { StartS = p.StartS / pace }).ToList(),
    };

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

    private static void Generate(DayScenario scenario, int seed, double splitS, double pace, bool wide, string firstPath, string secondPath)
    {
        var random = new Random(seed);
        var hum = new MainsHum(seed, Columns.Length - 1 + WideColumns.Length, scenario.SampleRateHz);
        var columns = wide ? Columns.Concat(WideColumns).ToArray() : Columns;
        // A faster day settles faster still: with the set points P times sooner, the thermal time constants shrink
        // 1.5·P times, so each point settles as fully as in the unpaced day (P = 1 keeps the day as it was).
        var settle = pace == 1.0 ? 1.0 : 1.5 * pace;
        var emfNoise = Enumerable.Range(0, 6).Select(_ => new Ar1Noise(random, 0.0020, 0.8)).ToArray(); // mV
        var pressureNoise = Enumerable.Range(0, 3).Select(_ => new Ar1Noise(random, 0.0015, 0.6)).ToArray(); // V
        var flowNoise = new Ar1Noise(random, 0.015, 0.7); // mA
        var rtdNoise = new Ar1Noise(random, 0.004, 0.5); // ohm
        var heaterNoise = new Ar1Noise(random, 0.002, 0.3); // V signal
        var lagNoise = Enumerable.Range(0, WideColumns.Length).Select(_ => new Ar1Noise(random, 0.0020, 0.8)).ToArray(); // mV; drawn after the others, so the sample day's noise stays as it was
        var culture = CultureInfo.InvariantCulture;
        var dt = 1.0 / scenario.SampleRateHz;
        var start = new DateTime(2026, 11, 24, 9, 0, 0, DateTimeKind.Unspecified);

        var massFlow = 0.0;
        var heaterPower = 0.0;
        var outletK = 294.45;
        var wallK = new double[RigPhysics.WallPositionsM.Length];
        Array.Fill(wallK, 294.45);
        TextWriter writer = Open(firstPath, columns);
        var line = new StringBuilder(256);
        var n = (long)Math.Round(scenario.DurationS * scenario.SampleRateHz);
        for (long i = 0; i < n; i++)
        {
            var t = i * dt;
            if (t >= splitS && writer is not null && firstPath != secondPath && i == (long)Math.Round(splitS * scenario.SampleRateHz))
            {
                writer.Dispose();
                writer = Open(secondPath, columns);
            }
            var set = scenario.At(t);
            massFlow += (set.MassFlowKgS - massFlow) * (1 - Math.Exp(-dt * pace / 15.0));
            heaterPower += (set.HeaterPowerW - heaterPower) * (1 - Math.Exp(-dt * pace / 2.0));
            var ambientK = 294.45 + (0.2 * t / 3600.0);
            var baroPa = 98_650.0 - (15.0 * t / 3600.0);
            var coldJunctionK = 297.15 + (0.4 * Math.Sin(2 * Math.PI * t / 5400.0));
            var steadyOutlet = RigPhysics.OutletBulkK(ambientK, massFlow, heaterPower);
            outletK += (steadyOutlet - outletK) * (1 - Math.Exp(-dt * settle / 420.0));
            for (var w = 0; w < wallK.Length; w++)
            {
                var steadyWall = RigPhysics.WallK(RigPhysics.WallPositionsM[w], ambientK, steadyOutlet, massFlow, heaterPower);
                wallK[w] += (steadyWall - wallK[w]) * (1 - Math.Exp(-dt * settle / 480.0));
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
            var column = 0;
            // Hum and dropouts only in the wide shape; the sample day and the 13-column benchmark stay as they were.
            double Hum(double amplitude) => wide ? amplitude * hum.At(column, i) : 0.0;
            void Cell(double value, string format, bool dropped = false)
            {
                AppendOrDrop(line, value, format, dropped || (wide && hum.IsDropout(column, i)));
                column++;
            }
            Cell(((baroPa / 100.0) - 800.0) / 60.0 + pressureNoise[0].Next() + Hum(0.002), "F5");
            Cell((inletGauge + 4.0) / 500.0 + pressureNoise[1].Next() + Realism.HeaterSwitchingSpikeV(i, scenario.SampleRateHz) + Hum(0.004), "F5");
            Cell((outletGauge - 3.0) / 500.0 + pressureNoise[2].Next() + Hum(0.004), "F5");
            Cell(4.0 + (16.0 * massFlow / 0.05) + flowNoise.Next() + Hum(0.01), "F4");
            Cell(CallendarVanDusen.ResistanceOhm(RtdNominal.Pt100, coldJunctionK) + rtdNoise.Next(), "F4");
            Cell(ThermocoupleMv(ambientK, coldJunctionK) + emfNoise[0].Next() + Hum(0.005), "F4");
            Cell(ThermocoupleMv(outletK, coldJunctionK) + emfNoise[1].Next() + Hum(0.005), "F4", Realism.IsDropout(i, scenario.SampleRateHz));
            for (var w = 0; w < wallK.Length; w++)
            {
                Cell(ThermocoupleMv(wallK[w], coldJunctionK) + emfNoise[2 + w].Next() + Hum(0.005), "F4");
            }
            Cell((volts / 25.0) + heaterNoise.Next() + Hum(0.002), "F5");
            Cell((amps / 2.5) + heaterNoise.Next() + Hum(0.002), "F5");
            if (wide)
            {
                for (var l = 0; l < WideColumns.Length; l++)
                {
                    Cell(ThermocoupleMv(ambientK + 2.0 + l, coldJunctionK) + lagNoise[l].Next() + Hum(0.005), "F4");
                }
            }
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

    private static StreamWriter Open(string path, string[] columns)
    {
        var writer = new StreamWriter(path, false, new UTF8Encoding(false), 1 << 16) { NewLine = "\n" };
        writer.Write(string.Join(',', columns));
        writer.Write('\n');
        return writer;
    }
}
