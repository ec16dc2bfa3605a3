namespace BcPrep.Conditioning;

/// <summary>
/// The Hampel rule of <see cref="HampelFilter.ApplyInto"/> written over the samples themselves, for the usual window
/// (k = 10, finite samples, vector hardware). A window statistics thread otherwise held a second window-long array for
/// the de-spiked copy (10 MB per thread on a 20-minute window at 1 kHz). Every window is still built from the original
/// samples: the centres go through in blocks, each block's windows read a small copy of the originals (the next block
/// takes the last 2k of them over, since its first windows reach back into samples the block before may have
/// replaced), and only the centres' replacements are written into the samples. The replaced samples' original values
/// are handed back, so that a caller can put them back (<see cref="SampleEdits"/>).
/// </summary>
internal static class InPlaceHampel
{
    /// <summary>Centres per block: the block's copy (2 blocks at most, plus 2k) stays in the second-level cache.</summary>
    internal const int BlockCentres = 1 << 14;

    /// <summary>Whether <see cref="TryApply"/> takes these samples; otherwise use <see cref="HampelFilter.ApplyInto"/> into a second array.</summary>
    public static bool Applies(ReadOnlySpan<double> x, int halfWindow) =>
        halfWindow == TwentyOnePointWindow.HalfWindow && TwentyOnePointWindow.IsAccelerated
        && x.Length - (2 * halfWindow) >= TwentyOnePointWindow.Lanes && HampelFilter.AllFinite(x);

    /// <summary>
    /// Replaces the spikes of <paramref name="x"/> in place, with the same decisions, replacement values and order of
    /// replaced indices as <see cref="HampelFilter.ApplyInto"/>, and returns true; returns false, writing nothing, when
    /// the samples are not for this rule (<see cref="Applies"/>), so that a caller checks them once, here. Each replaced
    /// index is appended to <paramref name="replaced"/> and its original value to <paramref name="originals"/>.
    /// </summary>
    public static bool TryApply(Span<double> x, double sigmaThreshold, double scaleFloor, List<int> replaced, List<double> originals)
    {
        const int k = TwentyOnePointWindow.HalfWindow;
        HampelFilter.Validate(k, sigmaThreshold, scaleFloor);
        if (!Applies(x, k))
        {
            return false;
        }
        int n = x.Length;
        // The block's originals: its centres' windows, [first − k, end + k). At most two blocks of centres (the last
        // block takes a remainder shorter than a block with it, so that no block has fewer centres than a vector).
        var copy = ThreadScratch.Rent(ScratchSlots.HampelOriginals, (2 * BlockCentres) + (2 * k));
        var found = new List<int>();
        int first = k; // the block's first centre
        int carried = 0; // originals already in the copy, from the block before: [first − k, first + k)
        bool head = true;
        while (first < n - k)
        {
            int end = n - k - first < 2 * BlockCentres ? n - k : first + BlockCentres;
            int from = first - k; // x index of copy[0]
            int length = end + k - from;
            x.Slice(from + carried, length - carried).CopyTo(copy.AsSpan(carried));
            var originalsHere = copy.AsSpan(0, length);
            // Output indices are those of the copy: the slice of x that starts where the copy does.
            var output = x[from..];
            if (head)
            {
                // The truncated windows at the start, as ApplyInto takes them first (the copy starts at sample 0).
                HampelFilter.TruncatedEnd(originalsHere, 0, k, k, sigmaThreshold, scaleFloor, output, found);
                head = false;
            }
            TwentyOnePointWindow.Apply(originalsHere, k, end - from, sigmaThreshold, scaleFloor, output, found);
            if (end == n - k)
            {
                // The truncated windows at the end: the copy reaches the last sample, so they are truncated as in x.
                HampelFilter.TruncatedEnd(originalsHere, end - from, length, k, sigmaThreshold, scaleFloor, output, found);
            }
            foreach (var at in found)
            {
                replaced.Add(from + at);
                originals.Add(originalsHere[at]);
            }
            found.Clear();
            // The next block's first windows reach back k samples into this block: keep their originals.
            originalsHere.Slice(length - (2 * k), 2 * k).CopyTo(copy);
            carried = 2 * k;
            first = end;
        }
        return true;
    }
}
