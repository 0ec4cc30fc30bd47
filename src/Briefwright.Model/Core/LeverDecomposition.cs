using Briefwright.Model.Inputs;

namespace Briefwright.Model.Core;

/// <summary>One lever's share of an option's long-run change in output per person, in percentage points.</summary>
public sealed record LeverContribution(string Lever, double ChangePct);

/// <summary>
/// An option's long-run change against the baseline split by lever. The split is the Shapley value: each lever's
/// marginal effect averaged over every order in which the changed levers can be switched from the baseline value
/// to the option's, so it does not depend on an order and the contributions add up to the total change.
/// </summary>
public sealed record LeverDecomposition(string OptionId, double TotalChangePct, IReadOnlyList<LeverContribution> Levers)
{
    /// <summary>True when the option changes more than one lever.</summary>
    public bool IsCombined => Levers.Count > 1;
}

public static class Levers
{
    public const string Schooling = "schooling";
    public const string RetirementAge = "retirement_age";
    public const string Participation = "participation";

    /// <summary>
    /// The levers an option may set against the baseline. The reform's phase-in is set once for every option
    /// (reform.phase_in_cohorts), so it shapes the path over time but is never one option's lever, and it does not
    /// enter the balanced-growth change.
    /// </summary>
    public static readonly string[] All = { Schooling, RetirementAge, Participation };

    /// <summary>
    /// The levers <paramref name="option"/> sets to a value other than the baseline's, in the order of
    /// <see cref="All"/>.
    /// </summary>
    public static IReadOnlyList<string> Changed(ModelInputs inputs, PolicyOption option)
    {
        var b = inputs.Baseline;
        var db = inputs.DemographyFor(b);
        var d = inputs.DemographyFor(option);
        var list = new List<string>(3);
        if (option.SchoolingYears != b.SchoolingYears) list.Add(Schooling);
        if (d.RetirementAge != db.RetirementAge) list.Add(RetirementAge);
        if (d.Participation != db.Participation) list.Add(Participation);
        return list;
    }

    /// <summary>
    /// Shapley decomposition of every alternative option's balanced-growth change against the baseline.
    /// </summary>
    public static IReadOnlyList<LeverDecomposition> Decompose(ModelInputs inputs) =>
        inputs.Options.Where(o => o.Id != inputs.BaselineId).Select(o => Decompose(inputs, o)).ToList();

    public static LeverDecomposition Decompose(ModelInputs inputs, PolicyOption option)
    {
        var changed = Changed(inputs, option).ToList();
        int k = changed.Count;
        var b = inputs.Baseline;
        var db = inputs.DemographyFor(b);
        var d = inputs.DemographyFor(option);
        // Output per person with the levers in mask switched to the option's values and the others at the baseline's.
        var y = new double[1 << k];
        for (int mask = 0; mask < y.Length; mask++)
        {
            bool On(string lever) => changed.IndexOf(lever) is var i and >= 0 && (mask & (1 << i)) != 0;
            var mixed = new PolicyOption("__levers", option.Label,
                On(Schooling) ? option.SchoolingYears : b.SchoolingYears,
                On(RetirementAge) ? d.RetirementAge : db.RetirementAge,
                On(Participation) ? d.Participation : db.Participation);
            y[mask] = BalancedGrowth.OutputPerPerson(inputs, mixed);
        }
        double Change(int mask) => 100 * (y[mask] / y[0] - 1);
        var contributions = new List<LeverContribution>(k);
        for (int i = 0; i < k; i++)
        {
            // Shapley weight of a coalition S without lever i: |S|!(k − |S| − 1)!/k!, the share of orders in which
            // exactly S comes before i.
            double sum = 0;
            for (int mask = 0; mask < y.Length; mask++)
            {
                if ((mask & (1 << i)) != 0) continue;
                int s = System.Numerics.BitOperations.PopCount((uint)mask);
                sum += Factorial(s) * Factorial(k - s - 1) / Factorial(k) * (Change(mask | (1 << i)) - Change(mask));
            }
            contributions.Add(new LeverContribution(changed[i], sum));
        }
        return new LeverDecomposition(option.Id, Change(y.Length - 1), contributions);
    }

    private static double Factorial(int n) => n <= 1 ? 1 : n * Factorial(n - 1);
}
