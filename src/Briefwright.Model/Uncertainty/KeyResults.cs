using Briefwright.Model.Core;
using Briefwright.Model.Dynamics;
using Briefwright.Model.Inputs;

namespace Briefwright.Model.Uncertainty;

/// <summary>The numbers a brief headlines, for one set of inputs: per alternative option, and the optimum.</summary>
public sealed record KeyResults(
    IReadOnlyList<string> OptionIds,
    double[] LongRunChangePct,
    double[] PresentValue,
    double OptimumYears)
{
    public bool Equals(KeyResults? other) =>
        other is not null && Same.Items(OptionIds, other.OptionIds)
        && Same.Items(LongRunChangePct, other.LongRunChangePct)
        && Same.Items(PresentValue, other.PresentValue) && OptimumYears.Equals(other.OptimumYears);

    public override int GetHashCode() =>
        HashCode.Combine(Same.Hash(OptionIds), Same.Hash(LongRunChangePct), OptimumYears);

    /// <summary>The long-run change (percent) of the option <paramref name="optionId"/>.</summary>
    public double LongRunChangeOf(string optionId) => LongRunChangePct[IndexOf(optionId)];

    private int IndexOf(string optionId)
    {
        for (int i = 0; i < OptionIds.Count; i++)
            if (OptionIds[i] == optionId) return i;
        throw new ArgumentException($"No results for option {optionId}.", nameof(optionId));
    }
}

/// <summary>Evaluates the key results quickly enough to repeat thousands of times.</summary>
public static class KeyResultsEvaluator
{
    /// <param name="headlineOnly">Evaluate the headline option alone (the result lists then hold just it).</param>
    /// <param name="headlinePath">Where to copy the headline option's reform path (horizon + 1 values); empty to
    /// skip.</param>
    public static KeyResults Evaluate(
        ModelInputs inputs, AnalysisSettings settings, double optimumGuess, bool headlineOnly = false,
        Span<double> headlinePath = default)
    {
        var alternatives = inputs.Options
            .Where(o => o.Id != inputs.BaselineId && (!headlineOnly || o.Id == settings.HeadlineOptionId))
            .ToList();
        var cache = new ReformSimulator.Cache(fast: true);
        double baseY = cache.OutputPerPerson(inputs, inputs.Baseline);
        var change = new double[alternatives.Count];
        var pv = new double[alternatives.Count];
        for (int i = 0; i < alternatives.Count; i++)
        {
            change[i] = 100 * (cache.OutputPerPerson(inputs, alternatives[i]) / baseY - 1);
            var path = ReformSimulator.Simulate(inputs, alternatives[i], settings.Reform, cache);
            pv[i] = PresentValue.ToHorizonOnly(
                path, settings.Headline, inputs.Production.TechnologyGrowth, settings.Reform.ValuationOffset);
            if (!headlinePath.IsEmpty && alternatives[i].Id == settings.HeadlineOptionId)
                path.Gain.CopyTo(headlinePath);
        }
        double optimum = OptimumSearch.LocalFrom(
            inputs.DemographyFor(inputs.Baseline), inputs.HumanCapital, optimumGuess, cache.Population(inputs),
            fast: true);
        return new KeyResults(alternatives.Select(o => o.Id).ToList(), change, pv, optimum);
    }
}
