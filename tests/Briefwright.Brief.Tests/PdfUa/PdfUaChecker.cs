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

    // ---- Structure tree -------------------------------------------------------------------------------------

    private void ReadRoleMap(JsonElement root)
    {
        if (Get(root, "/RoleMap") is not { } rm) return;
        foreach (var entry in Resolve(rm).EnumerateObject())
            roleMap[entry.Name.TrimStart('/')] = Str(entry.Value).TrimStart('/');
        foreach (var (from, _) in roleMap)
        {
            // 02-004: standard types must not be remapped; 02-001/02-003: a mapping must end in a standard type.
            if (StandardTypes.Contains(from)) Fail("02-004", $"the standard type {from} is remapped");
            var seen = new HashSet<string> { from };
            string t = from;
            while (roleMap.TryGetValue(t, out var next))
            {
                if (!seen.Add(next)) { Fail("02-003", $"circular role mapping from {from}"); break; }
                t = next;
            }
            if (!StandardTypes.Contains(t)) Fail("02-001", $"the type {from} does not map to a standard type");
        }
    }

    private string TypeOf(JsonElement element)
    {
        string s = Str(Get(element, "/S") ?? default).TrimStart('/');
        for (int i = 0; i < 10 && roleMap.TryGetValue(s, out var to); i++) s = to;
        return s;
    }

    private void Walk(JsonElement kidRef, string parentType, string? inheritedPage, List<string> path)
    {
        var kid = Resolve(kidRef);
        if (kid.ValueKind != JsonValueKind.Object) return;
        string type = TypeOf(kid);
        string where = string.Join('/', path.Append(type));
        string? page = Get(kid, "/Pg") is { } pg ? pg.GetString() : inheritedPage;
        string id = kidRef.ValueKind == JsonValueKind.String ? kidRef.GetString()! : where;

        CheckNesting(type, parentType, where);
        CheckElement(kid, type, where, page);

        if (Get(kid, "/K") is not { } k) return;
        var childTypes = new List<string>();
        foreach (var item in Items(k))
        {
            if (item.ValueKind == JsonValueKind.Number)
            {
                AddMcid(page, (int)item.GetDouble(), id, where);
                continue;
            }
            var child = Resolve(item);
            if (child.ValueKind != JsonValueKind.Object) continue;
            string childKind = Str(Get(child, "/Type") ?? default);
            if (childKind == "/MCR")
            {
                string? mcrPage = Get(child, "/Pg") is { } p2 ? p2.GetString() : page;
                AddMcid(mcrPage, (int)Get(child, "/MCID")!.Value.GetDouble(), id, where);
            }
            else if (childKind == "/OBJR")
            {
                if (Get(child, "/Obj") is { } obj && obj.ValueKind == JsonValueKind.String)
                    annotationParents[obj.GetString()!] = type;
            }
            else
            {
                childTypes.Add(TypeOf(child));
                path.Add(type);
                Walk(item, type, page, path);
                path.RemoveAt(path.Count - 1);
            }
        }
        if (type == "Table" && childTypes.Any(t => t is not ("TR" or "THead" or "TBody" or "TFoot" or "Caption")))
            Fail("09-004", $"{where} holds {string.Join(", ", childTypes.Distinct())}: a table holds rows, row " +
                "groups and a caption");
        if (type == "L" && childTypes.Any(t => t is not ("LI" or "Caption" or "L")))
            Fail("09-005", $"{where} holds {string.Join(", ", childTypes.Distinct())}: a list holds list items");
        if (type == "Table") CheckHeaderScopes(kid, where);
    }

    private void AddMcid(string? page, int mcid, string element, string where)
    {
        if (page is null)
        {
            Fail("01-005 (ISO 32000-1 14.7.4.2)", $"{where} marks content {mcid} without naming its page");
            return;
        }
        if (!treeMcids.TryGetValue(page, out var list)) treeMcids[page] = list = new();
        list.Add((mcid, element));
    }

    /// <summary>09-004 and 09-005: table and list parts sit where ISO 32000-1 tables 336 and 337 allow them.</summary>
    private void CheckNesting(string type, string parent, string where)
    {
        bool ok = type switch
        {
            "TR" => parent is "Table" or "THead" or "TBody" or "TFoot",
            "TH" or "TD" => parent == "TR",
            "THead" or "TBody" or "TFoot" => parent == "Table",
            "LI" => parent == "L",
            "Lbl" or "LBody" => parent == "LI",
            _ => true,
        };
        if (!ok) Fail(type is "LI" or "Lbl" or "LBody" ? "09-005" : "09-004", $"{where}: {type} inside {parent}");
    }

    private void CheckElement(JsonElement element, string type, string where, string? page)
    {
        if (type is "H1" or "H2" or "H3" or "H4" or "H5" or "H6") headingLevels.Add(type[1] - '0');
        if (type == "H") usesPlainH = true;
        if (type is "Figure" or "Formula")
        {
            string alt = Get(element, "/Alt") is { } a ? Str(a) : Get(element, "/ActualText") is { } at ? Str(at) : "";
            string checkpoint = type == "Figure" ? "13-004" : "17-002";
            if (alt.Trim().Length == 0) Fail(checkpoint, $"{where} has no alternative text");
            else if (FileName().IsMatch(alt.Trim()))
                Fail(checkpoint, $"{where}: the alternative text is a file name ('{alt}'); needs a description " +
                    "(human check beyond this)");
            CheckBoundingBox(element, where, page);
        }
        if (type == "Link"
            && !Items(Get(element, "/K") ?? default).Any(k => Str(Get(Resolve(k), "/Type") ?? default) == "/OBJR"))
            Fail("28-011", $"{where} holds no link annotation (OBJR)");
    }

    [GeneratedRegex(@"^[\w\-. ]+\.(png|jpe?g|gif|svg|pdf|tiff?|bmp|emf|wmf)$", RegexOptions.IgnoreCase)]
    private static partial Regex FileName();

    /// <summary>
    /// Figures and formulas carry a layout BBox (ISO 32000-1 14.8.5.4.3, required for Figure, Formula and Table when
    /// the content is laid out; not one of the Matterhorn failure conditions, checked because screen magnifiers
    /// and reflow use it) that lies on the page.
    /// </summary>
    private void CheckBoundingBox(JsonElement element, string where, string? page)
    {
        var bbox = Get(element, "/A") is { } a
            ? Items(a).Select(Resolve).Select(x => Get(x, "/BBox")).FirstOrDefault(b => b is not null)
            : null;
        if (bbox is null)
        {
            Fail("ISO 32000-1 14.8.5.4.3", $"{where} has no BBox layout attribute");
            return;
        }
        var box = Items(bbox.Value).Select(v => v.GetDouble()).ToArray();
        if (page is null || box.Length != 4) return;
        if (Get(Obj(page), "/MediaBox") is not { } mediaBox) return;
        var media = Items(mediaBox).Select(v => v.GetDouble()).ToArray();
        if (box[0] < media[0] - 1 || box[1] < media[1] - 1 || box[2] > media[2] + 1 || box[3] > media[3] + 1
            || box[2] <= box[0]
            || box[3] <= box[1])
            Fail("ISO 32000-1 14.8.5.4.3", $"{where}: BBox [{string.Join(' ', box)}] does not lie on the page");
    }

    /// <summary>15-003: in a table not organised with Headers and IDs, every TH has a Scope.</summary>
    private void CheckHeaderScopes(JsonElement table, string where)
    {
        var cells = new List<JsonElement>();
        void Collect(JsonElement e)
        {
            foreach (var k in Items(Get(e, "/K") ?? default))
            {
                var c = Resolve(k);
                if (c.ValueKind != JsonValueKind.Object || Get(c, "/S") is null) continue;
                if (TypeOf(c) is "TH" or "TD") cells.Add(c);
                else if (TypeOf(c) is "TR" or "THead" or "TBody" or "TFoot") Collect(c);
            }
        }
        Collect(table);
        bool usesHeaders = cells.Any(c => Attribute(c, "/Headers") is not null);
        if (usesHeaders) return;
        int missing = cells.Count(c => TypeOf(c) == "TH" && Attribute(c, "/Scope") is not { } s
            || TypeOf(c) == "TH" && Str(Attribute(c, "/Scope")!.Value) is not ("/Row" or "/Column" or "/Both"));
        if (missing > 0) Fail(
            "15-003",
            $"{where}: {missing} header cell(s) (TH) without a Scope attribute, in a table without Headers and IDs");
    }

    private JsonElement? Attribute(JsonElement element, string key)
    {
        if (Get(element, "/A") is not { } a) return null;
        foreach (var item in Items(a))
        {
            var dict = Resolve(item);
            if (dict.ValueKind == JsonValueKind.Object && Get(dict, key) is { } v) return v;
        }
        return null;
    }

    /// <summary>
    /// 14-002, 14-003, 14-007: numbered headings start at H1, do not skip levels going down, and are not mixed with H.
    /// </summary>
    private void CheckHeadings()
    {
        if (usesPlainH && headingLevels.Count > 0) Fail("14-007", "the document uses both H and numbered headings");
        if (headingLevels.Count == 0) return;
        if (headingLevels[0] != 1) Fail("14-002", $"the first numbered heading is H{headingLevels[0]}, not H1");
        for (int i = 1; i < headingLevels.Count; i++)
            if (headingLevels[i] > headingLevels[i - 1] + 1)
                Fail("14-003", $"H{headingLevels[i]} follows H{headingLevels[i - 1]}: a heading level is skipped");
    }

    // ---- Pages: annotations and content ---------------------------------------------------------------------

    private IEnumerable<string> PageRefs(JsonElement node)
    {
        foreach (var kid in Items(Get(node, "/Kids") ?? default))
        {
            var k = Resolve(kid);
            if (Str(Get(k, "/Type") ?? default) == "/Pages") foreach (var p in PageRefs(k)) yield return p;
            else yield return kid.GetString()!;
        }
    }

    private void CheckAnnotations(string pageRef, int index)
    {
        var page = Obj(pageRef);
        if (Get(page, "/Annots") is not { } annots) return;
        var list = Items(Resolve(annots)).ToList();
        if (list.Count == 0) return;
        var tabs = Get(page, "/Tabs");
        if (tabs is null) Fail("28-008", $"page {index} has annotations and no Tabs entry");
        else if (Str(tabs.Value) != "/S")
            Fail("28-009", $"page {index} has annotations and Tabs {Str(tabs.Value)}, not /S");
        foreach (var aRef in list)
        {
            var a = Resolve(aRef);
            string subtype = Str(Get(a, "/Subtype") ?? default);
            string key = aRef.ValueKind == JsonValueKind.String ? aRef.GetString()! : "";
            annotationParents.TryGetValue(key, out var parent);
            string contents = Get(a, "/Contents") is { } c ? Str(c) : "";
            if (subtype == "/Link")
            {
                if (parent != "Link") Fail(
                    "28-011",
                    $"page {index}: a link annotation is not inside a Link structure element");
                if (contents.Trim().Length == 0) Fail(
                    "28-012",
                    $"page {index}: a link annotation has no alternative description (Contents)");
            }
            else if (subtype is not ("/Widget" or "/PrinterMark" or "/Popup"))
            {
                if (parent != "Annot") Fail(
                    "28-002",
                    $"page {index}: a {subtype} annotation is not inside an Annot structure element");
                if (contents.Trim().Length == 0)
                    Fail("28-004", $"page {index}: a {subtype} annotation has no Contents");
            }
        }
    }

    /// <summary>The parent tree: for each page's StructParents key, the structure element of each MCID.</summary>
    private Dictionary<int, List<string?>> ParentTree(JsonElement root)
    {
        var map = new Dictionary<int, List<string?>>();
        void Read(JsonElement node)
        {
            if (Get(node, "/Nums") is { } nums)
            {
                var items = Items(nums).ToList();
                for (int i = 0; i + 1 < items.Count; i += 2)
                {
                    var value = Resolve(items[i + 1]);
                    map[(int)items[i].GetDouble()] = value.ValueKind == JsonValueKind.Array
                        ? value.EnumerateArray().Select(e => e.ValueKind == JsonValueKind.String ? e.GetString() : null)
                            .ToList()
                        : new List<string?> { items[i + 1].GetString() };
                }
            }
            foreach (var kid in Items(Get(node, "/Kids") ?? default)) Read(Resolve(kid));
        }
        if (Get(root, "/ParentTree") is { } pt) Read(Resolve(pt));
        return map;
    }

    private void CheckContent(string pageRef, int index, Dictionary<int, List<string?>> parentTree)
    {
        var page = Obj(pageRef);
        var content = new List<byte>();
        foreach (var c in Items(Get(page, "/Contents") ?? default))
        {
            content.AddRange(
                Data(c) ?? throw new InvalidOperationException($"page {index}: content stream not decoded"));
            content.Add((byte)'\n');
        }
        var forms = FormXObjects(Get(page, "/Resources"));
        var scan = ScanContent(content.ToArray(), forms);
        foreach (var f in scan.Findings) Fail(f.Checkpoint, $"page {index}: {f.Message}");
        foreach (var (form, count) in scan.FormUses)
            if (count > 1 && FormHasMcid(form)) Fail(
                "30-002",
                $"page {index}: a form XObject with marked content IDs is drawn {count} times");

        treeMcids.TryGetValue(pageRef, out var inTree);
        inTree ??= new();
        var treeSet = inTree.Select(x => x.Mcid).ToHashSet();
        var untagged = scan.Mcids.Where(m => !treeSet.Contains(m)).ToList();
        if (untagged.Count > 0)
            Fail(
                "01-005",
                $"page {index}: marked content {string.Join(", ", untagged.Take(5))} is in no structure element");
        var dangling = treeSet.Where(m => !scan.Mcids.Contains(m)).ToList();
        if (dangling.Count > 0)
            Fail("ISO 32000-1 14.7.4.2",
                $"page {index}: structure elements point at marked content {string.Join(", ", dangling.Take(5))} " +
                "that the page does not have");

        // The parent tree must lead each MCID back to the element that holds it (what assistive technology follows).
        if (inTree.Count > 0)
        {
            if (Get(page, "/StructParents") is not { } sp
                || !parentTree.TryGetValue((int)sp.GetDouble(), out var parents))
                Fail(
                    "ISO 32000-1 14.7.4.4",
                    $"page {index} has tagged content but no parent tree entry (StructParents)");
            else
                foreach (var (mcid, element) in inTree)
                    if (mcid >= parents.Count || parents[mcid] != element)
                        Fail(
                            "ISO 32000-1 14.7.4.4",
                            $"page {index}: the parent tree does not lead MCID {mcid} back to its element");
        }

        // 09-001 needs a person (does the order make sense?); what a machine can see: the structure tree visits the
        // page's marked content in the order it is drawn.
        var order = inTree.Select(x => x.Mcid).ToList();
        var drawn = scan.Mcids.Where(treeSet.Contains).ToList();
        if (!order.SequenceEqual(drawn))
            Fail("09-001", $"page {index}: the structure order of the content differs from the order it is drawn");
    }

    private Dictionary<string, string> FormXObjects(JsonElement? resources)
    {
        var forms = new Dictionary<string, string>(StringComparer.Ordinal);
        if (resources is null) return forms;
        if (Get(Resolve(resources.Value), "/XObject") is not { } xo) return forms;
        foreach (var entry in Resolve(xo).EnumerateObject())
            if (Str(Get(Resolve(entry.Value), "/Subtype") ?? default) == "/Form")
            {
                forms[entry.Name] = entry.Value.GetString()!;
                if (Get(Resolve(entry.Value), "/Ref") is not null) Fail(
                    "30-001",
                    $"the form XObject {entry.Name} is a reference XObject");
            }
        return forms;
    }

    private bool FormHasMcid(string formRef) =>
        Data(formRef) is { } d && Encoding.Latin1.GetString(d).Contains("/MCID", StringComparison.Ordinal);

    /// <summary>What a page's content stream shows about marked content.</summary>
    public sealed record ContentScan(
        IReadOnlyList<Finding> Findings,
        IReadOnlyList<int> Mcids,
        IReadOnlyDictionary<string, int> FormUses);

    private static readonly HashSet<string> PaintingOperators = new(StringComparer.Ordinal)
    {
        "Tj", "TJ", "'", "\"", "S", "s", "f", "F", "f*", "B", "B*", "b", "b*", "sh", "Do", "EI",
    };

    /// <summary>
    /// Follows the marked-content operators of a content stream: 01-005 (content neither tagged nor an artifact),
    /// 01-004 (tagged content inside an artifact), 01-003 (an artifact inside tagged content).
    /// <paramref name="forms"/> maps resource names of form XObjects to their objects (drawn inside the context of
    /// the Do, so their content belongs to the enclosing tag or artifact).
    /// </summary>
    public static ContentScan ScanContent(byte[] content, IReadOnlyDictionary<string, string>? forms = null)
    {
        var found = new List<Finding>();
        var mcids = new List<int>();
        var formUses = new Dictionary<string, int>(StringComparer.Ordinal);
        var stack = new List<(bool Artifact, bool Tagged)>();
        var operands = new List<string>();
        int untagged = 0, artifactInTagged = 0, taggedInArtifact = 0;
        foreach (var token in Tokens(content))
        {
            if (!token.IsOperator)
            {
                operands.Add(token.Text);
                continue;
            }
            switch (token.Text)
            {
                case "BMC":
                case "BDC":
                {
                    string tag = operands.FirstOrDefault(o => o.StartsWith('/')) ?? "";
                    bool artifact = tag == "/Artifact";
                    int? mcid = null;
                    int at = operands.IndexOf("/MCID");
                    if (token.Text == "BDC" && at >= 0 && at + 1 < operands.Count
                        && int.TryParse(operands[at + 1], CultureInfo.InvariantCulture, out int id))
                        mcid = id;
                    bool insideArtifact = stack.Any(s => s.Artifact), insideTagged = stack.Any(s => s.Tagged);
                    if (artifact && insideTagged) artifactInTagged++;
                    if (mcid is not null && insideArtifact) taggedInArtifact++;
                    if (mcid is { } m) mcids.Add(m);
                    stack.Add((artifact, mcid is not null));
                    break;
                }
                case "EMC":
                    if (stack.Count == 0) found.Add(
                        new Finding("ISO 32000-1 14.6", "EMC without a matching BMC or BDC"));
                    else stack.RemoveAt(stack.Count - 1);
                    break;
                default:
                    if (PaintingOperators.Contains(token.Text))
                    {
                        if (!stack.Any(s => s.Artifact || s.Tagged)) untagged++;
                        if (token.Text == "Do" && operands.Count > 0 && forms is not null
                            && forms.TryGetValue(operands[^1], out var form))
                            formUses[form] = formUses.GetValueOrDefault(form) + 1;
                    }
                    break;
            }
            operands.Clear();
        }
        if (untagged > 0) found.Add(
            new Finding("01-005", $"{untagged} drawing operation(s) neither tagged nor marked as artifact"));
        if (taggedInArtifact > 0) found.Add(
            new Finding("01-004", $"{taggedInArtifact} tagged marked-content sequence(s) inside an artifact"));
        if (artifactInTagged > 0) found.Add(
            new Finding("01-003", $"{artifactInTagged} artifact(s) inside tagged content"));
        if (stack.Count > 0) found.Add(
            new Finding("ISO 32000-1 14.6", $"{stack.Count} marked-content sequence(s) not closed"));
        return new ContentScan(found, mcids, formUses);
    }

    private readonly record struct Token(string Text, bool IsOperator);

    /// <summary>
    /// Content stream tokens: operands (numbers, names, strings, arrays and dictionaries flattened) and operators.
    /// </summary>
    private static IEnumerable<Token> Tokens(byte[] b)
    {
        int i = 0, n = b.Length;
        while (i < n)
        {
            byte c = b[i];
            if (c is (byte)' ' or (byte)'\n' or (byte)'\r' or (byte)'\t' or (byte)'\f' or 0) { i++; continue; }
            if (c == '%') { while (i < n && b[i] is not ((byte)'\n' or (byte)'\r')) i++; continue; }
            if (c == '(')
            {
                int depth = 0, start = i;
                for (; i < n; i++)
                {
                    if (b[i] == '\\') { i++; continue; }
                    if (b[i] == '(') depth++;
                    else if (b[i] == ')' && --depth == 0) { i++; break; }
                }
                yield return new Token(Encoding.Latin1.GetString(b, start, i - start), false);
                continue;
            }
            if (c == '<' && i + 1 < n && b[i + 1] == '<') { i += 2; yield return new Token("<<", false); continue; }
            if (c == '>' && i + 1 < n && b[i + 1] == '>') { i += 2; yield return new Token(">>", false); continue; }
            if (c == '<')
            {
                int start = i;
                while (i < n && b[i] != '>') i++;
                i++;
                yield return new Token(Encoding.Latin1.GetString(b, start, i - start), false);
                continue;
            }
            if (c is (byte)'[' or (byte)']' or (byte)'{' or (byte)'}')
            {
                i++;
                yield return new Token(((char)c).ToString(), false);
                continue;
            }
            int s = i;
            if (c == '/') i++;
            while (i < n && b[i] is not ((byte)' ' or (byte)'\n' or (byte)'\r' or (byte)'\t' or (byte)'\f' or 0
                or (byte)'(' or (byte)')' or (byte)'<' or (byte)'>' or (byte)'[' or (byte)']' or (byte)'{' or (byte)'}'
                or (byte)'/' or (byte)'%')) i++;
            string word = Encoding.Latin1.GetString(b, s, i - s);
            bool isOperand = c == '/' || c is (byte)'+' or (byte)'-' or (byte)'.' || char.IsAsciiDigit((char)c)
                || word is "true" or "false" or "null";
            yield return new Token(word, !isOperand);
            if (word == "ID")
            {
                // Inline image data: skip to EI.
                while (i + 2 < n
                    && !(b[i] is (byte)' ' or (byte)'\n' or (byte)'\r' && b[i + 1] == 'E' && b[i + 2] == 'I'))
                    i++;
                i++;
            }
        }
    }

    // ---- Fonts ----------------------------------------------------------------------------------------------

    /// <summary>
    /// 31-009 (ISO 14289-1 7.21.4.1): every font that draws text is embedded. 10-001 (7.21.7): every character code
    /// maps to Unicode (a ToUnicode map on composite fonts and on simple fonts without a standard encoding).
    /// Fonts of form XObjects (the charts) are included.
    /// </summary>
    private void CheckFonts(IEnumerable<string> pages)
    {
        var seen = new HashSet<string>(StringComparer.Ordinal);
        var visitedResources = new HashSet<string>(StringComparer.Ordinal);
        void Resources(JsonElement? resRef)
        {
            if (resRef is null) return;
            if (resRef.Value.ValueKind == JsonValueKind.String && !visitedResources.Add(resRef.Value.GetString()!))
                return;
            var res = Resolve(resRef.Value);
            if (Get(res, "/Font") is { } fonts)
                foreach (var f in Resolve(fonts).EnumerateObject())
                    if (f.Value.ValueKind != JsonValueKind.String || seen.Add(f.Value.GetString()!))
                        CheckFont(Resolve(f.Value), f.Name);
            if (Get(res, "/XObject") is { } xo)
                foreach (var x in Resolve(xo).EnumerateObject())
                {
                    var form = Resolve(x.Value);
                    if (Str(Get(form, "/Subtype") ?? default) == "/Form") Resources(Get(form, "/Resources"));
                }
        }
        foreach (var p in pages) Resources(Get(Obj(p), "/Resources"));
    }

    private void CheckFont(JsonElement font, string name)
    {
        string subtype = Str(Get(font, "/Subtype") ?? default);
        string baseFont = Str(Get(font, "/BaseFont") ?? default);
        if (subtype == "/Type3") return; // glyphs are content streams; nothing to embed
        var described = subtype == "/Type0" && Get(font, "/DescendantFonts") is { } df
            ? Resolve(Items(Resolve(df)).First())
            : font;
        var descriptor = Get(described, "/FontDescriptor") is { } fd ? Resolve(fd) : (JsonElement?)null;
        if (descriptor is null || (Get(descriptor.Value, "/FontFile")
            ?? Get(descriptor.Value, "/FontFile2") ?? Get(descriptor.Value, "/FontFile3")) is null)
            Fail("31-009", $"font {name} ({baseFont}) is not embedded");
        bool standardEncoding = Get(font, "/Encoding") is { } enc
            && Str(enc) is "/WinAnsiEncoding" or "/MacRomanEncoding" or "/StandardEncoding";
        if (Get(font, "/ToUnicode") is null && (subtype == "/Type0" || !standardEncoding))
            Fail(
                "10-001",
                $"font {name} ({baseFont}) has no ToUnicode map: its character codes cannot be mapped to Unicode");
    }

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
