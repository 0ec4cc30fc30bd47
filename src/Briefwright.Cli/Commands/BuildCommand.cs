using System.CommandLine;
using System.Diagnostics;
using System.Globalization;
using System.Text;
using Briefwright.Brief;
using Briefwright.Composer;
using Briefwright.Scenario;
using Briefwright.Templating;

namespace Briefwright.Cli.Commands;

/// <summary><c>build PATH...</c>: scenario + template → dated PDF brief and its results data.</summary>
public static class BuildCommand
{
    public static Command Create(TextWriter output, TextWriter error)
    {
        var paths = new Argument<string[]>("paths")
        {
            Description = "Scenario files, or folders whose *.yaml files are all built.",
            Arity = ArgumentArity.OneOrMore,
        };
        var template = new Option<string?>("--template", "-t")
        {
            Description = "Template file (Scriban producing CommonMark). Default: the standard brief; copy templates/standard-brief.md to start your own.",
        };
        var outDir = new Option<string?>("--out", "-o")
        {
            Description = "Folder for the briefs. Default: an 'out' folder beside each scenario. Files are named <id>-<date>.pdf and <id>-<date>.results.json.",
        };
        var date = new Option<string?>("--date")
        {
            Description = "Date of the brief (YYYY-MM-DD), replacing the scenario's brief.date. The clock is never used, so rebuilds are identical.",
        };
        var quiet = new Option<bool>("--quiet", "-q") { Description = "Print nothing but errors." };
        var command = new Command("build", "Build PDF briefs from scenarios: the model, charts and template text composed into a dated, tagged PDF, with the results as JSON beside it.")
        {
            paths, template, outDir, date, quiet,
        };
        command.SetAction(parse =>
        {
            BriefTemplate tpl;
            try
            {
                tpl = LoadTemplate(parse.GetValue(template));
            }
            catch (TemplateException ex)
            {
                foreach (var e in ex.Errors) error.WriteLine(e);
                return ExitCodes.InvalidInput;
            }
            catch (IOException ex)
            {
                error.WriteLine($"{parse.GetValue(template)}: cannot read the template ({ex.Message}).");
                return ExitCodes.InvalidInput;
            }
            DateOnly? dateOverride = null;
            if (parse.GetValue(date) is { } d)
            {
                if (!DateOnly.TryParseExact(d, "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out var parsed))
                {
                    error.WriteLine($"--date: must be a date written YYYY-MM-DD. Got '{d}'.");
                    return ExitCodes.InvalidInput;
                }
                dateOverride = parsed;
            }
            bool beQuiet = parse.GetValue(quiet);
            int code = ExitCodes.Ok;
            foreach (var file in ScenarioInputs.Expand(parse.GetValue(paths)!, error))
            {
                int one = BuildOne(file, tpl, parse.GetValue(outDir), dateOverride, beQuiet ? TextWriter.Null : output, error);
                code = Math.Max(code, one == ExitCodes.Failed ? ExitCodes.Failed : one);
            }
            return code;
        });
        return command;
    }

    private static BriefTemplate LoadTemplate(string? path) =>
        path is null ? StandardTemplate.Template : BriefTemplate.Parse(File.ReadAllText(path), path);

    private static int BuildOne(string file, BriefTemplate template, string? outDir, DateOnly? date, TextWriter output, TextWriter error)
    {
        var watch = Stopwatch.StartNew();
        var loaded = ScenarioInputs.Load(file, error);
        if (!loaded.Ok) return ExitCodes.InvalidInput;
        var scenario = loaded.Document!;
        if (date is { } d) scenario = scenario with { Brief = scenario.Brief with { Date = d } };
        try
        {
            var brief = BriefBuilder.Build(scenario, template);
            string dir = outDir ?? Path.Combine(Path.GetDirectoryName(file) ?? ".", "out");
            Directory.CreateDirectory(dir);
            string pdfPath = Path.Combine(dir, brief.FileStem + ".pdf");
            AtomicFile.Write(Path.Combine(dir, brief.FileStem + ".results.json"), Encoding.UTF8.GetBytes(brief.ResultsJson));
            AtomicFile.Write(pdfPath, brief.Pdf);
            output.WriteLine($"{file}: built {pdfPath} ({brief.PageCount} pages, {brief.Pdf.Length / 1024} KB, {watch.ElapsedMilliseconds} ms)");
            return ExitCodes.Ok;
        }
        catch (TemplateException ex)
        {
            foreach (var e in ex.Errors) error.WriteLine(e);
            error.WriteLine($"{file}: template error; nothing written.");
            return ExitCodes.InvalidInput;
        }
        catch (ComposeException ex)
        {
            error.WriteLine($"{template.Path}: {ex.Message}");
            error.WriteLine($"{file}: the filled template cannot be laid out; nothing written.");
            return ExitCodes.InvalidInput;
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            error.WriteLine($"{file}: cannot write the brief ({ex.Message}); previous files are untouched.");
            return ExitCodes.Failed;
        }
    }
}
