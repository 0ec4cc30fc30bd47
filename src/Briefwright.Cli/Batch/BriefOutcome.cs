namespace Briefwright.Cli.Batch;

public enum OutcomeStatus
{
    Built,
    Skipped,
    Invalid,
    Failed,
    Stopped,
}

/// <summary>
/// What happened to one scenario in a batch (its build-log line adds the time, tool version and shard).
/// </summary>
public sealed record BriefOutcome(
    string Scenario,
    string? Id,
    OutcomeStatus Status,
    int? Edition,
    string? Pdf,
    int Pages,
    long Bytes,
    long Milliseconds,
    string? Error)
{
    /// <summary>
    /// The hash over everything the brief depends on (the manifest's), once the scenario was read and valid.
    /// </summary>
    public string? InputHash { get; init; }

    /// <summary>
    /// The formats the brief's folder holds after this build (pdf, html, xlsx, docx), for the summary.
    /// </summary>
    public string? Formats { get; init; }

    /// <summary>What this build found left by an interrupted one and put right, if anything.</summary>
    public string? Recovered { get; init; }

    /// <summary>
    /// Where the previous edition was kept (relative to the output folder), when this build archived it.
    /// </summary>
    public string? Archived { get; init; }

    /// <summary>Every positioned message of a failed attempt (file:line:col: field: rule. Got value.).</summary>
    public IReadOnlyList<string>? Messages { get; init; }
}
