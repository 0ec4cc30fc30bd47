using System.Diagnostics;

namespace Briefwright.Cli.Batch;

/// <summary>A failure injected by <see cref="FaultSeam"/>; handled like any failed write.</summary>
public sealed class InjectedFaultException(string step) : IOException($"fault injected after step {step}");

/// <summary>
/// Off unless asked for. Each step of an edition's transaction calls <see cref="After"/> with its name
/// (<c>&lt;id&gt;/&lt;step&gt;</c>, such as <c>auroria-national/switch.in.3</c>). The environment variable
/// <c>BRIEFWRIGHT_FAULT=&lt;id&gt;/&lt;step&gt;=kill</c> kills the process there (SIGKILL to itself: no clean-up code
/// runs), <c>=fail</c> makes the step fail as a write would, <c>=term</c> sends the process SIGTERM;
/// <c>*/&lt;step&gt;</c> matches any brief. Tests in the same process set <see cref="Hook"/> instead.
/// </summary>
public static class FaultSeam
{
    private static readonly (string Step, string Action)? FromEnvironment = Parse(
        Environment.GetEnvironmentVariable("BRIEFWRIGHT_FAULT"));

    private static readonly AsyncLocal<Action<string>?> LocalHook = new();

    /// <summary>Called with every step name when set (in-process tests: record the steps, or throw to fail one). Flows
    /// with the calling test's execution context only, so tests running side by side do not see each other's
    /// steps.</summary>
    public static Action<string>? Hook { get => LocalHook.Value; set => LocalHook.Value = value; }

    private static (string, string)? Parse(string? text)
    {
        if (string.IsNullOrEmpty(text)) return null;
        int eq = text.LastIndexOf('=');
        return eq > 0 ? (text[..eq], text[(eq + 1)..]) : (text, "kill");
    }

    public static void After(string id, string step)
    {
        if (FromEnvironment is null && LocalHook.Value is null) return;
        string name = $"{id}/{step}";
        LocalHook.Value?.Invoke(name);
        if (FromEnvironment is not { } fault) return;
        if (fault.Step != name
            && !(fault.Step.StartsWith("*/", StringComparison.Ordinal) && fault.Step[2..] == step)) return;
        if (fault.Action == "fail") throw new InjectedFaultException(name);
        if (fault.Action == "term")
        {
            // As if an operator sent SIGTERM at this instant: the build must finish this brief
            // and stop before the next.
            using (var kill = Process.Start("kill", $"-TERM {Environment.ProcessId}")) kill.WaitForExit();
            StopSignal.Token.WaitHandle.WaitOne(TimeSpan.FromSeconds(30));
            return;
        }
        Console.Error.Flush();
        using var self = Process.GetCurrentProcess();
        self.Kill();
        Thread.Sleep(Timeout.Infinite);
    }
}
