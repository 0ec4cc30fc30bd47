using System.Globalization;
using System.Text;
using System.Text.Json;

namespace Briefwright.Brief.Tests.PdfUa;

/// <summary>Each page: its annotations, its content stream's marked content against the structure tree, and the
/// fonts that draw its text (see <see cref="PdfUaChecker"/> for the checkpoints' source).</summary>
public sealed partial class PdfUaChecker
{
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
}
