using System.Globalization;
using System.Net;
using System.Text;
using System.Text.Json;
using System.Text.RegularExpressions;

namespace Briefwright.Brief.Tests.Formats;

/// <summary>
/// The web page of the national demo brief: self-contained, structured for assistive technology, and holding the same
/// numbers as the results data. Structure rules follow WCAG 2.2 and the HTML standard's table model (header cells with
/// scope, captions; landmarks; the lang attribute; SVG images named by title and desc as ARIA 1.2 describes).
/// </summary>
public class HtmlTests
{
    private static string Html => Encoding.UTF8.GetString(FormatsDemo.File(FormatsDemo.National, "html"));

    [Fact]
    public void Page_makes_no_external_request()
    {
        string html = Html;
        Assert.DoesNotContain("<link", html, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain("<script", html, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain("@import", html, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain("<iframe", html, StringComparison.OrdinalIgnoreCase);
        // Every resource the page loads is inline: images as data URIs, SVG references within the page.
        foreach (Match m in Regex.Matches(html, @"\s(?:src|xlink:href)=""([^""]*)"""))
            Assert.True(
                m.Groups[1].Value.StartsWith("data:", StringComparison.Ordinal) || m.Groups[1].Value.StartsWith('#'),
                m.Value);
        foreach (Match m in Regex.Matches(html, @"url\(([^)]*)\)"))
            Assert.StartsWith("#", m.Groups[1].Value.Trim('"', '\''));
    }

    [Fact]
    public void Page_has_language_landmarks_and_the_outline_as_headings()
    {
        string html = Html;
        Assert.Contains("<html lang=\"en-GB\">", html);
        foreach (var landmark in new[] {
            "<header",
            "<nav aria-label=",
            "<main id=\"main\">",
            "<footer>" }) Assert.Contains(landmark, html);
        Assert.Single(Regex.Matches(html, "<h1[ >]"));
        // The numbered sections of the PDF, in order, each a labelled region.
        var sections = Regex.Matches(html, @"<h2 id=""(s-\d+)""><span class=""num"">(\d+)</span> ")
            .Select(m => int.Parse(m.Groups[2].Value, CultureInfo.InvariantCulture))
            .ToList();
        Assert.True(sections.Count >= 6, $"{sections.Count} sections");
        Assert.Equal(Enumerable.Range(1, sections.Count), sections);
        foreach (Match m in Regex.Matches(html, @"<h2 id=""(s-\d+)"""))
            Assert.Contains($"<section aria-labelledby=\"{m.Groups[1].Value}\">", html);
        var markdownSections = FormatsDemo.National.Markdown.Split('\n')
            .Count(l => l.StartsWith("## ", StringComparison.Ordinal));
        Assert.Equal(markdownSections, sections.Count);
        Assert.Contains("@media print", html);
        Assert.Contains("not forecasts", html);
    }

    [Fact]
    public void Tables_have_captions_and_scoped_header_cells()
    {
        string html = Html;
        var tables = Regex.Matches(html, "<table id=\"table-(\\d+)\">(.*?)</table>", RegexOptions.Singleline);
        Assert.True(tables.Count >= 6, $"{tables.Count} tables");
        foreach (Match t in tables)
        {
            string body = t.Groups[2].Value;
            Assert.Matches("<caption id=\"table-\\d+-caption\"><span class=\"label\">Table \\d+\\.</span> \\S", body);
            Assert.DoesNotContain("<th>", body);
            Assert.DoesNotMatch("<th(?=[\\s>])(?! scope=\"(?:col|row)\")", body);
            Assert.Contains("<th scope=\"col\"", body);
        }
    }

    [Fact]
    public void Charts_are_inline_svg_with_title_and_description()
    {
        string html = Html;
        var brief = FormatsDemo.National;
        var svgs = Regex.Matches(html,
            "<svg [^>]*role=\"img\" aria-labelledby=\"([^ ]+)-title \\1-desc\">\\s*<title " +
            "id=\"\\1-title\">([^<]+)</title><desc id=\"\\1-desc\">([^<]+)</desc>");
        int figures = brief.Markdown.Split('\n').Count(l => l.StartsWith("[[figure:", StringComparison.Ordinal));
        Assert.Equal(figures, svgs.Count);
        Assert.Equal(figures, Regex.Matches(html, "<svg ").Count);
        foreach (Match m in svgs)
        {
            Assert.StartsWith("Figure ", m.Groups[2].Value);
            Assert.True(m.Groups[3].Value.Length > 40, m.Groups[3].Value);
        }
        // Ids are unique on the page although every chart numbers its clip paths from 1.
        var ids = Regex.Matches(html, " id=\"([^\"]+)\"").Select(m => m.Groups[1].Value).ToList();
        Assert.Equal(ids.Count, ids.Distinct().Count());
    }

    [Fact]
    public void Key_findings_and_results_tables_hold_the_results_data_rounded()
    {
        var problems = NumberCheck.Check(Html, FormatsDemo.Json(FormatsDemo.National));
        Assert.True(problems.Count == 0, string.Join("\n", problems));
    }

    [Fact]
    public void Number_check_fails_when_a_number_differs()
    {
        string html = Html;
        var json = FormatsDemo.Json(FormatsDemo.National);
        // A digit changed in the options table, and one in the key findings: each is caught.
        string changedRow = Regex.Replace(
            html,
            @"(<td class=""r"">)(\d+\.\d)(%?</td>)",
            m => m.Groups[1].Value + "99.9" + m.Groups[3].Value,
            RegexOptions.None,
            TimeSpan.FromSeconds(1));
        Assert.NotEqual(html, changedRow);
        Assert.NotEmpty(NumberCheck.Check(changedRow, json));
        int box = html.IndexOf("<section class=\"box\"", StringComparison.Ordinal);
        var first = Regex.Match(html[box..], @"\d+\.\d%");
        string changedFinding = html[..(box + first.Index)] + "47.3%" + html[(box + first.Index + first.Length)..];
        Assert.NotEmpty(NumberCheck.Check(changedFinding, json));
    }

    /// <summary>
    /// Reads numbers off the page and compares each with the results data rounded to the digits printed.
    /// </summary>
    internal static class NumberCheck
    {
        private static readonly Regex Number = new(@"[+\-−]?\d[\d,]*(?:\.\d+)?", RegexOptions.Compiled);

        public static string Plain(string html) =>
            WebUtility.HtmlDecode(Regex.Replace(html, "<[^>]+>", "")).Trim();

        /// <summary>
        /// The numbers in a text with the digits after the point: "−0.7%" is (-0.7, 1); "2,000" is (2000, 0).
        /// </summary>
        public static List<(double Value, int Decimals, string Text)> Numbers(
            string text) => Number.Matches(text).Select(m =>
        {
            string s = m.Value.Replace("−", "-", StringComparison.Ordinal).Replace(",", "", StringComparison.Ordinal);
            int dot = s.IndexOf('.', StringComparison.Ordinal);
            return (double.Parse(s, CultureInfo.InvariantCulture), dot < 0 ? 0 : s.Length - dot - 1, m.Value);
        }).ToList();

        public static bool Rounds(double exact, double shown, int decimals) =>
            Math.Abs(Math.Round(exact, decimals, MidpointRounding.AwayFromZero) - shown) < 1e-9
            || Math.Abs(Math.Round(exact, decimals, MidpointRounding.ToEven) - shown) < 1e-9;

        public static List<List<string>> Rows(string html, string captionStart)
        {
            var table = Regex.Match(html,
                "<table id=\"table-\\d+\">\\s*<caption[^>]*><span class=\"label\">Table " +
                "\\d+\\.</span> " + Regex.Escape(captionStart) + ".*?</table>", RegexOptions.Singleline);
            Assert.True(table.Success, $"no table whose caption starts '{captionStart}'");
            return Regex.Matches(table.Value, "<tr>(.*?)</tr>", RegexOptions.Singleline)
                .Select(r => Regex.Matches(r.Groups[1].Value, "<t[hd][^>]*>(.*?)</t[hd]>", RegexOptions.Singleline)
                    .Select(c => Plain(c.Groups[1].Value))
                    .ToList()).ToList();
        }

        /// <summary>
        /// One printed cell against the value it shows (a percent in points, a year, an index); "–" and "none" stand
        /// for no value.
        /// </summary>
        private static void Cell(List<string> problems, string where, string cell, double? exact, double scale = 1)
        {
            var numbers = Numbers(cell);
            if (exact is null || cell is "–" or "none")
            {
                if (exact is not null && cell == "none" && exact >= 0) return; // "none": no dip
                if (exact is not null && numbers.Count > 0) problems.Add($"{where}: '{cell}' but the data has {exact}");
                return;
            }
            if (cell.StartsWith('<') && numbers.Count == 1) { if (exact * scale >= numbers[0].Value) problems.Add(
                $"{where}: '{cell}' but the data has {exact * scale}"); return; }
            if (numbers.Count != 1 || !Rounds(exact.Value * scale, numbers[0].Value, numbers[0].Decimals))
                problems.Add($"{where}: shows '{cell}', the results data has {exact.Value * scale}");
        }

        public static List<string> Check(string html, JsonElement json)
        {
            var problems = new List<string>();
            var options = json.GetProperty("options").EnumerateArray().ToList();
            var labels = options.ToDictionary(o => o.GetProperty("label").GetString()!, o => o);

            // Results by option: schooling, workers per person, human capital, output index (baseline = 100), change.
            var optionRows = Rows(html, "Long-run output per person by option");
            double baseOutput = options.Single(o => o.GetProperty("is_baseline").GetBoolean())
                .GetProperty("output_per_person")
                .GetDouble();
            foreach (var row in optionRows.Skip(1))
            {
                string label = row[0].Replace(" (baseline)", "", StringComparison.Ordinal);
                if (!labels.TryGetValue(label, out var o)) { problems.Add(
                    $"options table: unknown option '{row[0]}'"); continue; }
                Cell(problems, $"options/{label}/schooling", row[1], o.GetProperty("schooling_years").GetDouble());
                Cell(problems, $"options/{label}/workers", row[2], o.GetProperty("worker_share").GetDouble());
                Cell(
                    problems,
                    $"options/{label}/human capital",
                    row[3],
                    o.GetProperty("human_capital_per_worker").GetDouble());
                Cell(
                    problems,
                    $"options/{label}/output",
                    row[4],
                    o.GetProperty("output_per_person").GetDouble() / baseOutput * 100);
                Cell(problems, $"options/{label}/change", row[5], o.GetProperty("is_baseline").GetBoolean()
                    ? null
                    : o.GetProperty("change_vs_baseline_pct").GetDouble());
            }
            if (optionRows.Count != options.Count + 1) problems.Add(
                $"options table has {optionRows.Count - 1} rows, the data {options.Count}");

            // The reform over time: deepest dip, its year, first year above, payback, change at the horizon, once
            // adjusted.
            var reform = json.GetProperty("analysis").GetProperty("reform");
            var paths = reform.GetProperty("options").EnumerateArray().ToDictionary(
                r => options.Single(o => o.GetProperty("id").GetString() == r.GetProperty("option_id").GetString())
                    .GetProperty("label")
                    .GetString()!, r => r);
            var reformRows = Rows(html, "The reform over time");
            foreach (var row in reformRows.Skip(1))
            {
                var r = paths[row[0]];
                var path = r.GetProperty("path");
                double? Opt(JsonElement e, string name)
                    => e.TryGetProperty(name, out var v) && v.ValueKind == JsonValueKind.Number ? v.GetDouble() : null;
                var gains = path.GetProperty("gain").EnumerateArray().Select(g => g.GetDouble()).ToList();
                double? dip = Opt(path, "dip_depth");
                Cell(problems, $"reform/{row[0]}/dip", row[1], dip is < 0 ? dip : null, 100);
                Cell(problems, $"reform/{row[0]}/dip year", row[2], dip is < 0 ? Opt(path, "dip_calendar_year") : null);
                Cell(problems, $"reform/{row[0]}/above from", row[3], Opt(path, "first_positive_calendar_year"));
                Cell(
                    problems,
                    $"reform/{row[0]}/pays back",
                    row[4],
                    Opt(r.GetProperty("present_values")[0], "break_even_calendar_year"));
                Cell(problems, $"reform/{row[0]}/at horizon", row[5], gains[^1], 100);
                Cell(problems, $"reform/{row[0]}/once adjusted", row[6], Opt(path, "balanced_growth_gain"), 100);
            }
            if (reformRows.Count != paths.Count + 1) problems.Add(
                $"reform table has {reformRows.Count - 1} rows, the data {paths.Count}");

            // Present values: one column per discount schedule, in years of output per person.
            var pvRows = Rows(html, "Present value of the gain");
            foreach (var row in pvRows.Skip(1))
            {
                var pvs = paths[row[0]].GetProperty("present_values").EnumerateArray().ToList();
                for (int c = 1; c < row.Count; c++)
                {
                    var pv = pvs.Single(p => p.GetProperty("schedule_label").GetString() == pvRows[0][c]);
                    Cell(
                        problems,
                        $"present values/{row[0]}/{pvRows[0][c]}",
                        row[c],
                        pv.GetProperty("to_horizon").GetDouble());
                }
            }

            // Monte Carlo: 5th percentile, median, 95th percentile of the long-run change; the probability of a gain.
            var mc = json.GetProperty("analysis").GetProperty("monte_carlo").GetProperty("options").EnumerateArray()
                .ToDictionary(
                    m => options.Single(o => o.GetProperty("id").GetString() == m.GetProperty("option_id").GetString())
                    .GetProperty("label")
                    .GetString()!, m => m);
            foreach (var row in Rows(html, "Uncertainty: long-run change").Skip(1))
            {
                var change = mc[row[0]].GetProperty("long_run_change_pct");
                Cell(problems, $"monte carlo/{row[0]}/p5", row[1], change.GetProperty("p5").GetDouble());
                Cell(problems, $"monte carlo/{row[0]}/median", row[2], change.GetProperty("p50").GetDouble());
                Cell(problems, $"monte carlo/{row[0]}/p95", row[3], change.GetProperty("p95").GetDouble());
                var p = mc[row[0]].GetProperty("probability_gain");
                double estimate = (p.ValueKind == JsonValueKind.Object ? p.GetProperty("estimate") : p).GetDouble()
                    * 100;
                var shown = Numbers(row[4]);
                if (row[4].Contains("or more", StringComparison.Ordinal)
                    ? estimate < shown[0].Value
                    : !Rounds(estimate, shown[0].Value, shown[0].Decimals))
                    problems.Add($"monte carlo/{row[0]}/probability: shows '{row[4]}', the data has {estimate}");
            }

            // Key findings: every number is one of the headline facts, an option's schooling or change, a lever's
            // share, or a number written in an option's or schedule's label (scenario text); "90%" is the width of the
            // range shown (5th to 95th percentile, fixed by the method).
            var candidates = new List<double> { 90 };
            foreach (var p in json.GetProperty("headline").EnumerateObject())
                if (p.Value.ValueKind == JsonValueKind.Number) { candidates.Add(p.Value.GetDouble()); candidates.Add(
                    Math.Abs(p.Value.GetDouble())); }
            foreach (var o in options) { candidates.Add(o.GetProperty("schooling_years").GetDouble()); candidates.Add(
                o.GetProperty("change_vs_baseline_pct").GetDouble()); }
            foreach (var d in json.GetProperty("lever_decomposition").EnumerateArray())
                foreach (var l in d.GetProperty("levers").EnumerateArray()) candidates.Add(
                    l.GetProperty("change_pct").GetDouble());
            var labelTexts = options.Select(o => o.GetProperty("label").GetString()!)
                .Concat(paths.Values.SelectMany(r => r.GetProperty("present_values").EnumerateArray()
                    .Select(p => p.GetProperty("schedule_label").GetString()!))).ToList();
            foreach (var label in labelTexts) candidates.AddRange(Numbers(label).Select(n => Math.Abs(n.Value)));
            var box = Regex.Match(html, "<section class=\"box\".*?</section>", RegexOptions.Singleline);
            if (!box.Success) problems.Add("no key findings box");
            var items = Regex.Matches(box.Value, "<li>(.*?)</li>", RegexOptions.Singleline)
                .Select(m => Plain(m.Groups[1].Value))
                .ToList();
            if (items.Count < 3) problems.Add($"{items.Count} key findings");
            foreach (var item in items)
                foreach (var n in Numbers(item))
                    if (!candidates.Any(c => Rounds(c, n.Value, n.Decimals)))
                        problems.Add($"key findings: '{n.Text}' in \"{item}\" is not in the results data");
            return problems;
        }
    }
}

/// <summary>
/// The web page and the editable document of the invented French-language demo brief (Val-Dorée) are in French: the
/// page's lang attribute, its own words (skip link, contents, cautions), figure and table labels, source lines and date
/// follow the brief's language, as the PDF's do. Expected words are written out here, not read from the language files.
/// </summary>
public class FrenchFormatsTests
{
    private static readonly Lazy<BuiltBrief> Brief = new(() => FormatsDemo.Build("auroria-valdoree"));

    [Fact]
    public void Web_page_is_in_the_brief_language()
    {
        string html = Encoding.UTF8.GetString(FormatsDemo.File(Brief.Value, "html"));
        Assert.Contains("<html lang=\"fr-FR\"", html);
        Assert.Contains(">Aller à la note</a>", html);
        Assert.Contains("<p class=\"toc-title\">Sommaire</p>", html);
        Assert.Contains("<span class=\"label\">Figure 1.</span>", html);
        Assert.Contains("<span class=\"label\">Tableau 1.</span>", html);
        Assert.Contains("<em>Source :</em>", html);
        Assert.Contains("30 novembre 2026", html);
        Assert.Contains("pas des prévisions", html);
        foreach (var english in new[] {
            "Contents",
            "Skip to the brief",
            "not forecasts",
            "<em>Source:</em>",
            "Table 1.",
            "November" })
            Assert.DoesNotContain(english, html);
    }

    [Fact]
    public void Editable_document_labels_are_in_the_brief_language()
    {
        using var zip = new System.IO.Compression.ZipArchive(new MemoryStream(FormatsDemo.File(Brief.Value, "docx")));
        using var reader = new StreamReader(zip.GetEntry("word/document.xml")!.Open());
        string xml = reader.ReadToEnd();
        Assert.Contains(">Tableau </w:t>", xml);
        Assert.Contains(">Source : </w:t>", xml);
        Assert.Contains(">Scénario ", xml);
        Assert.DoesNotContain(">Table </w:t>", xml);
        Assert.DoesNotContain(">Source: </w:t>", xml);
    }
}
