using System.Diagnostics;
using System.Security.Cryptography;
using System.Text;
using Briefwright.Brief;
using Briefwright.Brief.Annex;
using Briefwright.Brief.Editions;
using Briefwright.Cli.Commands;
using Briefwright.Composer;
using Briefwright.Composer.Drawing;
using Briefwright.Scenario;
using Briefwright.Templating;

namespace Briefwright.Cli.Batch;

/// <summary>Settings of one <c>build</c> run.</summary>
public sealed record BatchSettings(BriefTemplate Template, BuildOptions Options, string ThemeHash, string? OutDir, DateOnly? Date, bool Force, bool AnnexImages)
{
    /// <summary>Flush the brief, its results and its manifest to the disk before renaming them into place.</summary>
    public bool Durable { get; init; } = true;

    /// <summary>Start each CSV file with a UTF-8 byte order mark, so spreadsheet programs read "–", "β₁" and "δ" right.</summary>
    public bool CsvByteOrderMark { get; init; }

    /// <summary>The project folder (--root) that files named by scenarios must stay inside; null: each scenario's folder.</summary>
    public string? Root { get; init; }
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
        using var sha = IncrementalHash.CreateHash(HashAlgorithmName.SHA256);
        foreach (var style in new[] { Composer.Document.RunStyle.Regular, Composer.Document.RunStyle.Bold, Composer.Document.RunStyle.Italic, Composer.Document.RunStyle.BoldItalic })
            sha.AppendData(BundledFonts.Bytes(style));
        return Convert.ToHexStringLower(sha.GetHashAndReset());
    });

    /// <param name="loadedBefore">The scenario as the batch already loaded it (to compare ids); read here when null.</param>
    public static BriefOutcome BuildOne(string file, BatchSettings settings, TextWriter error, LoadResult? loadedBefore = null, CancellationToken stop = default)
    {
        string? recovered = null;
        var watch = Stopwatch.StartNew();
        var loaded = loadedBefore ?? new ScenarioLoader(new FileSourceReader(), settings.Root).Load(file);
        if (!loaded.Ok)
        {
            var errors = new StringWriter();
            ScenarioInputs.Report(file, loaded, errors);
            lock (error) error.Write(errors.ToString());
            return new BriefOutcome(file, null, OutcomeStatus.Invalid, null, null, 0, 0, watch.ElapsedMilliseconds, $"{loaded.Problems.Count} problem(s) in the scenario")
            {
                Messages = loaded.Problems.Select(p => p.Message).ToList(),
            };
        }
        var scenario = loaded.Document!;
        if (settings.Date is { } d) scenario = scenario with { Brief = scenario.Brief with { Date = d } };
        string id = scenario.Brief.Id;
        string dir = settings.OutDir ?? Path.Combine(Path.GetDirectoryName(file) ?? ".", "out");
        string? hash = null;
        try
        {
            Directory.CreateDirectory(dir);
            var inputs = new SortedDictionary<string, string>(StringComparer.Ordinal)
            {
                ["scenario"] = scenario.InputHash,
                ["template"] = settings.Template.Hash,
                ["theme"] = settings.ThemeHash,
                ["fonts"] = FontsHash.Value,
                ["tool"] = ToolInfo.Version,
                ["date"] = scenario.Brief.Date.ToString("yyyy-MM-dd"),
                ["annex_images"] = settings.AnnexImages ? "yes" : "no",
            };
            if (settings.CsvByteOrderMark) inputs["csv_bom"] = "yes";
            hash = BriefBuilder.Sha256(string.Join("\n", inputs.Select(kv => $"{kv.Key}={kv.Value}")));
            var folder = new EditionFolder(dir, id);
            var request = new EditionRequest(hash, scenario.Brief.Edition, settings.Force);
            // Unchanged briefs are skipped without taking the lock (only reads; the manifest is switched last), unless the
            // temporary folder exists: then a build is running or was interrupted, and the locked path sees to it.
            if (!settings.Force && !Directory.Exists(folder.TempDir))
            {
                var (known, quick) = folder.Read(full: false);
                if (EditionPlanner.Plan(request, quick) is EditionPlan.Skip unchanged)
                    return new BriefOutcome(file, id, OutcomeStatus.Skipped, unchanged.Edition, Path.Combine(dir, known!.Stem + ".pdf"), 0, 0, watch.ElapsedMilliseconds, null) { InputHash = hash };
            }

            using var held = BriefLock.Acquire(folder.TempDir, id, message => { lock (error) error.WriteLine($"{file}: {message}"); }, stop);
            FaultSeam.After(id, "locked");
            recovered = EditionTransaction.Recover(folder, held);
            var (current, state) = folder.Read(full: true);
            var plan = EditionPlanner.Plan(request, state);
            if (plan is EditionPlan.Skip skip)
                return new BriefOutcome(file, id, OutcomeStatus.Skipped, skip.Edition, Path.Combine(dir, current!.Stem + ".pdf"), 0, 0, watch.ElapsedMilliseconds, null) { Recovered = recovered, InputHash = hash };
            var build = (EditionPlan.Build)plan;

            WarmUp.Start(); // this brief will be built: let the output libraries start up while its model runs
            scenario = scenario with { Brief = scenario.Brief with { Edition = build.Edition } };
            EditionSnapshot? before = null;
            if (build.NewEdition && build.CompareWith is { } previousJson)
                try { before = EditionSnapshot.FromJson(File.ReadAllText(Path.Combine(dir, previousJson))); }
                catch (Exception ex) when (ex is System.Text.Json.JsonException or KeyNotFoundException or InvalidOperationException) { } // no comparison from a damaged file

            var brief = BriefBuilder.Build(scenario, settings.Template, settings.Options with { PreviousEdition = before, ChartImages = settings.AnnexImages });
            var files = brief.Annex.Select(a => ($"{brief.FileStem}.{a.Suffix}",
                    settings.CsvByteOrderMark && a.Suffix.EndsWith(".csv", StringComparison.Ordinal) ? [0xEF, 0xBB, 0xBF, .. a.Bytes] : a.Bytes))
                .Append((brief.FileStem + ".results.json", Encoding.UTF8.GetBytes(brief.ResultsJson)))
                .Append((brief.FileStem + ".pdf", brief.Pdf)).ToList();
            var manifest = new Manifest(id, brief.FileStem, build.Edition, hash, inputs, files.Select(f => f.Item1).ToList())
            {
                Sizes = files.ToDictionary(f => f.Item1, f => (long)f.Item2.Length),
                Sha256 = files.ToDictionary(f => f.Item1, f => EditionFolder.Sha256(f.Item2)),
            };
            string? archived = EditionTransaction.Execute(folder, held, build, current, state, files, manifest, settings.Durable);
            string pdf = Path.Combine(dir, brief.FileStem + ".pdf");
            return new BriefOutcome(file, id, OutcomeStatus.Built, build.Edition, pdf, brief.PageCount, brief.Pdf.Length, watch.ElapsedMilliseconds, null)
            {
                Recovered = recovered, InputHash = hash,
                Archived = archived is null ? null : Path.GetRelativePath(dir, archived),
            };
        }
        catch (TemplateException ex)
        {
            lock (error) foreach (var e in ex.Errors) error.WriteLine(e);
            return new BriefOutcome(file, id, OutcomeStatus.Invalid, null, null, 0, 0, watch.ElapsedMilliseconds, "template error")
            {
                InputHash = hash, Messages = ex.Errors.Select(e => e.ToString().Split('\n')[0]).ToList(),
            };
        }
        catch (BriefTextException ex)
        {
            lock (error) foreach (var e in ex.Errors) error.WriteLine(e);
            return new BriefOutcome(file, id, OutcomeStatus.Invalid, null, null, 0, 0, watch.ElapsedMilliseconds, "text the brief cannot show")
            {
                InputHash = hash, Messages = ex.Errors.ToList(),
            };
        }
        catch (UnsolvableScenarioException ex)
        {
            lock (error) error.WriteLine(ScenarioInputs.Unsolvable(file, ex));
            return new BriefOutcome(file, id, OutcomeStatus.Invalid, null, null, 0, 0, watch.ElapsedMilliseconds, ex.Message);
        }
        catch (ComposeException ex)
        {
            string message = $"{Position(settings.Template, ex)}: {ex.Message}";
            lock (error) error.WriteLine(message);
            return new BriefOutcome(file, id, OutcomeStatus.Invalid, null, null, 0, 0, watch.ElapsedMilliseconds, ex.Message) { InputHash = hash, Messages = [message] };
        }
        catch (OperationCanceledException) when (stop.IsCancellationRequested)
        {
            return new BriefOutcome(file, id, OutcomeStatus.Stopped, null, null, 0, 0, watch.ElapsedMilliseconds, "stopped by a signal before it was started; nothing was replaced") { Recovered = recovered };
        }
        catch (EditionWriteException ex)
        {
            lock (error) error.WriteLine($"{file}: cannot write the brief to {dir}: {ex.Message}.");
            return new BriefOutcome(file, id, OutcomeStatus.Failed, null, null, 0, 0, watch.ElapsedMilliseconds, ex.Message) { Recovered = recovered };
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            // Failed before any staging: the lock, the recovery or the folder itself (a file, read-only, full).
            string message = $"{file}: cannot write the brief to {dir} ({ex.Message}); nothing was replaced: the previous files are untouched.";
            lock (error) error.WriteLine(message);
            return new BriefOutcome(file, id, OutcomeStatus.Failed, null, null, 0, 0, watch.ElapsedMilliseconds, ex.Message) { Recovered = recovered, InputHash = hash, Messages = [message] };
        }
        catch (Exception ex)
        {
            // Whatever went wrong, this brief fails alone: the others in the batch are still built, nothing is half-written.
            string message = $"{file}: {(ex is NonFiniteResultException ? "" : "internal error, please report it: ")}{ex.Message}";
            lock (error) error.WriteLine(message);
            return new BriefOutcome(file, id, OutcomeStatus.Failed, null, null, 0, 0, watch.ElapsedMilliseconds, ex.Message) { InputHash = hash, Messages = [message] };
        }
    }

    /// <summary>Where in the template the offending text was written: found by its text, else the line of the filled text.</summary>
    private static string Position(BriefTemplate template, ComposeException ex)
    {
        var lines = template.Text.Split('\n');
        if (ex.Snippet is { Length: > 0 } snippet)
            for (int i = 0; i < lines.Length; i++)
                if (lines[i].IndexOf(snippet, StringComparison.Ordinal) is int col and >= 0) return $"{template.Path}:{i + 1}:{col + 1}";
        return $"{template.Path}:{Math.Max(1, ex.Line)}:1";
    }

}
