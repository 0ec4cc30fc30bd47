using System.Text;
using System.Text.Json;
using Briefwright.Cli.Batch;

namespace Briefwright.Cli.Tests;

public class BatchTests
{
    private static Dictionary<string, byte[]> Files(string dir) =>
        Directory.GetFiles(dir).Where(f => !f.EndsWith("build-log.jsonl"))
            .ToDictionary(f => Path.GetFileName(f), File.ReadAllBytes);

    [Fact]
    public void Two_builds_of_the_same_inputs_give_identical_pdf_json_and_csv_bytes()
    {
        var w = new Workspace("auroria-silverdale");
        Assert.Equal(0, w.Build("-o", Path.Combine(w.Dir, "a")).Code);
        Assert.Equal(0, w.Build("-o", Path.Combine(w.Dir, "b")).Code);
        var a = Files(Path.Combine(w.Dir, "a"));
        var b = Files(Path.Combine(w.Dir, "b"));
        Assert.Equal(a.Keys.Order(), b.Keys.Order());
        Assert.Contains(a.Keys, k => k.EndsWith(".csv"));
        foreach (var (name, bytes) in a) Assert.True(bytes.AsSpan().SequenceEqual(b[name]), $"{name} differs");
    }

    [Fact]
    public void Chart_copies_in_the_annex_are_identical_in_a_second_build_of_the_same_process()
    {
        // Skia numbers SVG clip paths from a process-wide counter; the second build must still write the same bytes.
        var w = new Workspace("auroria-silverdale");
        foreach (var dir in new[] { "a", "b" })
            Assert.Equal(0, CliApp.Run(
                new[] { "build", w.Dir, "-q", "-o", Path.Combine(w.Dir, dir) },
                new StringWriter(),
                new StringWriter()));
        var a = Files(Path.Combine(w.Dir, "a"));
        var b = Files(Path.Combine(w.Dir, "b"));
        Assert.Contains(a.Keys, k => k.EndsWith(".svg"));
        Assert.Contains(a.Keys, k => k.EndsWith(".png"));
        foreach (var (name, bytes) in a.Where(kv => kv.Key.EndsWith(".svg") || kv.Key.EndsWith(".png")))
            Assert.True(bytes.AsSpan().SequenceEqual(b[name]), $"{name} differs");
    }

    [Fact]
    public void A_changed_assumption_rebuilds_only_its_brief_archives_the_last_edition_and_lists_exactly_that_change()
    {
        var w = new Workspace("auroria-silverdale", "auroria-eastmark");
        Assert.Equal(0, w.Build().Code);
        var before = Files(w.Out);
        w.Edit("auroria-silverdale.yaml", "value: -0.4%", "value: -0.6%");

        var output = new StringWriter();
        Assert.Equal(0, CliApp.Run(new[] { "build", w.Dir, "--no-chart-images" }, output, new StringWriter()));
        Assert.Contains("3 brief(s): 1 built, 2 skipped.", output.ToString());

        string archived = Path.Combine(
            w.Out,
            "archive",
            "auroria-silverdale",
            "edition-1",
            "auroria-silverdale-2026-11-30.pdf");
        Assert.Equal(before["auroria-silverdale-2026-11-30.pdf"], File.ReadAllBytes(archived));
        Assert.Equal(
            before["auroria-eastmark-2026-11-30.pdf"],
            File.ReadAllBytes(Path.Combine(w.Out, "auroria-eastmark-2026-11-30.pdf")));
        using var json = JsonDocument.Parse(
            File.ReadAllText(Path.Combine(w.Out, "auroria-silverdale-2026-11-30-edition-2.results.json")));
        Assert.Equal(2, json.RootElement.GetProperty("edition").GetInt32());

        string md = File.ReadAllText(Path.Combine(w.Out, "auroria-silverdale-2026-11-30-edition-2.brief.md"));
        var changed = md.Split('\n').SkipWhile(l => !l.StartsWith("[[table: Assumptions changed")).Skip(4)
            .TakeWhile(l => l.StartsWith('|'))
            .ToList();
        Assert.Equal(
            "| Population growth rate | −0.40% | −0.60% | Silverdale provincial projection 2025 (invented) |",
            Assert.Single(changed));
    }

    [Fact]
    public void A_change_to_the_national_scenario_rebuilds_every_region_that_extends_it()
    {
        var w = new Workspace("auroria-silverdale", "auroria-eastmark");
        Assert.Equal(0, w.Build().Code);
        w.Edit("auroria-national.yaml", "value: 3.5%", "value: 4%");
        var output = new StringWriter();
        CliApp.Run(new[] { "build", w.Dir, "--no-chart-images" }, output, new StringWriter());
        Assert.Contains("3 brief(s): 3 built.", output.ToString());
    }

    [Fact]
    public void Nothing_changed_means_nothing_rebuilt_and_force_rebuilds()
    {
        var w = new Workspace("auroria-silverdale");
        Assert.Equal(0, w.Build().Code);
        var output = new StringWriter();
        CliApp.Run(new[] { "build", w.Dir, "--no-chart-images" }, output, new StringWriter());
        Assert.Contains("2 brief(s): 2 skipped.", output.ToString());
        output = new StringWriter();
        CliApp.Run(new[] { "build", w.Dir, "--no-chart-images", "--force" }, output, new StringWriter());
        Assert.Contains("2 brief(s): 2 built.", output.ToString());
        Assert.False(
            Directory.Exists(Path.Combine(w.Out, "archive")),
            "a forced rebuild of unchanged inputs is the same edition");
    }

    [Fact]
    public void Shards_are_disjoint_and_cover_the_list()
    {
        var files = Enumerable.Range(0, 1000).Select(i => $"regions/region-{i:0000}.yaml").ToList();
        var shards = Enumerable.Range(1, 7).Select(k => Shards.Select(files, k, 7)).ToList();
        Assert.Equal(files.Count, shards.Sum(s => s.Count));
        Assert.Equal(files.Order(), shards.SelectMany(s => s).Order());
        Assert.All(shards, s => Assert.InRange(s.Count, 100, 190)); // roughly even
        Assert.Equal(
            Shards.Select(files, 3, 7),
            Shards.Select(files.AsEnumerable().Reverse().ToList(), 3, 7).AsEnumerable().Reverse());
    }

    [Fact]
    public void Every_brief_gets_one_machine_readable_log_line()
    {
        var w = new Workspace("auroria-silverdale");
        w.Build();
        var lines = File.ReadAllLines(Path.Combine(w.Out, "build-log.jsonl"));
        Assert.Equal(2, lines.Length);
        Assert.All(
            lines,
            l => Assert.Equal("built", JsonDocument.Parse(l).RootElement.GetProperty("status").GetString()));
    }

    [Fact]
    public void The_bundled_fonts_input_is_the_sha256_of_the_four_font_files_in_order()
    {
        // Every manifest records this value; it must not change when the way it is computed does (else every brief
        // would rebuild as a new edition). Reference: the one-shot SHA-256 of System.Security.Cryptography over the
        // four files joined, as earlier releases computed it.
        var styles = new[] {
            Composer.Document.RunStyle.Regular,
            Composer.Document.RunStyle.Bold,
            Composer.Document.RunStyle.Italic,
            Composer.Document.RunStyle.BoldItalic };
        var joined = styles.SelectMany(Composer.Drawing.BundledFonts.Bytes).ToArray();
        Assert.True(joined.Length > 100_000);
        Assert.Equal(
            Convert.ToHexStringLower(System.Security.Cryptography.SHA256.HashData(joined)),
            BatchBuilder.FontsHash.Value);
    }

    [Fact]
    public void A_head_start_with_a_template_that_does_not_exist_changes_nothing()
    {
        // The head start parses the standard template whatever the options; a named template that cannot be read is
        // reported by the build itself, as before.
        var w = new Workspace("auroria-silverdale");
        Speed.HeadStart();
        var (code, _, err) = w.Build("--template", "no-such-template.md");
        Assert.Equal(ExitCodes.InvalidInput, code);
        Assert.Contains("no-such-template.md:1:1: cannot read the template (no such file).", err);
        // only the attempt is logged
        Assert.Equal(new[] { BuildLog.FileName }, Directory.GetFiles(w.Out).Select(Path.GetFileName));
    }
}

public class FaultTests
{
    [Fact]
    public void An_unwritable_output_folder_gives_a_clear_error_exit_1_and_loses_nothing()
    {
        var w = new Workspace("auroria-silverdale");
        var error = new StringWriter();
        // /proc refuses new folders even to root, so this fails like a read-only or full volume would.
        int code = CliApp.Run(new[] {
            "build",
            Path.Combine(w.Dir, "auroria-silverdale.yaml"),
            "-o",
            "/proc/briefwright-out",
            "--no-chart-images",
            "-q" }, new StringWriter(), error);
        Assert.Equal(1, code);
        Assert.Contains("cannot write the brief to /proc/briefwright-out", error.ToString());
        Assert.Contains("nothing was replaced: the previous files are untouched", error.ToString());
        Assert.DoesNotContain("   at ", error.ToString());
    }

    [Fact]
    public void An_output_path_that_is_a_file_is_reported_not_overwritten()
    {
        var w = new Workspace("auroria-silverdale");
        string notAFolder = Path.Combine(w.Dir, "precious.txt");
        File.WriteAllText(notAFolder, "keep me");
        var error = new StringWriter();
        int code = CliApp.Run(new[] {
            "build",
            Path.Combine(w.Dir, "auroria-silverdale.yaml"),
            "-o",
            notAFolder,
            "--no-chart-images",
            "-q" }, new StringWriter(), error);
        Assert.Equal(1, code);
        Assert.Equal("keep me", File.ReadAllText(notAFolder));
    }
}

public class ThemeTests
{
    [Fact]
    public void Theme_fonts_from_files_are_used_for_the_text_and_the_charts()
    {
        var w = new Workspace("auroria-silverdale");
        File.Copy(
            Path.Combine(CliAppTests.RepoRoot(), "fonts", "LiberationSans-Italic.ttf"),
            Path.Combine(w.Dir, "house.ttf"));
        File.WriteAllText(
            Path.Combine(w.Dir, "house.theme.yaml"),
            "name: House style (invented)\npaper: letter\nfonts:\n  regular: house.ttf\n");
        var (code, _, err) = w.Build("--theme", Path.Combine(w.Dir, "house.theme.yaml"));
        Assert.True(code == 0, err);
        string pdf = System.Text.Encoding.Latin1
            .GetString(File.ReadAllBytes(Path.Combine(w.Out, "auroria-silverdale-2026-11-30.pdf")));
        Assert.Contains("Sans,Italic", pdf);                  // body text (PDF names escape the space)
        Assert.Contains("LiberationSans-Italic", pdf);        // charts
        Assert.DoesNotContain("Sans,Bold", pdf);              // bold falls back to the theme's regular face
        Assert.Contains("/MediaBox[0 0 612 792]", pdf);       // US Letter
    }

    [Fact]
    public void A_font_with_CFF_outlines_is_refused_with_the_reason()
    {
        var w = new Workspace("auroria-silverdale");
        File.WriteAllBytes(Path.Combine(w.Dir, "house.ttf"), "OTTO"u8.ToArray().Concat(new byte[64]).ToArray());
        File.WriteAllText(
            Path.Combine(w.Dir, "house.theme.yaml"),
            "name: House style (invented)\nfonts:\n  regular: house.ttf\n");
        var (code, _, err) = w.Build("--theme", Path.Combine(w.Dir, "house.theme.yaml"));
        Assert.Equal(2, code);
        Assert.Contains("house.theme.yaml:3:12: fonts.regular: must be a TrueType font (glyf outlines); the file is " +
            "an OpenType font with CFF outlines", err);
        // only the attempt is logged
        Assert.Equal(new[] { BuildLog.FileName }, Directory.GetFiles(w.Out).Select(Path.GetFileName));
    }
}
