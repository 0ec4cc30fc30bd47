using Scriban;
using Scriban.Parsing;
using Scriban.Runtime;
using Scriban.Syntax;

namespace Briefwright.Templating;

/// <summary>
/// A Scriban template whose output is CommonMark. Templates see only the data given to them: no file
/// includes (no loader), no clock or random numbers (the <c>date</c> and <c>math</c> built-ins are removed), unknown
/// names are errors, and every brief's run is held to budgets that hold whatever the template does: loops, recursion,
/// total steps, wall-clock time, the size of the output and of any text or list made on the way, and the size of
/// numbers given to functions (a padding width, a repeat count).
/// </summary>
public sealed class BriefTemplate
{
    public const int LoopLimit = 10_000;
    public const int RecursiveLimit = 50;
    public const int OutputLimit = 2_000_000;

    /// <summary>
    /// Expressions and statements evaluated for one brief: the deterministic budget, far above what a brief needs.
    /// </summary>
    public const int StepLimit = 1_000_000;

    /// <summary>Items in a list or range made while filling the template.</summary>
    public const int ItemLimit = 100_000;

    /// <summary>Largest whole number a function or operator may receive (a width, an index, a repeat count).</summary>
    public const int IntegerLimit = 100_000;

    /// <summary>
    /// Wall-clock time for filling one brief's template: a backstop for a single slow step (the step budget stops loops
    /// and recursion first), generous enough that a busy machine never stops a sound template.
    /// </summary>
    public static readonly TimeSpan TimeLimit = TimeSpan.FromSeconds(5);

    private readonly Template template;

    private BriefTemplate(Template template, string path, string text)
    {
        this.template = template;
        Path = path;
        Text = text;
        Hash = Sha256Hex.Of(text);
    }

    public string Path { get; }
    public string Text { get; }

    /// <summary>
    /// SHA-256 of the template text (hex), computed once: it goes into every brief's stamp and manifest.
    /// </summary>
    public string Hash { get; }

    public static BriefTemplate Parse(string text, string path)
    {
        var parsed = Template.Parse(text, path);
        if (parsed.HasErrors)
            throw new TemplateException(parsed.Messages
                .Select(m => new TemplateError(path, m.Span.Start.Line + 1, m.Span.Start.Column + 1, Clean(m.Message)))
                .ToList());
        return new BriefTemplate(parsed, path, text);
    }

    public string Render(ScriptObject model)
    {
        var context = new BudgetContext
        {
            StrictVariables = true,
            EnableRelaxedMemberAccess = false,
            EnableRelaxedTargetAccess = false,
            EnableRelaxedFunctionAccess = false,
            LoopLimit = LoopLimit,
            RecursiveLimit = RecursiveLimit,
            OutputLimit = OutputLimit,
            TemplateLoader = null,
            RegexTimeOut = TimeSpan.FromSeconds(1),
            MemberRenamer = member => member.Name,
        };
        context.BuiltinObject.Remove("date");
        context.BuiltinObject.Remove("math");
        context.PushGlobal(model);
        try
        {
            return template.Render(context);
        }
        catch (ScriptRuntimeException ex)
        {
            throw new TemplateException(new[]
            {
                new TemplateError(Path, ex.Span.Start.Line + 1, ex.Span.Start.Column + 1, Clean(ex.OriginalMessage)),
            });
        }
        catch (InvalidOperationException ex)
        {
            var span = context.CurrentSpan;
            throw new TemplateException(
                new[] { new TemplateError(Path, span.Start.Line + 1, span.Start.Column + 1, ex.Message) });
        }
        catch (OutOfMemoryException)
        {
            var span = context.CurrentSpan;
            throw new TemplateException(new[]
            {
                new TemplateError(Path, span.Start.Line + 1, span.Start.Column + 1,
                    "The template made a text or list too large to hold in memory."),
            });
        }
    }

    /// <summary>
    /// Counts every evaluation against the step and time budgets and refuses oversized intermediate values.
    /// </summary>
    private sealed class BudgetContext : TemplateContext
    {
        private readonly long deadline = System.Diagnostics.Stopwatch.GetTimestamp()
            + (long)(TimeLimit.TotalSeconds * System.Diagnostics.Stopwatch.Frequency);
        private int steps;
        private SourceSpan? statement;
        private int openStatements;

        public override object? Evaluate(ScriptNode? scriptNode, bool aliasReturnedFunction)
        {
            var at = scriptNode?.Span ?? CurrentSpan;
            // The step and time budgets are reported at the outermost statement that was running, so the message and
            // its position do not depend on which budget ran out first or on the machine's speed.
            bool outermost = openStatements == 0 && scriptNode is ScriptStatement and not ScriptBlockStatement;
            if (outermost) statement = at;
            if (++steps > StepLimit || ((steps & 255) == 0 && System.Diagnostics.Stopwatch.GetTimestamp() > deadline))
                throw new ScriptRuntimeException(statement ?? at,
                    $"This statement ran past the budget for one brief ({StepLimit:N0} steps or " +
                    $"{TimeLimit.TotalSeconds:0.#} s), as an endless or exploding loop or recursion would");
            object? result;
            if (outermost) openStatements++;
            try
            {
                result = base.Evaluate(scriptNode, aliasReturnedFunction);
            }
            finally
            {
                if (outermost) openStatements--;
            }
            switch (result)
            {
                case string text when text.Length > OutputLimit:
                    throw new ScriptRuntimeException(at,
                        $"The template made a text of {text.Length:N0} characters; the limit is {OutputLimit:N0}");
                case System.Collections.ICollection list when list.Count > ItemLimit:
                    throw new ScriptRuntimeException(at,
                        $"The template made a list or range of {list.Count:N0} items; the limit is {ItemLimit:N0}");
            }
            return result;
        }

        public override int ToInt(SourceSpan span, object? value) => Checked(span, base.ToInt(span, value));

        public override object? ToObject(SourceSpan span, object? value, Type destinationType)
        {
            var result = base.ToObject(span, value, destinationType);
            if (result is int i) Checked(span, i);
            else if (result is long l && (l > IntegerLimit || l < -IntegerLimit)) Checked(span, int.MaxValue);
            return result;
        }

        private static int Checked(SourceSpan span, int value) =>
            value is > IntegerLimit or < -IntegerLimit
                ? throw new ScriptRuntimeException(span,
                    $"A whole number given to a function or operator must be between −{IntegerLimit:N0} and " +
                    $"{IntegerLimit:N0}. Got {value:N0}")
                : value;
    }

    private static string Clean(string message) => message.TrimEnd('.') + ".";
}
