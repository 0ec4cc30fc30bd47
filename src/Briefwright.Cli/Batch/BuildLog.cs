using System.Globalization;
using System.Text.Json;
using System.Text.Json.Serialization;
using Briefwright.Brief;

namespace Briefwright.Cli.Batch;

/// <summary>
/// One line of <c>build-log.jsonl</c>: an attempt to build one brief (<c>kind: brief</c>), or a run stopped before any
/// brief by its command line, settings, theme, template or options (<c>kind: run</c>, with the <c>stage</c>). The time
/// is UTC; it is the only clock time the tool writes anywhere.
/// </summary>
public sealed record BuildLogEntry(
    string Time,
    string ToolVersion,
    string Kind,
    string Status,
    string? Stage,
    string? Scenario,
    string? Id,
    string? Shard,
    string? InputHash,
    int? Edition,
    string? Pdf,
    int? Pages,
    long? Bytes,
    long? Milliseconds,
    string? Error,
    IReadOnlyList<string>? Messages)
{
    /// <summary>What this attempt found left by an interrupted build and put right.</summary>
    public string? Recovered { get; init; }

    /// <summary>
    /// Where the previous edition was kept (relative to the output folder), when this attempt archived it.
    /// </summary>
    public string? Archived { get; init; }
}

/// <summary>Appends build-log lines; the clock is passed in so tests fix the time.</summary>
public sealed class BuildLog(TimeProvider clock, string? shard)
{
    public const string FileName = "build-log.jsonl";

    private static readonly object Gate = new();

    private static readonly JsonSerializerOptions Json = new()
    {
        PropertyNamingPolicy = JsonNamingPolicy.SnakeCaseLower,
        DefaultIgnoreCondition = JsonIgnoreCondition.WhenWritingNull,
        Encoder = System.Text.Encodings.Web.JavaScriptEncoder.UnsafeRelaxedJsonEscaping,
        TypeInfoResolver = BatchJsonContext.Default,
    };

    private static readonly System.Text.Json.Serialization.Metadata.JsonTypeInfo<BuildLogEntry> Info =
        (System.Text.Json.Serialization.Metadata.JsonTypeInfo<BuildLogEntry>)Json.GetTypeInfo(typeof(BuildLogEntry));

    private string Now() =>
        clock.GetUtcNow().UtcDateTime.ToString("yyyy-MM-dd'T'HH:mm:ss.fff'Z'", CultureInfo.InvariantCulture);

    public static string Line(BuildLogEntry entry) => JsonSerializer.Serialize(entry, Info);

    public BuildLogEntry Entry(BriefOutcome o) => new(Now(), ToolInfo.Version, "brief",
        o.Status.ToString().ToLowerInvariant(), null, o.Scenario, o.Id, shard, o.InputHash, o.Edition, o.Pdf,
        o.Status == OutcomeStatus.Built ? o.Pages : null, o.Status == OutcomeStatus.Built ? o.Bytes : null,
        o.Milliseconds, o.Error,
        o.Messages is { Count: > 0 } m ? m : null) { Recovered = o.Recovered, Archived = o.Archived };

    /// <summary>A run stopped before building: usage, settings, theme, template or option errors.</summary>
    public BuildLogEntry RunEntry(string stage, IReadOnlyList<string> messages) =>
        new(Now(), ToolInfo.Version, "run", "invalid", stage, null, null, shard, null, null, null, null, null, null,
            messages.FirstOrDefault(), messages);

    public void Append(string dir, BriefOutcome o) => Append(dir, Entry(o));

    /// <summary>
    /// Appends one line; a log that cannot be written never changes the outcome (it is on the console and in the exit
    /// code).
    /// </summary>
    public static void Append(string dir, BuildLogEntry entry)
    {
        try
        {
            lock (Gate)
            {
                Directory.CreateDirectory(dir);
                File.AppendAllText(Path.Combine(dir, FileName), Line(entry) + "\n");
            }
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
        }
    }
}
