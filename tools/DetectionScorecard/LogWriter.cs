using System.Globalization;
using System.Text;
using BcPrep.Calibration;
using BcPrep.Tools.SampleDay;

namespace BcPrep.Tools.Scorecard;

/// <summary>
/// Writes a generated day as one log of the scorecard rig (the sample stand's columns): the noise-free
/// <see cref="Trajectory"/> plus AR(1) noise, spikes, mains hum, a pressure zero drift and the planted gaps.
/// Deterministic: the same recipe gives the same bytes.
/// </summary>
public static class LogWriter
{
    public static readonly string[] Columns =
    [
        "timestamp", "PBARO_V", "PT_IN_V", "PT_OUT_V", "FM_MA", "RTD_CJ_OHM", "TC_IN_MV", "TC_OUT_MV",
        "TC_W1_MV", "TC_W2_MV", "TC_W3_MV", "TC_W4_MV", "HTR_V_SIG", "HTR_I_SIG",
    ];

    // Noise standard deviations in each column's raw unit (those of the sample day).
    private static readonly double[] Sigma = [0.0015, 0.0015, 0.0015, 0.015, 0.004, 0.002, 0.002, 0.002, 0.002, 0.002, 0.002, 0.002, 0.002];
    private static readonly string[] Formats = ["F5", "F5", "F5", "F4", "F4", "F4", "F4", "F4", "F4", "F4", "F4", "F5", "F5"];

    public static void Write(DayRecipe recipe, string path)
    {
        ArgumentNullException.ThrowIfNull(recipe);
        var trajectory = new Trajectory(recipe);
        var random = new Random(unchecked((recipe.Seed * 7919) + 1));
        var values = Columns.Length - 1;
        var noise = Enumerable.Range(0, values).Select(_ => new Ar1Noise(random, 1.0, recipe.NoisePhi)).ToArray();
        var humPhase = Enumerable.Range(0, values).Select(_ => 2 * Math.PI * random.NextDouble()).ToArray();
        var spikeLeft = new int[values];
        var spikeValue = new double[values];
        var drifting = Array.IndexOf(Columns, recipe.DriftingPressureColumn) - 1;
        var gapColumns = recipe.Gaps.Select(g => g.Column is null ? -1 : Array.IndexOf(Columns, g.Column) - 1).ToArray();
        var culture = CultureInfo.InvariantCulture;
        var origin = new DateTime(2026, 11, 24, 9, 0, 0, DateTimeKind.Unspecified);
        var raw = new double[values];
        using var writer = new StreamWriter(path, false, new UTF8Encoding(false), 1 << 16) { NewLine = "\n" };
        writer.Write(string.Join(',', Columns));
        writer.Write('\n');
        var line = new StringBuilder(256);
        var n = (long)Math.Round(recipe.DurationS * recipe.RateHz);
        for (long i = 0; i < n; i++)
        {
            var t = i / recipe.RateHz;
            var wholeRowMissing = false;
            for (var g = 0; g < recipe.Gaps.Count; g++)
            {
                wholeRowMissing |= gapColumns[g] < 0 && t >= recipe.Gaps[g].StartS && t < recipe.Gaps[g].StartS + recipe.Gaps[g].DurationS;
            }
            Raw(trajectory.At(t), t, raw);
            for (var c = 0; c < values; c++)
            {
                var v = raw[c] + (Sigma[c] * noise[c].Next());
                if (recipe.MainsHumSigmas > 0)
                {
                    v += recipe.MainsHumSigmas * Sigma[c] * Math.Sin((2 * Math.PI * 50.0 * t) + humPhase[c]);
                }
                if (c == drifting)
                {
                    v += recipe.PressureZeroDriftPaPerH * t / 3600.0 / 500.0;
                }
                if (spikeLeft[c] == 0 && random.NextDouble() < recipe.SpikeFraction / 2.0)
                {
                    // 1–3 samples long, 25–1000 σ (log-uniform, so small spikes are as common as large ones), either sign.
                    spikeLeft[c] = 1 + random.Next(3);
                    spikeValue[c] = (random.NextDouble() < 0.5 ? -1 : 1) * Sigma[c] * 25.0 * Math.Pow(40.0, random.NextDouble());
                }
                if (spikeLeft[c] > 0)
                {
                    v += spikeValue[c];
                    spikeLeft[c]--;
                }
                raw[c] = v;
            }
            if (wholeRowMissing)
            {
                continue;
            }
            line.Clear();
            line.Append(origin.AddTicks((long)Math.Round(t * TimeSpan.TicksPerSecond)).ToString("yyyy-MM-ddTHH:mm:ss.fff", culture));
            for (var c = 0; c < values; c++)
            {
                line.Append(',');
                if (!InColumnGap(recipe, gapColumns, c, t))
                {
                    line.Append(raw[c].ToString(Formats[c], culture));
                }
            }
            writer.Write(line);
            writer.Write('\n');
        }
    }

    private static bool InColumnGap(DayRecipe recipe, int[] gapColumns, int column, double t)
    {
        for (var g = 0; g < recipe.Gaps.Count; g++)
        {
            if (gapColumns[g] == column && t >= recipe.Gaps[g].StartS && t < recipe.Gaps[g].StartS + recipe.Gaps[g].DurationS)
            {
                return true;
            }
        }
        return false;
    }

    /// <summary>The noise-free raw readings (logger units) of one instant, through the sample rig's calibrations.</summary>
    public static void Raw(State x, double t, double[] raw)
    {
        var baroPa = Trajectory.BarometerPa - (15.0 * t / 3600.0);
        var coldJunctionK = 297.15 + (0.4 * Math.Sin(2 * Math.PI * t / 5400.0));
        var inletGauge = RigPhysics.InletGaugePa(x.MassFlowKgS);
        var outletGauge = inletGauge
            - RigPhysics.FrictionDropPa(x.MassFlowKgS, baroPa + inletGauge, 0.5 * (x.InletK + x.OutletK), RigPhysics.OutletPlaneM - RigPhysics.InletPlaneM)
            - RigPhysics.AccelerationDropPa(x.MassFlowKgS, baroPa + inletGauge, x.InletK, x.OutletK);
        const double heaterOhm = 24.0;
        var volts = Math.Sqrt(Math.Max(0, x.HeaterPowerW) * heaterOhm);
        raw[0] = ((baroPa / 100.0) - 800.0) / 60.0;
        raw[1] = inletGauge / 500.0;
        raw[2] = outletGauge / 500.0;
        raw[3] = 4.0 + (16.0 * x.MassFlowKgS / 0.05);
        raw[4] = CallendarVanDusen.ResistanceOhm(RtdNominal.Pt100, coldJunctionK);
        raw[5] = Mv(x.InletK, coldJunctionK);
        raw[6] = Mv(x.OutletK, coldJunctionK);
        for (var w = 0; w < 4; w++)
        {
            raw[7 + w] = Mv(x.WallK[w], coldJunctionK);
        }
        raw[11] = volts / 25.0;
        raw[12] = volts / heaterOhm / 2.5;
    }

    private static double Mv(double hotK, double coldK) =>
        (Its90Thermocouple.EmfV(ThermocoupleType.K, hotK) - Its90Thermocouple.EmfV(ThermocoupleType.K, coldK)) * 1000.0;
}
