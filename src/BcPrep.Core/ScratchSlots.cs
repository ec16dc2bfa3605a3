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

    /// <summary>A window's bridged, finite sample times (window statistics).</summary>
    public const int WindowTimes = 6;

    /// <summary>A window's bridged, finite sample values (window statistics).</summary>
    public const int WindowValues = 7;

    /// <summary>A window's de-spiked samples, rented at their exact length (<see cref="ThreadScratch.RentExact"/>).</summary>
    public const int CleanSamples = 8;

    /// <summary>Number of slots.</summary>
    public const int Count = 9;
}
