
namespace Briefwright.Brief.Tests;

public class ResultsGuardTests
{
    [Fact]
    public void A_forced_NaN_in_the_results_stops_the_brief_before_anything_is_written()
    {
        var solved = ScenarioSolver.Solve(Demo.Load("auroria-silverdale"));
        var options = solved.BalancedGrowth.Options.ToList();
        options[1] = options[1] with { OutputPerPerson = double.NaN };
        var broken = solved.BalancedGrowth with { Options = options };
        var ex = Assert.Throws<NonFiniteResultException>(() => ResultsGuard.EnsureFinite(broken));
        Assert.Contains("non-finite output per person", ex.Message);
    }

    [Fact]
    public void A_forced_infinity_in_the_reform_path_is_caught_too()
    {
        var solved = ScenarioSolver.Solve(Demo.Load("auroria-silverdale"));
        var reform = solved.Analysis.Reform;
        var first = reform.Options[0];
        var gain = (double[])first.Path.Gain.Clone();
        gain[10] = double.PositiveInfinity;
        var broken = solved.Analysis with { Reform = reform with { Options = reform.Options.Skip(1)
            .Prepend(first with { Path = first.Path with { Gain = gain } })
            .ToList() } };
        Assert.Throws<NonFiniteResultException>(() => ResultsGuard.EnsureFinite(broken));
    }
}
