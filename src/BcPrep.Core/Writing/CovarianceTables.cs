using System.Text.Json;
using BcPrep.Pipeline;
using BcPrep.Uncertainty;

namespace BcPrep.Writing;

/// <summary>
/// The GUM covariance of a point's scalar boundary-condition quantities, for a simulation's own uncertainty
/// analysis: as a long CSV (one row per pair), as a square CSV matrix, and inside the manifest. It comes from the
/// same inputs and sensitivities as every u written elsewhere, so u(y_i) = √U_ii everywhere. Profile points are
/// left out unless asked for (they are many, and each is ṁ-scaled, so nearly perfectly correlated).
/// </summary>
public static class CovarianceTables
{
    /// <summary>The covariance of the point's scalars (and profile points when <paramref name="includeProfile"/>).</summary>
    public static OutputCovariance Of(PointResult point, bool includeProfile = false)
    {
        ArgumentNullException.ThrowIfNull(point);
        return OutputCovariance.Select(point.Gum, name => includeProfile || !ProfileOutputs.IsProfilePoint(name));
    }

    /// <summary>One row per ordered pair (i, j), both triangles, per point: covariance in unit_i·unit_j and correlation.</summary>
    public static CsvTable Long(IEnumerable<PointResult> points, bool includeProfile = false)
    {
        var table = new CsvTable(["point", "quantity_1", "quantity_2", "covariance_unit", "covariance", "correlation"])
            .Comment("BcPrep output covariance (GUM, U_y = J U_x J^T); covariance in the product of the two quantities' SI units; correlation empty where a standard uncertainty is zero");
        foreach (var point in points)
        {
            var c = Of(point, includeProfile);
            for (var i = 0; i < c.Size; i++)
            {
                for (var j = 0; j < c.Size; j++)
                {
                    table.Add(point.Id, c.Names[i], c.Names[j], ProductUnit(UnitOf(point, c.Names[i]), UnitOf(point, c.Names[j])), c.Covariance[i, j], c.Correlation(i, j));
                }
            }
        }

        return table;
    }

    /// <summary>
    /// A square matrix per point, stacked: columns are the union of the points' quantities (a point that lacks one
    /// leaves its cells empty). Entries are covariances (unit of row × unit of column) or, with
    /// <paramref name="correlation"/>, correlation coefficients.
    /// </summary>
    public static CsvTable Matrix(IReadOnlyList<PointResult> points, bool correlation, bool includeProfile = false)
    {
        var perPoint = points.Select(p => (Point: p, Covariance: Of(p, includeProfile))).ToList();
        var names = perPoint.SelectMany(p => p.Covariance.Names).Distinct(StringComparer.Ordinal).ToList();
        var units = names.Select(n => points.Select(p => UnitOf(p, n)).FirstOrDefault(u => u.Length > 0) ?? "").ToList();
        var header = new List<string> { "point", "quantity", "unit" };
        header.AddRange(names.Select((n, i) => $"{n} [{units[i]}]"));
        var table = new CsvTable(header)
            .Comment(correlation
                ? "BcPrep output correlation matrix (GUM); r = U_ij / (u_i u_j), empty where undefined"
                : "BcPrep output covariance matrix (GUM, U_y = J U_x J^T); entry in (unit of the row) x (unit of the column)");
        foreach (var (point, c) in perPoint)
        {
            foreach (var rowName in names)
            {
                var i = c.IndexOf(rowName);
                if (i < 0)
                {
                    continue;
                }

                var row = new List<object?> { point.Id, rowName, UnitOf(point, rowName) };
                foreach (var columnName in names)
                {
                    var j = c.IndexOf(columnName);
                    row.Add(j < 0 ? double.NaN : correlation ? c.Correlation(i, j) : c.Covariance[i, j]);
                }

                table.Add([.. row]);
            }
        }

        return table;
    }

    /// <summary>Writes "covariance": {quantities, units, matrix, correlation} into the point object of the manifest.</summary>
    public static void WriteManifest(Utf8JsonWriter json, PointResult point)
    {
        ArgumentNullException.ThrowIfNull(json);
        var c = Of(point);
        json.WriteStartObject("covariance");
        json.WriteString("basis", "GUM U_y = J U_x J^T of the scalar quantities (profile points excluded); entry (i, j) in unit_i x unit_j");
        json.WriteStartArray("quantities");
        foreach (var name in c.Names)
        {
            json.WriteStringValue(name);
        }

        json.WriteEndArray();
        json.WriteStartArray("units");
        foreach (var name in c.Names)
        {
            json.WriteStringValue(UnitOf(point, name));
        }

        json.WriteEndArray();
        WriteMatrix(json, "matrix", c.Size, (i, j) => c.Covariance[i, j]);
        WriteMatrix(json, "correlation", c.Size, c.Correlation);
        json.WriteEndObject();
    }

    private static void WriteMatrix(Utf8JsonWriter json, string name, int size, Func<int, int, double> entry)
    {
        json.WriteStartArray(name);
        for (var i = 0; i < size; i++)
        {
            json.WriteStartArray();
            for (var j = 0; j < size; j++)
            {
                var value = entry(i, j);
                if (double.IsFinite(value))
                {
                    json.WriteNumberValue(value);
                }
                else
                {
                    json.WriteNullValue();
                }
            }

            json.WriteEndArray();
        }

        json.WriteEndArray();
    }

    private static string UnitOf(PointResult point, string name) =>
        point.Model.Outputs.FirstOrDefault(o => o.Name == name)?.Unit ?? "";

    /// <summary>"Pa" x "Pa" = "Pa^2", "kg/s" x "K" = "(kg/s)*K"; the dimensionless "1" drops out.</summary>
    private static string ProductUnit(string a, string b) => (a, b) switch
    {
        ("1", _) => b,
        (_, "1") => a,
        _ when a == b => Grouped(a) + "^2",
        _ => Grouped(a) + "*" + Grouped(b),
    };

    private static string Grouped(string unit) => unit.All(char.IsAsciiLetter) ? unit : "(" + unit + ")";
}
