using System.Text;
using Briefwright.Brief.Annex;
using Briefwright.Brief.ChartSet;
using Briefwright.Brief.Formats;
using Briefwright.Charts;
using Briefwright.Composer;
using Briefwright.Composer.Document;
using Briefwright.Composer.Drawing;
using Briefwright.Composer.Markdown;
using Briefwright.Model.Core;
using Briefwright.Model.Results;
using Briefwright.Scenario;
using Briefwright.Templating;

namespace Briefwright.Brief;

/// <summary>
/// Runs the pipeline for one scenario: model → charts and filled template → composer. Pure apart from the bytes it
/// returns; the command line writes them.
/// </summary>
public static class BriefBuilder
{
    public static BuiltBrief Build(ScenarioDocument scenario, BriefTemplate template, BuildOptions? options = null)
    {
        // Text the brief could not show is refused before the model runs (Compose checks again for its other callers).
        GlyphCheck.Check(scenario, template, GlyphCheck.LanguageOf(scenario), (options ?? BuildOptions.Default).Fonts);
        return Compose(ScenarioSolver.Solve(scenario, (options ?? BuildOptions.Default).ModelThreads), template, options);
    }

    /// <summary>Everything after the model: charts, results data, filled template, layout and PDF.</summary>
    public static BuiltBrief Compose(SolvedScenario solved, BriefTemplate template, BuildOptions? options = null)
    {
        options ??= BuildOptions.Default;
        var scenario = solved.Scenario;
        var language = GlyphCheck.LanguageOf(scenario);
        using var languageScope = BriefLanguage.Use(language);
        GlyphCheck.Check(scenario, template, language, options.Fonts);
        string? family = null;
        if (options.Fonts is { } fonts)
        {
            family = BundledFonts.Register(fonts.Regular, fonts.Bold, fonts.Italic, fonts.BoldItalic);
            ChartFont.Register(family, fonts.Regular, fonts.Bold);
        }
        var specs = ChartSpecs(solved, family, options.Theme.ChartColours);
        var figureRefs = specs.Select(c => new FigureRef(c.Id, c.Caption)).ToList();
        // The results data and the filled template need the charts' ids and captions, not their drawings; the data annex
        // needs the drawn charts, not the brief. The caller's runner decides where they are made (in order here, or on
        // spare cores while the charts and the brief are laid out).
        var runner = options.Runner;
        var text = runner.Start(() =>
        {
            string json = ResultsJson.Write(ResultsDocument.From(scenario, solved.BalancedGrowth, solved.Analysis));
            var changes = options.PreviousEdition is { } previous
                ? EditionSnapshot.Compare(previous, EditionSnapshot.FromJson(json)) with { Causes = options.EditionCauses, Edition = scenario.Brief.Edition }
                : null;
            return (Json: json, Changes: changes, Markdown: FillTemplate(solved, figureRefs, template, changes));
        });
        var charts = ChartSpec.RenderPdf(specs);
        // The web page needs each chart as SVG and the editable document as PNG: the same copies as the data annex's.
        var formats = options.Formats;
        bool copies = options.ChartImages || (formats & (OutputFormat.Html | OutputFormat.Docx)) != 0;
        var imaged = runner.Start(() => copies ? ChartSpec.AddImages(charts, specs, runner.Threads) : charts);
        var annex = runner.Start(() => AnnexFiles.Build(solved, options.ChartImages ? imaged.GetAwaiter().GetResult() : charts));
        var (json, changes, markdown) = text.GetAwaiter().GetResult();
        var figures = charts.ToDictionary(c => c.Id, c => new FigureBlock(c.Id, c.Pdf, c.Page, c.WidthPt, c.HeightPt, c.Caption, c.Source, c.AltText));
        var blocks = MarkdownReader.Read(markdown, figures);
        var document = DocumentOf(scenario, options, language, blocks, family);
        // The other formats are written from the same blocks and charts as the PDF, on the spare core while it is laid
        // out.
        var others = runner.Start(() => OutputWriters.For(formats).Select(w => new AnnexFile(w.Suffix,
            w.Write(new BriefContent(document, imaged.GetAwaiter().GetResult(), solved, json,
                scenario.Brief.Organisation)))).ToList());
        var pdf = DocumentComposer.WritePdf(document, new RenderSession(family));
        var annexFiles = annex.GetAwaiter().GetResult()
            .Append(new AnnexFile("brief.md", Encoding.UTF8.GetBytes(markdown))).ToList();
        return new BuiltBrief(FileStem(scenario), pdf.Bytes, json, markdown, pdf.PageCount, annexFiles, changes)
        {
            Formats = others.GetAwaiter().GetResult(),
        };
    }

    /// <summary>The brief's document: its blocks with the metadata, page furniture and labels in its
    /// language.</summary>
    private static BriefDocument DocumentOf(ScenarioDocument scenario, BuildOptions options, BriefLanguage language,
        IReadOnlyList<Block> blocks, string? family)
    {
        var info = scenario.Brief;
        return new BriefDocument(
            new DocumentInfo(
                info.Title, info.ShortTitle, info.Author ?? info.Organisation,
                T("doc.subject"), T("doc.keywords"),
                language.Tag, info.Date, T("doc.edition", info.Edition) + (info.Status == "final" ? "" : $" ({T("status." + info.Status)})"),
                options.Theme.Footer ?? T("doc.footer", info.Organisation))
            {
                Logo = options.Logo,
                Marker = info.Status switch { "final" => null, "consultation" => T("marker.consultation"), _ => T("marker.draft") },
                PageLabel = T("page.label", "{0}", "{1}"),
                DateText = language.Date(info.Date),
            },
            blocks)
        {
            Theme = options.PageTheme() with { FigureLabel = T("layout.figure"), TableLabel = T("layout.table"), SourceLabel = T("layout.source") },
            FontFamily = family,
        };
    }

    /// <summary>
    /// Output files are named from the scenario id, the brief's date and, from edition 2 on, the edition:
    /// auroria-national-2026-11-30, auroria-national-2026-11-30-edition-2. No two editions share a name.
    /// </summary>
    public static string FileStem(ScenarioDocument scenario) => FileStem(scenario.Brief.Id, scenario.Brief.Date, scenario.Brief.Edition);

    public static string FileStem(string id, DateOnly date, int edition) =>
        $"{id}-{date:yyyy-MM-dd}" + (edition > 1 ? $"-edition-{edition.ToString(System.Globalization.CultureInfo.InvariantCulture)}" : "");

    /// <summary>Whether an assumption as shown or a headline result differs from a previous edition's results data.</summary>
    public static bool ResultsDiffer(SolvedScenario solved, string previousJson) =>
        EditionSnapshot.Compare(EditionSnapshot.FromJson(previousJson),
            EditionSnapshot.FromJson(ResultsJson.Write(ResultsDocument.From(solved)))).Any;

    public static string FillTemplate(SolvedScenario solved, IReadOnlyList<RenderedChart> charts, BriefTemplate template, EditionChanges? changes = null) =>
        FillTemplate(solved, charts.Select(c => new FigureRef(c.Id, c.Caption)).ToList(), template, changes);

    /// <summary>Fills the template; the figures are given by id and caption.</summary>
    public static string FillTemplate(SolvedScenario solved, IReadOnlyList<FigureRef> figures, BriefTemplate template, EditionChanges? changes = null)
    {
        var scenario = solved.Scenario;
        using var languageScope = BriefLanguage.Use(GlyphCheck.LanguageOf(scenario));
        var inputs = new BriefInputs(scenario, solved.BalancedGrowth, solved.Analysis, figures,
            scenario.InputHash, ToolInfo.Version, Path.GetFileName(template.Path), template.Hash);
        var model = BriefModelBuilder.Build(inputs);
        ChangesModel.Add(model, changes);
        return template.Render(model);
    }

    public static IReadOnlyList<RenderedChart> RenderCharts(SolvedScenario solved, bool withImages = false, string? family = null) =>
        ChartSpec.RenderAll(ChartSpecs(solved, family), withImages);

    /// <summary>
    /// The brief's charts (<see cref="ChartCatalogue"/>), built but not yet drawn, in the bundled font or the theme's
    /// <paramref name="family"/>, each option in its style for this brief (from the theme's <paramref name="chartColours"/>
    /// when given).
    /// </summary>
    public static IReadOnlyList<ChartSpec> ChartSpecs(SolvedScenario solved, string? family = null, IReadOnlyList<string>? chartColours = null)
    {
        InstallChartFont();
        var scenario = solved.Scenario;
        var language = GlyphCheck.LanguageOf(scenario);
        using var languageScope = BriefLanguage.Use(language);
        ChartFont.Use(ChartFont.Variant(family ?? ChartFont.Family, GlyphCheck.ChartCharacters(scenario, language)));
        ChartWords.Use(new ChartWords.Language(key => language.Texts.TryGetValue(key, out var t) ? t.Text : null, language.Decimal));
        string source = T("chart.source", scenario.Brief.Id);
        return ChartCatalogue.Build(new ChartContext(solved, ChartCatalogue.Styles(solved, chartColours), source));
    }

    /// <summary>A text of the brief's language (templates/languages/*.texts), by key.</summary>
    private static string T(string key, params object?[] args) => BriefLanguage.Current.Format(key, args);

    /// <summary>Makes the bundled font the one charts are drawn in (once per process; before any chart is built).</summary>
    public static void InstallChartFont() => ChartFont.Install(BundledFonts.Bytes(RunStyle.Regular), BundledFonts.Bytes(RunStyle.Bold));

}
