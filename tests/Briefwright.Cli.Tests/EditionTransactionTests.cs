using System.Diagnostics;
using System.Text.Json;
using Briefwright.Cli.Batch;

namespace Briefwright.Cli.Tests;

/// <summary>What a folder holds, file by file, as SHA-256 (the manifest's own hash function).</summary>
internal static class Snapshot
{
    public const string Id = "auroria-national";

    public static Dictionary<string, string> Of(string dir) =>
        Directory.Exists(dir)
            ? Directory.GetFiles(dir).Where(f => !f.EndsWith("build-log.jsonl")).ToDictionary(f => Path.GetFileName(f)!, EditionFolder.Sha256)
            : [];

    /// <summary>Every file of an edition, by the hashes taken before anything happened: in place, or in its archive folder.</summary>
    public static void AssertKept(Dictionary<string, string> edition, string dir, string archive)
    {
        var here = Of(dir);
        var kept = Of(archive);
        foreach (var (name, hash) in edition)
            Assert.True(here.GetValueOrDefault(name) == hash || kept.GetValueOrDefault(name) == hash, $"{name} of the previous edition was lost");
    }

    /// <summary>The edition in the folder is complete: its manifest checks, and every file matches the manifest's SHA-256.</summary>
    public static Manifest AssertWhole(string dir, string id = Id)
    {
        var manifest = Manifest.Parse(File.ReadAllText(Manifest.PathFor(dir, id)));
        Assert.NotNull(manifest);
        foreach (var f in manifest.Files) Assert.Equal(manifest.Sha256![f], EditionFolder.Sha256(Path.Combine(dir, f)));
        return manifest;
    }

    public static void CopyTree(string from, string to)
    {
        Directory.CreateDirectory(to);
        foreach (var f in Directory.GetFiles(from)) File.Copy(f, Path.Combine(to, Path.GetFileName(f)));
        foreach (var d in Directory.GetDirectories(from)) CopyTree(d, Path.Combine(to, Path.GetFileName(d)));
    }

    /// <summary>A lock left by a killed build, as it looks once StaleAfter has passed.</summary>
    public static void AgeLocks(string outDir)
    {
        string temp = Path.Combine(outDir, EditionFolder.TempFolderName);
        if (!Directory.Exists(temp)) return;
        foreach (var l in Directory.GetFiles(temp, "*.lock")) File.SetLastWriteTimeUtc(l, DateTime.UtcNow - BriefLock.StaleAfter - TimeSpan.FromMinutes(1));
    }

    public static Process Start(IReadOnlyDictionary<string, string> env, params string[] args)
    {
        var psi = new ProcessStartInfo("dotnet") { RedirectStandardOutput = true, RedirectStandardError = true };
        psi.ArgumentList.Add(Path.Combine(AppContext.BaseDirectory, "briefwright.dll"));
        foreach (var a in args) psi.ArgumentList.Add(a);
        foreach (var (k, v) in env) psi.Environment[k] = v;
        return Process.Start(psi)!;
    }

    public static (int Code, string Out, string Err) Run(params string[] args)
    {
        var output = new StringWriter();
        var error = new StringWriter();
        int code = CliApp.Run(args, output, error);
        return (code, output.ToString(), error.ToString());
    }

    public static List<JsonElement> Log(string outDir) =>
        File.ReadAllLines(Path.Combine(outDir, "build-log.jsonl")).Select(l => JsonDocument.Parse(l).RootElement.Clone()).ToList();
}

/// <summary>
/// A build killed (SIGKILL, through the fault seam) after each step of its transaction, in a separate process: every
/// file of the previous edition must still exist byte for byte, and the next build must end with the whole new edition
/// and the whole previous one archived. Steps are taken from an uninterrupted run, so a step added later is covered.
/// </summary>
public class KillAfterEveryStepOfASameDateRebuildTests
{
    [Fact]
    public void A_same_date_rebuild_killed_after_any_step_loses_nothing_and_the_next_build_finishes_it() =>
        KillAfterEveryStepTests.KillEachStep(w => w.Edit("auroria-national.yaml", "value: 22%", "value: 23%"), [], edition: 2);
}

/// <summary>The same for a rebuild with a new date (edition 1 re-dated: new file names; the previous dated files are removed).</summary>
public class KillAfterEveryStepTests
{
    [Fact]
    public void A_new_date_rebuild_killed_after_any_step_loses_nothing_and_the_next_build_finishes_it() =>
        KillEachStep(_ => { }, ["--date", "2026-12-15"], edition: 1);

    internal static void KillEachStep(Action<Workspace> change, string[] extra, int edition)
    {
        var w = new Workspace("auroria-national");
        string yaml = Path.Combine(w.Dir, "auroria-national.yaml");
        string[] args = new[] { "build", yaml, "--no-chart-images", "-q", "--jobs", "1" }.Concat(extra).ToArray();
        Assert.Equal(0, Snapshot.Run("build", yaml, "--no-chart-images", "-q").Code);
        var edition1 = Snapshot.Of(w.Out);
        change(w);

        // The uninterrupted rebuild: its steps, and the folder it leaves.
        string reference = w.Dir + "-reference";
        Snapshot.CopyTree(w.Dir, reference);
        var steps = new List<string>();
        FaultSeam.Hook = steps.Add;
        try { Assert.Equal(0, Snapshot.Run(args.Select(a => a == yaml ? Path.Combine(reference, "auroria-national.yaml") : a).ToArray()).Code); }
        finally { FaultSeam.Hook = null; }
        var expected = Snapshot.Of(Path.Combine(reference, "out"));
        Assert.Contains($"{Snapshot.Id}/journal", steps);
        Assert.Contains(steps, s => s.Contains("switch.in."));
        Assert.Contains(steps, s => s.Contains("switch.aside."));

        foreach (var step in steps)
        {
            string trial = w.Dir + "-" + step.Replace('/', '-');
            Snapshot.CopyTree(w.Dir, trial);
            string outDir = Path.Combine(trial, "out"), archive = Path.Combine(outDir, "archive", Snapshot.Id, "edition-1");
            using (var p = Snapshot.Start(new Dictionary<string, string> { ["BRIEFWRIGHT_FAULT"] = step + "=kill" },
                       args.Select(a => a == yaml ? Path.Combine(trial, "auroria-national.yaml") : a).ToArray()))
            {
                p.WaitForExit();
                Assert.True(p.ExitCode == 137, $"{step}: the build was not killed there (exit {p.ExitCode}): {p.StandardError.ReadToEnd()}");
            }
            Snapshot.AssertKept(edition1, outDir, archive);

            bool locked = File.Exists(Path.Combine(outDir, EditionFolder.TempFolderName, Snapshot.Id + ".lock"));
            Snapshot.AgeLocks(outDir);
            var (code, output, err) = Snapshot.Run(args.Select(a => a == yaml ? Path.Combine(trial, "auroria-national.yaml") : a).Where(a => a != "-q").ToArray());
            Assert.True(code == 0, $"{step}: {err}");
            bool switching = steps.IndexOf(step) >= steps.IndexOf($"{Snapshot.Id}/journal") && steps.IndexOf(step) < steps.IndexOf($"{Snapshot.Id}/committed");
            if (switching) Assert.True(output.Contains($"finished the switch to edition {edition} that an interrupted build had begun"), $"{step}: {output}");
            if (locked) Assert.True(output.Contains("recovered: took over the lock of a build that showed no sign of life"), $"{step}: {output}");
            Assert.Equal(expected, Snapshot.Of(outDir));
            Assert.Equal(edition1, Snapshot.Of(archive));
            Assert.Equal(["edition-1"], Directory.GetDirectories(Path.Combine(outDir, "archive", Snapshot.Id)).Select(Path.GetFileName));
            Assert.False(Directory.Exists(Path.Combine(outDir, EditionFolder.TempFolderName)), $"{step}: temporary files left");
        }
    }
}

/// <summary>A step that fails (as a write would) is reported truthfully, and leaves the previous edition in place.</summary>
public class FailAfterEveryStepTests
{
    [Fact]
    public void A_failure_before_or_during_the_switch_leaves_the_previous_edition_in_place_and_says_so()
    {
        var w = new Workspace("auroria-national");
        string yaml = Path.Combine(w.Dir, "auroria-national.yaml");
        Assert.Equal(0, Snapshot.Run("build", yaml, "--no-chart-images", "-q").Code);
        var edition1 = Snapshot.Of(w.Out);
        w.Edit("auroria-national.yaml", "value: 22%", "value: 23%");
        var steps = new List<string>();
        string probe = w.Dir + "-probe";
        Snapshot.CopyTree(w.Dir, probe);
        FaultSeam.Hook = steps.Add;
        try { Snapshot.Run("build", Path.Combine(probe, "auroria-national.yaml"), "--no-chart-images", "-q"); }
        finally { FaultSeam.Hook = null; }

        foreach (var step in steps.TakeWhile(s => s != $"{Snapshot.Id}/switched"))
        {
            string trial = w.Dir + "-" + step.Replace('/', '-');
            Snapshot.CopyTree(w.Dir, trial);
            string outDir = Path.Combine(trial, "out");
            FaultSeam.Hook = s => { if (s == step) throw new InjectedFaultException(s); };
            (int Code, string Out, string Err) r;
            try { r = Snapshot.Run("build", Path.Combine(trial, "auroria-national.yaml"), "--no-chart-images", "-q"); }
            finally { FaultSeam.Hook = null; }
            Assert.Equal(1, r.Code);
            Assert.Contains($"fault injected after step {step}", r.Err);
            bool switching = steps.IndexOf(step) >= steps.IndexOf($"{Snapshot.Id}/journal");
            Assert.Contains(switching ? "the switch was undone: the previous files are back in place" : "nothing was replaced: the previous files are untouched", r.Err);
            var now = Snapshot.Of(outDir);
            Assert.Equal(edition1, now); // the previous edition is current, byte for byte
            Assert.False(Directory.Exists(Path.Combine(outDir, EditionFolder.TempFolderName)), $"{step}: temporary files left");
            Assert.Equal(0, Snapshot.Run("build", Path.Combine(trial, "auroria-national.yaml"), "--no-chart-images", "-q").Code);
            Assert.Equal(edition1, Snapshot.Of(Path.Combine(outDir, "archive", Snapshot.Id, "edition-1")));
            Assert.Equal(2, Snapshot.AssertWhole(outDir).Edition);
        }
    }
}

/// <summary>Builds run at the same time into one folder, as separate processes (as on machines sharing a folder).</summary>
public class ConcurrentBuildTests
{
    private static List<(int Code, string Err)> RunAtOnce(IEnumerable<string[]> commands)
    {
        var processes = commands.Select(c => Snapshot.Start(new Dictionary<string, string>(), c)).ToList();
        var results = processes.Select(p =>
        {
            string err = p.StandardError.ReadToEnd();
            p.StandardOutput.ReadToEnd();
            p.WaitForExit();
            return (p.ExitCode, err);
        }).ToList();
        processes.ForEach(p => p.Dispose());
        return results;
    }

    [Fact]
    public void Two_builds_of_the_same_change_make_one_new_edition_and_archive_the_previous_one_whole()
    {
        var w = new Workspace("auroria-silverdale");
        Assert.Equal(0, w.Build().Code);
        var national1 = Snapshot.Of(w.Out).Where(kv => kv.Key.StartsWith("auroria-national")).ToDictionary();
        w.Edit("auroria-national.yaml", "value: 22%", "value: 23%");
        var results = RunAtOnce(Enumerable.Repeat(new[] { "build", w.Dir, "--no-chart-images", "-q" }, 2));
        Assert.All(results, r => Assert.True(r.Code == 0, r.Err));
        foreach (var id in new[] { "auroria-national", "auroria-silverdale" })
        {
            Assert.Equal(2, Snapshot.AssertWhole(w.Out, id).Edition);
            Assert.Equal(["edition-1"], Directory.GetDirectories(Path.Combine(w.Out, "archive", id)).Select(Path.GetFileName));
            var archived = Snapshot.AssertWhole(Path.Combine(w.Out, "archive", id, "edition-1"), id);
            Assert.Equal(1, archived.Edition);
        }
        Assert.Equal(national1, Snapshot.Of(Path.Combine(w.Out, "archive", "auroria-national", "edition-1")));
        var log = Snapshot.Log(w.Out);
        Assert.Equal(2, log.Count(l => l.GetProperty("status").GetString() == "built" && l.GetProperty("edition").GetInt32() == 2));
    }

    [Fact]
    public void Three_builds_of_three_dates_re_date_edition_1_and_archive_every_dated_copy_whole()
    {
        var w = new Workspace("auroria-national");
        string yaml = Path.Combine(w.Dir, "auroria-national.yaml");
        Assert.Equal(0, Snapshot.Run("build", yaml, "--no-chart-images", "-q").Code);
        var edition1 = Snapshot.Of(w.Out);
        var results = RunAtOnce(new[] { "2026-12-01", "2026-12-02", "2026-12-03" }.Select(d => new[] { "build", yaml, "--no-chart-images", "-q", "--date", d }));
        Assert.All(results, r => Assert.True(r.Code == 0, r.Err));
        var current = Snapshot.AssertWhole(w.Out);
        Assert.Equal(1, current.Edition); // a new date alone is no new edition
        string root = Path.Combine(w.Out, "archive", Snapshot.Id);
        var kept = Directory.GetDirectories(root).Select(d => Snapshot.AssertWhole(d)).ToList();
        Assert.Equal(3, kept.Count);
        Assert.All(kept, m => Assert.Equal(1, m.Edition));
        // Every dated copy is somewhere: three in the archive, one current.
        Assert.Equal(["auroria-national-2026-11-30", "auroria-national-2026-12-01", "auroria-national-2026-12-02", "auroria-national-2026-12-03"],
            kept.Select(m => m.Stem).Append(current.Stem).Order());
        Assert.Equal(edition1, Snapshot.Of(Path.Combine(root, "edition-1")));
        Assert.False(Directory.Exists(Path.Combine(w.Out, EditionFolder.TempFolderName)));
    }
}

/// <summary>The lock: a live holder is waited for; an abandoned one (judged by age alone) is taken over.</summary>
public class LockTests
{
    private static string WriteLock(string outDir, string host, int pid)
    {
        string temp = Path.Combine(outDir, EditionFolder.TempFolderName);
        Directory.CreateDirectory(temp);
        string path = Path.Combine(temp, Snapshot.Id + ".lock");
        File.WriteAllBytes(path, JsonSerializer.SerializeToUtf8Bytes(new LockInfo(host, pid, "0123456789abcdef", DateTime.UtcNow), BatchJsonContext.Default.LockInfo));
        return path;
    }

    [Fact]
    public void A_lock_held_by_a_build_on_another_machine_is_waited_for_with_a_message_and_nothing_is_written_meanwhile()
    {
        var w = new Workspace("auroria-national");
        string yaml = Path.Combine(w.Dir, "auroria-national.yaml");
        Directory.CreateDirectory(w.Out);
        // Process id 1 is alive here, but on another host it means nothing: only the lock's age counts.
        string path = WriteLock(w.Out, "build-node-7", 1);
        using var p = Snapshot.Start(new Dictionary<string, string>(), "build", yaml, "--no-chart-images", "-q");
        string? line = p.StandardError.ReadLine();
        Assert.NotNull(line);
        Assert.Contains("waiting for another build (host build-node-7, process 1, started", line);
        Assert.Contains(path, line);
        Assert.Empty(Directory.GetFiles(w.Out, "*.pdf"));
        Assert.Single(Directory.GetFileSystemEntries(Path.Combine(w.Out, EditionFolder.TempFolderName)));
        File.Delete(path); // the other build finishes
        p.WaitForExit();
        Assert.Equal(0, p.ExitCode);
        Snapshot.AssertWhole(w.Out);
    }

    [Fact]
    public void A_lock_untouched_for_longer_than_the_stale_age_is_taken_over_and_the_build_says_so()
    {
        var w = new Workspace("auroria-national");
        Directory.CreateDirectory(w.Out);
        string path = WriteLock(w.Out, Environment.MachineName, Environment.ProcessId); // even this very process: age decides
        File.SetLastWriteTimeUtc(path, DateTime.UtcNow - BriefLock.StaleAfter - TimeSpan.FromSeconds(30));
        var (code, _, err) = Snapshot.Run("build", Path.Combine(w.Dir, "auroria-national.yaml"), "--no-chart-images", "-q");
        Assert.True(code == 0, err);
        Assert.Contains("took over the lock of a build that showed no sign of life", Snapshot.Log(w.Out).Single().GetProperty("recovered").GetString());
        Assert.False(File.Exists(path));
    }
}

/// <summary>Damaged or incomplete folders are kept as found before anything new is written.</summary>
public class DamagedFolderTests
{
    private static (Workspace W, string Yaml, Dictionary<string, string> Edition1) Built()
    {
        var w = new Workspace("auroria-national");
        string yaml = Path.Combine(w.Dir, "auroria-national.yaml");
        Assert.Equal(0, Snapshot.Run("build", yaml, "--no-chart-images", "-q").Code);
        return (w, yaml, Snapshot.Of(w.Out));
    }

    private static string ManifestPath(Workspace w) => Manifest.PathFor(w.Out, Snapshot.Id);

    [Fact]
    public void A_truncated_manifest_is_archived_with_the_files_as_found_and_the_next_edition_is_2()
    {
        var (w, yaml, edition1) = Built();
        var bytes = File.ReadAllBytes(ManifestPath(w));
        File.WriteAllBytes(ManifestPath(w), bytes[..(bytes.Length / 2)]);
        var damaged = Snapshot.Of(w.Out);
        var (code, _, err) = Snapshot.Run("build", yaml, "--no-chart-images", "-q");
        Assert.True(code == 0, err);
        string kept = Path.Combine(w.Out, "archive", Snapshot.Id, "edition-1-recovered");
        var archived = Snapshot.Of(kept);
        foreach (var (name, hash) in damaged) Assert.Equal(hash, archived[name]);
        Assert.Contains("the manifest was damaged", File.ReadAllText(Path.Combine(kept, "RECOVERED.txt")));
        Assert.Equal(2, Snapshot.AssertWhole(w.Out).Edition);
        Assert.Equal(edition1.Where(kv => !kv.Key.EndsWith("manifest.json")), archived.Where(kv => edition1.ContainsKey(kv.Key) && !kv.Key.EndsWith("manifest.json")));
    }

    [Fact]
    public void An_edited_manifest_fails_its_own_check_and_is_treated_as_damaged()
    {
        var (w, yaml, _) = Built();
        string text = File.ReadAllText(ManifestPath(w));
        File.WriteAllText(ManifestPath(w), text.Replace("\"edition\": 1", "\"edition\": 9"));
        Assert.Null(Manifest.Parse(File.ReadAllText(ManifestPath(w))));
        Assert.Equal(0, Snapshot.Run("build", yaml, "--no-chart-images", "-q").Code);
        Assert.True(Directory.Exists(Path.Combine(w.Out, "archive", Snapshot.Id, "edition-1-recovered")));
    }

    [Theory]
    [InlineData(true)]
    [InlineData(false)]
    public void A_manifest_naming_a_file_outside_the_folder_never_leads_to_touching_it(bool withCheck)
    {
        var (w, yaml, _) = Built();
        string victim = Path.Combine(w.Dir, "victim.txt");
        File.WriteAllText(victim, "keep me");
        var real = Manifest.Parse(File.ReadAllText(ManifestPath(w)))!;
        var forged = real with { Files = real.Files.Append("../victim.txt").ToList(), Sizes = null, Sha256 = null, Check = null };
        byte[] bytes = withCheck
            ? (forged with { Sizes = forged.Files.ToDictionary(f => f, _ => 7L), Sha256 = forged.Files.ToDictionary(f => f, _ => "0") }).ToBytes()
            : forged.ToBytes();
        if (!withCheck) bytes = System.Text.Encoding.UTF8.GetBytes(System.Text.RegularExpressions.Regex.Replace(System.Text.Encoding.UTF8.GetString(bytes), ",\\s*\"check\": \"[0-9a-f]*\"", ""));
        File.WriteAllBytes(ManifestPath(w), bytes);
        Assert.Null(Manifest.Parse(File.ReadAllText(ManifestPath(w))));
        w.Edit("auroria-national.yaml", "value: 22%", "value: 23%");
        Assert.Equal(0, Snapshot.Run("build", yaml, "--no-chart-images", "-q", "--date", "2026-12-15").Code);
        Assert.Equal("keep me", File.ReadAllText(victim));
    }

    [Fact]
    public void A_deleted_csv_and_a_change_keep_the_rest_of_the_edition_as_found_before_the_new_one()
    {
        var (w, yaml, edition1) = Built();
        string csv = "auroria-national-2026-11-30.options.csv";
        File.Delete(Path.Combine(w.Out, csv));
        w.Edit("auroria-national.yaml", "value: 22%", "value: 23%");
        Assert.Equal(0, Snapshot.Run("build", yaml, "--no-chart-images", "-q").Code);
        string kept = Path.Combine(w.Out, "archive", Snapshot.Id, "edition-1-recovered");
        Assert.Equal(edition1.Where(kv => kv.Key != csv), Snapshot.Of(kept).Where(kv => kv.Key != "RECOVERED.txt"));
        Assert.Contains($"missing: {csv}", File.ReadAllText(Path.Combine(kept, "RECOVERED.txt")));
        Assert.Equal(2, Snapshot.AssertWhole(w.Out).Edition);
    }

    [Fact]
    public void A_deleted_csv_without_a_change_is_restored_in_the_same_edition_with_the_same_bytes()
    {
        var (w, yaml, edition1) = Built();
        File.Delete(Path.Combine(w.Out, "auroria-national-2026-11-30.options.csv"));
        Assert.Equal(0, Snapshot.Run("build", yaml, "--no-chart-images", "-q").Code);
        Assert.Equal(edition1, Snapshot.Of(w.Out));
        Assert.False(Directory.Exists(Path.Combine(w.Out, "archive")));
    }

    [Fact]
    public void Current_files_deleted_with_their_manifest_never_reuse_an_archived_edition_number()
    {
        var (w, yaml, _) = Built();
        Assert.Equal(0, Snapshot.Run("build", yaml, "--no-chart-images", "-q", "--date", "2026-12-15").Code);
        foreach (var f in Directory.GetFiles(w.Out).Where(f => !f.EndsWith("build-log.jsonl"))) File.Delete(f);
        Assert.Equal(0, Snapshot.Run("build", yaml, "--no-chart-images", "-q", "--date", "2026-12-20").Code);
        Assert.Equal(2, Snapshot.AssertWhole(w.Out).Edition);
        Assert.Equal(["edition-1"], Directory.GetDirectories(Path.Combine(w.Out, "archive", Snapshot.Id)).Select(Path.GetFileName));
    }
}

/// <summary>Faults of the machine: a full disk, an immutable file.</summary>
public class DiskFaultTests
{
    private static bool Root => Environment.UserName == "root";

    /// <summary>Runs <paramref name="test"/> with an output folder on a tmpfs of the given size, unmounted afterwards.</summary>
    private static void OnSmallDisk(string size, Action<Workspace, string, string> test)
    {
        Skip.IfNot(Root && OperatingSystem.IsLinux(), "needs root on Linux to mount a small tmpfs");
        var w = new Workspace("auroria-national");
        string mount = Path.Combine(w.Dir, "small");
        Directory.CreateDirectory(mount);
        using (var mounting = Process.Start("mount", ["-t", "tmpfs", "-o", $"size={size}", "tmpfs", mount]))
        {
            mounting.WaitForExit();
            Skip.If(mounting.ExitCode != 0, "this machine refuses to mount a tmpfs");
        }
        try
        {
            string yaml = Path.Combine(w.Dir, "auroria-national.yaml");
            Assert.Equal(0, Snapshot.Run("build", yaml, "--no-chart-images", "-q", "-o", mount).Code);
            w.Edit("auroria-national.yaml", "value: 22%", "value: 23%");
            test(w, yaml, mount);
        }
        finally
        {
            using var unmounting = Process.Start("umount", [mount]);
            unmounting.WaitForExit();
        }
    }

    [SkippableFact]
    public void A_disk_without_room_for_the_new_edition_and_the_archive_copy_fails_before_anything_is_written() =>
        OnSmallDisk("1600k", (_, yaml, mount) =>
        {
            var edition1 = Snapshot.Of(mount);
            var (code, _, err) = Snapshot.Run("build", yaml, "--no-chart-images", "-q", "-o", mount);
            Assert.Equal(1, code);
            Assert.Contains("not enough free space", err);
            Assert.Contains("nothing was replaced: the previous files are untouched", err);
            Assert.Equal(edition1, Snapshot.Of(mount));
            Assert.False(Directory.Exists(Path.Combine(mount, "archive")));
            Assert.False(Directory.Exists(Path.Combine(mount, EditionFolder.TempFolderName)));
        });

    [SkippableFact]
    public void A_disk_that_fills_while_the_new_edition_is_staged_leaves_the_previous_one_and_says_so() =>
        OnSmallDisk("4m", (_, yaml, mount) =>
        {
            var edition1 = Snapshot.Of(mount);
            string filler = Path.Combine(mount, "filler");
            // The free-space check passed; another writer takes the rest of the disk after the first staged file.
            FaultSeam.Hook = s =>
            {
                if (s != $"{Snapshot.Id}/stage.first") return;
                using var f = new FileStream(filler, FileMode.Create);
                var block = new byte[16 * 1024];
                try { while (true) { f.Write(block); f.Flush(); } } catch (IOException) { }
            };
            (int Code, string Out, string Err) r;
            try { r = Snapshot.Run("build", yaml, "--no-chart-images", "-q", "-o", mount); }
            finally { FaultSeam.Hook = null; }
            Assert.Equal(1, r.Code);
            Assert.Contains("nothing was replaced: the previous files are untouched", r.Err);
            File.Delete(filler);
            Assert.Equal(edition1, Snapshot.Of(mount));
            Assert.False(Directory.Exists(Path.Combine(mount, EditionFolder.TempFolderName)));
            Assert.Equal(0, Snapshot.Run("build", yaml, "--no-chart-images", "-q", "-o", mount).Code);
            Assert.Equal(edition1.Where(kv => kv.Key != "filler"), Snapshot.Of(Path.Combine(mount, "archive", Snapshot.Id, "edition-1")));
        });

    [SkippableFact]
    public void An_immutable_file_stops_the_switch_which_is_undone_and_a_later_build_reuses_the_archive()
    {
        var w = new Workspace("auroria-national");
        string yaml = Path.Combine(w.Dir, "auroria-national.yaml");
        Assert.Equal(0, Snapshot.Run("build", yaml, "--no-chart-images", "-q").Code);
        var edition1 = Snapshot.Of(w.Out);
        string pdf = Path.Combine(w.Out, "auroria-national-2026-11-30.pdf");
        Process chattr;
        try { chattr = Process.Start("chattr", ["+i", pdf]); }
        catch (System.ComponentModel.Win32Exception) { chattr = null!; }
        Skip.If(chattr is null, "chattr is not installed");
        chattr.WaitForExit();
        Skip.If(chattr.ExitCode != 0, "this file system or user cannot make a file immutable");
        try
        {
            w.Edit("auroria-national.yaml", "value: 22%", "value: 23%");
            var (code, _, err) = Snapshot.Run("build", yaml, "--no-chart-images", "-q");
            Assert.Equal(1, code);
            Assert.True(err.Contains("the switch was undone: the previous files are back in place (and kept in archive/auroria-national/edition-1)"), err);
            Assert.Equal(edition1, Snapshot.Of(w.Out));
            Assert.Equal(edition1, Snapshot.Of(Path.Combine(w.Out, "archive", Snapshot.Id, "edition-1")));
        }
        finally
        {
            Process.Start("chattr", ["-i", pdf])!.WaitForExit();
        }
        Assert.Equal(0, Snapshot.Run("build", yaml, "--no-chart-images", "-q").Code);
        Assert.Equal(["edition-1"], Directory.GetDirectories(Path.Combine(w.Out, "archive", Snapshot.Id)).Select(Path.GetFileName));
        Assert.Equal(2, Snapshot.AssertWhole(w.Out).Edition);
    }
}

/// <summary>SIGTERM (sent by the fault seam at a fixed step, so the test does not depend on timing).</summary>
public class SignalTests
{
    [Fact]
    public void Sigterm_lets_the_brief_in_progress_finish_and_starts_no_other()
    {
        var w = new Workspace("auroria-silverdale", "auroria-eastmark");
        using var p = Snapshot.Start(new Dictionary<string, string> { ["BRIEFWRIGHT_FAULT"] = "*/staged=term" }, "build", w.Dir, "--no-chart-images", "-q", "--jobs", "1");
        string err = p.StandardError.ReadToEnd();
        p.WaitForExit();
        Assert.Equal(1, p.ExitCode);
        Assert.Contains("SIGTERM received; finishing the briefs in progress", err);
        var log = Snapshot.Log(w.Out);
        var built = Assert.Single(log, l => l.GetProperty("status").GetString() == "built");
        Assert.Equal(2, log.Count(l => l.GetProperty("status").GetString() == "stopped"));
        Snapshot.AssertWhole(w.Out, built.GetProperty("id").GetString()!);
        Assert.False(Directory.Exists(Path.Combine(w.Out, EditionFolder.TempFolderName)));
    }
}

/// <summary>The manifest's own check and path rules.</summary>
public class ManifestTests
{
    private static Manifest Sample() => new("b", "b-2026-11-30", 2, "f", new Dictionary<string, string> { ["tool"] = "1" }, ["b-2026-11-30.pdf"])
    {
        Sizes = new Dictionary<string, long> { ["b-2026-11-30.pdf"] = 10 },
        Sha256 = new Dictionary<string, string> { ["b-2026-11-30.pdf"] = new string('a', 64) },
    };

    [Fact]
    public void A_written_manifest_reads_back_with_its_check()
    {
        string text = System.Text.Encoding.UTF8.GetString(Sample().ToBytes());
        var read = Manifest.Parse(text);
        Assert.NotNull(read);
        Assert.Matches("^[0-9a-f]{64}$", read.Check);
        Assert.Equal(10, read.Sizes!["b-2026-11-30.pdf"]);
    }

    [Theory]
    [InlineData("\"edition\": 2", "\"edition\": 3")]            // edited
    [InlineData("\"size", "\"siz")]                              // a field renamed
    public void An_edited_manifest_fails_its_check(string find, string replace)
    {
        string text = System.Text.Encoding.UTF8.GetString(Sample().ToBytes());
        Assert.Contains(find, text);
        Assert.Null(Manifest.Parse(text.Replace(find, replace)));
    }

    [Theory]
    [InlineData("../victim.txt")]
    [InlineData("/etc/passwd")]
    [InlineData("sub/b.pdf")]
    [InlineData("..")]
    [InlineData(".hidden")]
    [InlineData("a\\b")]
    public void A_path_that_is_not_a_plain_file_name_in_the_folder_is_refused(string name)
    {
        var m = Sample() with { Files = [name], Sizes = new Dictionary<string, long> { [name] = 1 }, Sha256 = new Dictionary<string, string> { [name] = "0" } };
        Assert.False(Manifest.Confined(name));
        Assert.Null(Manifest.Parse(System.Text.Encoding.UTF8.GetString(m.ToBytes())));
    }

    [Fact]
    public void A_manifest_of_an_earlier_release_without_hashes_is_still_read()
    {
        Assert.NotNull(Manifest.Parse("""{"id":"a","stem":"a-2000-01-01","edition":1,"hash":"0","inputs":{"tool":"0"},"files":["a-2000-01-01.pdf"]}"""));
    }
}
