namespace Briefwright.Brief.Editions;

/// <summary>What the output folder holds for one brief's manifest.</summary>
public enum ManifestCondition
{
    /// <summary>No manifest: a new brief, or its manifest was deleted.</summary>
    Missing,

    /// <summary>Read, its own hash checked and every path confined to the output folder.</summary>
    Valid,

    /// <summary>Unreadable, truncated, edited (its own hash does not match) or naming a path outside the folder.</summary>
    Damaged,
}

/// <summary>
/// The current edition of one brief as found in its output folder. <see cref="Files"/> are the manifest's files when it
/// is valid, else the files found by name (<c>&lt;id&gt;-YYYY-MM-DD.*</c>). <see cref="ChangedFiles"/> differ from the
/// manifest's record (by size, or by hash when the command line has hashed them: it does before anything is built).
/// <see cref="Edition"/> is the manifest's, or the one a found results file names.
/// </summary>
public sealed record CurrentEdition(
    ManifestCondition Manifest,
    int? Edition,
    string? Fingerprint,
    string? Stem,
    IReadOnlyList<string> Files,
    IReadOnlyList<string> MissingFiles,
    IReadOnlyList<string> ChangedFiles,
    int HighestArchivedEdition)
{
    public static CurrentEdition None(int highestArchived = 0) =>
        new(ManifestCondition.Missing, null, null, null, [], [], [], highestArchived);

    /// <summary>Nothing of this brief is in the folder (an archive may be).</summary>
    public bool Empty => Manifest == ManifestCondition.Missing && Files.Count == 0;
}

/// <summary>What was asked: the fingerprint of every input, the edition the scenario names, and <c>--force</c>.</summary>
public sealed record EditionRequest(string Fingerprint, int RequestedEdition, bool Force);

/// <summary>How the current files are kept before they are replaced.</summary>
/// <param name="Folder">The archive folder's name under <c>archive/&lt;id&gt;/</c>: <c>edition-N</c> when the files are
/// complete and match their manifest, else <c>edition-N-recovered</c> (or <c>recovered</c> when the edition is unknown).</param>
/// <param name="Recovered">The files are kept as found, not as their manifest recorded them.</param>
/// <param name="Reasons">Why they are marked recovered, one line each (empty when verified).</param>
public sealed record ArchiveStep(string Folder, int? Edition, IReadOnlyList<string> Files, bool Recovered, IReadOnlyList<string> Reasons);

/// <summary>The planner's answer for one brief.</summary>
public abstract record EditionPlan
{
    private EditionPlan() { }

    /// <summary>Nothing the brief depends on changed and its files are in place.</summary>
    public sealed record Skip(int Edition) : EditionPlan;

    /// <summary>Build edition <paramref name="Edition"/>; keep the current files first when <paramref name="Archive"/> is set.</summary>
    /// <param name="NewEdition">The number went up (inputs changed): the brief gets a "changes since" section.</param>
    /// <param name="CompareWith">The current edition's results file to compare with (verified, or null).</param>
    public sealed record Build(int Edition, bool NewEdition, ArchiveStep? Archive, string? CompareWith) : EditionPlan;
}

/// <summary>
/// Decides what a build does with one brief, from the fingerprint of its inputs and what its output folder holds. Pure:
/// the command line gathers <see cref="CurrentEdition"/> and carries the plan out. The rule that matters: files of the
/// current edition are never replaced unless they are archived first, completely and verified, or as found and marked
/// recovered; the only exception is a rebuild of the same fingerprint whose present files all match the manifest
/// (the new bytes are then the same bytes).
/// </summary>
public static class EditionPlanner
{
    public static EditionPlan Plan(EditionRequest request, CurrentEdition current)
    {
        int requested = Math.Max(1, request.RequestedEdition);
        int afterArchive = current.HighestArchivedEdition + 1;
        if (current.Manifest == ManifestCondition.Valid)
        {
            int previous = current.Edition ?? 0;
            bool intact = current.MissingFiles.Count == 0 && current.ChangedFiles.Count == 0;
            if (current.Fingerprint == request.Fingerprint)
            {
                if (intact && !request.Force) return new EditionPlan.Skip(previous);
                int same = Math.Max(requested, previous);
                // Same inputs: the rebuild writes the same bytes, so present files that match need no copy.
                if (current.ChangedFiles.Count == 0) return new EditionPlan.Build(same, false, null, null);
                return new EditionPlan.Build(same, false, Recovered(current, previous), null);
            }
            int next = Math.Max(requested, Math.Max(previous + 1, afterArchive));
            var archive = intact
                ? new ArchiveStep($"edition-{previous}", previous, current.Files, false, [])
                : Recovered(current, previous);
            string? results = current.Stem + ".results.json";
            bool comparable = current.Files.Contains(results) && !current.MissingFiles.Contains(results) && !current.ChangedFiles.Contains(results);
            return new EditionPlan.Build(next, true, archive, comparable ? results : null);
        }
        if (current.Empty) return new EditionPlan.Build(current.HighestArchivedEdition > 0 ? Math.Max(requested, afterArchive) : requested, false, null, null);
        // A damaged or missing manifest beside files of this brief: keep them as found, then start a new edition.
        int found = current.Edition ?? 0;
        int edition = Math.Max(requested, Math.Max(found + 1, afterArchive));
        return new EditionPlan.Build(edition, found > 0, Recovered(current, current.Edition), null);
    }

    private static ArchiveStep Recovered(CurrentEdition current, int? edition)
    {
        var reasons = new List<string>();
        if (current.Manifest == ManifestCondition.Damaged) reasons.Add("the manifest was damaged (unreadable, edited, or naming a path outside the output folder)");
        if (current.Manifest == ManifestCondition.Missing) reasons.Add("the manifest was missing");
        foreach (var f in current.MissingFiles) reasons.Add($"missing: {f}");
        foreach (var f in current.ChangedFiles) reasons.Add($"not as the manifest recorded it: {f}");
        string folder = edition is > 0 ? $"edition-{edition}-recovered" : "recovered";
        return new ArchiveStep(folder, edition is > 0 ? edition : null, current.Files.Except(current.MissingFiles).ToList(), true, reasons);
    }
}
