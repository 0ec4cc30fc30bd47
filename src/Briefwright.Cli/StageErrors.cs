using Briefwright.Brief;
using Briefwright.Cli.Batch;
using Briefwright.Composer;
using Briefwright.Model;
using Briefwright.Templating;

namespace Briefwright.Cli;

/// <summary>The stages of building a brief, each with its own failure type.</summary>
public enum Stage
{
    /// <summary>
    /// Reading and checking the scenario: a result, <see cref="Scenario.LoadResult"/>, with positioned problems.
    /// </summary>
    Scenario,
    /// <summary>Solving it: <see cref="UnsolvableScenarioException"/> (the model's own
    /// <see cref="ModelRuleException"/>, a non-finite result, a computation that fails on these inputs).</summary>
    Model,
    /// <summary>Parsing or filling the template: <see cref="TemplateException"/>, with positions; and text the brief
    /// cannot show (<see cref="BriefTextException"/>: a character the fonts lack, a language without texts), positioned
    /// at the scenario field, template line or line of texts it came from.</summary>
    Template,
    /// <summary>Laying out the pages: <see cref="ComposeException"/>, traced back to the template.</summary>
    Layout,
    /// <summary>
    /// Writing the edition: <see cref="EditionWriteException"/>, or an I/O failure before anything was staged.
    /// </summary>
    Write,
}

/// <summary>What the user reads about a failed stage, the exit code and the build outcome it counts as.</summary>
public sealed record StageFailure(
    Stage? Stage,
    IReadOnlyList<string> Lines,
    int ExitCode,
    OutcomeStatus Status,
    string Summary)
{
    /// <summary>First lines only, for the build log.</summary>
    public List<string> FirstLines => Lines.Select(l => l.Split('\n')[0]).ToList();
}

/// <summary>
/// The one place that turns a stage's failure into a message and an exit code. Input a user can fix (scenario, model,
/// template, layout) exits 2 with the file and the reason; a write that fails exits 1 and says what was kept. Only an
/// exception no stage claims is a fault of the tool, and only that one asks to be reported.
/// </summary>
public static class StageErrors
{
    public static StageFailure Describe(
        Exception ex,
        string file,
        string? outDir = null,
        BriefTemplate? template = null) => ex switch
    {
        UnsolvableScenarioException u => Model(file, u.Message),
        ModelRuleException m => Model(file, m.Message),
        TemplateException t => new(Stage.Template, t.Errors.Select(e => e.ToString()).ToList(), ExitCodes.InvalidInput,
            OutcomeStatus.Invalid, "template error"),
        BriefTextException x => new(Stage.Template, x.Errors, ExitCodes.InvalidInput, OutcomeStatus.Invalid,
            "text the brief cannot show (a language without texts, or a character the fonts lack)"),
        ComposeException c => new(Stage.Layout, [$"{(template is null ? file : Position(template, c))}: {c.Message}"],
            ExitCodes.InvalidInput, OutcomeStatus.Invalid, c.Message),
        EditionWriteException w => new(Stage.Write, [$"{file}: cannot write the brief to {outDir}: {w.Message}."],
            ExitCodes.Failed, OutcomeStatus.Failed, w.Message),
        IOException or UnauthorizedAccessException => new(Stage.Write,
            // Failed before any staging: the lock, the recovery or the folder itself (a file, read-only, full).
            [$"{file}: cannot write the brief to {outDir} ({ex.Message}); nothing was replaced: the previous files " +
                "are untouched."],
            ExitCodes.Failed, OutcomeStatus.Failed, ex.Message),
        _ => new(null, [$"{file}: {Internal(ex)}"], ExitCodes.Failed, OutcomeStatus.Failed, ex.Message),
    };

    /// <summary>A fault of the tool itself: no stage claims it, so no input can be changed to avoid it.</summary>
    public static string Internal(Exception ex) =>
        $"internal error, please report it: {ex.GetType().Name}: {ex.Message}";

    private static StageFailure Model(string file, string reason) => new(Stage.Model,
        [$"{file}: the model cannot solve this scenario: {reason.TrimEnd('.')}. Change the inputs named in the " +
            "reason; nothing written."],
        ExitCodes.InvalidInput, OutcomeStatus.Invalid, reason);

    /// <summary>
    /// Where in the template the offending text was written: found by its text, else the line of the filled text.
    /// </summary>
    private static string Position(BriefTemplate template, ComposeException ex)
    {
        var lines = template.Text.Split('\n');
        if (ex.Snippet is { Length: > 0 } snippet)
            for (int i = 0; i < lines.Length; i++)
                if (lines[i].IndexOf(snippet, StringComparison.Ordinal) is int col and >= 0)
                    return $"{template.Path}:{i + 1}:{col + 1}";
        return $"{template.Path}:{Math.Max(1, ex.Line)}:1";
    }
}
