namespace Briefwright.Model.Uncertainty;

/// <summary>
/// First-order and total Sobol indices of one output for each input, each with a bootstrap confidence interval
/// (<see cref="Level"/>, percentile method over <see cref="Resamples"/> resamples of the base rows). Estimates are
/// reported as computed: a small negative estimate is noise around zero, and its interval says how much.
/// </summary>
public sealed record SobolIndices(
    IReadOnlyList<string> Inputs,
    double[] FirstOrder,
    double[] FirstOrderLow,
    double[] FirstOrderHigh,
    double[] Total,
    double[] TotalLow,
    double[] TotalHigh,
    double Variance,
    int Samples,
    int Resamples,
    double Level)
{
    public bool Equals(SobolIndices? other) =>
        other is not null && Same.Items(Inputs, other.Inputs) && Same.Items(FirstOrder, other.FirstOrder)
        && Same.Items(FirstOrderLow, other.FirstOrderLow) && Same.Items(FirstOrderHigh, other.FirstOrderHigh)
        && Same.Items(Total, other.Total) && Same.Items(TotalLow, other.TotalLow)
        && Same.Items(TotalHigh, other.TotalHigh) && Variance.Equals(other.Variance) && Samples == other.Samples
        && Resamples == other.Resamples && Level.Equals(other.Level);

    public override int GetHashCode() => HashCode.Combine(Same.Hash(Inputs), Same.Hash(Total), Variance, Samples);

    /// <summary>The widest half-width of any interval, first-order or total.</summary>
    public double WidestHalfWidth()
    {
        double w = 0;
        for (int i = 0; i < Inputs.Count; i++)
            w = Math.Max(w, Math.Max(FirstOrderHigh[i] - FirstOrderLow[i], TotalHigh[i] - TotalLow[i]) / 2);
        return w;
    }
}

/// <summary>
/// Variance-based sensitivity: Saltelli's sampling scheme (matrices A, B and, for each input i, A with column i taken
/// from B, written A_B^i) with the estimators recommended by Saltelli et al. (2010, Comput. Phys. Commun. 181,
/// 259–270, Table 2): first order V_i = mean[(f(B) − f̄)·(f(A_B^i) − f(A))], total V_Ti = ½·mean[(f(A) − f(A_B^i))²]
/// (Jansen 1999). f(B) is centred on the mean f̄ of the A and B outputs: uncentred, the first-order estimator's
/// error grows with the output's mean (a 3% change with a spread of 0.3 points gave intervals ±0.6 wide at N = 512).
/// Both are exactly 0 for an input that has no effect. Costs (d + 2)·N evaluations of f; the
/// bootstrap resamples the N rows (Efron &amp; Tibshirani 1993, percentile intervals) and costs no evaluations.
/// </summary>
public static class Sobol
{
    public const int DefaultResamples = 1000;
    public const double DefaultLevel = 0.95;

    /// <summary>Base samples whose every run must meet the model's rules: half of them, and at least two (the indices
    /// are ratios of variances over the accepted rows; below that they say nothing).</summary>
    public static int MinRows(int n) => Math.Max(2, (n + 1) / 2);

    /// <summary>Row <paramref name="r"/> of the base matrices A and B: its own random stream from (seed, r), A's d
    /// uniforms first, then B's.</summary>
    public static void BaseRow(ulong seed, int r, Span<double> a, Span<double> b)
    {
        var rng = SplitMix64.ForStream(seed, (ulong)r);
        for (int j = 0; j < a.Length; j++) a[j] = rng.NextOpenUnit();
        for (int j = 0; j < b.Length; j++) b[j] = rng.NextOpenUnit();
    }

    /// <param name="f">The model on the unit cube: d uniforms in (0,1) to several outputs.</param>
    public static IReadOnlyList<SobolIndices> Estimate(
        int d, int n, ulong seed, IReadOnlyList<string> inputNames, Func<double[], double[]?> f,
        int maxThreads = ModelThreads.AllCores, int resamples = DefaultResamples, double level = DefaultLevel)
    {
        var a = new double[n][];
        var b = new double[n][];
        for (int r = 0; r < n; r++)
        {
            a[r] = new double[d];
            b[r] = new double[d];
            BaseRow(seed, r, a[r], b[r]);
        }
        var fa = new double[]?[n];
        var fb = new double[]?[n];
        var fab = new double[]?[d, n];
        Parallel.For(0, n, ModelThreads.Options(maxThreads), r =>
        {
            fa[r] = f(a[r]);
            fb[r] = f(b[r]);
            for (int i = 0; i < d; i++)
            {
                var mixed = (double[])a[r].Clone();
                mixed[i] = b[r][i];
                fab[i, r] = f(mixed);
            }
        });
        // Rows where any evaluation broke a model rule are dropped from every estimator alike.
        var rows = Enumerable.Range(0, n)
            .Where(r => fa[r] is not null && fb[r] is not null
                && Enumerable.Range(0, d).All(i => fab[i, r] is not null))
            .ToArray();
        int m = rows.Length;
        if (m < MinRows(n))
            throw new ModelRuleException($"Sobol indices: only {m} of {n} base samples met every model rule in all " +
                $"{d + 2} of their runs (at least {MinRows(n)} must); narrow the distributions, or set " +
                "uncertainty.sobol_samples to 0 to skip the indices.");
        int outputs = fa[rows[0]]!.Length;
        // Resample s draws its rows from its own stream, so every output sees the same resamples and threads change
        // nothing.
        ulong bootSeed = seed ^ 0xB007_57A9_0000_0001UL;
        return ModelThreads.Map(
            outputs, maxThreads, k => Output(k, d, rows, fa, fb, fab, inputNames, bootSeed, resamples, level));
    }

    /// <summary>The indices of output <paramref name="k"/> over the accepted rows, with bootstrap intervals.</summary>
    private static SobolIndices Output(int k, int d, int[] rows, double[]?[] fa, double[]?[] fb, double[]?[,] fab,
        IReadOnlyList<string> inputNames, ulong bootSeed, int resamples, double level)
    {
        int m = rows.Length;
        // Column-major copies of this output: yA[j], yB[j], yAB[i][j] for the accepted rows.
        var yA = rows.Select(r => fa[r]![k]).ToArray();
        var yB = rows.Select(r => fb[r]![k]).ToArray();
        var yAB = Enumerable.Range(0, d).Select(i => rows.Select(r => fab[i, r]![k]).ToArray()).ToArray();
        var all = Enumerable.Range(0, m).ToArray();
        var (first, total, variance) = Indices(yA, yB, yAB, all);
        var bootFirst = new double[d][];
        var bootTotal = new double[d][];
        for (int i = 0; i < d; i++) { bootFirst[i] = new double[resamples]; bootTotal[i] = new double[resamples]; }
        var pick = new int[m];
        for (int s = 0; s < resamples; s++)
        {
            var rng = SplitMix64.ForStream(bootSeed, (ulong)s);
            for (int j = 0; j < m; j++) pick[j] = (int)(rng.NextUInt64() % (ulong)m);
            var (bf, bt, _) = Indices(yA, yB, yAB, pick);
            for (int i = 0; i < d; i++) { bootFirst[i][s] = bf[i]; bootTotal[i][s] = bt[i]; }
        }
        double lowP = (1 - level) / 2, highP = 1 - lowP;
        var fLow = new double[d]; var fHigh = new double[d]; var tLow = new double[d]; var tHigh = new double[d];
        for (int i = 0; i < d; i++)
        {
            Array.Sort(bootFirst[i]);
            Array.Sort(bootTotal[i]);
            fLow[i] = Quantile(bootFirst[i], lowP); fHigh[i] = Quantile(bootFirst[i], highP);
            tLow[i] = Quantile(bootTotal[i], lowP); tHigh[i] = Quantile(bootTotal[i], highP);
        }
        return new SobolIndices(inputNames, first, fLow, fHigh, total, tLow, tHigh, variance, m, resamples, level);
    }

    /// <summary>
    /// The estimators over the rows listed in <paramref name="pick"/> (all rows, or a bootstrap resample).
    /// </summary>
    private static (double[] First, double[] Total, double Variance) Indices(
        double[] yA, double[] yB, double[][] yAB, int[] pick)
    {
        int d = yAB.Length, m = pick.Length;
        // Variance of the output over the A and B rows together (2m values).
        double mean = 0;
        foreach (int j in pick) mean += yA[j] + yB[j];
        mean /= 2.0 * m;
        double variance = 0;
        foreach (int j in pick) variance += (yA[j] - mean) * (yA[j] - mean) + (yB[j] - mean) * (yB[j] - mean);
        variance /= 2.0 * m - 1;
        var first = new double[d];
        var total = new double[d];
        if (!(variance > 0)) return (first, total, 0);
        for (int i = 0; i < d; i++)
        {
            var ab = yAB[i];
            double sFirst = 0, sTotal = 0;
            foreach (int j in pick)
            {
                double diff = ab[j] - yA[j];
                sFirst += (yB[j] - mean) * diff;
                sTotal += diff * diff;
            }
            first[i] = sFirst / m / variance;
            total[i] = sTotal / (2.0 * m) / variance;
        }
        return (first, total, variance);
    }

    /// <summary>Type-7 quantile of a sorted sample.</summary>
    private static double Quantile(double[] sorted, double p)
    {
        double h = (sorted.Length - 1) * p;
        int i = (int)Math.Floor(h);
        return i + 1 < sorted.Length ? sorted[i] + (h - i) * (sorted[i + 1] - sorted[i]) : sorted[i];
    }
}
