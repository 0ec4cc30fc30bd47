using Briefwright.Brief.Annex;
using Briefwright.Templating;
using Scriban.Runtime;

namespace Briefwright.Brief;

/// <summary>Template data for the "changes since the previous edition" section: <c>changes</c> and <c>changes_table</c>.</summary>
public static class ChangesModel
{
    public static void Add(ScriptObject model, EditionChanges? changes)
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

    public static string Table(EditionChanges changes)
    {
        var text = "";
        if (changes.Assumptions.Count > 0)
            text += Md.Table($"Assumptions changed since edition {changes.PreviousEdition} ({changes.PreviousDate})", null,
                new[] { "Parameter", "Previous", "Now", "Source" },
                changes.Assumptions.Select(c => (IReadOnlyList<string>)new[] { c.Label, c.Old, c.New, c.Detail ?? "not given" }), new HashSet<int> { 1, 2 }) + "\n";
        if (changes.Results.Count > 0)
            text += Md.Table($"Headline results changed since edition {changes.PreviousEdition}", null,
                new[] { "Result", "Previous", "Now", "Difference" },
                changes.Results.Select(c => (IReadOnlyList<string>)new[] { c.Label, c.Old, c.New, c.Detail ?? "" }), new HashSet<int> { 1, 2, 3 });
        var causes = Causes(changes, text.Length > 0);
        if (text.Length == 0)
            return causes.Count > 0
                ? $"No assumption or headline result changed; this edition follows {Join(causes)}.\n"
                : "No assumption or headline result changed.\n";
        return causes.Count > 0 ? text + $"\nThis edition also follows {Join(causes)}.\n" : text;
    }

    /// <summary>
    /// The reasons for a new edition that the tables do not show, in words: a changed template, other content of the
    /// scenario (its title, question, options' wording or notes), the edition <c>brief.edition</c> asks for, a new tool.
    /// </summary>
    public static IReadOnlyList<string> Causes(EditionChanges changes, bool tables)
    {
        var words = new List<string>();
        foreach (var cause in changes.Causes)
            switch (cause)
            {
                case "template":
                    words.Add("a change of the template (the brief's wording and layout)");
                    break;
                case "content" when changes.Assumptions.Count == 0:
                    words.Add("a change of the scenario's other content (such as its title, question, options' wording or notes)");
                    break;
                case "brief.edition":
                    words.Add($"the scenario's request for edition {changes.Edition} (brief.edition)");
                    break;
                case "results":
                    words.Add(tables ? "a new version of the tool, under which the rows above changed" : "a new version of the tool");
                    break;
                case "files":
                    words.Add("the previous edition's files, found incomplete or without their record");
                    break;
            }
        return words;
    }

    private static string Join(IReadOnlyList<string> words) =>
        words.Count == 1 ? words[0] : string.Join(", ", words.Take(words.Count - 1)) + " and " + words[^1];
}
