using System.Globalization;
using System.Text;
using System.Text.Json;
using System.Text.Json.Serialization;
using Briefwright.Brief;
using Briefwright.Brief.Editions;
using Briefwright.Model;
using Briefwright.Cli.Commands;
using Briefwright.Scenario;
using Briefwright.Templating;

namespace Briefwright.Cli.Batch;

/// <summary>
/// What <c>build --plan</c> says of one scenario: what a build would do (<c>new</c>, <c>skip</c>, <c>rewrite</c>,
/// <c>redate</c>, <c>new_edition</c>, <c>invalid</c>), the edition and file names before and after, which inputs
/// changed and why that means what it does.
/// </summary>
public sealed record PlannedBrief(
    string Scenario,
    string? Id,
    string Action,
    int? Edition,
    int? PreviousEdition,
    string? Files,
    string? PreviousFiles,
    IReadOnlyList<string> Changed,
    string Why)
{
    /// <summary>Where the current files would be kept first (relative to the output folder), if anywhere.</summary>
    public string? Archive { get; init; }

    /// <summary>The output folder.</summary>
    public string? Out { get; init; }

    /// <summary>Every positioned message, for an invalid scenario.</summary>
    public IReadOnlyList<string>? Messages { get; init; }
}

/// <summary>
/// <c>build --plan</c>: for each brief, what a build would do and why, from the same planner and the same inputs a
/// build uses. Reads only: no folder, lock, staging folder, log line or file is made, and an interrupted build is not
/// recovered (the plan says the next build will). When only the tool changed among what defines an edition, the brief's
/// model is solved to tell whether an assumption as shown or a headline result moved.
/// </summary>
public static class BuildPlan
{
    public static PlannedBrief PlanOne(string file, LoadResult loaded, BatchSettings settings)
    {
        if (!loaded.Ok)
        {
            var messages = loaded.Problems.Select(p => p.Message).ToList();
            return new PlannedBrief(file, null, "invalid", null, null, null, null, [],
                $"{messages.Count} problem(s) in the scenario") { Messages = messages };
        }
        var scenario = settings.Dated(loaded.Document!);
        string id = scenario.Brief.Id, dir = BatchBuilder.DirOf(file, settings);
        var (_, _, request) = BatchBuilder.Request(scenario, settings);
        var folder = new EditionFolder(dir, id);
        var (_, state) = folder.Read(full: true);
        var plan = EditionPlanner.Plan(request, state);
        string? interrupted = Interrupted(folder, id);
        string? before = state.Stem;
        switch (plan)
        {
            case EditionPlan.Skip skip:
                return new PlannedBrief(
                    file, id, "skip", skip.Edition, skip.Edition, before, before, [],
                    "nothing it depends on changed and its files are as built." + interrupted) { Out = dir };
            case EditionPlan.Refuse refuse:
                var problem = BatchBuilder.RefusalOf(file, scenario, refuse, dir);
                return new PlannedBrief(
                    file, id, "invalid", null, state.Edition, null, before, [EditionInput.RequestedEdition],
                    "brief.edition is below an edition already issued")
                {
                    Messages = [problem.Message], Out = dir,
                };
        }
        var build = (EditionPlan.Build)plan;
        if (build.ResultsDecide)
        {
            try
            {
                var solved = ScenarioSolver.Solve(scenario, settings.Options.ModelThreads);
                build = EditionPlanner.Settle(
                    build, request, state, BatchBuilder.ResultsDiffer(solved, dir, build.CompareWith));
            }
            catch (Exception ex) when (ex is UnsolvableScenarioException or ModelRuleException)
            {
                var failure = StageErrors.Describe(ex, file);
                return new PlannedBrief(file, id, "invalid", null, state.Edition, null, before, [], failure.Summary)
                    { Messages = failure.Lines, Out = dir };
            }
        }
        string stem = BriefBuilder.FileStem(id, scenario.Brief.Date, build.Edition);
        string action = build.Changed.Contains("new")
            ? "new"
            : build.NewEdition ? "new_edition" : build.Redated ? "redate" : "rewrite";
        string why = Describe(build, request, state) + (build.Archive is { } a ? "; the current files are kept " +
            $"first in archive/{id}/{a.Folder}" + (a.Recovered ? " (as found)" : "") : "");
        return new PlannedBrief(
            file, id, action, build.Edition, state.Edition, stem, before, build.Changed, why + "." + interrupted)
        {
            Archive = build.Archive is { } k ? $"archive/{id}/{k.Folder}" : null, Out = dir,
        };
    }

    /// <summary>What the plan says of a build of this brief that is running or was interrupted, if any.</summary>
    private static string? Interrupted(EditionFolder folder, string id) =>
        Directory.Exists(folder.TempDir) && Directory.EnumerateFileSystemEntries(folder.TempDir, id + ".*").Any()
            ? $" A build of {id} is running or was interrupted ({folder.TempDir}); the next build waits for it or " +
                "puts it right first."
            : null;

    /// <summary>Plans every scenario: reads them all (ids must be unique within the batch, as for a build), then each
    /// brief. Positioned errors go to <paramref name="error"/> as a build prints them.</summary>
    public static IReadOnlyList<PlannedBrief> PlanAll(
        IReadOnlyList<string> files,
        BatchSettings settings,
        int jobs,
        TextWriter error)
    {
        var parallel = new ParallelOptions { MaxDegreeOfParallelism = Math.Max(1, jobs) };
        var loaded = new LoadResult[files.Count];
        var reader = new FileSourceReader();
        Parallel.For(0, files.Count, parallel,
            i => loaded[i] = new ScenarioLoader(reader, settings.Root).Load(files[i]));
        var duplicates = ScenarioInputs.DuplicateIds(files.Select((f, i) => (f, loaded[i])).ToList(), reader);
        if (jobs > 1 && files.Count > 1)
            settings = settings with { Options = settings.Options with { ModelThreads = 1 } };
        var plans = new PlannedBrief[files.Count];
        Parallel.For(0, files.Count, parallel, i =>
        {
            var errors = new StringWriter();
            if (duplicates.TryGetValue(files[i], out var duplicate))
            {
                errors.WriteLine(loaded[i].Sources.Render(duplicate));
                plans[i] = new PlannedBrief(
                    files[i], loaded[i].Document!.Brief.Id, "invalid", null, null, null, null, [],
                    "brief.id is not unique within the batch")
                {
                    Messages = [duplicate.Message], Out = BatchBuilder.DirOf(files[i], settings),
                };
            }
            else
            {
                if (!loaded[i].Ok) ScenarioInputs.Report(files[i], loaded[i], errors);
                plans[i] = PlanOne(files[i], loaded[i], settings);
                if (loaded[i].Ok && plans[i].Action == "invalid")
                    foreach (var m in plans[i].Messages ?? []) errors.WriteLine(m);
            }
            if (errors.ToString() is { Length: > 0 } text) lock (error) error.Write(text);
        });
        return plans;
    }

    /// <summary>The plan's reasons in words: what changed, and what that means for the edition.</summary>
    public static string Describe(EditionPlan.Build build, EditionRequest request, CurrentEdition state)
    {
        string Was(string key) => state.Inputs?.GetValueOrDefault(key) ?? "?";
        string Now(string key) => request.Inputs.GetValueOrDefault(key) ?? "?";
        var words = build.Changed.Select(c => c switch
        {
            "new" => "not built before",
            "files" => "its files are missing or not as built",
            "force" => "--force",
            "inputs" => "its inputs (recorded by an earlier release)",
            EditionInput.Content => "the scenario's content",
            EditionInput.ScenarioText => "the scenario file's text, not its content",
            EditionInput.Template => "the template",
            EditionInput.Date => $"the date ({Was(EditionInput.Date)} → {Now(EditionInput.Date)})",
            EditionInput.Tool => $"the tool version ({Was(EditionInput.Tool)} → {Now(EditionInput.Tool)})",
            EditionInput.RequestedEdition => $"brief.edition asks for edition {request.RequestedEdition}",
            EditionInput.Results => "assumptions as shown or headline results",
            _ when c.StartsWith(EditionInput.OutputPrefix, StringComparison.Ordinal) => "output switch " +
                $"{c[EditionInput.OutputPrefix.Length..]}" +
                $" ({state.Outputs?.GetValueOrDefault(c[EditionInput.OutputPrefix.Length..]) ?? "?"} → " +
                $"{request.Outputs.GetValueOrDefault(c[EditionInput.OutputPrefix.Length..]) ?? "?"})",
            _ => $"the {c}",
        }).ToList();
        string changed = words.Count == 0 ? "" : "changed: " + string.Join(", ", words);
        if (build.Changed.Contains("new")) return "not built before";
        string meaning = build.NewEdition ? $"a new edition {build.Edition} after edition " +
                $"{state.Edition?.ToString(CultureInfo.InvariantCulture) ?? "?"}"
            : build.Redated ? $"edition {build.Edition} re-dated (no change of content, template or results)"
            : build.ResultsDecide ? $"edition {build.Edition} rewritten; it becomes a new edition if the results move"
            : build.Archive is null
                && build.Changed.All(c => c.StartsWith(EditionInput.OutputPrefix, StringComparison.Ordinal))
                ? $"edition {build.Edition} kept; only which files are written changes (the PDF and results data " +
                  "stay the same bytes; the current files are kept first in the archive if a file would be dropped " +
                  "or changed)"
            : $"edition {build.Edition} rewritten";
        return $"{changed}: {meaning}";
    }

    private static readonly JsonSerializerOptions Json = new()
    {
        WriteIndented = true,
        PropertyNamingPolicy = JsonNamingPolicy.SnakeCaseLower,
        DefaultIgnoreCondition = JsonIgnoreCondition.WhenWritingNull,
        Encoder = System.Text.Encodings.Web.JavaScriptEncoder.UnsafeRelaxedJsonEscaping,
        TypeInfoResolver = BatchJsonContext.Default,
    };

    /// <summary>The plan as a JSON list, one object per scenario in the order given (as <c>solve --json</c>).</summary>
    public static string ToJson(IReadOnlyList<PlannedBrief> plans) =>
        JsonSerializer.Serialize(plans,
            (System.Text.Json.Serialization.Metadata.JsonTypeInfo<IReadOnlyList<PlannedBrief>>)
            Json.GetTypeInfo(typeof(IReadOnlyList<PlannedBrief>))) + "\n";

    /// <summary>
    /// The plan as a table and one line per brief saying why, then a count; ends by saying nothing was written.
    /// </summary>
    public static string ToText(IReadOnlyList<PlannedBrief> plans)
    {
        var sb = new StringBuilder();
        var rows = plans.Select(p => new[]
        {
            p.Id ?? Path.GetFileName(p.Scenario), Words(p.Action),
            p.Edition?.ToString(CultureInfo.InvariantCulture) ?? "", p.Files is null ? "" : p.Files + ".pdf",
        }).Prepend(["brief", "would", "edition", "file"]).ToList();
        int[] w = Enumerable.Range(0, 4).Select(c => rows.Max(r => r[c].Length)).ToArray();
        for (int i = 0; i < rows.Count; i++)
        {
            sb.AppendLine(string.Join("  ",
                rows[i].Select((cell, c) => c == 2 ? cell.PadLeft(w[c]) : cell.PadRight(w[c]))).TrimEnd());
            if (i > 0)
            {
                var p = plans[i - 1];
                sb.AppendLine($"    {p.Why}");
                foreach (var m in p.Messages ?? []) sb.AppendLine($"    {m}");
            }
        }
        var counts = plans.GroupBy(p => p.Action).OrderBy(g => Array.IndexOf(Order, g.Key))
            .Select(g => $"{g.Count()} {Words(g.Key)}");
        sb.AppendLine($"{plans.Count} brief(s): {string.Join(", ", counts)}. Plan only: nothing was written.");
        return sb.ToString();
    }

    private static readonly string[] Order = ["new", "new_edition", "redate", "rewrite", "skip", "invalid"];

    private static string Words(string action) => action switch
    {
        "new" => "build new",
        "new_edition" => "new edition",
        "redate" => "re-date",
        "rewrite" => "rewrite",
        "skip" => "skip",
        _ => "invalid",
    };
}
