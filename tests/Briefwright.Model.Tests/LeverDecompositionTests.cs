using Briefwright.Model.Core;
using Briefwright.Model.Inputs;

namespace Briefwright.Model.Tests;

/// <summary>
/// The split of an option's change by lever is the Shapley value (Shapley 1953, "A value for n-person games",
/// Contributions to the Theory of Games II): each lever's marginal effect averaged over every order of switching.
/// Checked against that definition computed the long way, by walking each of the orders.
/// </summary>
public class LeverDecompositionTests
{
    private static readonly PolicyOption All3 = new("all", "All three", 13, RetirementAge: 68, Participation: 0.8);

    private static ModelInputs Inputs() => new(
        new Demography(0.01, 6, 65, new RectangularSurvival(80), 0.7),
        new HumanCapital(BracketReturns.HallJones, null),
        Fixtures.MankiwRomerWeil,
        new[] { new PolicyOption("base", "Base", 11), new PolicyOption("more", "More", 12), All3 },
        "base");

    /// <summary>Output per person with the levers in <paramref name="on"/> at the option's values.</summary>
    private static double Y(
        ModelInputs inputs,
        ISet<string> on) => BalancedGrowth.OutputPerPerson(inputs, new PolicyOption("x", "x",
        on.Contains(Levers.Schooling) ? All3.SchoolingYears : 11,
        on.Contains(Levers.RetirementAge) ? All3.RetirementAge : 65,
        on.Contains(Levers.Participation) ? All3.Participation : 0.7));

    [Fact]
    public void Equals_the_average_marginal_effect_over_the_six_orders_of_switching()
    {
        var inputs = Inputs();
        double y0 = Y(inputs, new HashSet<string>());
        var orders = new[]
        {
            new[] { 0, 1, 2 }, new[] { 0, 2, 1 }, new[] { 1, 0, 2 }, new[] { 1, 2, 0 }, new[] { 2, 0, 1 }, new[] {
                2,
                1,
                0 },
        };
        var sums = new double[3];
        foreach (var order in orders)
        {
            var on = new HashSet<string>();
            double before = 0;
            foreach (int i in order)
            {
                on.Add(Levers.All[i]);
                double after = 100 * (Y(inputs, on) / y0 - 1);
                sums[i] += after - before;
                before = after;
            }
        }
        var split = Levers.Decompose(inputs, All3);
        Assert.True(split.IsCombined);
        Assert.Equal(Levers.All, split.Levers.Select(l => l.Lever));
        for (int i = 0; i < 3; i++) Assert.Equal(sums[i] / 6, split.Levers[i].ChangePct, 10);
    }

    [Fact]
    public void Adds_up_to_the_options_change_on_the_balanced_growth_path()
    {
        var inputs = Inputs();
        var solved = BalancedGrowth.Solve(inputs);
        foreach (var d in solved.Levers)
        {
            double change = solved.Options.Single(o => o.Id == d.OptionId).ChangeVsBaselinePct;
            Assert.Equal(change, d.TotalChangePct, 9);
            Assert.Equal(change, d.Levers.Sum(l => l.ChangePct), 9);
        }
    }

    [Fact]
    public void Gives_a_single_lever_option_its_whole_change()
    {
        var split = Levers.Decompose(Inputs(), Inputs().Options[1]);
        Assert.False(split.IsCombined);
        Assert.Equal(Levers.Schooling, Assert.Single(split.Levers).Lever);
        Assert.Equal(split.TotalChangePct, split.Levers[0].ChangePct, 12);
    }
}
