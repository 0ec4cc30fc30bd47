using Briefwright.Brief.Editions;

namespace Briefwright.Brief.Tests;

/// <summary>
/// The edition planner's rules. The rule under every case (common practice for records kept under version control and
/// for backups): the current edition's files are never replaced unless they are first kept, completely and verified, or
/// as found and marked recovered; the only exception is a rebuild of unchanged inputs whose files all match.
/// </summary>
public class EditionPlannerTests
{
    private const string Old = "old-fingerprint", New = "new-fingerprint";
    private static readonly string[] Files
        = ["b-2026-11-30.results.json", "b-2026-11-30.pdf", "b-2026-11-30.options.csv"];

    private static CurrentEdition Valid(
        int edition = 3,
        string[]? missing = null,
        string[]? changed = null,
        int archived = 2) =>
        new(ManifestCondition.Valid, edition, Old, "b-2026-11-30", Files, missing ?? [], changed ?? [], archived);

    public class Given_a_valid_manifest
    {
        [Fact]
        public void Unchanged_inputs_with_every_file_in_place_are_skipped()
        {
            var plan = EditionPlanner.Plan(new EditionRequest(Old, 1, Force: false), Valid());
            Assert.Equal(new EditionPlan.Skip(3), plan);
        }

        [Fact]
        public void Forced_rebuild_of_unchanged_inputs_keeps_the_edition_and_archives_nothing()
        {
            var plan = Assert.IsType<EditionPlan.Build>(
                EditionPlanner.Plan(new EditionRequest(Old, 1, Force: true), Valid()));
            Assert.Equal(3, plan.Edition);
            Assert.False(plan.NewEdition);
            Assert.Null(plan.Archive);
        }

        [Fact]
        public void Changed_inputs_start_edition_n_plus_1_and_keep_edition_n_verified_first()
        {
            var plan = Assert.IsType<EditionPlan.Build>(
                EditionPlanner.Plan(new EditionRequest(New, 1, false), Valid()));
            Assert.Equal(4, plan.Edition);
            Assert.True(plan.NewEdition);
            Assert.Equal("edition-3", plan.Archive!.Folder);
            Assert.Equal(3, plan.Archive.Edition);
            Assert.Equal(Files, plan.Archive.Files);
            Assert.Empty(plan.Archive.Reasons);
            Assert.False(plan.Archive.Recovered);
            Assert.Equal("b-2026-11-30.results.json", plan.CompareWith);
        }

        [Fact]
        public void The_scenario_may_ask_for_a_higher_edition_but_never_a_lower_one()
        {
            Assert.Equal(7, Assert.IsType<EditionPlan.Build>(
                EditionPlanner.Plan(new EditionRequest(New, 7, false), Valid())).Edition);
            Assert.Equal(4, Assert.IsType<EditionPlan.Build>(
                EditionPlanner.Plan(new EditionRequest(New, 2, false), Valid())).Edition);
        }

        [Fact]
        public void A_new_edition_number_is_above_every_archived_one_so_no_archive_folder_is_reused()
        {
            var plan = Assert.IsType<EditionPlan.Build>(
                EditionPlanner.Plan(new EditionRequest(New, 1, false), Valid(edition: 3, archived: 5)));
            Assert.Equal(6, plan.Edition);
        }

        [Fact]
        public void A_missing_file_with_changed_inputs_keeps_the_rest_as_found_marked_recovered()
        {
            var plan = Assert.IsType<EditionPlan.Build>(
                EditionPlanner.Plan(new EditionRequest(New, 1, false), Valid(missing: ["b-2026-11-30.options.csv"])));
            Assert.Equal(4, plan.Edition);
            var archive = plan.Archive!;
            Assert.True(archive.Recovered);
            Assert.Equal("edition-3-recovered", archive.Folder);
            Assert.Equal(["b-2026-11-30.results.json", "b-2026-11-30.pdf"], archive.Files);
            Assert.Contains("missing: b-2026-11-30.options.csv", archive.Reasons);
        }

        [Fact]
        public void A_missing_file_with_unchanged_inputs_is_rebuilt_in_place_when_the_others_match()
        {
            var plan = Assert.IsType<EditionPlan.Build>(
                EditionPlanner.Plan(new EditionRequest(Old, 1, false), Valid(missing: ["b-2026-11-30.pdf"])));
            Assert.Equal(3, plan.Edition);
            Assert.Null(plan.Archive); // the rebuild writes the very bytes the manifest recorded
        }

        [Fact]
        public void An_edited_file_is_kept_as_found_even_when_the_inputs_are_unchanged()
        {
            var plan = Assert.IsType<EditionPlan.Build>(
                EditionPlanner.Plan(new EditionRequest(Old, 1, false), Valid(changed: ["b-2026-11-30.pdf"])));
            Assert.Equal(3, plan.Edition);
            Assert.True(plan.Archive!.Recovered);
            Assert.Contains("not as the manifest recorded it: b-2026-11-30.pdf", plan.Archive.Reasons);
        }

        [Fact]
        public void A_changed_results_file_is_not_compared_with()
        {
            var plan = Assert.IsType<EditionPlan.Build>(
                EditionPlanner.Plan(new EditionRequest(New, 1, false), Valid(changed: ["b-2026-11-30.results.json"])));
            Assert.Null(plan.CompareWith);
        }
    }

    public class Given_no_usable_manifest
    {
        [Fact]
        public void An_empty_folder_builds_the_edition_the_scenario_names()
        {
            var plan = Assert.IsType<EditionPlan.Build>(
                EditionPlanner.Plan(new EditionRequest(New, 1, false), CurrentEdition.None()));
            Assert.Equal(new EditionPlan.Build(1, false, null, null), plan with { Changed = [] });
            Assert.Equal(["new"], plan.Changed);
        }

        [Fact]
        public void Current_files_deleted_but_an_archive_kept_continue_after_the_archived_editions()
        {
            var plan = Assert.IsType<EditionPlan.Build>(
                EditionPlanner.Plan(new EditionRequest(New, 1, false), CurrentEdition.None(highestArchived: 4)));
            Assert.Equal(5, plan.Edition);
            Assert.Null(plan.Archive);
        }

        [Fact]
        public void A_damaged_manifest_keeps_the_found_files_marked_recovered_and_never_reuses_their_edition()
        {
            var found = new CurrentEdition(ManifestCondition.Damaged, 3, null, null, Files, [], [], 2);
            foreach (var fingerprint in new[] { Old, New })
            {
                var plan = Assert.IsType<EditionPlan.Build>(
                    EditionPlanner.Plan(new EditionRequest(fingerprint, 1, false), found));
                Assert.Equal(4, plan.Edition);
                Assert.Equal("edition-3-recovered", plan.Archive!.Folder);
                Assert.True(plan.Archive.Recovered);
                Assert.Equal(Files, plan.Archive.Files);
                Assert.StartsWith("the manifest was damaged", plan.Archive.Reasons[0]);
                Assert.Null(plan.CompareWith);
            }
        }

        [Fact]
        public void A_missing_manifest_beside_files_of_unknown_edition_keeps_them_as_recovered()
        {
            var found = new CurrentEdition(ManifestCondition.Missing, null, null, null, Files, [], [], 0);
            var plan = Assert.IsType<EditionPlan.Build>(EditionPlanner.Plan(new EditionRequest(New, 1, false), found));
            Assert.Equal(1, plan.Edition);
            Assert.Equal("recovered", plan.Archive!.Folder);
            Assert.Equal(["the manifest was missing"], plan.Archive.Reasons);
        }

        [Fact]
        public void Force_never_skips_the_archive_of_found_files()
        {
            var found = new CurrentEdition(ManifestCondition.Damaged, null, null, null, Files, [], [], 0);
            var plan = Assert.IsType<EditionPlan.Build>(
                EditionPlanner.Plan(new EditionRequest(Old, 1, Force: true), found));
            Assert.NotNull(plan.Archive);
        }
    }

    /// <summary>
    /// The edition rule, on named inputs (the manifest's <c>inputs</c> and <c>outputs</c>). The rule is the project's
    /// own (README, "Rebuilds, editions and the data annex"); that a reprint under a new date keeps its edition number
    /// and that a new edition gets a name of its own is common practice for numbered documents, not taken from a
    /// source.
    /// </summary>
    public class Given_named_inputs
    {
        private static readonly Dictionary<string, string> Inputs = new()
        {
            ["scenario"] = "text-1", ["content"] = "content-1", ["template"] = "template-1", ["theme"] = "standard",
            ["fonts"] = "fonts-1", ["tool"] = "0.2.0", ["date"] = "2026-11-30",
        };

        private static readonly Dictionary<string, string> Outputs = new() {
            ["chart_copies"] = "yes",
            ["csv_byte_order_mark"] = "no" };

        private static string Fingerprint(
            IReadOnlyDictionary<string, string> inputs,
            IReadOnlyDictionary<string, string> outputs) =>
            string.Join(
                ";",
                inputs.OrderBy(kv => kv.Key)
                    .Concat(outputs.OrderBy(kv => kv.Key))
                    .Select(kv => kv.Key + "=" + kv.Value));

        private static CurrentEdition Current(
            int edition = 3,
            int archived = 2,
            int? requested = 1,
            string[]? missing = null) =>
            new(
                ManifestCondition.Valid,
                edition,
                Fingerprint(Inputs, Outputs),
                "b-2026-11-30-edition-3",
                Files3,
                missing ?? [],
                [],
                archived)
            {
                Inputs = Inputs, Outputs = Outputs, RequestedEdition = requested,
            };

        private static readonly string[] Files3 = ["b-2026-11-30-edition-3.results.json", "b-2026-11-30-edition-3.pdf"];

        /// <summary>
        /// A request with some inputs or outputs changed from <see cref="Inputs"/> and <see cref="Outputs"/>.
        /// </summary>
        private static EditionRequest Ask(
            int requested = 1,
            bool force = false,
            Dictionary<string, string>? inputs = null,
            Dictionary<string, string>? outputs = null)
        {
            var i = new Dictionary<string, string>(Inputs);
            foreach (var (k, v) in inputs ?? []) i[k] = v;
            var o = new Dictionary<string, string>(Outputs);
            foreach (var (k, v) in outputs ?? []) o[k] = v;
            return new EditionRequest(Fingerprint(i, o), requested, force) { Inputs = i, Outputs = o };
        }

        private static EditionPlan.Build Build(EditionRequest request, CurrentEdition? current = null) =>
            Assert.IsType<EditionPlan.Build>(EditionPlanner.Plan(request, current ?? Current()));

        [Fact]
        public void Nothing_changed_is_skipped()
            => Assert.Equal(new EditionPlan.Skip(3), EditionPlanner.Plan(Ask(), Current()));

        [Theory]
        [InlineData("content")]
        [InlineData("template")]
        public void An_assumption_or_the_template_starts_a_new_edition_and_keeps_the_current_one_verified(string input)
        {
            var plan = Build(Ask(inputs: input == "content"
                ? new() { [input] = "changed", ["scenario"] = "text-2" }
                : new() { [input] = "changed" }));
            Assert.Equal(4, plan.Edition);
            Assert.True(plan.NewEdition);
            Assert.False(plan.Redated);
            Assert.Equal("edition-3", plan.Archive!.Folder);
            Assert.False(plan.Archive.Recovered);
            Assert.Equal("b-2026-11-30-edition-3.results.json", plan.CompareWith);
            Assert.Equal([input], plan.Changed); // the text changed with the content: not listed twice
        }

        [Fact]
        public void A_new_date_alone_re_dates_the_current_edition_and_archives_the_dated_files()
        {
            var plan = Build(Ask(inputs: new() { ["date"] = "2026-12-31", ["scenario"] = "text-2" }));
            Assert.Equal(3, plan.Edition);
            Assert.False(plan.NewEdition);
            Assert.True(plan.Redated);
            Assert.False(plan.ResultsDecide);
            Assert.Equal("edition-3", plan.Archive!.Folder);
            Assert.Equal(["date", "scenario"], plan.Changed);
        }

        [Fact]
        public void A_new_date_with_a_new_assumption_is_a_new_edition_not_a_re_dating()
        {
            var plan = Build(Ask(inputs: new() { ["date"] = "2026-12-31", ["content"] = "content-2" }));
            Assert.Equal(4, plan.Edition);
            Assert.True(plan.NewEdition);
            Assert.False(plan.Redated);
            Assert.Equal(["content", "date"], plan.Changed);
        }

        [Theory]
        [InlineData("theme")]
        [InlineData("fonts")]
        [InlineData("scenario")] // a comment or layout edit: same content
        public void A_new_look_or_layout_re_issues_the_same_edition_after_archiving_it(string input)
        {
            var plan = Build(Ask(inputs: new() { [input] = "changed" }));
            Assert.Equal(3, plan.Edition);
            Assert.False(plan.NewEdition);
            Assert.False(plan.Redated);
            Assert.NotNull(plan.Archive);
            Assert.Equal([input], plan.Changed);
        }

        [Theory]
        [InlineData("chart_copies", "no")]
        [InlineData("csv_byte_order_mark", "yes")]
        [InlineData("formats", "pdf,html")] // a further output selection, whatever its name
        public void An_output_switch_never_makes_an_edition_and_archives_nothing(string output, string value)
        {
            var plan = Build(Ask(outputs: new() { [output] = value }));
            Assert.Equal(new EditionPlan.Build(3, false, null, null), plan with { Changed = [] });
            Assert.Equal(["outputs." + output], plan.Changed);
        }

        [Fact]
        public void An_output_switch_that_drops_or_changes_a_file_keeps_the_current_edition_whole_first()
        {
            var plan = Build(Ask(outputs: new() { ["chart_copies"] = "no" }));
            var hashes = Files3.ToDictionary(f => f, f => "hash-of-" + f);
            // Every current file comes back byte for byte (a file only added): no copy.
            Assert.Null(EditionPlanner.KeepReplaced(
                plan,
                Current(),
                hashes,
                hashes.Append(new("b.fig-x.svg", "s")).ToDictionary()).Archive);
            // One dropped, or one changed: the whole edition is kept first, verified.
            Assert.Equal(
                "edition-3",
                EditionPlanner.KeepReplaced(plan, Current(), hashes, hashes.Skip(1).ToDictionary()).Archive!.Folder);
            var changed = hashes.ToDictionary(kv => kv.Key, kv => kv.Value + "-with-a-byte-order-mark");
            Assert.False(EditionPlanner.KeepReplaced(plan, Current(), hashes, changed).Archive!.Recovered);
            // No hashes recorded: nothing can be shown to come back.
            Assert.NotNull(EditionPlanner.KeepReplaced(plan, Current(), null, hashes).Archive);
        }

        [Fact]
        public void A_new_tool_keeps_the_edition_unless_the_results_move()
        {
            var request = Ask(inputs: new() { ["tool"] = "0.3.0" });
            var plan = Build(request);
            Assert.True(plan.ResultsDecide);
            Assert.Equal(3, plan.Edition);
            Assert.Equal("b-2026-11-30-edition-3.results.json", plan.CompareWith);

            var same = EditionPlanner.Settle(plan, request, Current(), resultsChanged: false);
            Assert.Equal(3, same.Edition);
            Assert.False(same.NewEdition);
            Assert.False(same.ResultsDecide);

            var moved = EditionPlanner.Settle(plan, request, Current(), resultsChanged: true);
            Assert.Equal(4, moved.Edition);
            Assert.True(moved.NewEdition);
            Assert.Equal("edition-3", moved.Archive!.Folder);
            Assert.Equal(["tool", "results"], moved.Changed);
        }

        [Fact]
        public void A_new_tool_without_the_current_results_to_compare_with_is_a_new_edition()
        {
            var plan = Build(
                Ask(inputs: new() { ["tool"] = "0.3.0" }),
                Current(missing: ["b-2026-11-30-edition-3.results.json"]));
            Assert.True(plan.NewEdition);
            Assert.True(plan.Archive!.Recovered);
        }

        [Fact]
        public void Settle_leaves_a_plan_the_results_do_not_decide_alone()
        {
            var plan = Build(Ask(inputs: new() { ["content"] = "content-2" }));
            Assert.Same(plan, EditionPlanner.Settle(plan, Ask(), Current(), resultsChanged: false));
        }

        [Fact]
        public void A_manifest_without_content_falls_back_on_the_scenario_text()
        {
            var old = Current() with { Inputs = Inputs.Where(kv => kv.Key != "content").ToDictionary() };
            var plan = Build(Ask(inputs: new() { ["scenario"] = "text-2" }), old);
            Assert.True(plan.NewEdition);
            Assert.Equal(["content"], plan.Changed);
        }

        [Fact]
        public void Brief_edition_above_the_current_one_starts_that_edition_even_when_nothing_else_changed()
        {
            var plan = Build(Ask(requested: 7, inputs: new() { ["scenario"] = "text-2" }));
            Assert.Equal(7, plan.Edition);
            Assert.True(plan.NewEdition);
            Assert.Equal(["brief.edition", "scenario"], plan.Changed);
        }

        [Fact]
        public void Brief_edition_is_a_minimum_when_a_new_edition_is_due()
        {
            var plan = Build(Ask(requested: 3, inputs: new() { ["content"] = "content-2" }), Current(requested: 3));
            Assert.Equal(4, plan.Edition); // already met: the next number
        }

        [Fact]
        public void Brief_edition_written_below_an_edition_already_issued_is_refused()
        {
            Assert.Equal(
                new EditionPlan.Refuse(2, 3),
                EditionPlanner.Plan(Ask(requested: 2, inputs: new() { ["scenario"] = "text-2" }), Current()));
            Assert.Equal(new EditionPlan.Refuse(2, 6), EditionPlanner.Plan(Ask(requested: 2), Current(archived: 6)));
        }

        [Fact]
        public void Brief_edition_already_met_is_no_reason_to_refuse_later_editions()
        {
            // edition 2 was asked for and built; editions 3 followed from changes; the scenario still says 2
            Assert.Equal(new EditionPlan.Skip(3), EditionPlanner.Plan(Ask(requested: 2), Current(requested: 2)));
            Assert.Equal(
                4,
                Build(Ask(requested: 2, inputs: new() { ["content"] = "content-2" }), Current(requested: 2)).Edition);
            // equal to the current edition: nothing asked beyond what is issued
            Assert.IsType<EditionPlan.Skip>(EditionPlanner.Plan(Ask(requested: 3), Current()));
        }

        [Fact]
        public void Force_with_nothing_changed_rewrites_the_same_edition_and_says_so()
        {
            var plan = Build(Ask(force: true));
            Assert.Equal(3, plan.Edition);
            Assert.Null(plan.Archive);
            Assert.Equal(["force"], plan.Changed);
        }
    }

    public class File_names
    {
        [Fact]
        public void Edition_1_keeps_the_plain_name_and_every_later_edition_has_its_own()
        {
            var day = new DateOnly(2026, 11, 30);
            Assert.Equal("b-2026-11-30", BriefBuilder.FileStem("b", day, 1));
            Assert.Equal("b-2026-11-30-edition-2", BriefBuilder.FileStem("b", day, 2));
            // Any two editions differ in name, whatever their dates; a re-dated edition differs from its earlier copy
            // by date.
            var names = new[] { (day, 1), (day, 2), (day.AddDays(31), 2), (day.AddDays(31), 3) }.Select(
                e => BriefBuilder.FileStem("b", e.Item1, e.Item2)).ToList();
            Assert.Equal(names.Count, names.Distinct().Count());
        }
    }
}
