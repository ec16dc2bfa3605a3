namespace BcPrep.Report;

/// <summary>The runs of finite values in a series: where a drawn line may go without crossing a missing value.</summary>
internal static class TraceRuns
{
    /// <summary>Each maximal run of finite values as (first index, length), in order.</summary>
    public static IEnumerable<(int Start, int Length)> Finite(double[] values)
    {
        var start = -1;
        for (var i = 0; i <= values.Length; i++)
        {
            var finite = i < values.Length && double.IsFinite(values[i]);
            if (finite && start < 0)
            {
                start = i;
            }
            else if (!finite && start >= 0)
            {
                yield return (start, i - start);
                start = -1;
            }
        }
    }
}
