using Briefwright.Model.Dynamics;
using Briefwright.Model.Inputs;

namespace Briefwright.Model.Tests;

public class ReformSimulatorTests
{
    internal static ModelInputs Inputs(
        Survival? survival = null,
        ExperienceProfile? experience = null,
        double n = 0.01) => new(
        new Demography(n, 6, 65, survival ?? new GompertzMakehamSurvival(0.0004, 3e-6, 1.12, 110), 0.76),
        new HumanCapital(BracketReturns.HallJones, experience),
        new Production(0.22, 0.33, 0.035, 0.015),
        new[]
        {
            new PolicyOption("base", "Base", 11), new PolicyOption("plus1", "Plus one", 12),
            new PolicyOption("plus2", "Plus two", 13), new PolicyOption(
                "retire",
                "Retire later",
                11,
                RetirementAge: 67),
        },
        "base");

    [Theory]
    [InlineData("plus1", 0.01)]
    [InlineData("plus2", 0.01)]
    [InlineData("retire", 0.01)]
    [InlineData("plus1", 0.0)]
    [InlineData("plus1", -0.005)]
    public void Long_run_gain_converges_to_the_balanced_growth_comparison(string option, double n)
    {
        // Independent route: the balanced-growth ratio from the stable-population integrals (BalancedGrowth),
        // against the end of a 400-year cohort simulation with capital accumulation.
        var inputs = Inputs(n: n, experience: new ExperienceProfile(0.081, 0.0012));
        var path = ReformSimulator.Simulate(
            inputs,
            inputs.Options.Single(o => o.Id == option),
            new ReformSettings(2027, 1, 400));
        Assert.True(
            Math.Abs(path.LongRunGain - path.BalancedGrowthGain) < 1e-4,
            $"{path.LongRunGain} vs {path.BalancedGrowthGain}");
    }

    [Fact]
    public void No_reform_gives_a_flat_zero_path()
    {
        var inputs = Inputs();
        var same = new PolicyOption("same", "Same as baseline", 11);
        var path = ReformSimulator.Simulate(
            inputs with { Options = inputs.Options.Append(same).ToList() },
            same,
            new ReformSettings(2027, 1, 120));
        Assert.All(path.Gain, g => Assert.True(Math.Abs(g) < 1e-12, g.ToString()));
    }

    [Theory]
    [InlineData(1, 0.01)]
    [InlineData(5, 0.0)]
    [InlineData(3, -0.005)]
    public void Labour_is_evaluated_once_after_the_last_reform_cohort_reaches_retirement_without_changing_the_path(
        int phaseIn,
        double n)
    {
        // Once every cohort of working age entered school after the phase-in, x(t) is constant; the simulator reuses
        // it there. The path must be identical, digit for digit, to evaluating x(t) at every step.
        var inputs = Inputs(n: n, experience: new ExperienceProfile(0.05, 0.0007));
        var settings = new ReformSettings(2027, phaseIn, 150);
        foreach (var option in inputs.Options.Where(o => o.Id != "base"))
        {
            var quick = ReformSimulator.Simulate(inputs, option, settings, null, settledShortcut: true);
            var full = ReformSimulator.Simulate(inputs, option, settings, null, settledShortcut: false);
            Assert.Equal(full.Gain, quick.Gain);
        }
    }

    [Fact]
    public void Longer_schooling_dips_first_then_turns_positive()
    {
        var inputs = Inputs();
        var path = ReformSimulator.Simulate(
            inputs,
            inputs.Options.Single(o => o.Id == "plus1"),
            new ReformSettings(2027, 1, 150));
        Assert.NotNull(path.DipDepth);
        Assert.True(path.DipDepth < 0);
        // the first reform cohort would have started work after E₀ = 11 years
        Assert.InRange(path.DipYear!.Value, 10, 14);
        Assert.True(path.FirstPositiveYear > path.DipYear);
        Assert.True(path.LongRunGain > 0);
    }

    [Fact]
    public void A_later_retirement_age_raises_output_from_the_first_year()
    {
        var inputs = Inputs();
        var path = ReformSimulator.Simulate(
            inputs,
            inputs.Options.Single(o => o.Id == "retire"),
            new ReformSettings(2027, 1, 100));
        Assert.Null(path.DipDepth);
        Assert.True(path.Gain[1] > 0);
    }

    [Fact]
    public void Phasing_in_over_cohorts_makes_the_dip_shallower()
    {
        var inputs = Inputs();
        var option = inputs.Options.Single(o => o.Id == "plus2");
        var sudden = ReformSimulator.Simulate(inputs, option, new ReformSettings(2027, 1, 150));
        var phased = ReformSimulator.Simulate(inputs, option, new ReformSettings(2027, 4, 150));
        Assert.True(phased.DipDepth > sudden.DipDepth);
    }
}
