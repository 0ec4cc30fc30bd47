namespace Briefwright.Model.Uncertainty;

/// <summary>First-order and total Sobol indices of one output for each input.</summary>
public sealed record SobolIndices(IReadOnlyList<string> Inputs, double[] FirstOrder, double[] Total, double Variance, int Samples);

/// <summary>
/// Variance-based sensitivity: Saltelli's sampling scheme (matrices A, B and, for each input i, A with column i
/// taken from B) and Jansen's estimators: V_i = V − ½·mean[(f(B) − f(A_B^i))²], V_Ti = ½·mean[(f(A) − f(A_B^i))²].
/// Costs (d + 2)·N evaluations of f.
/// </summary>
public static class Sobol
{
    /// <param name="f">The model on the unit cube: d uniforms in (0,1) to several outputs.</param>
    public static IReadOnlyList<SobolIndices> Estimate(int d, int n, ulong seed, IReadOnlyList<string> inputNames, Func<double[], double[]?> f, int maxThreads = ModelThreads.AllCores)
    {
        var a = new double[n][];
        var b = new double[n][];
        for (int r = 0; r < n; r++)
        {
            var rng = SplitMix64.ForStream(seed, (ulong)r);
            a[r] = new double[d];
            b[r] = new double[d];
            for (int j = 0; j < d; j++) a[r][j] = rng.NextOpenUnit();
            for (int j = 0; j < d; j++) b[r][j] = rng.NextOpenUnit();
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
        var rows = Enumerable.Range(0, n).Where(r => fa[r] is not null && fb[r] is not null && Enumerable.Range(0, d).All(i => fab[i, r] is not null)).ToList();
        int outputs = fa[rows[0]]!.Length;
        var result = new List<SobolIndices>();
        for (int k = 0; k < outputs; k++)
        {
            var all = rows.Select(r => fa[r]![k]).Concat(rows.Select(r => fb[r]![k])).ToList();
            double mean = all.Average();
            double variance = all.Sum(v => (v - mean) * (v - mean)) / (all.Count - 1);
            var first = new double[d];
            var total = new double[d];
            for (int i = 0; i < d; i++)
            {
                double sFirst = 0, sTotal = 0;
                foreach (int r in rows)
                {
                    double ab = fab[i, r]![k];
                    sFirst += (fb[r]![k] - ab) * (fb[r]![k] - ab);
                    sTotal += (fa[r]![k] - ab) * (fa[r]![k] - ab);
                }
                first[i] = variance > 0 ? (variance - sFirst / (2.0 * rows.Count)) / variance : 0;
                total[i] = variance > 0 ? sTotal / (2.0 * rows.Count) / variance : 0;
            }
            result.Add(new SobolIndices(inputNames, first, total, variance, rows.Count));
        }
        return result;
    }
}
