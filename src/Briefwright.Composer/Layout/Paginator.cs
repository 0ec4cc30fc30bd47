namespace Briefwright.Composer.Layout;

/// <summary>An atom placed on a page, at <see cref="Y"/> points below the top of the content area.</summary>
public readonly record struct Placement(Atom Atom, double Y);

/// <summary>
/// The one pagination loop: places atoms top to bottom, starting a new page when an atom together with the
/// atoms it must keep with does not fit, and repeating a table's header row at the top of a continued table.
/// </summary>
public static class Paginator
{
    public static IReadOnlyList<IReadOnlyList<Placement>> Paginate(IReadOnlyList<Atom> atoms, double pageHeight)
    {
        var pages = new List<List<Placement>> { new() };
        double y = 0;
        for (int i = 0; i < atoms.Count; i++)
        {
            var atom = atoms[i];
            double space = y == 0 ? 0 : atom.SpaceBefore;
            double chain = space + atom.Height;
            for (int j = i; atoms[j].KeepWithNext && j + 1 < atoms.Count && chain < pageHeight; j++)
                chain += atoms[j + 1].SpaceBefore + atoms[j + 1].Height;
            if (chain > pageHeight) chain = space + atom.Height; // the chain cannot fit on any page; break it
            if (y > 0 && (atom.BreakBefore || y + chain > pageHeight))
            {
                pages.Add(new List<Placement>());
                y = 0;
                space = 0;
                if (atom.RepeatHeader is { } header && !ReferenceEquals(header, atom))
                {
                    pages[^1].Add(new Placement(header, 0));
                    y = header.Height;
                }
            }
            pages[^1].Add(new Placement(atom, y + space));
            y += space + atom.Height;
        }
        return pages;
    }
}
