using System.Text;
using System.Text.Json;
using Briefwright.Brief.Editions;

namespace Briefwright.Cli.Batch;

/// <summary>
/// The record of a switch in progress, written (atomically, flushed) once the new edition is staged and the previous
/// one archived, and removed when the switch is done. The files named in <see cref="Old"/> are moved from the folder
/// into the staging folder's <c>old/</c> (the manifest first), then those in <see cref="New"/> from its <c>new/</c>
/// into the folder (the manifest last). Each move is one rename(2) (a move that may replace its target: .NET's
/// no-replace move links and unlinks, which can leave a file in two places), so every file is at any instant in exactly
/// one place, and a build that finds the journal can finish the switch or undo it.
/// </summary>
public sealed record Journal(
    string Id,
    string Token,
    int Edition,
    IReadOnlyList<string> Old,
    IReadOnlyList<string> New,
    IReadOnlyDictionary<string, string> NewSha256,
    string? Archive);

/// <summary>
/// A transaction failed; <see cref="Exception.Message"/> says truthfully what state the folder is in.
/// </summary>
public sealed class EditionWriteException(string message, Exception inner) : IOException(message, inner);

/// <summary>
/// Carries out an edition plan for one brief whose lock is held: stage the complete new edition, archive the current
/// one (verified against its manifest's hashes, or as found and marked recovered), journal, switch, clean up. Also
/// recovers what an interrupted build left.
/// </summary>
public static class EditionTransaction
{
    private const long Margin = 1 << 20;

    /// <summary>
    /// Finishes or undoes a switch left by a build that stopped, and removes its staging and partial archive.
    /// </summary>
    /// <returns>What was recovered, for the report; null when there was nothing.</returns>
    public static string? Recover(EditionFolder folder, BriefLock held)
    {
        var notes = new List<string>();
        if (File.Exists(folder.JournalPath))
        {
            Journal? journal = null;
            try { journal = JsonSerializer.Deserialize(File.ReadAllBytes(folder.JournalPath),
                BatchJsonContext.Default.Journal); }
            catch (JsonException) { }
            if (journal is null || journal.Id != folder.Id || !journal.Old.Concat(journal.New).All(Manifest.Confined)
                || journal.Token.Any(c => !char.IsAsciiLetterOrDigit(c)))
                throw new IOException($"{folder.JournalPath} is damaged, so an interrupted switch of {folder.Id} can " +
                    "be neither finished nor undone safely; nothing was changed. " +
                    $"Inspect {folder.TempDir} (old/ holds the previous files, new/ the new ones), " +
                    "put the files right and delete the journal");
            try
            {
                Forward(folder, journal);
                notes.Add($"finished the switch to edition {journal.Edition} that an interrupted build had begun");
            }
            catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
            {
                try { Back(folder, journal); }
                catch (Exception again) when (again is IOException or UnauthorizedAccessException)
                {
                    throw new EditionWriteException($"an interrupted switch to edition {journal.Edition} could be " +
                        $"neither finished ({ex.Message}) nor undone ({again.Message}); {folder.JournalPath} still " +
                        $"records it, the previous files are in {Path.Combine(folder.Staging(journal.Token), "old")}" +
                        (journal.Archive is null ? "" : $" and {journal.Archive}") +
                        "; put right what stops it and build again", again);
                }
                notes.Add($"undid the switch to edition {journal.Edition} that an interrupted build had begun " +
                    $"({ex.Message}); the previous edition is in place");
            }
            File.Delete(folder.JournalPath);
            FaultSeam.After(folder.Id, "recover.journal");
        }
        if (Directory.Exists(folder.TempDir))
        {
            foreach (var d in Directory.EnumerateDirectories(folder.TempDir, folder.Id + ".*"))
                if (!d.EndsWith("." + held.Info.Token, StringComparison.Ordinal))
                {
                    Directory.Delete(d, recursive: true);
                    if (notes.Count == 0) notes.Add("removed the staging folder of an interrupted build");
                }
            foreach (var f in Directory.EnumerateFiles(folder.TempDir, folder.Id + ".journal.*"))
                File.Delete(f);
        }
        if (Directory.Exists(folder.ArchiveRoot))
            foreach (var d in Directory.EnumerateDirectories(folder.ArchiveRoot, ".partial-*"))
            {
                Directory.Delete(d, recursive: true);
                notes.Add("removed a partial archive copy of an interrupted build " +
                    "(the edition it copied is still current)");
            }
        if (held.TookOver is { } t) notes.Insert(0, t);
        return notes.Count == 0 ? null : string.Join("; ", notes);
    }

    /// <summary>
    /// Carries out <paramref name="plan"/>: the new edition's files replace the current ones as one step.
    /// </summary>
    /// <returns>The archive folder written, if any.</returns>
    public static string? Execute(
        EditionFolder folder,
        BriefLock held,
        EditionPlan.Build plan,
        Manifest? current,
        CurrentEdition state,
        IReadOnlyList<(string Name, byte[] Bytes)> files,
        Manifest manifest,
        bool durable)
    {
        string token = held.Info.Token, staging = folder.Staging(token);
        byte[] manifestBytes = manifest.ToBytes();
        string? archived = Stage(folder, held, plan, current, files, manifestBytes, durable);
        // The commit point: once the journal exists, the next build finishes this switch (or undoes it).
        var journal = JournalOf(folder, token, plan, state, files, manifestBytes, archived);
        WriteJournal(folder, journal, staging);
        Switch(folder, journal, staging, archived);
        // Switched: from here nothing can make this build fail. A journal left behind finds nothing to do next time.
        try
        {
            FaultSeam.After(folder.Id, "switched");
            File.Delete(folder.JournalPath);
            FaultSeam.After(folder.Id, "committed");
            TryDelete(staging);
            FaultSeam.After(folder.Id, "cleaned");
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            // the next holder of the lock removes what is left
        }
        return archived;
    }

    /// <summary>Writes the new files and manifest into the staging folder and archives what the plan keeps, after
    /// checking the space; nothing in the brief's folder is replaced yet. Returns the archive folder written, if
    /// any.</summary>
    private static string? Stage(EditionFolder folder, BriefLock held, EditionPlan.Build plan, Manifest? current,
        IReadOnlyList<(string Name, byte[] Bytes)> files, byte[] manifestBytes, bool durable)
    {
        string id = folder.Id, token = held.Info.Token;
        string staging = folder.Staging(token), stagedNew = Path.Combine(staging, "new");
        string? archived = null;
        try
        {
            long archiveBytes = plan.Archive is { } a
                ? a.Files.Sum(f => Length(Path.Combine(folder.Dir, f))) + Length(folder.ManifestPath)
                : 0;
            CheckSpace(folder.Dir, files.Sum(f => (long)f.Bytes.Length) + manifestBytes.Length + archiveBytes + Margin);

            Directory.CreateDirectory(stagedNew);
            foreach (var (name, bytes) in files)
            {
                WriteNew(Path.Combine(stagedNew, name), bytes, durable);
                if (name == files[0].Name) FaultSeam.After(id, "stage.first");
            }
            WriteNew(Path.Combine(stagedNew, folder.ManifestName), manifestBytes, durable);
            FaultSeam.After(id, "staged");

            if (plan.Archive is { } step)
            {
                archived = Archive(folder, step, current, token, durable);
                FaultSeam.After(id, "archived");
            }
            if (!held.StillHeld())
                throw new IOException(
                    $"another build took over the lock {held.Path} while this one worked (it judged it abandoned)");
            return archived;
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            TryDelete(staging);
            TryDelete(Path.Combine(folder.ArchiveRoot, ".partial-" + token));
            throw new EditionWriteException($"{ex.Message}; nothing was replaced: the previous files are untouched" +
                (archived is null ? "" : $" (and kept in {Relative(folder, archived)})"), ex);
        }
    }

    /// <summary>The switch to make: the files to move aside (the manifest first, then the previous edition's files
    /// and any file the new edition overwrites) and the new ones with their hashes.</summary>
    private static Journal JournalOf(EditionFolder folder, string token, EditionPlan.Build plan, CurrentEdition state,
        IReadOnlyList<(string Name, byte[] Bytes)> files, byte[] manifestBytes, string? archived)
    {
        var previous = plan.Archive is { } keep ? keep.Files : state.Files;
        var newNames = files.Select(f => f.Name).Append(folder.ManifestName).ToList();
        var old = new List<string>();
        if (File.Exists(folder.ManifestPath)) old.Add(folder.ManifestName);
        foreach (var f in previous.Union(newNames.Where(n => n != folder.ManifestName)))
            if (!old.Contains(f) && File.Exists(Path.Combine(folder.Dir, f))) old.Add(f);
        return new Journal(folder.Id, token, plan.Edition, old, newNames,
            files.ToDictionary(f => f.Name, f => EditionFolder.Sha256(f.Bytes))
                .Append(new(folder.ManifestName, EditionFolder.Sha256(manifestBytes)))
                .ToDictionary(),
            archived is null ? null : Relative(folder, archived));
    }

    /// <summary>Writes the journal (the commit point); on failure removes it and the staging folder: nothing
    /// replaced.</summary>
    private static void WriteJournal(EditionFolder folder, Journal journal, string staging)
    {
        try
        {
            Directory.CreateDirectory(Path.Combine(staging, "old"));
            WriteAtomically(folder.JournalPath,
                JsonSerializer.SerializeToUtf8Bytes(journal, BatchJsonContext.Default.Journal), journal.Token);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            TryDelete(folder.JournalPath);
            TryDelete(staging);
            throw new EditionWriteException(
                $"{ex.Message}; nothing was replaced: the previous files are untouched", ex);
        }
    }

    /// <summary>Moves the old files aside and the new ones in; when that fails, moves everything back (or, when even
    /// that fails, leaves the journal for the next build) and says where the previous files are.</summary>
    private static void Switch(EditionFolder folder, Journal journal, string staging, string? archived)
    {
        try
        {
            FaultSeam.After(folder.Id, "journal");
            Forward(folder, journal);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            try
            {
                Back(folder, journal);
                File.Delete(folder.JournalPath);
                TryDelete(staging);
            }
            catch (Exception again) when (again is IOException or UnauthorizedAccessException)
            {
                throw new EditionWriteException(
                    $"{ex.Message}; the switch could neither be finished nor undone ({again.Message}): " +
                    $"{folder.JournalPath} records it and the next build finishes or undoes it; " +
                    $"the previous files are in {Path.Combine(staging, "old")}" +
                    (archived is null ? "" : $" and {Relative(folder, archived)}"), ex);
            }
            throw new EditionWriteException(
                $"{ex.Message}; the switch was undone: the previous files are back in place" +
                (archived is null ? "" : $" (and kept in {Relative(folder, archived)})"), ex);
        }
    }

    /// <summary>
    /// Moves the old files aside (manifest first) and the new ones in (manifest last); safe to repeat after a kill.
    /// </summary>
    private static void Forward(EditionFolder folder, Journal journal)
    {
        string staging = folder.Staging(journal.Token), stagedNew = Path.Combine(staging, "new"),
            stagedOld = Path.Combine(staging, "old");
        foreach (var n in journal.New)
            if (!File.Exists(Path.Combine(stagedNew, n)) && !(File.Exists(Path.Combine(folder.Dir, n))
                && EditionFolder.Sha256(Path.Combine(folder.Dir, n)) == journal.NewSha256[n]))
                throw new IOException($"the staged file {n} is gone");
        bool movingIn = journal.New.Any(n => !File.Exists(Path.Combine(stagedNew, n)));
        if (!movingIn)
        {
            Directory.CreateDirectory(stagedOld);
            int k = 0;
            foreach (var o in journal.Old)
            {
                k++;
                string here = Path.Combine(folder.Dir, o), aside = Path.Combine(stagedOld, o);
                if (!File.Exists(here)) continue; // moved already
                File.Move(here, aside, overwrite: true);
                FaultSeam.After(folder.Id, $"switch.aside.{k}");
            }
        }
        int i = 0;
        foreach (var n in journal.New)
        {
            i++;
            string staged = Path.Combine(stagedNew, n);
            if (!File.Exists(staged)) continue; // moved in already
            File.Move(staged, Path.Combine(folder.Dir, n), overwrite: true);
            FaultSeam.After(folder.Id, $"switch.in.{i}");
        }
    }

    /// <summary>Moves the new files back to staging and the old ones back into place; safe to repeat.</summary>
    private static void Back(EditionFolder folder, Journal journal)
    {
        string staging = folder.Staging(journal.Token), stagedNew = Path.Combine(staging, "new"),
            stagedOld = Path.Combine(staging, "old");
        foreach (var n in journal.New.Reverse())
        {
            string here = Path.Combine(folder.Dir, n), staged = Path.Combine(stagedNew, n);
            if (!File.Exists(staged) && File.Exists(here)) File.Move(here, staged, overwrite: true);
        }
        foreach (var o in journal.Old.Reverse())
        {
            string aside = Path.Combine(stagedOld, o);
            if (File.Exists(aside)) File.Move(aside, Path.Combine(folder.Dir, o), overwrite: true);
        }
    }

    /// <summary>
    /// Copies the current files into <c>archive/&lt;id&gt;/&lt;folder&gt;/</c>: first into a partial folder, each copy
    /// read back and checked against the manifest's SHA-256 (or against the bytes read, for files kept as found), then
    /// renamed into place in one step. An existing archive folder is never overwritten: one with the same files is
    /// reused, else the copy gets the next free name.
    /// </summary>
    private static string Archive(EditionFolder folder, ArchiveStep step, Manifest? current, string token, bool durable)
    {
        string partial = Path.Combine(folder.ArchiveRoot, ".partial-" + token);
        Directory.CreateDirectory(partial);
        var names = step.Files.ToList();
        if (File.Exists(folder.ManifestPath)) names.Add(folder.ManifestName);
        foreach (var f in names)
        {
            byte[] bytes = File.ReadAllBytes(Path.Combine(folder.Dir, f));
            string hash = EditionFolder.Sha256(bytes);
            if (!step.Recovered && current?.Sha256 is { } expected && expected.TryGetValue(f, out var want)
                && want != hash)
                throw new IOException($"{f} changed while it was being archived");
            string copy = Path.Combine(partial, f);
            WriteNew(copy, bytes, durable);
            if (EditionFolder.Sha256(copy) != hash)
                throw new IOException($"the archive copy of {f} does not read back as written");
        }
        if (step.Recovered)
            WriteNew(Path.Combine(partial, "RECOVERED.txt"), Encoding.UTF8.GetBytes(
                "These files were kept as found, not as a complete edition checked against its manifest, because:\n" +
                string.Concat(step.Reasons.Select(r => $"- {r}\n"))), durable);
        FaultSeam.After(folder.Id, "archive.copied");
        string target = Path.Combine(folder.ArchiveRoot, step.Folder);
        for (int n = 2; Directory.Exists(target); n++)
        {
            if (SameFiles(target, partial))
            {
                Directory.Delete(partial, recursive: true);
                return target;
            }
            target = Path.Combine(folder.ArchiveRoot, $"{step.Folder}-{n}");
        }
        Directory.Move(partial, target);
        return target;
    }

    private static bool SameFiles(string a, string b)
    {
        var fa = Directory.GetFiles(a).Select(Path.GetFileName).Order(StringComparer.Ordinal).ToList();
        var fb = Directory.GetFiles(b).Select(Path.GetFileName).Order(StringComparer.Ordinal).ToList();
        return fa.SequenceEqual(fb)
            && fa.All(f => EditionFolder.Sha256(Path.Combine(a, f!)) == EditionFolder.Sha256(Path.Combine(b, f!)));
    }

    private static void CheckSpace(string dir, long need)
    {
        long free;
        try { free = new DriveInfo(Path.GetFullPath(dir)).AvailableFreeSpace; }
        // unknown: the writes will tell
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException or ArgumentException) { return; }
        if (free < need)
            throw new IOException($"not enough free space in {dir}: the new edition and the archive copy need " +
                $"{Mb(need)}, {Mb(free)} is free");
    }

    private static string Mb(long bytes) => $"{bytes / (1024.0 * 1024.0):0.0} MB";

    private static long Length(string path) => new FileInfo(path) is { Exists: true } fi ? fi.Length : 0;

    private static void WriteNew(string path, byte[] bytes, bool durable)
    {
        using var stream = new FileStream(path, FileMode.CreateNew, FileAccess.Write, FileShare.None);
        stream.Write(bytes);
        stream.Flush(flushToDisk: durable);
    }

    private static void WriteAtomically(string path, byte[] bytes, string token)
    {
        string temp = $"{path}.{token}.tmp";
        WriteNew(temp, bytes, durable: true);
        File.Move(temp, path, overwrite: true);
    }

    private static string Relative(EditionFolder folder, string path) => Path.GetRelativePath(folder.Dir, path);

    private static void TryDelete(string path)
    {
        try
        {
            if (Directory.Exists(path)) Directory.Delete(path, recursive: true);
            else File.Delete(path);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            // left for the next holder of the lock, which removes it
        }
    }
}
