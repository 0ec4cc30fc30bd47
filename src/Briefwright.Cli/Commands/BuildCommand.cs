using System.CommandLine;
using System.Globalization;
using System.Text;
using Briefwright.Brief;
using Briefwright.Brief.Formats;
using Briefwright.Cli.Batch;
using Briefwright.Cli.Project;
using Briefwright.Scenario;
using Briefwright.Templating;

namespace Briefwright.Cli.Commands;

/// <summary>
/// <c>build PATH...</c>: scenarios + template → dated PDF briefs with their data annex, in parallel, incrementally.
/// </summary>
public static partial class BuildCommand
{
    public static Command Create(CliIo io)
    {
        var paths = ScenarioInputs.PathsArgument("built", stdin: false);
        var template = new Option<string?>("--template", "-t") { Description = "Template file (Scriban producing " +
            "CommonMark). Default: the project's, else the standard brief; copy templates/standard-brief.md to start " +
            "your own." };
        var theme = new Option<string?>("--theme") { Description = "Theme file (YAML): organisation name, paper size " +
            "(A4 or US Letter), colours, footer text, logo, fonts. See docs/themes.md." };
        var outDir = new Option<string?>("--out", "-o") { Description = "Folder for the briefs. Default: the " +
            "project's, else an 'out' folder beside each scenario." };
        var date = new Option<string?>("--date") { Description = "Date of the brief (YYYY-MM-DD), replacing " +
            "brief.date. The clock is never used, so rebuilds are identical." };
        var force = new Option<bool>("--force", "-f") { Description = "Rebuild even when nothing a brief depends on " +
            "has changed." };
        var shard = new Option<string?>("--shard") { Description = "Build only shard K of N (written K/N), for job " +
            "arrays: shards are disjoint and together cover the list, whatever the spelling of the folder." };
        var jobs = new Option<string?>("--jobs", "-j") { Description = "Briefs built at once, at least 1 (default: " +
            "the project's, else one per core)." };
        var root = ScenarioInputs.RootOption();
        var noImages = new Option<bool>("--no-chart-images") { Description = "Skip the SVG and PNG copies of each " +
            "chart in the data annex (faster)." };
        var csvBom = new Option<bool>("--csv-bom") { Description = "Start each CSV file with a UTF-8 byte order " +
            "mark, so spreadsheet programs show '–', 'β₁' and 'δ' correctly." };
        var skipFlush = new Option<bool>("--skip-flush") { Description = "Do not wait for each brief to reach the " +
            "disk before renaming it into place: faster on slow disks; a kill still cannot leave half a file, but a " +
            "power cut might leave an empty one." };
        var settingsFile = new Option<string?>("--settings") { Description = "Project settings file. Default: the " +
            $"nearest {ProjectSettings.FileName} in the scenarios' folder or a folder above it." };
        var quiet = new Option<bool>("--quiet", "-q") { Description = "Print nothing but errors." };
        var formatsOption = new Option<string?>("--formats")
        {
            Description = "Which files to write for each brief, comma-separated: pdf (always written), " +
                "html (a self-contained web page), xlsx (a spreadsheet workbook of the results tables), " +
                "docx (an editable document). Default: the project's, else pdf. " +
                "Switching a format on or off rebuilds the same edition; it never makes a new one.",
        };
        var plan = new Option<bool>("--plan") { Description = "Say what a build would do for each brief (build new, " +
            "skip, rewrite, re-date, new edition) and which inputs changed, and write nothing at all: no brief, log " +
            "line, lock or folder. Exit 0, or 2 on invalid input." };
        var json = new Option<bool>("--json") { Description = "With --plan: print the plan as a JSON list, one " +
            "object per scenario in the order given." };
        var command = new Command("build",
            "Build PDF briefs: model, charts and template text composed into a dated, tagged PDF, with the results " +
            "JSON, CSV tables and chart images beside it. Unchanged briefs are skipped. A changed scenario content, " +
            "template or headline result makes a new edition (files named <id>-<date>-edition-<n>); a new date alone " +
            "re-dates the current edition; a new theme or tool rewrites it; output switches never make an edition; " +
            "whatever is replaced is archived first. --plan shows what a build would do, writing nothing. " +
            $"Defaults come from the project settings ({ProjectSettings.FileName}); options given here win.")
        {
            paths, template, theme, outDir, date, force, shard, jobs, noImages, csvBom, skipFlush, settingsFile, quiet,
            root, plan, json, formatsOption,
        };
        command.SetAction(parse => Execute(io, new Given(
            parse.GetValue(paths)!, parse.GetValue(template), parse.GetValue(theme), parse.GetValue(outDir),
            parse.GetValue(date), parse.GetValue(force), parse.GetValue(shard), parse.GetValue(jobs),
            parse.GetValue(root), parse.GetValue(noImages), parse.GetValue(csvBom), parse.GetValue(skipFlush),
            parse.GetValue(settingsFile), parse.GetValue(quiet), parse.GetValue(plan), parse.GetValue(json),
            parse.GetValue(formatsOption))));
        return command;
    }

    /// <summary>The words given to <c>build</c>, as parsed (null or false where not given).</summary>
    private sealed record Given(string[] Paths, string? Template, string? Theme, string? Out, string? Date, bool Force,
        string? Shard, string? Jobs, string? Root, bool NoImages, bool CsvBom, bool SkipFlush, string? Settings,
        bool Quiet, bool Plan, bool Json, string? Formats);

    /// <summary>Runs <c>build</c>: project settings, then template, theme and options, then the plan or the
    /// briefs.</summary>
    private static int Execute(CliIo io, Given given)
    {
        var error = io.Err;
        if (!ScenarioInputs.RootIsValid(given.Root, error)) return ExitCodes.InvalidInput;
        if (given.Json && !given.Plan)
        {
            error.WriteLine("briefwright build: --json is for --plan; a build reports in build-log.jsonl " +
                "(one JSON line per brief).");
            return ExitCodes.InvalidInput;
        }
        // A plan writes nothing, not even a log line.
        var log = given.Plan ? null : new BuildLog(io.Clock, given.Shard);
        if (given.Paths.Contains("-"))
            return Refuse(log, "usage", LogDirs(given.Paths, given.Out, null), error,
                "briefwright build: '-' (standard input) is for check, solve and diff; build names its files after " +
                "each scenario, so give the scenario's path.");
        if (ReadProject(given, log, error, out var project) is { } refusedSettings) return refusedSettings;
        string? effectiveOut = given.Out ?? project?.Out;

        var files = ScenarioInputs.Expand(given.Paths, error, out bool emptyFolder);
        if (files.Count == 0) return ExitCodes.InvalidInput;
        if (Configure(given, project, effectiveOut, ref files, log, error, out int jobCount) is not { } settings)
            return ExitCodes.InvalidInput;
        if (given.Plan)
        {
            var plans = BuildPlan.PlanAll(files, settings, jobCount, error);
            io.Out.Write(given.Json ? BuildPlan.ToJson(plans) : BuildPlan.ToText(plans));
            return emptyFolder || plans.Any(p => p.Action == "invalid") ? ExitCodes.InvalidInput : ExitCodes.Ok;
        }
        var progress = new Progress(given.Quiet ? TextWriter.Null : io.Out, io.Interactive && !given.Quiet,
            files.Count);
        var outcomes = Run(files, settings, jobCount, progress, error, log!);
        if (!given.Quiet) io.Out.Write(Summary(outcomes));
        if (outcomes.Any(o => o.Status is OutcomeStatus.Failed or OutcomeStatus.Stopped)) return ExitCodes.Failed;
        return emptyFolder || outcomes.Any(o => o.Status == OutcomeStatus.Invalid)
            ? ExitCodes.InvalidInput : ExitCodes.Ok;
    }

    /// <summary>Project settings: named, or the nearest above each path; every path must belong to the same project.
    /// Returns the exit code of a refusal, or null with <paramref name="project"/> (null when there is none).</summary>
    private static int? ReadProject(Given given, BuildLog? log, TextWriter error, out ProjectSettings? project)
    {
        project = null;
        string? settingsPath = given.Settings;
        if (settingsPath is null)
        {
            var found = given.Paths.Select(ProjectSettings.Find).Distinct().ToList();
            if (found.Count > 1)
                return Refuse(log, "settings", LogDirs(given.Paths, given.Out, null), error,
                    "briefwright build: the paths belong to different projects " +
                    $"({string.Join(", ", found.Select(f => f ?? "none"))}); " +
                    "build each project on its own or name one with --settings.");
            settingsPath = found[0];
        }
        if (settingsPath is null) return null;
        var loaded = ProjectSettings.Load(settingsPath, new FileSourceReader());
        if (loaded.Settings is null)
        {
            foreach (var p in loaded.Problems) error.WriteLine(loaded.Sources.Render(p));
            return Refuse(log, "settings", LogDirs(given.Paths, given.Out, null), TextWriter.Null,
                loaded.Problems.Select(p => p.Message).ToArray());
        }
        project = loaded.Settings;
        return null;
    }

    /// <summary>The batch's settings from the template, theme and options given (else the project's), with
    /// <paramref name="files"/> cut to this shard; null after a refusal (printed and logged: exit 2).</summary>
    private static BatchSettings? Configure(Given given, ProjectSettings? project, string? effectiveOut,
        ref IReadOnlyList<string> files, BuildLog? log, TextWriter error, out int jobCount)
    {
        jobCount = 0;
        var setupErrors = new StringWriter();
        var setup = Setup(given.Template ?? project?.Template, given.Theme ?? project?.Theme,
            given.Date ?? project?.Date?.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture), given.Shard, given.Jobs,
            project?.Jobs, given.Root, setupErrors, out string stage);
        if (setup is null)
        {
            error.Write(setupErrors.ToString());
            var messages = setupErrors.ToString().Split('\n').Select(l => l.TrimEnd('\r'))
                .Where(l => l.Length > 0 && !l.StartsWith("    ", StringComparison.Ordinal)).ToArray();
            Refuse(log, stage, LogDirs(files, effectiveOut, null, expanded: true), TextWriter.Null, messages);
            return null;
        }
        var (tpl, options, themeHash, day, shardSpec, jobs) = setup.Value;
        var formats = project?.Formats ?? OutputFormats.Default;
        if (given.Formats is { } formatsText)
        {
            if (OutputFormats.Parse(formatsText.Split(','), out string? unknown) is not { } parsed)
            {
                Refuse(log, "options", LogDirs(files, effectiveOut, null, expanded: true), error,
                    $"--formats: must be a comma-separated list of {OutputFormats.Describe(OutputFormats.All)}. " +
                    $"Got '{Scenario.Binding.BindContext.Printable(unknown ?? formatsText)}'.");
                return null;
            }
            formats = parsed;
        }
        options = options with { Formats = formats };
        if (shardSpec is { } s) files = Shards.Select(files, s.Index, s.Count, project?.Folder);
        bool images = !given.NoImages && (project?.ChartCopies ?? true);
        jobCount = jobs;
        return new BatchSettings(tpl, options, themeHash, effectiveOut, day, given.Force, images)
        {
            Durable = !given.SkipFlush,
            CsvByteOrderMark = given.CsvBom || (project?.CsvByteOrderMark ?? false),
            Root = given.Root,
        };
    }

    /// <summary>
    /// Stops the run before any brief: prints the messages, logs them (one run line per output folder), exit 2.
    /// </summary>
    private static int Refuse(
        BuildLog? log,
        string stage,
        IEnumerable<string> logDirs,
        TextWriter error,
        params string[] messages)
    {
        foreach (var m in messages) error.WriteLine(m);
        if (log is null) return ExitCodes.InvalidInput; // a plan writes nothing
        var entry = log.RunEntry(stage, messages);
        foreach (var dir in logDirs.Distinct()) BuildLog.Append(dir, entry);
        return ExitCodes.InvalidInput;
    }

    /// <summary>
    /// Where a run's log lines go: the output folder, else an 'out' folder beside each scenario (or in each folder
    /// named).
    /// </summary>
    private static IEnumerable<string> LogDirs(
        IEnumerable<string> paths,
        string? outDir,
        ProjectSettings? project,
        bool expanded = false)
    {
        if ((outDir ?? project?.Out) is { } o) return [o];
        return paths.Where(p => p != "-" && p != ScenarioInputs.StdinName)
            .Select(p => !expanded && Directory.Exists(p)
                ? Path.Combine(p, "out")
                : File.Exists(p) ? Path.Combine(Path.GetDirectoryName(p) ?? ".", "out") : null)
            .OfType<string>().Distinct().ToList();
    }

    /// <summary>
    /// A usage error of <c>build</c> is logged too, where its output folder can be told from the words given.
    /// </summary>
    public static void LogUsageError(string[] args, string message, CliIo io)
    {
        string? outDir = null, shardText = null;
        var paths = new List<string>();
        for (int i = 1; i < args.Length; i++)
        {
            string a = args[i];
            if ((a is "-o" or "--out" or "--shard") && i + 1 < args.Length)
            {
                if (a == "--shard") shardText = args[++i];
                else outDir = args[++i];
            }
            else if (a.StartsWith("--out=", StringComparison.Ordinal)) outDir = a["--out=".Length..];
            else if (!a.StartsWith('-') && (Directory.Exists(a) || File.Exists(a))) paths.Add(a);
        }
        ProjectSettings? project = null;
        if (outDir is null && paths.Count > 0 && ProjectSettings.Find(paths[0]) is { } found)
            project = ProjectSettings.Load(found, new FileSourceReader()).Settings;
        var log = new BuildLog(io.Clock, shardText);
        var entry = log.RunEntry("usage", [message]);
        foreach (var dir in LogDirs(paths, outDir, project)) BuildLog.Append(dir, entry);
    }

    public static IReadOnlyList<BriefOutcome> Run(
        IReadOnlyList<string> files,
        BatchSettings settings,
        int jobs,
        Progress progress,
        TextWriter error,
        BuildLog? log = null)
    {
        log ??= new BuildLog(TimeProvider.System, null);
        string DirOf(string f) => settings.OutDir ?? Path.Combine(Path.GetDirectoryName(f) ?? ".", "out");
        var outcomes = new BriefOutcome[files.Count];
        var parallel = new ParallelOptions { MaxDegreeOfParallelism = Math.Max(1, jobs) };
        // Every scenario is read first: ids must be unique within the batch before anything is written.
        var loaded = new LoadResult?[files.Count];
        var reader = new FileSourceReader();
        Parallel.For(0, files.Count, parallel,
            i => loaded[i] = new ScenarioLoader(reader, settings.Root).Load(files[i]));
        var duplicates = ScenarioInputs.DuplicateIds(files.Select((f, i) => (f, loaded[i]!)).ToList(), reader);
        settings = settings with { Options = Speed.ForBatch(settings.Options, jobs, files.Count) };
        Parallel.For(0, files.Count, parallel, i =>
        {
            // A signal stops the build between briefs: those in progress finish, the others are not started.
            outcomes[i] = StopSignal.Token.IsCancellationRequested
                ? new BriefOutcome(
                    files[i], loaded[i]?.Document?.Brief.Id, OutcomeStatus.Stopped, null, null, 0, 0, 0,
                    "not started: the build was stopped by a signal")
                : duplicates.TryGetValue(files[i], out var duplicate)
                    ? Duplicate(files[i], loaded[i]!, duplicate, error)
                    : BatchBuilder.BuildOne(files[i], settings, error, loaded[i], StopSignal.Token);
            loaded[i] = null; // a batch of thousands keeps only the scenarios still to build
            log.Append(DirOf(files[i]), outcomes[i]);
            progress.Done(outcomes[i]);
        });
        progress.Finish();
        return outcomes;
    }

    private static BriefOutcome Duplicate(
        string file,
        LoadResult loaded,
        Scenario.Diagnostics.Diagnostic problem,
        TextWriter error)
    {
        lock (error)
        {
            error.WriteLine(loaded.Sources.Render(problem));
            error.WriteLine($"{file}: 1 problem; nothing written.");
        }
        return new BriefOutcome(
            file, loaded.Document!.Brief.Id, OutcomeStatus.Invalid, null, null, 0, 0, 0,
            "brief.id is not unique within the batch")
        {
            Messages = [problem.Message],
        };
    }

    public static string Summary(IReadOnlyList<BriefOutcome> outcomes)
    {
        var sb = new StringBuilder();
        sb.AppendLine();
        var rows = outcomes.Select(o => new[]
        {
            o.Id ?? Path.GetFileName(o.Scenario), o.Status.ToString().ToLowerInvariant(),
            o.Edition?.ToString(CultureInfo.InvariantCulture) ?? "",
            o.Pages > 0 ? o.Pages.ToString(CultureInfo.InvariantCulture) : "",
            o.Bytes > 0 ? $"{o.Bytes / 1024} KB" : "", $"{o.Milliseconds} ms",
            o.Formats ?? "",
        }).Prepend(new[] { "brief", "status", "edition", "pages", "size", "time", "formats" }).ToList();
        int[] w = Enumerable.Range(0, 7).Select(c => rows.Max(r => r[c].Length)).ToArray();
        foreach (var r in rows)
            sb.AppendLine(string.Join("  ",
                r.Select((cell, c) => c is 0 or 6 ? cell.PadRight(w[c]) : cell.PadLeft(w[c]))).TrimEnd());
        var counts = outcomes.GroupBy(o => o.Status).OrderBy(g => g.Key)
            .Select(g => $"{g.Count()} {g.Key.ToString().ToLowerInvariant()}");
        sb.AppendLine($"{outcomes.Count} brief(s): {string.Join(", ", counts)}.");
        return sb.ToString();
    }
}
