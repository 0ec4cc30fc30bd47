using System.Text.Json;
using Briefwright.Cli.Batch;

namespace Briefwright.Cli.Tests;

/// <summary>
/// The edition rule with real builds in a temporary folder, path by path, and what each brief's "changes" section says
/// (read from its filled template, <c>.brief.md</c>). The rule is the project's own (README, "Rebuilds, editions and
/// the data annex"); numbering reprints and new editions this way is common practice for numbered documents.
/// </summary>
public class EditionRuleTests
{
    private const string Id = "auroria-national";
    private const string Stem1 = "auroria-national-2026-11-30";

    private static (int Code, string Out, string Err) Run(params string[] args) => ReissueTests.Run(args);

    private static Workspace Built(params string[] extra)
    {
        var w = new Workspace("auroria-national");
        var (code, _, err) = w.Build(extra);
        Assert.True(code == 0, err);
        return w;
    }

    private static Manifest Current(Workspace w) => Snapshot.AssertWhole(w.Out);

    private static string Md(Workspace w) => File.ReadAllText(Path.Combine(w.Out, Current(w).Stem + ".brief.md"));

    private static string? ChangesSection(string md)
    {
        int at = md.IndexOf("## Changes since the previous edition", StringComparison.Ordinal);
        if (at < 0) return null;
        int end = md.IndexOf("\n## ", at + 5, StringComparison.Ordinal);
        return md[at..end];
    }

    private static JsonElement LastLogLine(Workspace w) => Snapshot.Log(w.Out)[^1];

    [Fact]
    public void Same_date_rebuild_with_nothing_changed_is_skipped_and_forced_keeps_the_edition_with_no_changes_section()
    {
        var w = Built();
        var before = Snapshot.Of(w.Out);
        Assert.Equal(0, w.Build().Code);
        Assert.Equal("skipped", LastLogLine(w).GetProperty("status").GetString());
        Assert.Equal(0, w.Build("--force").Code);
        Assert.Equal(before, Snapshot.Of(w.Out)); // the same bytes, edition 1
        Assert.Null(ChangesSection(Md(w)));
        Assert.False(Directory.Exists(Path.Combine(w.Out, "archive")));
    }

    [Fact]
    public void A_new_date_alone_re_dates_edition_1_under_a_new_name_and_archives_the_dated_copy()
    {
        var w = Built();
        var edition1 = Snapshot.Of(w.Out);
        Assert.Equal(0, w.Build("--date", "2026-12-31").Code);

        var m = Current(w);
        Assert.Equal(1, m.Edition);
        Assert.Equal("auroria-national-2026-12-31", m.Stem);
        Assert.DoesNotContain(Snapshot.Of(w.Out).Keys, k => k.StartsWith(Stem1, StringComparison.Ordinal));
        Assert.Equal(edition1, Snapshot.Of(Path.Combine(w.Out, "archive", Id, "edition-1")));
        Assert.Null(ChangesSection(Md(w)));
        Assert.Contains("31 December 2026", Md(w));
        Assert.Contains("edition 1", Md(w));
        var line = LastLogLine(w);
        Assert.Equal("built", line.GetProperty("status").GetString());
        Assert.Equal(1, line.GetProperty("edition").GetInt32());

        // The same date again: nothing to do, whatever the number of runs.
        Assert.Equal(0, w.Build("--date", "2026-12-31").Code);
        Assert.Equal("skipped", LastLogLine(w).GetProperty("status").GetString());

        // A date written into the scenario instead of --date is the same re-dating, not a change of content.
        w.Edit("auroria-national.yaml", "date: 2026-11-30", "date: 2027-01-15");
        Assert.Equal(0, w.Build().Code);
        Assert.Equal((1, "auroria-national-2027-01-15"), (Current(w).Edition, Current(w).Stem));
    }

    [Fact]
    public void A_changed_assumption_makes_edition_2_with_its_own_file_names_and_lists_the_change()
    {
        var w = Built();
        var edition1 = Snapshot.Of(w.Out);
        w.Edit("auroria-national.yaml", "value: 22%", "value: 23%");
        Assert.Equal(0, w.Build().Code);

        var m = Current(w);
        Assert.Equal(2, m.Edition);
        Assert.Equal("auroria-national-2026-11-30-edition-2", m.Stem);
        Assert.Empty(m.Files.Intersect(edition1.Keys)); // no file of edition 2 takes a name of edition 1's
        Assert.Equal(edition1, Snapshot.Of(Path.Combine(w.Out, "archive", Id, "edition-1")));
        string section = ChangesSection(Md(w))!;
        Assert.Contains("This is a new edition of the brief issued on 30 November 2026 (edition 1).", section);
        Assert.Contains("Assumptions changed since edition 1", section);
        Assert.Contains("| 22.00% | 23.00% |", section);
        Assert.DoesNotContain("presentation", section);
        Assert.DoesNotContain("also follows", section);
    }

    [Fact]
    public void A_changed_template_makes_a_new_edition_that_says_the_template_changed()
    {
        var w = Built();
        string template = Path.Combine(w.Dir, "brief-template.md");
        File.WriteAllText(
            template,
            File.ReadAllText(Path.Combine(RepositoryRoot.Path, "templates", "standard-brief.md")));
        Assert.Equal(0, w.Build("-t", template).Code); // the standard template's own text, named: the same template
        Assert.Equal(1, Current(w).Edition);
        File.AppendAllText(template, "\nA closing line added to the template.\n");
        Assert.Equal(0, w.Build("-t", template).Code);
        Assert.Equal(2, Current(w).Edition);
        string section = ChangesSection(Md(w))!;
        Assert.Contains("No assumption or headline result changed; this edition follows a change of the template " +
            "(the brief's wording and layout).", section);
    }

    [Fact]
    public void Chart_copies_on_or_off_never_make_an_edition_and_leave_the_brief_the_same_bytes()
    {
        var w = Built(); // without chart copies
        var plain = Snapshot.Of(w.Out);
        Assert.Equal(0, Run("build", w.Dir, "-q").Code); // with them
        var with = Snapshot.Of(w.Out);
        Assert.Equal(1, Current(w).Edition);
        Assert.Contains(with.Keys, k => k.EndsWith(".svg", StringComparison.Ordinal));
        foreach (var (name, hash) in plain.Where(kv => !kv.Key.EndsWith(".manifest.json", StringComparison.Ordinal)))
            Assert.Equal(hash, with[name]); // PDF, results, CSV, filled template: the same bytes
        Assert.False(Directory.Exists(Path.Combine(w.Out, "archive"))); // files only added: nothing to keep
        Assert.Equal(0, w.Build().Code); // off again
        Assert.Equal(plain, Snapshot.Of(w.Out));
        Assert.Equal(1, Current(w).Edition);
        Assert.Null(ChangesSection(Md(w)));
        // The chart copies dropped are not lost: edition 1 with them is kept whole.
        Assert.Equal(with, Snapshot.Of(Path.Combine(w.Out, "archive", Id, "edition-1")));
    }

    [Fact]
    public void A_new_theme_re_issues_the_same_edition_after_archiving_it()
    {
        var w = Built();
        var edition1 = Snapshot.Of(w.Out);
        string theme = Path.Combine(w.Dir, "auroria-institute.theme.yaml");
        File.Copy(CliAppTests.Demo("auroria-institute.theme.yaml"), theme);
        // the workspace copies text only
        File.Copy(
            CliAppTests.Demo("auroria-institute-logo.png"),
            Path.Combine(w.Dir, "auroria-institute-logo.png"),
            overwrite: true);
        var (code, _, err) = w.Build("--theme", theme);
        Assert.True(code == 0, err);
        Assert.Equal((1, Stem1), (Current(w).Edition, Current(w).Stem));
        Assert.NotEqual(edition1[Stem1 + ".pdf"], Snapshot.Of(w.Out)[Stem1 + ".pdf"]);
        Assert.Equal(edition1, Snapshot.Of(Path.Combine(w.Out, "archive", Id, "edition-1")));
        Assert.Null(ChangesSection(Md(w)));
    }

    [Fact]
    public void Brief_edition_raised_starts_that_edition_and_written_below_an_issued_one_is_a_positioned_error()
    {
        var w = Built();
        string yaml = Path.Combine(w.Dir, "auroria-national.yaml");

        // Raised with nothing else changed: edition 5, and the brief says why.
        w.Edit("auroria-national.yaml", "edition: 1", "edition: 5");
        Assert.Equal(0, w.Build().Code);
        Assert.Equal((5, "auroria-national-2026-11-30-edition-5"), (Current(w).Edition, Current(w).Stem));
        Assert.Contains("No assumption or headline result changed; this edition follows the scenario's request for " +
            "edition 5 (brief.edition).", ChangesSection(Md(w)));

        // Written below edition 5: refused at its position, nothing written but the log line.
        w.Edit("auroria-national.yaml", "edition: 5", "edition: 2");
        var before = Snapshot.Of(w.Out);
        var (code, _, err) = w.Build();
        Assert.Equal(2, code);
        Assert.Contains($"{yaml}:11:12: brief.edition: must not be below edition 5, already issued in {w.Out}; " +
            "remove it, or give at least 6 to start a new edition. Got '2'.", err);
        Assert.Contains("^", err);
        Assert.Equal(before, Snapshot.Of(w.Out));
        var line = LastLogLine(w);
        Assert.Equal("invalid", line.GetProperty("status").GetString());
        Assert.StartsWith($"{yaml}:11:12: brief.edition:", line.GetProperty("messages")[0].GetString());

        // Kept at 5 (a request already met) with an assumption changed: edition 6, no error.
        w.Edit("auroria-national.yaml", "edition: 2", "edition: 5");
        w.Edit("auroria-national.yaml", "value: 22%", "value: 23%");
        Assert.Equal(0, w.Build().Code);
        Assert.Equal(6, Current(w).Edition);
    }

    [Fact]
    public void Every_edition_of_a_history_has_its_own_file_names()
    {
        var w = Built();
        var names = new HashSet<string>(Current(w).Files);
        void Next(params string[] extra)
        {
            Assert.Equal(0, w.Build(extra).Code);
            foreach (var f in Current(w).Files) Assert.True(names.Add(f), $"{f} reused");
        }
        w.Edit("auroria-national.yaml", "value: 22%", "value: 23%");
        Next(); // edition 2, 2026-11-30
        Next("--date", "2026-12-31"); // edition 2 re-dated
        w.Edit("auroria-national.yaml", "value: 23%", "value: 24%");
        Next("--date", "2026-12-31"); // edition 3, same date as the re-dated edition 2
        Assert.Equal("auroria-national-2026-12-31-edition-3", Current(w).Stem);
        Assert.Equal(
            ["edition-1", "edition-2", "edition-2-2"],
            Directory.GetDirectories(Path.Combine(w.Out, "archive", Id)).Select(Path.GetFileName).Order());
    }
}
