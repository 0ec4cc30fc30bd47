namespace Briefwright.Brief.Editions;

/// <summary>What the output folder holds for one brief's manifest.</summary>
public enum ManifestCondition
{
    /// <summary>No manifest: a new brief, or its manifest was deleted.</summary>
    Missing,

    /// <summary>Read, its own hash checked and every path confined to the output folder.</summary>
    Valid,

    /// <summary>
    /// Unreadable, truncated, edited (its own hash does not match) or naming a path outside the folder.
    /// </summary>
    Damaged,
}

/// <summary>
/// The names of the inputs a manifest records, and what a change of each means (<see cref="EditionPlanner"/>).
/// Output switches (which files are written: chart copies, a byte order mark, further formats) are recorded apart,
/// under the manifest's <c>outputs</c>, and never make an edition.
/// </summary>
public static class EditionInput
{
    /// <summary>
    /// What the scenario says apart from its date and edition number (a change starts a new edition).
    /// </summary>
    public const string Content = "content";

    /// <summary>The scenario's files as text (comments and layout too; used as the content when a manifest has no
    /// <see cref="Content"/>). Listed as changed only when the content is not: a change of comments, layout, date or
    /// edition number.</summary>
    public const string ScenarioText = "scenario";

    /// <summary>The template (a change starts a new edition).</summary>
    public const string Template = "template";

    /// <summary>The brief's date (a change alone re-dates the current edition).</summary>
    public const string Date = "date";

    /// <summary>
    /// The tool's version: the same edition, unless an assumption as shown or a headline result then differs.
    /// </summary>
    public const string Tool = "tool";

    /// <summary>A change that is no input: <c>brief.edition</c> asks for a higher edition.</summary>
    public const string RequestedEdition = "brief.edition";

    /// <summary>
    /// A change that is no input: an assumption as shown or a headline result differs from the current edition's.
    /// </summary>
    public const string Results = "results";

    /// <summary>Prefix of an output switch in <see cref="EditionPlan.Build.Changed"/>.</summary>
    public const string OutputPrefix = "outputs.";
}

/// <summary>
/// The current edition of one brief as found in its output folder. <see cref="Files"/> are the manifest's files when it
/// is valid, else the files found by name (<c>&lt;id&gt;-YYYY-MM-DD[-edition-N].*</c>). <see cref="ChangedFiles"/>
/// differ from the manifest's record (by size, or by hash when the command line has hashed them: it does before
/// anything is built).
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
    /// <summary>
    /// The manifest's inputs by name (<see cref="EditionInput"/>); null when it has none or there is no manifest.
    /// </summary>
    public IReadOnlyDictionary<string, string>? Inputs { get; init; }

    /// <summary>The manifest's output switches by name; null for a manifest that records none apart.</summary>
    public IReadOnlyDictionary<string, string>? Outputs { get; init; }

    /// <summary>
    /// The <c>brief.edition</c> the scenario gave when the current edition was built (null: not recorded).
    /// </summary>
    public int? RequestedEdition { get; init; }

    public static CurrentEdition None(int highestArchived = 0) =>
        new(ManifestCondition.Missing, null, null, null, [], [], [], highestArchived);

    /// <summary>Nothing of this brief is in the folder (an archive may be).</summary>
    public bool Empty => Manifest == ManifestCondition.Missing && Files.Count == 0;
}

/// <summary>
/// What was asked: the fingerprint of every input, the edition the scenario names, and <c>--force</c>.
/// </summary>
/// <param name="Fingerprint">The hash over <see cref="Inputs"/> and <see cref="Outputs"/>: equal means nothing
/// changed.</param>
public sealed record EditionRequest(string Fingerprint, int RequestedEdition, bool Force)
{
    /// <summary>
    /// Every input by name (<see cref="EditionInput"/>); empty: only the fingerprint is known, and any change is a new
    /// edition.
    /// </summary>
    public IReadOnlyDictionary<string, string> Inputs { get; init; } = new Dictionary<string, string>();

    /// <summary>Every output switch by name (which files are written); a change never makes an edition.</summary>
    public IReadOnlyDictionary<string, string> Outputs { get; init; } = new Dictionary<string, string>();
}

/// <summary>How the current files are kept before they are replaced.</summary>
/// <param name="Folder">The archive folder's name under <c>archive/&lt;id&gt;/</c>: <c>edition-N</c> when the files are
/// complete and match their manifest, else <c>edition-N-recovered</c> (or <c>recovered</c> when the edition is
/// unknown).</param>
/// <param name="Recovered">The files are kept as found, not as their manifest recorded them.</param>
/// <param name="Reasons">Why they are marked recovered, one line each (empty when verified).</param>
public sealed record ArchiveStep(string Folder, int? Edition, IReadOnlyList<string> Files, bool Recovered,
    IReadOnlyList<string> Reasons);

/// <summary>The planner's answer for one brief.</summary>
public abstract record EditionPlan
{
    private EditionPlan() { }

    /// <summary>Nothing the brief depends on changed and its files are in place.</summary>
    public sealed record Skip(int Edition) : EditionPlan;

    /// <summary>
    /// Build edition <paramref name="Edition"/>; keep the current files first when <paramref name="Archive"/> is set.
    /// </summary>
    /// <param name="NewEdition">The number went up: the brief gets a "changes since" section.</param>
    /// <param name="CompareWith">The current edition's results file to compare with (verified, or null).</param>
    public sealed record Build(int Edition, bool NewEdition, ArchiveStep? Archive, string? CompareWith) : EditionPlan
    {
        /// <summary>The same edition under a new date: new file names, the previous dated files archived.</summary>
        public bool Redated { get; init; }

        /// <summary>
        /// Only the tool changed among what defines an edition: the built results decide. If an assumption as shown or
        /// a headline result differs from <see cref="CompareWith"/>, <see cref="EditionPlanner.Settle"/> makes it a new
        /// edition.
        /// </summary>
        public bool ResultsDecide { get; init; }

        /// <summary>What changed, by input name (<see cref="EditionInput"/>), output switches prefixed <c>outputs.</c>;
        /// <c>new</c> for a brief not built before, <c>files</c> when files were missing or edited, <c>force</c> for
        /// --force.</summary>
        public IReadOnlyList<string> Changed { get; init; } = [];
    }

    /// <summary><c>brief.edition</c> was set below an edition already issued: nothing is built.</summary>
    public sealed record Refuse(int Requested, int Issued) : EditionPlan;
}

/// <summary>
/// Decides what a build does with one brief, from its inputs and what its output folder holds. Pure: the command line
/// gathers <see cref="CurrentEdition"/> and carries the plan out.
/// <para>The edition rule. A new edition (number n+1, or <c>brief.edition</c> when that is higher) starts only when the
/// scenario's content (anything but its date and edition number), the template, or an assumption as shown or a
/// headline result changes, or when <c>brief.edition</c> asks for a higher number than the current one. A new date
/// alone re-dates the current edition: same number, new file names, the previous dated files archived. A new theme,
/// fonts, tool version or scenario layout re-issues the same edition (archived first); an output switch (chart copies,
/// byte order mark, further formats) rewrites the same edition, archived first only when it drops or changes a file
/// (<see cref="KeepReplaced"/>). <c>brief.edition</c> below an edition already issued is refused, unless it is the
/// value the current edition was built with (a request already met).</para>
/// <para>The rule that matters for files: the current edition's files are never replaced unless they are archived
/// first, completely and verified, or as found and marked recovered; the exception is a rebuild in which every present
/// file comes out the same bytes.</para>
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
            int issued = Math.Max(previous, current.HighestArchivedEdition);
            bool intact = current.MissingFiles.Count == 0 && current.ChangedFiles.Count == 0;
            if (requested > 1 && requested < issued && current.RequestedEdition is { } asked && requested != asked)
                return new EditionPlan.Refuse(requested, issued);
            string? results = current.Stem + ".results.json";
            bool comparable = current.Files.Contains(results) && !current.MissingFiles.Contains(results)
                && !current.ChangedFiles.Contains(results);
            var diff = Compare(request, current);
            if (requested > previous)
                diff.Edition.Add(EditionInput.RequestedEdition);
            else if (current.Fingerprint == request.Fingerprint)
            {
                if (intact && !request.Force) return new EditionPlan.Skip(previous);
                string[] why = intact ? ["force"] : ["files"];
                // Same inputs: the rebuild writes the same bytes, so present files that match need no copy.
                if (current.ChangedFiles.Count == 0)
                    return new EditionPlan.Build(previous, false, null, null) { Changed = why };
                return new EditionPlan.Build(previous, false, Recovered(current, previous), null) { Changed = why };
            }
            var changed = diff.All();
            if (diff.Edition.Count > 0 || (diff.Tool && !comparable))
                return NewEdition(current, requested, intact, comparable ? results : null, changed);
            // The same edition: re-dated, re-issued in a new look, or with other output switches.
            bool replaced = diff.Date || diff.Presentation.Count > 0;
            ArchiveStep? archive = current.ChangedFiles.Count > 0 || (replaced && !intact)
                ? Recovered(current, previous)
                : replaced ? Verified(current, previous) : null;
            return new EditionPlan.Build(previous, false, archive, diff.Tool ? results : null)
            {
                Redated = diff.Date, ResultsDecide = diff.Tool, Changed = changed,
            };
        }
        if (current.Empty)
            return new EditionPlan.Build(
                current.HighestArchivedEdition > 0 ? Math.Max(requested, afterArchive) : requested, false, null, null)
            {
                Changed = ["new"],
            };
        // A damaged or missing manifest beside files of this brief: keep them as found, then start a new edition.
        int found = current.Edition ?? 0;
        int edition = Math.Max(requested, Math.Max(found + 1, afterArchive));
        return new EditionPlan.Build(edition, found > 0, Recovered(current, current.Edition), null)
        {
            Changed = ["files"],
        };
    }

    /// <summary>
    /// A plan whose results decide (<see cref="EditionPlan.Build.ResultsDecide"/>), once the brief's results are known:
    /// a new edition when an assumption as shown or a headline result differs from the current edition's, else as
    /// planned.
    /// </summary>
    public static EditionPlan.Build Settle(EditionPlan.Build plan, EditionRequest request, CurrentEdition current,
        bool resultsChanged)
    {
        if (!plan.ResultsDecide) return plan;
        if (!resultsChanged) return plan with { ResultsDecide = false };
        bool intact = current.MissingFiles.Count == 0 && current.ChangedFiles.Count == 0;
        var next = NewEdition(current, Math.Max(1, request.RequestedEdition), intact, plan.CompareWith,
            plan.Changed.Append(EditionInput.Results).ToList());
        return next with { Archive = plan.Archive ?? next.Archive };
    }

    /// <summary>
    /// Once the new files are made: a plan that keeps no copy (nothing changed but output switches, or files to
    /// restore) keeps the current edition whole first after all when a present file would not come back byte for byte,
    /// such as chart copies switched off or a byte order mark switched on. Files only added need no copy.
    /// </summary>
    /// <param name="currentSha256">The manifest's SHA-256 of each current file (null: not recorded, so nothing can be
    /// shown to come back).</param>
    /// <param name="newSha256">The SHA-256 of each file the build made.</param>
    public static EditionPlan.Build KeepReplaced(EditionPlan.Build plan, CurrentEdition current,
        IReadOnlyDictionary<string, string>? currentSha256, IReadOnlyDictionary<string, string> newSha256)
    {
        if (plan.Archive is not null || current.Manifest != ManifestCondition.Valid) return plan;
        var present = current.Files.Except(current.MissingFiles).ToList();
        if (present.Count == 0) return plan;
        if (currentSha256 is not null && present.All(f =>
                newSha256.TryGetValue(f, out var h) && currentSha256.TryGetValue(f, out var was) && h == was))
            return plan;
        int edition = current.Edition ?? 0;
        bool intact = current.MissingFiles.Count == 0 && current.ChangedFiles.Count == 0;
        return plan with { Archive = intact ? Verified(current, edition) : Recovered(current, edition) };
    }

    private static EditionPlan.Build NewEdition(CurrentEdition current, int requested, bool intact, string? compareWith,
        IReadOnlyList<string> changed)
    {
        int previous = current.Edition ?? 0;
        int next = Math.Max(requested, Math.Max(previous + 1, current.HighestArchivedEdition + 1));
        var archive = intact ? Verified(current, previous) : Recovered(current, previous);
        return new EditionPlan.Build(next, true, archive, compareWith) { Changed = changed };
    }

    private sealed class Differences
    {
        public List<string> Edition { get; } = [];
        public bool Date { get; set; }
        public bool Tool { get; set; }
        public List<string> Presentation { get; } = [];
        public List<string> Outputs { get; } = [];

        public IReadOnlyList<string> All() =>
            [.. Edition, .. Date ? [EditionInput.Date] : Array.Empty<string>(), .. Presentation,
                .. Outputs.Select(o => EditionInput.OutputPrefix + o)];
    }

    /// <summary>Which inputs differ, sorted by what a change of each means.</summary>
    private static Differences Compare(EditionRequest request, CurrentEdition current)
    {
        var d = new Differences();
        if (request.Inputs.Count == 0 || current.Inputs is null)
        {
            // Only fingerprints to go on: any change is a new edition.
            if (request.Fingerprint != current.Fingerprint) d.Edition.Add("inputs");
            return d;
        }
        bool content = request.Inputs.ContainsKey(EditionInput.Content)
            && current.Inputs.ContainsKey(EditionInput.Content);
        foreach (var key in request.Inputs.Keys.Union(current.Inputs.Keys).Order(StringComparer.Ordinal))
        {
            if (request.Inputs.GetValueOrDefault(key) == current.Inputs.GetValueOrDefault(key)) continue;
            switch (key)
            {
                case EditionInput.Template:
                    d.Edition.Add(key);
                    break;
                case EditionInput.Content:
                // the text stands in for the content a manifest did not record
                case EditionInput.ScenarioText when !content:
                    if (!d.Edition.Contains(EditionInput.Content)) d.Edition.Add(EditionInput.Content);
                    break;
                case EditionInput.Date:
                    d.Date = true;
                    break;
                case EditionInput.Tool:
                    d.Tool = true;
                    d.Presentation.Add(key);
                    break;
                default:
                    d.Presentation.Add(key);
                    break;
            }
        }
        // A content change says all the text change could (the text also holds the date and edition number).
        if (d.Edition.Contains(EditionInput.Content)) d.Presentation.Remove(EditionInput.ScenarioText);
        var before = current.Outputs ?? new Dictionary<string, string>();
        foreach (var key in request.Outputs.Keys.Union(before.Keys).Order(StringComparer.Ordinal))
            if (request.Outputs.GetValueOrDefault(key) != before.GetValueOrDefault(key)) d.Outputs.Add(key);
        return d;
    }

    private static ArchiveStep Verified(CurrentEdition current, int edition)
        => new($"edition-{edition}", edition, current.Files, false, []);

    private static ArchiveStep Recovered(CurrentEdition current, int? edition)
    {
        var reasons = new List<string>();
        if (current.Manifest == ManifestCondition.Damaged)
            reasons.Add("the manifest was damaged (unreadable, edited, or naming a path outside the output folder)");
        if (current.Manifest == ManifestCondition.Missing) reasons.Add("the manifest was missing");
        foreach (var f in current.MissingFiles) reasons.Add($"missing: {f}");
        foreach (var f in current.ChangedFiles) reasons.Add($"not as the manifest recorded it: {f}");
        string folder = edition is > 0 ? $"edition-{edition}-recovered" : "recovered";
        return new ArchiveStep(folder, edition is > 0 ? edition : null,
            current.Files.Except(current.MissingFiles).ToList(), true, reasons);
    }
}
