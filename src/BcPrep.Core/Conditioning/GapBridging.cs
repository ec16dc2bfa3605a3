using System.Globalization;

namespace BcPrep.Conditioning;

/// <summary>
/// One gap between two valid samples. <see cref="StartS"/> is the time of the last valid sample before it and
/// <see cref="EndS"/> the first valid one after (at a record edge: the first / last missing cell's time).
/// <see cref="MissingSamples"/> counts non-finite cells plus samples absent from a time jump (at the nominal interval).
/// </summary>
public readonly record struct DataGap(double StartS, double EndS, int MissingSamples, bool Bridged, bool AtRecordEdge)
{
    /// <summary>EndS − StartS.</summary>
    public double DurationS => EndS - StartS;
}

/// <summary>What <see cref="GapBridging.Bridge(ReadOnlySpan{double}, ReadOnlySpan{double}, double)"/> found and changed.</summary>
public sealed record GapReport(
    double NominalIntervalS,
    int NonFiniteCells,
    int TimeJumps,
    int InsertedSamples,
    int InterpolatedSamples,
    IReadOnlyList<DataGap> Gaps)
{
    /// <summary>Gaps that were bridged by interpolation.</summary>
    public IEnumerable<DataGap> Bridged => Gaps.Where(g => g.Bridged);

    /// <summary>Gaps left open (too long, or at a record edge where interpolation would be extrapolation).</summary>
    public IEnumerable<DataGap> Unbridged => Gaps.Where(g => !g.Bridged);
}

/// <summary>Series after gap bridging: new time axis (s), values, and a per-sample flag for interpolated values.</summary>
public sealed record GapBridgeResult(double[] TimesS, double[] Values, bool[] Interpolated, GapReport Report);

/// <summary>Finds and bridges short gaps in a sampled channel.</summary>
public static class GapBridging
{
    /// <summary>A time step above this multiple of the nominal interval is a time jump.</summary>
    public const double JumpFactor = 1.5;

    /// <summary>
    /// Nominal interval = median of the time steps. A gap lies between two consecutive valid (finite) samples a, b
    /// when cells between them are NaN/∞ or t_b − t_a &gt; 1.5·nominal. Gaps with t_b − t_a ≤
    /// <paramref name="maxBridgeS"/> are bridged: NaN cells keep their time stamps, each time jump inside the gap gets
    /// round(Δt/nominal) − 1 evenly spaced new samples, and all of them take the straight line between (t_a, x_a)
    /// and (t_b, x_b). Longer gaps, and missing cells at the record edges (no extrapolation), stay as they are
    /// (NaN cells stay NaN, jumps stay jumps) and are reported. Cost O(n); one copy of the time steps for the median.
    /// </summary>
    /// <exception cref="BcPrepDataException">Lengths differ, fewer than 2 samples, a non-finite or non-increasing
    /// time stamp, or maxBridgeS negative/NaN.</exception>
    public static GapBridgeResult Bridge(ReadOnlySpan<double> timesS, ReadOnlySpan<double> values, double maxBridgeS) =>
        Bridge(timesS, values, maxBridgeS, null, null);

    /// <summary>
    /// As <see cref="Bridge(ReadOnlySpan{double}, ReadOnlySpan{double}, double)"/>, but when nothing is bridged the
    /// result holds <paramref name="timesS"/> and <paramref name="values"/> themselves instead of copies: a window of
    /// a long, clean record is not copied just to be read.
    /// </summary>
    public static GapBridgeResult Bridge(double[] timesS, double[] values, double maxBridgeS)
    {
        ArgumentNullException.ThrowIfNull(timesS);
        ArgumentNullException.ThrowIfNull(values);
        return Bridge(timesS, values, maxBridgeS, timesS, values);
    }

    private static GapBridgeResult Bridge(ReadOnlySpan<double> timesS, ReadOnlySpan<double> values, double maxBridgeS, double[]? sameTimes, double[]? sameValues)
    {
        Validate(timesS, values, maxBridgeS);
        double nominal = NominalInterval(timesS);
        double jumpS = JumpFactor * nominal;

        var gaps = new List<DataGap>();
        int nonFinite = 0, jumps = 0;
        for (int i = 1; i < timesS.Length; i++)
        {
            if (timesS[i] - timesS[i - 1] > jumpS)
            {
                jumps++;
            }
        }

        int previousValid = -1;
        var bridgedPairs = new List<(int A, int B)>();
        for (int i = 0; i < values.Length; i++)
        {
            if (!double.IsFinite(values[i]))
            {
                nonFinite++;
                continue;
            }

            if (previousValid < 0 && i > 0)
            {
                gaps.Add(new DataGap(timesS[0], timesS[i - 1], i, false, true));
            }
            else if (previousValid >= 0 && (i > previousValid + 1 || timesS[i] - timesS[previousValid] > jumpS))
            {
                double duration = timesS[i] - timesS[previousValid];
                int missing = MissingInside(timesS, previousValid, i, nominal, jumpS);
                bool bridge = duration <= maxBridgeS;
                gaps.Add(new DataGap(timesS[previousValid], timesS[i], missing, bridge, false));
                if (bridge)
                {
                    bridgedPairs.Add((previousValid, i));
                }
            }

            previousValid = i;
        }

        if (previousValid < values.Length - 1)
        {
            int first = previousValid + 1;
            gaps.Add(new DataGap(timesS[first], timesS[^1], values.Length - first, false, true));
        }

        if (bridgedPairs.Count == 0 && sameTimes is not null && sameValues is not null)
        {
            var report = new GapReport(nominal, nonFinite, jumps, 0, 0, gaps);
            return new GapBridgeResult(sameTimes, sameValues, new bool[sameValues.Length], report);
        }

        return Assemble(timesS, values, nominal, jumpS, bridgedPairs, gaps, nonFinite, jumps);
    }

    private static GapBridgeResult Assemble(ReadOnlySpan<double> timesS, ReadOnlySpan<double> values, double nominal,
        double jumpS, List<(int A, int B)> bridgedPairs, List<DataGap> gaps, int nonFinite, int jumps)
    {
        int inserted = 0;
        foreach (var (a, b) in bridgedPairs)
        {
            inserted += InsertedInside(timesS, a, b, nominal, jumpS);
        }

        int n = values.Length + inserted;
        var t = new double[n];
        var x = new double[n];
        var flag = new bool[n];
        int interpolated = 0;
        int o = 0, next = 0;
        for (int i = 0; i < values.Length; i++)
        {
            t[o] = timesS[i];
            x[o] = values[i];
            o++;
            if (next < bridgedPairs.Count && bridgedPairs[next].A == i)
            {
                var (a, b) = bridgedPairs[next++];
                for (int j = a + 1; j <= b; j++)
                {
                    int extra = Inserted(timesS[j] - timesS[j - 1], nominal, jumpS);
                    for (int m = 1; m <= extra; m++)
                    {
                        t[o] = timesS[j - 1] + ((timesS[j] - timesS[j - 1]) * m / (extra + 1));
                        x[o] = Line(timesS[a], values[a], timesS[b], values[b], t[o]);
                        flag[o] = true;
                        o++;
                        interpolated++;
                    }

                    if (j < b)
                    {
                        t[o] = timesS[j];
                        x[o] = Line(timesS[a], values[a], timesS[b], values[b], timesS[j]);
                        flag[o] = true;
                        o++;
                        interpolated++;
                    }
                }

                i = b - 1;
            }
        }

        var report = new GapReport(nominal, nonFinite, jumps, inserted, interpolated, gaps);
        return new GapBridgeResult(t, x, flag, report);
    }

    private static double Line(double ta, double xa, double tb, double xb, double t) => xa + ((xb - xa) * (t - ta) / (tb - ta));

    private static int Inserted(double stepS, double nominal, double jumpS) =>
        stepS > jumpS ? Math.Max(0, (int)Math.Round(stepS / nominal) - 1) : 0;

    private static int InsertedInside(ReadOnlySpan<double> timesS, int a, int b, double nominal, double jumpS)
    {
        int count = 0;
        for (int j = a + 1; j <= b; j++)
        {
            count += Inserted(timesS[j] - timesS[j - 1], nominal, jumpS);
        }

        return count;
    }

    private static int MissingInside(ReadOnlySpan<double> timesS, int a, int b, double nominal, double jumpS) =>
        (b - a - 1) + InsertedInside(timesS, a, b, nominal, jumpS);

    private static double NominalInterval(ReadOnlySpan<double> timesS)
    {
        // The selection reorders its input, so it works on a per-thread scratch copy of the steps.
        var steps = ThreadScratch.Rent(ScratchSlots.TimeSteps, timesS.Length - 1);
        for (int i = 1; i < timesS.Length; i++)
        {
            steps[i - 1] = timesS[i] - timesS[i - 1];
        }

        return OrderStatistics.MedianInPlace(steps.AsSpan(0, timesS.Length - 1));
    }

    private static void Validate(ReadOnlySpan<double> timesS, ReadOnlySpan<double> values, double maxBridgeS)
    {
        if (timesS.Length != values.Length)
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"Time stamps ({timesS.Length}) and values ({values.Length}) must have the same length."), nameof(values));
        }

        if (timesS.Length < 2)
        {
            throw new BcPrepDataException("Gap search needs at least 2 samples.");
        }

        if (!(maxBridgeS >= 0.0))
        {
            throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                $"Maximum bridged gap {maxBridgeS} s must be zero or positive."));
        }

        for (int i = 0; i < timesS.Length; i++)
        {
            if (!double.IsFinite(timesS[i]) || (i > 0 && timesS[i] <= timesS[i - 1]))
            {
                throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                    $"Time stamp {i} ({timesS[i]} s) is not finite or not after the previous one; time must increase strictly."));
            }
        }
    }
}
