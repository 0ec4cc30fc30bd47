using Briefwright.Model.Dynamics;
using Briefwright.Model.Inputs;
using Briefwright.Model.Uncertainty;

namespace Briefwright.Model.Tests;

public class UncertaintyTests
{
    public class Sobol
    {
        [Fact]
        public void Ishigami_indices_match_the_closed_form_variance_decomposition()
        {
            // Ishigami & Homma (1990): f = sin x₁ + a sin² x₂ + b x₃⁴ sin x₁, xᵢ ~ U(−π, π), a = 7, b = 0.1.
            // Closed form: V = a²/8 + bπ⁴/5 + b²π⁸/18 + 1/2; V₁ = (1 + bπ⁴/5)²/2; V₂ = a²/8; V₃ = 0; V₁₃ = 8b²π⁸/225.
            double a = 7, b = 0.1, pi = Math.PI;
            double v = a * a / 8 + b * Math.Pow(pi, 4) / 5 + b * b * Math.Pow(pi, 8) / 18 + 0.5;
            double v1 = 0.5 * Math.Pow(1 + b * Math.Pow(pi, 4) / 5, 2), v2 = a * a / 8, v13 = 8 * b * b * Math.Pow(pi, 8) / 225;
            double[] first = { v1 / v, v2 / v, 0 };
            double[] total = { (v1 + v13) / v, v2 / v, v13 / v };
            Assert.Equal(0.3139, first[0], 4);
            Assert.Equal(0.4424, first[1], 4);
            Assert.Equal(0.5576, total[0], 4);
            Assert.Equal(0.2437, total[2], 4);

            var s = Model.Uncertainty.Sobol.Estimate(3, 40_000, 7, new[] { "x1", "x2", "x3" }, u =>
            {
                double x1 = -pi + 2 * pi * u[0], x2 = -pi + 2 * pi * u[1], x3 = -pi + 2 * pi * u[2];
                return new[] { Math.Sin(x1) + a * Math.Pow(Math.Sin(x2), 2) + b * Math.Pow(x3, 4) * Math.Sin(x1) };
            })[0];
            for (int i = 0; i < 3; i++)
            {
                Assert.True(Math.Abs(s.FirstOrder[i] - first[i]) < 0.03, $"S{i + 1} = {s.FirstOrder[i]}, expected {first[i]}");
                Assert.True(Math.Abs(s.Total[i] - total[i]) < 0.03, $"ST{i + 1} = {s.Total[i]}, expected {total[i]}");
            }
        }
    }

    public class Distributions
    {
        public static TheoryData<Distribution> All => new()
        {
            new NormalDistribution(0.2, 0.03),
            new TruncatedNormalDistribution(0.2, 0.05, 0.15, 0.3),
            new UniformDistribution(0.1, 0.4),
            new TriangularDistribution(60, 63, 70),
            new LognormalDistribution(1.0, 0.2),
        };

        private static double SampleMean(Distribution d, int n, ulong seed)
        {
            var rng = new SplitMix64(seed);
            double sum = 0;
            for (int i = 0; i < n; i++) sum += d.Quantile(rng.NextOpenUnit());
            return sum / n;
        }

        [Theory]
        [MemberData(nameof(All))]
        public void Sample_mean_approaches_the_known_expectation(Distribution d)
        {
            // Expectations from the textbook formulas (truncated normal: μ + σ(φ(α) − φ(β))/(Φ(β) − Φ(α)); lognormal: m·e^(σ²/2)).
            double mean = SampleMean(d, 200_000, 11);
            double scale = Math.Abs(d.Mean) + 1e-3;
            Assert.True(Math.Abs(mean - d.Mean) / scale < 2e-3, $"{mean} vs {d.Mean}");
        }

        [Fact]
        public void Error_shrinks_roughly_as_one_over_root_n()
        {
            var d = new UniformDistribution(0, 1);
            double Rms(int n) => Math.Sqrt(Enumerable.Range(0, 200).Average(s => Math.Pow(SampleMean(d, n, (ulong)(1000 + s)) - 0.5, 2)));
            double ratio = Rms(250) / Rms(4000); // √16 = 4 expected
            Assert.InRange(ratio, 3.0, 5.3);
        }

        [Fact]
        public void The_same_seed_gives_the_same_stream()
        {
            var a = SplitMix64.ForStream(42, 7);
            var b = SplitMix64.ForStream(42, 7);
            for (int i = 0; i < 100; i++) Assert.Equal(a.NextUInt64(), b.NextUInt64());
        }
    }

    public class MonteCarloRuns
    {
        private static AnalysisSettings Settings(params UncertainParameter[] parameters) => new(
            new ReformSettings(2027, 1, 80), "plus1", new[] { DiscountSchedule.GreenBook }, Array.Empty<SensitivityRange>(), Array.Empty<GridSpec>(),
            new MonteCarloSpec(300, 2026, parameters, 64));

        [Fact]
        public void Same_seed_gives_identical_numbers_to_the_last_digit()
        {
            var inputs = ReformSimulatorTests.Inputs();
            var settings = Settings(new UncertainParameter("saving_rate", new NormalDistribution(0.22, 0.02)), new UncertainParameter("return_scale", new UniformDistribution(0.8, 1.2)));
            var a = MonteCarlo.Run(inputs, settings, 34);
            var b = MonteCarlo.Run(inputs, settings, 34);
            Assert.Equal(a.HeadlineChangeSample, b.HeadlineChangeSample);
            Assert.Equal(a.OptimumYears, b.OptimumYears);
            Assert.Equal(a.HeadlineFan[40], b.HeadlineFan[40]);
        }

        [Fact]
        public void One_thread_or_all_cores_give_identical_results()
        {
            // Batches run the model on one thread per brief; a single brief uses every core. Each draw has its own
            // random stream and results are gathered in draw order, so the numbers must not differ in any digit.
            var inputs = ReformSimulatorTests.Inputs();
            var settings = Settings(new UncertainParameter("saving_rate", new NormalDistribution(0.22, 0.02)), new UncertainParameter("population_growth", new UniformDistribution(-0.005, 0.015)))
                with { Ranges = new[] { new SensitivityRange("saving_rate", 0.18, 0.26) } };
            var bgp = Core.BalancedGrowth.Solve(inputs);
            var one = AnalysisRunner.Run(inputs, settings, bgp, maxThreads: 1);
            var all = AnalysisRunner.Run(inputs, settings, bgp, maxThreads: ModelThreads.AllCores);
            Assert.Equal(one.MonteCarlo!.HeadlineChangeSample, all.MonteCarlo!.HeadlineChangeSample);
            Assert.Equal(one.MonteCarlo.HeadlineFan, all.MonteCarlo.HeadlineFan);
            Assert.Equal(one.Sobol!.Indices[0].FirstOrder, all.Sobol!.Indices[0].FirstOrder);
            Assert.Equal(one.Sobol.Indices[2].Total, all.Sobol.Indices[2].Total);
            Assert.Equal(one.Tornado[0].AtLow.PresentValue, all.Tornado[0].AtLow.PresentValue);
        }

        [Fact]
        public void Tornado_rows_that_do_not_move_the_result_tie_and_are_ordered_by_name()
        {
            // The long-run change is a ratio of outputs per person, so ŷ* cancels: saving rate, depreciation and the
            // capital share leave it unchanged (their swings are zero up to rounding). They must come after the
            // parameter that matters, alphabetically, whatever the last digits.
            var inputs = ReformSimulatorTests.Inputs();
            var settings = Settings() with
            {
                Ranges = new[]
                {
                    new SensitivityRange("saving_rate", 0.18, 0.26), new SensitivityRange("depreciation", 0.02, 0.05),
                    new SensitivityRange("population_growth", 0.0, 0.02), new SensitivityRange("capital_share", 0.28, 0.38),
                },
            };
            var rows = Sensitivity.Tornado(inputs, settings, 34);
            Assert.Equal(new[] { "population_growth", "capital_share", "depreciation", "saving_rate" }, rows.Select(r => r.Parameter));
            Assert.All(rows.Skip(1), r => Assert.True(r.Swing < 1e-9));
        }

        [Fact]
        public void Headline_only_evaluation_matches_the_headline_entry_of_the_full_one()
        {
            // Sobol runs evaluate the headline option alone; its numbers must be those of the full evaluation.
            var inputs = ReformSimulatorTests.Inputs();
            var settings = Settings();
            var full = KeyResultsEvaluator.Evaluate(inputs, settings, 34);
            var alone = KeyResultsEvaluator.Evaluate(inputs, settings, 34, headlineOnly: true);
            int k = full.OptionIds.ToList().IndexOf("plus1");
            Assert.Equal(new[] { "plus1" }, alone.OptionIds);
            Assert.Equal(full.LongRunChangePct[k], alone.LongRunChangePct[0]);
            Assert.Equal(full.PresentValue[k], alone.PresentValue[0]);
            Assert.Equal(full.OptimumYears, alone.OptimumYears);
        }

        [Fact]
        public void Draws_that_break_a_model_rule_are_rejected_and_counted()
        {
            var inputs = ReformSimulatorTests.Inputs();
            var settings = Settings(new UncertainParameter("saving_rate", new UniformDistribution(0.5, 1.3)));
            var r = MonteCarlo.Run(inputs, settings, 34);
            Assert.True(r.Rejected > 0);
            Assert.Equal(300, r.Draws);
        }

        [Fact]
        public void A_higher_return_to_schooling_raises_the_probability_of_a_gain()
        {
            var inputs = ReformSimulatorTests.Inputs();
            var r = MonteCarlo.Run(inputs, Settings(new UncertainParameter("return_scale", new UniformDistribution(0.0, 1.5))), 34);
            var plus1 = r.Options.Single(o => o.OptionId == "plus1");
            Assert.InRange(plus1.ProbabilityGain, 0.05, 0.999);
            Assert.True(plus1.LongRunChangePct.P5 < plus1.LongRunChangePct.P95);
        }
    }
}
