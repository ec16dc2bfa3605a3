using System.Globalization;
using System.Text.RegularExpressions;
using BcPrep.Rig;

namespace BcPrep.Lab;

/// <summary>
/// Reads a test-matrix CSV: a header row <c>point,mass_flow [kg/s],tolerance_mass_flow [kg/s],…</c>, then one row
/// per planned point. Lines starting with '#' and blank lines are skipped; fields are separated by commas and
/// may not be quoted. Units stand in the header in brackets and are converted by <see cref="UnitText"/>; a cell
/// may carry its own unit instead ("150 degF"). A tolerance in "%" is relative to the planned value. A column
/// named <c>comment</c> or <c>note</c> is free text. Every problem is reported with file, line, column and header.
/// </summary>
public static partial class TestMatrixReader
{
    public const string NameColumn = "point";
    public const string TolerancePrefix = "tolerance_";
    private static readonly string[] FreeTextColumns = ["comment", "note"];

    /// <summary>Parses the matrix. Throws <see cref="BcPrepFailure"/> (Configuration) listing every problem.</summary>
    public static TestMatrix Parse(string text, string fileName, RigDescription rig)
    {
        var problems = new List<Problem>();
        var lines = text.Replace("\r\n", "\n", StringComparison.Ordinal).Split('\n');
        var headerIndex = Array.FindIndex(lines, l => l.Trim().Length > 0 && !l.TrimStart().StartsWith('#'));
        if (headerIndex < 0)
        {
            throw new BcPrepFailure(FailureKind.Configuration, new SourceLocation(fileName, 1), "the test matrix has no header row (e.g. \"point,mass_flow [kg/s],tolerance_mass_flow [kg/s]\")");
        }
        var header = ReadHeader(Fields(lines[headerIndex]), fileName, headerIndex + 1, rig, problems);
        var rows = new List<MatrixRow>();
        for (var i = headerIndex + 1; i < lines.Length; i++)
        {
            if (lines[i].Trim().Length == 0 || lines[i].TrimStart().StartsWith('#'))
            {
                continue;
            }
            if (ReadRow(Fields(lines[i]), header, fileName, i + 1, problems) is { } row)
            {
                if (rows.FirstOrDefault(r => r.Name == row.Name) is { } earlier)
                {
                    problems.Add(new Problem(row.Location, $"point name '{row.Name}' is used twice (first on line {earlier.Location.Line})"));
                }
                rows.Add(row);
            }
        }
        if (problems.Count == 0 && rows.Count == 0)
        {
            problems.Add(new Problem(new SourceLocation(fileName, headerIndex + 1), "the test matrix has a header but no point rows"));
        }
        if (problems.Count > 0)
        {
            throw new BcPrepFailure(FailureKind.Configuration, problems);
        }
        return new TestMatrix(fileName, header.Planned.Select(p => new PlannedQuantity(p.Name, p.Dimension)).ToList(), rows);
    }

    private sealed record Field(string Text, int Column);

    private sealed record ValueColumn(string Name, Dimension Dimension, string? Unit, int Index, int ToleranceIndex, string? ToleranceUnit);

    private sealed record Header(int NameIndex, IReadOnlyList<ValueColumn> Planned, IReadOnlyList<Field> Fields);

    private static List<Field> Fields(string line)
    {
        var fields = new List<Field>();
        var start = 0;
        for (var i = 0; i <= line.Length; i++)
        {
            if (i == line.Length || line[i] == ',')
            {
                var raw = line[start..i];
                var lead = raw.Length - raw.TrimStart().Length;
                fields.Add(new Field(raw.Trim(), start + lead + 1));
                start = i + 1;
            }
        }
        return fields;
    }

    [GeneratedRegex(@"^(?<name>[^\[\]]+?)\s*(\[(?<unit>[^\[\]]*)\])?$")]
    private static partial Regex HeaderCell();

    private static Header ReadHeader(List<Field> fields, string file, int line, RigDescription rig, List<Problem> problems)
    {
        var nameIndex = -1;
        var values = new Dictionary<string, (Dimension Dimension, string? Unit, int Index, Field Field)>(StringComparer.Ordinal);
        var tolerances = new Dictionary<string, (string? Unit, int Index, Field Field)>(StringComparer.Ordinal);
        var seen = new HashSet<string>(StringComparer.Ordinal);
        for (var i = 0; i < fields.Count; i++)
        {
            var field = fields[i];
            var at = new SourceLocation(file, line, field.Column, field.Text);
            var match = HeaderCell().Match(field.Text);
            if (!match.Success)
            {
                problems.Add(new Problem(at, "a header cell must be a name with an optional unit in brackets, e.g. \"mass_flow [kg/s]\""));
                continue;
            }
            var name = match.Groups["name"].Value.Trim();
            var unit = match.Groups["unit"].Success ? match.Groups["unit"].Value.Trim() : null;
            if (!seen.Add(name))
            {
                problems.Add(new Problem(at, $"column '{name}' appears twice"));
                continue;
            }
            if (name == NameColumn)
            {
                nameIndex = i;
            }
            else if (FreeTextColumns.Contains(name))
            {
                continue;
            }
            else if (name.StartsWith(TolerancePrefix, StringComparison.Ordinal))
            {
                tolerances[name[TolerancePrefix.Length..]] = (unit, i, field);
            }
            else if (PlannableQuantities.DimensionOf(name, rig) is { } dimension)
            {
                values[name] = (dimension, unit, i, field);
            }
            else
            {
                problems.Add(new Problem(at, $"'{name}' is no quantity the matrix can plan{TableReader.Suggest(name, PlannableQuantities.Names(rig))} (an output such as mass_flow, heater_power, inlet.temperature, or a channel id)"));
            }
        }
        if (nameIndex < 0)
        {
            problems.Add(new Problem(new SourceLocation(file, line, 1), $"the header has no '{NameColumn}' column naming each planned point"));
        }
        var planned = new List<ValueColumn>();
        foreach (var (name, (dimension, unit, index, field)) in values)
        {
            CheckUnit(unit, dimension, false, new SourceLocation(file, line, field.Column, field.Text), problems);
            if (!tolerances.TryGetValue(name, out var tolerance))
            {
                problems.Add(new Problem(new SourceLocation(file, line, field.Column, field.Text), $"column '{name}' has no tolerance column: add '{TolerancePrefix}{name} [{unit ?? UnitText.SiSymbol(dimension)}]' (or [%])"));
                continue;
            }
            CheckUnit(tolerance.Unit, ToleranceDimension(dimension), true, new SourceLocation(file, line, tolerance.Field.Column, tolerance.Field.Text), problems);
            planned.Add(new ValueColumn(name, dimension, unit, index, tolerance.Index, tolerance.Unit));
        }
        foreach (var (name, tolerance) in tolerances.Where(t => !values.ContainsKey(t.Key)))
        {
            problems.Add(new Problem(new SourceLocation(file, line, tolerance.Field.Column, tolerance.Field.Text), $"tolerance column for '{name}', but no column '{name}' plans it"));
        }
        if (values.Count == 0 && nameIndex >= 0)
        {
            problems.Add(new Problem(new SourceLocation(file, line, 1), "the header plans no quantity (add e.g. \"mass_flow [kg/s],tolerance_mass_flow [kg/s]\")"));
        }
        return new Header(nameIndex, planned.OrderBy(p => p.Index).ToList(), fields);
    }

    private static void CheckUnit(string? unit, Dimension dimension, bool isTolerance, SourceLocation at, List<Problem> problems)
    {
        if (unit is null || (isTolerance && unit == "%") || IsDimensionlessUnit(unit, dimension))
        {
            return;
        }
        if (!UnitText.TryToSi("1 " + unit, dimension, out _, out var error))
        {
            problems.Add(new Problem(at, error));
        }
    }

    private static MatrixRow? ReadRow(List<Field> fields, Header header, string file, int line, List<Problem> problems)
    {
        var rowLocation = new SourceLocation(file, line, 1);
        if (fields.Count > header.Fields.Count)
        {
            problems.Add(new Problem(new SourceLocation(file, line, fields[header.Fields.Count].Column), $"this row has {fields.Count} fields, the header {header.Fields.Count}"));
            return null;
        }
        if (header.NameIndex < 0)
        {
            return null;
        }
        var name = Cell(fields, header.NameIndex)?.Text ?? "";
        if (name.Length == 0)
        {
            problems.Add(new Problem(rowLocation with { Key = NameColumn }, "the row has no point name"));
            return null;
        }
        var before = problems.Count;
        var setPoints = new List<SetPoint>();
        foreach (var column in header.Planned)
        {
            var valueCell = Cell(fields, column.Index);
            var toleranceCell = Cell(fields, column.ToleranceIndex);
            var hasValue = valueCell is { Text.Length: > 0 };
            var hasTolerance = toleranceCell is { Text.Length: > 0 };
            if (!hasValue && !hasTolerance)
            {
                continue; // this point does not plan the quantity
            }
            if (!hasValue || !hasTolerance)
            {
                var missing = hasValue ? TolerancePrefix + column.Name : column.Name;
                problems.Add(new Problem(new SourceLocation(file, line, (valueCell ?? toleranceCell)?.Column ?? 1, missing), $"'{name}' gives {(hasValue ? "a planned value but no tolerance" : "a tolerance but no planned value")} for {column.Name}"));
                continue;
            }
            var planned = ToSi(valueCell!, column.Unit, column.Dimension, file, line, header.Fields[column.Index].Text, problems);
            var tolerance = Tolerance(toleranceCell!, column, planned, file, line, header.Fields[column.ToleranceIndex].Text, problems);
            if (planned is { } p && tolerance is { } t)
            {
                setPoints.Add(new SetPoint(column.Name, p, t));
            }
        }
        if (problems.Count == before && setPoints.Count == 0)
        {
            problems.Add(new Problem(rowLocation with { Key = name }, $"point '{name}' plans no quantity: fill in at least one set point and its tolerance"));
        }
        return problems.Count == before ? new MatrixRow(name, setPoints, rowLocation with { Key = name }) : null;
    }

    private static double? ToSi(Field cell, string? unit, Dimension dimension, string file, int line, string columnText, List<Problem> problems)
    {
        var at = new SourceLocation(file, line, cell.Column, columnText);
        var isBare = double.TryParse(cell.Text, NumberStyles.Float, CultureInfo.InvariantCulture, out var bare);
        if (isBare && IsDimensionlessUnit(unit, dimension))
        {
            return unit == "%" ? bare / 100.0 : bare;
        }
        if (isBare && unit is null)
        {
            problems.Add(new Problem(at, $"{cell.Text} has no unit: give it in the header ([{UnitText.SiSymbol(dimension)}]) or in the cell"));
            return null;
        }
        var text = isBare ? cell.Text + " " + unit : cell.Text;
        if (!UnitText.TryToSi(text, dimension, out var si, out var error) || !double.IsFinite(si))
        {
            problems.Add(new Problem(at, error.Length > 0 ? error : $"'{cell.Text}' is not a finite number"));
            return null;
        }
        return si;
    }

    private static double? Tolerance(Field cell, ValueColumn column, double? plannedSi, string file, int line, string columnText, List<Problem> problems)
    {
        var at = new SourceLocation(file, line, cell.Column, columnText);
        var relative = column.ToleranceUnit == "%" || cell.Text.EndsWith('%');
        double? tolerance;
        if (relative && column.Dimension == Dimension.Temperature)
        {
            problems.Add(new Problem(at, "a temperature tolerance in % depends on the temperature scale: give it in K (or degC)"));
            return null;
        }
        if (relative)
        {
            var number = cell.Text.TrimEnd('%').Trim();
            if (!double.TryParse(number, NumberStyles.Float, CultureInfo.InvariantCulture, out var percent))
            {
                problems.Add(new Problem(at, $"'{cell.Text}' is not a percentage"));
                return null;
            }
            // A relative tolerance scales with the planned value (for temperatures: the absolute temperature in K).
            tolerance = plannedSi is { } p ? percent / 100.0 * Math.Abs(p) : null;
        }
        else
        {
            tolerance = ToSi(cell, column.ToleranceUnit, ToleranceDimension(column.Dimension), file, line, columnText, problems);
        }
        if (tolerance is < 0)
        {
            problems.Add(new Problem(at, "a tolerance must not be negative"));
            return null;
        }
        return tolerance;
    }

    private static Field? Cell(List<Field> fields, int index) => index < fields.Count ? fields[index] : null;

    private static Dimension ToleranceDimension(Dimension dimension) =>
        dimension == Dimension.Temperature ? Dimension.TemperatureDifference : dimension;

    private static bool IsDimensionlessUnit(string? unit, Dimension dimension) =>
        dimension == Dimension.Dimensionless && unit is null or "" or "1" or "-" or "%";
}
