using System.CommandLine;
using System.Text;
using Briefwright.Brief;
using Briefwright.Brief.Annex;

namespace Briefwright.Cli.Commands;

/// <summary>
/// <c>diff OLD NEW</c>: changed assumptions and headline results between two scenarios or two results files.
/// </summary>
public static class DiffCommand
{
    public static Command Create(TextWriter output, TextWriter error, TextReader input)
    {
        var reader = new InputReader(input);
        var oldPath = new Argument<string>("old") { Description = "Earlier scenario (.yaml) or results file " +
            "(.results.json); '-' reads a scenario from standard input." };
        var newPath = new Argument<string>("new") { Description = "Later scenario (.yaml) or results file " +
            "(.results.json)." };
        var root = ScenarioInputs.RootOption();
        var command = new Command("diff",
            "Compare two scenarios or two results files: changed assumptions (old → new, with source) and changed " +
            "headline results. Exit code 0 when nothing changed, 1 when something did, 2 on invalid input.")
        {
            oldPath, newPath, root,
        };
        command.SetAction(parse =>
        {
            if (!ScenarioInputs.RootIsValid(parse.GetValue(root), error)) return ExitCodes.InvalidInput;
            var before = Snapshot(parse.GetValue(oldPath)!, parse.GetValue(root), error, reader);
            var after = Snapshot(parse.GetValue(newPath)!, parse.GetValue(root), error, reader);
            if (before is null || after is null) return ExitCodes.InvalidInput;
            var changes = EditionSnapshot.Compare(before, after);
            output.Write(Render(changes));
            return changes.Any ? 1 : ExitCodes.Ok;
        });
        return command;
    }

    /// <summary>Results files read by diff are at most this long.</summary>
    public const long MaxResultsBytes = 64L << 20;

    private static EditionSnapshot? Snapshot(string path, string? root, TextWriter error, InputReader reader)
    {
        if (path == "-") path = ScenarioInputs.StdinName;
        if (path.EndsWith(".json", StringComparison.OrdinalIgnoreCase))
        {
            if (!SafeFile.TryReadBytes(path, null, MaxResultsBytes, out byte[] bytes, out string why))
            {
                error.WriteLine($"{path}: cannot read the results file ({why}).");
                return null;
            }
            try
            {
                return EditionSnapshot.FromJson(SafeFile.Decode(bytes));
            }
            catch (Exception ex) when (ex is IOException or UnauthorizedAccessException
                or System.Text.Json.JsonException or KeyNotFoundException or InvalidOperationException)
            {
                error.WriteLine($"{path}: not a briefwright results file ({ex.Message}).");
                return null;
            }
        }
        var loaded = ScenarioInputs.Load(path, error, reader, root);
        if (!loaded.Ok) return null;
        if (ScenarioInputs.Solve(path, loaded.Document!, error) is not { } solved) return null;
        return EditionSnapshot.FromJson(ResultsJson.Write(ResultsDocument.From(solved)));
    }

    public static string Render(EditionChanges c)
    {
        var sb = new StringBuilder();
        if (!c.Any) return "No assumption or headline result differs.\n";
        if (c.Assumptions.Count > 0)
        {
            sb.AppendLine("Assumptions:");
            foreach (var a in c.Assumptions)
                sb.AppendLine($"  {a.Label} ({a.Key}): {a.Old} → {a.New}" +
                    $"{(a.Detail is null ? "" : $"  [source: {a.Detail}]")}");
        }
        if (c.Results.Count > 0)
        {
            sb.AppendLine("Headline results:");
            foreach (var r in c.Results) sb.AppendLine($"  {r.Label}: {r.Old} → {r.New} ({r.Detail})");
        }
        return sb.ToString();
    }
}
