using System.Globalization;
using System.Text;
using System.Text.RegularExpressions;

namespace Briefwright.Composer.Drawing;

/// <summary>
/// Makes a saved PDF a function of its content alone, and completes its XMP metadata. PDFsharp writes random
/// font-subset tags, a random document /ID and random XMP uuids. The file is read object by object: stream contents
/// (compressed page content, fonts, images) are copied byte for byte and never searched; the rewrites apply only to
/// the text of objects and the trailer, and to the one uncompressed XMP metadata stream named by its dictionary.
/// Each random field is masked, the masked file is hashed, and every field is refilled from that hash (dates from
/// the brief's date). The cross-reference table is written afresh, so fields may change length.
/// </summary>
public static partial class ReproducibleBytes
{
    [GeneratedRegex(@"/[A-Z]{6}\+")]
    private static partial Regex SubsetTag();

    [GeneratedRegex(@"/ID\s*\[\s*<([0-9A-Fa-f]+)>\s*<([0-9A-Fa-f]+)>\s*\]")]
    private static partial Regex TrailerId();

    [GeneratedRegex(@"uuid:([0-9a-fA-F-]{36})")]
    private static partial Regex Uuid();

    [GeneratedRegex(@"\(D:(\d{14})([^)]*)\)")]
    private static partial Regex PdfDate();

    [GeneratedRegex(@"/NM\s*\(([^)]*)\)")]
    private static partial Regex AnnotationName();

    [GeneratedRegex(@"<xmp:(?:CreateDate|ModifyDate|MetadataDate)>([^<]+)</xmp:")]
    private static partial Regex XmpDate();

    [GeneratedRegex(@"^\s*(\d+)\s+(\d+)\s+obj\b")]
    private static partial Regex ObjectHeader();

    [GeneratedRegex(@"/Length\s+(\d+)(\s+\d+\s+R)?")]
    private static partial Regex StreamLength();

    /// <summary>The PDF/UA identification (ISO 14289-1, 5): part 1, in its own XMP namespace.</summary>
    public const string PdfUaIdentification =
        "      <rdf:Description rdf:about=\"\" xmlns:pdfuaid=\"http://www.aiim.org/pdfua/ns/id/\">\r\n" +
        "        <pdfuaid:part>1</pdfuaid:part>\r\n" +
        "      </rdf:Description>\r\n";

    /// <summary>
    /// Fixes the random fields; with <paramref name="pdfUa"/>, also declares PDF/UA-1 in the XMP metadata.
    /// </summary>
    public static byte[] Fix(byte[] pdf, DateOnly date, bool pdfUa = true)
    {
        var file = PdfObjects.Parse(pdf);
        foreach (var obj in file.Objects)
            if (obj.IsXmpMetadata)
                obj.StreamText = new PdfObjects.Text(
                    Encoding.Latin1.GetString(Xmp(obj.Stream!, date, pdfUa)), obj.Head.Order + 1);

        string stamp = date.ToString("yyyyMMdd", CultureInfo.InvariantCulture) + "000000";
        var texts = file.Texts().ToList();
        foreach (var t in texts)
            foreach (Match m in PdfDate().Matches(t.Value))
                t.Overwrite(m.Groups[1].Index, stamp);

        var fields = RandomFields(texts);
        var seeds = Mask(fields);
        Refill(fields, seeds, Sha256Hex.Digest(file.Write()));
        return file.Write();
    }

    /// <summary>The random fields in the text of objects and the trailer: font-subset tags, the document /ID, XMP
    /// uuids and annotation names.</summary>
    private static List<Field> RandomFields(List<PdfObjects.Text> texts)
    {
        var fields = new List<Field>();
        foreach (var t in texts)
        {
            string s = t.Value;
            foreach (Match m in SubsetTag().Matches(s)) fields.Add(new Field(t, m.Index + 1, 6, 'A'));
            foreach (Match m in TrailerId().Matches(s))
            {
                fields.Add(new Field(t, m.Groups[1].Index, m.Groups[1].Length, 'H'));
                fields.Add(new Field(t, m.Groups[2].Index, m.Groups[2].Length, 'H'));
            }
            foreach (Match m in Uuid().Matches(s)) fields.Add(new Field(t, m.Groups[1].Index, 36, 'U'));
            foreach (Match m in AnnotationName().Matches(s))
                fields.Add(new Field(t, m.Groups[1].Index, m.Groups[1].Length, 'H'));
        }
        return fields;
    }

    /// <summary>Overwrites every field with zeros (a uuid keeps its dashes) and returns each field's seed: subset
    /// tags name the same font in several places, so the same tag gets the same seed (the others get -1).</summary>
    private static Dictionary<Field, int> Mask(List<Field> fields)
    {
        var tagMap = new Dictionary<string, int>(StringComparer.Ordinal);
        foreach (var f in fields.Where(f => f.Kind == 'A'))
            tagMap.TryAdd(f.Text.Value.Substring(f.Start, 6), tagMap.Count);
        var seeds = fields.ToDictionary(f => f, f => f.Kind == 'A' ? tagMap[f.Text.Value.Substring(f.Start, 6)] : -1);

        foreach (var f in fields)
        {
            var mask = new StringBuilder(f.Text.Value.Substring(f.Start, f.Length));
            for (int i = 0; i < mask.Length; i++)
                if (f.Kind != 'U' || mask[i] != '-') mask[i] = '0';
            f.Text.Overwrite(f.Start, mask.ToString());
        }
        return seeds;
    }

    /// <summary>Fills every masked field from the hash of the masked file, in the order the fields stand in
    /// it.</summary>
    private static void Refill(List<Field> fields, Dictionary<Field, int> seeds, byte[] digest)
    {
        int n = 0;
        foreach (var f in fields.OrderBy(f => f.Text.Order).ThenBy(f => f.Start))
        {
            int seed = f.Kind == 'A' ? seeds[f] : n++;
            byte[] stream = Stream(digest, seed, f.Length);
            var fill = new StringBuilder(f.Length);
            for (int i = 0; i < f.Length; i++)
            {
                char c = f.Text.Value[f.Start + i];
                fill.Append(f.Kind switch
                {
                    'U' when c == '-' => '-',
                    'U' => "0123456789abcdef"[stream[i] % 16],
                    'A' => (char)('A' + stream[i] % 26),
                    _ => "0123456789ABCDEF"[stream[i] % 16],
                });
            }
            f.Text.Overwrite(f.Start, fill.ToString());
        }
    }

    /// <summary>Sets the XMP dates to the brief's date and adds the PDF/UA identification if it is missing.</summary>
    private static byte[] Xmp(byte[] xmp, DateOnly date, bool pdfUa)
    {
        // Latin-1 maps bytes 1:1 to chars: the UTF-8 of titles passes through unchanged.
        string s = Encoding.Latin1.GetString(xmp);
        string iso = date.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture) + "T00:00:00Z";
        s = XmpDate().Replace(s, m => m.Value.Replace(m.Groups[1].Value, iso, StringComparison.Ordinal));
        int end = s.IndexOf("</rdf:RDF>", StringComparison.Ordinal);
        if (pdfUa && end >= 0 && !s.Contains("pdfuaid:part", StringComparison.Ordinal))
        {
            int lineStart = s.LastIndexOf('\n', end) + 1;
            s = s.Insert(lineStart, PdfUaIdentification);
        }
        return Encoding.Latin1.GetBytes(s);
    }

    private sealed record Field(PdfObjects.Text Text, int Start, int Length, char Kind);

    private static byte[] Stream(byte[] digest, int seed, int length)
    {
        var input = new byte[digest.Length + 4];
        digest.CopyTo(input, 0);
        BitConverter.TryWriteBytes(input.AsSpan(digest.Length), seed + 1_000_003 * length);
        var output = new List<byte>();
        while (output.Count < length)
        {
            input = Sha256Hex.Digest(input);
            output.AddRange(input);
        }
        return output.Take(length).ToArray();
    }

    /// <summary>
    /// A classic-layout PDF (header, numbered objects, cross-reference table, trailer) as PDFsharp writes it, split
    /// into the text of each object (up to the <c>stream</c> keyword) and its stream bytes, found by the stream's
    /// <c>/Length</c>, so nothing inside a stream is ever read as syntax.
    /// </summary>
    internal sealed class PdfObjects
    {
        private byte[] header = [];
        private Text trailer = new("", 0);
        private string tail = "";

        public List<Obj> Objects { get; } = new();

        public sealed class Text(string value, int order)
        {
            public string Value { get; private set; } = value;
            public int Order { get; } = order;

            public void Overwrite(int start, string with) =>
                Value = string.Concat(Value.AsSpan(0, start), with, Value.AsSpan(start + with.Length));
        }

        public sealed class Obj
        {
            public required int Number { get; init; }
            public required Text Head { get; init; }
            public byte[]? Stream { get; set; }

            /// <summary>
            /// The stream as rewritable text (the uncompressed XMP metadata only); replaces <see cref="Stream"/>.
            /// </summary>
            public Text? StreamText { get; set; }

            public required string After { get; init; }

            public bool IsXmpMetadata =>
                Stream is not null && Head.Value.Contains("/Type/Metadata", StringComparison.Ordinal)
                && Head.Value.Contains("/Subtype/XML", StringComparison.Ordinal)
                && !Head.Value.Contains("/Filter", StringComparison.Ordinal);
        }

        /// <summary>Every rewritable text: each object's dictionary text, the XMP stream, then the trailer.</summary>
        public IEnumerable<Text> Texts()
        {
            foreach (var o in Objects)
            {
                yield return o.Head;
                if (o.StreamText is not null) yield return o.StreamText;
            }
            yield return trailer;
        }

        public static PdfObjects Parse(byte[] pdf)
        {
            string s = Encoding.Latin1.GetString(pdf);
            var file = new PdfObjects();
            int first = s.IndexOf(" obj", StringComparison.Ordinal);
            if (first < 0) throw Bad("no object");
            int pos = s.LastIndexOf('\n', first) + 1;
            file.header = pdf[..pos];
            int order = 0;
            while (true)
            {
                int start = SkipSpace(s, pos);
                if (string.CompareOrdinal(s, start, "xref", 0, 4) == 0) break;
                var m = ObjectHeader().Match(s[start..Math.Min(s.Length, start + 32)]);
                if (!m.Success) throw Bad($"expected an object at byte {start}");
                int number = int.Parse(m.Groups[1].Value, CultureInfo.InvariantCulture);
                int end = EndOfObjectText(s, start + m.Length, out bool hasStream);
                if (!hasStream)
                {
                    file.Objects.Add(new Obj { Number = number, Head = new Text(s[pos..end], order), After = "" });
                    order += 2;
                    pos = end;
                    continue;
                }
                // end is just after the "stream" keyword; its end-of-line comes next.
                int data = end + (s[end] == '\r' ? 2 : 1);
                string head = s[pos..data];
                var length = StreamLength().Match(head);
                if (!length.Success || length.Groups[2].Success)
                    throw Bad($"stream of object {number} without a direct /Length");
                int count = int.Parse(length.Groups[1].Value, CultureInfo.InvariantCulture);
                int after = data + count;
                int endObj = s.IndexOf("endobj", after, StringComparison.Ordinal);
                if (endObj < 0
                    || s.IndexOf("endstream", after, StringComparison.Ordinal) is var es && (es < 0 || es > endObj))
                    throw Bad($"object {number}: endstream not found after its /Length");
                int next = endObj + "endobj".Length;
                while (next < s.Length && s[next] is '\r' or '\n') next++;
                file.Objects.Add(new Obj
                {
                    Number = number, Head = new Text(head, order), Stream = pdf[data..after], After = s[after..next],
                });
                order += 2;
                pos = next;
            }
            int xref = SkipSpace(s, pos);
            int trailerAt = s.IndexOf("trailer", xref, StringComparison.Ordinal);
            int startXref = s.IndexOf("startxref", trailerAt, StringComparison.Ordinal);
            if (trailerAt < 0 || startXref < 0) throw Bad("no trailer");
            file.trailer = new Text(s[trailerAt..startXref], order);
            int number2 = SkipSpace(s, startXref + "startxref".Length);
            int numberEnd = number2;
            while (numberEnd < s.Length && char.IsAsciiDigit(s[numberEnd])) numberEnd++;
            file.tail = s[numberEnd..];
            return file;
        }

        /// <summary>Writes the file with a fresh cross-reference table, in the layout PDFsharp uses.</summary>
        public byte[] Write()
        {
            using var output = new MemoryStream();
            output.Write(header);
            int size = Objects.Count == 0 ? 1 : Objects.Max(o => o.Number) + 1;
            var offsets = new long[size];
            foreach (var o in Objects)
            {
                offsets[o.Number] = output.Position;
                string head = o.Head.Value;
                byte[]? stream = o.StreamText is { } text ? Encoding.Latin1.GetBytes(text.Value) : o.Stream;
                if (o.StreamText is not null)
                    head = StreamLength().Replace(
                        head, "/Length " + stream!.Length.ToString(CultureInfo.InvariantCulture), 1);
                output.Write(Encoding.Latin1.GetBytes(head));
                if (stream is not null) output.Write(stream);
                output.Write(Encoding.Latin1.GetBytes(o.After));
            }
            long xref = output.Position;
            var table = new StringBuilder();
            table.Append("xref\n0 ").Append(size.ToString(CultureInfo.InvariantCulture)).Append('\n');
            table.Append("0000000000 65535 f \n");
            for (int i = 1; i < size; i++)
                table.Append(offsets[i] == 0 ? "0000000000 65535 f \n" : $"{offsets[i]:D10} 00000 n \n");
            table.Append(trailer.Value).Append("startxref\n").Append(xref.ToString(CultureInfo.InvariantCulture))
                .Append(tail);
            output.Write(Encoding.Latin1.GetBytes(table.ToString()));
            return output.ToArray();
        }

        private static int SkipSpace(string s, int i)
        {
            while (i < s.Length && (s[i] is ' ' or '\r' or '\n' or '\t' or '\f' or '\0' || s[i] == '%'))
            {
                if (s[i] == '%') while (i < s.Length && s[i] is not ('\r' or '\n')) i++;
                else i++;
            }
            return i;
        }

        /// <summary>
        /// Scans an object's text from <paramref name="i"/>, skipping strings and comments, to just after the
        /// <c>stream</c> keyword (a stream follows) or the end of the line after <c>endobj</c>.
        /// </summary>
        private static int EndOfObjectText(string s, int i, out bool hasStream)
        {
            while (i < s.Length)
            {
                char c = s[i];
                if (c == '(')
                {
                    int depth = 0;
                    for (; i < s.Length; i++)
                    {
                        if (s[i] == '\\') { i++; continue; }
                        if (s[i] == '(') depth++;
                        else if (s[i] == ')' && --depth == 0) { i++; break; }
                    }
                }
                else if (c == '<' && i + 1 < s.Length && s[i + 1] != '<')
                {
                    i = s.IndexOf('>', i) + 1;
                    if (i == 0) throw Bad("unterminated hex string");
                }
                else if (c == '%')
                {
                    while (i < s.Length && s[i] is not ('\r' or '\n')) i++;
                }
                else if (IsKeyword(s, i, "stream"))
                {
                    hasStream = true;
                    return i + "stream".Length;
                }
                else if (IsKeyword(s, i, "endobj"))
                {
                    hasStream = false;
                    i += "endobj".Length;
                    while (i < s.Length && s[i] is '\r' or '\n') i++;
                    return i;
                }
                else i++;
            }
            throw Bad("object without endobj");
        }

        private static bool IsKeyword(string s, int i, string word) =>
            string.CompareOrdinal(s, i, word, 0, word.Length) == 0
            && (i == 0 || !char.IsAsciiLetter(s[i - 1]))
            && (i + word.Length == s.Length || !char.IsAsciiLetter(s[i + word.Length]));

        private static InvalidDataException Bad(string what) => new($"Unexpected PDF layout: {what}.");
    }
}
