using System.Diagnostics;
using System.Text;
using Briefwright.Brief;
using Briefwright.Brief.Annex;
using Briefwright.Brief.Editions;
using Briefwright.Brief.Formats;
using Briefwright.Cli.Commands;
using Briefwright.Composer;
using Briefwright.Composer.Drawing;
using Briefwright.Scenario;
using Briefwright.Templating;

namespace Briefwright.Cli.Batch;

/// <summary>Settings of one <c>build</c> run.</summary>
public sealed record BatchSettings(
    BriefTemplate Template,
    BuildOptions Options,
    string ThemeHash,
    string? OutDir,
    DateOnly? Date,
    bool Force,
    bool AnnexImages)
{
    /// <summary>Flush the brief, its results and its manifest to the disk before renaming them into place.</summary>
    public bool Durable { get; init; } = true;

    /// <summary>
    /// Start each CSV file with a UTF-8 byte order mark, so spreadsheet programs read "–", "β₁" and "δ" right.
    /// </summary>
    public bool CsvByteOrderMark { get; init; }

    /// <summary>
    /// The project folder (--root) that files named by scenarios must stay inside; null: each scenario's folder.
    /// </summary>
    public string? Root { get; init; }

    /// <summary>The scenario with the date given to the run (<c>--date</c> or the project's) in place of
    /// <c>brief.date</c>; unchanged when none was given.</summary>
    public ScenarioDocument Dated(ScenarioDocument scenario) =>
        Date is { } d ? scenario with { Brief = scenario.Brief with { Date = d } } : scenario;
}

/// <summary>
/// Builds one brief with editions and nothing lost: the planner (<see cref="EditionPlanner"/>) decides from the inputs'
/// fingerprint and what the folder holds whether to skip it, rebuild the same edition or start a new one; under the
/// brief's lock, <see cref="EditionTransaction"/> stages the new edition, archives the previous one and switches.
/// </summary>
public static class BatchBuilder
{
    /// <summary>SHA-256 of the four bundled font files, one after the other (an input of every brief).</summary>
    internal static readonly Lazy<string> FontsHash = new(() =>
    {
        var styles = new[]
        {
            Composer.Document.RunStyle.Regular, Composer.Document.RunStyle.Bold, Composer.Document.RunStyle.Italic,
            Composer.Document.RunStyle.BoldItalic,
        };
        return Sha256Hex.OfAll(styles.Select(BundledFonts.Bytes));
    });

    /// <param name="loadedBefore">The scenario as the batch already loaded it (to compare ids); read here when
    /// null.</param>
    public static BriefOutcome BuildOne(
        string file,
        BatchSettings settings,
        TextWriter error,
        LoadResult? loadedBefore = null,
        CancellationToken stop = default)
    {
        var watch = Stopwatch.StartNew();
        var loaded = loadedBefore ?? new ScenarioLoader(new FileSourceReader(), settings.Root).Load(file);
        if (!loaded.Ok) return Invalid(file, loaded, error, watch);
        var one = new OneBrief(file, loaded, settings.Dated(loaded.Document!), DirOf(file, settings), settings, error,
            watch);
        try
        {
            Directory.CreateDirectory(one.Dir);
            var (inputs, outputs, request) = Request(one.Scenario, settings);
            one.Hash = request.Fingerprint;
            var folder = new EditionFolder(one.Dir, one.Id);
            // Unchanged briefs are skipped without taking the lock (only reads; the manifest is switched last), unless
            // the temporary folder exists: then a build is running or was interrupted, and the locked path sees to it.
            if (!settings.Force && !Directory.Exists(folder.TempDir))
            {
                var (known, quick) = folder.Read(full: false);
                var early = EditionPlanner.Plan(request, quick);
                if (early is EditionPlan.Skip unchanged) return one.Skipped(unchanged.Edition, known!.Stem);
                if (early is EditionPlan.Refuse refused) return one.Refused(refused);
            }

            using var held = BriefLock.Acquire(folder.TempDir, one.Id,
                message => { lock (error) error.WriteLine($"{file}: {message}"); }, stop);
            FaultSeam.After(one.Id, "locked");
            one.Recovered = EditionTransaction.Recover(folder, held);
            return BuildLocked(one, folder, held, inputs, outputs, request);
        }
        catch (OperationCanceledException) when (stop.IsCancellationRequested)
        {
            return new BriefOutcome(file, one.Id, OutcomeStatus.Stopped, null, null, 0, 0, watch.ElapsedMilliseconds,
                "stopped by a signal before it was started; nothing was replaced") { Recovered = one.Recovered };
        }
        catch (Exception ex)
        {
            // Whatever went wrong, this brief fails alone: the others in the batch are still built,
            // nothing is half-written.
            var failure = StageErrors.Describe(ex, file, one.Dir, settings.Template);
            lock (error) foreach (var line in failure.Lines) error.WriteLine(line);
            return new BriefOutcome(file, one.Id, failure.Status, null, null, 0, 0, watch.ElapsedMilliseconds,
                failure.Summary)
            {
                Recovered = one.Recovered, InputHash = one.Hash, Messages = failure.FirstLines,
            };
        }
    }

    /// <summary>One brief on its way through <see cref="BuildOne"/>: what it is, where it goes, and what is known of it
    /// so far (its fingerprint, what was recovered), for its outcome.</summary>
    private sealed class OneBrief(string file, LoadResult loaded, ScenarioDocument scenario, string dir,
        BatchSettings settings, TextWriter error, Stopwatch watch)
    {
        public string File => file;
        public ScenarioDocument Scenario => scenario;
        public string Id => scenario.Brief.Id;
        public string Dir => dir;
        public BatchSettings Settings => settings;
        public long Milliseconds => watch.ElapsedMilliseconds;
        public string FormatNames { get; } = OutputFormats.Describe(settings.Options.Formats, " ");
        public string? Hash { get; set; }
        public string? Recovered { get; set; }

        public BriefOutcome Skipped(int edition, string stem) =>
            new(file, Id, OutcomeStatus.Skipped, edition, Path.Combine(dir, stem + ".pdf"), 0, 0, Milliseconds, null)
            {
                Recovered = Recovered, InputHash = Hash, Formats = FormatNames,
            };

        public BriefOutcome Refused(EditionPlan.Refuse refuse) =>
            BatchBuilder.Refused(file, loaded, scenario, refuse, dir, Hash, error, watch)
                with { Recovered = Recovered };
    }

    /// <summary>A scenario with problems: they are printed, nothing is written.</summary>
    private static BriefOutcome Invalid(string file, LoadResult loaded, TextWriter error, Stopwatch watch)
    {
        var errors = new StringWriter();
        ScenarioInputs.Report(file, loaded, errors);
        lock (error) error.Write(errors.ToString());
        return new BriefOutcome(file, null, OutcomeStatus.Invalid, null, null, 0, 0, watch.ElapsedMilliseconds,
            $"{loaded.Problems.Count} problem(s) in the scenario")
        {
            Messages = loaded.Problems.Select(p => p.Message).ToList(),
        };
    }

    /// <summary>Under the brief's lock: plans again on the folder as it is now, then builds the edition planned and
    /// switches it in (<see cref="EditionTransaction"/>), or skips or refuses it.</summary>
    private static BriefOutcome BuildLocked(OneBrief one, EditionFolder folder, BriefLock held,
        SortedDictionary<string, string> inputs, SortedDictionary<string, string> outputs, EditionRequest request)
    {
        var (current, state) = folder.Read(full: true);
        // Formats switched on or off are not an input of the edition: the same edition is rebuilt with the formats
        // asked for.
        var plan = EditionPlanner.Plan(request, state);
        if (plan is EditionPlan.Skip skip) return one.Skipped(skip.Edition, current!.Stem);
        if (plan is EditionPlan.Refuse refuse) return one.Refused(refuse);
        var build = (EditionPlan.Build)plan;

        // Only the tool changed among what defines an edition: the results decide whether this is a new edition.
        SolvedScenario? solved = null;
        if (build.ResultsDecide)
        {
            solved = ScenarioSolver.Solve(one.Scenario, one.Settings.Options.ModelThreads);
            build = EditionPlanner.Settle(build, request, state, ResultsDiffer(solved, one.Dir, build.CompareWith));
        }

        Speed.WarmUp(); // this brief will be built: let the output libraries start up while its model runs
        var brief = Make(one, build, solved);
        var files = FilesOf(brief, one.Settings);
        var manifest = new Manifest(one.Id, brief.FileStem, build.Edition, request.Fingerprint, inputs,
            files.Select(f => f.Item1).ToList())
        {
            Outputs = outputs, RequestedEdition = Math.Max(1, request.RequestedEdition),
            Sizes = files.ToDictionary(f => f.Item1, f => (long)f.Item2.Length),
            Sha256 = files.ToDictionary(f => f.Item1, f => EditionFolder.Sha256(f.Item2)),
        };
        build = EditionPlanner.KeepReplaced(build, state, current?.Sha256, manifest.Sha256!);
        string? archived = EditionTransaction.Execute(folder, held, build, current, state, files, manifest,
            one.Settings.Durable);
        string pdf = Path.Combine(one.Dir, brief.FileStem + ".pdf");
        return new BriefOutcome(one.File, one.Id, OutcomeStatus.Built, build.Edition, pdf, brief.PageCount,
            brief.Pdf.Length, one.Milliseconds, null)
        {
            Recovered = one.Recovered, InputHash = one.Hash, Formats = one.FormatNames,
            Archived = archived is null ? null : Path.GetRelativePath(one.Dir, archived),
        };
    }

    /// <summary>The brief of the edition planned, compared with the one it replaces when it is a new edition (the
    /// model solved once: <paramref name="solved"/> is reused when the results already had to be known).</summary>
    private static BuiltBrief Make(OneBrief one, EditionPlan.Build build, SolvedScenario? solved)
    {
        var scenario = one.Scenario with { Brief = one.Scenario.Brief with { Edition = build.Edition } };
        EditionSnapshot? before = null;
        if (build.NewEdition && build.CompareWith is { } previousJson)
            try { before = EditionSnapshot.FromJson(File.ReadAllText(Path.Combine(one.Dir, previousJson))); }
            catch (Exception ex) when (ex is System.Text.Json.JsonException or KeyNotFoundException
                                           or InvalidOperationException) { } // no comparison from a damaged file

        var settings = one.Settings;
        var options = settings.Options with
        {
            PreviousEdition = before, ChartImages = settings.AnnexImages, EditionCauses = build.Changed,
        };
        return solved is null
            ? BriefBuilder.Build(scenario, settings.Template, options)
            : BriefBuilder.Compose(solved with { Scenario = scenario }, settings.Template, options);
    }

    /// <summary>Every file of a brief, by name: its annex (CSV files with a byte order mark when asked for), other
    /// formats, results and the PDF last.</summary>
    private static List<(string, byte[])> FilesOf(BuiltBrief brief, BatchSettings settings) =>
        brief.Annex.Select(a => ($"{brief.FileStem}.{a.Suffix}",
                settings.CsvByteOrderMark && a.Suffix.EndsWith(".csv", StringComparison.Ordinal)
                    ? [0xEF, 0xBB, 0xBF, .. a.Bytes] : a.Bytes))
            .Concat(brief.Formats.Select(f => ($"{brief.FileStem}.{f.Suffix}", f.Bytes)))
            .Append((brief.FileStem + ".results.json", Encoding.UTF8.GetBytes(brief.ResultsJson)))
            .Append((brief.FileStem + ".pdf", brief.Pdf)).ToList();

    /// <summary>The output folder of one scenario: the one named, else an <c>out</c> folder beside it.</summary>
    public static string DirOf(string file, BatchSettings settings) =>
        settings.OutDir ?? Path.Combine(Path.GetDirectoryName(file) ?? ".", "out");

    /// <summary>
    /// What the brief depends on, by name: <c>inputs</c> (what its bytes are made from: the scenario's text and
    /// content, template, theme, fonts, tool, date) and <c>outputs</c> (the output switches: which files are written).
    /// A further output format or switch goes into <c>outputs</c>, never <c>inputs</c>, so that it never makes an
    /// edition.
    /// </summary>
    public static (SortedDictionary<string, string> Inputs, SortedDictionary<string, string> Outputs,
        EditionRequest Request) Request(ScenarioDocument scenario, BatchSettings settings)
    {
        var inputs = new SortedDictionary<string, string>(StringComparer.Ordinal)
        {
            [EditionInput.ScenarioText] = scenario.InputHash,
            [EditionInput.Content] = scenario.ContentHash,
            [EditionInput.Template] = settings.Template.Hash,
            ["theme"] = settings.ThemeHash,
            ["fonts"] = FontsHash.Value,
            [EditionInput.Tool] = ToolInfo.Version,
            [EditionInput.Date] = scenario.Brief.Date
                .ToString("yyyy-MM-dd", System.Globalization.CultureInfo.InvariantCulture),
        };
        var outputs = new SortedDictionary<string, string>(StringComparer.Ordinal)
        {
            ["chart_copies"] = settings.AnnexImages ? "yes" : "no",
            ["csv_byte_order_mark"] = settings.CsvByteOrderMark ? "yes" : "no",
            ["formats"] = OutputFormats.Describe(settings.Options.Formats, ","),
        };
        string hash = Sha256Hex.Of(string.Join("\n", inputs.Select(kv => $"{kv.Key}={kv.Value}")
            .Concat(outputs.Select(kv => $"{EditionInput.OutputPrefix}{kv.Key}={kv.Value}"))));
        return (inputs, outputs,
            new EditionRequest(hash, scenario.Brief.Edition, settings.Force) { Inputs = inputs, Outputs = outputs });
    }

    /// <summary>Whether the solved brief's assumptions as shown or headline results differ from the current edition's
    /// results file; true when that file cannot be read (the change cannot be ruled out).</summary>
    internal static bool ResultsDiffer(SolvedScenario solved, string dir, string? previousJson)
    {
        if (previousJson is null) return true;
        try { return BriefBuilder.ResultsDiffer(solved, File.ReadAllText(Path.Combine(dir, previousJson))); }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException or System.Text.Json.JsonException
            or KeyNotFoundException or InvalidOperationException) { return true; }
    }

    /// <summary>
    /// <c>brief.edition</c> below an edition already issued: a positioned error, nothing written for the brief.
    /// </summary>
    private static BriefOutcome Refused(
        string file,
        LoadResult loaded,
        ScenarioDocument scenario,
        EditionPlan.Refuse refuse,
        string dir,
        string? hash,
        TextWriter error,
        Stopwatch watch)
    {
        var problem = RefusalOf(file, scenario, refuse, dir);
        lock (error)
        {
            error.WriteLine(loaded.Sources.Render(problem));
            error.WriteLine($"{file}: 1 problem; nothing written.");
        }
        return new BriefOutcome(
            file, scenario.Brief.Id, OutcomeStatus.Invalid, null, null, 0, 0, watch.ElapsedMilliseconds,
            "brief.edition is below an edition already issued")
        {
            InputHash = hash, Messages = [problem.Message],
        };
    }

    internal static Scenario.Diagnostics.Diagnostic RefusalOf(
        string file,
        ScenarioDocument scenario,
        EditionPlan.Refuse refuse,
        string dir) =>
        new(scenario.EditionAt ?? new Scenario.Diagnostics.SourceSpan(file, 1, 1), "brief.edition",
            $"must not be below edition {refuse.Issued}, already issued in {dir}; remove it, or give at least " +
            $"{refuse.Issued + 1} to start a new edition",
            $"'{refuse.Requested}'");
}
