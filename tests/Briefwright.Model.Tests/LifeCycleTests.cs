using Briefwright.Model.Core;
using Briefwright.Model.Inputs;

namespace Briefwright.Model.Tests;

public class LifeCycleTests
{
    public class WorkerShare
    {
        [Theory]
        [InlineData(60, 0.02, 15)]
        [InlineData(60, -0.01, 15)]
        [InlineData(75, 0.005, 30)]
        public void Matches_the_classic_formula_for_school_from_birth_to_death(double t, double n, double e)
        {
            // ω = (e^(−nE) − e^(−nT)) / (1 − e^(−nT)), derived from the stable-population integral.
            var cycle = new LifeCycle(Fixtures.Classic(t, n), Fixtures.Constant(0.1));
            double expected = (Math.Exp(-n * e) - Math.Exp(-n * t)) / (1 - Math.Exp(-n * t));
            Assert.Equal(expected, cycle.WorkerShare(e), 12);
        }

        [Fact]
        public void Is_continuous_through_zero_growth()
        {
            // The n → 0 limit is (T − E)/T, and to first order ω(n) = (T − E)/T · (1 − nE/2) (Taylor expansion of
            // the classic formula). The raw ratio loses about half its digits at n = 1e-9; the stable form must not.
            var atZero = new LifeCycle(Fixtures.Classic(60, 0.0), Fixtures.Constant(0.1)).WorkerShare(15);
            var nearZero = new LifeCycle(Fixtures.Classic(60, 1e-9), Fixtures.Constant(0.1)).WorkerShare(15);
            var belowZero = new LifeCycle(Fixtures.Classic(60, -1e-9), Fixtures.Constant(0.1)).WorkerShare(15);
            Assert.Equal(45.0 / 60.0, atZero, 14);
            Assert.Equal(0.75 * (1 - 1e-9 * 15 / 2), nearZero, 14);
            Assert.Equal(0.75 * (1 + 1e-9 * 15 / 2), belowZero, 14);
            Assert.Equal(atZero, nearZero, 7);
        }

        [Theory]
        [InlineData(0.02)]
        [InlineData(0.0)]
        [InlineData(-0.015)]
        public void Quadrature_agrees_with_the_closed_form_for_rectangular_survival(double n)
        {
            var d = new Demography(
                n,
                EntryAge: 6,
                RetirementAge: 64.5,
                new RectangularSurvival(82.3),
                Participation: 0.8);
            var cycle = new LifeCycle(d, Fixtures.Constant(0.1));
            Assert.Equal(cycle.WorkerShare(12.25), cycle.WorkerShareByQuadrature(12.25), 12);
        }

        [Fact]
        public void Stays_within_zero_and_one_and_falls_with_schooling_under_Gompertz_Makeham()
        {
            var d = new Demography(-0.01, 6, 65, new GompertzMakehamSurvival(0.00022, 2.7e-6, 1.124, 120), 0.75);
            var cycle = new LifeCycle(d, Fixtures.Constant(0.08));
            double previous = double.PositiveInfinity;
            for (double e = 0; e <= 59; e += 0.5)
            {
                double w = cycle.WorkerShare(e);
                Assert.InRange(w, 0.0, 1.0);
                Assert.True(w < previous);
                previous = w;
            }
        }
    }

    public class HumanCapitalPerWorker
    {
        [Theory]
        // Hall & Jones (1999), QJE 114(1), rates after Psacharopoulos (1994): 13.4% for years 0–4, 10.1% for 4–8,
        // 6.8% beyond. Brackets of unequal use, so the order of the rates matters:
        // φ(6) = 4×0.134 + 2×0.101 = 0.738, φ(10) = 4×0.134 + 4×0.101 + 2×0.068 = 1.076, φ(3) = 3×0.134 = 0.402.
        [InlineData(3.0, 1.4948)]
        [InlineData(6.0, 2.0917)]
        [InlineData(10.0, 2.9329)]
        public void Hall_Jones_schedule_applies_each_rate_to_its_own_bracket(double years, double expected)
        {
            var cycle = new LifeCycle(Fixtures.Classic(60, 0.01), new HumanCapital(BracketReturns.HallJones, null));
            Assert.Equal(expected, cycle.HumanCapitalPerWorker(years), 4);
        }

        [Fact]
        public void Hall_Jones_schedule_gives_3_3602_at_twelve_years()
        {
            // Hall & Jones (1999), QJE 114(1): φ(12) = 4×0.134 + 4×0.101 + 4×0.068 = 1.212; e^1.212 = 3.3602.
            var cycle = new LifeCycle(Fixtures.Classic(60, 0.01), new HumanCapital(BracketReturns.HallJones, null));
            Assert.Equal(3.3602, cycle.HumanCapitalPerWorker(12), 4);
        }

        [Fact]
        public void Experience_profile_raises_human_capital_by_the_weighted_average_premium()
        {
            // Independent route: the average of e^(β₁x − β₂x²) over x ∈ [0, 40] with uniform weights (n = 0,
            // rectangular survival) computed by a fine midpoint sum.
            var profile = new ExperienceProfile(0.081, 0.0012);
            var d = new Demography(0.0, 0, 50, new RectangularSurvival(50), 1.0);
            var cycle = new LifeCycle(d, new HumanCapital(new ConstantReturn(0.1), profile));
            double sum = 0;
            const int steps = 400_000;
            for (int i = 0; i < steps; i++) sum += Math.Exp(profile.LogPremium((i + 0.5) * 40.0 / steps));
            Assert.Equal(Math.Exp(1.0) * sum / steps, cycle.HumanCapitalPerWorker(10), 8);
        }
    }
}
