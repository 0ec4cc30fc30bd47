using System.Text;
using System.Text.Json;

namespace Briefwright.Cli.Batch;

/// <summary>
/// What a brief in an output folder was built from: the hashes of every input, the files written with their sizes and
/// SHA-256, and its own hash (<c>check</c>: the SHA-256 of the file with that value left empty). Stored as
/// <c>&lt;id&gt;.manifest.json</c>. A manifest whose check fails, or that names a path outside its folder, is damaged.
/// <c>inputs</c> are what the brief's bytes depend on (<see cref="Brief.Editions.EditionInput"/>); <c>outputs</c> are
/// the output switches (which files are written), kept apart because they never make an edition; <c>hash</c> covers
/// both. Manifests of earlier releases (no sizes, hashes or check) are read as valid but unverifiable.
/// </summary>
public sealed record Manifest(
    string Id,
    string Stem,
    int Edition,
    string Hash,
    IReadOnlyDictionary<string, string> Inputs,
    IReadOnlyList<string> Files)
{
    public IReadOnlyDictionary<string, long>? Sizes { get; init; }

    /// <summary>
    /// Output switches by name (chart copies, byte order mark, further formats): never part of what defines an edition.
    /// </summary>
    public IReadOnlyDictionary<string, string>? Outputs { get; init; }

    /// <summary>The <c>brief.edition</c> the scenario gave for this build (a minimum; 1 when it gave none).</summary>
    public int? RequestedEdition { get; init; }

    public IReadOnlyDictionary<string, string>? Sha256 { get; init; }

    public string? Check { get; init; }

    private static readonly JsonSerializerOptions Json = new()
    {
        WriteIndented = true,
        PropertyNamingPolicy = JsonNamingPolicy.SnakeCaseLower,
        DefaultIgnoreCondition = System.Text.Json.Serialization.JsonIgnoreCondition.WhenWritingNull,
        TypeInfoResolver = BatchJsonContext.Default,
    };

    private static readonly System.Text.Json.Serialization.Metadata.JsonTypeInfo<Manifest> Info
        = (System.Text.Json.Serialization.Metadata.JsonTypeInfo<Manifest>)Json.GetTypeInfo(typeof(Manifest));

    public static string FileName(string id) => id + ".manifest.json";

    public static string PathFor(string outDir, string id) => Path.Combine(outDir, FileName(id));

    /// <summary>
    /// Reads a manifest from text; null if it is not one (unreadable, truncated), or its check or a path is wrong.
    /// </summary>
    public static Manifest? Parse(string json)
    {
        Manifest? m;
        try
        {
            m = JsonSerializer.Deserialize(json, Info);
        }
        catch (JsonException)
        {
            return null;
        }
        if (m is null || m.Id is null || m.Stem is null || m.Hash is null || m.Files is null || m.Inputs is null)
            return null;
        if (!m.Files.All(Confined) || !Confined(m.Stem + ".pdf")) return null;
        if (m.Check is { } check
            && !check.Equals(SelfHash(json.Replace(CheckText(check), CheckText(""))), StringComparison.Ordinal))
            return null;
        if (m.Sizes is { } sizes && !m.Files.All(sizes.ContainsKey)) return null;
        if (m.Sha256 is { } hashes && !m.Files.All(hashes.ContainsKey)) return null;
        if (m.Check is not null && (m.Sizes is null || m.Sha256 is null)) return null;
        return m;
    }

    /// <summary>A plain file name in the output folder itself: no folder part, no <c>..</c>, nothing hidden.</summary>
    public static bool Confined(string name) =>
        name.Length is > 0 and <= 255 && name == Path.GetFileName(name) && name.IndexOfAny(['/', '\\', '\0', ':']) < 0
        && name[0] != '.' && !Path.IsPathRooted(name);

    /// <summary>The manifest's bytes with its check filled in.</summary>
    public byte[] ToBytes()
    {
        string body = JsonSerializer.Serialize(this with { Check = "" }, Info) + "\n";
        string check = SelfHash(body);
        return Encoding.UTF8.GetBytes(body.Replace(CheckText(""), CheckText(check)));
    }

    private static string CheckText(string value) => $"\"check\": \"{value}\"";

    private static string SelfHash(string text) => Sha256Hex.Of(text);

    /// <summary>Every file exists with the size the manifest recorded (the check a skipped build relies on).</summary>
    public bool FilesPresent(string outDir) => Files.All(f => Sizes is null
        ? File.Exists(Path.Combine(outDir, f))
        : new FileInfo(Path.Combine(outDir, f)) is { Exists: true } fi && fi.Length == Sizes[f]);
}

/// <summary>
/// Serialisation code for the manifest, the build log, the switch journal and the lock, generated at build time.
/// </summary>
[System.Text.Json.Serialization.JsonSerializable(typeof(Manifest))]
[System.Text.Json.Serialization.JsonSerializable(typeof(BuildLogEntry))]
[System.Text.Json.Serialization.JsonSerializable(typeof(Journal))]
[System.Text.Json.Serialization.JsonSerializable(typeof(LockInfo))]
[System.Text.Json.Serialization.JsonSerializable(typeof(IReadOnlyList<PlannedBrief>))]
internal sealed partial class BatchJsonContext : System.Text.Json.Serialization.JsonSerializerContext;
