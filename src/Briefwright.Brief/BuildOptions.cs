using Briefwright.Brief.Annex;
using Briefwright.Composer.Document;
using Briefwright.Composer.Layout;
using Briefwright.Scenario;

namespace Briefwright.Brief;

/// <summary>How to build a brief beyond scenario and template: look, previous edition, annex images.</summary>
public sealed record BuildOptions
{
    public ThemeSpec Theme { get; init; } = ThemeSpec.Default;

    /// <summary>The theme's logo, read by the caller (the command line), with its pixel size.</summary>
    public (byte[] Png, int Width, int Height)? Logo { get; init; }

    /// <summary>
    /// The theme's TrueType fonts (regular, bold, italic, bold italic), read by the caller; null for the bundled font.
    /// </summary>
    public (byte[] Regular, byte[] Bold, byte[] Italic, byte[] BoldItalic)? Fonts { get; init; }

    /// <summary>
    /// The previous edition's results data, to write the "changes since the previous edition" section.
    /// </summary>
    public EditionSnapshot? PreviousEdition { get; init; }

    /// <summary>
    /// The formats written beside the PDF (web page, workbook, editable document); not an input of the brief's edition.
    /// </summary>
    public Formats.OutputFormat Formats { get; init; } = Briefwright.Brief.Formats.OutputFormats.Default;

    /// <summary>
    /// Why this is a new edition, by input name (the edition planner's <c>Changed</c>): said in the changes section.
    /// </summary>
    public IReadOnlyList<string> EditionCauses { get; init; } = [];

    /// <summary>Also render each chart as SVG and PNG for the data annex.</summary>
    public bool ChartImages { get; init; }

    /// <summary>
    /// Threads the model's uncertainty loops may use. A batch building one brief per core passes 1. Output does not
    /// depend on it.
    /// </summary>
    public int ModelThreads { get; init; } = Model.Uncertainty.ModelThreads.AllCores;

    /// <summary>Where the brief's independent pieces run beside its layout (<see cref="WorkRunner"/>); in order on the
    /// calling thread unless the caller gives another. Output does not depend on it.</summary>
    public WorkRunner Runner { get; init; } = WorkRunner.Sequential;

    public static BuildOptions Default { get; } = new();

    /// <summary>The page theme: paper size and colours from the theme file over the standard look.</summary>
    public Theme PageTheme()
    {
        var t = Composer.Layout.Theme.For(Theme.Paper == "letter" ? PaperSize.Letter : PaperSize.A4);
        Rgb? C(string key) => Theme.Colours.TryGetValue(key, out var hex) ? Rgb.Hex(hex) : null;
        return t with
        {
            Accent = C("accent") ?? t.Accent,
            Text = C("text") ?? t.Text,
            Muted = C("muted") ?? t.Muted,
            Rule = C("rule") ?? t.Rule,
            BoxFill = C("box_fill") ?? t.BoxFill,
            HeaderFill = C("header_fill") ?? t.HeaderFill,
        };
    }
}
