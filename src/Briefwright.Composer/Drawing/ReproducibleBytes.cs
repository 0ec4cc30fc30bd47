using System.Security.Cryptography;
using System.Text;
using System.Text.RegularExpressions;

namespace Briefwright.Composer.Drawing;

/// <summary>
/// Makes a saved PDF a function of its content alone. PDFsharp writes random font-subset tags, a random
/// document /ID, XMP uuids, and the current time in link annotations. Each such field is masked, the masked
/// file is hashed, and every field is refilled from that hash (dates from the brief's date), keeping each
/// field's length so cross-reference offsets stay valid.
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

    public static byte[] Fix(byte[] pdf, DateOnly date)
    {
        // Latin-1 maps bytes 1:1 to chars, so string offsets are byte offsets.
        var text = Encoding.Latin1.GetString(pdf).ToCharArray();
        string s = new(text);
        var fields = new List<(int Start, int Length, char Kind)>();
        foreach (Match m in SubsetTag().Matches(s)) fields.Add((m.Index + 1, 6, 'A'));
        foreach (Match m in TrailerId().Matches(s))
        {
            fields.Add((m.Groups[1].Index, m.Groups[1].Length, 'H'));
            fields.Add((m.Groups[2].Index, m.Groups[2].Length, 'H'));
        }
        foreach (Match m in Uuid().Matches(s)) fields.Add((m.Groups[1].Index, 36, 'U'));
        foreach (Match m in AnnotationName().Matches(s)) fields.Add((m.Groups[1].Index, m.Groups[1].Length, 'H'));

        string stamp = date.ToString("yyyyMMdd") + "000000";
        foreach (Match m in PdfDate().Matches(s))
            for (int i = 0; i < 14; i++) text[m.Groups[1].Index + i] = stamp[i];
        string iso = date.ToString("yyyy-MM-dd") + "T00:00:00";
        foreach (Match m in XmpDate().Matches(s))
        {
            var g = m.Groups[1];
            for (int i = 0; i < Math.Min(g.Length, iso.Length); i++) text[g.Index + i] = iso[i];
            for (int i = iso.Length; i < g.Length; i++) text[g.Index + i] = i == iso.Length ? 'Z' : ' ';
        }

        // Subset tags name the same font in several places: the same tag must map to the same replacement.
        var tagMap = new Dictionary<string, int>(StringComparer.Ordinal);
        foreach (var f in fields.Where(f => f.Kind == 'A'))
        {
            string tag = s.Substring(f.Start, 6);
            if (!tagMap.ContainsKey(tag)) tagMap[tag] = tagMap.Count;
        }
        var tagOf = fields.Where(f => f.Kind == 'A').ToDictionary(f => f.Start, f => tagMap[s.Substring(f.Start, 6)]);
        foreach (var f in fields)
            for (int i = 0; i < f.Length; i++)
                if (f.Kind != 'U' || text[f.Start + i] != '-') text[f.Start + i] = '0';

        byte[] digest = SHA256.HashData(Encoding.Latin1.GetBytes(text));
        int n = 0;
        foreach (var f in fields.OrderBy(f => f.Start))
        {
            int seed = f.Kind == 'A' ? tagOf[f.Start] : n++;
            byte[] stream = Stream(digest, seed, f.Length);
            for (int i = 0; i < f.Length; i++)
            {
                if (f.Kind == 'U' && s[f.Start + i] == '-') continue;
                text[f.Start + i] = f.Kind switch
                {
                    'A' => (char)('A' + stream[i] % 26),
                    _ => "0123456789ABCDEF"[stream[i] % 16] is var c && f.Kind == 'U' ? char.ToLowerInvariant(c) : "0123456789ABCDEF"[stream[i] % 16],
                };
            }
        }
        return Encoding.Latin1.GetBytes(text);
    }

    private static byte[] Stream(byte[] digest, int seed, int length)
    {
        var input = new byte[digest.Length + 4];
        digest.CopyTo(input, 0);
        BitConverter.TryWriteBytes(input.AsSpan(digest.Length), seed + 1_000_003 * length);
        var output = new List<byte>();
        while (output.Count < length)
        {
            input = SHA256.HashData(input);
            output.AddRange(input);
        }
        return output.Take(length).ToArray();
    }
}
