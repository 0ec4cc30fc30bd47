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

        var pages = new Pages();
        int i = 0;
        while (i < atoms.Count)
        {
            var atom = atoms[i];
            if (atom.Float is not null && pages.Waiting is null
                && WaitingFloatEnd(atoms, i, pages.Y, pageHeight) is { } end)
            {
                pages.Waiting = atoms.Skip(i).Take(end - i + 1).ToList();
                i = end + 1;
                continue;
            }

            double chain = Chain(atoms, i, pages.Y == 0 ? 0 : atom.SpaceBefore, pageHeight);
            if (pages.Waiting is not null
                && (atom.BreakBefore || atom.Float is not null || pages.Y + chain > pageHeight))
            {
                // The page is as full as the text allows: the waiting float opens the next page (and a table that
                // continues after it repeats its header row).
                pages.PlaceWaiting();
                if (!atom.BreakBefore && atom.RepeatHeader is { } header && !ReferenceEquals(header, atom))
                    pages.Place(header);
                continue;
            }
            if (pages.Y > 0 && (atom.BreakBefore || pages.Y + chain > pageHeight)) pages.NewPage(atom);
            pages.Place(atom);
            i++;
        }
        if (pages.Waiting is not null) pages.PlaceWaiting();
        return pages.List;
    }

    /// <summary>The pages placed so far, the height used on the last one, and the float waiting for the next
    /// page.</summary>
    private sealed class Pages
    {
        public List<List<Placement>> List { get; } = [new()];
        public double Y { get; private set; }
        public List<Atom>? Waiting { get; set; }

        public void NewPage(Atom? continuing)
        {
            List.Add(new List<Placement>());
            Y = 0;
            if (continuing?.RepeatHeader is { } header && !ReferenceEquals(header, continuing))
            {
                List[^1].Add(new Placement(header, 0));
                Y = header.Height;
            }
        }

        public void Place(Atom atom)
        {
            double space = Y == 0 ? 0 : atom.SpaceBefore;
            List[^1].Add(new Placement(atom, Y + space));
            Y += space + atom.Height;
        }

        public void PlaceWaiting()
        {
            if (Y > 0) NewPage(null);
            foreach (var a in Waiting!) Place(a);
            Waiting = null;
        }
    }

    /// <summary>The index of the last atom of the float that starts at <paramref name="i"/> when that float waits for
    /// the next page: it does not fit, more than <see cref="FloatGap"/> of the page is left, and text that can fill
    /// the page follows it. Null when the float is placed where it stands.</summary>
    private static int? WaitingFloatEnd(IReadOnlyList<Atom> atoms, int i, double y, double pageHeight)
    {
        var atom = atoms[i];
        int end = i;
        while (end + 1 < atoms.Count && atoms[end + 1].Float == atom.Float) end++;
        double height = (y == 0 ? 0 : atom.SpaceBefore) + atom.Height;
        for (int k = i + 1; k <= end; k++) height += atoms[k].SpaceBefore + atoms[k].Height;
        bool waits = y > 0 && y + height > pageHeight && pageHeight - y > FloatGap * pageHeight && end + 1 < atoms.Count
                     && !atoms[end + 1].BreakBefore && atoms[end + 1].Float is null;
        return waits ? end : null;
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
