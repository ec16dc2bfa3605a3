using System.Globalization;
using BcPrep.Profiles;

namespace BcPrep.Reading;

/// <summary>
/// Reads the points of an inlet face: one point per line as x, y, z separated by commas, semicolons, tabs or
/// spaces. Blank lines and lines starting with '#' are skipped, and so is a first line that does not start with
/// a number (a header). Values are multiplied by <c>unitToM</c>. A malformed line fails with its line number.
/// </summary>
public static class FacePointsReader
{
    private static readonly char[] Separators = [',', ';', '\t', ' '];

    public static IReadOnlyList<Point3> Read(TextReader text, double unitToM, string fileName)
    {
        ArgumentNullException.ThrowIfNull(text);
        var points = new List<Point3>();
        var lineNumber = 0;
        var seenData = false;
        while (text.ReadLine() is { } line)
        {
            lineNumber++;
            var trimmed = line.Trim();
            if (trimmed.Length == 0 || trimmed.StartsWith('#'))
            {
                continue;
            }
            var cells = trimmed.Split(Separators, StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries);
            var numbers = cells.Select(c => double.TryParse(c, NumberStyles.Float, CultureInfo.InvariantCulture, out var v) ? v : (double?)null).ToList();
            if (!seenData && numbers.Count > 0 && numbers[0] is null)
            {
                seenData = true; // a header line
                continue;
            }
            seenData = true;
            if (numbers.Count != 3 || numbers.Any(n => n is null || !double.IsFinite(n.Value)))
            {
                throw new BcPrepFailure(FailureKind.InputData, new SourceLocation(fileName, lineNumber),
                    $"expected three numbers x, y, z (invariant culture, '.' as decimal point), found '{trimmed}'");
            }
            points.Add(new Point3(numbers[0]!.Value * unitToM, numbers[1]!.Value * unitToM, numbers[2]!.Value * unitToM));
        }
        if (points.Count == 0)
        {
            throw new BcPrepFailure(FailureKind.InputData, new SourceLocation(fileName), "the face points file holds no points");
        }
        return points;
    }
}
