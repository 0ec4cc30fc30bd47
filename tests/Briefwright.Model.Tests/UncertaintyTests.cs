using Briefwright.Model.Dynamics;
using Briefwright.Model.Inputs;
using Briefwright.Model.Uncertainty;

namespace Briefwright.Model.Tests;

public class UncertaintyTests
{
    public class Sobol
    {
        // Ishigami & Homma (1990): f = sin x₁ + a·sin² x₂ + b·x₃⁴·sin x₁, xᵢ ~ U(−π, π), a = 7, b = 0.1. Analytic
        // variances (Saltelli et al. 2008, Global Sensitivity Analysis: The Primer): V = a²/8 + bπ⁴/5 + b²π⁸/18 + 1/2,
        // V₁ = (1 + bπ⁴/5)²/2, V₂ = a²/8, V₃ = 0, V₁₃ = 8b²π⁸/225. The published indices S₁ = 0.3139, S₂ = 0.4424,
        // S₃ = 0, S_T1 = 0.5576, S_T2 = 0.4424, S_T3 = 0.2437 are recalled from memory and checked against the
        // formulas.
        private const double A = 7, B = 0.1;
        private static readonly double V = A * A / 8 + B * Math.Pow(Math.PI, 4) / 5 + B * B * Math.Pow(Math.PI, 8) / 18
            + 0.5;
        private static readonly double V1 = 0.5 * Math.Pow(1 + B * Math.Pow(Math.PI, 4) / 5, 2), V2 = A * A / 8, V13 = 8
            * B
            * B
            * Math.Pow(Math.PI, 8) / 225;
        private static readonly double[] First = { V1 / V, V2 / V, 0 };
        private static readonly double[] Total = { (V1 + V13) / V, V2 / V, V13 / V };

        private static double[] Ishigami(double[] u)
        {
            double x1 = -Math.PI + 2 * Math.PI * u[0], x2 = -Math.PI + 2 * Math.PI * u[1], x3 = -Math.PI
                + 2 * Math.PI * u[2];
            return new[] { Math.Sin(x1) + A * Math.Pow(Math.Sin(x2), 2) + B * Math.Pow(x3, 4) * Math.Sin(x1) };
        }

        private static SobolIndices Run(int n, ulong seed, int resamples = 200) =>
            Model.Uncertainty.Sobol
                .Estimate(3, n, seed, new[] { "x1", "x2", "x3" }, Ishigami, maxThreads: 1, resamples: resamples)[0];

        [Fact]
        public void The_closed_form_gives_the_published_Ishigami_indices()
        {
            Assert.Equal(0.3139, First[0], 4);
            Assert.Equal(0.4424, First[1], 4);
            Assert.Equal(0.5576, Total[0], 4);
            Assert.Equal(0.4424, Total[1], 4);
            Assert.Equal(0.2437, Total[2], 4);
        }

        [Fact]
        public void Ishigami_estimates_lie_within_their_intervals_of_the_analytic_values()
        {
            var s = Run(20_000, 7, resamples: 500);
            for (int i = 0; i < 3; i++)
            {
                Assert.InRange(First[i], s.FirstOrderLow[i] - 1e-3, s.FirstOrderHigh[i] + 1e-3);
                Assert.InRange(Total[i], s.TotalLow[i] - 1e-3, s.TotalHigh[i] + 1e-3);
                Assert.True(
                    Math.Abs(s.FirstOrder[i] - First[i]) < 0.03,
                    $"S{i + 1} = {s.FirstOrder[i]}, analytic {First[i]}");
                Assert.True(Math.Abs(s.Total[i] - Total[i]) < 0.03, $"ST{i + 1} = {s.Total[i]}, analytic {Total[i]}");
            }
        }

        [Fact]
        public void The_error_on_Ishigami_shrinks_like_one_over_root_N()
        {
            // Root-mean-square error over 24 seeds at N and 16N: the ratio is √16 = 4 for a Monte Carlo estimator.
            double Rms(int n) => Math.Sqrt(Enumerable.Range(0, 24).Average(seed =>
            {
                var s = Run(n, (ulong)(100 + seed), resamples: 1);
                return Enumerable.Range(0, 3)
                    .Sum(i => Math.Pow(s.FirstOrder[i] - First[i], 2) + Math.Pow(s.Total[i] - Total[i], 2)) / 6;
            }));
            double small = Rms(250), large = Rms(4000);
            Assert.InRange(small / large, 2.8, 5.6);
        }

        [Fact]
        public void Interval_width_shrinks_like_one_over_root_N_and_covers_the_analytic_value_95_percent_of_the_time()
        {
            int covered = 0, cases = 0;
            double widthSmall = 0, widthLarge = 0;
            for (int seed = 0; seed < 20; seed++)
            {
                var small = Run(500, (ulong)(500 + seed));
                var large = Run(2000, (ulong)(900 + seed));
                widthSmall += small.TotalHigh[2] - small.TotalLow[2];
                widthLarge += large.TotalHigh[2] - large.TotalLow[2];
                foreach (var s in new[] { small, large })
                    for (int i = 0; i < 3; i++)
                    {
                        cases += 2;
                        if (s.FirstOrderLow[i] <= First[i] && First[i] <= s.FirstOrderHigh[i]) covered++;
                        if (s.TotalLow[i] <= Total[i] && Total[i] <= s.TotalHigh[i]) covered++;
                    }
            }
            Assert.InRange(widthSmall / widthLarge, 1.6, 2.5); // √4 = 2
            Assert.InRange(covered / (double)cases, 0.88, 1.0);
        }

        [Fact]
        public void An_input_without_effect_gets_exactly_zero_and_a_small_negative_estimate_is_kept_with_its_interval()
        {
            // f = u₁ + 0.02·u₂ + 0·u₃: S₃ = 0 exactly (f(A_B³) = f(A) row by row); S₂ = 0.0004/1.0004 is tiny, so some
            // seeds estimate it below zero, and the estimate is reported as computed, not clamped.
            var negatives = 0;
            for (int seed = 0; seed < 30; seed++)
            {
                var s = Model.Uncertainty.Sobol.Estimate(
                    3,
                    200,
                    (ulong)seed,
                    new[] { "a", "b", "c" },
                    u => new[] { u[0] + 0.02 * u[1] + 0 * u[2] },
                    maxThreads: 1,
                    resamples: 200)[0];
                Assert.Equal(0.0, s.FirstOrder[2]);
                Assert.Equal(0.0, s.Total[2]);
                Assert.Equal(0.0, s.FirstOrderLow[2]);
                Assert.Equal(0.0, s.TotalHigh[2]);
                Assert.True(s.FirstOrderLow[1] <= s.FirstOrder[1] && s.FirstOrder[1] <= s.FirstOrderHigh[1]);
                if (s.FirstOrder[1] < 0) negatives++;
            }
            Assert.True(negatives > 0, "no negative estimate of a near-zero index in 30 seeds: estimates look clamped");
        }

        [Fact]
        public void The_same_seed_gives_the_same_intervals_on_one_thread_or_all_cores()
        {
            var one = Model.Uncertainty.Sobol.Estimate(3, 300, 5, new[] {
                "x1",
                "x2",
                "x3" }, Ishigami, maxThreads: 1)[0];
            var all = Model.Uncertainty.Sobol
                .Estimate(3, 300, 5, new[] { "x1", "x2", "x3" }, Ishigami, maxThreads: ModelThreads.AllCores)[0];
            Assert.Equal(one.FirstOrderLow, all.FirstOrderLow);
            Assert.Equal(one.TotalHigh, all.TotalHigh);
        }
    }

    public class Distributions
    {
        // Reference distributions from Math.NET Numerics 5.0 (an independent implementation of each law): the mean and
        // the inverse CDF of our parameterisation must match theirs.
        public static TheoryData<Distribution, MathNet.Numerics.Distributions.IContinuousDistribution> Pairs => new()
        {
            { new NormalDistribution(0.2, 0.03), new MathNet.Numerics.Distributions.Normal(0.2, 0.03) },
            { new UniformDistribution(0.1, 0.4), new MathNet.Numerics.Distributions.ContinuousUniform(0.1, 0.4) },
            { new TriangularDistribution(60, 63, 70), new MathNet.Numerics.Distributions.Triangular(60, 70, 63) },
            { new LognormalDistribution(1.0, 0.2), new MathNet.Numerics.Distributions.LogNormal(Math.Log(1.0), 0.2) },
            {
                new LognormalDistribution(0.76, 0.03),
                new MathNet.Numerics.Distributions.LogNormal(Math.Log(0.76), 0.03) },
        };

        private static double SampleMean(Distribution d, int n, ulong seed)
        {
            var rng = new SplitMix64(seed);
            double sum = 0;
            for (int i = 0; i < n; i++) sum += d.Quantile(rng.NextOpenUnit());
            return sum / n;
        }

        [Theory]
        [MemberData(nameof(Pairs))]
        public void Mean_and_quantiles_match_Math_NET(
            Distribution ours,
            MathNet.Numerics.Distributions.IContinuousDistribution reference)
        {
            Assert.Equal(reference.Mean, ours.Mean, 12);
            foreach (double u in new[] { 0.001, 0.05, 0.3, 0.5, 0.7, 0.95, 0.999 })
            {
                double expected = reference switch
                {
                    MathNet.Numerics.Distributions.Normal n => n.InverseCumulativeDistribution(u),
                    MathNet.Numerics.Distributions.ContinuousUniform c => c.InverseCumulativeDistribution(u),
                    MathNet.Numerics.Distributions.Triangular t => t.InverseCumulativeDistribution(u),
                    MathNet.Numerics.Distributions.LogNormal l => l.InverseCumulativeDistribution(u),
                    _ => throw new InvalidOperationException(),
                };
                Assert.Equal(expected, ours.Quantile(u), 9);
            }
        }

        [Theory]
        [MemberData(nameof(Pairs))]
        public void Sample_mean_of_draws_through_the_quantile_approaches_Math_NET_s_mean(
            Distribution ours,
            MathNet.Numerics.Distributions.IContinuousDistribution reference)
        {
            // Within four standard errors of the mean (Math.NET's standard deviation over √n).
            int n = 200_000;
            Assert.InRange(
                SampleMean(ours, n, 11),
                reference.Mean - 4 * reference.StdDev / Math.Sqrt(n),
                reference.Mean + 4 * reference.StdDev / Math.Sqrt(n));
        }

        [Fact]
        public void Truncated_normal_mean_and_quantiles_match_numerical_integration_of_the_density()
        {
            // Independent route: the normal density of Math.NET integrated over [low, high] (double-exponential
            // quadrature).
            var d = new TruncatedNormalDistribution(0.2, 0.05, 0.15, 0.3);
            var normal = new MathNet.Numerics.Distributions.Normal(0.2, 0.05);
            double mass = MathNet.Numerics.Integrate.DoubleExponential(normal.Density, 0.15, 0.3, 1e-14);
            double mean = MathNet.Numerics.Integrate.DoubleExponential(x => x * normal.Density(x), 0.15, 0.3, 1e-14)
                / mass;
            Assert.Equal(mean, d.Mean, 9);
            foreach (double u in new[] { 0.05, 0.5, 0.9 })
            {
                double x = d.Quantile(u);
                Assert.Equal(u, MathNet.Numerics.Integrate.DoubleExponential(normal.Density, 0.15, x, 1e-14) / mass, 9);
            }
        }

        [Fact]
        public void Error_shrinks_roughly_as_one_over_root_n()
        {
            var d = new UniformDistribution(0, 1);
            double Rms(int n) =>
                Math.Sqrt(Enumerable.Range(0, 200)
                    .Average(s => Math.Pow(SampleMean(d, n, (ulong)(1000 + s)) - 0.5, 2)));
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

    public class PrecisionOfSummaries
    {
        [Theory]
        // Newcombe (1998), Statistics in Medicine 17:857–872, Table II, Wilson score interval without continuity
        // correction (values recalled from memory; 0/20 also follows from the closed form z²/(n + z²)).
        [InlineData(81, 263, 0.2553, 0.3662)]
        [InlineData(15, 148, 0.0624, 0.1605)]
        [InlineData(0, 20, 0.0000, 0.1611)]
        [InlineData(1, 29, 0.0061, 0.1718)]
        public void Wilson_intervals_match_Newcombe_s_worked_examples(int count, int n, double low, double high)
        {
            var p = Probability.Of(count, n);
            Assert.Equal(low, p.Low, 4);
            Assert.Equal(high, p.High, 4);
        }

        [Fact]
        public void All_draws_showing_a_gain_give_an_interval_below_certainty()
        {
            // z²/(n + z²) with z = 1.959964 and n = 2,000: the lower bound is 1 − 0.0019171.
            var p = Probability.Of(2000, 2000);
            Assert.Equal(1.0, p.Estimate);
            Assert.Equal(1.0, p.High);
            Assert.Equal(1 - 1.959964 * 1.959964 / (2000 + 1.959964 * 1.959964), p.Low, 6);
        }

        [Fact]
        public void Percentile_intervals_cover_the_true_normal_quantile_about_95_percent_of_the_time()
        {
            // True quantiles of the standard normal from Math.NET; 400 samples of 1,000 draws each.
            double[] levels = { 0.05, 0.25, 0.5, 0.75, 0.95 };
            var truth = levels.Select(q => MathNet.Numerics.Distributions.Normal.InvCDF(0, 1, q)).ToArray();
            var hits = new int[levels.Length];
            int runs = 400;
            for (int r = 0; r < runs; r++)
            {
                var rng = SplitMix64.ForStream(77, (ulong)r);
                var sample = Enumerable.Range(0, 1000).Select(_ => NormalQuantile.Standard(rng.NextOpenUnit()))
                    .ToArray();
                var s = PercentileSummary.Of(sample);
                var intervals = new[] { s.P5Interval, s.P25Interval, s.P50Interval, s.P75Interval, s.P95Interval };
                for (int k = 0; k < levels.Length; k++)
                    if (intervals[k].Low <= truth[k] && truth[k] <= intervals[k].High) hits[k]++;
            }
            // Binomial(400, 0.95) lies within 0.92–0.98 with probability above 99%.
            foreach (int h in hits) Assert.InRange(h / (double)runs, 0.92, 0.985);
        }

        [Fact]
        public void The_standard_error_of_the_mean_is_the_sample_standard_deviation_over_root_n()
        {
            var sample = new[] { 2.0, 4, 4, 4, 5, 5, 7, 9 };
            var s = PercentileSummary.Of(sample);
            // Sample variance with n − 1: 32/7.
            Assert.Equal(Math.Sqrt(32.0 / 7) / Math.Sqrt(8), s.MeanStandardError, 12);
        }
    }

    public class MonteCarloRuns
    {
        private static AnalysisSettings Settings(params UncertainParameter[] parameters) => new(
            new ReformSettings(2027, 1, 80), "plus1", new[] {
                DiscountSchedule.GreenBook }, Array.Empty<SensitivityRange>(), Array.Empty<GridSpec>(),
            new MonteCarloSpec(300, 2026, parameters, 64));

        [Fact]
        public void Same_seed_gives_identical_numbers_to_the_last_digit()
        {
            var inputs = ReformSimulatorTests.Inputs();
            var settings = Settings(
                new UncertainParameter("saving_rate", new NormalDistribution(0.22, 0.02)),
                new UncertainParameter("return_scale", new UniformDistribution(0.8, 1.2)));
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
            var settings = Settings(
                new UncertainParameter("saving_rate", new NormalDistribution(0.22, 0.02)),
                new UncertainParameter("population_growth", new UniformDistribution(-0.005, 0.015)))
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
                    new SensitivityRange("population_growth", 0.0, 0.02), new SensitivityRange(
                        "capital_share",
                        0.28,
                        0.38),
                },
            };
            var rows = Sensitivity.Tornado(inputs, settings, 34);
            Assert.Equal(
                new[] { "population_growth", "capital_share", "depreciation", "saving_rate" },
                rows.Select(r => r.Parameter));
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
        public void The_probability_of_a_gain_matches_the_exact_threshold_probability_and_rises_with_the_return()
        {
            // With the return to schooling scaled by k ~ U(low, high) and nothing else uncertain, the long-run change
            // is positive exactly when k exceeds the threshold k* where it crosses zero (found here by Brent's
            // method on the deterministic model), so P(gain) = (high − k*)/(high − low). The Monte Carlo estimate must
            // agree within its own 95% interval (widened by a draw for rounding), and a distribution of higher returns
            // must give a higher probability.
            var inputs = ReformSimulatorTests.Inputs();
            var settings = Settings();
            double Change(double k) =>
                KeyResultsEvaluator.Evaluate(Parameters.Find("return_scale")!.Set(inputs, k), settings, 34)
                    .LongRunChangePct[0];
            double threshold = MathNet.Numerics.RootFinding.Brent.FindRoot(Change, 0.05, 1.0, 1e-10);
            Probability Run(double low, double high)
            {
                var parameter = new UncertainParameter("return_scale", new UniformDistribution(low, high));
                return MonteCarlo.Run(inputs, Settings(parameter), 34)
                    .Options.Single(o => o.OptionId == "plus1").ProbabilityGain;
            }
            var lower = Run(0.0, 1.0);
            var higher = Run(0.3, 1.3);
            foreach (var (p, low, high) in new[] { (lower, 0.0, 1.0), (higher, 0.3, 1.3) })
            {
                double exact = (high - threshold) / (high - low);
                Assert.InRange(exact, p.Low - 1.0 / p.Draws, p.High + 1.0 / p.Draws);
            }
            Assert.True(
                higher.Estimate > lower.Estimate,
                $"{higher.Estimate} with higher returns, {lower.Estimate} with lower");
            Assert.True(lower.Low < lower.Estimate && lower.Estimate < lower.High);
        }
    }
}
