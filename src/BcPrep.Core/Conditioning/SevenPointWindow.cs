namespace BcPrep.Conditioning;

/// <summary>Median and median absolute deviation of seven finite values by a sorting network (16 compare-exchanges).</summary>
internal static class SevenPointWindow
{
    public const int HalfWindow = 3;

    /// <summary>
    /// Sorts the seven values with a minimal network, takes m = s₃, and the MAD as the fourth smallest of the seven
    /// |sⱼ − m|. One of those is |s₃ − m| = 0 and the rest form two ascending triples, below (m − s₂, m − s₁, m − s₀)
    /// and above (s₄ − m, s₅ − m, s₆ − m), so the MAD is the third smallest of their merge:
    /// min(b₃, max(a₁, b₂), max(a₂, b₁), a₃).
    /// </summary>
    public static (double Median, double Mad) MedianAndMad(ReadOnlySpan<double> seven)
    {
        double s0 = seven[0], s1 = seven[1], s2 = seven[2], s3 = seven[3], s4 = seven[4], s5 = seven[5], s6 = seven[6];
        Exchange(ref s0, ref s6);
        Exchange(ref s2, ref s3);
        Exchange(ref s4, ref s5);
        Exchange(ref s0, ref s2);
        Exchange(ref s1, ref s4);
        Exchange(ref s3, ref s6);
        Exchange(ref s0, ref s1);
        Exchange(ref s2, ref s5);
        Exchange(ref s3, ref s4);
        Exchange(ref s1, ref s2);
        Exchange(ref s4, ref s6);
        Exchange(ref s2, ref s3);
        Exchange(ref s4, ref s5);
        Exchange(ref s1, ref s2);
        Exchange(ref s3, ref s4);
        Exchange(ref s5, ref s6);

        double m = s3;
        double a1 = m - s2, a2 = m - s1, a3 = m - s0;
        double b1 = s4 - m, b2 = s5 - m, b3 = s6 - m;
        double mad = Math.Min(Math.Min(b3, a3), Math.Min(Math.Max(a1, b2), Math.Max(a2, b1)));
        return (m, mad);
    }

    private static void Exchange(ref double low, ref double high)
    {
        double min = Math.Min(low, high);
        high = Math.Max(low, high);
        low = min;
    }
}
