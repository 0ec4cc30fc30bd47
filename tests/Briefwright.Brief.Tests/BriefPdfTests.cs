using System.Text.Json;
using System.Text.RegularExpressions;
using Briefwright.Templating;
using UglyToad.PdfPig;

namespace Briefwright.Brief.Tests;

/// <summary>The demo brief read back from its PDF and checked against its own results data and PDF checkers.</summary>
public class BriefPdfTests
{
    private const string Name = "auroria-national";

    private static string Squash(string s) => Regex.Replace(s, @"\s+", "");

    private static (PdfDocument Pdf, string Text) Open()
    {
        var pdf = PdfDocument.Open(Demo.Build(Name).Pdf);
        return (pdf, string.Concat(pdf.GetPages().Select(p => p.Text)));
    }

    [Fact]
    public void Title_date_and_metadata_match_the_scenario()
    {
        var (pdf, text) = Open();
        using var _ = pdf;
        var scenario = Demo.Load(Name);
        Assert.Equal(scenario.Brief.Title, pdf.Information.Title);
        Assert.Contains(Squash(scenario.Brief.Title), Squash(pdf.GetPage(1).Text));
        Assert.Contains(Squash("30 November 2026"), Squash(pdf.GetPage(1).Text));
        Assert.Contains("schooling", pdf.Information.Keywords);
        Assert.Equal(scenario.Brief.Author, pdf.Information.Author);
    }

    [Fact]
    public void Headline_numbers_are_the_results_data_as_formatted()
    {
        var (pdf, text) = Open();
        using var _ = pdf;
        using var json = JsonDocument.Parse(Demo.Build(Name).ResultsJson);
        foreach (var option in json.RootElement.GetProperty("options").EnumerateArray())
        {
            if (option.GetProperty("is_baseline").GetBoolean()) continue;
            string change = TemplateFunctions.Change(option.GetProperty("change_vs_baseline_pct").GetDouble());
            Assert.Contains(Squash(change), Squash(text));
            double baseY = json.RootElement.GetProperty("options").EnumerateArray()
                .First(o => o.GetProperty("is_baseline").GetBoolean())
                .GetProperty("output_per_person")
                .GetDouble();
            Assert.Contains(
                Squash(TemplateFunctions.Num(100 * option.GetProperty("output_per_person").GetDouble() / baseY, 1)),
                Squash(text));
        }
        var optimum = json.RootElement.GetProperty("optimum");
        Assert.Contains(
            Squash(TemplateFunctions.Years(optimum.GetProperty("schooling_years").GetDouble())),
            Squash(text));
        var band = optimum.GetProperty("within_1pct");
        Assert.Contains(Squash(TemplateFunctions.Years(band[0].GetDouble())), Squash(text));
        Assert.Contains(Squash(TemplateFunctions.Years(band[1].GetDouble())), Squash(text));
    }

    [Fact]
    public void Every_figure_and_table_is_present_with_its_numbered_caption()
    {
        var (pdf, text) = Open();
        using var _ = pdf;
        string markdown = Demo.Build(Name).Markdown;
        var tables = Regex.Matches(markdown, @"^\[\[table: ([^|\]]+)", RegexOptions.Multiline)
            .Select(m => m.Groups[1].Value.Trim())
            .ToList();
        int figures = Regex.Matches(markdown, @"^\[\[figure: ", RegexOptions.Multiline).Count;
        Assert.Equal(8, tables.Count);
        Assert.Equal(7, figures);
        for (int i = 0; i < tables.Count; i++)
            Assert.Contains(Squash($"Table {i + 1}. {Md.Unescape(tables[i])}"), Squash(text));
        foreach (var caption in new[]
        {
            "Figure 1. Compulsory to 12 years: change in output per person against no reform",
            "Figure 2. The two opposing forces",
            "Figure 3. Output per person after the reform relative to no reform",
            "Figure 4. Sensitivity of the long-run change",
            "Figure 5. Output-maximising schooling E* (years) over",
            "Figure 6. Distribution of the long-run change",
            "Figure 7. Output per person against years of schooling",
        })
            Assert.Contains(Squash(caption), Squash(text));
        Assert.Equal(figures, Regex.Matches(Squash(text), "Source:briefwrightmodel,scenario").Count);
    }

    [Fact]
    public void Cautions_are_in_every_brief()
    {
        var (pdf, text) = Open();
        using var _ = pdf;
        Assert.Contains(Squash("model illustrations under stated assumptions, not forecasts"), Squash(text));
        Assert.Contains(Squash("commissioning body's own appraisal rules prevail"), Squash(text));
    }

    [Fact]
    public void Outline_entries_match_the_headings_of_the_filled_template()
    {
        var (pdf, _) = Open();
        using var __ = pdf;
        Assert.True(pdf.TryGetBookmarks(out var bookmarks));
        var titles = bookmarks.GetNodes().Select(n => n.Title).ToList();
        var headings = Regex.Matches(Demo.Build(Name).Markdown, @"^(#{1,3}) (.+)$", RegexOptions.Multiline).ToList();
        int section = 0, sub = 0;
        var expected = headings.Select(m =>
        {
            int level = m.Groups[1].Length;
            string text = m.Groups[2].Value.Trim();
            if (level == 1) return text;
            if (level == 2) { section++; sub = 0; return $"{section}  {text}"; }
            return $"{section}.{++sub}  {text}";
        }).ToList();
        Assert.Equal(expected, titles);
        Assert.True(expected.Count >= 10);
    }

    [Fact]
    public void Pdfinfo_reports_a_tagged_document()
    {
        var (code, output) = ExternalTool.Run("pdfinfo", "", Demo.Build(Name).Pdf);
        Assert.Equal(0, code);
        Assert.Matches(@"Tagged:\s+yes", output);
    }

    [Fact]
    public void Qpdf_check_passes_without_warnings()
    {
        var (code, output) = ExternalTool.Run("qpdf", "--check", Demo.Build(Name).Pdf);
        Assert.Equal(0, code);
        Assert.DoesNotContain("WARNING", output);
    }

    [Fact]
    public void Every_font_is_embedded()
    {
        var (code, output) = ExternalTool.Run("pdffonts", "", Demo.Build(Name).Pdf);
        Assert.Equal(0, code);
        var rows = output.Split('\n').Skip(2).Where(l => l.Trim().Length > 0).ToList();
        Assert.NotEmpty(rows);
        Assert.All(rows, row => Assert.Matches(@"\s+yes\s+(yes|no)\s+(yes|no)\s+\d+\s+\d+\s*$", row));
        Assert.All(rows, row => Assert.Matches(@"^\S+\s.*\s+yes\s+\S+\s+\S+\s+\d+", row));
    }

    [Fact]
    public void Charts_share_one_embedded_font()
    {
        // Seven charts drawn from one multi-page chart document: pdffonts lists each font object once, so the chart
        // font (Skia's face name has no space) must appear once, not once per chart.
        var (code, output) = ExternalTool.Run("pdffonts", "", Demo.Build(Name).Pdf);
        Assert.Equal(0, code);
        var names = output.Split('\n').Skip(2).Where(l => l.Trim().Length > 0).Select(l => l.Split(' ')[0]).ToList();
        Assert.Single(names, n => n.EndsWith("+LiberationSans", StringComparison.Ordinal));
        Assert.Equal(names.Count, names.Distinct().Count());
    }
}
