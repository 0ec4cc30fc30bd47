using System.Diagnostics;
using System.Security.Cryptography;
using System.Text;
using Briefwright.Brief;
using Briefwright.Brief.Annex;
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
/// Builds one brief with editions and nothing lost: skips it when its manifest says nothing changed; otherwise
/// raises the edition, keeps the previous edition in <c>archive/&lt;id&gt;/edition-N/</c>, adds the changes section, and
/// writes every file atomically, the manifest last.
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
    public static BriefOutcome BuildOne(string file, BatchSettings settings, TextWriter error, LoadResult? loadedBefore = null)
    {
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
            var previous = Manifest.Read(dir, id);
            if (!settings.Force && previous is not null && previous.Hash == hash && previous.FilesPresent(dir))
                return new BriefOutcome(file, id, OutcomeStatus.Skipped, previous.Edition, Path.Combine(dir, previous.Stem + ".pdf"), 0, 0, watch.ElapsedMilliseconds, null) { InputHash = hash };

            WarmUp.Start(); // this brief will be built: let the output libraries start up while its model runs
            bool newEdition = previous is not null && previous.Hash != hash && previous.FilesPresent(dir);
            int edition = newEdition ? Math.Max(scenario.Brief.Edition, previous!.Edition + 1) : Math.Max(scenario.Brief.Edition, previous?.Edition ?? 0);
            scenario = scenario with { Brief = scenario.Brief with { Edition = edition } };
            EditionSnapshot? before = null;
            string previousJson = previous is null ? "" : Path.Combine(dir, previous.Stem + ".results.json");
            if (newEdition && File.Exists(previousJson)) before = EditionSnapshot.FromJson(File.ReadAllText(previousJson));

            var brief = BriefBuilder.Build(scenario, settings.Template, settings.Options with { PreviousEdition = before, ChartImages = settings.AnnexImages });

            // Nothing on disk has changed so far. Keep the previous edition first, then replace.
            if (newEdition) Archive(dir, previous!);
            var files = new List<string>();
            void Put(string name, byte[] bytes, bool durable = true)
            {
                AtomicFile.Write(Path.Combine(dir, name), bytes, durable && settings.Durable);
                files.Add(name);
            }
            foreach (var a in brief.Annex)
                Put($"{brief.FileStem}.{a.Suffix}", settings.CsvByteOrderMark && a.Suffix.EndsWith(".csv", StringComparison.Ordinal) ? [0xEF, 0xBB, 0xBF, .. a.Bytes] : a.Bytes, durable: false);
            Put(brief.FileStem + ".results.json", Encoding.UTF8.GetBytes(brief.ResultsJson));
            Put(brief.FileStem + ".pdf", brief.Pdf);
            AtomicFile.Write(Manifest.PathFor(dir, id), new Manifest(id, brief.FileStem, edition, hash, inputs, files).ToBytes(), settings.Durable);
            if (previous is not null)
                foreach (var old in previous.Files.Except(files))
                    try { File.Delete(Path.Combine(dir, old)); } catch (IOException) { }
            string pdf = Path.Combine(dir, brief.FileStem + ".pdf");
            return new BriefOutcome(file, id, OutcomeStatus.Built, edition, pdf, brief.PageCount, brief.Pdf.Length, watch.ElapsedMilliseconds, null) { InputHash = hash };
        }
        catch (TemplateException ex)
        {
            lock (error) foreach (var e in ex.Errors) error.WriteLine(e);
            return new BriefOutcome(file, id, OutcomeStatus.Invalid, null, null, 0, 0, watch.ElapsedMilliseconds, "template error")
            {
                InputHash = hash, Messages = ex.Errors.Select(e => e.ToString().Split('\n')[0]).ToList(),
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
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            string message = $"{file}: cannot write the brief to {dir} ({ex.Message}); previous files are untouched.";
            lock (error) error.WriteLine(message);
            return new BriefOutcome(file, id, OutcomeStatus.Failed, null, null, 0, 0, watch.ElapsedMilliseconds, ex.Message) { InputHash = hash, Messages = [message] };
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

    /// <summary>Copies the previous edition's files to archive/&lt;id&gt;/edition-N/ (atomically, before anything is replaced).</summary>
    private static void Archive(string dir, Manifest previous)
    {
        string target = Path.Combine(dir, "archive", previous.Id, $"edition-{previous.Edition}");
        Directory.CreateDirectory(target);
        foreach (var f in previous.Files.Append(Path.GetFileName(Manifest.PathFor(dir, previous.Id))))
        {
            string source = Path.Combine(dir, f);
            if (File.Exists(source)) AtomicFile.Write(Path.Combine(target, f), File.ReadAllBytes(source));
        }
    }
}
