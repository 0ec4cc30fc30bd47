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
    private static readonly string[] Files = ["b-2026-11-30.results.json", "b-2026-11-30.pdf", "b-2026-11-30.options.csv"];

    private static CurrentEdition Valid(int edition = 3, string[]? missing = null, string[]? changed = null, int archived = 2) =>
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
            var plan = Assert.IsType<EditionPlan.Build>(EditionPlanner.Plan(new EditionRequest(Old, 1, Force: true), Valid()));
            Assert.Equal(3, plan.Edition);
            Assert.False(plan.NewEdition);
            Assert.Null(plan.Archive);
        }

        [Fact]
        public void Changed_inputs_start_edition_n_plus_1_and_keep_edition_n_verified_first()
        {
            var plan = Assert.IsType<EditionPlan.Build>(EditionPlanner.Plan(new EditionRequest(New, 1, false), Valid()));
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
            Assert.Equal(7, Assert.IsType<EditionPlan.Build>(EditionPlanner.Plan(new EditionRequest(New, 7, false), Valid())).Edition);
            Assert.Equal(4, Assert.IsType<EditionPlan.Build>(EditionPlanner.Plan(new EditionRequest(New, 2, false), Valid())).Edition);
        }

        [Fact]
        public void A_new_edition_number_is_above_every_archived_one_so_no_archive_folder_is_reused()
        {
            var plan = Assert.IsType<EditionPlan.Build>(EditionPlanner.Plan(new EditionRequest(New, 1, false), Valid(edition: 3, archived: 5)));
            Assert.Equal(6, plan.Edition);
        }

        [Fact]
        public void A_missing_file_with_changed_inputs_keeps_the_rest_as_found_marked_recovered()
        {
            var plan = Assert.IsType<EditionPlan.Build>(EditionPlanner.Plan(new EditionRequest(New, 1, false), Valid(missing: ["b-2026-11-30.options.csv"])));
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
            var plan = Assert.IsType<EditionPlan.Build>(EditionPlanner.Plan(new EditionRequest(Old, 1, false), Valid(missing: ["b-2026-11-30.pdf"])));
            Assert.Equal(3, plan.Edition);
            Assert.Null(plan.Archive); // the rebuild writes the very bytes the manifest recorded
        }

        [Fact]
        public void An_edited_file_is_kept_as_found_even_when_the_inputs_are_unchanged()
        {
            var plan = Assert.IsType<EditionPlan.Build>(EditionPlanner.Plan(new EditionRequest(Old, 1, false), Valid(changed: ["b-2026-11-30.pdf"])));
            Assert.Equal(3, plan.Edition);
            Assert.True(plan.Archive!.Recovered);
            Assert.Contains("not as the manifest recorded it: b-2026-11-30.pdf", plan.Archive.Reasons);
        }

        [Fact]
        public void A_changed_results_file_is_not_compared_with()
        {
            var plan = Assert.IsType<EditionPlan.Build>(EditionPlanner.Plan(new EditionRequest(New, 1, false), Valid(changed: ["b-2026-11-30.results.json"])));
            Assert.Null(plan.CompareWith);
        }
    }

    public class Given_no_usable_manifest
    {
        [Fact]
        public void An_empty_folder_builds_the_edition_the_scenario_names()
        {
            var plan = Assert.IsType<EditionPlan.Build>(EditionPlanner.Plan(new EditionRequest(New, 1, false), CurrentEdition.None()));
            Assert.Equal(new EditionPlan.Build(1, false, null, null), plan);
        }

        [Fact]
        public void Current_files_deleted_but_an_archive_kept_continue_after_the_archived_editions()
        {
            var plan = Assert.IsType<EditionPlan.Build>(EditionPlanner.Plan(new EditionRequest(New, 1, false), CurrentEdition.None(highestArchived: 4)));
            Assert.Equal(5, plan.Edition);
            Assert.Null(plan.Archive);
        }

        [Fact]
        public void A_damaged_manifest_keeps_the_found_files_marked_recovered_and_never_reuses_their_edition()
        {
            var found = new CurrentEdition(ManifestCondition.Damaged, 3, null, null, Files, [], [], 2);
            foreach (var fingerprint in new[] { Old, New })
            {
                var plan = Assert.IsType<EditionPlan.Build>(EditionPlanner.Plan(new EditionRequest(fingerprint, 1, false), found));
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
            var plan = Assert.IsType<EditionPlan.Build>(EditionPlanner.Plan(new EditionRequest(Old, 1, Force: true), found));
            Assert.NotNull(plan.Archive);
        }
    }
}
