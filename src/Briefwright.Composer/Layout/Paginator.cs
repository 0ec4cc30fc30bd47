namespace Briefwright.Composer.Layout;

/// <summary>An atom placed on a page, at <see cref="Y"/> points below the top of the content area.</summary>
public readonly record struct Placement(Atom Atom, double Y);

/// <summary>
/// The one pagination loop: places atoms top to bottom, starting a new page when an atom together with the
/// atoms it must keep with does not fit, and repeating a table's header row at the top of a continued table.
/// A float (a figure with its caption and source) that does not fit where it stands, on a page with more than
/// <see cref="FloatGap"/> of its height left, waits: the text after it fills the page, and the float opens the
/// next page. An atom taller than a page is an error that names it, never drawn over the footer.
/// </summary>
public static class Paginator
{
    /// <summary>The share of a page that may stay empty before a float that does not fit lets text pass it.</summary>
    public const double FloatGap = 0.15;

    public static IReadOnlyList<IReadOnlyList<Placement>> Paginate(IReadOnlyList<Atom> atoms, double pageHeight)
    {
        foreach (var atom in atoms)
            if (atom.Height > pageHeight + 1e-6)
                throw new ComposeException(
                    $"{Capitalise(atom.Describe())} is {atom.Height:0} pt tall and cannot fit on a page " +
                    $"({pageHeight:0} pt of content height): shorten it or split it.");

        var pages = new List<List<Placement>> { new() };
        double y = 0;
        List<Atom>? waiting = null;

        void NewPage(Atom? continuing)
        {
            pages.Add(new List<Placement>());
            y = 0;
            if (continuing?.RepeatHeader is { } header && !ReferenceEquals(header, continuing))
            {
                pages[^1].Add(new Placement(header, 0));
                y = header.Height;
            }
        }

        void Place(Atom atom)
        {
            double space = y == 0 ? 0 : atom.SpaceBefore;
            pages[^1].Add(new Placement(atom, y + space));
            y += space + atom.Height;
        }

        void PlaceWaiting()
        {
            if (y > 0) NewPage(null);
            foreach (var a in waiting!) Place(a);
            waiting = null;
        }

        int i = 0;
        while (i < atoms.Count)
        {
            var atom = atoms[i];
            if (atom.Float is { } f && waiting is null)
            {
                int end = i;
                while (end + 1 < atoms.Count && atoms[end + 1].Float == f) end++;
                double height = (y == 0 ? 0 : atom.SpaceBefore) + atom.Height;
                for (int k = i + 1; k <= end; k++) height += atoms[k].SpaceBefore + atoms[k].Height;
                if (y > 0 && y + height > pageHeight && pageHeight - y > FloatGap * pageHeight && end + 1 < atoms.Count
                    && !atoms[end + 1].BreakBefore && atoms[end + 1].Float is null)
                {
                    waiting = atoms.Skip(i).Take(end - i + 1).ToList();
                    i = end + 1;
                    continue;
                }
            }

            double chain = Chain(atoms, i, y == 0 ? 0 : atom.SpaceBefore, pageHeight);
            if (waiting is not null && (atom.BreakBefore || atom.Float is not null || y + chain > pageHeight))
            {
                // The page is as full as the text allows: the waiting float opens the next page (and a table that
                // continues after it repeats its header row).
                PlaceWaiting();
                if (!atom.BreakBefore && atom.RepeatHeader is { } header && !ReferenceEquals(header, atom))
                    Place(header);
                continue;
            }
            if (y > 0 && (atom.BreakBefore || y + chain > pageHeight)) NewPage(atom);
            Place(atom);
            i++;
        }
        if (waiting is not null) PlaceWaiting();
        return pages;
    }

    /// <summary>
    /// The height of an atom with the atoms it must stay with; just its own when the chain cannot fit on any page.
    /// </summary>
    private static double Chain(IReadOnlyList<Atom> atoms, int i, double space, double pageHeight)
    {
        double chain = space + atoms[i].Height;
        for (int j = i; atoms[j].KeepWithNext && j + 1 < atoms.Count && chain < pageHeight; j++)
            chain += atoms[j + 1].SpaceBefore + atoms[j + 1].Height;
        return chain > pageHeight ? space + atoms[i].Height : chain;
    }

    private static string Capitalise(string s) => s.Length == 0 ? s : char.ToUpperInvariant(s[0]) + s[1..];
}
