using System.Diagnostics;
using Briefwright.Cli.Batch;

namespace Briefwright.Cli.Tests;

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
        Assert.Equal(
            edition1.Where(kv => !kv.Key.EndsWith("manifest.json")),
            archived.Where(kv => edition1.ContainsKey(kv.Key) && !kv.Key.EndsWith("manifest.json")));
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
        var forged = real with
        {
            Files = real.Files.Append("../victim.txt").ToList(), Sizes = null, Sha256 = null, Check = null,
        };
        byte[] bytes = withCheck
            ? (forged with
            {
                Sizes = forged.Files.ToDictionary(f => f, _ => 7L),
                Sha256 = forged.Files.ToDictionary(f => f, _ => "0"),
            }).ToBytes()
            : forged.ToBytes();
        if (!withCheck)
            bytes = System.Text.Encoding.UTF8.GetBytes(System.Text.RegularExpressions.Regex.Replace(
                System.Text.Encoding.UTF8.GetString(bytes), ",\\s*\"check\": \"[0-9a-f]*\"", ""));
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
        Assert.Equal(
            ["edition-1"],
            Directory.GetDirectories(Path.Combine(w.Out, "archive", Snapshot.Id)).Select(Path.GetFileName));
    }
}

/// <summary>Faults of the machine: a full disk, an immutable file.</summary>
public class DiskFaultTests
{
    private static bool Root => Environment.UserName == "root";

    /// <summary>
    /// Runs <paramref name="test"/> with an output folder on a tmpfs of the given size, unmounted afterwards.
    /// </summary>
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
            Assert.Equal(
                edition1.Where(kv => kv.Key != "filler"),
                Snapshot.Of(Path.Combine(mount, "archive", Snapshot.Id, "edition-1")));
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
            Assert.True(err.Contains("the switch was undone: the previous files are back in place " +
                "(and kept in archive/auroria-national/edition-1)"), err);
            Assert.Equal(edition1, Snapshot.Of(w.Out));
            Assert.Equal(edition1, Snapshot.Of(Path.Combine(w.Out, "archive", Snapshot.Id, "edition-1")));
        }
        finally
        {
            Process.Start("chattr", ["-i", pdf])!.WaitForExit();
        }
        Assert.Equal(0, Snapshot.Run("build", yaml, "--no-chart-images", "-q").Code);
        Assert.Equal(
            ["edition-1"],
            Directory.GetDirectories(Path.Combine(w.Out, "archive", Snapshot.Id)).Select(Path.GetFileName));
        Assert.Equal(2, Snapshot.AssertWhole(w.Out).Edition);
    }
}
