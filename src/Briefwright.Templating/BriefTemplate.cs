using Scriban;
using Scriban.Runtime;
using Scriban.Syntax;

namespace Briefwright.Templating;

/// <summary>
/// A Scriban template whose output is CommonMark. Templates see only the data given to them: no file
/// includes (no loader), no clock or random numbers (the <c>date</c> and <c>math</c> built-ins are removed), unknown
/// names are errors, and loops, recursion and output size are capped.
/// </summary>
public sealed class BriefTemplate
{
    public const int LoopLimit = 10_000;
    public const int RecursiveLimit = 50;
    public const int OutputLimit = 2_000_000;

    private readonly Template template;

    private BriefTemplate(Template template, string path, string text)
    {
        this.template = template;
        Path = path;
        Text = text;
        Hash = Convert.ToHexStringLower(System.Security.Cryptography.SHA256.HashData(System.Text.Encoding.UTF8.GetBytes(text)));
    }

    public string Path { get; }
    public string Text { get; }

    /// <summary>SHA-256 of the template text (hex), computed once: it goes into every brief's stamp and manifest.</summary>
    public string Hash { get; }

    public static BriefTemplate Parse(string text, string path)
    {
        var parsed = Template.Parse(text, path);
        if (parsed.HasErrors)
            throw new TemplateException(parsed.Messages.Select(m => new TemplateError(path, m.Span.Start.Line + 1, m.Span.Start.Column + 1, Clean(m.Message))).ToList());
        return new BriefTemplate(parsed, path, text);
    }

    public string Render(ScriptObject model)
    {
        var context = new TemplateContext
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
            throw new TemplateException(new[] { new TemplateError(Path, ex.Span.Start.Line + 1, ex.Span.Start.Column + 1, Clean(ex.OriginalMessage)) });
        }
        catch (InvalidOperationException ex)
        {
            var span = context.CurrentSpan;
            throw new TemplateException(new[] { new TemplateError(Path, span.Start.Line + 1, span.Start.Column + 1, ex.Message) });
        }
    }

    private static string Clean(string message) => message.TrimEnd('.') + ".";
}
