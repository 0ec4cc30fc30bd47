using System.Globalization;
using System.Text;

namespace Briefwright.Brief.Annex;

/// <summary>RFC 4180 CSV: CRLF line ends, fields quoted when they hold a comma, quote or line break, quotes doubled.
/// Text that a spreadsheet program would run as a formula is neutralised first (<see cref="Neutralise"/>).</summary>
public static class Csv
{
    public static string Field(object? value) => value switch
    {
        null => "",
        double d => double.IsFinite(d) ? d.ToString("R", CultureInfo.InvariantCulture) : "",
        bool b => b ? "true" : "false",
        IFormattable f => f.ToString(null, CultureInfo.InvariantCulture),
        _ => Quote(Neutralise(value.ToString() ?? "")),
    };

    /// <summary>
    /// Text starting with '=', '+', '-', '@', a tab or a carriage return is read as a formula by spreadsheet programs
    /// (CSV injection); the usual rule is to prefix such a cell with a single quote, which they show as text. Applies
    /// to text cells only: numbers are written by the number formatter and a negative number stays a number.
    /// </summary>
    public static string Neutralise(string text) =>
        text.Length > 0 && text[0] is '=' or '+' or '-' or '@' or '\t' or '\r' ? "'" + text : text;

    private static string Quote(string s) =>
        s.IndexOfAny(new[] { ',', '"', '\r', '\n' }) >= 0 ? "\"" + s.Replace("\"", "\"\"") + "\"" : s;

    public static byte[] Write(IReadOnlyList<string> header, IEnumerable<IReadOnlyList<object?>> rows)
    {
        var sb = new StringBuilder();
        sb.Append(string.Join(",", header.Select(Quote))).Append("\r\n");
        foreach (var row in rows) sb.Append(string.Join(",", row.Select(Field))).Append("\r\n");
        return Encoding.UTF8.GetBytes(sb.ToString());
    }
}
