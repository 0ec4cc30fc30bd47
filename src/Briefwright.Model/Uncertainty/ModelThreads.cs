namespace Briefwright.Model.Uncertainty;

/// <summary>
/// How many threads the model's own loops (Monte Carlo, Sobol, sensitivity) may use. A batch that already builds
/// one brief per core passes 1, so the briefs do not fight over the cores; results do not depend on it.
/// </summary>
public static class ModelThreads
{
    /// <summary>Any value below 1 means one thread per core.</summary>
    public const int AllCores = -1;

    public static ParallelOptions Options(int maxThreads) => new() { MaxDegreeOfParallelism = maxThreads < 1 ? -1 : maxThreads };

    public static ParallelQuery<T> Limit<T>(this ParallelQuery<T> query, int maxThreads) =>
        maxThreads < 1 ? query : query.WithDegreeOfParallelism(maxThreads);
}
