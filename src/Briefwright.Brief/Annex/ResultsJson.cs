using System.Text.Json;
using System.Text.Json.Serialization;
using System.Text.Json.Serialization.Metadata;
using Briefwright.Model.Dynamics;
using Briefwright.Model.Results;
using Briefwright.Model.Uncertainty;
using Briefwright.Scenario;
using Briefwright.Templating;

namespace Briefwright.Brief.Annex;

/// <summary>
/// The results data written beside a brief and printed by <c>solve --json</c>. Field names are documented in
/// docs/results-json.md.
/// </summary>
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
    public static ResultsDocument From(SolvedScenario solved)
        => From(solved.Scenario, solved.BalancedGrowth, solved.Analysis);

    public static ResultsDocument From(ScenarioDocument scenario, BalancedGrowthResults results,
        AnalysisResults analysis) => new(
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
        TypeInfoResolver = ResultsJsonContext.Default.WithAddedModifier(ResultsNaming.Apply),
    };

    /// <summary>The generated serialisation code for <typeparamref name="T"/> with these options.</summary>
    public static JsonTypeInfo<T> Info<T>() => (JsonTypeInfo<T>)Options.GetTypeInfo(typeof(T));

    public static string Write(ResultsDocument document)
        => JsonSerializer.Serialize(document, Info<ResultsDocument>()) + "\n";

    /// <summary>Several results documents as one JSON array (<c>solve --json</c> with several scenarios).</summary>
    public static string Write(List<ResultsDocument> documents)
        => JsonSerializer.Serialize(documents, Info<List<ResultsDocument>>()) + "\n";
}

/// <summary>
/// The results data's own naming, kept here rather than on the model's records: names that are not the snake case of
/// the model's (<c>within_1pct</c>, the <c>*_years_after_reform</c> landmarks), members the data leaves out (the raw
/// headline sample, a present value's counted total, the fields its sentences are made from), and the English sentences
/// it carries, written from the model's codes and numbers by <see cref="ResultWords.Data"/> where the model's fields
/// were (docs/results-json.md).
/// </summary>
internal static class ResultsNaming
{
    private static string Snake(string name) => JsonNamingPolicy.SnakeCaseLower.ConvertName(name);

    public static void Apply(JsonTypeInfo info)
    {
        if (info.Kind != JsonTypeInfoKind.Object) return;
        var words = ResultWords.Data;
        if (info.Type == typeof(OptimumResult))
        {
            Rename(info, nameof(OptimumResult.Within1Pct), "within_1pct");
            Replace<OptimumResult>(info, nameof(OptimumResult.ClosedFormNotApplicable), "closed_form_not_applicable",
                o => o.ClosedFormNotApplicable is { } why ? words.ClosedFormReason(why) : null);
        }
        else if (info.Type == typeof(SolverDiagnostics))
            Replace<SolverDiagnostics>(info, nameof(SolverDiagnostics.Refinement), "refinement",
                d => words.Refinement(d.Refinement));
        else if (info.Type == typeof(ReformPath))
        {
            Rename(info, nameof(ReformPath.DipYear), "dip_years_after_reform");
            Rename(info, nameof(ReformPath.FirstPositiveYear), "first_positive_years_after_reform");
        }
        else if (info.Type == typeof(PresentValue))
        {
            Rename(info, nameof(PresentValue.BreakEvenYear), "break_even_years_after_reform");
            Replace<PresentValue>(info, nameof(PresentValue.TailBasis), "tail_note", p => words.TailNote(p.TailBasis));
            Remove(info, nameof(PresentValue.Counted));
        }
        else if (info.Type == typeof(AppraisalResults))
            Insert<AppraisalResults>(info, after: nameof(AppraisalResults.ValuationYear), "price_base",
                a => words.PriceBase(a.ValuationYear));
        else if (info.Type == typeof(DiscountedOptimum))
        {
            Replace<DiscountedOptimum>(info, nameof(DiscountedOptimum.LongerSchoolingPays), "explanation",
                words.Explanation);
            Remove(info, nameof(DiscountedOptimum.ScheduleLabel));
            Remove(info, nameof(DiscountedOptimum.HorizonYears));
        }
        else if (info.Type == typeof(MonteCarloResults))
            Remove(info, nameof(MonteCarloResults.HeadlineChangeSample));
    }

    private static int IndexOf(JsonTypeInfo info, string member)
    {
        string name = Snake(member);
        for (int i = 0; i < info.Properties.Count; i++)
            if (info.Properties[i].Name == name) return i;
        throw new InvalidOperationException($"The results data has no member {member} on {info.Type.Name}.");
    }

    private static void Rename(JsonTypeInfo info, string member, string name) =>
        info.Properties[IndexOf(info, member)].Name = name;

    private static void Remove(JsonTypeInfo info, string member) => info.Properties.RemoveAt(IndexOf(info, member));

    /// <summary>A text member written where <paramref name="member"/> was, which the data leaves out.</summary>
    private static void Replace<T>(JsonTypeInfo info, string member, string name, Func<T, string?> text)
    {
        int at = IndexOf(info, member);
        info.Properties.RemoveAt(at);
        info.Properties.Insert(at, Text(info, name, text));
    }

    private static void Insert<T>(JsonTypeInfo info, string after, string name, Func<T, string?> text) =>
        info.Properties.Insert(IndexOf(info, after) + 1, Text(info, name, text));

    private static JsonPropertyInfo Text<T>(JsonTypeInfo info, string name, Func<T, string?> text)
    {
        // Made as the generated code makes its members (JsonTypeInfo.CreateJsonPropertyInfo would need reflection).
        return JsonMetadataServices.CreatePropertyInfo(info.Options, new JsonPropertyInfoValues<string>
        {
            IsProperty = true,
            IsPublic = true,
            DeclaringType = typeof(T),
            PropertyName = name,
            JsonPropertyName = name,
            Getter = o => text((T)o),
        });
    }
}
