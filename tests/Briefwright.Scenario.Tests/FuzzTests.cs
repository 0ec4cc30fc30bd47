using Briefwright.Model.Core;
using CsCheck;

namespace Briefwright.Scenario.Tests;

/// <summary>
/// Seeded fuzzing: 10,000 random mutations of the demo scenarios, some aiming extends and life tables outside the
/// project folder (CsCheck generators driven by a fixed PCG seed, so every run tries the same cases). No mutation may
/// crash the loader; every failure must be a positioned error; every mutant that loads must solve to finite numbers.
/// </summary>
public class FuzzTests
{
    private static readonly string Root = RepositoryRoot.Path;
    private static readonly Dictionary<string, string> Demo = new()
    {
        ["national.yaml"] = File.ReadAllText(Path.Combine(Root, "briefs-demo", "auroria-national.yaml")),
        ["region.yaml"] = File.ReadAllText(Path.Combine(Root, "briefs-demo", "auroria-silverdale.yaml"))
            .Replace("auroria-national.yaml", "national.yaml"),
        ["life.yaml"] = File.ReadAllText(Path.Combine(Root, "briefs-demo", "auroria-northport.yaml"))
            .Replace("auroria-national.yaml", "national.yaml")
            .Replace("northport-life-table.csv", "table.csv"),
        ["table.csv"] = File.ReadAllText(Path.Combine(Root, "briefs-demo", "northport-life-table.csv")),
        // Outside the project folder (the current folder): path mutations aim at these, which must never be read or
        // quoted.
        ["../secret.yaml"] = "password: hunter2\n",
        ["../secret.csv"] = "age,survivors\n0,hunter2\n",
    };

    private static readonly string[] Tokens =
    {
        "NaN", "-", "%", "[", "]", "{", "}", ":", "&a ", "*a", "\t", "  ", "1e999", "-1", "0", "\"", "'", "#", "---",
        "\n", "- ",
        "extends: region.yaml\n", "extends: national.yaml\n", "999999999999999999999999999999999", "é", "\0", "...",
        "!!int ", "? ", ",",
        // paths out of the project folder, of the wrong kind, and tags
        "extends: ../secret.yaml\n", "extends: /etc/passwd\n", "extends: /proc/self/environ\n", "file: ../secret.csv\n",
        "file: /dev/zero.csv\n",
        "../", "/", "!!str ", "!custom ", "!!binary ",
    };

    private static string Mutate(string text, int op, int position, int token, int other)
    {
        var lines = text.Split('\n').ToList();
        int at = position % Math.Max(1, text.Length), line = position % lines.Count;
        switch (op)
        {
            case 0: lines.RemoveAt(line); return string.Join('\n', lines);
            case 1: lines.Insert(line, lines[other % lines.Count]); return string.Join('\n', lines);
            case 2:
                (lines[line], lines[other % lines.Count]) = (lines[other % lines.Count], lines[line]);
                return string.Join('\n', lines);
            case 3: return text[..at] + Tokens[token] + text[at..];
            case 4: return text.Remove(at, Math.Min(1 + other % 5, text.Length - at));
            case 5: return text[..at];
            case 6: return text[..at] + Tokens[token] + text[Math.Min(text.Length, at + 1 + other % 8)..];
            case 7: lines[line] = new string(' ', other % 7) + lines[line].TrimStart(); return string.Join('\n', lines);
            default: return Mutate(
                Mutate(text, other % 7, position / 3 + 1, token, other / 7 + 1),
                position % 7,
                other,
                (token + 7) % Tokens.Length,
                position);
        }
    }

    [Fact]
    public void Ten_thousand_mutations_never_crash_and_every_failure_is_positioned()
    {
        var gen = Gen.Select(
            Gen.Int[0, 3],
            Gen.Int[0, 8],
            Gen.Int[0, int.MaxValue],
            Gen.Int[0, Tokens.Length - 1],
            Gen.Int[0, 100_000]);
        var pcg = new PCG(1, 20261130);
        string[] targets = { "national.yaml", "region.yaml", "life.yaml", "table.csv" };
        int loaded = 0, rejected = 0;
        for (int i = 0; i < 10_000; i++)
        {
            var (target, op, position, token, other) = gen.Generate(pcg, null!, out _);
            if (Environment.GetEnvironmentVariable("BW_FUZZ_TRACE") is { } trace) File.WriteAllText(
                trace,
                $"{i} {target} {op} {position} {token} {other}");
            var files = new Dictionary<string, string>(Demo);
            files[targets[target]] = Mutate(files[targets[target]], op, position, token, other);
            string entry = target == 0 ? "national.yaml" : target == 2 || target == 3 ? "life.yaml" : "region.yaml";
            LoadResult result;
            try
            {
                result = new ScenarioLoader(new MemoryReader(files)).Load(entry);
            }
            catch (Exception ex)
            {
                Assert.Fail(
                    $"case {i} (file {targets[target]}, op {op}) crashed the loader: {ex.GetType().Name}: " +
                    $"{ex.Message}");
                return;
            }
            if (!result.Ok)
            {
                rejected++;
                Assert.NotEmpty(result.Problems);
                Assert.DoesNotContain("hunter2", string.Join("\n", result.Problems.Select(result.Sources.Render)));
                foreach (var p in result.Problems)
                {
                    Assert.True(
                        p.At.Line >= 1 && p.At.Column >= 1 && files.ContainsKey(p.At.File),
                        $"case {i}: unpositioned problem {p.Message}");
                    Assert.Matches(@"^\S+:\d+:\d+: ", p.Message);
                    _ = result.Sources.Render(p);
                }
                continue;
            }
            loaded++;
            Assert.DoesNotContain(result.Document!.Files, f => f.Contains("secret", StringComparison.Ordinal));
            var solved = BalancedGrowth.Solve(result.Document!.Inputs, gridPoints: 40);
            Assert.All(solved.Options, o => Assert.True(
                double.IsFinite(o.OutputPerPerson) && o.OutputPerPerson > 0 && double.IsFinite(o.ChangeVsBaselinePct),
                $"case {i}: output {o.OutputPerPerson}"));
            Assert.True(double.IsFinite(solved.Optimum.SchoolingYears));
        }
        Assert.True(
            loaded > 500 && rejected > 500,
            $"{loaded} loaded, {rejected} rejected: the mutations should exercise both paths");
    }
}
