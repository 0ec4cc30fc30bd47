using System.Diagnostics;
using System.Text.Json;
using Briefwright.Cli.Batch;

namespace Briefwright.Cli.Tests;

/// <summary>
/// Builds run at the same time into one folder, as separate processes (as on machines sharing a folder).
/// </summary>
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
            Assert.Equal(
                ["edition-1"],
                Directory.GetDirectories(Path.Combine(w.Out, "archive", id)).Select(Path.GetFileName));
            var archived = Snapshot.AssertWhole(Path.Combine(w.Out, "archive", id, "edition-1"), id);
            Assert.Equal(1, archived.Edition);
        }
        Assert.Equal(national1, Snapshot.Of(Path.Combine(w.Out, "archive", "auroria-national", "edition-1")));
        var log = Snapshot.Log(w.Out);
        Assert.Equal(
            2,
            log.Count(l => l.GetProperty("status").GetString() == "built" && l.GetProperty("edition").GetInt32() == 2));
    }

    [Fact]
    public void Three_builds_of_three_dates_re_date_edition_1_and_archive_every_dated_copy_whole()
    {
        var w = new Workspace("auroria-national");
        string yaml = Path.Combine(w.Dir, "auroria-national.yaml");
        Assert.Equal(0, Snapshot.Run("build", yaml, "--no-chart-images", "-q").Code);
        var edition1 = Snapshot.Of(w.Out);
        var results = RunAtOnce(new[] { "2026-12-01", "2026-12-02", "2026-12-03" }.Select(
            d => new[] { "build", yaml, "--no-chart-images", "-q", "--date", d }));
        Assert.All(results, r => Assert.True(r.Code == 0, r.Err));
        var current = Snapshot.AssertWhole(w.Out);
        Assert.Equal(1, current.Edition); // a new date alone is no new edition
        string root = Path.Combine(w.Out, "archive", Snapshot.Id);
        var kept = Directory.GetDirectories(root).Select(d => Snapshot.AssertWhole(d)).ToList();
        Assert.Equal(3, kept.Count);
        Assert.All(kept, m => Assert.Equal(1, m.Edition));
        // Every dated copy is somewhere: three in the archive, one current.
        Assert.Equal(
            ["auroria-national-2026-11-30", "auroria-national-2026-12-01", "auroria-national-2026-12-02",
             "auroria-national-2026-12-03"],
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
        File.WriteAllBytes(path, JsonSerializer.SerializeToUtf8Bytes(
            new LockInfo(host, pid, "0123456789abcdef", DateTime.UtcNow),
            BatchJsonContext.Default.LockInfo));
        return path;
    }

    [Fact]
    public void A_lock_held_by_a_build_on_another_machine_is_waited_for_with_a_message_and_nothing_written_meanwhile()
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
        // even this very process: age decides
        string path = WriteLock(w.Out, Environment.MachineName, Environment.ProcessId);
        File.SetLastWriteTimeUtc(path, DateTime.UtcNow - BriefLock.StaleAfter - TimeSpan.FromSeconds(30));
        var (code, _, err) = Snapshot.Run("build", Path.Combine(w.Dir, "auroria-national.yaml"), "--no-chart-images",
            "-q");
        Assert.True(code == 0, err);
        Assert.Contains("took over the lock of a build that showed no sign of life",
            Snapshot.Log(w.Out).Single().GetProperty("recovered").GetString());
        Assert.False(File.Exists(path));
    }
}
