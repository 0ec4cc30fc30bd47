using System.Globalization;
using System.IO.Compression;
using System.Text;

namespace Briefwright.Brief.Formats;

/// <summary>
/// An Office Open XML package (ECMA-376 Part 2, Open Packaging Conventions) written as a zip: the parts in the order
/// added, the content types, the relationships of the package and of each part, and the core properties. Every zip
/// entry is stamped with the brief's date, so the same brief gives the same bytes. Written here rather than through the
/// Open XML SDK's packaging, which kept about 20 MB of schema and XML code in the native executable (19 → 40 MB,
/// measured); the tests read every file back and validate it with the SDK.
/// </summary>
public sealed class OfficePackage(DateOnly date)
{
    public const string RelationshipsNs = "http://schemas.openxmlformats.org/officeDocument/2006/relationships";
    private const string PackageRelationships = "http://schemas.openxmlformats.org/package/2006/relationships";

    private readonly List<(string Name, string ContentType, byte[] Bytes)> parts = [];
    private readonly Dictionary<string, List<(string Id, string Type, string Target, bool External)>> relationships
        = new(StringComparer.Ordinal);

    /// <summary>Adds a part by its name in the package, such as <c>/word/document.xml</c>.</summary>
    public void Add(string name, string contentType, byte[] bytes) => parts.Add((name, contentType, bytes));

    public void AddXml(string name, string contentType, string xml) =>
        Add(name, contentType,
            Encoding.UTF8.GetBytes("<?xml version=\"1.0\" encoding=\"UTF-8\" standalone=\"yes\"?>\n" + xml));

    /// <summary>
    /// A relationship from <paramref name="source"/> ("/" for the package) to a part or, when external, a URI.
    /// </summary>
    public void Relate(string source, string id, string type, string target, bool external = false)
    {
        if (!relationships.TryGetValue(source, out var list)) relationships[source] = list = [];
        list.Add((id, type, target, external));
    }

    /// <summary>The core properties (title, author, dates from the brief) as <c>/docProps/core.xml</c>.</summary>
    public void CoreProperties(string title, string creator)
    {
        string when = date.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture) + "T00:00:00Z";
        AddXml("/docProps/core.xml", "application/vnd.openxmlformats-package.core-properties+xml",
            "<cp:coreProperties xmlns:cp=\"http://schemas.openxmlformats.org/package/2006/metadata/core-properties\" " +
            "xmlns:dc=\"http://purl.org/dc/elements/1.1/\" " +
            "xmlns:dcterms=\"http://purl.org/dc/terms/\" xmlns:xsi=\"http://www.w3.org/2001/XMLSchema-instance\">" +
            $"<dc:title>{Escape(title)}</dc:title><dc:creator>{Escape(creator)}</dc:creator>" +
            $"<dcterms:created xsi:type=\"dcterms:W3CDTF\">{when}</dcterms:created><dcterms:modified " +
            $"xsi:type=\"dcterms:W3CDTF\">{when}</dcterms:modified>" +
            "</cp:coreProperties>");
        Relate("/", "rIdCore", "http://schemas.openxmlformats.org/package/2006/relationships/metadata/core-properties",
            "/docProps/core.xml");
    }

    public byte[] ToBytes()
    {
        var stamp = new DateTimeOffset(date.ToDateTime(new TimeOnly(12, 0)), TimeSpan.Zero);
        using var output = new MemoryStream();
        using (var zip = new ZipArchive(output, ZipArchiveMode.Create, leaveOpen: true))
        {
            void Entry(string name, byte[] bytes)
            {
                var entry = zip.CreateEntry(name.TrimStart('/'), CompressionLevel.Optimal);
                entry.LastWriteTime = stamp;
                using var s = entry.Open();
                s.Write(bytes);
            }
            var types = new StringBuilder("<?xml version=\"1.0\" encoding=\"UTF-8\" standalone=\"yes\"?>\n" +
                "<Types xmlns=\"http://schemas.openxmlformats.org/package/2006/content-types\">")
                .Append("<Default Extension=\"rels\" " +
                    "ContentType=\"application/vnd.openxmlformats-package.relationships+xml\"/><Default " +
                    "Extension=\"xml\" ContentType=\"application/xml\"/>");
            if (parts.Any(p => p.Name.EndsWith(".png", StringComparison.Ordinal)))
                types.Append("<Default Extension=\"png\" ContentType=\"image/png\"/>");
            foreach (var p in parts.Where(p => !p.Name.EndsWith(".png", StringComparison.Ordinal)))
                types.Append("<Override PartName=\"").Append(Escape(p.Name)).Append("\" ContentType=\"")
                    .Append(Escape(p.ContentType)).Append("\"/>");
            Entry("[Content_Types].xml", Encoding.UTF8.GetBytes(types.Append("</Types>").ToString()));
            foreach (var (source, list) in relationships.OrderBy(r => r.Key, StringComparer.Ordinal))
            {
                var rels = new StringBuilder(
                    "<?xml version=\"1.0\" encoding=\"UTF-8\" standalone=\"yes\"?>\n" +
                    "<Relationships xmlns=\"").Append(PackageRelationships).Append("\">");
                foreach (var r in list)
                    rels.Append("<Relationship Id=\"").Append(r.Id).Append("\" Type=\"").Append(Escape(r.Type))
                        .Append("\" Target=\"").Append(Escape(r.Target)).Append('"')
                        .Append(r.External ? " TargetMode=\"External\"" : "").Append("/>");
                rels.Append("</Relationships>");
                int slash = source.LastIndexOf('/');
                string relsName = source == "/"
                    ? "_rels/.rels"
                    : $"{source[1..(slash + 1)]}_rels/{source[(slash + 1)..]}.rels";
                Entry(relsName, Encoding.UTF8.GetBytes(rels.ToString()));
            }
            foreach (var p in parts) Entry(p.Name, p.Bytes);
        }
        return output.ToArray();
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
