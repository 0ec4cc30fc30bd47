using System.Diagnostics;
using System.Globalization;
using System.Text;
using System.Text.Json;
using System.Text.RegularExpressions;

namespace Briefwright.Brief.Tests.PdfUa;

/// <summary>
/// One failed check: the Matterhorn Protocol checkpoint (or the standard's clause) and what was found.
/// </summary>
public sealed record Finding(string Checkpoint, string Message)
{
    public override string ToString() => $"{Checkpoint}: {Message}";
}

/// <summary>
/// Applies the machine-checkable failure conditions of the Matterhorn Protocol (PDF Association's checklist for
/// PDF/UA-1, ISO 14289-1) to a PDF read through qpdf's JSON output (qpdf 11, <c>--json --json-stream-data=inline
/// --decode-level=generalized</c>), not through PDFsharp, which wrote it. Checkpoint numbers and the wording of their
/// failure conditions are from the Matterhorn Protocol 1.1 (2021), recalled from memory; the standard's clause is
/// given where the checkpoint number is less certain.
///
/// Needs a person (not checked here): whether tags are semantically right (01-001, 01-002, 01-006), reading order
/// makes sense (09-001; checked by proxy: the structure visits each page's content in the order it is drawn),
/// alternative text is meaningful (13-004 checks it is present, not empty and not a file name), headings are
/// headings (14-001), tables are data tables (15-004), colour and contrast (04-001, 04-002 are not PDF checks).
/// </summary>
public sealed partial class PdfUaChecker
{
    private readonly JsonElement objects;
    private readonly List<Finding> findings = new();
    private readonly Dictionary<string, string> roleMap = new(StringComparer.Ordinal);

    // Per page (object reference): MCIDs in structure-tree order, with the element that holds each.
    private readonly Dictionary<string, List<(int Mcid, string Element)>> treeMcids = new();
    // annotation ref → structure type holding its OBJR
    private readonly Dictionary<string, string> annotationParents = new();
    private readonly List<int> headingLevels = new();
    private bool usesPlainH;

    private static readonly HashSet<string> StandardTypes = new(StringComparer.Ordinal)
    {
        "Document", "Part", "Art", "Sect", "Div", "BlockQuote", "Caption", "TOC", "TOCI", "Index", "NonStruct",
        "Private", "P", "H", "H1", "H2", "H3", "H4", "H5", "H6", "L", "LI", "Lbl", "LBody", "Table", "TR", "TH",
        "TD", "THead", "TBody", "TFoot", "Span", "Quote", "Note", "Reference", "BibEntry", "Code", "Link", "Annot",
        "Ruby", "RB", "RT", "RP", "Warichu", "WT", "WP", "Figure", "Formula", "Form",
    };

    private PdfUaChecker(JsonElement objects) => this.objects = objects;

    /// <summary>Runs qpdf on <paramref name="pdf"/> and returns every failed check (none when it conforms).</summary>
    public static IReadOnlyList<Finding> Check(byte[] pdf)
    {
        string path = Path.Combine(Path.GetTempPath(), $"bw-ua-{Guid.NewGuid():N}.pdf");
        File.WriteAllBytes(path, pdf);
        try
        {
            var psi = new ProcessStartInfo(
                "qpdf",
                ["--json", "--json-stream-data=inline", "--decode-level=generalized", path])
            {
                RedirectStandardOutput = true, RedirectStandardError = true,
            };
            using var p = Process.Start(psi) ?? throw new InvalidOperationException("qpdf did not start.");
            var stdout = p.StandardOutput.ReadToEndAsync();
            string stderr = p.StandardError.ReadToEnd();
            string json = stdout.Result;
            p.WaitForExit();
            if (p.ExitCode is not (0 or 3)) throw new InvalidOperationException(
                $"qpdf --json failed ({p.ExitCode}): {stderr}");
            using var doc = JsonDocument.Parse(json);
            var checker = new PdfUaChecker(doc.RootElement.GetProperty("qpdf")[1]);
            checker.Run();
            return checker.findings;
        }
        catch (System.ComponentModel.Win32Exception)
        {
            throw new InvalidOperationException("qpdf is not installed; test.sh installs it (apt-get install qpdf).");
        }
        finally
        {
            File.Delete(path);
        }
    }

    private void Fail(string checkpoint, string message) => findings.Add(new Finding(checkpoint, message));

    private void Run()
    {
        var trailer = objects.GetProperty("trailer").GetProperty("value");
        var catalog = Resolve(trailer.GetProperty("/Root"));
        CheckDocument(trailer, catalog);
        if (Get(catalog, "/StructTreeRoot") is not { } rootRef)
        {
            Fail("01-005", "no structure tree (StructTreeRoot): no content is tagged");
            return;
        }
        var root = Resolve(rootRef);
        ReadRoleMap(root);
        if (Get(root, "/K") is { } kids)
            foreach (var kid in Items(kids)) Walk(kid, "StructTreeRoot", null, new List<string>());
        CheckHeadings();
        var pages = PageRefs(Resolve(Get(catalog, "/Pages")!.Value)).ToList();
        var parentTree = ParentTree(root);
        foreach (var (page, index) in pages.Select((p, i) => (p, i + 1)))
        {
            CheckAnnotations(page, index);
            CheckContent(page, index, parentTree);
        }
        CheckFonts(pages);
    }

    // ---- Document level -------------------------------------------------------------------------------------

    private void CheckDocument(JsonElement trailer, JsonElement catalog)
    {
        if (Get(trailer, "/Encrypt") is { } enc)
        {
            // 26-001/26-002: an encrypted file must allow assistive technology (P bit 10).
            var p = Get(Resolve(enc), "/P");
            if (p is not { ValueKind: JsonValueKind.Number } || ((long)p.Value.GetDouble() & (1 << 9)) == 0)
                Fail("26-002", "the file is encrypted and does not allow assistive technology to read it (P bit 10)");
        }
        var markInfo = Get(catalog, "/MarkInfo") is { } mi ? Resolve(mi) : (JsonElement?)null;
        if (markInfo is null || Get(markInfo.Value, "/Marked") is not { ValueKind: JsonValueKind.True })
            Fail("01-005 (ISO 14289-1 7.1)", "MarkInfo /Marked is not true");
        if (markInfo is { } m && Get(m, "/Suspects") is { ValueKind: JsonValueKind.True })
            Fail("01-007", "MarkInfo /Suspects is true");

        // 06-001..06-003: XMP metadata with the PDF/UA identification and a title.
        if (Get(catalog, "/Metadata") is not { } metadataRef || Data(metadataRef) is not { } xmpBytes)
            Fail("06-001", "the catalog has no XMP metadata stream");
        else
        {
            string xmp = Encoding.UTF8.GetString(xmpBytes);
            if (!PdfUaPart().IsMatch(xmp)) Fail("06-002", "the XMP metadata does not identify PDF/UA (pdfuaid:part 1)");
            if (!DcTitle().IsMatch(xmp)) Fail("06-003", "the XMP metadata has no dc:title");
        }

        // 07-001/07-002: the window shows the document's title.
        var prefs = Get(catalog, "/ViewerPreferences") is { } vp ? Resolve(vp) : (JsonElement?)null;
        var display = prefs is { } pr ? Get(pr, "/DisplayDocTitle") : null;
        if (display is null) Fail("07-001", "ViewerPreferences has no DisplayDocTitle entry");
        else if (display.Value.ValueKind != JsonValueKind.True) Fail("07-002", "DisplayDocTitle is false");

        // 11-001: the natural language of the text must be determinable; every element here inherits the catalog's.
        if (Get(catalog, "/Lang") is not { } lang || Str(lang).Trim().Length == 0)
            Fail("11-001", "the catalog has no /Lang, so the language of the text cannot be determined");
    }

    [GeneratedRegex(@"pdfuaid:part(?:>\s*1\s*<|\s*=\s*[""']1[""'])")]
    private static partial Regex PdfUaPart();

    [GeneratedRegex(@"<dc:title>\s*<rdf:Alt>\s*<rdf:li[^>]*>[^<]*\S[^<]*</rdf:li>", RegexOptions.Singleline)]
    private static partial Regex DcTitle();

    // ---- qpdf JSON helpers ----------------------------------------------------------------------------------

    [GeneratedRegex(@"^\d+ \d+ R$")]
    private static partial Regex Reference();

    private JsonElement Obj(string reference)
    {
        if (!objects.TryGetProperty("obj:" + reference, out var o)) return default;
        if (o.TryGetProperty("value", out var v)) return v;
        return o.GetProperty("stream").GetProperty("dict");
    }

    private JsonElement Resolve(JsonElement e) =>
        e.ValueKind == JsonValueKind.String && Reference().IsMatch(e.GetString()!) ? Obj(e.GetString()!) : e;

    private byte[]? Data(JsonElement reference)
        => reference.ValueKind == JsonValueKind.String ? Data(reference.GetString()!) : null;

    private byte[]? Data(string reference)
    {
        if (!objects.TryGetProperty("obj:" + reference, out var o)) return null;
        if (!o.TryGetProperty("stream", out var s) || !s.TryGetProperty("data", out var d)) return null;
        return Convert.FromBase64String(d.GetString()!);
    }

    private static JsonElement? Get(JsonElement dict, string key) =>
        dict.ValueKind == JsonValueKind.Object && dict.TryGetProperty(key, out var v)
            && v.ValueKind != JsonValueKind.Null ? v : null;

    private static IEnumerable<JsonElement> Items(JsonElement e) => e.ValueKind switch
    {
        JsonValueKind.Array => e.EnumerateArray(),
        JsonValueKind.Undefined or JsonValueKind.Null => [],
        _ => [e],
    };

    /// <summary>A name, or a string decoded from qpdf's "u:" (text) or "b:" (hex bytes) form.</summary>
    private static string Str(JsonElement e)
    {
        if (e.ValueKind != JsonValueKind.String) return "";
        string s = e.GetString()!;
        if (s.StartsWith("u:", StringComparison.Ordinal)) return s[2..];
        if (s.StartsWith("b:", StringComparison.Ordinal))
        {
            var bytes = Convert.FromHexString(s[2..]);
            return bytes.Length >= 2 && bytes[0] == 0xFE && bytes[1] == 0xFF
                ? Encoding.BigEndianUnicode.GetString(bytes, 2, bytes.Length - 2)
                : Encoding.Latin1.GetString(bytes);
        }
        return s;
    }
}
