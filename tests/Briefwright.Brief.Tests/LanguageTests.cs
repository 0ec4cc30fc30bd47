using System.Text;
using Briefwright.Scenario;
using Briefwright.Templating;

namespace Briefwright.Brief.Tests;

/// <summary>
/// Briefs in each shipped language, read back from the PDF with pdftotext: the tool's own words, the date, the page
/// furniture and the number format follow the brief's language, and every character of every label reaches the charts.
/// Expected words are written out here (not read from the language files), so a wrong text file fails the test.
/// Number and date conventions: the usual typography of each language (common practice; French thin spaces and
/// the space before %, Spanish "de" in dates, the German day with a full stop), written from memory.
/// </summary>
public class LanguageTests
{
    private static readonly Lazy<SolvedScenario> National = new(
        () => ScenarioSolver.Solve(Demo.Load("auroria-national")));
    private static readonly Dictionary<string, BuiltBrief> Built = new();

    private static BuiltBrief BuildIn(string tag)
    {
        lock (Built)
        {
            if (Built.TryGetValue(tag, out var brief)) return brief;
            var solved = National.Value;
            var scenario = solved.Scenario with { Brief = solved.Scenario.Brief with { Language = tag } };
            return Built[tag] = BriefBuilder.Compose(solved with { Scenario = scenario }, StandardTemplate.Template);
        }
    }

    /// <summary>The PDF's text (pdftotext), with the no-break and narrow no-break spaces read as spaces.</summary>
    private static string PdfText(byte[] pdf)
    {
        string path = Path.Combine(Path.GetTempPath(), $"bw-{Guid.NewGuid():N}.pdf");
        string txt = Path.ChangeExtension(path, ".txt");
        File.WriteAllBytes(path, pdf);
        try
        {
            var psi = new System.Diagnostics.ProcessStartInfo("pdftotext", $"-enc UTF-8 \"{path}\" \"{txt}\"") {
                RedirectStandardError = true };
            using var p = System.Diagnostics.Process.Start(psi)!;
            p.WaitForExit();
            Assert.Equal(0, p.ExitCode);
            return File.ReadAllText(txt, Encoding.UTF8).Replace('\u00A0', ' ').Replace('\u202F', ' ');
        }
        finally
        {
            File.Delete(path);
            if (File.Exists(txt)) File.Delete(txt);
        }
    }

    [Theory]
    // Each case: the language tag, the date, the page label, words the tool writes, the decimal sign, the percent.
    [InlineData(
        "en-GB",
        "30 November 2026",
        "Page 1 of",
        new[] { "Key findings", "Caveats", "Technical annex", "Figure 1.", "Table 1.", "Source:" },
        "100.0",
        "%")]
    [InlineData(
        "fr-FR",
        "30 novembre 2026",
        "Page 1 sur",
        new[] { "Principaux résultats", "Mises en garde", "Annexe technique", "Figure 1.", "Tableau 1.", "Source :" },
        "100,0",
        " %")]
    [InlineData(
        "es-ES",
        "30 de noviembre de 2026",
        "Página 1 de",
        new[] { "Conclusiones principales", "Advertencias", "Anexo técnico", "Figura 1.", "Tabla 1.", "Fuente:" },
        "100,0",
        " %")]
    [InlineData(
        "de-DE",
        "30. November 2026",
        "Seite 1 von",
        new[] { "Wichtigste Ergebnisse", "Vorbehalte", "Technischer Anhang", "Abbildung 1.", "Tabelle 1.", "Quelle:" },
        "100,0",
        " %")]
    public void Brief_follows_its_language(
        string tag,
        string date,
        string pageLabel,
        string[] words,
        string baselineIndex,
        string percent)
    {
        var brief = BuildIn(tag);
        string text = PdfText(brief.Pdf);
        Assert.Contains(date, text);
        // The page label with the brief's own page count (the German brief runs a page longer than the others).
        Assert.Contains($"{pageLabel} {brief.PageCount}", text);
        foreach (var w in words) Assert.Contains(w, text);
        // The baseline's index in the results table is 100 to one decimal, written with the language's decimal mark.
        Assert.Contains(baselineIndex, text);
        if (baselineIndex.Contains(',')) Assert.DoesNotContain("100.0", text);
        // The headline change is +4.1% for the national scenario (DESIGN.md's demo check value), in the language's
        // format.
        string change = "+4" + baselineIndex[3] + "1" + percent;
        Assert.Contains(change, text);
        // The PDF's language tag.
        Assert.Contains($"/Lang({tag})", Encoding.Latin1.GetString(brief.Pdf));
        // The cautions every brief carries: the not-a-forecast line is there in every language.
        Assert.Contains(
            tag switch
            {
                "fr-FR" => "pas des prévisions",
                "es-ES" => "no previsiones",
                "de-DE" => "keine Prognosen",
                _ => "not forecasts",
            },
            text);
    }

    [Theory]
    [InlineData("fr-FR", "1 000", "2000")]
    [InlineData("de-DE", "1.000", "2.000")]
    [InlineData("es-ES", "1000", "12.000")]
    [InlineData("en-GB", "1,000", "2,000")]
    public void Large_numbers_are_grouped_as_the_language_writes_them(string tag, string thousand, string other)
    {
        // Spanish leaves four-digit numbers ungrouped (common practice, RAE); French groups with a narrow space.
        var language = BriefLanguage.ForTag(tag)!;
        using (BriefLanguage.Use(language))
        {
            Assert.Equal(thousand, TemplateFunctions.Big(1000).Replace('\u202F', ' '));
            if (tag == "fr-FR") Assert.Equal("2\u202F000", TemplateFunctions.Big(2000));
            else if (tag == "es-ES") Assert.Equal(other, TemplateFunctions.Big(12000));
            else Assert.Equal(other, TemplateFunctions.Big(2000));
        }
    }

    [Fact]
    public void Every_language_has_every_text_and_every_placeholder_of_English()
    {
        var english = BriefLanguage.English;
        Assert.True(BriefLanguage.BuiltIn.Count >= 4, "en, fr, es and de are shipped");
        foreach (var (code, language) in BriefLanguage.BuiltIn)
            foreach (var (key, text) in english.Texts)
            {
                Assert.True(language.Texts.ContainsKey(key), $"{code}: {key} is missing");
                for (int i = 0; i < 8; i++)
                    if (text.Text.Contains("{" + i + "}"))
                        Assert.True(
                            language.Texts[key].Text.Contains("{" + i + "}"),
                            $"{code}: {key} does not use {{{i}}}");
            }
    }

    /// <summary>A scenario extending the national demo, written to a temporary folder with a copy of it.</summary>
    private static string Scenario(string yaml)
    {
        string dir = Path.Combine(Path.GetTempPath(), $"bw-lang-{Guid.NewGuid():N}");
        Directory.CreateDirectory(dir);
        File.Copy(
            Path.Combine(Demo.Root, "briefs-demo", "auroria-national.yaml"),
            Path.Combine(dir, "auroria-national.yaml"));
        string path = Path.Combine(dir, "test.yaml");
        File.WriteAllText(path, "# INVENTED SCENARIO for a test.\nextends: auroria-national.yaml\n" + yaml);
        return path;
    }

    private static LoadResult Load(string path) => new ScenarioLoader(new Demo.DiskReader()).Load(path);

    public static readonly string[] Labels =
    {
        "Obowiązek szkolny: 11 lat (Łódź)", // Polish
        "Povinná školní docházka: 12 let (Čeřeň)", // Czech
        "Zorunlu eğitim 13 yıl (İğdır, Şişli)", // Turkish
        "Giáo dục bắt buộc 13 năm, nghỉ hưu ở tuổi 67", // Vietnamese
    };

    [Fact]
    public void Every_character_of_every_label_reaches_the_charts()
    {
        // Latin Extended (Polish, Czech, Turkish, Vietnamese), and Greek and Cyrillic in the appraisal rule's label.
        string greek = "Κανόνας Υπουργείου 4%", cyrillic = "Правило Минфина 4%";
        var path = Scenario($$"""
            brief:
              id: test-scripts
            options:
              - { id: current-law, label: "{{Labels[0]}}", schooling_years: 11, baseline: true }
              - { id: plus-one-year, label: "{{Labels[1]}}", schooling_years: 12 }
              - { id: plus-two-years, label: "{{Labels[2]}}", schooling_years: 13 }
              - { id: plus-two-retire-67, label: "{{Labels[3]}}", schooling_years: 13, retirement_age: 67 }
            appraisal:
              discount_rates:
                - { id: greek, label: "{{greek}}", rate: 4% }
                - { id: cyrillic, label: "{{cyrillic}}", rate: 3% }
            """);
        var result = Load(path);
        Assert.True(result.Ok, string.Join("\n", result.Problems));
        var solved = ScenarioSolver.Solve(result.Document!);
        var charts = BriefBuilder.RenderCharts(solved, withImages: true);
        string svg = string.Concat(charts.Select(c => c.Svg));
        string pdfText = PdfText(charts[0].Pdf); // one PDF holds every chart, one per page
        // The legend of the output curve names every option; the reform path's break-even line names the first rule.
        foreach (string label in Labels.Append(greek))
        {
            foreach (var rune in label.EnumerateRunes().Where(r => !Rune.IsWhiteSpace(r)))
            {
                Assert.Contains(rune.ToString(), svg);
                Assert.Contains(rune.ToString(), pdfText);
            }
        }
        Assert.Contains(Labels[0], svg);
        // The Cyrillic rule is not drawn in a chart (only the first rule is); the brief's text carries it.
        var brief = BriefBuilder.Compose(solved, StandardTemplate.Template);
        Assert.Contains(cyrillic, PdfText(brief.Pdf));
    }

    [Fact]
    public void A_character_no_font_carries_is_an_error_naming_the_field()
    {
        var path = Scenario("""
            brief:
              id: test-cjk
            options:
              - { id: current-law, label: "Current law 中", schooling_years: 11, baseline: true }
              - { id: plus-one-year, label: "Compulsory to 12 years", schooling_years: 12 }
            reform: { headline_option: plus-one-year }
            """);
        var result = Load(path);
        Assert.True(result.Ok, string.Join("\n", result.Problems));
        var ex = Assert.Throws<BriefTextException>(
            () => BriefBuilder.Build(result.Document!, StandardTemplate.Template));
        string message = Assert.Single(ex.Errors);
        Assert.StartsWith($"{path}:6:", message);
        Assert.Contains("options[0].label", message);
        Assert.Contains("U+4E2D", message);
    }

    [Fact]
    public void A_template_line_with_a_character_no_font_carries_is_named()
    {
        var template = BriefTemplate.Parse("# {{ brief.title }}\n\nA line.\nThis one has ⿰ in it.\n", "custom.md");
        var ex = Assert.Throws<BriefTextException>(() => BriefBuilder.Build(Demo.Load("auroria-national"), template));
        Assert.StartsWith("custom.md:4:14: ", Assert.Single(ex.Errors));
    }

    [Theory]
    [InlineData("language: ar-EG", "brief.language")]
    [InlineData("title: \"חינוך חובה\"", "brief.title")]
    public void Right_to_left_scripts_are_refused_where_they_are_written(string line, string path)
    {
        var result = Load(Scenario($"brief:\n  id: test-rtl\n  {line}\n"));
        var problem = Assert.Single(result.Problems);
        Assert.Equal(path, problem.Path);
        Assert.Equal(5, problem.At.Line);
        Assert.Contains("right-to-left", problem.Rule);
    }

    [Fact]
    public void A_language_without_texts_is_an_error_at_brief_language()
    {
        var result = Load(Scenario("brief:\n  id: test-it\n  language: it-IT\n"));
        Assert.True(result.Ok);
        var ex = Assert.Throws<BriefTextException>(() => GlyphCheck.LanguageOf(result.Document!));
        Assert.Contains(":5:13: brief.language:", Assert.Single(ex.Errors));
    }
}
