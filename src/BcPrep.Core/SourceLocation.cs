namespace BcPrep;

/// <summary>
/// Where in an input a problem sits: file, 1-based line and column when known, and the rig-file key or log
/// column that carries the bad value. Rendered as <c>file:line:column: key</c> so editors can jump to it.
/// </summary>
public sealed record SourceLocation(string File, int? Line = null, int? Column = null, string? Key = null)
{
    public override string ToString()
    {
        var text = File;
        if (Line is { } line)
        {
            text += ":" + line.ToString(System.Globalization.CultureInfo.InvariantCulture);
            if (Column is { } column)
            {
                text += ":" + column.ToString(System.Globalization.CultureInfo.InvariantCulture);
            }
        }
        return Key is null ? text : $"{text}: {Key}";
    }
}
