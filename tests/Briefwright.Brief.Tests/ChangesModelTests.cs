using Briefwright.Brief.Annex;

namespace Briefwright.Brief.Tests;

/// <summary>The "changes since the previous edition" section says truthfully why there is a new edition.</summary>
public class ChangesModelTests
{
    private static readonly ChangedValue Saving = new(
        "production.saving_rate",
        "Saving rate",
        "22.00%",
        "23.00%",
        "invented");

    private static EditionChanges Changes(string[] causes, bool assumption = false) =>
        new(1, "2026-11-30", assumption ? [Saving] : [], []) { Causes = causes, Edition = 2 };

    [Fact]
    public void A_changed_assumption_is_listed_in_its_table_and_nothing_else_is_claimed()
    {
        string text = ChangesModel.Table(Changes(["content"], assumption: true));
        Assert.Contains("Assumptions changed since edition 1 (2026-11-30)", text);
        Assert.Contains("Saving rate", text);
        Assert.DoesNotContain("also follows", text);
        Assert.DoesNotContain("presentation", text);
    }

    [Fact]
    public void A_template_change_alone_says_so()
    {
        Assert.Equal("No assumption or headline result changed; this edition follows a change of the template (the " +
            "brief's wording and layout).\n",
            ChangesModel.Table(Changes(["template"])));
    }

    [Fact]
    public void Content_without_a_changed_assumption_names_the_scenarios_other_content()
    {
        Assert.Contains(
            "a change of the scenario's other content (such as its title, question, options' wording or notes)",
            ChangesModel.Table(Changes(["content"])));
    }

    [Fact]
    public void A_raised_brief_edition_says_the_scenario_asked_for_it()
    {
        Assert.Equal("No assumption or headline result changed; this edition follows the scenario's request for " +
            "edition 2 (brief.edition).\n",
            ChangesModel.Table(Changes(["brief.edition", "scenario"])));
    }

    [Fact]
    public void Several_causes_beside_a_table_are_named_after_it()
    {
        string text = ChangesModel.Table(Changes(["content", "template", "date"], assumption: true));
        Assert.EndsWith(
            "\nThis edition also follows a change of the template (the brief's wording and layout).\n",
            text);
    }

    [Fact]
    public void Never_claims_that_only_the_presentation_changed()
    {
        foreach (var causes in new[] { new[] { "template" }, ["content"], ["brief.edition"], ["results"], [] })
            Assert.DoesNotContain("only the presentation", ChangesModel.Table(Changes(causes)));
    }
}
