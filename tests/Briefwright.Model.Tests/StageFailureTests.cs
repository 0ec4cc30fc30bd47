using Briefwright.Model;
using Briefwright.Model.Uncertainty;

namespace Briefwright.Model.Tests;

/// <summary>Inputs that leave the model nothing to compute stop with the model's own exception and a reason.</summary>
public class StageFailureTests
{
    [Fact]
    public void Sobol_with_every_base_sample_rejected_throws_a_model_rule_exception_not_an_index_error()
    {
        var ex = Assert.Throws<ModelRuleException>(
            () => Sobol.Estimate(2, 16, 1, ["a", "b"], _ => null, maxThreads: 1));
        Assert.Contains("only 0 of 16 base samples", ex.Message);
    }

    [Fact]
    public void Sobol_with_fewer_than_half_the_samples_accepted_throws_and_with_half_it_estimates()
    {
        // f accepts a row when its first uniform is below the cut: about that share of the rows survive.
        Func<double[], double[]?> Cut(double cut) => u => u[0] < cut ? [u[0] + 2 * u[1]] : null;
        Assert.Throws<ModelRuleException>(
            () => Sobol.Estimate(2, 200, 5, ["a", "b"], Cut(0.3), maxThreads: 1, resamples: 10));
        var indices = Sobol.Estimate(2, 200, 5, ["a", "b"], u => [u[0] + 2 * u[1]], maxThreads: 1, resamples: 10);
        Assert.Equal(200, Assert.Single(indices).Samples);
    }

    [Fact]
    public void The_base_rows_are_the_ones_the_estimate_draws()
    {
        var a = new double[3];
        var b = new double[3];
        Sobol.BaseRow(9, 4, a, b);
        var rng = SplitMix64.ForStream(9, 4);
        Assert.Equal(a.Concat(b), Enumerable.Range(0, 6).Select(_ => rng.NextOpenUnit()));
    }
}

/// <summary>The model's caches stay within their bounds however many schedules a process meets.</summary>
public class CacheBoundTests
{
    [Fact]
    public void Present_value_factors_are_kept_for_at_most_the_bound_and_give_the_same_sums_after_a_reset()
    {
        var inputs = ReformSimulatorTests.Inputs();
        var path = Briefwright.Model.Dynamics.ReformSimulator
            .Simulate(inputs, inputs.Options[1], new Briefwright.Model.Dynamics.ReformSettings(2027, 1, 40));
        double first = Briefwright.Model.Dynamics.PresentValue
            .ToHorizonOnly(path, Briefwright.Model.Dynamics.DiscountSchedule.GreenBook, 0.02);
        for (int i = 0; i < Briefwright.Model.Dynamics.PresentValue.MaxCachedFactors + 10; i++)
            Briefwright.Model.Dynamics.PresentValue.ToHorizonOnly(path,
                Briefwright.Model.Dynamics.DiscountSchedule.Constant($"r{i}", $"r{i}", 0.01 + i * 1e-5), 0.02);
        Assert.InRange(
            Briefwright.Model.Dynamics.PresentValue.CachedFactors,
            1,
            Briefwright.Model.Dynamics.PresentValue.MaxCachedFactors);
        Assert.Equal(first, Briefwright.Model.Dynamics.PresentValue
            .ToHorizonOnly(path, Briefwright.Model.Dynamics.DiscountSchedule.GreenBook, 0.02));
    }
}
