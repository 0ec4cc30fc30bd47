using System.Text.Json;
using System.Text.Json.Serialization;
using System.Text.Json.Serialization.Metadata;
using Briefwright.Model.Results;
using Briefwright.Model.Uncertainty;
using Briefwright.Scenario;

namespace Briefwright.Brief.Annex;

/// <summary>The results data written beside a brief and printed by <c>solve --json</c>. Field names are documented in docs/results-json.md.</summary>
public sealed record ResultsDocument(
    string ScenarioId,
    string Title,
    string Date,
    int Edition,
    string ToolVersion,
    string InputHash,
    IReadOnlyList<Assumption> Assumptions,
    SteadyState SteadyState,
    IReadOnlyList<OptionResult> Options,
    OptimumResult Optimum,
    IReadOnlyList<CurvePoint> SchoolingCurve,
    AnalysisResults Analysis,
    IReadOnlyList<Model.Core.LeverDecomposition> LeverDecomposition,
    HeadlineFacts Headline)
{
    public static ResultsDocument From(SolvedScenario solved) => From(solved.Scenario, solved.BalancedGrowth, solved.Analysis);

    public static ResultsDocument From(ScenarioDocument scenario, BalancedGrowthResults results, AnalysisResults analysis) => new(
        scenario.Brief.Id,
        scenario.Brief.Title,
        scenario.Brief.Date.ToString("yyyy-MM-dd"),
        scenario.Brief.Edition,
        ToolInfo.Version,
        scenario.InputHash,
        scenario.Assumptions,
        results.SteadyState,
        results.Options,
        results.Optimum,
        results.SchoolingCurve,
        analysis,
        results.Levers,
        HeadlineFacts.From(results, analysis));
}

/// <summary>Serialisation code generated at build time: no reflection when a process writes its first brief.</summary>
[JsonSourceGenerationOptions(PropertyNamingPolicy = JsonKnownNamingPolicy.SnakeCaseLower, WriteIndented = true)]
[JsonSerializable(typeof(ResultsDocument))]
[JsonSerializable(typeof(List<ResultsDocument>))]
internal sealed partial class ResultsJsonContext : JsonSerializerContext;

public static class ResultsJson
{
    public static readonly JsonSerializerOptions Options = new()
    {
        PropertyNamingPolicy = JsonNamingPolicy.SnakeCaseLower,
        WriteIndented = true,
        // One converter per enum in the results (not the reflection-based factory), so that the native publish needs no
        // code generation at run time.
        Converters =
        {
            new JsonStringEnumConverter<Scenario.ValueUnit>(JsonNamingPolicy.SnakeCaseLower),
            new JsonStringEnumConverter<Model.Results.OptimumMethod>(JsonNamingPolicy.SnakeCaseLower),
            new JsonStringEnumConverter<Direction>(JsonNamingPolicy.SnakeCaseLower),
        },
        TypeInfoResolver = ResultsJsonContext.Default,
    };

    /// <summary>The generated serialisation code for <typeparamref name="T"/> with these options.</summary>
    public static JsonTypeInfo<T> Info<T>() => (JsonTypeInfo<T>)Options.GetTypeInfo(typeof(T));

    public static string Write(ResultsDocument document) => JsonSerializer.Serialize(document, Info<ResultsDocument>()) + "\n";

    /// <summary>Several results documents as one JSON array (<c>solve --json</c> with several scenarios).</summary>
    public static string Write(List<ResultsDocument> documents) => JsonSerializer.Serialize(documents, Info<List<ResultsDocument>>()) + "\n";
}
