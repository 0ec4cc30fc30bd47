namespace Briefwright.Brief.Tests;

public class WarmUpTests
{
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
        var alone = Demo.Build("auroria-silverdale").Pdf;
        var warm = Task.Run(() => { for (int i = 0; i < 3; i++) WarmUp.Run(); });
        var during = BriefBuilder.Build(Demo.Load("auroria-silverdale"), StandardTemplate.Template).Pdf;
        await warm;
        Assert.Equal(alone, during);
    }
}
