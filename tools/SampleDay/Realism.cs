namespace BcPrep.Tools.SampleDay;

/// <summary>
/// Imperfections of a real log, placed at fixed times so the sample day stays deterministic: spikes on the inlet
/// pressure transducer when the heater's contactor switches (electrical pickup on the signal wiring), and a short
/// dropout of the outlet thermocouple. Mains hum is left out on purpose: at 2 Hz the logger's integrating
/// converter averages it away, and 50 Hz lies far above the 1 Hz Nyquist frequency, so no notch could remove it
/// after sampling anyway.
/// </summary>
internal static class Realism
{
    /// <summary>Times (s since the first sample) of contactor switching spikes, inside and outside operating points.</summary>
    public static readonly double[] SpikeTimesS = [2000.0, 3000.0, 3001.0, 3210.5, 6100.0, 9300.0];

    /// <summary>Spike height on the 0–10 V inlet pressure signal (V; 0.3 V is 150 Pa).</summary>
    public const double SpikeV = 0.3;

    /// <summary>First sample (s) of the outlet-thermocouple dropout: two empty cells inside OP2.</summary>
    public const double DropoutStartS = 6000.0;

    public const int DropoutSamples = 2;

    public static double HeaterSwitchingSpikeV(long sample, double rateHz)
    {
        foreach (var t in SpikeTimesS)
        {
            if (sample == (long)Math.Round(t * rateHz))
            {
                // Alternating sign: switching on and off kicks the signal both ways.
                return Array.IndexOf(SpikeTimesS, t) % 2 == 0 ? SpikeV : -SpikeV;
            }
        }
        return 0.0;
    }

    public static bool IsDropout(long sample, double rateHz)
    {
        var first = (long)Math.Round(DropoutStartS * rateHz);
        return sample >= first && sample < first + DropoutSamples;
    }
}
