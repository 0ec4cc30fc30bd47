using System.Text.Json;

namespace Briefwright.Cli.Batch;

/// <summary>
/// What a brief in an output folder was built from: the hashes of every input and the files written. Stored as
/// <c>&lt;id&gt;.manifest.json</c>; an unchanged hash with all files present means the brief is up to date.
/// </summary>
public sealed record Manifest(string Id, string Stem, int Edition, string Hash, IReadOnlyDictionary<string, string> Inputs, IReadOnlyList<string> Files)
{
    private static readonly JsonSerializerOptions Json = new()
    {
        WriteIndented = true,
        PropertyNamingPolicy = JsonNamingPolicy.SnakeCaseLower,
        TypeInfoResolver = BatchJsonContext.Default,
    };

    private static readonly System.Text.Json.Serialization.Metadata.JsonTypeInfo<Manifest> Info = (System.Text.Json.Serialization.Metadata.JsonTypeInfo<Manifest>)Json.GetTypeInfo(typeof(Manifest));

    public static string PathFor(string outDir, string id) => Path.Combine(outDir, id + ".manifest.json");

    public static Manifest? Read(string outDir, string id)
    {
        string path = PathFor(outDir, id);
        return File.Exists(path) ? Parse(File.ReadAllText(path)) : null;
    }

    /// <summary>Reads a manifest from text; null if it is not one.</summary>
    public static Manifest? Parse(string json)
    {
        try
        {
            return JsonSerializer.Deserialize(json, Info);
        }
        catch (JsonException)
        {
            return null; // a damaged manifest only costs a rebuild
        }
    }

    public byte[] ToBytes() => System.Text.Encoding.UTF8.GetBytes(JsonSerializer.Serialize(this, Info) + "\n");

    public bool FilesPresent(string outDir) => Files.All(f => File.Exists(Path.Combine(outDir, f)));
}

/// <summary>Serialisation code for the manifest and the build log, generated at build time.</summary>
[System.Text.Json.Serialization.JsonSerializable(typeof(Manifest))]
[System.Text.Json.Serialization.JsonSerializable(typeof(BuildLogEntry))]
internal sealed partial class BatchJsonContext : System.Text.Json.Serialization.JsonSerializerContext;
