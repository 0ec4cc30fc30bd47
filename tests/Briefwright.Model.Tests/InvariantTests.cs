using Briefwright.Model.Core;
using Briefwright.Model.Inputs;
using CsCheck;

namespace Briefwright.Model.Tests;

/// <summary>Model invariants over 2,000 random valid economies (CsCheck generators, fixed PCG seed).</summary>
public class InvariantTests
{
    private static readonly Gen<(Demography, HumanCapital, Production)> Economies =
        Gen.Select(Gen.Double[-0.03, 0.04], Gen.Double[3, 8], Gen.Double[55, 72], Gen.Int[0, 2], Gen.Double[0.3, 1.0])
            .Select(
                Gen.Double[0.02, 0.15],
                Gen.Int[0, 2],
                Gen.Double[0.05, 0.4],
                Gen.Double[0.2, 0.45],
                Gen.Double[0.0, 0.08])
            .Select(t =>
            {
                var ((n, entry, retire, survivalKind, p), r, schedule, s, alpha, delta) = t;
                Survival survival = survivalKind switch
                {
                    0 => new RectangularSurvival(retire + 10),
                    1 => new GompertzMakehamSurvival(0.0003, 3e-6, 1.12, 110),
                    _ => new TabulatedSurvival(new double[] { 0, 40, 80, 100 }, new[] { 1.0, 0.97, 0.6, 0.0 }),
                };
                ReturnSchedule returns = schedule switch
                {
                    0 => new ConstantReturn(r),
                    1 => BracketReturns.HallJones,
                    _ => new PowerReturn(0.32, 0.58),
                };
                var d = new Demography(n, entry, Math.Min(retire, survival.MaxAge), survival, p);
                return (
                    d,
                    new HumanCapital(returns, schedule == 1 ? new ExperienceProfile(0.081, 0.0012) : null),
                    new Production(s, alpha, Math.Max(delta, 0.04 - n), 0.015));
            });

    [Fact]
    public void Worker_share_human_capital_output_and_optimum_behave_for_every_random_economy()
    {
        var pcg = new PCG(7, 20261130);
        for (int i = 0; i < 2000; i++)
        {
            var (d, hc, prod) = Economies.Generate(pcg, null!, out _);
            var cycle = new LifeCycle(d, hc);
            double eMax = cycle.MaxSchooling, previousOmega = double.PositiveInfinity, previousH = 0;
            for (int k = 0; k <= 20; k++)
            {
                double e = eMax * k / 20.0;
                double omega = cycle.WorkerShare(e), h = Math.Exp(hc.Returns.Phi(e));
                Assert.InRange(omega, 0.0, 1.0);
                Assert.True(omega <= previousOmega + 1e-12, $"case {i}: worker share rose with schooling at E = {e}");
                Assert.True(h >= previousH, $"case {i}: human capital fell with schooling at E = {e}");
                previousOmega = omega;
                previousH = h;
            }
            var options = new[] {
                new PolicyOption("a", "A", Math.Min(10, eMax / 2)),
                new PolicyOption("b", "B", Math.Min(12, eMax * 0.6)) };
            var r = BalancedGrowth.Solve(new ModelInputs(d, hc, prod, options, "a"), gridPoints: 60);
            Assert.All(r.Options, o => Assert.True(
                double.IsFinite(o.OutputPerPerson) && o.OutputPerPerson > 0,
                $"case {i}: output {o.OutputPerPerson}"));
            Assert.InRange(r.Optimum.SchoolingYears, 0, eMax);
            bool interior = r.Optimum.SchoolingYears > 1e-9 && r.Optimum.SchoolingYears < eMax - 1e-9;
            Assert.True(
                interior || r.Optimum.AtBoundary,
                $"case {i}: optimum {r.Optimum.SchoolingYears} at an edge but not flagged");
        }
    }
}
