using Briefwright.Composer.Drawing;

namespace Briefwright.Composer.Layout;

/// <summary>
/// The unit of pagination: something of fixed height that is never split. Paragraphs become one atom per line,
/// tables one per row, so that pages can break between them.
/// </summary>
public abstract class Atom
{
    public double Height { get; init; }

    /// <summary>Vertical space above; dropped at the top of a page.</summary>
    public double SpaceBefore { get; init; }

    /// <summary>
    /// Must stay on the same page as the next atom (headings, first and last lines of a paragraph, captions).
    /// </summary>
    public bool KeepWithNext { get; set; }

    /// <summary>
    /// Consecutive atoms with the same group share one structure element (a paragraph, a list, a table) on a page.
    /// </summary>
    public object? Group { get; init; }

    public StructTag GroupTag { get; init; } = StructTag.P;

    /// <summary>The header row to repeat when this table row starts a new page.</summary>
    public Atom? RepeatHeader { get; init; }

    /// <summary>Starts a new page unless already at the top of one.</summary>
    public bool BreakBefore { get; init; }

    /// <summary>
    /// Atoms with the same float (a figure with its caption and source line) move together: when they do not fit
    /// where they stand, the text that follows fills the page and they go to the top of the next one.
    /// </summary>
    public object? Float { get; set; }

    /// <summary>What this atom holds, in a few words, for an error that names it.</summary>
    public virtual string Describe() => GetType().Name.Replace("Atom", "").ToLowerInvariant();

    public abstract void Draw(IDrawingSurface surface, Theme theme, double x, double y);
}
