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
        options ??= BuildOptions.Default;
        // Text the brief could not show is refused before the model runs.
        var language = GlyphCheck.LanguageOf(scenario);
        GlyphCheck.Check(scenario, template, language, options.Fonts);
        return ComposeChecked(ScenarioSolver.Solve(scenario, options.ModelThreads), template, options, language);
    }

    /// <summary>Everything after the model: charts, results data, filled template, layout and PDF.</summary>
    public static BuiltBrief Compose(SolvedScenario solved, BriefTemplate template, BuildOptions? options = null)
    {
        options ??= BuildOptions.Default;
        var language = GlyphCheck.LanguageOf(solved.Scenario);
        GlyphCheck.Check(solved.Scenario, template, language, options.Fonts);
        return ComposeChecked(solved, template, options, language);
    }

    /// <summary><see cref="Compose"/> once the brief's texts are known to be in its fonts.</summary>
    private static BuiltBrief ComposeChecked(SolvedScenario solved, BriefTemplate template, BuildOptions options,
        BriefLanguage language)
    {
        var scenario = solved.Scenario;
        var words = new TemplateFunctions(language);
        // The brief's own fonts and words for its pages and its charts, made here and passed down; nothing is kept
        // beyond this brief.
        var fonts = options.Fonts is { } f ? new FontFaces(f.Regular, f.Bold, f.Italic, f.BoldItalic) : null;
        var session = new RenderSession(fonts);
        var drawing = ChartDrawingFor(scenario, fonts);
        var specs = ChartSpecs(solved, drawing, options.Theme.ChartColours);
        var figureRefs = specs.Select(c => new FigureRef(c.Id, c.Caption)).ToList();
        // The results data and the filled template need the charts' ids and captions, not their drawings; the data
        // annex needs the drawn charts, not the brief. The caller's runner decides where they are made (in order here,
        // or on spare cores while the charts and the brief are laid out).
        var runner = options.Runner;
        var text = runner.Start(() =>
        {
            string json = ResultsJson.Write(ResultsDocument.From(scenario, solved.BalancedGrowth, solved.Analysis));
            var changes = options.PreviousEdition is { } previous
                ? EditionSnapshot.Compare(previous, EditionSnapshot.FromJson(json, language), language)
                    with { Causes = options.EditionCauses, Edition = scenario.Brief.Edition }
                : null;
            return (Json: json, Changes: changes, Markdown: FillTemplate(solved, figureRefs, template, changes));
        });
        var charts = ChartSpec.RenderPdf(specs);
        // The web page needs each chart as SVG and the editable document as PNG: the same copies as the data annex's.
        var formats = options.Formats;
        bool copies = options.ChartImages || (formats & (OutputFormat.Html | OutputFormat.Docx)) != 0;
        var imaged = runner.Start(() => copies ? ChartSpec.AddImages(charts, specs, drawing, runner.Threads) : charts);
        var annex = runner.Start(
            () => AnnexFiles.Build(solved, options.ChartImages ? imaged.GetAwaiter().GetResult() : charts));
        var (json, changes, markdown) = text.GetAwaiter().GetResult();
        var figures = charts.ToDictionary(c => c.Id,
            c => new FigureBlock(c.Id, c.Pdf, c.Page, c.WidthPt, c.HeightPt, c.Caption, c.Source, c.AltText));
        var blocks = MarkdownReader.Read(markdown, figures);
        var document = DocumentOf(scenario, options, language, words, blocks, fonts);
        // The other formats are written from the same blocks and charts as the PDF, on the spare core while it is laid
        // out.
        var others = runner.Start(() => OutputWriters.For(formats).Select(w => new AnnexFile(w.Suffix,
            w.Write(new BriefContent(document, imaged.GetAwaiter().GetResult(), solved, json,
                scenario.Brief.Organisation)))).ToList());
        var pdf = DocumentComposer.WritePdf(document, session);
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
        TemplateFunctions words, IReadOnlyList<Block> blocks, FontFaces? fonts)
    {
        var info = scenario.Brief;
        return new BriefDocument(
            new DocumentInfo(
                info.Title, info.ShortTitle, info.Author ?? info.Organisation,
                words.T("doc.subject"), words.T("doc.keywords"),
                language.Tag, info.Date,
                words.T("doc.edition", info.Edition)
                + (info.Status == "final" ? "" : $" ({words.T("status." + info.Status)})"),
                options.Theme.Footer ?? words.T("doc.footer", info.Organisation))
            {
                Logo = options.Logo,
                Marker = info.Status switch { "final" => null, "consultation" => words.T("marker.consultation"),
                    _ => words.T("marker.draft") },
                PageLabel = words.T("page.label", "{0}", "{1}"),
                DateText = language.Date(info.Date),
            },
            blocks)
        {
            Theme = options.PageTheme() with { FigureLabel = words.T("layout.figure"),
                TableLabel = words.T("layout.table"), SourceLabel = words.T("layout.source") },
            FontFamily = fonts?.Family,
        };
    }

    /// <summary>
    /// Output files are named from the scenario id, the brief's date and, from edition 2 on, the edition:
    /// auroria-national-2026-11-30, auroria-national-2026-11-30-edition-2. No two editions share a name.
    /// </summary>
    public static string FileStem(ScenarioDocument scenario)
        => FileStem(scenario.Brief.Id, scenario.Brief.Date, scenario.Brief.Edition);

    public static string FileStem(string id, DateOnly date, int edition) =>
        $"{id}-{date:yyyy-MM-dd}" + (edition > 1
            ? $"-edition-{edition.ToString(System.Globalization.CultureInfo.InvariantCulture)}"
            : "");

    /// <summary>
    /// Whether an assumption as shown or a headline result differs from a previous edition's results data.
    /// </summary>
    public static bool ResultsDiffer(SolvedScenario solved, string previousJson) =>
        EditionSnapshot.Compare(EditionSnapshot.FromJson(previousJson),
            EditionSnapshot.FromJson(ResultsJson.Write(ResultsDocument.From(solved)))).Any;

    public static string FillTemplate(SolvedScenario solved, IReadOnlyList<RenderedChart> charts,
        BriefTemplate template, EditionChanges? changes = null) =>
        FillTemplate(solved, charts.Select(c => new FigureRef(c.Id, c.Caption)).ToList(), template, changes);

    /// <summary>Fills the template; the figures are given by id and caption.</summary>
    public static string FillTemplate(SolvedScenario solved, IReadOnlyList<FigureRef> figures, BriefTemplate template,
        EditionChanges? changes = null)
    {
        var scenario = solved.Scenario;
        var language = GlyphCheck.LanguageOf(scenario);
        var inputs = new BriefInputs(scenario, solved.BalancedGrowth, solved.Analysis, figures,
            scenario.InputHash, ToolInfo.Version, Path.GetFileName(template.Path), template.Hash);
        var model = new BriefModelBuilder(language).Build(inputs);
        new ChangesModel(language).Add(model, changes);
        return template.Render(model);
    }

    public static IReadOnlyList<RenderedChart> RenderCharts(SolvedScenario solved, bool withImages = false,
        FontFaces? fonts = null)
    {
        var drawing = ChartDrawingFor(solved.Scenario, fonts);
        return ChartSpec.RenderAll(ChartSpecs(solved, drawing), drawing, withImages);
    }

    /// <summary>
    /// The brief's charts (<see cref="ChartCatalogue"/>), built but not yet drawn, with <paramref name="drawing"/> (the
    /// scenario's own in the bundled font when null), each option in its style for this brief (from the theme's
    /// <paramref name="chartColours"/> when given).
    /// </summary>
    public static IReadOnlyList<ChartSpec> ChartSpecs(
        SolvedScenario solved, ChartDrawing? drawing = null, IReadOnlyList<string>? chartColours = null)
    {
        var scenario = solved.Scenario;
        var texts = new ChartTexts(GlyphCheck.LanguageOf(scenario));
        string source = texts.T("chart.source", scenario.Brief.Id);
        var context = new ChartContext(solved, ChartCatalogue.Styles(solved, chartColours), source,
            drawing ?? ChartDrawingFor(scenario), texts);
        return ChartCatalogue.Build(context);
    }

    /// <summary>
    /// What the scenario's charts are drawn with: the theme's regular and bold <paramref name="fonts"/> (the bundled
    /// ones when null), cut to the characters its chart texts use, and the words of its language.
    /// </summary>
    public static ChartDrawing ChartDrawingFor(ScenarioDocument scenario, FontFaces? fonts = null)
    {
        var language = GlyphCheck.LanguageOf(scenario);
        var font = fonts is null ? BundledChartFont.Value
            : ChartFont.FromBytes(fonts.Faces[RunStyle.Regular], fonts.Faces[RunStyle.Bold]);
        return new ChartDrawing(font.Variant(GlyphCheck.ChartCharacters(scenario, language)),
            new ChartWords(key => language.Texts.TryGetValue(key, out var t) ? t.Text : null, language.Decimal));
    }

    /// <summary>The bundled regular and bold faces as a chart font: made from bytes that never change, once.</summary>
    private static readonly Lazy<ChartFont> BundledChartFont =
        new(() => ChartFont.FromBytes(BundledFonts.Bytes(RunStyle.Regular), BundledFonts.Bytes(RunStyle.Bold)));

}
