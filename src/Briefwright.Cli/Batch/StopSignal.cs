using System.Runtime.InteropServices;

namespace Briefwright.Cli.Batch;

/// <summary>
/// SIGINT (Ctrl+C) and SIGTERM stop a build between briefs: briefs in progress finish (or undo) their switch, the
/// others are not started. A second signal ends the process at once; the switch journal still covers every brief.
/// </summary>
public static class StopSignal
{
    private static readonly CancellationTokenSource Source = new();
    private static readonly List<PosixSignalRegistration> Registrations = [];

    public static CancellationToken Token => Source.Token;

    /// <summary>Installed by the program itself (not by tests that run the commands in their own process).</summary>
    public static void Install(TextWriter error)
    {
        foreach (var signal in new[] { PosixSignal.SIGINT, PosixSignal.SIGTERM })
            Registrations.Add(PosixSignalRegistration.Create(signal, context =>
            {
                if (Source.IsCancellationRequested) return; // the second signal ends the process
                context.Cancel = true;
                lock (error) error.WriteLine($"briefwright: {context.Signal} received; finishing the briefs in " +
                    "progress and starting no others (send it again to stop at once).");
                Source.Cancel();
            }));
    }
}
