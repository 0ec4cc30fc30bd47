using Briefwright.Brief;
using Briefwright.Cli.Batch;
using Briefwright.Composer;
using Briefwright.Model;
using Briefwright.Model.Uncertainty;
using Briefwright.Scenario;
using Briefwright.Templating;

namespace Briefwright.Cli.Tests;

/// <summary>
/// Each stage's failure reaches the user as a message naming the file and the reason, with the stage's exit code;
/// nothing a user can cause asks to be reported as a fault of the tool.
/// </summary>
public class StageErrorTests
{
    private const string Report = "please report";

    /// <summary>An invented scenario whose population growth is drawn so that most draws break n + g + δ ≥ 0.1%: Monte
    /// Carlo survives by redrawing, the Sobol samples (never redrawn) do not.</summary>
    private static readonly string SobolStarved = ValidScenario.Text
        .Replace("id: test-brief", "id: sobol-starved")
        .Replace("title: Test brief", "title: Starved Sobol indices (invented)") + """

        uncertainty:
          draws: 200
          seed: 7
          sobol_samples: 64
          parameters:
            population_growth: { distribution: normal, mean: -6%, sd: 0.8% }
        """;

    private static string Write(string text)
    {
        string dir = Directory.CreateTempSubdirectory("bw-stage-").FullName;
        string file = Path.Combine(dir, "s.yaml");
        File.WriteAllText(file, text);
        return file;
    }

    /// <summary>The scenario without its uncertainty section, loaded, then given <paramref name="spec"/> directly: the
    /// way past check's pilot draws to the model itself.</summary>
    private static (string File, LoadResult Loaded) Doctored(MonteCarloSpec spec)
    {
        string file = Write(SobolStarved[..SobolStarved.IndexOf("uncertainty:", StringComparison.Ordinal)]);
        var loaded = new ScenarioLoader(new FileSourceReader()).Load(file);
        Assert.True(loaded.Ok, string.Join("\n", loaded.Problems));
        var doc = loaded.Document!;
        doc = doc with { Analysis = doc.Analysis with { MonteCarlo = spec } };
        return (file, loaded with { Document = doc });
    }

    private static BriefOutcome Build(string file, LoadResult loaded, TextWriter error)
    {
        var settings = new BatchSettings(StandardTemplate.Template, BuildOptions.Default, "standard",
            Path.Combine(Path.GetDirectoryName(file)!, "out"), null, false, false) { Durable = false };
        return BatchBuilder.BuildOne(file, settings, error, loaded);
    }

    [Fact]
    public void A_scenario_whose_Monte_Carlo_draws_are_all_rejected_fails_in_the_model_stage_with_exit_2()
    {
        // A saving rate of 150% to 200% breaks a model rule in every draw and every attempt.
        var (file, loaded) = Doctored(new MonteCarloSpec(50, 3,
            [new UncertainParameter("saving_rate", new UniformDistribution(1.5, 2.0))], 0));
        var error = new StringWriter();
        var outcome = Build(file, loaded, error);
        Assert.Equal(OutcomeStatus.Invalid, outcome.Status);
        Assert.Contains($"{file}: the model cannot solve this scenario: Monte Carlo: ", error.ToString());
        Assert.Contains("narrow the distributions", error.ToString());
        Assert.DoesNotContain(Report, error.ToString());
        Assert.False(
            Directory.Exists(Path.Combine(Path.GetDirectoryName(file)!, "out", "sobol-starved-2026-11-30.pdf")));

        var ex = Assert.Throws<UnsolvableScenarioException>(() => ScenarioSolver.Solve(loaded.Document!));
        Assert.IsType<ModelRuleException>(ex.InnerException);
        Assert.Equal(ExitCodes.InvalidInput, StageErrors.Describe(ex, file).ExitCode);
    }

    [Fact]
    public void A_scenario_whose_Sobol_samples_are_all_rejected_fails_in_the_model_stage_not_on_an_empty_list()
    {
        var (file, loaded) = Doctored(new MonteCarloSpec(200, 7,
            [new UncertainParameter("population_growth", new NormalDistribution(-0.06, 0.008))], 64));
        var error = new StringWriter();
        var outcome = Build(file, loaded, error);
        Assert.Equal(OutcomeStatus.Invalid, outcome.Status);
        Assert.Contains("the model cannot solve this scenario: Sobol indices: only ", error.ToString());
        Assert.Contains("set uncertainty.sobol_samples to 0", error.ToString());
        Assert.DoesNotContain(Report, error.ToString());
    }

    [Fact]
    public void Check_solve_and_build_refuse_the_starved_Sobol_scenario_at_its_line_with_exit_2()
    {
        string file = Write(SobolStarved);
        foreach (var command in new[] { "check", "solve", "build" })
        {
            var error = new StringWriter();
            int code = CliApp.Run(
                [command, file, .. command == "build" ? new[] { "-q", "--no-chart-images" } : []],
                new StringWriter(),
                error);
            Assert.Equal(ExitCodes.InvalidInput, code);
            int line = SobolStarved.Split('\n').ToList().FindIndex(l => l.Contains("sobol_samples")) + 1;
            Assert.Contains($"{file}:{line}:", error.ToString());
            Assert.Contains(
                "uncertainty.sobol_samples: the distributions break a model rule too often for the Sobol indices",
                error.ToString());
            Assert.DoesNotContain(Report, error.ToString());
        }
    }

    [Fact]
    public void A_layout_error_from_the_template_is_positioned_in_the_template_and_exits_2()
    {
        var w = new Workspace("auroria-silverdale");
        string template = Path.Combine(w.Dir, "link.md");
        File.WriteAllText(template, "# {{ brief.title }}\n\nSee [the file](file:///etc/passwd).\n");
        var (code, _, err) = w.Build("-t", template);
        Assert.Equal(ExitCodes.InvalidInput, code);
        Assert.Contains($"{template}:3:", err);
        Assert.Contains("links in a brief must start with http:, https: or mailto:", err);
        Assert.DoesNotContain(Report, err);
    }

    public static TheoryData<string, Exception, Stage?, int> Failures => new()
    {
        {
            "model", new UnsolvableScenarioException("Monte Carlo: too few draws", new ModelRuleException("x")),
            Stage.Model, ExitCodes.InvalidInput
        },
        { "model rule", new ModelRuleException("Sobol indices: only 0 of 64"), Stage.Model, ExitCodes.InvalidInput },
        {
            "template", new TemplateException([new TemplateError("t.md", 3, 4, "unknown field")]),
            Stage.Template, ExitCodes.InvalidInput
        },
        {
            "layout", new ComposeException("links in a brief must start with http:", 3),
            Stage.Layout, ExitCodes.InvalidInput
        },
        {
            "write", new EditionWriteException("disk full; nothing was replaced", new IOException("disk full")),
            Stage.Write, ExitCodes.Failed
        },
        { "folder", new UnauthorizedAccessException("read-only"), Stage.Write, ExitCodes.Failed },
        { "tool", new NullReferenceException("a bug"), null, ExitCodes.Failed },
    };

    [Theory]
    [MemberData(nameof(Failures))]
    public void Each_stage_maps_to_its_message_and_exit_code_and_only_a_fault_of_the_tool_asks_to_be_reported(
        string name, Exception ex, Stage? stage, int exitCode)
    {
        var failure = StageErrors.Describe(ex, "s.yaml", "out");
        Assert.Equal(stage, failure.Stage);
        Assert.Equal(exitCode, failure.ExitCode);
        Assert.Equal(exitCode == ExitCodes.InvalidInput ? OutcomeStatus.Invalid : OutcomeStatus.Failed, failure.Status);
        Assert.Equal(stage is null, failure.Lines.Any(l => l.Contains(Report)));
        Assert.All(failure.Lines, l => Assert.True(
            l.StartsWith("s.yaml", StringComparison.Ordinal) || l.StartsWith("t.md:3:4", StringComparison.Ordinal),
            $"{name}: {l}"));
    }
}
