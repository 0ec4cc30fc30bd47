using Briefwright.Model.Inputs;

namespace Briefwright.Scenario;

/// <summary>Title-block facts of a brief.</summary>
public sealed record BriefInfo(
    string Id,
    string Title,
    string ShortTitle,
    string Organisation,
    string? Author,
    DateOnly Date,
    string Status,
    int Edition,
    string? Question);

public enum ValueUnit
{
    Rate,
    Years,
    Age,
    Number,
    Text,
}

/// <summary>One row of the assumptions table: a parameter, its value, unit, source and note.</summary>
public sealed record Assumption(string Path, string Label, double? Value, string? Text, ValueUnit Unit, string? Source, string? Note);

/// <summary>A validated scenario: brief facts, model inputs, provenance of every parameter, and the files it was read from.</summary>
public sealed record ScenarioDocument(
    BriefInfo Brief,
    ModelInputs Inputs,
    IReadOnlyList<Assumption> Assumptions,
    IReadOnlyList<string> Files)
{
    /// <summary>SHA-256 over the text of every input file, in the order read (the scenario, what it extends, life tables).</summary>
    public string InputHash { get; init; } = "";

    /// <summary>Reform path, appraisal, sensitivity and uncertainty settings (defaults when the scenario gives none).</summary>
    public Model.Uncertainty.AnalysisSettings Analysis { get; init; } = null!;
}
