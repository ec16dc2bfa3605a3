namespace BcPrep.Conditioning;

/// <summary>
/// The samples a window's reduction wrote over in its caller's array (bridged gap cells, replaced spikes), each with
/// the value it had, so that the array can be put back exactly as it was loaded. A reduction that fails is done
/// again for its message (<see cref="Pipeline.WindowStatsBook"/>) and must see the samples as they were loaded;
/// recording the few cells written lets the reduction work in the loaded array instead of a second window-long copy.
/// </summary>
internal sealed class SampleEdits
{
    private readonly List<int> _indices = [];
    private readonly List<double> _originals = [];

    /// <summary>Cells recorded so far.</summary>
    public int Count => _indices.Count;

    /// <summary>Records that cell <paramref name="index"/> held <paramref name="original"/> before it is written over.</summary>
    public void Record(int index, double original)
    {
        _indices.Add(index);
        _originals.Add(original);
    }

    /// <summary>Records the cells of <paramref name="indices"/>, which held <paramref name="originals"/> (pairwise).</summary>
    public void Record(List<int> indices, List<double> originals)
    {
        _indices.AddRange(indices);
        _originals.AddRange(originals);
    }

    /// <summary>
    /// Writes every recorded original back, the last recorded first, so that a cell written twice (a bridged cell
    /// later replaced as a spike) ends with the value it was loaded with; then forgets them.
    /// </summary>
    public void Undo(Span<double> samples)
    {
        for (var i = _indices.Count - 1; i >= 0; i--)
        {
            samples[_indices[i]] = _originals[i];
        }
        _indices.Clear();
        _originals.Clear();
    }
}
