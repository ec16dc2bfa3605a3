using System.Globalization;
using BcPrep.Rig;

namespace BcPrep.Lab;

/// <summary>A measured operating point as matching sees it: its id and its measured values (SI) by quantity name.</summary>
/// <remarks><c>ValueOf</c> returns null for a quantity the point does not have.</remarks>
public sealed record MeasuredPoint(string Id, Func<string, double?> ValueOf);

/// <summary>One planned quantity of a matched point: planned, measured, tolerance (SI).</summary>
public sealed record SetPointDeviation(string Quantity, double PlannedSi, double MeasuredSi, double ToleranceSi);

/// <summary>A point matched to a matrix row, with the name it takes (the row's, suffixed "-2", "-3" for repeats).</summary>
public sealed record PointMatch(string PointId, string NewId, MatrixRow Row, IReadOnlyList<SetPointDeviation> Deviations);

/// <summary>The outcome of matching: matched points, points no row admits, rows no point reached, and warnings.</summary>
public sealed record MatrixReport(
    string SourceFile,
    IReadOnlyList<PointMatch> Matches,
    IReadOnlyList<string> UnmatchedPoints,
    IReadOnlyList<MatrixRow> RowsWithoutPoint,
    IReadOnlyList<string> Warnings)
{
    /// <summary>The id a point carries after matching (its own id when unmatched).</summary>
    public string NewIdOf(string pointId) => Matches.FirstOrDefault(m => m.PointId == pointId)?.NewId ?? pointId;
}

/// <summary>
/// Matches measured operating points to the rows of a test matrix. A row admits a point when every set point the
/// row fills in lies within its tolerance of the point's measured value. One admitting row: the point takes the
/// row's name. Several admitting rows: the matrix's tolerance bands overlap at that point and any name would be
/// a guess, so this fails (naming the point, the rows and their lines) rather than label boundary conditions
/// wrongly. A row admitting several points (a repeat) names them in the order given: NAME, NAME-2, NAME-3.
/// Points no row admits keep their ids and rows no point reached are reported, both as warnings.
/// </summary>
public static class MatrixMatching
{
    /// <summary>Matches <paramref name="points"/> (in time order) against <paramref name="matrix"/>.</summary>
    /// <exception cref="BcPrepFailure">Configuration: a point admitted by two rows, or two points ending with one id.</exception>
    public static MatrixReport Match(TestMatrix matrix, IReadOnlyList<MeasuredPoint> points)
    {
        var matches = new List<PointMatch>();
        var unmatched = new List<string>();
        var warnings = new List<string>();
        var problems = new List<Problem>();
        var used = new HashSet<string>(matrix.Rows.Select(r => r.Name), StringComparer.Ordinal);
        var timesUsed = new Dictionary<string, int>(StringComparer.Ordinal);
        foreach (var point in points)
        {
            var admitting = matrix.Rows.Where(r => r.SetPoints.All(s => point.ValueOf(s.Quantity) is { } v && s.Admits(v))).ToList();
            if (admitting.Count > 1)
            {
                problems.Add(new Problem(admitting[0].Location with { Key = $"point '{point.Id}'" },
                    $"point '{point.Id}' ({Measured(point, admitting[0])}) lies within the tolerances of {admitting.Count} rows: " +
                    string.Join(", ", admitting.Select(r => $"'{r.Name}' (line {r.Location.Line})")) + "; narrow their tolerances so that each point matches one row"));
                continue;
            }
            if (admitting.Count == 0)
            {
                unmatched.Add(point.Id);
                warnings.Add($"point '{point.Id}' matches no row of the test matrix{Nearest(matrix, point)}; it keeps its id");
                continue;
            }
            var row = admitting[0];
            var count = timesUsed[row.Name] = timesUsed.GetValueOrDefault(row.Name) + 1;
            var newId = row.Name;
            if (count > 1)
            {
                newId = Unique(row.Name, count, used);
                warnings.Add($"point '{point.Id}' repeats planned point '{row.Name}' (line {row.Location.Line}); it is named '{newId}'");
            }
            used.Add(newId);
            var deviations = row.SetPoints.Select(s => new SetPointDeviation(s.Quantity, s.PlannedSi, point.ValueOf(s.Quantity)!.Value, s.ToleranceSi)).ToList();
            matches.Add(new PointMatch(point.Id, newId, row, deviations));
        }
        foreach (var id in unmatched.Where(id => matches.Any(m => m.NewId == id)))
        {
            problems.Add(new Problem(new SourceLocation(matrix.SourceFile, Key: $"point '{id}'"), $"unmatched point '{id}' keeps its id, which a matched point now carries; rename the matrix row or the point"));
        }
        if (problems.Count > 0)
        {
            throw new BcPrepFailure(FailureKind.Configuration, problems);
        }
        var missing = matrix.Rows.Where(r => !timesUsed.ContainsKey(r.Name)).ToList();
        warnings.AddRange(missing.Select(r => $"planned point '{r.Name}' ({r.Location}) has no operating point in the logs"));
        return new MatrixReport(matrix.SourceFile, matches, unmatched, missing, warnings);
    }

    private static string Unique(string name, int count, HashSet<string> used)
    {
        var k = count;
        while (used.Contains(string.Create(CultureInfo.InvariantCulture, $"{name}-{k}")))
        {
            k++;
        }
        return string.Create(CultureInfo.InvariantCulture, $"{name}-{k}");
    }

    private static string Measured(MeasuredPoint point, MatrixRow row) =>
        string.Join(", ", row.SetPoints.Select(s => $"{s.Quantity} = {Format(point.ValueOf(s.Quantity))}"));

    // The closest row by its worst set point, so the person sees which plan the point missed and by how much.
    private static string Nearest(TestMatrix matrix, MeasuredPoint point)
    {
        var nearest = matrix.Rows
            .Select(r => (Row: r, Worst: r.SetPoints.Select(s => point.ValueOf(s.Quantity) is { } v ? s.DeviationInTolerances(v) : double.PositiveInfinity).DefaultIfEmpty(0).Max()))
            .Where(c => double.IsFinite(c.Worst))
            .OrderBy(c => c.Worst)
            .FirstOrDefault();
        if (nearest.Row is null)
        {
            return "";
        }
        var quantities = nearest.Row.SetPoints.Select(s => string.Create(CultureInfo.InvariantCulture,
            $"{s.Quantity} = {Format(point.ValueOf(s.Quantity))} (planned {Format(s.PlannedSi)} ± {Format(s.ToleranceSi)})"));
        return string.Create(CultureInfo.InvariantCulture, $" (nearest '{nearest.Row.Name}', line {nearest.Row.Location.Line}, off by {nearest.Worst:0.##} tolerances: {string.Join(", ", quantities)}, SI units)");
    }

    // A message for a person: four significant digits (as the report writes numbers without an uncertainty), through
    // the one formatter of numbers for people.
    private static string Format(double? value) => value is { } v ? MeasurementText.Number(v) : "not measured";
}
