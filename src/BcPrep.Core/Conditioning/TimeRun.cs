namespace BcPrep.Conditioning;

/// <summary>
/// A run of a channel's conditioned times: either a stretch of the logger's time axis, by absolute index
/// (<see cref="Owned"/> null; nearly every run), or times of the channel's own (a chunk where gap bridging inserted
/// samples), in <see cref="Owned"/> from <see cref="OwnedStart"/>.
/// </summary>
internal readonly record struct TimeRun(long From, int Length, double[]? Owned = null, int OwnedStart = 0)
{
    public ReadOnlySpan<double> Times(SlidingDoubles axis) => Owned is { } own ? own.AsSpan(OwnedStart, Length) : axis.Slice(From, Length);

    /// <summary>The run without its first <paramref name="k"/> times.</summary>
    public TimeRun Skip(int k) => Owned is null ? this with { From = From + k, Length = Length - k } : this with { OwnedStart = OwnedStart + k, Length = Length - k };
}
