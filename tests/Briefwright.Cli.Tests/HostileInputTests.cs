using System.Diagnostics;

namespace Briefwright.Cli.Tests;

/// <summary>
/// Input as a shared build server meets it: special files, links out of the project folder, usage mistakes and
/// floods of problems. Each must end in a clear message and exit code 2 with nothing written, never a hang, a crash
/// or a quoted file that is not a scenario.
/// </summary>
public class HostileInputTests
{
    private static readonly string Good = Path.Combine(CliAppTests.RepoRoot(), "tests", "corpus", "good-parent.yaml");

    private static (int Code, string Out, string Err) Run(params string[] args)
    {
        var output = new StringWriter();
        var error = new StringWriter();
        int code = CliApp.Run(args, output, error);
        return (code, output.ToString(), error.ToString());
    }

    private static string Project()
    {
        string dir = Directory.CreateTempSubdirectory("bw-hostile-").FullName;
        File.Copy(Good, Path.Combine(dir, "base.yaml"));
        return dir;
    }

    private static void MakeFifo(string path)
    {
        using var p = Process.Start(new ProcessStartInfo("mkfifo", path) { UseShellExecute = false })!;
        p.WaitForExit();
        Assert.Equal(0, p.ExitCode);
    }

    [Fact]
    public async Task A_named_pipe_as_scenario_extends_or_life_table_is_refused_without_blocking()
    {
        if (!OperatingSystem.IsLinux()) return;
        string dir = Project();
        MakeFifo(Path.Combine(dir, "pipe.yaml"));
        MakeFifo(Path.Combine(dir, "pipe.csv"));
        File.WriteAllText(Path.Combine(dir, "child.yaml"), "extends: pipe.yaml\n");
        File.WriteAllText(Path.Combine(dir, "table.yaml"), File.ReadAllText(Good)
            .Replace("    form: rectangular\n    max_age: 80", "    form: life_table\n    file: pipe.csv"));
        var run = Task.Run(() => (Run("check", Path.Combine(dir, "pipe.yaml")), Run(
            "check",
            Path.Combine(dir, "child.yaml")), Run("check", Path.Combine(dir, "table.yaml"))));
        // a TimeoutException means a named pipe blocked
        var (top, child, table) = await run.WaitAsync(TimeSpan.FromMinutes(2));
        Assert.Equal((2, 2, 2), (top.Code, child.Code, table.Code));
        Assert.Contains("pipe.yaml:1:1: cannot read the scenario (it is a named pipe, not a regular file).", top.Err);
        Assert.Contains("child.yaml:1:10: extends: cannot read the extended scenario (it is a named pipe, not a " +
            "regular file). Got 'pipe.yaml'.", child.Err);
        Assert.Contains("table.yaml:13:11: demography.survival.file: cannot read the life table (it is a named pipe, " +
            "not a regular file). Got 'pipe.csv'.", table.Err);
    }

    [Fact]
    public void Devices_proc_files_and_links_out_of_the_project_folder_are_refused_and_never_quoted()
    {
        if (!OperatingSystem.IsLinux()) return;
        string dir = Project();
        File.CreateSymbolicLink(Path.Combine(dir, "zero.yaml"), "/dev/zero");
        File.CreateSymbolicLink(Path.Combine(dir, "passwd.yaml"), "/etc/passwd");
        File.CreateSymbolicLink(Path.Combine(dir, "env.yaml"), "/proc/self/environ");
        foreach (var (target, reason) in new[] {
            ("zero.yaml", "it is a device, not a regular file"),
            ("passwd.yaml", "a symbolic link leads it out of the project folder"),
            ("env.yaml", "it is a system file (under /proc, /sys or /dev), not a regular file") })
        {
            File.WriteAllText(Path.Combine(dir, "child.yaml"), $"extends: {target}\n");
            var (code, _, err) = Run("check", Path.Combine(dir, "child.yaml"));
            Assert.Equal(2, code);
            Assert.Contains($"extends: cannot read the extended scenario ({reason}). Got '{target}'.", err);
            Assert.DoesNotContain("root:", err);
        }
        var (devCode, _, devErr) = Run("check", "/dev/zero");
        Assert.Equal(2, devCode);
        Assert.Contains("/dev/zero:1:1: cannot read the scenario (it is a device, not a regular file).", devErr);
    }

    [Fact]
    public async Task Seeded_path_and_special_file_mutations_never_hang_crash_or_quote_what_is_not_a_scenario()
    {
        if (!OperatingSystem.IsLinux()) return;
        string outside = Directory.CreateTempSubdirectory("bw-outside-").FullName;
        File.WriteAllText(Path.Combine(outside, "secret.yaml"), "password: hunter2\n");
        string dir = Project();
        MakeFifo(Path.Combine(dir, "pipe.yaml"));
        MakeFifo(Path.Combine(dir, "pipe.csv"));
        File.CreateSymbolicLink(Path.Combine(dir, "zero.yaml"), "/dev/zero");
        File.CreateSymbolicLink(Path.Combine(dir, "zero.csv"), "/dev/zero");
        File.CreateSymbolicLink(Path.Combine(dir, "out.yaml"), Path.Combine(outside, "secret.yaml"));
        File.CreateSymbolicLink(Path.Combine(dir, "env.csv"), "/proc/self/environ");
        File.CreateSymbolicLink(Path.Combine(dir, "sub"), outside);
        string[] targets =
        {
            "pipe.yaml", "zero.yaml", "out.yaml", "sub/secret.yaml", "../" + Path.GetFileName(outside)
                + "/secret.yaml", Path.Combine(outside, "secret.yaml"),
            "/proc/self/environ", "/dev/zero", "base.yaml", "pipe.csv", "zero.csv", "env.csv", "sub/x.csv",
            "/etc/passwd", "nothing.yaml", ".", "..", "",
        };
        string good = File.ReadAllText(Good);
        var rng = new Random(20261202);
        var work = Task.Run(() =>
        {
            for (int i = 0; i < 300; i++)
            {
                string target = targets[rng.Next(targets.Length)];
                string text = rng.Next(3) switch
                {
                    0 => $"extends: \"{target}\"\nbrief:\n  id: x{i}\n",
                    1 => good.Replace(
                        "    form: rectangular\n    max_age: 80",
                        $"    form: life_table\n    file: \"{target}\""),
                    _ => "extends: base.yaml\ndemography:\n  survival:\n    form: life_table\n" +
                        $"    file: \"{target}\"\n",
                };
                string file = Path.Combine(dir, "case.yaml");
                File.WriteAllText(file, text);
                var (code, _, err) = Run("check", file);
                Assert.True(code is 0 or 2, $"case {i} ({target}): exit {code}: {err}");
                Assert.DoesNotContain("hunter2", err);
                Assert.DoesNotContain("Exception", err);
                if (code == 2) Assert.Matches(@"case\.yaml:\d+:\d+: ", err);
            }
        });
        await work.WaitAsync(TimeSpan.FromMinutes(5)); // a TimeoutException means a mutation blocked on a special file
    }

    [Fact]
    public void A_root_given_on_the_command_line_lets_a_scenario_extend_a_parent_above_its_folder()
    {
        string dir = Project();
        Directory.CreateDirectory(Path.Combine(dir, "regions"));
        File.WriteAllText(Path.Combine(dir, "regions", "r.yaml"), "extends: ../base.yaml\nbrief:\n  id: region\n");
        var (refused, _, err) = Run("check", Path.Combine(dir, "regions", "r.yaml"));
        Assert.Equal(2, refused);
        Assert.Contains("'..' may not lead out of it", err);
        var (code, output, _) = Run("check", Path.Combine(dir, "regions", "r.yaml"), "--root", dir);
        Assert.Equal(0, code);
        Assert.Contains("ok (region", output);
    }

    [Fact]
    public void A_scenario_one_byte_over_the_limit_reports_its_exact_size()
    {
        string dir = Project();
        string big = Path.Combine(dir, "big.yaml");
        File.WriteAllText(big, new string('#', (1 << 20) + 1));
        var (code, _, err) = Run("check", big);
        Assert.Equal(2, code);
        Assert.Contains(
            "cannot read the scenario (the file is 1,048,577 bytes, over the limit of 1,048,576 bytes).",
            err);
    }

    [Theory]
    [InlineData("--jobs", "abc", "--jobs: must be a whole number from 1 to 256. Got 'abc'.")]
    [InlineData("--jobs", "0", "--jobs: must be a whole number from 1 to 256. Got '0'.")]
    [InlineData("--frobnicate", null, "briefwright build: '--frobnicate' is not an option of build")]
    public void Usage_mistakes_are_worded_for_users_with_exit_code_2(string option, string? value, string expected)
    {
        string outDir = Directory.CreateTempSubdirectory("bw-usage-").FullName;
        var args = new List<string> { "build", Good, "-o", outDir, option };
        if (value is not null) args.Add(value);
        var (code, _, err) = Run(args.ToArray());
        Assert.Equal(2, code);
        Assert.Contains(expected, err);
        Assert.DoesNotContain("System.", err);
        // Only the build log's line for the refused run; no brief file.
        Assert.DoesNotContain(Directory.GetFiles(outDir), f => Path.GetFileName(f) != "build-log.jsonl");
    }

    [Fact]
    public void An_empty_folder_or_a_folder_named_like_a_scenario_is_an_error()
    {
        string dir = Directory.CreateTempSubdirectory("bw-empty-").FullName;
        string named = Path.Combine(dir, "x.yaml");
        Directory.CreateDirectory(named);
        foreach (var command in new[] { "check", "solve", "build" })
        {
            var (code, _, err) = Run(command, named);
            Assert.Equal(2, code);
            Assert.Contains("x.yaml: the folder holds no scenario files (*.yaml, *.yml); nothing to do for it.", err);
        }
        Assert.Empty(Directory.GetFiles(named));
    }

    [Fact]
    public void Twenty_thousand_unknown_keys_print_the_first_hundred_then_a_count()
    {
        string dir = Project();
        string many = Path.Combine(dir, "many.yaml");
        File.WriteAllText(
            many,
            File.ReadAllText(Good) + string.Concat(Enumerable.Range(0, 20_000).Select(i => $"k{i}: 1\n")));
        var (code, _, err) = Run("check", many);
        Assert.Equal(2, code);
        Assert.Equal(100, err.Split('\n').Count(l => l.Contains(": unknown key")));
        Assert.Contains("… and 19,900 more problems not shown (fix these first).", err);
        Assert.Contains("many.yaml: 20000 problems.", err);
    }

    [Fact]
    public void Scenario_text_that_looks_like_markup_is_printed_as_text_and_makes_no_link()
    {
        string dir = Project();
        string q = Path.Combine(dir, "q.yaml");
        File.WriteAllText(q, File.ReadAllText(Good).Replace(
            "  date: 2026-11-30\n",
            "  date: 2026-11-30\n  question: \"[memo](file:///etc/passwd) [[pagebreak]] <div> [[figure: nope]]\"\n"));
        string outDir = Path.Combine(dir, "out");
        var (code, _, err) = Run("build", q, "-o", outDir, "-q", "--no-chart-images");
        Assert.True(code == 0, err);
        var pdf = File.ReadAllBytes(Directory.GetFiles(outDir, "*.pdf").Single());
        Assert.DoesNotContain("/URI", System.Text.Encoding.Latin1.GetString(pdf));
        string filled = File.ReadAllText(Directory.GetFiles(outDir, "*.brief.md").Single());
        Assert.Contains(
            "\\[memo\\](file:///etc/passwd) \\[\\[pagebreak\\]\\] \\<div\\> \\[\\[figure: nope\\]\\]",
            filled);
    }
}
