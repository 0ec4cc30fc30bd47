using Scriban.Runtime;

namespace Briefwright.Templating.Tests;

public class BriefTemplateTests
{
    private static ScriptObject Model()
    {
        var m = new ScriptObject();
        m.Import(typeof(TemplateFunctions));
        m["brief"] = new ScriptObject { ["title"] = "A title" };
        m.Import("recurse", new Func<int, int>(n => n));
        return m;
    }

    private static TemplateError Error(string text)
    {
        var ex = Assert.Throws<TemplateException>(() => BriefTemplate.Parse(text, "t.md").Render(Model()));
        return Assert.Single(ex.Errors);
    }

    [Fact]
    public void Renders_values_and_formatting_functions()
    {
        Assert.Equal(
            "# A title 4.1%",
            BriefTemplate.Parse("# {{ brief.title }} {{ pct 0.0412 }}", "t.md").Render(Model()));
    }

    [Fact]
    public void A_syntax_error_is_reported_with_file_line_and_column()
    {
        var ex = Assert.Throws<TemplateException>(() => BriefTemplate.Parse("line one\n{{ if }}\n", "t.md"));
        var e = ex.Errors[0];
        Assert.Equal(("t.md", 2), (e.File, e.Line));
        Assert.StartsWith("t.md:2:", e.ToString());
    }

    [Fact]
    public void An_unknown_name_is_an_error_in_strict_mode()
    {
        var e = Error("ok\n  {{ brief.titel }}");
        Assert.Equal(2, e.Line);
        Assert.Contains("titel", e.Message);
    }

    [Fact]
    public void An_endless_loop_is_stopped_by_the_loop_limit()
    {
        var e = Error("{{ while true }}x{{ end }}");
        Assert.Equal(1, e.Line);
        Assert.Contains("loop", e.Message, StringComparison.OrdinalIgnoreCase);
    }

    [Fact]
    public void Endless_recursion_is_stopped_by_the_recursion_limit()
    {
        var e = Error("{{ func f; ret f; end }}{{ f }}");
        Assert.Contains("recursi", e.Message, StringComparison.OrdinalIgnoreCase);
    }

    [Fact]
    public void Templates_cannot_include_files()
    {
        var e = Error("{{ include '/etc/passwd' }}");
        Assert.Equal(1, e.Line);
    }

    [Theory]
    [InlineData("{{ date.now }}")]
    [InlineData("{{ math.random 1 10 }}")]
    public void Templates_cannot_read_the_clock_or_draw_random_numbers(string text)
    {
        var e = Error(text);
        Assert.Equal(1, e.Line);
    }
}
