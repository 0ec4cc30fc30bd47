using System.Text.RegularExpressions;

namespace Briefwright.Cli.Tests;

/// <summary>
/// The bad-input corpus (tests/corpus, made by generate.py): every file must give a positioned error, exit code 2,
/// no stack trace and no output. expected.tsv holds the exact first message for each file, paths relative to the
/// corpus folder. BRIEFWRIGHT_UPDATE_CORPUS=1 rewrites it (review the diff before committing).
/// </summary>
public class CorpusTests
{
    private static readonly string Dir = Path.Combine(CliAppTests.RepoRoot(), "tests", "corpus");
    private static readonly string Good = Path.Combine(Dir, "good-parent.yaml");

    public static TheoryData<string> Cases()
    {
        var data = new TheoryData<string>();
        foreach (var f in Directory.GetFiles(Dir).Select(f => Path.GetFileName(f)!).Order(StringComparer.Ordinal))
            if ((f.EndsWith(".yaml") || f.EndsWith(".md")) && f != "good-parent.yaml"
                && !f.StartsWith("extends-cycle-b"))
                data.Add(f);
        return data;
    }

    private static (int Code, string Error, string OutDir) Run(string file)
    {
        string outDir = Directory.CreateTempSubdirectory("bw-corpus-").FullName;
        string path = Path.Combine(Dir, file);
        string[] args = file.EndsWith(".md") ? new[] { "build", Good, "-t", path, "-o", outDir, "-q" }
            : file.EndsWith(".theme.yaml") ? new[] { "build", Good, "--theme", path, "-o", outDir, "-q" }
            : new[] { "build", path, "-o", outDir, "-q", "--no-chart-images" };
        var error = new StringWriter();
        int code = CliApp.Run(args, new StringWriter(), error);
        return (code, error.ToString().Replace(Dir + Path.DirectorySeparatorChar, ""), outDir);
    }

    private static Dictionary<string, string> Expected() =>
        File.ReadAllLines(Path.Combine(Dir, "expected.tsv")).Where(l => l.Length > 0 && !l.StartsWith('#'))
            .Select(l => l.Split('\t', 2)).ToDictionary(p => p[0], p => p[1]);

    [Fact]
    public void Corpus_holds_at_least_one_hundred_bad_files_each_with_an_expected_message()
    {
        var cases = ((IEnumerable<object[]>)Cases()).Select(c => (string)c[0]).ToList();
        Assert.True(cases.Count >= 100, $"{cases.Count} files");
        if (Environment.GetEnvironmentVariable("BRIEFWRIGHT_UPDATE_CORPUS") == "1")
            File.WriteAllLines(Path.Combine(Dir, "expected.tsv"), cases.Select(
                c => $"{c}\t{Run(c).Error.Split('\n')[0]}").Prepend("# file\tfirst message (paths relative to this " +
                    "folder)"));
        Assert.Equal(cases.Order(), Expected().Keys.Order());
    }

    [Theory]
    [MemberData(nameof(Cases))]
    public void Each_bad_file_gives_its_positioned_error_exit_2_no_stack_trace_and_no_output(string file)
    {
        var (code, error, outDir) = Run(file);
        Assert.Equal(2, code);
        string first = error.Split('\n')[0];
        Assert.Equal(Expected()[file], first);
        Assert.Matches(@"^[^\s:]+:\d+:\d+: ", first);
        Assert.DoesNotContain("   at ", error);
        Assert.DoesNotContain("Exception", error);
        Assert.DoesNotContain(Directory.GetFiles(outDir), f => !f.EndsWith("build-log.jsonl"));
    }

    [Fact]
    public void A_batch_of_every_bad_scenario_still_builds_the_good_one()
    {
        string outDir = Directory.CreateTempSubdirectory("bw-corpus-batch-").FullName;
        var args = new List<string> { "build", "-o", outDir, "-q", "--no-chart-images" };
        args.AddRange(Directory.GetFiles(Dir, "*.yaml").Where(f => !f.EndsWith(".theme.yaml")));
        int code = CliApp.Run(args.ToArray(), new StringWriter(), new StringWriter());
        Assert.Equal(2, code);
        var pdfs = Directory.GetFiles(outDir, "*.pdf").Select(f => Path.GetFileName(f)).ToList();
        Assert.Contains("corpus-base-2026-11-30.pdf", pdfs);
    }
}
