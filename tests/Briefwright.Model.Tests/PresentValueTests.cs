using Briefwright.Model.Dynamics;
using Briefwright.Model.Inputs;

namespace Briefwright.Model.Tests;

public class PresentValueTests
{
    [Fact]
    public void Green_Book_discount_factor_for_year_50_is_0_19727()
    {
        // HM Treasury Green Book (2003), Table 6.1: 3.5% for years 1–30, then 3.0%: 1/(1.035^30 × 1.03^20) = 0.19727
        // as quoted (the exact value is 0.197263, so the quoted figure is good to 1e-5).
        Assert.InRange(DiscountSchedule.GreenBook.Factor(50), 0.19727 - 1e-5, 0.19727 + 1e-5);
        Assert.Equal(1 / (Math.Pow(1.035, 30) * Math.Pow(1.03, 20)), DiscountSchedule.GreenBook.Factor(50), 14);
    }

    [Fact]
    public void Green_Book_rates_step_down_at_the_published_years()
    {
        var gb = DiscountSchedule.GreenBook;
        Assert.Equal(new[] { 0.035, 0.035, 0.030, 0.030, 0.025, 0.025, 0.020, 0.020, 0.015, 0.015, 0.010 },
            new[] { 1, 30, 31, 75, 76, 125, 126, 200, 201, 300, 301 }.Select(gb.RateInYear).ToArray());
    }

    [Fact]
    public void Omb_constant_rates_discount_geometrically()
    {
        // US OMB Circular A-4 (2003): 3% and 7% real.
        Assert.Equal(Math.Pow(1.07, -10), DiscountSchedule.Omb7.Factor(10), 14);
        Assert.Equal(Math.Pow(1.03, -40), DiscountSchedule.Omb3.Factor(40), 14);
    }

    private static ReformPath Constant(double gain, int horizon) =>
        new("x", Enumerable.Repeat(gain, horizon + 1).ToArray(), gain, gain, null, null, 0);

    [Fact]
    public void Tail_beyond_the_horizon_equals_the_brute_force_sum()
    {
        // Independent route: sum a constant gain year by year to 20,000 years.
        double g = 0.015;
        var path = Constant(0.05, 100);
        var pv = PresentValue.Compute(
            path,
            DiscountSchedule.GreenBook with { Steps = DiscountSchedule.GreenBook.Steps.Take(4).ToList() },
            g);
        var longPath = Constant(0.05, 20_000);
        var brute = PresentValue.Compute(
            longPath,
            DiscountSchedule.GreenBook with { Steps = DiscountSchedule.GreenBook.Steps.Take(4).ToList() },
            g);
        Assert.Equal(brute.ToHorizon, pv.Total!.Value, 8);
    }

    [Fact]
    public void A_tail_that_does_not_converge_is_left_out_and_said_so()
    {
        var pv = PresentValue.Compute(Constant(0.05, 100), DiscountSchedule.GreenBook, 0.015);
        Assert.Null(pv.Total);
        Assert.Equal(new TailBasis(TailTreatment.NotFinite, 0.01, 0.015, 0.05), pv.TailBasis with { HeldGain = 0.05 });
    }

    [Fact]
    public void Break_even_is_the_first_year_from_which_the_cumulative_gain_stays_positive()
    {
        var gain = new double[31];
        for (int t = 0; t < 31; t++) gain[t] = t < 10 ? -0.01 : 0.03;
        var pv = PresentValue.Compute(
            new ReformPath("x", gain, 0.02, 0.02, -0.01, 0, 10),
            DiscountSchedule.Constant("zero", "0%", 0.0),
            0.0);
        // Cumulative: −0.10 after year 9, then +0.03 a year: −0.07, −0.04, −0.01, +0.02 at year 13.
        Assert.Equal(13, pv.BreakEvenYear);
    }

    [Fact]
    public void The_value_to_the_horizon_alone_is_the_same_number_as_the_full_computation()
    {
        // Monte Carlo and Sobol runs ask only for the value to the horizon; it must be the very number the brief's
        // present-value table shows (same sum, same order), for every schedule and for paths with a dip.
        var inputs = ReformSimulatorTests.Inputs(experience: new ExperienceProfile(0.081, 0.0012));
        var schedules = new[] {
            DiscountSchedule.GreenBook,
            DiscountSchedule.Omb3,
            DiscountSchedule.Omb7,
            DiscountSchedule.Constant("zero", "0%", 0.0) };
        foreach (var option in inputs.Options.Where(o => o.Id != "base"))
        {
            var path = ReformSimulator.Simulate(inputs, option, new ReformSettings(2027, 2, 150));
            foreach (var schedule in schedules)
                Assert.Equal(
                    PresentValue.Compute(path, schedule, 0.015).ToHorizon,
                    PresentValue.ToHorizonOnly(path, schedule, 0.015));
        }
    }
}

public class ValuationDateTests
{
    private const double G = 0.015;

    /// <summary>A path with an early dip and a later gain, as a reform gives.</summary>
    private static ReformPath Path(int reformYear, int horizon = 120)
    {
        var gain = Enumerable.Range(0, horizon + 1)
            .Select(t => t < 15 ? -0.004 * t / 15.0 : 0.02 * (1 - Math.Exp(-(t - 15) / 25.0)))
            .ToArray();
        return new ReformPath("x", gain, gain[^1], 0.02, gain.Min(), 14, 16) { ReformYear = reformYear };
    }

    /// <summary>
    /// Independent route: each calendar year's flow discounted year by year at the rates written out here.
    /// </summary>
    private static double BruteForce(ReformPath path, Func<int, double> rateInYear, int offset)
    {
        double pv = 0;
        for (int t = 0; t <= path.Horizon; t++)
        {
            int yearsFromValuation = offset + t;
            double d = 1;
            for (int y = 1; y <= yearsFromValuation; y++) d /= 1 + rateInYear(y);
            pv += d * Math.Exp(G * yearsFromValuation) * path.Gain[t];
        }
        return pv;
    }

    // HM Treasury Green Book (2003, Table 6.1; kept in 2018/2020), years counted from the valuation date.
    private static double GreenBookRate(int y)
        => y <= 30 ? 0.035 : y <= 75 ? 0.030 : y <= 125 ? 0.025 : y <= 200 ? 0.020 : y <= 300 ? 0.015 : 0.010;

    [Theory]
    [InlineData(0.03)]
    [InlineData(0.07)]
    public void Moving_the_reform_later_lowers_each_constant_rate_present_value_by_the_discount_factor_between_years(
        double rate)
    {
        // US OMB Circular A-4 (2003) rates. Valued at 2026, a reform in 2060 instead of 2028 is the same path 32 years
        // later: at a constant rate every flow is worth (e^g/(1 + r))^32 as much, and so is the sum and its tail.
        var schedule = DiscountSchedule.Constant("c", "c", rate);
        var early = PresentValue.Compute(Path(2028), schedule, G, valuationOffset: 2);
        var late = PresentValue.Compute(Path(2060), schedule, G, valuationOffset: 34);
        double factor = Math.Pow(Math.Exp(G) / (1 + rate), 32);
        Assert.Equal(factor, late.ToHorizon / early.ToHorizon, 10);
        Assert.Equal(factor, late.Tail!.Value / early.Tail!.Value, 10);
        Assert.Equal(Math.Pow(1 + rate, -2), early.DiscountFactorToReform, 12);
        Assert.Equal(Math.Pow(1 + rate, -34), late.DiscountFactorToReform, 12);
        Assert.Equal(2026, late.ValuationYear);
    }

    [Fact]
    public void Under_the_Green_Book_each_flow_is_discounted_from_the_valuation_date_not_from_the_reform()
    {
        // The declining schedule steps down 30, 75, 125 … years after the valuation date: a later reform's flows reach
        // the lower rates sooner, so the value falls by less than the 32-year factor of the early years alone.
        var gb = DiscountSchedule.GreenBook;
        var early = PresentValue.Compute(Path(2028), gb, G, valuationOffset: 2);
        var late = PresentValue.Compute(Path(2060), gb, G, valuationOffset: 34);
        Assert.Equal(BruteForce(Path(2028), GreenBookRate, 2), early.ToHorizon, 12);
        Assert.Equal(BruteForce(Path(2060), GreenBookRate, 34), late.ToHorizon, 12);
        double firstYearsFactor = Math.Pow(Math.Exp(G) / 1.035, 28) * Math.Pow(Math.Exp(G) / 1.03, 4);
        Assert.True(late.ToHorizon < early.ToHorizon && late.ToHorizon > firstYearsFactor * early.ToHorizon,
            $"{late.ToHorizon} against {early.ToHorizon} (factor of the first 32 years {firstYearsFactor})");
    }

    [Fact]
    public void Valued_at_the_reform_year_the_sum_starts_undiscounted()
    {
        var path = Path(2028);
        var pv = PresentValue.Compute(path, DiscountSchedule.GreenBook, G);
        Assert.Equal(BruteForce(path, GreenBookRate, 0), pv.ToHorizon, 12);
        Assert.Equal(1.0, pv.DiscountFactorToReform);
        Assert.Equal(2028, pv.ValuationYear);
    }

    [Fact]
    public void The_tail_of_a_later_reform_equals_the_brute_force_sum_to_twenty_thousand_years()
    {
        // Schedule without the steps below technology growth, so the tail is finite.
        var schedule = DiscountSchedule.GreenBook with { Steps = DiscountSchedule.GreenBook.Steps.Take(4).ToList() };
        var path = Path(2040, 100);
        var pv = PresentValue.Compute(path, schedule, G, valuationOffset: 14);
        var longGain = path.Gain.Concat(Enumerable.Repeat(path.BalancedGrowthGain, 20_000)).ToArray();
        var longPath = path with { Gain = longGain };
        Assert.Equal(PresentValue.Compute(longPath, schedule, G, valuationOffset: 14).ToHorizon, pv.Total!.Value, 8);
    }

    [Fact]
    public void Break_even_is_given_both_as_a_calendar_year_and_in_years_after_the_reform()
    {
        var gain = new double[31];
        for (int t = 0; t < 31; t++) gain[t] = t < 10 ? -0.01 : 0.03;
        var path = new ReformPath("x", gain, 0.03, 0.03, -0.01, 0, 10) { ReformYear = 2030 };
        var pv = PresentValue.Compute(path, DiscountSchedule.Constant("zero", "0%", 0.0), 0.0, valuationOffset: 4);
        // Cumulative: −0.10 after year 9, then +0.03 a year: −0.07, −0.04, −0.01, +0.02 at year 13.
        Assert.Equal(13, pv.BreakEvenYear);
        Assert.Equal(2043, pv.BreakEvenCalendarYear);
    }

    [Fact]
    public void The_value_to_the_horizon_alone_matches_the_full_computation_at_any_valuation_date()
    {
        var path = Path(2030);
        foreach (int offset in new[] { 0, 1, 7, 40 })
            Assert.Equal(
                PresentValue.Compute(path, DiscountSchedule.GreenBook, G, offset).ToHorizon,
                PresentValue.ToHorizonOnly(path, DiscountSchedule.GreenBook, G, offset));
    }
}

public class DiscountedOptimumTests
{
    private static double Counted(ModelInputs inputs, ReformSettings reform, DiscountSchedule schedule, double e)
    {
        var option = inputs.Baseline with { Id = "probe", SchoolingYears = e };
        var trial = inputs with { Options = inputs.Options.Append(option).ToList() };
        var pv = PresentValue.Compute(
            ReformSimulator.Simulate(trial, option, reform),
            schedule,
            trial.Production.TechnologyGrowth,
            reform.ValuationOffset);
        return pv.Total ?? pv.ToHorizon;
    }

    [Fact]
    public void With_a_finite_tail_the_optimum_maximises_the_value_including_the_tail()
    {
        // A declining 4% → 3% schedule: its last rate exceeds technology growth (1.5%), so the tail is finite.
        var schedule = new DiscountSchedule(
            "d",
            "4% then 3%",
            new[] { new DiscountStep(1, 0.04), new DiscountStep(41, 0.03) });
        var inputs = ReformSimulatorTests.Inputs();
        var reform = new ReformSettings(2028, 1, 80, ValuationYear: 2026);
        double eStar = Core.BalancedGrowth.Solve(inputs).Optimum.SchoolingYears;
        var opt = Appraisal.FindDiscountedOptimum(inputs, reform, schedule, eStar);
        Assert.True(opt.TailIncluded);
        double at = Counted(inputs, reform, schedule, opt.SchoolingYears);
        Assert.Equal(at, opt.PresentValue, 12);
        // Independent check of optimality: an exhaustive one-year grid from the baseline to E* finds nothing higher,
        // and half a year either side (inside the range) is lower.
        for (double e = 12; e <= eStar; e += 1)
            Assert.True(
                at >= Counted(inputs, reform, schedule, e),
                $"{e} years beats the optimum {opt.SchoolingYears}");
        Assert.True(at >= Counted(inputs, reform, schedule, opt.SchoolingYears - 0.5), "lower half a year below");
        if (opt.SchoolingYears + 0.5 <= eStar)
            Assert.True(at >= Counted(inputs, reform, schedule, opt.SchoolingYears + 0.5), "lower half a year above");
        // The tail counts gains the cut-off value ignores, so the optimum with the tail is at least as long.
        var cut = opt.ByHorizon.Single(x => x.HorizonYears == 80);
        Assert.True(
            opt.SchoolingYears >= cut.SchoolingYears - 0.01,
            $"{opt.SchoolingYears} with the tail, {cut.SchoolingYears} without");
        Assert.True(opt.PresentValue > cut.PresentValue);
    }

    [Fact]
    public void Without_a_finite_tail_the_optimum_is_cut_at_the_horizon_and_shown_at_other_horizons()
    {
        // The Green Book's last rate (1%) is below technology growth (1.5%): the tail has no finite value.
        var inputs = ReformSimulatorTests.Inputs();
        var reform = new ReformSettings(2028, 1, 80, ValuationYear: 2026);
        var opt = Appraisal.FindDiscountedOptimum(inputs, reform, DiscountSchedule.GreenBook, 34);
        Assert.False(opt.TailIncluded);
        Assert.Equal(new[] { 40, 80, 160 }, opt.ByHorizon.Select(x => x.HorizonYears));
        var atHorizon = opt.ByHorizon.Single(x => x.HorizonYears == 80);
        Assert.Equal(opt.SchoolingYears, atHorizon.SchoolingYears);
        Assert.Equal(opt.PresentValue, atHorizon.PresentValue);
        // A longer count adds later gains of longer schooling: the optimum does not shorten as the cut moves out.
        Assert.True(opt.ByHorizon[0].SchoolingYears <= opt.ByHorizon[1].SchoolingYears + 0.01
            && opt.ByHorizon[1].SchoolingYears <= opt.ByHorizon[2].SchoolingYears + 0.01,
            string.Join(", ", opt.ByHorizon.Select(x => $"{x.HorizonYears}: {x.SchoolingYears}")));
        Assert.Equal(80, opt.HorizonYears);
        Assert.Equal(DiscountSchedule.GreenBook.Label, opt.ScheduleLabel);
    }
}
