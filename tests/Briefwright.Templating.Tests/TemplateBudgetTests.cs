using Scriban.Runtime;

namespace Briefwright.Templating.Tests;

/// <summary>
/// Budgets that hold whatever a template does: each of these once ran for minutes or took gigabytes. Every one must
/// stop with a positioned template error.
/// </summary>
public class TemplateBudgetTests
{
    private static ScriptObject Model()
    {
        var m = new ScriptObject();
        m.Import(typeof(TemplateFunctions));
        m["brief"] = new ScriptObject { ["title"] = "A title" };
        return m;
    }

    private static TemplateError Error(string text)
    {
        var ex = Assert.Throws<TemplateException>(() => BriefTemplate.Parse(text, "t.md").Render(Model()));
        var e = Assert.Single(ex.Errors);
        Assert.Equal("t.md", e.File);
        Assert.True(e.Line >= 1 && e.Column >= 1);
        return e;
    }

    [Theory]
    [InlineData("{{ big 1 999999999 | string.size }}", "must be between −100,000 and 100,000. Got 999,999,999")]
    [InlineData("{{ 'x' | string.pad_left 1000000000 | string.size }}", "Got 1,000,000,000")]
    [InlineData("{{ [1] | array.insert_at 900000000 1 | array.size }}", "Got 900,000,000")]
    [InlineData("{{ (1..1000000000) | array.size }}", "Got 1,000,000,000")]
    [InlineData("{{ (1..99999) | array.size }}", "Range expression exceeds LoopLimit")]
    [InlineData(
        "{{ x = 'abcdefgh'; for i in 1..40; x = x + x; end; x | string.size }}",
        "The template made a text of 2,097,15")]
    public void Oversized_numbers_texts_and_lists_stop_the_template(string text, string expected)
    {
        Assert.Contains(expected, Error(text).Message);
    }

    [Fact]
    public void Repeating_a_text_a_hundred_million_times_is_refused()
    {
        var e = Error("{{ 'x' * 100000000 | string.size }}");
        Assert.Equal(1, e.Line);
    }

    [Fact]
    public void A_doubly_recursive_function_under_the_depth_limit_is_stopped_by_the_step_or_time_budget()
    {
        var e = Error("# T\n{{ func f(n); if n > 0; f(n - 1); f(n - 1); end; end; f 40 }}");
        Assert.Equal("t.md:2:55: This statement ran past the budget for one brief (1,000,000 steps or 5 s), as an " +
            "endless or exploding loop or recursion would.", e.ToString());
    }

    [Fact]
    public void Nested_loops_are_stopped()
    {
        var e = Error("{{ for i in 1..10000; for j in 1..10000; for k in 1..10000; end; end; end }}");
        Assert.Matches("limit|budget", e.Message);
    }

    [Fact]
    public void Ordinary_work_fits_well_inside_the_budgets()
    {
        string text = "{{ for i in 1..5000 }}{{ pct (i / 10000) }} {{ end }}";
        string output = BriefTemplate.Parse(text, "t.md").Render(Model());
        Assert.Equal(5000, output.Split(' ', StringSplitOptions.RemoveEmptyEntries).Length);
        Assert.EndsWith("50.0% ", output);
    }
}

/// <summary>
/// Seeded fuzzing of the budgets: 150 templates made of random pieces, many of them hostile. Each must fill within
/// its budgets or stop with a positioned template error; none may crash or produce more than the output limit.
/// </summary>
public class TemplateBudgetFuzzTests
{
    private static readonly string[] Pieces =
    {
        "# {{ brief.title }}\n", "{{ for i in 1..100 }}{{ i }} {{ end }}\n", "{{ while true }}x{{ end }}",
        "{{ func f(n); if n > 0; f(n - 1); f(n - 1); end; end; f 30 }}",
        "{{ 'ab' * 99999 }}", "{{ x = 'abcd'; for i in 1..30; x = x + x; end; x | string.size }}",
        "{{ (1..200000) | array.size }}",
        "{{ 'x' | string.pad_left 99999 }}", "{{ big 1 99999 }}", "{{ pct 0.5 999999 }}",
        "{{ [1, 2] | array.insert_at 99999 3 | array.size }}",
        "{{ for i in 1..9999; for j in 1..9999; end; end }}", "text\n", "{{ func g; ret g; end }}{{ g }}",
        "{{ (1..9999) | array.join ',' | string.size }}",
        "{{ capture c; for i in 1..9999; 'abcdefghij'; end; end; c | string.size }}",
        "{{ brief.title | string.replace 'A' ('B' * 50000) }}",
    };

    [Fact]
    public void Random_hostile_templates_fill_within_budget_or_stop_with_a_positioned_error()
    {
        var rng = new Random(20261202);
        var model = new Scriban.Runtime.ScriptObject();
        model.Import(typeof(TemplateFunctions));
        model["brief"] = new Scriban.Runtime.ScriptObject { ["title"] = "A title" };
        int stopped = 0, filled = 0;
        for (int i = 0; i < 150; i++)
        {
            string text = string.Concat(
                Enumerable.Range(0, 1 + rng.Next(4)).Select(_ => Pieces[rng.Next(Pieces.Length)]));
            try
            {
                string output = BriefTemplate.Parse(text, "t.md").Render(model);
                Assert.True(output.Length <= BriefTemplate.OutputLimit, $"case {i}: {output.Length} characters");
                filled++;
            }
            catch (TemplateException ex)
            {
                Assert.All(
                    ex.Errors,
                    e => Assert.True(e.Line >= 1 && e.Column >= 1 && e.File == "t.md", $"case {i}: {e}"));
                stopped++;
            }
        }
        Assert.True(stopped > 30 && filled > 10, $"{stopped} stopped, {filled} filled");
    }
}
