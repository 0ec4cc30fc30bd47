using Briefwright.Model.Core;
using Briefwright.Model.Inputs;
using Briefwright.Model.Results;

namespace Briefwright.Model.Tests;

public class BalancedGrowthTests
{
    public class OutputPerEffectiveWorker
    {
        [Fact]
        public void Is_the_square_root_of_s_over_n_g_delta_when_alpha_is_one_third()
        {
            // Mankiw, Romer & Weil (1992) calibration α = 1/3; s = 0.2, n + g + δ = 0.06: (0.2/0.06)^(1/2) = 1.8257.
            var d = Fixtures.Classic(60, 0.01);
            Assert.Equal(1.8257, BalancedGrowth.OutputPerEffectiveWorker(d, Fixtures.MankiwRomerWeil), 4);
        }
    }

    public class Solve
    {
        private static ModelInputs Inputs(double n) => new(
            new Demography(n, 6, 65, new RectangularSurvival(80), 0.7),
            new HumanCapital(BracketReturns.HallJones, null),
            Fixtures.MankiwRomerWeil,
            new[] {
                new PolicyOption("base", "Base", 10),
                new PolicyOption("more", "More", 12),
                new PolicyOption("late", "Later retirement", 10, RetirementAge: 67) },
            "base");

        [Fact]
        public void Output_per_person_is_y_hat_times_h_times_omega_and_changes_are_relative_to_the_baseline()
        {
            var r = BalancedGrowth.Solve(Inputs(0.01));
            var more = r.Options.Single(o => o.Id == "more");
            var baseline = r.Options.Single(o => o.IsBaseline);
            Assert.Equal(
                more.OutputPerEffectiveWorker * more.HumanCapitalPerWorker * more.WorkerShare,
                more.OutputPerPerson,
                12);
            Assert.Equal(0.0, baseline.ChangeVsBaselinePct);
            Assert.Equal(100 * (more.OutputPerPerson / baseline.OutputPerPerson - 1), more.ChangeVsBaselinePct, 10);
        }

        [Fact]
        public void A_later_retirement_age_raises_the_worker_share()
        {
            var r = BalancedGrowth.Solve(Inputs(0.01));
            Assert.True(
                r.Options.Single(o => o.Id == "late").WorkerShare > r.Options.Single(o => o.Id == "base").WorkerShare);
        }

        [Fact]
        public void Negative_growth_solves_with_a_numerical_optimum_and_a_band_around_it()
        {
            var r = BalancedGrowth.Solve(Inputs(-0.01));
            Assert.Equal(OptimumMethod.Numerical, r.Optimum.Method);
            Assert.True(
                r.Optimum.Within1Pct[0] < r.Optimum.SchoolingYears
                && r.Optimum.SchoolingYears < r.Optimum.Within1Pct[1]);
            Assert.True(r.Optimum.Diagnostics.Converged);
        }
    }
}
