namespace Briefwright.Model.Uncertainty;

/// <summary>
/// How many threads the model's own loops (Monte Carlo, Sobol, sensitivity) may use. A batch that already builds
/// one brief per core passes 1, so the briefs do not fight over the cores; results do not depend on it.
/// </summary>
public static class ModelThreads
{
    /// <summary>Any value below 1 means one thread per core.</summary>
    public const int AllCores = -1;

    public static ParallelOptions Options(int maxThreads) =>
        new() { MaxDegreeOfParallelism = maxThreads < 1 ? -1 : maxThreads };

    /// <summary>
    /// f(0), …, f(n − 1) in order, computed in parallel. Parallel.For rather than PLINQ: the results are the same,
    /// and a fresh process does not pay PLINQ's start-up.
    /// </summary>
    public static T[] Map<T>(int n, int maxThreads, Func<int, T> f)
    {
        var results = new T[n];
        Parallel.For(0, n, Options(maxThreads), i => results[i] = f(i));
        return results;
    }
}
