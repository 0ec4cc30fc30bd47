namespace Briefwright.Composer.Layout;

/// <summary>Widths of text in a font; the only thing layout needs to know about fonts.</summary>
public interface ITextMeasurer
{
    double Width(string text, FontSpec font);

    /// <summary>Distance from the top of the line box to the baseline, for a font at its size.</summary>
    double Ascent(FontSpec font);
}
