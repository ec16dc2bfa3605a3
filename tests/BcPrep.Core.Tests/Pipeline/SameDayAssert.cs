using BcPrep.Pipeline;

namespace BcPrep.Tests.Pipeline;

/// <summary>
/// Two reductions of the same day agree to the bit: detection (accepted and rejected stretches), windows, each
/// channel's statistics and every output's estimate and expanded uncertainty. Shared by the tests that hold a faster
/// or incremental path equal to the plain one (one read against two, the day so far against `process`).
/// </summary>
internal static class SameDayAssert
{
    public static void Points(DayResult expected, DayResult actual)
    {
        Assert.Equal(expected.Detection is null, actual.Detection is null);
        if (expected.Detection is { } expectedDetection && actual.Detection is { } actualDetection)
        {
            Assert.Equal(expectedDetection.Accepted.Select(w => (w.StartS, w.EndS, w.StretchStartS, w.StretchEndS, w.AcceptedBy)), actualDetection.Accepted.Select(w => (w.StartS, w.EndS, w.StretchStartS, w.StretchEndS, w.AcceptedBy)));
            Assert.Equal(expectedDetection.Rejected.Select(r => (r.StartS, r.EndS, r.Reason)), actualDetection.Rejected.Select(r => (r.StartS, r.EndS, r.Reason)));
        }
        Assert.Equal(expected.Points.Select(p => p.Window), actual.Points.Select(p => p.Window));
        for (var i = 0; i < expected.Points.Count; i++)
        {
            foreach (var (channel, reference) in expected.Points[i].Channels)
            {
                var stats = actual.Points[i].Channels[channel];
                Assert.Equal(reference.SampleCount, stats.SampleCount);
                Assert.Equal(reference.SpikesReplaced, stats.SpikesReplaced);
                Assert.Equal(reference.Mean, stats.Mean);
                Assert.Equal(reference.StandardDeviation, stats.StandardDeviation);
                Assert.Equal(reference.TypeA.StandardUncertainty, stats.TypeA.StandardUncertainty);
            }
            Assert.Equal(expected.Points[i].Gum.Outputs.Select(o => (o.Estimate, o.ExpandedUncertainty)), actual.Points[i].Gum.Outputs.Select(o => (o.Estimate, o.ExpandedUncertainty)));
        }
    }
}
