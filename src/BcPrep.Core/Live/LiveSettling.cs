namespace BcPrep.Live;

/// <summary>The settling estimate the follower uses: the steady-state detection's first-order fit.</summary>
public static class LiveSettling
{
    public static ISettlingEstimator Estimator { get; } = new FirstOrderSettling();
}
