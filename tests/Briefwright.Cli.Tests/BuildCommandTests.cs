using System.Diagnostics;

namespace Briefwright.Cli.Tests;

public class BuildCommandTests
{
    private static string TempDir() => Directory.CreateTempSubdirectory("bw-build-").FullName;

    /// <summary>Runs the real program in its own process, as a scheduled job would.</summary>
    private static (int Code, string Out, string Err) RunProcess(params string[] args)
    {
        string dll = Path.Combine(AppContext.BaseDirectory, "briefwright.dll");
        var psi = new ProcessStartInfo("dotnet") { RedirectStandardOutput = true, RedirectStandardError = true };
        psi.ArgumentList.Add(dll);
        foreach (var a in args) psi.ArgumentList.Add(a);
        using var p = Process.Start(psi)!;
        string output = p.StandardOutput.ReadToEnd(), error = p.StandardError.ReadToEnd();
        p.WaitForExit();
        return (p.ExitCode, output, error);
    }

    [Fact]
    public void Builds_one_pdf_and_one_results_file_per_demo_scenario_named_from_id_and_date()
    {
        string dir = TempDir();
        var output = new StringWriter();
        var error = new StringWriter();
        int code = CliApp.Run(new[] { "build", CliAppTests.Demo(), "--out", dir }, output, error);
        Assert.True(code == 0, error.ToString());
        var files = Directory.GetFiles(dir).Select(f => Path.GetFileName(f)).ToHashSet();
        foreach (var id in new[] { "auroria-eastmark", "auroria-national", "auroria-northport", "auroria-silverdale" })
        {
            string stem = id + "-2026-11-30";
            foreach (var suffix in new[] {
                ".pdf",
                ".results.json",
                ".assumptions.csv",
                ".options.csv",
                ".reform-path.csv",
                ".present-values.csv",
                ".sensitivity.csv",
                ".montecarlo.csv",
                ".brief.md",
                ".fig-output-curve.svg",
                ".fig-output-curve.png",
                ".fig-reform-path.svg",
                ".fig-distribution.png" })
                Assert.Contains(stem + suffix, files);
            Assert.Contains(id + ".manifest.json", files);
        }
        Assert.All(Directory.GetFiles(dir, "*.pdf"), f => Assert.StartsWith("%PDF-", File.ReadAllText(f)[..5]));
    }

    [Fact]
    public void The_same_inputs_give_byte_identical_pdfs_in_two_separate_runs()
    {
        string a = TempDir(), b = TempDir();
        string scenario = CliAppTests.Demo("auroria-northport.yaml");
        var first = RunProcess("build", scenario, "--out", a, "--quiet");
        var second = RunProcess("build", scenario, "--out", b, "--quiet");
        Assert.True(first.Code == 0, first.Err);
        Assert.True(second.Code == 0, second.Err);
        Assert.Equal("", first.Out);
        string name = "auroria-northport-2026-11-30";
        Assert.Equal(
            File.ReadAllBytes(Path.Combine(a, name + ".pdf")),
            File.ReadAllBytes(Path.Combine(b, name + ".pdf")));
        Assert.Equal(
            File.ReadAllBytes(Path.Combine(a, name + ".results.json")),
            File.ReadAllBytes(Path.Combine(b, name + ".results.json")));
    }

    [Fact]
    public void The_date_option_replaces_the_scenario_date_in_the_file_name()
    {
        string dir = TempDir();
        int code = CliApp.Run(
            new[] { "build", CliAppTests.Demo("auroria-national.yaml"), "-o", dir, "--date", "2027-01-15" },
            new StringWriter(),
            new StringWriter());
        Assert.Equal(0, code);
        Assert.True(File.Exists(Path.Combine(dir, "auroria-national-2027-01-15.pdf")));
    }

    [Fact]
    public void A_template_error_is_positioned_exits_2_and_writes_nothing()
    {
        string dir = TempDir();
        string template = Path.Combine(dir, "bad.md");
        File.WriteAllText(template, "# {{ brief.title }}\n\n{{ brief.no_such_field }}\n");
        var error = new StringWriter();
        string outDir = Path.Combine(dir, "out");
        int code = CliApp.Run(
            new[] { "build", CliAppTests.Demo("auroria-national.yaml"), "-t", template, "-o", outDir },
            new StringWriter(),
            error);
        Assert.Equal(2, code);
        Assert.Contains($"{template}:3:", error.ToString());
        Assert.False(
            Directory.Exists(outDir) && Directory.EnumerateFiles(outDir).Any(f => !f.EndsWith("build-log.jsonl")));
    }

    [Fact]
    public void Invalid_scenarios_do_not_stop_the_others_in_the_same_batch()
    {
        string dir = TempDir();
        string bad = Path.Combine(dir, "bad.yaml");
        File.WriteAllText(bad, "brief: [\n");
        string outDir = Path.Combine(dir, "out");
        int code = CliApp.Run(
            new[] { "build", bad, CliAppTests.Demo("auroria-national.yaml"), "-o", outDir, "-q" },
            new StringWriter(),
            new StringWriter());
        Assert.Equal(2, code);
        Assert.True(File.Exists(Path.Combine(outDir, "auroria-national-2026-11-30.pdf")));
        Assert.DoesNotContain(Directory.GetFiles(outDir), f => Path.GetFileName(f).StartsWith("bad"));
        Assert.Contains("\"status\":\"invalid\"", File.ReadAllText(Path.Combine(outDir, "build-log.jsonl")));
    }
}
