namespace BcPrep.Pipeline;

/// <summary>
/// Where the samples of a detected window come from once the day's detection is known: the rows kept back during
/// the read (<see cref="LiveDetection"/>), or a second read that seeks to the blocks covering the window
/// (<see cref="SeekingSecondRead"/>). Either hands each channel's samples to the same statistics, so the rest of the
/// pipeline does not know which one served a window.
/// </summary>
internal interface IWindowSource
{
    /// <summary>Takes the window if this source can serve it (now or when it completes); false leaves it to the next source.</summary>
    bool TryGather(TimeWindow window);
}
