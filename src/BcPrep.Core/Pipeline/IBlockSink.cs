namespace BcPrep.Pipeline;

/// <summary>Receives whole calibrated row blocks of one logger (for writers that keep rows together).</summary>
public interface IBlockSink
{
    /// <param name="channels">Channel ids of this logger, in the order of <paramref name="valuesSi"/>.</param>
    /// <param name="timeS">Row times (log clock, s).</param>
    /// <param name="valuesSi">One array per channel; only the first <paramref name="count"/> entries are valid.</param>
    /// <param name="count">Number of valid rows in the block.</param>
    void AcceptBlock(IReadOnlyList<string> channels, double[] timeS, IReadOnlyList<double[]> valuesSi, int count);
}
