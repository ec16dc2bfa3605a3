namespace BcPrep.Live;

/// <summary>
/// The settling estimate the follower uses. Until the first-order fit of the steady-state detection is wired in,
/// no approach is estimated and every key channel reads as moving.
/// </summary>
public static class LiveSettling
{
    public static ISettlingEstimator Estimator { get; } = new NoEstimate();

    private sealed class NoEstimate : ISettlingEstimator
    {
        public SettlingView? Estimate(ReadOnlySpan<double> timesS, ReadOnlySpan<double> values, double stepTimeS, double nowS, double toleranceSi) => null;
    }
}
