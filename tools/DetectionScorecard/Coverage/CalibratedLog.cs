using System.Globalization;
using System.Text;

namespace BcPrep.Tools.Scorecard.Coverage;

/// <summary>
/// Copies a generated day's log (<see cref="LogWriter"/>) with one realisation of the calibration errors put on
/// every sample (<see cref="RawSignals.Apply"/>). Empty cells stay empty, timestamps are copied as they are, and
/// values are written with six decimals, finer than the generator's own resolution.
/// </summary>
public static class CalibratedLog
{
    public static void Write(string sourcePath, string targetPath, CalibrationErrors errors)
    {
        ArgumentNullException.ThrowIfNull(errors);
        var culture = CultureInfo.InvariantCulture;
        using var reader = new StreamReader(sourcePath, Encoding.UTF8, false, 1 << 16);
        using var writer = new StreamWriter(targetPath, false, new UTF8Encoding(false), 1 << 16) { NewLine = "\n" };
        var header = reader.ReadLine() ?? throw new InvalidDataException($"{sourcePath}: empty log");
        if (header != string.Join(',', LogWriter.Columns))
        {
            throw new InvalidDataException($"{sourcePath}: the columns are not the scorecard rig's ({header})");
        }
        writer.Write(header);
        writer.Write('\n');
        var raw = new double[RawSignals.Count];
        var line = new StringBuilder(256);
        while (reader.ReadLine() is { } text)
        {
            var cells = text.Split(',');
            for (var c = 0; c < RawSignals.Count; c++)
            {
                raw[c] = cells[c + 1].Length == 0 ? double.NaN : double.Parse(cells[c + 1], culture);
            }
            RawSignals.Apply(errors, raw);
            line.Clear();
            line.Append(cells[0]);
            for (var c = 0; c < RawSignals.Count; c++)
            {
                line.Append(',');
                if (!double.IsNaN(raw[c]))
                {
                    line.Append(raw[c].ToString("F6", culture));
                }
            }
            writer.Write(line);
            writer.Write('\n');
        }
    }
}
