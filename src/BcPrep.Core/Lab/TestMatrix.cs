using BcPrep.Rig;

namespace BcPrep.Lab;

/// <summary>
/// The planned operating points of a test day: each row names a point and gives the set points it should reach,
/// each with the tolerance within which a measured point counts as that planned point. Values are SI.
/// </summary>
public sealed record TestMatrix(string SourceFile, IReadOnlyList<PlannedQuantity> Quantities, IReadOnlyList<MatrixRow> Rows);

/// <summary>A quantity the matrix plans: a point-model output name or a channel id, with its dimension.</summary>
public sealed record PlannedQuantity(string Name, Dimension Dimension);

/// <summary>One planned point. <see cref="SetPoints"/> holds only the quantities the row fills in.</summary>
public sealed record MatrixRow(string Name, IReadOnlyList<SetPoint> SetPoints, SourceLocation Location);

/// <summary>A planned value and its tolerance half-width, both in the SI unit of the quantity.</summary>
public sealed record SetPoint(string Quantity, double PlannedSi, double ToleranceSi)
{
    /// <summary>True when <paramref name="measuredSi"/> lies within ±tolerance of the planned value; NaN never does.</summary>
    public bool Admits(double measuredSi) => Math.Abs(measuredSi - PlannedSi) <= ToleranceSi;

    /// <summary>|measured − planned| in tolerances (∞ for a zero tolerance and any deviation; NaN for NaN).</summary>
    public double DeviationInTolerances(double measuredSi)
    {
        var deviation = Math.Abs(measuredSi - PlannedSi);
        return ToleranceSi > 0 ? deviation / ToleranceSi : deviation == 0 ? 0 : double.PositiveInfinity;
    }
}
