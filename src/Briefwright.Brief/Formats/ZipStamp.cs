using System.IO.Compression;

namespace Briefwright.Brief.Formats;

/// <summary>
/// Office files are zip packages, and a zip entry records when it was written. The packaging library stamps entries
/// with the clock; this copies a package entry by entry, in the same order, with every entry stamped with the brief's
/// date, so the same brief gives the same bytes.
/// </summary>
public static class ZipStamp
{
    /// <summary>
    /// The package's core properties (title, author, dates) written as a part with a fixed name and relationship id; the
    /// packaging library's own property store picks a random part name.
    /// </summary>
    public static void CoreProperties(DocumentFormat.OpenXml.Packaging.OpenXmlPackage package, string title, string creator, DateOnly date)
    {
        var part = package switch
        {
            DocumentFormat.OpenXml.Packaging.WordprocessingDocument w => w.AddNewPart<DocumentFormat.OpenXml.Packaging.CoreFilePropertiesPart>("rIdCore"),
            DocumentFormat.OpenXml.Packaging.SpreadsheetDocument x => x.AddNewPart<DocumentFormat.OpenXml.Packaging.CoreFilePropertiesPart>("rIdCore"),
            _ => throw new ArgumentException("a Word or spreadsheet package", nameof(package)),
        };
        static string X(string s) => System.Security.SecurityElement.Escape(s);
        string when = date.ToString("yyyy-MM-dd", System.Globalization.CultureInfo.InvariantCulture) + "T00:00:00Z";
        string xml = "<?xml version=\"1.0\" encoding=\"UTF-8\" standalone=\"yes\"?>\n" +
            "<cp:coreProperties xmlns:cp=\"http://schemas.openxmlformats.org/package/2006/metadata/core-properties\" xmlns:dc=\"http://purl.org/dc/elements/1.1/\" " +
            "xmlns:dcterms=\"http://purl.org/dc/terms/\" xmlns:xsi=\"http://www.w3.org/2001/XMLSchema-instance\">" +
            $"<dc:title>{X(title)}</dc:title><dc:creator>{X(creator)}</dc:creator>" +
            $"<dcterms:created xsi:type=\"dcterms:W3CDTF\">{when}</dcterms:created><dcterms:modified xsi:type=\"dcterms:W3CDTF\">{when}</dcterms:modified>" +
            "</cp:coreProperties>";
        using var s = new MemoryStream(System.Text.Encoding.UTF8.GetBytes(xml));
        part.FeedData(s);
    }

    public static byte[] Restamp(byte[] package, DateOnly date)
    {
        var stamp = new DateTimeOffset(date.ToDateTime(new TimeOnly(12, 0)), TimeSpan.Zero);
        using var input = new ZipArchive(new MemoryStream(package), ZipArchiveMode.Read);
        using var output = new MemoryStream(package.Length + 1024);
        using (var copy = new ZipArchive(output, ZipArchiveMode.Create, leaveOpen: true))
        {
            foreach (var entry in input.Entries)
            {
                var target = copy.CreateEntry(entry.FullName, CompressionLevel.Optimal);
                target.LastWriteTime = stamp;
                using var from = entry.Open();
                using var to = target.Open();
                from.CopyTo(to);
            }
        }
        return output.ToArray();
    }
}
