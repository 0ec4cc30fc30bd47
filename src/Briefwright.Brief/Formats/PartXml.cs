using System.Text;
using DocumentFormat.OpenXml.Packaging;

namespace Briefwright.Brief.Formats;

/// <summary>
/// Part contents written as XML text into the SDK's package parts. The SDK's typed element classes are not used in the
/// tool: each reaches its whole schema, which native compilation would keep (the executable grew from 19 to 40 MB with
/// them). The tests read every part back with the typed classes and run the SDK's validator over the files.
/// </summary>
public static class PartXml
{
    public const string RelationshipsNs = "http://schemas.openxmlformats.org/officeDocument/2006/relationships";

    public static void Feed(OpenXmlPart part, string xml)
    {
        using var s = new MemoryStream(Encoding.UTF8.GetBytes("<?xml version=\"1.0\" encoding=\"UTF-8\" standalone=\"yes\"?>\n" + xml));
        part.FeedData(s);
    }

    /// <summary>Text for an element or an attribute value; characters XML 1.0 cannot hold are left out.</summary>
    public static string Escape(string text)
    {
        var sb = new StringBuilder(text.Length + 16);
        foreach (char c in text)
        {
            switch (c)
            {
                case '&': sb.Append("&amp;"); break;
                case '<': sb.Append("&lt;"); break;
                case '>': sb.Append("&gt;"); break;
                case '"': sb.Append("&quot;"); break;
                case '\t' or '\n' or '\r': sb.Append(c); break;
                case < ' ' or '\uFFFE' or '\uFFFF': break;
                default: sb.Append(c); break;
            }
        }
        return sb.ToString();
    }
}
