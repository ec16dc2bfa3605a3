using System.Runtime.InteropServices;

namespace BcPrep.Conditioning;

/// <summary>
/// Four channels' notch and low-pass in step: while their samples share one time axis, are all finite and the
/// filters are in the same state, the sections run as lanes of one vector (<see cref="StreamedSectionPass.PushLanes"/>),
/// each lane's values exactly those of <see cref="Accept"/> on its own. Anything else (a missing value in one channel,
/// other times) goes through <see cref="Accept"/> lane by lane, and the lanes stay apart until they are in step again.
/// </summary>
internal sealed partial class StreamedZeroPhase
{
    /// <summary>Samples that went through <see cref="AcceptLanes"/> together with three other channels (for tests).</summary>
    public long SamplesInLanes { get; private set; }

    /// <summary>As <see cref="Accept"/> on each of four channels' filters, with the same times.</summary>
    public static void AcceptLanes(StreamedZeroPhase[] lanes, ReadOnlySpan<double> timesS, ReadOnlySpan<double> v0, ReadOnlySpan<double> v1, ReadOnlySpan<double> v2, ReadOnlySpan<double> v3)
    {
        if (!InStep(lanes) || !AllFinite(v0) || !AllFinite(v1) || !AllFinite(v2) || !AllFinite(v3))
        {
            lanes[0].Accept(timesS, v0);
            lanes[1].Accept(timesS, v1);
            lanes[2].Accept(timesS, v2);
            lanes[3].Accept(timesS, v3);
            return;
        }
        foreach (var lane in lanes)
        {
            lane.SamplesInLanes += timesS.Length;
        }
        var p = lanes[0];
        var i = 0;
        while (i < timesS.Length)
        {
            if (p._open && timesS[i] - p._lastS > p._jumpS)
            {
                foreach (var lane in lanes)
                {
                    lane.EndSegment();
                }
            }
            var end = i + 1;
            while (end < timesS.Length && timesS[end] - timesS[end - 1] <= p._jumpS)
            {
                end++;
            }
            FeedLanes(lanes, timesS[i..end], v0[i..end], v1[i..end], v2[i..end], v3[i..end]);
            i = end;
        }
    }

    /// <summary>Same sections and the same segment state in every lane, and the sections in step.</summary>
    private static bool InStep(StreamedZeroPhase[] lanes)
    {
        var p = lanes[0];
        if (p._passes.Length == 0)
        {
            return false;
        }
        foreach (var lane in lanes)
        {
            if (lane._passes.Length != p._passes.Length || lane._open != p._open || lane._streaming != p._streaming
                || lane._lastS.CompareTo(p._lastS) != 0 || lane._jumpS.CompareTo(p._jumpS) != 0 || lane._minimumPad != p._minimumPad
                || lane._segmentStart.Count != p._segmentStart.Count || lane._held != p._held)
            {
                return false;
            }
        }
        return StreamedSectionPass.InStep(lanes.Select(l => l._passes[0]).ToArray());
    }

    private static bool AllFinite(ReadOnlySpan<double> values)
    {
        foreach (var v in values)
        {
            if (!double.IsFinite(v))
            {
                return false;
            }
        }
        return true;
    }

    /// <summary>As <see cref="Feed"/> on each lane.</summary>
    private static void FeedLanes(StreamedZeroPhase[] lanes, ReadOnlySpan<double> timesS, ReadOnlySpan<double> v0, ReadOnlySpan<double> v1, ReadOnlySpan<double> v2, ReadOnlySpan<double> v3)
    {
        foreach (var lane in lanes)
        {
            lane._open = true;
            lane._lastS = timesS[^1];
            lane._held += timesS.Length;
        }
        var first = lanes.Select(l => l._passes[0]).ToArray();
        var p = lanes[0];
        if (p._streaming)
        {
            StreamedSectionPass.PushLanes(first, v0, v1, v2, v3);
            return;
        }
        if (p._segmentStart.Count == 0 && v0.Length > p._minimumPad)
        {
            // As Feed: a first input longer than the pad goes on where it is.
            foreach (var lane in lanes)
            {
                lane._streaming = true;
            }
            StreamedSectionPass.PushLanes(first, v0, v1, v2, v3);
            return;
        }
        lanes[0]._segmentStart.AddRange(v0);
        lanes[1]._segmentStart.AddRange(v1);
        lanes[2]._segmentStart.AddRange(v2);
        lanes[3]._segmentStart.AddRange(v3);
        if (p._segmentStart.Count > p._minimumPad)
        {
            foreach (var lane in lanes)
            {
                lane._streaming = true;
            }
            StreamedSectionPass.PushLanes(first, CollectionsMarshal.AsSpan(lanes[0]._segmentStart), CollectionsMarshal.AsSpan(lanes[1]._segmentStart),
                CollectionsMarshal.AsSpan(lanes[2]._segmentStart), CollectionsMarshal.AsSpan(lanes[3]._segmentStart));
            foreach (var lane in lanes)
            {
                lane._segmentStart.Clear();
                lane._segmentStart.Capacity = 0;
            }
        }
    }
}
