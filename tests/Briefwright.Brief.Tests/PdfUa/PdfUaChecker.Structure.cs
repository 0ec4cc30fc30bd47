using System.Text.Json;
using System.Text.RegularExpressions;

namespace Briefwright.Brief.Tests.PdfUa;

/// <summary>The structure tree: role map, nesting of table and list parts, alternative text, bounding boxes, header
/// scopes and heading levels (see <see cref="PdfUaChecker"/> for the checkpoints' source).</summary>
public sealed partial class PdfUaChecker
{
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
}
