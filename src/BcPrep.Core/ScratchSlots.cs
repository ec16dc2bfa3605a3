namespace BcPrep;

/// <summary>Which <see cref="ThreadScratch"/> slot each user takes, so that two users never share one in a call.</summary>
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

    /// <summary>A window's bridged, finite sample times (window statistics).</summary>
    public const int WindowTimes = 10;

    /// <summary>A window's bridged, finite sample values (window statistics).</summary>
    public const int WindowValues = 11;

    /// <summary>A window's de-spiked samples, rented at their exact length (<see cref="ThreadScratch.RentExact"/>).</summary>
    public const int CleanSamples = 12;

    /// <summary>A gathered window's channel, loaded from the kept rows for its reduction (<see cref="Pipeline.GatheredWindow"/>).</summary>
    public const int LoadedValues = 13;

    /// <summary>Number of slots.</summary>
    public const int Count = 14;
}
