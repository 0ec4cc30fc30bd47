namespace Briefwright.Brief;

/// <summary>
/// Where a brief's independent pieces run (the results data and filled template, and the chart copies, while the
/// charts and the PDF are laid out). The pipeline asks for them in order and waits for each where it needs it; the
/// runner decides whether they run at once on the calling thread (<see cref="Sequential"/>, the default) or on idle
/// cores (the command line's choice). The bytes are the same either way.
/// </summary>
public abstract class WorkRunner
{
    /// <summary>Every piece at once, on the calling thread.</summary>
    public static WorkRunner Sequential { get; } = new InPlace();

    /// <summary>Starts <paramref name="work"/>; the pipeline waits for its result where it uses it.</summary>
    public abstract Task<T> Start<T>(Func<T> work);

    /// <summary>Threads one piece may itself use (drawing the chart copies).</summary>
    public abstract int Threads { get; }

    private sealed class InPlace : WorkRunner
    {
        public override Task<T> Start<T>(Func<T> work) => Task.FromResult(work());

        public override int Threads => 1;
    }
}
