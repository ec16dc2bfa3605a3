using System.Globalization;

namespace BcPrep.Uncertainty;

/// <summary>
/// An accuracy specification of the form "±(P % of reading + F % of full scale + A)", the way data sheets
/// state it. The terms are added linearly to one half-width a, exactly as the sheet states the limit (not
/// root-sum-squared: the sheet promises the sum as the bound). The half-width becomes a standard uncertainty
/// through <see cref="Interpretation"/>: by default a rectangular limit, u = a/√3 (GUM 4.3.7; reading a bare
/// spec figure as a rectangular bound is "common practice"), or an expanded uncertainty, u = a/k.
/// </summary>
/// <param name="PercentOfReading">P, in percent of |reading|, ≥ 0.</param>
/// <param name="PercentOfFullScale">F, in percent of <paramref name="FullScale"/>, ≥ 0.</param>
/// <param name="FullScale">Full-scale span in the quantity's SI unit, ≥ 0.</param>
/// <param name="AbsoluteTerm">A, in the quantity's SI unit, ≥ 0 (e.g. an offset or a 1-digit term).</param>
/// <param name="Interpretation">How the summed figure becomes a standard uncertainty.</param>
/// <param name="CoverageFactor">k for <see cref="SpecInterpretation.ExpandedUncertainty"/> (ignored otherwise).</param>
public sealed record InstrumentSpec(
    double PercentOfReading = 0.0,
    double PercentOfFullScale = 0.0,
    double FullScale = 0.0,
    double AbsoluteTerm = 0.0,
    SpecInterpretation Interpretation = SpecInterpretation.RectangularLimits,
    double CoverageFactor = 2.0)
{
    /// <summary>Half-width a = |reading|·P/100 + FullScale·F/100 + A (same unit as the reading).</summary>
    /// <exception cref="BcPrepDataException">Negative or non-finite terms, or a non-finite reading.</exception>
    public double HalfWidthAt(double reading)
    {
        Validate();
        if (!double.IsFinite(reading))
        {
            throw new BcPrepDataException($"Spec evaluated at a non-finite reading {reading}.");
        }

        return Math.Abs(reading) * PercentOfReading / 100.0 + FullScale * PercentOfFullScale / 100.0 + AbsoluteTerm;
    }

    /// <summary>Standard uncertainty at a reading: a/√3 (rectangular limits) or a/k (expanded uncertainty).</summary>
    public double StandardUncertaintyAt(double reading)
    {
        var a = HalfWidthAt(reading);
        return Interpretation == SpecInterpretation.RectangularLimits
            ? TypeB.FromRectangularHalfWidth(a)
            : TypeB.FromCertificate(a, CoverageFactor);
    }

    /// <summary>
    /// A Type B input at the given reading; ν = +∞ unless given (bounds taken as certain, GUM G.4.2), distribution
    /// rectangular or normal to match <see cref="Interpretation"/>, source text spelling out the spec terms.
    /// </summary>
    public UncertaintyInput ToInput(string name, double reading, double degreesOfFreedom = double.PositiveInfinity) =>
        new(name, reading, StandardUncertaintyAt(reading), degreesOfFreedom,
            Interpretation == SpecInterpretation.RectangularLimits ? DistributionKind.Rectangular : DistributionKind.Normal,
            EvaluationType.TypeB, Describe());

    /// <summary>Human-readable statement of the spec, e.g. "spec ±(0.05 % of reading + 0.1 % of FS 1000 + 0.2), rectangular".</summary>
    public string Describe()
    {
        var terms = new List<string>();
        if (PercentOfReading != 0.0)
        {
            terms.Add(string.Create(CultureInfo.InvariantCulture, $"{PercentOfReading:G} % of reading"));
        }

        if (PercentOfFullScale != 0.0)
        {
            terms.Add(string.Create(CultureInfo.InvariantCulture, $"{PercentOfFullScale:G} % of FS {FullScale:G}"));
        }

        if (AbsoluteTerm != 0.0 || terms.Count == 0)
        {
            terms.Add(AbsoluteTerm.ToString("G", CultureInfo.InvariantCulture));
        }

        var reading = Interpretation == SpecInterpretation.RectangularLimits
            ? "rectangular limits"
            : string.Create(CultureInfo.InvariantCulture, $"expanded, k = {CoverageFactor:G}");
        return $"spec ±({string.Join(" + ", terms)}), {reading}";
    }

    private void Validate()
    {
        Check(PercentOfReading, nameof(PercentOfReading));
        Check(PercentOfFullScale, nameof(PercentOfFullScale));
        Check(FullScale, nameof(FullScale));
        Check(AbsoluteTerm, nameof(AbsoluteTerm));
        if (PercentOfFullScale != 0.0 && FullScale == 0.0)
        {
            throw new BcPrepDataException("Spec gives a % of full scale term but FullScale is 0.");
        }

        static void Check(double value, string what)
        {
            if (!double.IsFinite(value) || value < 0.0)
            {
                throw new BcPrepDataException($"Spec term {what} = {value} must be finite and ≥ 0.");
            }
        }
    }
}
