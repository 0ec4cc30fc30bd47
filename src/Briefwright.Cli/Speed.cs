using Briefwright.Brief;
using Briefwright.Cli.Batch;

namespace Briefwright.Cli;

/// <summary>
/// Every speed decision of the tool, in one place; the pipeline itself runs in order. A fresh process building one
/// brief uses its idle cores three ways: a head start on what every build reads (<see cref="HeadStart"/>), a warm-up of
/// the output libraries while the first brief's model runs (<see cref="WarmUp"/>), and a brief's independent pieces
/// beside its layout (<see cref="ForBatch"/>). A batch building one brief per core does none of the last: its cores are
/// busy already. None of it changes a byte of the output (tested).
/// </summary>
public static class Speed
{
    /// <summary>
    /// On a spare core, while the command line and the first scenario are read: parses the standard template, hashes
    /// the bundled fonts and reads a sample manifest, so that a single brief built by a fresh process finishes sooner.
    /// The template and the hash are computed once per process either way (the template is parsed even when another is
    /// named: reading the options here would repeat the command-line parser); a failure here surfaces, with its
    /// message, where the value is first used.
    /// </summary>
    public static void HeadStart()
    {
        Task.Run(() =>
        {
            try
            {
                _ = StandardTemplate.Template;
                _ = BatchBuilder.FontsHash.Value;
                Manifest.Parse("""{"id":"a","stem":"a-2000-01-01","edition":""" +
                    """1,"hash":"0","inputs":{"tool":"0"},"files":["a.pdf"]}""");
            }
            catch (Exception)
            {
                // Only a head start: the same work is done, and any error reported, where the value is first used.
            }
        });
    }

    /// <summary>
    /// The first brief a process will build: its output libraries start up on a spare core meanwhile.
    /// </summary>
    public static void WarmUp() => global::Briefwright.Cli.WarmUp.Start();

    /// <summary>
    /// The options a batch builds with: several briefs at once already keep the cores busy, so the model's loops stay
    /// on their brief's thread and the brief's pieces run in order; otherwise they use the spare cores.
    /// </summary>
    public static BuildOptions ForBatch(BuildOptions options, int jobs, int briefs) =>
        jobs > 1 && briefs > 1 ? options with { ModelThreads = 1 } : options with { Runner = SpareCores.Instance };

    /// <summary>Each piece on the thread pool; chart copies drawn on every core.</summary>
    private sealed class SpareCores : WorkRunner
    {
        public static readonly SpareCores Instance = new();

        public override Task<T> Start<T>(Func<T> work) => Task.Run(work);

        public override int Threads => Environment.ProcessorCount;
    }
}
