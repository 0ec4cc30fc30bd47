using System.Text.Json;
using System.Text.Json.Serialization;

namespace Briefwright.Cli.Batch;

public enum OutcomeStatus
{
    Built,
    Skipped,
    Invalid,
    Failed,
    Stopped,
}

/// <summary>What happened to one scenario in a batch; also its machine-readable log line.</summary>
public sealed record BriefOutcome(string Scenario, string? Id, OutcomeStatus Status, int? Edition, string? Pdf, int Pages, long Bytes, long Milliseconds, string? Error)
{
    /// <summary>What this build found left by an interrupted one and put right, if anything.</summary>
    public string? Recovered { get; init; }

    /// <summary>Where the previous edition was kept (relative to the output folder), when this build archived it.</summary>
    public string? Archived { get; init; }

    private static readonly JsonSerializerOptions Json = new()
    {
        PropertyNamingPolicy = JsonNamingPolicy.SnakeCaseLower,
        Converters = { new JsonStringEnumConverter<OutcomeStatus>(JsonNamingPolicy.SnakeCaseLower) },
        DefaultIgnoreCondition = JsonIgnoreCondition.WhenWritingNull,
        TypeInfoResolver = BatchJsonContext.Default,
    };

    private static readonly System.Text.Json.Serialization.Metadata.JsonTypeInfo<BriefOutcome> Info = (System.Text.Json.Serialization.Metadata.JsonTypeInfo<BriefOutcome>)Json.GetTypeInfo(typeof(BriefOutcome));

    public string LogLine() => JsonSerializer.Serialize(this, Info);
}
