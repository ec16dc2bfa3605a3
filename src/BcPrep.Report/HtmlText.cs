using System.Globalization;
using System.Net;
using System.Text;

namespace BcPrep.Report;

/// <summary>Small helpers for writing escaped HTML: every text that comes from a rig file or a log passes through <see cref="Escape"/>.</summary>
internal static class HtmlText
{
    /// <summary>Text escaped for element content and quoted attribute values (&amp;, &lt;, &gt;, quotes).</summary>
    public static string Escape(string? text) => WebUtility.HtmlEncode(text ?? "");

    /// <summary>A number for a person without an uncertainty: four significant digits, as <see cref="MeasurementText.Number"/> writes it; "–" for NaN or infinity.</summary>
    public static string Number(double value) => MeasurementText.Number(value, 4);

    /// <summary>
    /// Escaped text in which a quantity name may wrap after each '.' or '_' (outlet.static_pressure): headers are the
    /// widest words of a table of numbers, and without these break points a table of many quantities runs past the page.
    /// </summary>
    public static string BreakableName(string text) =>
        System.Text.RegularExpressions.Regex.Replace(Escape(text), @"([._])(?=[A-Za-z])", "$1<wbr>");

    /// <summary>Appends a table with a header row; cells are escaped here.</summary>
    public static void Table(StringBuilder html, IReadOnlyList<string> header, IEnumerable<IReadOnlyList<string>> rows, string? cssClass = null)
    {
        html.Append(cssClass is null ? "<table>" : $"<table class=\"{Escape(cssClass)}\">").Append("\n<thead><tr>");
        foreach (var cell in header)
        {
            html.Append("<th>").Append(BreakableName(cell)).Append("</th>");
        }
        html.Append("</tr></thead>\n<tbody>\n");
        var any = false;
        foreach (var row in rows)
        {
            any = true;
            html.Append("<tr>");
            foreach (var cell in row)
            {
                html.Append("<td>").Append(Escape(cell)).Append("</td>");
            }
            html.Append("</tr>\n");
        }
        if (!any)
        {
            html.Append("<tr><td colspan=\"").Append(header.Count.ToString(CultureInfo.InvariantCulture)).Append("\">none</td></tr>\n");
        }
        html.Append("</tbody></table>\n");
    }

    /// <summary>Appends a list, or a paragraph "none" when there is nothing to list.</summary>
    public static void List(StringBuilder html, IEnumerable<string> items, string? cssClass = null)
    {
        var list = items.ToList();
        if (list.Count == 0)
        {
            html.Append("<p>none</p>\n");
            return;
        }
        html.Append(cssClass is null ? "<ul>\n" : $"<ul class=\"{Escape(cssClass)}\">\n");
        foreach (var item in list)
        {
            html.Append("<li>").Append(Escape(item)).Append("</li>\n");
        }
        html.Append("</ul>\n");
    }

    /// <summary>Appends a figure with its image (relative path, alt text, size) and caption.</summary>
    public static void Figure(StringBuilder html, ReportFigure figure, string pathFromPage)
    {
        html.Append("<figure><img src=\"").Append(Escape(pathFromPage)).Append("\" alt=\"").Append(Escape(figure.Caption))
            .Append("\" width=\"").Append(figure.WidthPx.ToString(CultureInfo.InvariantCulture))
            .Append("\" height=\"").Append(figure.HeightPx.ToString(CultureInfo.InvariantCulture)).Append("\">")
            .Append("<figcaption>").Append(Escape(figure.Caption)).Append("</figcaption></figure>\n");
    }
}
