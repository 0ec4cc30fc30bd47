using System.CommandLine;
using System.Globalization;
using System.Text;
using Briefwright.Brief;
using Briefwright.Cli.Batch;
using Briefwright.Scenario;
using Briefwright.Templating;

namespace Briefwright.Cli.Commands;

/// <summary><c>build PATH...</c>: scenarios + template → dated PDF briefs with their data annex, in parallel, incrementally.</summary>
public static class BuildCommand
{
    public static Command Create(TextWriter output, TextWriter error, bool interactive)
    {
        var paths = ScenarioInputs.PathsArgument("built");
        var template = new Option<string?>("--template", "-t") { Description = "Template file (Scriban producing CommonMark). Default: the standard brief; copy templates/standard-brief.md to start your own." };
        var theme = new Option<string?>("--theme") { Description = "Theme file (YAML): organisation name, paper size (A4 or US Letter), colours, footer text, logo, fonts. See docs/themes.md." };
        var outDir = new Option<string?>("--out", "-o") { Description = "Folder for the briefs. Default: an 'out' folder beside each scenario." };
        var date = new Option<string?>("--date") { Description = "Date of the brief (YYYY-MM-DD), replacing brief.date. The clock is never used, so rebuilds are identical." };
        var force = new Option<bool>("--force", "-f") { Description = "Rebuild even when nothing a brief depends on has changed." };
        var shard = new Option<string?>("--shard") { Description = "Build only shard K of N (written K/N), for job arrays: shards are disjoint and together cover the list." };
        var jobs = new Option<int?>("--jobs", "-j") { Description = "Briefs built at once (default: one per core)." };
        var noImages = new Option<bool>("--no-chart-images") { Description = "Skip the SVG and PNG copies of each chart in the data annex (faster)." };
        var noSync = new Option<bool>("--no-sync") { Description = "Do not flush each brief to the disk before renaming it into place: faster on slow disks; a kill still cannot leave half a file, but a power cut might leave an empty one." };
        var quiet = new Option<bool>("--quiet", "-q") { Description = "Print nothing but errors." };
        var command = new Command("build",
            "Build PDF briefs: model, charts and template text composed into a dated, tagged PDF, with the results JSON, CSV tables and " +
            "chart images beside it. Unchanged briefs are skipped; a changed brief becomes a new edition and the previous one is archived.")
        {
            paths, template, theme, outDir, date, force, shard, jobs, noImages, noSync, quiet,
        };
        command.SetAction(parse =>
        {
            var setup = Setup(parse.GetValue(template), parse.GetValue(theme), parse.GetValue(date), parse.GetValue(shard), error);
            if (setup is null) return ExitCodes.InvalidInput;
            var (tpl, options, themeHash, day, shardSpec) = setup.Value;
            var files = ScenarioInputs.Expand(parse.GetValue(paths)!, error);
            if (shardSpec is { } s) files = Shards.Select(files, s.Index, s.Count);
            var settings = new BatchSettings(tpl, options, themeHash, parse.GetValue(outDir), day, parse.GetValue(force), !parse.GetValue(noImages))
            {
                Durable = !parse.GetValue(noSync),
            };
            var progress = new Progress(parse.GetValue(quiet) ? TextWriter.Null : output, interactive && !parse.GetValue(quiet), files.Count);
            var outcomes = Run(files, settings, parse.GetValue(jobs) ?? Environment.ProcessorCount, progress, error);
            if (!parse.GetValue(quiet)) output.Write(Summary(outcomes));
            if (outcomes.Any(o => o.Status is OutcomeStatus.Failed or OutcomeStatus.Stopped)) return ExitCodes.Failed;
            return outcomes.Any(o => o.Status == OutcomeStatus.Invalid) ? ExitCodes.InvalidInput : ExitCodes.Ok;
        });
        return command;
    }

    /// <summary>
    /// On a spare core, while the command line and the first scenario are read: parses the standard template, hashes
    /// the bundled fonts and reads a sample manifest, so that a single brief built by a fresh process finishes sooner.
    /// The template and the hash are computed once per process either way (the template is parsed even when another is
    /// named: reading the options here would repeat the command-line parser); a failure here surfaces, with its
    /// message, where the value is first used.
    /// </summary>
    public static void HeadStart()
    {
        Task.Run(() =>
        {
            try
            {
                _ = StandardTemplate.Template;
                _ = BatchBuilder.FontsHash.Value;
                Manifest.Parse("""{"id":"a","stem":"a-2000-01-01","edition":1,"hash":"0","inputs":{"tool":"0"},"files":["a.pdf"]}""");
            }
            catch (Exception)
            {
                // Only a head start: the same work is done, and any error reported, where the value is first used.
            }
        });
    }

    public static IReadOnlyList<BriefOutcome> Run(IReadOnlyList<string> files, BatchSettings settings, int jobs, Progress progress, TextWriter error)
    {
        var outcomes = new BriefOutcome[files.Count];
        // Several briefs at once already keep the cores busy; the model's own loops then stay on their brief's thread.
        if (jobs > 1 && files.Count > 1) settings = settings with { Options = settings.Options with { ModelThreads = 1 } };
        Parallel.For(0, files.Count, new ParallelOptions { MaxDegreeOfParallelism = Math.Max(1, jobs) }, i =>
        {
            // A signal stops the build between briefs: those in progress finish, the others are not started.
            outcomes[i] = StopSignal.Token.IsCancellationRequested
                ? new BriefOutcome(files[i], null, OutcomeStatus.Stopped, null, null, 0, 0, 0, "not started: the build was stopped by a signal")
                : BatchBuilder.BuildOne(files[i], settings, error, StopSignal.Token);
            Log(outcomes[i], settings);
            progress.Done(outcomes[i]);
        });
        progress.Finish();
        return outcomes;
    }

    private static readonly object LogGate = new();

    /// <summary>One JSON line per brief, appended to build-log.jsonl in its output folder.</summary>
    private static void Log(BriefOutcome o, BatchSettings settings)
    {
        string dir = settings.OutDir ?? Path.Combine(Path.GetDirectoryName(o.Scenario) ?? ".", "out");
        try
        {
            lock (LogGate)
            {
                Directory.CreateDirectory(dir);
                File.AppendAllText(Path.Combine(dir, "build-log.jsonl"), o.LogLine() + "\n");
            }
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            // The outcome is still reported on the console and in the exit code.
        }
    }

    private static (BriefTemplate, BuildOptions, string, DateOnly?, (int Index, int Count)?)? Setup(string? templatePath, string? themePath, string? dateText, string? shardText, TextWriter error)
    {
        BriefTemplate tpl;
        try
        {
            tpl = templatePath is null ? StandardTemplate.Template : BriefTemplate.Parse(File.ReadAllText(templatePath), templatePath);
        }
        catch (TemplateException ex)
        {
            foreach (var e in ex.Errors) error.WriteLine(e);
            return null;
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            error.WriteLine($"{templatePath}: cannot read the template ({ex.Message}).");
            return null;
        }
        var options = BuildOptions.Default;
        string themeHash = "standard";
        if (themePath is not null)
        {
            var (spec, problems, sources) = ThemeLoader.Load(themePath, new FileSourceReader());
            foreach (var p in problems) error.WriteLine(sources.Render(p));
            if (spec is null) return null;
            options = options with { Theme = spec };
            themeHash = sources.Hash(); // the theme text as read by the loader; no second read
            if (spec.FontPaths.Count > 0)
            {
                var fonts = ThemeFonts.Read(spec.FontPaths, error);
                if (fonts is null) return null;
                options = options with { Fonts = fonts };
                themeHash = BriefBuilder.Sha256(themeHash + string.Concat(new[] { fonts.Value.Regular, fonts.Value.Bold, fonts.Value.Italic, fonts.Value.BoldItalic }
                    .Select(b => Convert.ToHexString(System.Security.Cryptography.SHA256.HashData(b)))));
            }
            if (spec.LogoPath is { } logo)
            {
                var png = Logo.Read(logo, error);
                if (png is null) return null;
                options = options with { Logo = png };
                themeHash = BriefBuilder.Sha256(themeHash + Convert.ToHexString(System.Security.Cryptography.SHA256.HashData(png.Value.Png)));
            }
        }
        DateOnly? day = null;
        if (dateText is not null)
        {
            if (!DateOnly.TryParseExact(dateText, "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out var parsed))
            {
                error.WriteLine($"--date: must be a date written YYYY-MM-DD. Got '{dateText}'.");
                return null;
            }
            day = parsed;
        }
        (int, int)? shard = null;
        if (shardText is not null)
        {
            if (!Shards.TryParse(shardText, out int k, out int n))
            {
                error.WriteLine($"--shard: must be K/N with 1 ≤ K ≤ N, such as 3/16. Got '{shardText}'.");
                return null;
            }
            shard = (k, n);
        }
        return (tpl, options, themeHash, day, shard);
    }

    public static string Summary(IReadOnlyList<BriefOutcome> outcomes)
    {
        var sb = new StringBuilder();
        sb.AppendLine();
        var rows = outcomes.Select(o => new[]
        {
            o.Id ?? Path.GetFileName(o.Scenario), o.Status.ToString().ToLowerInvariant(), o.Edition?.ToString(CultureInfo.InvariantCulture) ?? "",
            o.Pages > 0 ? o.Pages.ToString(CultureInfo.InvariantCulture) : "", o.Bytes > 0 ? $"{o.Bytes / 1024} KB" : "", $"{o.Milliseconds} ms",
        }).Prepend(new[] { "brief", "status", "edition", "pages", "size", "time" }).ToList();
        int[] w = Enumerable.Range(0, 6).Select(c => rows.Max(r => r[c].Length)).ToArray();
        foreach (var r in rows) sb.AppendLine(string.Join("  ", r.Select((cell, c) => c == 0 ? cell.PadRight(w[c]) : cell.PadLeft(w[c]))).TrimEnd());
        var counts = outcomes.GroupBy(o => o.Status).OrderBy(g => g.Key).Select(g => $"{g.Count()} {g.Key.ToString().ToLowerInvariant()}");
        sb.AppendLine($"{outcomes.Count} brief(s): {string.Join(", ", counts)}.");
        return sb.ToString();
    }
}
