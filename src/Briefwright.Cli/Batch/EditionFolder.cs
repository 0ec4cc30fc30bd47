using System.Text.Json;
using System.Text.RegularExpressions;
using Briefwright.Brief.Editions;

namespace Briefwright.Cli.Batch;

/// <summary>
/// Where one brief lives in an output folder, and what is there now. Paths: the brief's files and
/// <c>&lt;id&gt;.manifest.json</c> in the folder; <c>archive/&lt;id&gt;/</c>; and in <c>.briefwright-tmp/</c> the lock
/// <c>&lt;id&gt;.lock</c>, the switch journal <c>&lt;id&gt;.journal</c> and staging folders
/// <c>&lt;id&gt;.&lt;token&gt;/</c>.
/// </summary>
public sealed class EditionFolder(string dir, string id)
{
    public const string TempFolderName = ".briefwright-tmp";

    public string Dir { get; } = dir;
    public string Id { get; } = id;
    public string TempDir => Path.Combine(Dir, TempFolderName);
    public string ManifestName => Manifest.FileName(Id);
    public string ManifestPath => Path.Combine(Dir, ManifestName);
    public string JournalPath => Path.Combine(TempDir, Id + ".journal");
    public string ArchiveRoot => Path.Combine(Dir, "archive", Id);
    public string Staging(string token) => Path.Combine(TempDir, $"{Id}.{token}");

    public static string Sha256(byte[] bytes) => Sha256Hex.Of(bytes);

    public static string Sha256(string path)
    {
        using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read, 1 << 16);
        return Sha256Hex.Of(stream);
    }

    /// <summary>
    /// The current edition as found. Without <paramref name="full"/>: the manifest and the size of each file (enough to
    /// skip an unchanged brief). With it: also every file's SHA-256 against the manifest, files found by name when the
    /// manifest is missing or damaged, and the highest archived edition.
    /// </summary>
    public (Manifest? Manifest, CurrentEdition State) Read(bool full)
    {
        Manifest? manifest = null;
        var condition = ManifestCondition.Missing;
        if (File.Exists(ManifestPath))
        {
            string text;
            try { text = File.ReadAllText(ManifestPath); }
            catch (Exception ex) when (ex is IOException or UnauthorizedAccessException) { text = ""; }
            manifest = Manifest.Parse(text);
            condition = manifest is not null && manifest.Id == Id ? ManifestCondition.Valid : ManifestCondition.Damaged;
            if (condition == ManifestCondition.Damaged) manifest = null;
        }
        int archived = full ? HighestArchivedEdition() : 0;
        if (manifest is not null)
        {
            var missing = new List<string>();
            var changed = new List<string>();
            foreach (var f in manifest.Files)
            {
                var info = new FileInfo(Path.Combine(Dir, f));
                if (!info.Exists) missing.Add(f);
                else if (manifest.Sizes is { } sizes && sizes[f] != info.Length) changed.Add(f);
                else if (full && manifest.Sha256 is { } hashes && hashes[f] != Sha256(info.FullName)) changed.Add(f);
            }
            return (manifest, new CurrentEdition(
                condition, manifest.Edition, manifest.Hash, manifest.Stem, manifest.Files, missing, changed, archived)
            {
                Inputs = manifest.Inputs, Outputs = manifest.Outputs, RequestedEdition = manifest.RequestedEdition,
            });
        }
        if (!full) return (null, new CurrentEdition(condition, null, null, null, [], [], [], 0));
        var found = Found();
        return (null, new CurrentEdition(condition, FoundEdition(found), null, null, found, [], [], archived));
    }

    /// <summary>Files of this brief by name, <c>&lt;id&gt;-YYYY-MM-DD.*</c> or <c>&lt;id&gt;-YYYY-MM-DD-edition-N.*</c>
    /// (ids cannot hold a dot, so no other brief's).</summary>
    public IReadOnlyList<string> Found()
    {
        if (!Directory.Exists(Dir)) return [];
        var pattern = new Regex(
            "^" + Regex.Escape(Id) + @"-\d{4}-\d{2}-\d{2}(-edition-\d{1,9})?\.",
            RegexOptions.CultureInvariant);
        return Directory.EnumerateFiles(Dir, Id + "-*").Select(Path.GetFileName)
            .Where(n => n is not null && pattern.IsMatch(n))
            .Select(n => n!)
            .Order(StringComparer.Ordinal)
            .ToList();
    }

    /// <summary>
    /// The edition a found results file names (the highest, if several), when the manifest cannot say.
    /// </summary>
    private int? FoundEdition(IReadOnlyList<string> found)
    {
        int? best = null;
        foreach (var f in found.Where(f => f.EndsWith(".results.json", StringComparison.Ordinal)))
            try
            {
                using var doc = JsonDocument.Parse(File.ReadAllBytes(Path.Combine(Dir, f)));
                if (doc.RootElement.TryGetProperty("edition", out var e) && e.TryGetInt32(out int n) && n > 0)
                    best = Math.Max(best ?? 0, n);
            }
            catch (Exception ex)
                when (ex is IOException or JsonException or UnauthorizedAccessException or InvalidOperationException)
            {
                // damaged too: the edition stays unknown
            }
        return best;
    }

    private static readonly Regex ArchiveName = new(@"^edition-(\d{1,9})(-|$)", RegexOptions.CultureInvariant);

    public int HighestArchivedEdition()
    {
        if (!Directory.Exists(ArchiveRoot)) return 0;
        int best = 0;
        foreach (var d in Directory.EnumerateDirectories(ArchiveRoot))
            if (ArchiveName.Match(Path.GetFileName(d)) is { Success: true } m)
                best = Math.Max(best, int.Parse(m.Groups[1].Value, System.Globalization.CultureInfo.InvariantCulture));
        return best;
    }
}
