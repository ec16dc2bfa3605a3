using BcPrep.Pipeline;

namespace BcPrep.Lab;

/// <summary>Applies a test matrix to processed points: matches them and gives each matched point the matrix name.</summary>
public static class MatrixNaming
{
    /// <summary>The measured values matching uses: a point-model output by name, else a channel's window mean by id.</summary>
    public static MeasuredPoint Measured(PointResult point) => new(point.Id, name =>
        point.Output(name) is { } output ? output.Estimate
        : point.Channels.TryGetValue(name, out var stats) ? stats.Mean
        : null);

    /// <summary>Matches <paramref name="points"/> to <paramref name="matrix"/> and renames the matched ones; order is kept.</summary>
    public static (IReadOnlyList<PointResult> Points, MatrixReport Report) Apply(TestMatrix matrix, IReadOnlyList<PointResult> points)
    {
        var report = MatrixMatching.Match(matrix, points.Select(Measured).ToList());
        return (points.Select(p => p with { Id = report.NewIdOf(p.Id) }).ToList(), report);
    }
}
