using Briefwright.Brief.Annex;
using Briefwright.Templating;
using Scriban.Runtime;

namespace Briefwright.Brief;

/// <summary>Template data for the "changes since the previous edition" section: <c>changes</c> and
/// <c>changes_table</c>, in the brief's language.</summary>
public sealed class ChangesModel(BriefLanguage language) : TemplateFunctions(language)
{
    public void Add(ScriptObject model, EditionChanges? changes)
    {
        if (changes is null)
        {
            model["changes"] = null;
            model.AddFunction("changes_table", new Func<string>(() => ""));
            return;
        }
        model["changes"] = new ScriptObject
        {
            ["previous_edition"] = changes.PreviousEdition,
            ["previous_date"] = changes.PreviousDate,
            ["assumptions"] = changes.Assumptions.Count,
            ["results"] = changes.Results.Count,
        };
        model.AddFunction("changes_table", new Func<string>(() => Table(changes)));
    }

    public string Table(EditionChanges changes)
    {
        var text = "";
        if (changes.Assumptions.Count > 0)
            text += Md.Table(T("changes.assumptions_caption", changes.PreviousEdition, changes.PreviousDate), null,
                new[] { T("table.parameter"), T("changes.previous"), T("changes.now"), T("table.source") },
                changes.Assumptions.Select(c =>
                    (IReadOnlyList<string>)new[] { c.Label, c.Old, c.New, c.Detail ?? T("changes.not_given") }),
                new HashSet<int> { 1, 2 }) + "\n";
        if (changes.Results.Count > 0)
            text += Md.Table(T("changes.results_caption", changes.PreviousEdition), null,
                new[] { T("changes.result"), T("changes.previous"), T("changes.now"), T("changes.difference") },
                changes.Results.Select(c => (IReadOnlyList<string>)new[] { c.Label, c.Old, c.New, c.Detail ?? "" }),
                new HashSet<int> { 1, 2, 3 });
        var causes = Causes(changes, text.Length > 0);
        if (text.Length == 0)
            return (causes.Count > 0 ? T("changes.none_follows", Join(causes)) : T("changes.none")) + "\n";
        return causes.Count > 0 ? text + "\n" + T("changes.also_follows", Join(causes)) + "\n" : text;
    }

    /// <summary>
    /// The reasons for a new edition that the tables do not show, in words: a changed template, other content of the
    /// scenario (its title, question, options' wording or notes), the edition <c>brief.edition</c> asks for, a new
    /// tool.
    /// </summary>
    public IReadOnlyList<string> Causes(EditionChanges changes, bool tables)
    {
        var words = new List<string>();
        foreach (var cause in changes.Causes)
            switch (cause)
            {
                case "template":
                    words.Add(T("changes.cause.template"));
                    break;
                case "content" when changes.Assumptions.Count == 0:
                    words.Add(T("changes.cause.content"));
                    break;
                case "brief.edition":
                    words.Add(T("changes.cause.edition", changes.Edition));
                    break;
                case "results":
                    words.Add(T(tables ? "changes.cause.tool_rows" : "changes.cause.tool"));
                    break;
                case "files":
                    words.Add(T("changes.cause.files"));
                    break;
            }
        return words;
    }

    private string Join(IReadOnlyList<string> words) => Wording.List(words);
}
