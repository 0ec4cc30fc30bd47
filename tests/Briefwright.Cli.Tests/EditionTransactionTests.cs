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
            ? Directory.GetFiles(dir).Where(f => !f.EndsWith("build-log.jsonl"))
                .ToDictionary(f => Path.GetFileName(f)!, EditionFolder.Sha256)
            : [];

    /// <summary>
    /// Every file of an edition, by the hashes taken before anything happened: in place, or in its archive folder.
    /// </summary>
    public static void AssertKept(Dictionary<string, string> edition, string dir, string archive)
    {
        var here = Of(dir);
        var kept = Of(archive);
        foreach (var (name, hash) in edition)
            Assert.True(here.GetValueOrDefault(name) == hash || kept.GetValueOrDefault(name) == hash,
                $"{name} of the previous edition was lost");
    }

    /// <summary>
    /// The edition in the folder is complete: its manifest checks, and every file matches the manifest's SHA-256.
    /// </summary>
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
        foreach (var l in Directory.GetFiles(temp, "*.lock"))
            File.SetLastWriteTimeUtc(l, DateTime.UtcNow - BriefLock.StaleAfter - TimeSpan.FromMinutes(1));
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
        File.ReadAllLines(Path.Combine(outDir, "build-log.jsonl"))
            .Select(l => JsonDocument.Parse(l).RootElement.Clone())
            .ToList();
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
        KillAfterEveryStepTests.KillEachStep(w => w.Edit("auroria-national.yaml", "value: 22%", "value: 23%"), [],
            edition: 2);
}

/// <summary>
/// The same for a rebuild with a new date (edition 1 re-dated: new file names; the previous dated files are removed).
/// </summary>
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
        try
        {
            Assert.Equal(0, Snapshot.Run(
                args.Select(a => a == yaml ? Path.Combine(reference, "auroria-national.yaml") : a).ToArray()).Code);
        }
        finally { FaultSeam.Hook = null; }
        var expected = Snapshot.Of(Path.Combine(reference, "out"));
        Assert.Contains($"{Snapshot.Id}/journal", steps);
        Assert.Contains(steps, s => s.Contains("switch.in."));
        Assert.Contains(steps, s => s.Contains("switch.aside."));

        foreach (var step in steps)
        {
            string trial = w.Dir + "-" + step.Replace('/', '-');
            Snapshot.CopyTree(w.Dir, trial);
            string outDir = Path.Combine(trial, "out");
            string archive = Path.Combine(outDir, "archive", Snapshot.Id, "edition-1");
            using (var p = Snapshot.Start(new Dictionary<string, string> { ["BRIEFWRIGHT_FAULT"] = step + "=kill" },
                       args.Select(a => a == yaml ? Path.Combine(trial, "auroria-national.yaml") : a).ToArray()))
            {
                p.WaitForExit();
                Assert.True(p.ExitCode == 137,
                    $"{step}: the build was not killed there (exit {p.ExitCode}): {p.StandardError.ReadToEnd()}");
            }
            Snapshot.AssertKept(edition1, outDir, archive);

            bool locked = File.Exists(Path.Combine(outDir, EditionFolder.TempFolderName, Snapshot.Id + ".lock"));
            Snapshot.AgeLocks(outDir);
            var (code, output, err) = Snapshot.Run(args
                .Select(a => a == yaml ? Path.Combine(trial, "auroria-national.yaml") : a)
                .Where(a => a != "-q").ToArray());
            Assert.True(code == 0, $"{step}: {err}");
            bool switching = steps.IndexOf(step) >= steps.IndexOf($"{Snapshot.Id}/journal")
                && steps.IndexOf(step) < steps.IndexOf($"{Snapshot.Id}/committed");
            if (switching)
                Assert.True(
                    output.Contains($"finished the switch to edition {edition} that an interrupted build had begun"),
                    $"{step}: {output}");
            if (locked)
                Assert.True(output.Contains("recovered: took over the lock of a build that showed no sign of life"),
                    $"{step}: {output}");
            Assert.Equal(expected, Snapshot.Of(outDir));
            Assert.Equal(edition1, Snapshot.Of(archive));
            Assert.Equal(
                ["edition-1"],
                Directory.GetDirectories(Path.Combine(outDir, "archive", Snapshot.Id)).Select(Path.GetFileName));
            Assert.False(
                Directory.Exists(Path.Combine(outDir, EditionFolder.TempFolderName)),
                $"{step}: temporary files left");
        }
    }
}

/// <summary>
/// A step that fails (as a write would) is reported truthfully, and leaves the previous edition in place.
/// </summary>
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
            Assert.Contains(switching
                ? "the switch was undone: the previous files are back in place"
                : "nothing was replaced: the previous files are untouched", r.Err);
            var now = Snapshot.Of(outDir);
            Assert.Equal(edition1, now); // the previous edition is current, byte for byte
            Assert.False(
                Directory.Exists(Path.Combine(outDir, EditionFolder.TempFolderName)),
                $"{step}: temporary files left");
            Assert.Equal(
                0,
                Snapshot.Run("build", Path.Combine(trial, "auroria-national.yaml"), "--no-chart-images", "-q").Code);
            Assert.Equal(edition1, Snapshot.Of(Path.Combine(outDir, "archive", Snapshot.Id, "edition-1")));
            Assert.Equal(2, Snapshot.AssertWhole(outDir).Edition);
        }
    }
}

/// <summary>SIGTERM (sent by the fault seam at a fixed step, so the test does not depend on timing).</summary>
public class SignalTests
{
    [Fact]
    public void Sigterm_lets_the_brief_in_progress_finish_and_starts_no_other()
    {
        var w = new Workspace("auroria-silverdale", "auroria-eastmark");
        using var p = Snapshot.Start(
            new Dictionary<string, string> { ["BRIEFWRIGHT_FAULT"] = "*/staged=term" },
            "build",
            w.Dir,
            "--no-chart-images",
            "-q",
            "--jobs",
            "1");
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
