namespace BcPrep.Conditioning;

/// <summary>
/// The times of a channel's samples in the order they went into the filters (which emit them in that order, one
/// value per time), as runs (<see cref="TimeRun"/>): a channel's conditioned rows carry their times without a copy
/// of them, and two channels' runs on one axis are compared by position instead of time by time.
/// </summary>
internal sealed class TimeRuns
{
    private readonly List<TimeRun> _runs = [];
    private int _head;

    /// <summary>Times held.</summary>
    public long Count { get; private set; }

    public void Add(TimeRun run)
    {
        if (run.Length > 0)
        {
            _runs.Add(run);
            Count += run.Length;
        }
    }

    /// <summary>Absolute index of the earliest time of the axis still referenced (null when none is).</summary>
    public long? FirstOnAxis
    {
        get
        {
            for (var r = _head; r < _runs.Count; r++)
            {
                if (_runs[r].Owned is null)
                {
                    return _runs[r].From;
                }
            }
            return null;
        }
    }

    /// <summary>Copies the first <c>destination.Length</c> times.</summary>
    public void CopyTo(SlidingDoubles axis, Span<double> destination)
    {
        var r = _head;
        var o = 0;
        while (o < destination.Length)
        {
            var run = _runs[r++];
            var n = Math.Min(run.Length, destination.Length - o);
            run.Times(axis)[..n].CopyTo(destination[o..]);
            o += n;
        }
    }

    /// <summary>Whether the first <paramref name="count"/> times equal those of <paramref name="other"/> (runs at one position of one axis without reading them).</summary>
    public bool SameAs(SlidingDoubles axis, TimeRuns other, SlidingDoubles otherAxis, int count)
    {
        if (Count < count || other.Count < count)
        {
            return false;
        }
        if (count == 0)
        {
            return true;
        }
        int r = _head, q = other._head;
        var a = _runs[r];
        var b = other._runs[q];
        var left = count;
        while (left > 0)
        {
            if (a.Length == 0)
            {
                a = _runs[++r];
            }
            if (b.Length == 0)
            {
                b = other._runs[++q];
            }
            var n = Math.Min(left, Math.Min(a.Length, b.Length));
            var samePlace = a.Owned is null && b.Owned is null && a.From == b.From && ReferenceEquals(axis, otherAxis);
            if (!samePlace && !a.Times(axis)[..n].SequenceEqual(b.Times(otherAxis)[..n]))
            {
                return false;
            }
            a = a.Skip(n);
            b = b.Skip(n);
            left -= n;
        }
        return true;
    }

    /// <summary>Whether these runs hold the same times as <paramref name="other"/>, all of them.</summary>
    public bool SameAs(SlidingDoubles axis, TimeRuns other, SlidingDoubles otherAxis) =>
        Count == other.Count && SameAs(axis, other, otherAxis, (int)Count);

    /// <summary>The runs in order (for filtering them one after the other).</summary>
    public IEnumerable<TimeRun> Runs
    {
        get
        {
            for (var r = _head; r < _runs.Count; r++)
            {
                yield return _runs[r];
            }
        }
    }

    /// <summary>Appends the first <paramref name="count"/> times to <paramref name="destination"/> and drops them.</summary>
    public void MoveTo(SlidingDoubles axis, List<double> destination, int count)
    {
        var left = count;
        while (left > 0)
        {
            var run = _runs[_head];
            var n = Math.Min(left, run.Length);
            destination.AddRange(run.Times(axis)[..n]);
            Drop(n);
            left -= n;
        }
    }

    /// <summary>Drops the first <paramref name="count"/> times.</summary>
    public void Drop(int count)
    {
        if (count > Count)
        {
            throw new InvalidOperationException($"{count} times dropped of {Count}");
        }
        var left = count;
        while (left > 0)
        {
            var run = _runs[_head];
            if (run.Length <= left)
            {
                left -= run.Length;
                _head++;
            }
            else
            {
                _runs[_head] = run.Skip(left);
                left = 0;
            }
        }
        Count -= count;
        if (_head == _runs.Count)
        {
            _runs.Clear();
            _head = 0;
        }
        else if (_head >= 256)
        {
            _runs.RemoveRange(0, _head);
            _head = 0;
        }
    }

    public void Clear()
    {
        _runs.Clear();
        _head = 0;
        Count = 0;
    }
}
