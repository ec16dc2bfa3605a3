namespace BcPrep.Tools.Scorecard.Coverage;

/// <summary>One written value against its truth: covered when |value − truth| ≤ the half-width of its interval.</summary>
/// <param name="StandardUncertainty">The u written beside the value, for the normalised error (value − truth)/u.</param>
public sealed record CoverageTrial(string Quantity, double Value, double HalfWidth, double Truth, double StandardUncertainty)
{
    /// <summary>(value − truth)/u: for an honest u its spread across trials is about 1.</summary>
    public double NormalisedError => (Value - Truth) / StandardUncertainty;

    public bool Covered => Math.Abs(Value - Truth) <= HalfWidth;

    /// <summary>The error in units of the half-width: |value − truth| / half-width (above 1 = not covered).</summary>
    public double Ratio => Math.Abs(Value - Truth) / HalfWidth;
}

/// <summary>Counts of covered trials per quantity, and the coverage with its binomial standard error.</summary>
public sealed class CoverageTally
{
    private readonly SortedDictionary<string, (int Covered, int Total)> _counts = new(StringComparer.Ordinal);
    private readonly Dictionary<string, (double Sum, double SumOfSquares)> _errors = new(StringComparer.Ordinal);

    public void Add(CoverageTrial trial)
    {
        ArgumentNullException.ThrowIfNull(trial);
        _counts.TryGetValue(trial.Quantity, out var c);
        _counts[trial.Quantity] = (c.Covered + (trial.Covered ? 1 : 0), c.Total + 1);
        _errors.TryGetValue(trial.Quantity, out var e);
        var z = trial.NormalisedError;
        _errors[trial.Quantity] = (e.Sum + z, e.SumOfSquares + (z * z));
    }

    /// <summary>
    /// Mean and root mean square of (value − truth)/u over a quantity's trials: a mean far from 0 is a bias the
    /// budget does not know of; an RMS well above 1 an understated u, well below 1 an overstated one.
    /// </summary>
    public (double Mean, double Rms) NormalisedErrors(string quantity)
    {
        var n = Count(quantity).Total;
        return n == 0 || !_errors.TryGetValue(quantity, out var e) ? (double.NaN, double.NaN) : (e.Sum / n, Math.Sqrt(e.SumOfSquares / n));
    }

    public IEnumerable<string> Quantities => _counts.Keys;

    public (int Covered, int Total) Count(string quantity) => _counts.TryGetValue(quantity, out var c) ? c : (0, 0);

    public (int Covered, int Total) Overall => (_counts.Values.Sum(c => c.Covered), _counts.Values.Sum(c => c.Total));

    /// <summary>Covered / total; NaN with no trials.</summary>
    public static double Fraction((int Covered, int Total) count) => count.Total == 0 ? double.NaN : (double)count.Covered / count.Total;

    /// <summary>
    /// Standard error of a coverage fraction p from n independent trials, √(p(1 − p)/n) (binomial); at the nominal
    /// 95 % and n = 300 it is 1.3 %, so 90 % lies nearly 4 standard errors away.
    /// </summary>
    public static double StandardError(double fraction, int total) => total == 0 ? double.NaN : Math.Sqrt(fraction * (1.0 - fraction) / total);
}
