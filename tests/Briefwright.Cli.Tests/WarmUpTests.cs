using Briefwright.Brief;
using Briefwright.Scenario;

namespace Briefwright.Cli.Tests;

public class WarmUpTests
{
    private static ScenarioDocument Load(string name)
    {
        var loaded = new ScenarioLoader(new FileSourceReader())
            .Load(Path.Combine(RepositoryRoot.Path, "briefs-demo", name + ".yaml"));
        Assert.True(loaded.Ok, string.Join("\n", loaded.Problems));
        return loaded.Document!;
    }

    [Fact]
    public void The_warm_up_brief_goes_through_every_library_without_error()
    {
        // The warm-up swallows failures so that it can never break a build; this checks it really exercises the
        // chart, template, Markdown and PDF stages instead of failing silently at the first step.
        Assert.True(WarmUp.Run());
    }

    [Fact]
    public async Task A_brief_built_while_the_warm_up_runs_is_byte_identical()
    {
        var alone = BriefBuilder.Build(Load("auroria-silverdale"), StandardTemplate.Template).Pdf;
        var warm = Task.Run(() => { for (int i = 0; i < 3; i++) WarmUp.Run(); });
        var during = BriefBuilder.Build(Load("auroria-silverdale"), StandardTemplate.Template).Pdf;
        await warm;
        Assert.Equal(alone, during);
    }
}
