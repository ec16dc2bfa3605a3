namespace BcPrep;

/// <summary>Which <see cref="ThreadScratch"/> slot each user takes, so that two users never share one in a call (two names of one slot say why their uses never overlap).</summary>
internal static class ScratchSlots
{
    public const int TimeSteps = 0;
    public const int FftReal = 1;
    public const int FftImaginary = 2;
    public const int FftPower = 3;
    public const int ThermocoupleEmf = 4;
    public const int Deviations = 5;
    public const int SectionPreviousReal = 6;
    public const int SectionPreviousImaginary = 7;
    public const int SectionSumImaginary = 8;
    public const int Autocorrelation = 9;

    /// <summary>
    /// A window's bridged, finite sample times (window statistics). The same array as <see cref="FftReal"/>: the bridged
    /// samples are dead once de-spiked (<see cref="Pipeline.WindowStatistics.Evaluate(string, Pipeline.TimeWindow, double[], ReadOnlyMemory{double}, Conditioning.ConditioningSettings, Conditioning.SensorFaultLimits, Values.DayStart)"/> takes every time it reports
    /// before the Type A evaluation), and the autocorrelation's transforms run only in that evaluation, so a statistics
    /// thread holds one set of window-long arrays for both (30 MB less on the 1 kHz day, two threads).
    /// </summary>
    public const int WindowTimes = FftReal;

    /// <summary>A window's bridged, finite sample values (window statistics); the same array as <see cref="FftImaginary"/>, see <see cref="WindowTimes"/>.</summary>
    public const int WindowValues = FftImaginary;

    /// <summary>A window's de-spiked samples (window statistics), when they cannot be de-spiked where they were loaded (inserted samples, gaps left open, a Hampel window other than k = 10) and the caller names no slot of its own for them (<see cref="LoadedValues"/>).</summary>
    public const int CleanSamples = 10;

    /// <summary>
    /// A gathered window's channel, loaded from the kept rows for its reduction (<see cref="Pipeline.GatheredWindow"/>);
    /// also its de-spiked copy when its samples had to be bridged into the window arrays (<see cref="WindowValues"/>),
    /// after which the loaded ones are dead (a failed reduction loads them again).
    /// </summary>
    public const int LoadedValues = 11;

    /// <summary>A block of original samples for the in-place Hampel rule (<see cref="Conditioning.InPlaceHampel"/>).</summary>
    public const int HampelOriginals = 12;

    /// <summary>Number of slots.</summary>
    public const int Count = 13;
}
