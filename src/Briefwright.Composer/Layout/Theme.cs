using Briefwright.Composer.Document;

namespace Briefwright.Composer.Layout;

/// <summary>An sRGB colour.</summary>
public readonly record struct Rgb(byte R, byte G, byte B)
{
    public static Rgb Hex(string hex)
        => new(Convert.ToByte(hex[1..3], 16), Convert.ToByte(hex[3..5], 16), Convert.ToByte(hex[5..7], 16));
}

/// <summary>A font: style and size in points.</summary>
public readonly record struct FontSpec(RunStyle Style, double Size);

/// <summary>Page geometry, type sizes and colours. All lengths in points.</summary>
public sealed record Theme
{
    /// <summary>The words the layout writes itself, in the brief's language: {0} is the number.</summary>
    public string FigureLabel { get; init; } = "Figure {0}.";

    public string TableLabel { get; init; } = "Table {0}.";

    public string SourceLabel { get; init; } = "Source: ";

    public double PageWidth { get; init; } = 595.28;
    public double PageHeight { get; init; } = 841.89;
    public double MarginLeft { get; init; } = 62;
    public double MarginRight { get; init; } = 62;
    public double MarginTop { get; init; } = 70;
    public double MarginBottom { get; init; } = 64;
    public double BodySize { get; init; } = 10;
    public double LineFactor { get; init; } = 1.38;
    public double ParagraphGap { get; init; } = 6;
    public double TableSize { get; init; } = 8.5;
    public double CaptionSize { get; init; } = 8.5;
    public Rgb Text { get; init; } = new(0x1A, 0x1A, 0x1A);
    public Rgb Muted { get; init; } = new(0x55, 0x5B, 0x66);
    public Rgb Accent { get; init; } = Rgb.Hex("#1F4E79");
    public Rgb Rule { get; init; } = Rgb.Hex("#B8C2CC");
    public Rgb BoxFill { get; init; } = Rgb.Hex("#EAF1F8");
    public Rgb HeaderFill { get; init; } = Rgb.Hex("#DCE6F0");
    public Rgb StripeFill { get; init; } = Rgb.Hex("#F5F7FA");

    public double ContentWidth => PageWidth - MarginLeft - MarginRight;
    public double ContentHeight => PageHeight - MarginTop - MarginBottom;

    public static Theme For(PaperSize paper)
        => paper == PaperSize.Letter ? new Theme { PageWidth = 612, PageHeight = 792 } : new Theme();
}
