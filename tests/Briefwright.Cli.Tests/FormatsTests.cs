using System.Text.Json;
using Briefwright.Cli.Project;

namespace Briefwright.Cli.Tests;

/// <summary>Which formats a build writes: chosen on the command line or in the project settings, covered by the
/// manifest, listed in the summary, and never a new edition of the brief.</summary>
public class FormatsTests
{
    private const string Stem = "auroria-silverdale-2026-11-30";

    private static (int Edition, List<string> Files) Manifest(string outDir)
    {
        using var m = JsonDocument.Parse(File.ReadAllText(Path.Combine(outDir, "auroria-silverdale.manifest.json")));
        return (m.RootElement.GetProperty("edition").GetInt32(), m.RootElement.GetProperty("files").EnumerateArray()
            .Select(f => f.GetString()!)
            .ToList());
    }

    private static (int Code, string Out, string Err) Build(Workspace w, params string[] extra)
    {
        var output = new StringWriter();
        var error = new StringWriter();
        int code = CliApp.Run(new[] { "build", Path.Combine(w.Dir, "auroria-silverdale.yaml"), "--no-chart-images" }
            .Concat(extra)
            .ToArray(), output, error);
        return (code, output.ToString(), error.ToString());
    }

    [Fact]
    public void Switching_formats_on_and_off_rebuilds_the_same_edition()
    {
        var w = new Workspace("auroria-silverdale");
        // Given a brief built as a PDF only (the default)
        var first = Build(w);
        Assert.True(first.Code == 0, first.Err);
        Assert.Equal((1, false), (Manifest(w.Out).Edition, File.Exists(Path.Combine(w.Out, Stem + ".html"))));
        byte[] pdf = File.ReadAllBytes(Path.Combine(w.Out, Stem + ".pdf"));

        // When every format is switched on, then the same edition is rebuilt with them, in the manifest, nothing
        // archived
        var all = Build(w, "--formats", "pdf,html,xlsx,docx");
        Assert.True(all.Code == 0, all.Err);
        Assert.Matches(@"auroria-silverdale\s+built\s+1\s.*pdf html xlsx docx", all.Out);
        var (edition, files) = Manifest(w.Out);
        Assert.Equal(1, edition);
        foreach (var suffix in new[] { "html", "xlsx", "docx" })
        {
            Assert.Contains($"{Stem}.{suffix}", files);
            Assert.True(new FileInfo(Path.Combine(w.Out, $"{Stem}.{suffix}")).Length > 1000, suffix);
        }
        Assert.False(Directory.Exists(Path.Combine(w.Out, "archive")));
        Assert.Equal(pdf, File.ReadAllBytes(Path.Combine(w.Out, Stem + ".pdf")));

        // When nothing changes, then the brief is skipped
        var again = Build(w, "--formats", "html,docx,xlsx");
        Assert.Matches(@"auroria-silverdale\s+skipped\s+1\s.*pdf html xlsx docx", again.Out);

        // When the formats are switched off again, then the same edition holds the PDF only
        var off = Build(w, "--formats", "pdf");
        Assert.True(off.Code == 0, off.Err);
        (edition, files) = Manifest(w.Out);
        Assert.Equal(1, edition);
        Assert.DoesNotContain(files, f => f.EndsWith(".html") || f.EndsWith(".xlsx") || f.EndsWith(".docx"));
        Assert.False(File.Exists(Path.Combine(w.Out, Stem + ".html")));
        // A file dropped by an output switch is kept first, as the edition rule says (EditionPlanner.KeepReplaced).
        Assert.Contains(
            Directory.GetFiles(Path.Combine(w.Out, "archive"), Stem + ".html", SearchOption.AllDirectories),
            f => f.Contains("edition-1", StringComparison.Ordinal));
        Assert.Equal(pdf, File.ReadAllBytes(Path.Combine(w.Out, Stem + ".pdf")));
    }

    [Fact]
    public void The_project_settings_choose_the_formats_and_the_command_line_wins()
    {
        var w = new Workspace("auroria-silverdale");
        File.WriteAllText(Path.Combine(w.Dir, ProjectSettings.FileName), "formats: [html, xlsx]\n");
        var built = Build(w);
        Assert.True(built.Code == 0, built.Err);
        var files = Manifest(w.Out).Files;
        Assert.Contains($"{Stem}.html", files);
        Assert.Contains($"{Stem}.xlsx", files);
        Assert.DoesNotContain($"{Stem}.docx", files);
        Assert.Contains($"{Stem}.pdf", files);

        var cli = Build(w, "--formats", "docx");
        Assert.True(cli.Code == 0, cli.Err);
        files = Manifest(w.Out).Files;
        Assert.Contains($"{Stem}.docx", files);
        Assert.DoesNotContain($"{Stem}.html", files);
    }

    [Fact]
    public void An_unknown_format_is_refused_on_the_command_line_and_in_the_settings()
    {
        var w = new Workspace("auroria-silverdale");
        var bad = Build(w, "--formats", "pdf,odt");
        Assert.Equal(2, bad.Code);
        Assert.Contains("--formats: must be a comma-separated list of pdf, html, xlsx, docx. Got 'odt'.", bad.Err);
        Assert.False(File.Exists(Path.Combine(w.Out, Stem + ".pdf")));

        string settings = Path.Combine(w.Dir, ProjectSettings.FileName);
        File.WriteAllText(settings, "formats: [html, odt]\n");
        var badSettings = Build(w);
        Assert.Equal(2, badSettings.Code);
        Assert.Contains(
            $"{settings}:1:17: formats: must be a list of format names (pdf, html, xlsx, docx). Got 'odt'.",
            badSettings.Err);
        File.WriteAllText(settings, "formats: html\n");
        Assert.Equal(2, Build(w).Code);
    }
}
