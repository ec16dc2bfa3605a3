namespace BcPrep.Reading;

/// <summary>
/// A reusable block of consecutive log rows, stored column by column (time plus the requested columns) so that
/// calibration and statistics run as tight loops over arrays. Values are as logged (raw units); an empty or
/// "NaN" cell is <see cref="double.NaN"/> and left to the gap handling.
/// </summary>
public sealed class LogBlock
{
    public LogBlock(int columnCount, int capacity)
    {
        Capacity = capacity;
        TimeS = new double[capacity];
        LineNumbers = new long[capacity];
        Columns = new double[columnCount][];
        for (var i = 0; i < columnCount; i++)
        {
            Columns[i] = new double[capacity];
        }
    }

    public int Capacity { get; }

    public int Count { get; internal set; }

    /// <summary>Byte offset in its file where the block's first row starts (for seeking back to it).</summary>
    public long FirstByteOffset { get; internal set; }

    public double[] TimeS { get; }

    /// <summary>1-based line of each row in its file, for error messages.</summary>
    public long[] LineNumbers { get; }

    public double[][] Columns { get; }
}
