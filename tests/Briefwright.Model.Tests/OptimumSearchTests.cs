using Briefwright.Model.Core;
using Briefwright.Model.Inputs;
using Briefwright.Model.Results;

namespace Briefwright.Model.Tests;

public class OptimumSearchTests
{
    [Theory]
    [InlineData(60, 0.02, 0.10)]
    [InlineData(60, 0.0, 0.10)]
    [InlineData(70, -0.01, 0.08)]
    [InlineData(50, 0.03, 0.07)]
    [InlineData(80, 1e-9, 0.12)]
    public void Closed_form_agrees_with_the_numerical_search_to_a_millionth_of_a_year(double t, double n, double r)
    {
        // E* = T + ln(1 − n/r)/n: derived in closed form (no published source); checked against the numerical route.
        var result = OptimumSearch.Find(Fixtures.Classic(t, n), Fixtures.Constant(r), 1.0);
        Assert.Equal(OptimumMethod.ClosedForm, result.Method);
        var numerical = result.LocalMaxima.MaxBy(m => m.OutputPerPerson)!;
        Assert.Equal(result.SchoolingYears, numerical.SchoolingYears, 6);
        Assert.Single(result.LocalMaxima);
    }

    [Fact]
    public void Working_years_at_the_optimum_tend_to_one_over_r_at_zero_growth()
    {
        var result = OptimumSearch.Find(Fixtures.Classic(60, 0.0), Fixtures.Constant(0.1), 1.0);
        Assert.Equal(60 - 10, result.SchoolingYears, 10);
    }

    [Fact]
    public void Band_edges_are_where_output_falls_one_percent_below_the_maximum()
    {
        var d = Fixtures.Classic(60, 0.01);
        var result = OptimumSearch.Find(d, Fixtures.Constant(0.1), 1.0);
        var cycle = new LifeCycle(d, Fixtures.Constant(0.1));
        double top = cycle.Objective(result.SchoolingYears);
        Assert.Equal(0.99 * top, cycle.Objective(result.Within1Pct[0]), 8);
        Assert.Equal(0.99 * top, cycle.Objective(result.Within1Pct[1]), 8);
    }

    [Fact]
    public void Return_below_growth_puts_the_optimum_at_no_schooling_and_flags_the_boundary()
    {
        var result = OptimumSearch.Find(Fixtures.Classic(60, 0.03), Fixtures.Constant(0.02), 1.0);
        Assert.Equal(0.0, result.SchoolingYears);
        Assert.True(result.AtBoundary);
        Assert.Equal(ClosedFormObstacle.ReturnBelowGrowth, result.ClosedFormNotApplicable);
    }

    [Fact]
    public void Hall_Jones_with_Gompertz_Makeham_uses_the_numerical_search_and_converges()
    {
        var d = new Demography(0.01, 6, 65, new GompertzMakehamSurvival(0.00022, 2.7e-6, 1.124, 120), 0.75);
        var result = OptimumSearch.Find(
            d,
            new HumanCapital(BracketReturns.HallJones, new ExperienceProfile(0.081, 0.0012)),
            1.0);
        Assert.Equal(OptimumMethod.Numerical, result.Method);
        Assert.True(result.Diagnostics.Converged);
        var cycle = new LifeCycle(d, new HumanCapital(BracketReturns.HallJones, new ExperienceProfile(0.081, 0.0012)));
        double best = cycle.Objective(result.SchoolingYears);
        for (
            double e = 0;
            e < result.FeasibleMaxSchooling;
            e += 0.01) Assert.True(cycle.Objective(e) <= best * (1 + 1e-12));
    }
}

public class LocalOptimumTests
{
    [Theory]
    [InlineData(5.0)]
    [InlineData(34.0)]
    [InlineData(50.0)]
    public void Local_search_from_any_start_finds_the_full_search_optimum(double guess)
    {
        var d = new Demography(0.009, 6, 65, new GompertzMakehamSurvival(0.0004, 3e-6, 1.12, 110), 0.76);
        var hc = new HumanCapital(BracketReturns.HallJones, new ExperienceProfile(0.081, 0.0012));
        var full = OptimumSearch.Find(d, hc, 1.0);
        Assert.Equal(full.SchoolingYears, OptimumSearch.LocalFrom(d, hc, guess), 5);
    }
}
