using Briefwright.Brief;
using Briefwright.Charts;
using Briefwright.Composer;
using Briefwright.Composer.Document;
using Briefwright.Composer.Drawing;
using Briefwright.Composer.Markdown;
using Briefwright.Templating;

namespace Briefwright.Cli;

/// <summary>
/// A speed decision (see <see cref="Speed"/>): the chart, template and PDF libraries each pay a one-time start-up in a
/// new process (loading and compiling their code, reading font tables). <see cref="Start"/> pays it on a spare core
/// with a tiny throw-away brief while the first real brief's model runs, so that a single brief built by a fresh
/// process finishes sooner. It writes nothing and shares nothing with a real brief (it makes its own chart drawing and
/// render session), and its failures are ignored: the real brief then simply pays the start-up itself.
/// </summary>
internal static class WarmUp
{
    private static readonly Lazy<Task> Started = new(() => Task.Run(() => Run()));

    /// <summary>Starts the warm-up once per process; later calls do nothing.</summary>
    public static Task Start() => Started.Value;

    /// <summary>
    /// One warm-up pass; false if any library failed on the tiny brief (then the real brief pays the start-up).
    /// </summary>
    internal static bool Run()
    {
        try
        {
            var drawing = new ChartDrawing(
                ChartFont.FromBytes(BundledFonts.Bytes(RunStyle.Regular), BundledFonts.Bytes(RunStyle.Bold)),
                ChartWords.English);
            byte[] chart = ChartRenderer.SamplePdf(drawing);

            string markdown = BriefTemplate.Parse(
                    "# {{ title }}\n\nText with **bold** and *italic*.\n\n"
                    + "| a | b |\n|---|--:|\n| {{ title }} | 1.0 |\n\n[[figure: warm]]\n", "warm-up")
                .Render(new Scriban.Runtime.ScriptObject { ["title"] = "Warm-up" });
            var figure = new FigureBlock(
                "warm", chart, 1, ChartRenderer.Width, ChartRenderer.Height, "Warm-up", null, "Warm-up");
            var blocks = MarkdownReader.Read(markdown, new Dictionary<string, FigureBlock> { ["warm"] = figure });
            var info = new DocumentInfo(
                "Warm-up", "Warm-up", "briefwright", "", "", "en-GB", new DateOnly(2000, 1, 1), "", "");
            return DocumentComposer.WritePdf(new BriefDocument(info, blocks), new RenderSession()).PageCount == 1;
        }
        catch (Exception)
        {
            return false; // only a head start; the real brief reports any real problem
        }
    }
}
