using System.CommandLine;

namespace BcPrep.Cli.Output;

/// <summary>
/// Rows of data for standard output, written as CSV (the default) or as JSON lines (<c>--json</c>: one object per
/// row, keys = column names). A command describes its rows once through this class, so every data-printing command
/// offers both forms with the same columns and the same numbers (round-trip "R" format, invariant culture).
/// Usage: <see cref="Header"/> once, then per row <see cref="Number"/>/<see cref="Text"/>/<see cref="Empty"/> for each
/// column in header order and <see cref="EndRow"/>; <see cref="Flush"/> hands buffered rows to the writer.
/// </summary>
public abstract class TabularOutput
{
    /// <summary>The <c>--json</c> option; add it to each command that prints rows.</summary>
    public static Option<bool> JsonOption() => new("--json") { Description = "Write JSON lines (one object per row, keys = column names) instead of CSV." };

    public static TabularOutput Create(TextWriter output, bool json) => json ? new JsonLinesOutput(output) : new CsvOutput(output);

    /// <summary>Starts the table; the column names become the CSV header or the JSON keys.</summary>
    public abstract void Header(IReadOnlyList<string> columns);

    /// <summary>A number cell; NaN and infinities are empty (CSV) or null (JSON), since neither form has them.</summary>
    public abstract void Number(double value);

    public abstract void Text(string value);

    /// <summary>A cell with no value: empty in CSV, null in JSON.</summary>
    public abstract void Empty();

    /// <summary>Ends the row; throws when the row has a different number of cells than the header.</summary>
    public abstract void EndRow();

    /// <summary>Writes the buffered rows to the output writer (call once per block of rows, and at the end).</summary>
    public abstract void Flush();
}
